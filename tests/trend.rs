//! `rheoside trend`: sessions on several days, written through the journal API, with the
//! chilli sauce's consistency index drifting across its upper limit (16 Pa·sⁿ in the
//! bundled demo site, an invented plant).
//!
//! The readings are a power-law fluid, τ = K·γ̇ⁿ, read on the standard viscometer at its
//! Newtonian (Margules) rate. The expected fitted K is derived in `expected_k` from the
//! power-law bob rate of Steffe (1996) eqs 3.33/3.37.

use assert_cmd::Command;
use chrono::{DateTime, Duration, FixedOffset, Utc};
use rheoside::journal::*;
use std::path::Path;

const N: f64 = 0.35;
/// Standard viscometer: rotor 18.415 mm, bob 17.245 mm (API RP 13B-1, from memory);
/// 1.7023 s⁻¹ per rpm and 0.511 Pa per dial degree.
const RATIO: f64 = 18.415 / 17.245;
const RATE_PER_RPM: f64 = 1.7023;
const PA_PER_DIAL: f64 = 0.511;

/// A journal of `site_id` started `days_ago` days before `now`, holding one viscometer set
/// of `product` with consistency index `k` (Pa·sⁿ).
fn session(dir: &Path, site_id: &str, now: DateTime<Utc>, days_ago: i64, operator: &str, k: f64) {
    session_at(dir, site_id, now, days_ago, operator, k, 25.0);
}

/// As [`session`], with the set read at `temp_c` °C.
fn session_at(
    dir: &Path,
    site_id: &str,
    now: DateTime<Utc>,
    days_ago: i64,
    operator: &str,
    k: f64,
    temp_c: f64,
) {
    let start = Stamp {
        utc: now - Duration::days(days_ago),
        offset: FixedOffset::east_opt(3600).unwrap(),
    };
    let new = NewSession {
        log_dir: dir.to_path_buf(),
        site_id: site_id.into(),
        site_source: "test".into(),
        operator: operator.into(),
    };
    let clock = StepClock::new(start, Duration::seconds(60));
    let mut w = JournalWriter::create(&new, Box::new(clock)).unwrap();
    // Speeds at which K up to 22 Pa·sⁿ stays below full scale (300): a pegged dial would be
    // left out of the fit. At 100 rpm, 22·(170.2)^0.35/0.511 = 260 degrees.
    let rows = [100.0, 60.0, 30.0, 10.0, 6.0, 3.0]
        .iter()
        .map(|&rpm: &f64| {
            let dial = (k * (RATE_PER_RPM * rpm).powf(N) / PA_PER_DIAL * 10.0).round() / 10.0;
            DialRow {
                rpm_raw: rpm.to_string(),
                rpm,
                dial_raw: dial.to_string(),
                dial,
            }
        })
        .collect();
    let set = Payload::ViscometerSet {
        viscometer: "VIS-A".into(),
        product: "chilli-sauce".into(),
        temperature_raw: Some(format!("{temp_c} C")),
        temperature_k: Some(temp_c + 273.15),
        rows,
    };
    w.append(
        Some("VIS-A"),
        Payload::Reading {
            name: "flow".into(),
            raw: "12 m3/h".into(),
            value_si: 12.0 / 3600.0,
            dimension: "flow".into(),
        },
    )
    .unwrap();
    w.append(Some("VIS-A"), set).unwrap();
    w.end_session().unwrap();
}

/// K the fit should find: the bob rate of a power-law fluid is 2Ω/[n(1 − s^(−2/n))]
/// (Steffe 1996 eq 3.37) against the Margules 2Ω/(1 − s^(−2)) the readings were made at,
/// so K_fit = K·[(1 − s^(−2)) / (n(1 − s^(−2/n)))]^(−n).
fn expected_k(k: f64) -> f64 {
    let ratio = (1.0 - RATIO.powf(-2.0)) / (N * (1.0 - RATIO.powf(-2.0 / N)));
    k / ratio.powf(N)
}

/// Five chilli-sauce sessions 40, 20, 12, 6 and 2 days ago with K 10, 12, 14, 19, 22;
/// one journal of another site; one file that is not a journal.
fn plant(dir: &Path) {
    let now = Utc::now();
    let days = [(40, 10.0), (20, 12.0), (12, 14.0), (6, 19.0), (2, 22.0)];
    for (i, (ago, k)) in days.into_iter().enumerate() {
        let who = ["J. Ferreira", "K. Amundsen", "T. Oduya"][i % 3];
        session(dir, "marrowdale-u4", now, ago, who, k);
    }
    session(dir, "other-plant", now, 3, "someone", 30.0);
    std::fs::write(dir.join("shift-notes.txt"), "not a journal\n").unwrap();
}

