//! `rheoside restart` and `rheoside pump` end to end: the `--json` contract keys, the demo's
//! paste line against numbers worked here, and bad input (exit 2, the message on stderr).

use assert_cmd::Command;
use serde_json::Value;
use std::io::Write;

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(1e-300)
}

fn run(args: &[&str]) -> assert_cmd::assert::Assert {
    Command::cargo_bin("rheoside").unwrap().args(args).assert()
}

fn json(args: &[&str]) -> Value {
    let mut all = args.to_vec();
    all.push("--json");
    let out = run(&all).success().get_output().stdout.clone();
    serde_json::from_slice(&out).unwrap()
}

fn refused(args: &[&str], needle: &str) {
    let out = run(args).code(2).get_output().stderr.clone();
    let text = String::from_utf8_lossy(&out);
    assert!(text.contains(needle), "{text}");
}

const PASTE: [&str; 7] = [
    "restart",
    "--line",
    "L-2",
    "--pump",
    "P-2",
    "--product",
    "filler-paste",
];

// Derived from the invented demo site: L-2 is 62.7 mm bore, 32 m + 6 m fittings, 2 m rise,
// 0.2 bar back-pressure; the paste is 1480 kg/m³ with gel 120 → 520 Pa, tr = 2 h; P-2's relief
// is 12 bar. After a long rest: 4·520·38/0.0627 = 1 260 606 Pa, static 1480·9.80665·2 =
// 29 028 Pa, plus 20 000 Pa: 1 309 634 Pa > 12 bar, so it will not restart. Safe stop:
// τ_allow = (10.8e5 − 49 028)·0.0627/152 = 425.28 Pa, t = 7200·ln(400/94.72) = 10 372 s.
#[test]
fn demo_paste_line_will_not_restart_after_a_long_stop() {
    let v = json(&PASTE);
    assert_eq!(v["will_restart"], Value::Bool(false));
    let needed = 4.0 * 520.0 * 38.0 / 0.0627 + 1480.0 * 9.80665 * 2.0 + 20_000.0;
    // A long rest is judged at 20 time constants: e^(−20) of the build-up (8e-7 Pa) is left.
    assert!(rel(v["restart_pressure_pa"].as_f64().unwrap(), needed) < 1e-8);
    assert_eq!(v["available_pressure_pa"].as_f64(), Some(12e5));
    assert!(rel(v["gel_stress_pa"].as_f64().unwrap(), 520.0) < 1e-6);
    let stop = v["max_stop_s"].as_f64().unwrap();
    assert!(rel(stop, 10_372.0) < 1e-3, "{stop}");
    assert!(
        v["coldest"]["max_stop_s"].as_f64().unwrap() < stop,
        "colder gels faster"
    );
    let cautions = v["cautions"].to_string();
    assert!(
        cautions.contains("never raise a relief setting"),
        "{cautions}"
    );
}

// Derived: after 1 h 30 min, τ = 520 − 400·e^(−5400/7200) = 331.1 Pa; the restart pressure
// is 4·331.1·38/0.0627 + 49 028 = 851 700 Pa, under 12 bar: it restarts.
#[test]
fn a_short_stop_restarts_and_the_words_say_so() {
    let mut args = PASTE.to_vec();
    args.extend(["--stopped-for", "1 h 30 min"]);
    let v = json(&args);
    let gel = 520.0 - 400.0 * (-0.75f64).exp();
    assert!(rel(v["gel_stress_pa"].as_f64().unwrap(), gel) < 1e-9);
    assert_eq!(v["will_restart"], Value::Bool(true));
    let text = String::from_utf8(run(&args).success().get_output().stdout.clone()).unwrap();
    assert!(
        text.contains("will restart") && text.contains("longest safe stop about 2 h 53 min"),
        "{text}"
    );
    assert!(text.contains("conservative for long lines"), "{text}");
}

fn csv(text: &str) -> tempfile::NamedTempFile {
    let mut f = tempfile::NamedTempFile::new().unwrap();
    f.write_all(text.as_bytes()).unwrap();
    f
}

// Derived: readings from τ = 520 − 400·e^(−t/7200) at 10 s, 10 min, 30 min (132.2, 156.8,
// 208.5 Pa... computed below) fit exactly, and the band comes from an assumed 5 % per reading.
#[test]
fn three_readings_give_a_band_on_the_safe_stop() {
    let tau = |t: f64| 520.0 - 400.0 * (-t / 7200.0).exp();
    let rows = format!(
        "rest_time,gel_stress\n10 s,{}\n10 min,{}\n30 min,{}\n",
        tau(10.0),
        tau(600.0),
        tau(1800.0)
    );
    let file = csv(&rows);
    let mut args = PASTE.to_vec();
    args.extend(["--gel-readings", file.path().to_str().unwrap()]);
    let v = json(&args);
    let band = v["max_stop_band_s"].as_array().expect("a band");
    let stop = v["max_stop_s"].as_f64().unwrap();
    assert!(rel(stop, 10_372.0) < 1e-3, "{stop}");
    let lo = band[0].as_f64().unwrap();
    assert!(
        lo < stop && (band[1].is_null() || band[1].as_f64().unwrap() > stop),
        "{band:?}"
    );
}

