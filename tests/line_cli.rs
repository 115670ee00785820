//! `rheoside line` and `rheoside fit` on plant pairs, end to end: the `--json` contract keys,
//! the numbers against outside relations named beside each check, and bad input (exit 2).

use assert_cmd::Command;
use serde_json::Value;
use std::f64::consts::PI;
use std::io::Write;

fn run(args: &[&str]) -> assert_cmd::assert::Assert {
    Command::cargo_bin("rheoside").unwrap().args(args).assert()
}

fn json(args: &[&str]) -> Value {
    let mut all = vec!["line", "--json"];
    all.extend_from_slice(args);
    let out = run(&all).success().get_output().stdout.clone();
    serde_json::from_slice(&out).unwrap()
}

fn num(v: &Value, key: &str) -> f64 {
    v[key]
        .as_f64()
        .unwrap_or_else(|| panic!("{key} missing in {v}"))
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

const CONTRACT: [&str; 11] = [
    "velocity_m_s",
    "wall_shear_stress_pa",
    "wall_shear_rate_per_s",
    "reynolds",
    "critical_reynolds",
    "regime",
    "fanning_friction",
    "pressure_drop_pa",
    "friction_pressure_drop_pa",
    "static_pressure_pa",
    "pressure_drop_band_pa",
];

#[test]
fn json_keeps_the_contract_keys_and_hagen_poiseuille() {
    // 7.2 m3/h = 0.002 m3/s (NIST SP 811: 1 h = 3600 s). Hagen–Poiseuille:
    // Δp = 8μLQ/(πR⁴) = 8·1.2·20·0.002/(π·0.025⁴) = 156 455 Pa; static ρgΔz = 1260·9.80665·3.
    let v = json(&[
        "--flow",
        "7.2 m3/h",
        "--diameter",
        "50 mm",
        "--length",
        "20",
        "--density",
        "1260",
        "--elevation",
        "3",
        "--mu",
        "1.2",
    ]);
    for key in CONTRACT {
        assert!(v.get(key).is_some(), "{key} missing in {v}");
    }
    assert_eq!(v["regime"], "laminar");
    let hp = 8.0 * 1.2 * 20.0 * 0.002 / (PI * 0.025f64.powi(4));
    assert!(rel(num(&v, "friction_pressure_drop_pa"), hp) < 1e-9);
    let head = 1260.0 * 9.80665 * 3.0;
    assert!(rel(num(&v, "static_pressure_pa"), head) < 1e-12);
    assert!(rel(num(&v, "pressure_drop_pa"), hp + head) < 1e-9);
    assert!(
        v["pressure_drop_band_pa"].is_null(),
        "no intervals for typed constants"
    );
}

#[test]
fn flow_for_pressure_round_trips() {
    let base = ["--line", "L-1", "--product", "chilli-sauce"];
    let mut a = base.to_vec();
    a.extend(["--flow", "0.003"]);
    let fwd = json(&a);
    let p = num(&fwd, "pressure_drop_pa").to_string();
    let mut b = base.to_vec();
    b.extend(["--flow-for-pressure", p.as_str()]);
    let inv = json(&b);
    assert!(rel(num(&inv, "flow_m3_s"), 0.003) < 1e-8, "{inv}");
}

#[test]
fn a_journal_curve_carries_its_band() {
    let dir = tempfile::tempdir().unwrap();
    let path = crate::line_source::sauce_journal(dir.path());
    let journal = path.to_str().unwrap();
    let args = [
        "--line",
        "L-1",
        "--product",
        "chilli-sauce",
        "--journal",
        journal,
        "--temperature",
        "25",
        "--flow",
        "10 m3/h",
    ];
    let v = json(&args);
    let band = v["pressure_drop_band_pa"].as_array().expect("band");
    let (lo, hi) = (band[0].as_f64().unwrap(), band[1].as_f64().unwrap());
    let p = num(&v, "pressure_drop_pa");
    assert!(lo < p && p < hi, "{lo} {p} {hi}");
    let mut human = vec!["line"];
    human.extend_from_slice(&args);
    let out = run(&human).success().get_output().stdout.clone();
    let text = String::from_utf8(out).unwrap();
    // "5.20 bar (5.10 to 5.31)": the answer with its band, and the cautions.
    assert!(text.contains(" to ") && text.contains("bar ("), "{text}");
    assert!(
        text.contains("lock out") && text.contains("weakest part"),
        "{text}"
    );
}

#[test]
fn bad_input_exits_2_with_the_reason() {
    let pipe = ["--flow", "0.001", "--density", "1000"];
    let cases: [(&[&str], &str); 6] = [
        (
            &["--diameter", "0", "--length", "10", "--mu", "1"],
            "--diameter",
        ),
        (
            &["--diameter", "0.05", "--length", "-3", "--mu", "1"],
            "--length",
        ),
        (
            &["--diameter", "0.05", "--length", "10", "--tau0", "5"],
            "yield stress alone",
        ),
        (
            &["--diameter", "0.05", "--length", "10", "--k", "5"],
            "--k and --n go together",
        ),
        (
            &["--diameter", "0.05", "--length", "10"],
            "no flow curve given",
        ),
        (
            &["--line", "L-9", "--mu", "1"],
            "the site's lines: L-1, L-2",
        ),
    ];
    for (extra, needle) in cases {
        let mut args = vec!["line"];
        args.extend_from_slice(&pipe);
        args.extend_from_slice(extra);
        let out = run(&args).code(2).get_output().stderr.clone();
        let err = String::from_utf8(out).unwrap();
        assert!(err.contains(needle), "{args:?}: {err}");
    }
    let err = run(&[
        "line",
        "--flow",
        "0",
        "--diameter",
        "0.05",
        "--length",
        "1",
        "--mu",
        "1",
        "--density",
        "1000",
    ])
    .code(2)
    .get_output()
    .stderr
    .clone();
    assert!(String::from_utf8(err).unwrap().contains("--flow"));
}

fn plant_csv(rows: &[(f64, f64)]) -> tempfile::NamedTempFile {
    let mut f = tempfile::NamedTempFile::new().unwrap();
    writeln!(f, "flow,pressure_drop").unwrap();
    for (q, p) in rows {
        writeln!(f, "{q} m3/h,{p} bar").unwrap();
    }
    f
}

/// Pairs on a 50 mm, 20 m level pipe from a power law K = 30 Pa·sⁿ, n = 0.32, by the
/// closed form τw = K[(3n+1)/(4n)·8V/D]ⁿ (Steffe 1996 eq 2.121), Δp = 4Lτw/D.
fn power_law_pairs() -> Vec<(f64, f64)> {
    let (k, n, d, l) = (30.0, 0.32, 0.05, 20.0);
    [1.0, 2.0, 4.0, 8.0]
        .iter()
        .map(|&q_h: &f64| {
            let v = q_h / 3600.0 / (PI * d * d / 4.0);
            let tau = k * ((3.0 * n + 1.0) / (4.0 * n) * 8.0 * v / d).powf(n);
            (q_h, 4.0 * l * tau / d / 1e5)
        })
        .collect()
}

#[test]
fn fit_on_plant_pairs_recovers_the_power_law() {
    let f = plant_csv(&power_law_pairs());
    let path = f.path().to_str().unwrap();
    let args = [
        "fit",
        path,
        "--diameter",
        "50 mm",
        "--length",
        "20 m",
        "--density",
        "1100",
        "--model",
        "power-law",
        "--json",
    ];
    let out = run(&args).success().get_output().stdout.clone();
    let v: Value = serde_json::from_slice(&out).unwrap();
    // n′ = n and K′ = K[(3n+1)/(4n)]ⁿ (Steffe 1996 eqs 2.119–2.121).
    assert!(rel(num(&v, "n_prime"), 0.32) < 1e-6, "{v}");
    let kp = 30.0 * ((3.0 * 0.32 + 1.0) / (4.0 * 0.32_f64)).powf(0.32);
    assert!(rel(num(&v, "k_prime_pa_sn"), kp) < 1e-6);
    assert!(
        rel(v["params"]["k_pa_sn"].as_f64().unwrap(), 30.0) < 1e-5,
        "{v}"
    );
    let p0 = &v["points"][0];
    for key in [
        "wall_shear_stress_pa",
        "nominal_shear_rate_per_s",
        "shear_rate_per_s",
    ] {
        assert!(p0[key].as_f64().is_some(), "{key} in {p0}");
    }
}

#[test]
fn turbulent_plant_pairs_are_refused() {
    // Water-like pressure drops at high flow: Re far above any critical value.
    let f = plant_csv(&[(30.0, 0.5), (40.0, 0.85)]);
    let path = f.path().to_str().unwrap();
    let args = [
        "fit",
        path,
        "--diameter",
        "50 mm",
        "--length",
        "20 m",
        "--density",
        "1000",
    ];
    let err = run(&args).code(2).get_output().stderr.clone();
    let err = String::from_utf8(err).unwrap();
    assert!(err.contains("not laminar"), "{err}");
}