fn trend(dir: &Path, args: &[&str]) -> std::process::Output {
    Command::cargo_bin("rheoside")
        .unwrap()
        .arg("--log-dir")
        .arg(dir)
        .arg("trend")
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

/// The session rows of the table (each starts with the mark column, then the date).
fn rows(table: &str) -> Vec<&str> {
    table
        .lines()
        .filter(|l| l.len() > 6 && l[4..].starts_with("20") && l.as_bytes()[8] == b'-')
        .collect()
}

#[test]
fn out_of_limit_sessions_are_marked_in_words() {
    let dir = tempfile::tempdir().unwrap();
    plant(dir.path());
    let out = text(&trend(dir.path(), &["--product", "chilli-sauce"]));
    let rows = rows(&out);
    // Default window 30d: the session 40 days ago is left out.
    assert_eq!(rows.len(), 4, "{out}");
    let marked: Vec<bool> = rows.iter().map(|r| r.starts_with("OUT ")).collect();
    // K 12 and 14 fit below 16; K 19 and 22 fit above it (expected_k: 18.2 and 21.1).
    assert_eq!(marked, [false, false, true, true], "{out}");
    assert_eq!(out.matches("OUT: K above 16.0 Pa·sⁿ").count(), 2, "{out}");
    // K 22 also takes μa at 50 1/s above 1.6 Pa·s: 21.1 × 50^(0.35 − 1) = 1.66 Pa·s.
    assert!(out.contains("μa at 50.0 1/s above 1600 mPa.s"), "{out}");
    assert!(
        out.contains("skipped 1 of another site and 1 file(s) that are not session journals"),
        "{out}"
    );
}

#[test]
fn the_fitted_k_matches_the_power_law_bob_rate() {
    let dir = tempfile::tempdir().unwrap();
    plant(dir.path());
    let out = text(&trend(
        dir.path(),
        &["--product", "chilli-sauce", "--since", "8w"],
    ));
    let rows = rows(&out);
    assert_eq!(rows.len(), 5, "--since 8w takes all five sessions:\n{out}");
    for (row, k) in rows.iter().zip([10.0, 12.0, 14.0, 19.0, 22.0]) {
        let words: Vec<&str> = row.split_whitespace().collect();
        let unit = words
            .iter()
            .position(|w| w.starts_with("Pa·sⁿ"))
            .expect("a K cell");
        let shown: f64 = words[unit - 1].parse().expect("K is a number");
        let want = expected_k(k);
        // Three significant figures shown; dials rounded to 0.1: within 2 %.
        assert!(
            (shown - want).abs() < 0.02 * want,
            "K {shown} shown, {want:.3} derived, row {row}"
        );
    }
}

#[test]
fn since_filters_the_sessions() {
    let dir = tempfile::tempdir().unwrap();
    plant(dir.path());
    let week = text(&trend(
        dir.path(),
        &["--product", "chilli-sauce", "--since", "8d"],
    ));
    assert_eq!(rows(&week).len(), 2, "{week}");
    let hours = text(&trend(
        dir.path(),
        &["--product", "chilli-sauce", "--since", "12h"],
    ));
    assert!(rows(&hours).is_empty(), "{hours}");
    assert!(hours.contains("No session in the window"), "{hours}");
}

#[test]
fn the_chart_is_plain_ascii_with_the_out_marks() {
    let dir = tempfile::tempdir().unwrap();
    plant(dir.path());
    let out = text(&trend(dir.path(), &["--product", "chilli-sauce"]));
    let start = out.find("\nApparent viscosity at").expect("a chart");
    let end = out[start..]
        .find("\nRead ")
        .map_or(out.len(), |e| start + e);
    let chart = &out[start..end];
    assert!(chart.is_ascii(), "non-ASCII in the chart:\n{chart}");
    assert!(
        chart.contains("'-' marks the limits 500 mPa.s and 1600 mPa.s"),
        "{chart}"
    );
    let marks = chart
        .lines()
        .find(|l| l.trim_start().starts_with("OUT"))
        .expect("an OUT row");
    assert_eq!(marks.matches('^').count(), 2, "{chart}");
}

#[test]
fn an_unknown_product_exits_2_with_the_list() {
    let dir = tempfile::tempdir().unwrap();
    plant(dir.path());
    let out = trend(dir.path(), &["--product", "tomato-paste"]);
    assert_eq!(out.status.code(), Some(2));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains("'tomato-paste' is not in site 'marrowdale-u4'"),
        "{err}"
    );
    assert!(
        err.contains("chilli-sauce, filler-paste, chalk-slurry"),
        "{err}"
    );
}