// Derived: a single gel stress for any stop on D = 0.05 m, L = 100 m: τ = 10 Pa needs
// 80 000 Pa (force balance); against 1 bar it restarts at any stop (null); against 0.5 bar
// none does (0).
#[test]
fn flags_give_the_contract_keys() {
    let base = [
        "restart",
        "--diameter",
        "0.05",
        "--length",
        "100",
        "--gel-stress",
        "10",
    ];
    let mut ok = base.to_vec();
    ok.extend(["--available-pressure", "1 bar"]);
    let v = json(&ok);
    assert!(rel(v["restart_pressure_pa"].as_f64().unwrap(), 80_000.0) < 1e-12);
    assert_eq!(v["max_stop_s"], Value::Null);
    assert_eq!(v["will_restart"], Value::Bool(true));
    let mut weak = base.to_vec();
    weak.extend(["--available-pressure", "0.5 bar"]);
    let v = json(&weak);
    assert_eq!(v["max_stop_s"].as_f64(), Some(0.0));
    assert_eq!(v["will_restart"], Value::Bool(false));
}

#[test]
fn bad_restart_input_exits_2() {
    let base = ["restart", "--diameter", "0.05", "--length", "100"];
    let with = |extra: &[&'static str]| {
        let mut a = base.to_vec();
        a.extend_from_slice(extra);
        a
    };
    refused(
        &with(&["--gel-stress", "10"]),
        "the pump's limit is not known",
    );
    refused(
        &with(&[
            "--gel-initial",
            "20",
            "--gel-final",
            "10",
            "--gel-time-constant",
            "10 min",
            "--available-pressure",
            "5 bar",
        ]),
        "below the initial",
    );
    let file = csv("rest_time,gel_stress\n-10 s,5\n10 min,9\n");
    let path = file.path().to_str().unwrap().to_string();
    let mut neg = with(&["--available-pressure", "5 bar", "--gel-readings"]);
    neg.push(&path);
    refused(&neg, "rest time -10 s is negative");
    refused(
        &with(&[
            "--gel-stress",
            "10",
            "--available-pressure",
            "5 bar",
            "--stopped-for",
            "-3 h",
        ]),
        "cannot be negative",
    );
    refused(
        &[
            "restart",
            "--line",
            "L-2",
            "--pump",
            "P-1",
            "--product",
            "filler-paste",
        ],
        "feeds line 'L-1'",
    );
}

// Derived by hand in tests/pump.rs (ANSI/HI 9.6.7 forms): ν = 100 cSt at 20 m³/h, 24 m,
// 1450 rpm gives B = 10.605, C_Q = C_H = 0.8369, C_η = 0.5175; the viscous BEP flow is
// 20/3600·0.8369 m³/s and head 24·0.8369 m.
#[test]
fn pump_bep_json_keys() {
    let v = json(&[
        "pump",
        "--viscosity-cst",
        "100",
        "--bep-flow",
        "20 m3/h",
        "--bep-head",
        "24",
        "--speed",
        "1450",
        "--bep-efficiency",
        "65 %",
        "--density",
        "1000",
    ]);
    assert!(rel(v["b_parameter"].as_f64().unwrap(), 10.605) < 1e-3);
    assert!(rel(v["c_q"].as_f64().unwrap(), 0.8369) < 1e-3);
    assert_eq!(v["c_h"], v["c_q"]);
    assert!(rel(v["c_eta"].as_f64().unwrap(), 0.5175) < 1e-3);
    assert!(rel(v["flow_m3_s"].as_f64().unwrap(), 20.0 / 3600.0 * 0.8369) < 1e-3);
    assert!(rel(v["head_m"].as_f64().unwrap(), 24.0 * 0.8369) < 1e-3);
    let p = 1000.0 * 9.80665 * v["flow_m3_s"].as_f64().unwrap() * v["head_m"].as_f64().unwrap()
        / v["efficiency"].as_f64().unwrap();
    assert!(rel(v["power_w"].as_f64().unwrap(), p) < 1e-9);
    refused(&["pump", "--viscosity-cst", "100"], "give --bep-flow");
}

