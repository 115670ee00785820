//! `rheoside mix` end to end: the `--json` contract keys, a hand-worked laminar case, the
//! tank's spot readings taken from a journal, and bad input (exit 2, message on stderr).
//! The tanks and products are the invented demo site's (Marrowdale, site-configs/demo.toml).

use assert_cmd::Command;
use chrono::{Duration, FixedOffset, Utc};
use rheoside::journal::*;
use serde_json::Value;
use std::path::{Path, PathBuf};

const DEMO: &str = "site-configs/demo.toml";

fn mix(args: &[&str]) -> std::process::Output {
    Command::cargo_bin("rheoside")
        .unwrap()
        .arg("mix")
        .args(args)
        .output()
        .unwrap()
}

fn json_of(out: &std::process::Output) -> Value {
    serde_json::from_slice(&out.stdout).unwrap_or_else(|e| {
        panic!("{e}: {}", String::from_utf8_lossy(&out.stderr));
    })
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

#[test]
fn the_contract_keys_are_all_there_with_a_yield_stress_and_a_motor() {
    let out = mix(&[
        "--site",
        DEMO,
        "--tank",
        "TK-2",
        "--tau0",
        "40",
        "--mu-p",
        "0.05",
        "--motor-current",
        "4.2 A",
        "--json",
    ]);
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v = json_of(&out);
    for key in [
        "effective_shear_rate_per_s",
        "apparent_viscosity_pa_s",
        "reynolds",
        "regime",
        "power_number",
        "power_w",
        "torque_n_m",
        "specific_power_w_m3",
        "cavern_diameter_m",
        "speed_cavern_to_wall_rps",
        "shaft_power_w",
        "apparent_viscosity_from_power_pa_s",
        "k_from_power_pa_sn",
    ] {
        assert!(v.get(key).is_some(), "missing {key} in {v}");
    }
    assert!(v["warnings"].is_array() && v["cautions"].is_array());
    let cautions = v["cautions"].to_string();
    assert!(cautions.contains("lock out the agitator"), "{cautions}");
}

#[test]
fn laminar_power_through_the_command_line_worked_by_hand() {
    // By hand: μ = 10 Pa·s, ρ = 1200 kg/m³, disc turbine D = 0.2 m at 60 rpm = 1 rev/s.
    // γ̇ = ks·N = 11.5 1/s; Re = 1200·1·0.04/10 = 4.8; P = Kp·μ·N²·D³ = 70·10·0.008 = 5.6 W.
    let out = mix(&[
        "--impeller",
        "rushton-turbine",
        "--impeller-diameter",
        "0.2",
        "--speed",
        "60 rpm",
        "--density",
        "1200",
        "--mu",
        "10",
        "--json",
    ]);
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v = json_of(&out);
    assert!(rel(v["effective_shear_rate_per_s"].as_f64().unwrap(), 11.5) < 1e-9);
    assert!(rel(v["reynolds"].as_f64().unwrap(), 4.8) < 1e-9);
    assert_eq!(v["regime"], "laminar");
    assert!(rel(v["power_w"].as_f64().unwrap(), 5.6) < 1e-9);
    // No tank given: the power per volume is null and says why.
    assert!(v["specific_power_w_m3"].is_null());
    assert!(v["warnings"].to_string().contains("give the tank diameter"));
    // No yield stress, no motor: those keys are absent.
    assert!(v.get("cavern_diameter_m").is_none() && v.get("shaft_power_w").is_none());
}

#[test]
fn the_human_output_carries_the_ranges_and_the_cautions() {
    let out = mix(&[
        "--site", DEMO, "--tank", "TK-1", "--k", "12", "--n", "0.3", "--tau0", "25",
    ]);
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(text.contains("Power ") && text.contains(" to "), "{text}");
    assert!(text.contains("Stop and lock out the agitator"), "{text}");
    assert!(
        text.contains("Never run the agitator at full speed"),
        "{text}"
    );
    assert!(text.contains("Cavern (Elson)"), "{text}");
}

/// A journal with a chilli-sauce set (power law K = 12 Pa·sⁿ, n = 0.35 on the standard
/// viscometer) and readings at TK-1: 24 rpm, 3.5 A at 410 V.
fn journal(dir: &Path) -> PathBuf {
    let start = Stamp {
        utc: Utc::now() - Duration::hours(1),
        offset: FixedOffset::east_opt(0).unwrap(),
    };
    let new = NewSession {
        log_dir: dir.to_path_buf(),
        site_id: "marrowdale-u4".into(),
        site_source: DEMO.into(),
        operator: "T. Oduya".into(),
    };
    let clock = StepClock::new(start, Duration::seconds(60));
    let mut w = JournalWriter::create(&new, Box::new(clock)).unwrap();
    let rows = [600.0, 300.0, 200.0, 100.0, 6.0, 3.0]
        .iter()
        .map(|&rpm: &f64| {
            let dial = (12.0 * (1.7023 * rpm).powf(0.35) / 0.511 * 10.0).round() / 10.0;
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
        temperature_raw: None,
        temperature_k: None,
        rows,
    };
    w.append(Some("VIS-A"), set).unwrap();
    for (name, raw, si, dim) in [
        (
            "agitator-speed",
            "24 rpm",
            24.0 * std::f64::consts::PI / 30.0,
            "speed",
        ),
        ("motor-current", "3.5 A", 3.5, "current"),
        ("voltage", "410 V", 410.0, "voltage"),
    ] {
        let payload = Payload::Reading {
            name: name.into(),
            raw: raw.into(),
            value_si: si,
            dimension: dim.into(),
        };
        w.append(Some("TK-1"), payload).unwrap();
    }
    let path = w.path().unwrap().to_path_buf();
    w.end_session().unwrap();
    path
}

#[test]
fn spot_readings_and_the_curve_come_from_the_journal() {
    let dir = tempfile::tempdir().unwrap();
    let path = journal(dir.path());
    let p = path.to_str().unwrap();
    let out = mix(&["--site", DEMO, "--tank", "TK-1", "--journal", p, "--json"]);
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v = json_of(&out);
    assert_eq!(v["speed_from"], "reading");
    assert!(rel(v["speed_rps"].as_f64().unwrap(), 0.4) < 1e-12);
    // Three-phase: √3·410·3.5·0.80 (demo nameplate PF) = 1988.4 W electrical; ×0.86 motor ×
    // 0.94 gearbox (demo nameplate) = 1607.4 W at the impeller shaft.
    let shaft = v["shaft_power_w"].as_f64().unwrap();
    assert!(rel(shaft, 1607.4) < 1e-4, "{shaft}");
    assert!(
        v["rheology_source"]
            .as_str()
            .unwrap()
            .contains("latest fitted set")
    );
}

#[test]
fn a_turbulent_back_calculation_exits_2_with_nulls_and_the_reason() {
    // Water-like product at 180 rpm in a disc turbine: turbulent. 0.7 A is close to the
    // power the curve predicts, so the measured power number sits on the flat part.
    let out = mix(&[
        "--impeller",
        "rushton-turbine",
        "--impeller-diameter",
        "0.3",
        "--speed",
        "180 rpm",
        "--density",
        "1000",
        "--mu",
        "0.001",
        "--motor-current",
        "0.7",
        "--voltage",
        "400",
        "--power-factor",
        "0.8",
        "--motor-efficiency",
        "0.9",
        "--json",
    ]);
    assert_eq!(out.status.code(), Some(2));
    let v = json_of(&out);
    assert!(v["apparent_viscosity_from_power_pa_s"].is_null());
    assert!(v["k_from_power_pa_sn"].is_null());
    assert!(
        v["warnings"]
            .to_string()
            .contains("turbulent part of the curve"),
        "{v}"
    );
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("power hardly depends on viscosity"), "{err}");
}

fn refused(args: &[&str], says: &str) {
    let out = mix(args);
    assert_eq!(out.status.code(), Some(2), "{args:?}");
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains(says), "{args:?}: {err}");
    assert!(!err.contains("panicked"), "{err}");
}

