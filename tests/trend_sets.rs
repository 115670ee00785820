//! `trend` takes every set: an out-of-spec set followed by a good one in the same session
//! are both shown; `--property` charts any limited property.
//!
//! Readings: a power-law fluid τ = K·γ̇ⁿ (n = 0.35) read on the standard viscometer at its
//! Newtonian rate, 1.7023 s⁻¹ per rpm and 0.511 Pa per degree (API RP 13D geometry, from
//! memory), at speeds that keep the dial on scale. The bundled demo site (an invented plant)
//! limits chilli-sauce K to 8–16 Pa·sⁿ.

use assert_cmd::Command;
use chrono::{Duration, FixedOffset, Utc};
use rheoside::journal::*;
use std::path::Path;

fn set(k: f64) -> Payload {
    let rows = [100.0, 60.0, 30.0, 10.0, 6.0, 3.0]
        .iter()
        .map(|&rpm: &f64| {
            let dial = (k * (1.7023 * rpm).powf(0.35) / 0.511 * 10.0).round() / 10.0;
            DialRow {
                rpm_raw: rpm.to_string(),
                rpm,
                dial_raw: dial.to_string(),
                dial,
            }
        })
        .collect();
    Payload::ViscometerSet {
        viscometer: "VIS-A".into(),
        product: "chilli-sauce".into(),
        temperature_raw: Some("25 C".into()),
        temperature_k: Some(298.15),
        rows,
    }
}

/// One session, two hours ago: a set with K 19 (out: above 16), then one with K 12.
fn one_session_two_sets(dir: &Path) {
    let start = Stamp {
        utc: Utc::now() - Duration::hours(2),
        offset: FixedOffset::east_opt(0).unwrap(),
    };
    let new = NewSession {
        log_dir: dir.to_path_buf(),
        site_id: "marrowdale-u4".into(),
        site_source: "test".into(),
        operator: "J. Ferreira".into(),
    };
    let clock = StepClock::new(start, Duration::seconds(600));
    let mut w = JournalWriter::create(&new, Box::new(clock)).unwrap();
    w.append(Some("VIS-A"), set(19.0)).unwrap();
    w.append(Some("VIS-A"), set(12.0)).unwrap();
    w.end_session().unwrap();
}

fn trend(dir: &Path, args: &[&str]) -> std::process::Output {
    Command::cargo_bin("rheoside")
        .unwrap()
        .arg("--log-dir")
        .arg(dir)
        .arg("trend")
        .args(["--product", "chilli-sauce"])
        .args(args)
        .output()
        .unwrap()
}

fn text(out: &std::process::Output) -> String {
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout.clone()).unwrap()
}

// Regression: trend kept only the last set of each session, so the out-of-spec set vanished.
#[test]
fn an_out_of_spec_set_followed_by_a_good_one_is_shown() {
    let dir = tempfile::tempdir().unwrap();
    one_session_two_sets(dir.path());
    let out = text(&trend(dir.path(), &[]));
    let rows: Vec<&str> = out
        .lines()
        .filter(|l| l.len() > 8 && l[4..].starts_with("20"))
        .collect();
    assert_eq!(rows.len(), 2, "{out}");
    assert!(rows[0].starts_with("OUT "), "the K 19 set first: {out}");
    assert!(
        !rows[1].starts_with("OUT "),
        "then the good K 12 set: {out}"
    );
    assert_eq!(out.matches("OUT: K above 16.0 Pa·sⁿ").count(), 1, "{out}");
}

#[test]
fn by_default_each_limited_property_is_charted_and_property_picks_one() {
    let dir = tempfile::tempdir().unwrap();
    one_session_two_sets(dir.path());
    let all = text(&trend(dir.path(), &[]));
    // chilli-sauce has limits on K, n and μa at 50 1/s (site-configs/demo.toml).
    for title in [
        "\nConsistency index K, one column per set",
        "\nFlow behaviour index n, one column per set",
        "\nApparent viscosity at 50.0 1/s, one column per set",
    ] {
        assert!(all.contains(title), "{title:?} missing:\n{all}");
    }
    let k = text(&trend(dir.path(), &["--property", "k"]));
    assert!(k.contains("\nConsistency index K"), "{k}");
    assert!(!k.contains("\nApparent viscosity at"), "{k}");
    assert!(
        k.contains("'-' marks the limits 8.00 Pa.s^n and 16.0 Pa.s^n"),
        "{k}"
    );
    let tau0 = text(&trend(dir.path(), &["--property", "yield-stress"]));
    // Both sets fit a power law (τ0 held at 0 by the form), so there is nothing to draw.
    assert!(
        tau0.contains("(no chart of Yield stress tau0: no fitted set"),
        "{tau0}"
    );
    let bad = trend(dir.path(), &["--property", "colour"]);
    assert_eq!(bad.status.code(), Some(2));
    let err = String::from_utf8_lossy(&bad.stderr);
    assert!(
        err.contains("--property 'colour'") && err.contains("consistency-index (k)"),
        "{err}"
    );
}