#[test]
fn site_pump_has_an_operating_point() {
    let v = json(&[
        "pump",
        "--pump",
        "P-1",
        "--product",
        "chilli-sauce",
        "--tau0",
        "20",
        "--k",
        "12",
        "--n",
        "0.3",
    ]);
    let op = &v["operating_point"];
    for key in ["flow_m3_s", "head_m", "pressure_pa", "power_w"] {
        assert!(op[key].as_f64().is_some_and(|x| x > 0.0), "{key}: {op}");
    }
    assert_eq!(op["regime"], "laminar");
    // ρ·g·H is the pump's pressure rise (definition of head).
    let rho_g_h = 1120.0 * 9.80665 * op["head_m"].as_f64().unwrap();
    assert!(rel(op["pressure_pa"].as_f64().unwrap(), rho_g_h) < 1e-9);
    let pd = json(&[
        "pump",
        "--pump",
        "P-2",
        "--product",
        "filler-paste",
        "--tau0",
        "150",
        "--k",
        "45",
        "--n",
        "0.3",
    ]);
    // P-2 measured volumetric efficiency 92 %: 0.42 L/rev × 5 rev/s × 0.92.
    assert!(rel(pd["flow_m3_s"].as_f64().unwrap(), 0.42e-3 * 5.0 * 0.92) < 1e-9);
    assert!(pd["operating_point"]["pressure_pa"].as_f64().is_some());
    // With the site's nominal constants the pump answers from them, and says so.
    let nominal = json(&["pump", "--pump", "P-1", "--product", "chilli-sauce"]);
    assert!(nominal["operating_point"]["flow_m3_s"].as_f64().is_some());
    // A product with no nominal block and no flags is refused with what to give.
    let demo = std::fs::read_to_string("site-configs/demo.toml").unwrap();
    let cut = demo.replacen(
        "[product.nominal]\nmodel = \"power-law\"                    # newtonian, power-law, bingham, herschel-bulkley, casson\nk = 15                                 # consistency index K, Pa·s^n\nn = 0.38                               # flow behaviour index\n",
        "",
        1,
    );
    assert_ne!(
        cut, demo,
        "the demo's chilli-sauce nominal block moved; update this test"
    );
    let mut site = tempfile::NamedTempFile::new().unwrap();
    site.write_all(cut.as_bytes()).unwrap();
    let path = site.path().to_str().unwrap();
    refused(
        &[
            "--site",
            path,
            "pump",
            "--pump",
            "P-1",
            "--product",
            "chilli-sauce",
        ],
        "no nominal flow curve",
    );
}

// Derived: P-1 is centrifugal with a 32 m shut-off head on its water curve and an 8 bar casing
// limit; on the sauce (1120 kg/m³) its shut-off pressure ρ·g·H = 1120·9.80665·32 = 351 470 Pa
// is the lower, so it sets what is available. L-1's coldest is 8 °C with no gel factor: the
// cold case keeps the gel and says that cold raises it.
#[test]
fn centrifugal_limit_is_its_shut_off_head_and_cold_is_cautioned() {
    let v = json(&[
        "restart",
        "--line",
        "L-1",
        "--pump",
        "P-1",
        "--product",
        "chilli-sauce",
        "--gel-stress",
        "30",
    ]);
    assert!(
        rel(
            v["available_pressure_pa"].as_f64().unwrap(),
            1120.0 * 9.80665 * 32.0
        ) < 1e-9
    );
    assert_eq!(v["limit_source"], "shut-off-head");
    assert!(
        v["cautions"]
            .to_string()
            .contains("cold raises the gel strength")
    );
    assert_eq!(v["coldest"]["gel_stress_pa"], v["gel_stress_pa"]);
}

// Source: the standard geometry's 0.511 Pa per dial degree (API RP 13B-1 convention, as the
// instrument module holds it). Two readings with a time constant given: τi and τ∞ solve
// exactly (derived in tests/restart.rs), and the answer says the time constant was given.
#[test]
fn dial_readings_and_two_readings() {
    let file = csv("rest_time,dial\n10 s,10\n10 min,40\n30 min,60\n");
    let path = file.path().to_str().unwrap().to_string();
    let args = [
        "restart",
        "--diameter",
        "0.1",
        "--length",
        "500",
        "--available-pressure",
        "20 bar",
        "--gel-readings",
        &path,
    ];
    let v = json(&args);
    let readings = v["gel"]["readings"].as_array().unwrap();
    assert!(rel(readings[1]["stress_pa"].as_f64().unwrap(), 40.0 * 0.511) < 1e-12);
    let two = csv("rest_time,gel_stress\n10 s,100\n30 min,300\n");
    let path = two.path().to_str().unwrap().to_string();
    let mut args = vec![
        "restart",
        "--diameter",
        "0.1",
        "--length",
        "500",
        "--available-pressure",
        "20 bar",
    ];
    args.extend(["--gel-readings", &path, "--gel-time-constant", "30 min"]);
    let text = String::from_utf8(run(&args).success().get_output().stdout.clone()).unwrap();
    assert!(
        text.contains("two readings cannot fit the time constant; the value given (30 min"),
        "{text}"
    );
}