#[test]
fn bad_input_exits_2_with_a_clear_message() {
    let base = ["--impeller", "anchor", "--density", "1100"];
    let with = |more: &[&'static str]| -> Vec<&'static str> {
        base.iter().copied().chain(more.iter().copied()).collect()
    };
    refused(
        &with(&[
            "--impeller-diameter",
            "1.9",
            "--tank-diameter",
            "1.8",
            "--speed",
            "30 rpm",
            "--mu",
            "1",
        ]),
        "must be smaller than the tank",
    );
    refused(
        &with(&[
            "--impeller-diameter",
            "1.7",
            "--speed",
            "0 rpm",
            "--tau0",
            "20",
            "--mu-p",
            "1",
        ]),
        "at zero speed a product with a yield stress",
    );
    refused(
        &with(&["--impeller-diameter", "1.7", "--speed", "30", "--mu", "1"]),
        "add the unit, e.g. '30 rpm'",
    );
    refused(
        &with(&["--impeller-diameter", "1.7", "--speed", "30 rpm"]),
        "no flow curve given",
    );
    // --site's help promises the demo site by default: a tank id alone finds it there.
    let demo_default = mix(&["--tank", "TK-1", "--mu", "1", "--json"]);
    let with_site = mix(&["--site", DEMO, "--tank", "TK-1", "--mu", "1", "--json"]);
    assert_eq!(demo_default.status.code(), Some(0));
    assert_eq!(json_of(&demo_default), json_of(&with_site));
    refused(&["--tank", "TK-9", "--mu", "1"], "its tanks: TK-1, TK-2");
    refused(
        &with(&[
            "--impeller-diameter",
            "1.7",
            "--speed",
            "30 rpm",
            "--mu",
            "1",
            "--motor-current",
            "3",
        ]),
        "--voltage and --power-factor",
    );
    refused(
        &[
            "--impeller",
            "paddle",
            "--impeller-diameter",
            "1",
            "--speed",
            "30 rpm",
            "--density",
            "1000",
            "--mu",
            "1",
        ],
        "use one of rushton-turbine",
    );
}
