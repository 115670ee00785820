//! The handover's ranked findings: a product far out of its spec and a pump discharge above
//! its relief setting, the two cases a new user once saw reported as "Findings (0)".
//!
//! Limits from the invented demo site (site-configs/demo.toml): chilli-sauce K 8 to 16 Pa·sⁿ,
//! n at most 0.40; pump P-2 relief 12 bar, casing 14 bar.

use assert_cmd::Command;
use chrono::{DateTime, Duration, FixedOffset, Utc};
use rheoside::journal::*;
use std::path::{Path, PathBuf};

fn start() -> Stamp {
    Stamp {
        utc: "2026-03-11T05:00:00Z".parse::<DateTime<Utc>>().unwrap(),
        offset: FixedOffset::east_opt(3600).unwrap(),
    }
}

/// Dial readings of a power-law product K = 30 Pa·sⁿ, n = 0.3 on the standard six-speed
/// instrument, derived: γ̇ = 1.703·rpm, dial = τ/0.511 Pa (API RP 13D constants), so
/// τ = 30·γ̇^0.3 gives 95.7, 118, 191, 235 and 274 at 3, 6, 30, 60 and 100 rpm.
pub fn thick_sauce_set() -> Payload {
    let rows = [
        (100.0, 274.0),
        (60.0, 235.0),
        (30.0, 191.0),
        (6.0, 118.0),
        (3.0, 95.7),
    ];
    Payload::ViscometerSet {
        viscometer: "VIS-A".into(),
        product: "chilli-sauce".into(),
        temperature_raw: Some("25 C".into()),
        temperature_k: Some(298.15),
        rows: rows
            .iter()
            .map(|&(rpm, dial)| DialRow {
                rpm_raw: format!("{rpm}"),
                rpm,
                dial_raw: format!("{dial}"),
                dial,
            })
            .collect(),
    }
}

/// A session with the thick sauce and 13 bar read at P-2's discharge.
pub fn two_case_journal(dir: &Path) -> PathBuf {
    let new = NewSession {
        log_dir: dir.to_path_buf(),
        site_id: "marrowdale-u4".into(),
        site_source: "bundled demo site (invented plant)".into(),
        operator: "T. Oduya".into(),
    };
    let clock = StepClock::new(start(), Duration::seconds(60));
    let mut w = JournalWriter::create(&new, Box::new(clock)).expect("journal created");
    w.append(Some("VIS-A"), thick_sauce_set()).unwrap();
    let reading = rheoside::readings::parse_reading_arg("discharge-pressure=13 bar")
        .expect("reading parses")
        .payload();
    w.append(Some("P-2"), reading).unwrap();
    w.end_session().unwrap();
    w.path().expect("file journal").to_path_buf()
}

fn report(args: &[&str]) -> std::process::Output {
    Command::cargo_bin("rheoside")
        .unwrap()
        .arg("report")
        .args(args)
        .output()
        .unwrap()
}

#[test]
fn markdown_lists_both_findings_first_with_their_cautions() {
    let dir = tempfile::tempdir().unwrap();
    let path = two_case_journal(dir.path());
    let out = report(&[path.to_str().unwrap()]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let md = String::from_utf8(out.stdout).unwrap();
    assert!(!md.contains("## Findings (0)"), "{md}");
    let findings_at = md.find("## Findings (").expect("a findings section");
    assert!(
        findings_at < md.find("## Session ").unwrap(),
        "findings come first"
    );
    // 13 bar > 12 bar relief: an alarm; K ≈ 30 > 16: out of spec.
    assert!(md.contains("**ALARM, certain: pump P-2. The discharge pressure is above the pump's relief setting.**"), "{md}");
    assert!(
        md.contains("The product is out of spec: consistency index K is above its limit"),
        "{md}"
    );
    assert!(md.contains("relief setting 12.0 bar"), "{md}");
    assert!(
        md.contains("Caution: Never exceed the rated pressure"),
        "{md}"
    );
}

#[test]
fn json_findings_carry_the_contract_keys() {
    let dir = tempfile::tempdir().unwrap();
    let path = two_case_journal(dir.path());
    let out = report(&["--format", "json", path.to_str().unwrap()]);
    assert!(out.status.success());
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let findings = v["findings"].as_array().expect("a findings list");
    let rules: Vec<&str> = findings.iter().filter_map(|f| f["rule"].as_str()).collect();
    assert!(rules.contains(&"discharge-over-limit"), "{rules:?}");
    assert!(rules.contains(&"out-of-spec"), "{rules:?}");
    for f in findings {
        for key in [
            "rule",
            "severity",
            "title",
            "sure",
            "numbers",
            "next_checks",
            "caution",
        ] {
            assert!(!f[key].is_null(), "{key} missing in {f}");
        }
    }
    let pump = findings
        .iter()
        .find(|f| f["rule"] == "discharge-over-limit")
        .unwrap();
    assert_eq!(pump["severity"], "alarm");
    // 13 bar = 1.3e6 Pa (bar = 10^5 Pa, NIST SP 811), with the ±2 % reading error.
    assert_eq!(pump["numbers"][0]["value_si"], 1.3e6);
    assert_eq!(pump["numbers"][1]["value_si"], 1.2e6);
    let spec = findings
        .iter()
        .find(|f| f["rule"] == "out-of-spec")
        .unwrap();
    assert_eq!(spec["severity"], "alarm");
    let k = spec["numbers"][0]["value_si"].as_f64().unwrap();
    assert!((20.0..45.0).contains(&k), "K {k}");
    // Alarms rank first.
    assert_eq!(findings[0]["severity"], "alarm");
}

#[test]
fn csv_has_a_row_per_finding_after_the_readings() {
    let dir = tempfile::tempdir().unwrap();
    let path = two_case_journal(dir.path());
    let out = report(&["--format", "csv", path.to_str().unwrap()]);
    assert!(out.status.success());
    let text = String::from_utf8(out.stdout).unwrap();
    let rows: Vec<&str> = text.lines().filter(|l| l.contains(",finding,")).collect();
    assert!(
        rows.iter()
            .any(|r| r.contains(",discharge-over-limit,alarm,certain,")),
        "{text}"
    );
    assert!(
        rows.iter().any(|r| r.contains(",out-of-spec,alarm,")),
        "{text}"
    );
}