#[test]
fn a_bad_window_exits_2_saying_what_is_accepted() {
    let dir = tempfile::tempdir().unwrap();
    for bad in ["30 days", "30µ", "d", "0d", "-3d", ""] {
        let since = format!("--since={bad}");
        let out = trend(dir.path(), &["--product", "chilli-sauce", &since]);
        assert_eq!(out.status.code(), Some(2), "--since {bad:?}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(err.contains("e.g. 30d, 12h, 8w"), "--since {bad:?}: {err}");
    }
}

/// Herschel–Bulkley τ = τ0 + Kγ̇ⁿ read off simpler models, derived from their forms:
/// Bingham τ0 + μp·γ̇ is K = μp, n = 1; Newtonian μγ̇ is τ0 = 0, K = μ, n = 1; Casson's
/// √τ = √τ0 + √(μc·γ̇) is no Herschel–Bulkley curve, so its K limit cannot be checked.
#[test]
fn simpler_models_are_read_as_herschel_bulkley() {
    use rheoside::rheology::{Model, ParamName};
    use rheoside::session::trend::{LimitStatus, Param, check_limits, hb_equivalent};
    use rheoside::site::{LimitProperty, SpecLimit};
    let bingham = Model::Bingham {
        tau0: 10.0,
        mu_p: 0.05,
    };
    assert_eq!(
        hb_equivalent(&bingham, ParamName::Tau0),
        Param::Fitted(10.0)
    );
    assert_eq!(hb_equivalent(&bingham, ParamName::K), Param::Implied(0.05));
    assert_eq!(hb_equivalent(&bingham, ParamName::N), Param::Implied(1.0));
    let water = Model::Newtonian { mu: 0.001 };
    assert_eq!(hb_equivalent(&water, ParamName::Tau0), Param::Implied(0.0));
    assert_eq!(hb_equivalent(&water, ParamName::K), Param::Implied(0.001));
    let casson = Model::Casson {
        tau0: 4.0,
        mu_c: 0.2,
    };
    assert_eq!(hb_equivalent(&casson, ParamName::K), Param::Absent);
    let k_max = SpecLimit {
        property: LimitProperty::ConsistencyIndex,
        min: None,
        max: Some(0.04),
    };
    // μa at 100 1/s of the Bingham model: (10 + 0.05·100)/100 = 0.15 Pa·s, above 0.1.
    let mu_max = SpecLimit {
        property: LimitProperty::ApparentViscosity {
            shear_rate_per_s: 100.0,
        },
        min: None,
        max: Some(0.1),
    };
    let checks = check_limits(&[k_max, mu_max], &bingham);
    assert_eq!(checks[0].status, LimitStatus::Above);
    assert_eq!(checks[1].status, LimitStatus::Above);
    assert!((checks[1].value.unwrap() - 0.15).abs() < 1e-12);
    assert_eq!(
        check_limits(&[k_max], &casson)[0].status,
        LimitStatus::NotChecked
    );
}

/// The number before "Pa·sⁿ" on a table row (the K column).
fn k_on(row: &str) -> f64 {
    let end = row.find(" Pa·sⁿ").expect("a K value on the row");
    let start = row[..end].rfind(' ').map_or(0, |i| i + 1);
    row[start..end]
        .trim_start_matches(['*', '!'])
        .parse()
        .expect("K parses")
}

#[test]
fn a_set_read_warm_is_shifted_to_the_reference_temperature() {
    // The demo's chilli sauce: reference 25 °C, activation energy 30 kJ/mol (invented).
    // Arrhenius (Steffe 1996, ch. 1), worked by hand for 45 °C: (30000/8.314462618) = 3608.171 K,
    // 1/318.15 − 1/298.15 = −2.108445e-4, product −0.760762, so K(45 °C) = K(25 °C)·0.467308.
    let dir = tempfile::tempdir().unwrap();
    let now = Utc::now();
    let factor = ((30_000.0_f64 / 8.314462618) * (1.0 / 318.15 - 1.0 / 298.15)).exp();
    assert!(
        (factor - 0.467308).abs() < 1e-6,
        "hand-worked factor {factor}"
    );
    session_at(
        dir.path(),
        "marrowdale-u4",
        now,
        5,
        "J. Ferreira",
        14.0,
        25.0,
    );
    session_at(
        dir.path(),
        "marrowdale-u4",
        now,
        3,
        "T. Oduya",
        14.0 * factor,
        45.0,
    );
    let out = text(&trend(
        dir.path(),
        &[
            "--site",
            "site-configs/demo.toml",
            "--product",
            "chilli-sauce",
        ],
    ));
    let table = rows(&out);
    assert_eq!(table.len(), 2, "{out}");
    let (cool, warm) = (k_on(table[0]), k_on(table[1]));
    // Shifted back, the warm set's K is the cool one's (dials are rounded to 0.1: 2 %).
    assert!((warm - cool).abs() / cool < 0.02, "{cool} vs {warm}\n{out}");
    assert!(
        (cool - expected_k(14.0)).abs() / expected_k(14.0) < 0.02,
        "{out}"
    );
    assert!(out.contains("shifted to 25.0 °C"), "{out}");
}
