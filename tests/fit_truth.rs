//! `rheoside fit` tells the truth: pegged and reversed readings, poor fits, the API RP 13D
//! field relations, `--weight log` against numpy, and hostile input refused once, clearly.

use assert_cmd::Command;
use serde_json::Value;
use std::io::Write;

fn fit(csv: &str, args: &[&str]) -> std::process::Output {
    let mut file = tempfile::NamedTempFile::new().unwrap();
    file.write_all(csv.as_bytes()).unwrap();
    Command::cargo_bin("rheoside")
        .unwrap()
        .arg("fit")
        .arg(file.path())
        .args(args)
        .output()
        .unwrap()
}

fn json(csv: &str, args: &[&str]) -> Value {
    let mut all = vec!["--json"];
    all.extend_from_slice(args);
    let out = fit(csv, &all);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).unwrap()
}

fn human(csv: &str, args: &[&str]) -> String {
    let out = fit(csv, args);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

fn stderr_of(out: std::process::Output) -> String {
    assert_eq!(out.status.code(), Some(2), "{out:?}");
    String::from_utf8(out.stderr).unwrap()
}

const SIX: &[&str] = &["--geometry", "standard-six-speed"];

/// Invented six-speed set (a thin slurry shape), all on scale.
const SET: &str = "rpm,dial\n600,52\n300,34\n200,27\n100,19\n6,7\n3,6\n";

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(1e-300)
}

// Source: a dial at or above full scale only says "at least this much" (common practice, no
// source), so the fit with it left out must be the fit of the other readings exactly.
#[test]
fn a_pegged_dial_is_left_out_and_the_fit_equals_the_fit_without_it() {
    let pegged = "rpm,dial\n600,300\n300,34\n200,27\n100,19\n6,7\n3,6\n";
    let without = "rpm,dial\n300,34\n200,27\n100,19\n6,7\n3,6\n";
    let a = json(pegged, SIX);
    let b = json(without, SIX);
    assert_eq!(a["model"], b["model"]);
    assert_eq!(a["params"], b["params"], "{a:#}");
    assert_eq!(a["ci95"], b["ci95"]);
    assert_eq!(a["left_out"][0]["row"], 1);
    assert_eq!(a["left_out"][0]["why"], "pegged");
    assert_eq!(a["points"].as_array().unwrap().len(), 5);
    assert_eq!(a["points"][0]["row"], 2, "rows keep the numbers typed");
    let warnings = a["warnings"].to_string();
    assert!(warnings.contains("reading 1 (600 rpm, dial 300) is at or above full scale"));
    let text = human(pegged, SIX);
    assert!(text.contains("left out of the fit"), "{text}");
    // --include-off-scale keeps it, flagged.
    let kept = json(
        pegged,
        &["--geometry", "standard-six-speed", "--include-off-scale"],
    );
    assert_eq!(kept["points"].as_array().unwrap().len(), 6);
    assert!(kept["left_out"].as_array().unwrap().is_empty());
    assert_eq!(kept["points"][0]["flags"][0], "off-scale");
    assert_ne!(kept["params"], b["params"]);
}

#[test]
fn every_reading_pegged_is_refused_with_the_way_out() {
    let err = stderr_of(fit("rpm,dial\n600,300\n300,310\n", SIX));
    assert!(
        err.contains("every reading (2) is at or above full scale"),
        "{err}"
    );
    assert!(err.contains("--include-off-scale"), "{err}");
}

// Source: the flow curve of a fluid at rest-to-flow never falls with rate in a steady
// measurement; a lower speed reading above a higher one (3 rpm above 6 rpm) is a reading
// problem (common practice, no source).
#[test]
fn a_reversed_reading_is_flagged_on_both_points_and_in_the_warnings() {
    let v = json("rpm,dial\n600,52\n300,34\n200,27\n100,19\n6,7\n3,9\n", SIX);
    let flags = |i: usize| v["points"][i]["flags"].to_string();
    assert!(
        flags(4).contains("reversed") && flags(5).contains("reversed"),
        "{v:#}"
    );
    assert!(!flags(3).contains("reversed"));
    let warnings = v["warnings"].to_string();
    assert!(
        warnings.contains("readings 6 and 5 are reversed"),
        "{warnings}"
    );
    assert!(warnings.contains("thixotropy") && warnings.contains("wall slip"));
    assert!(v["concerns"].to_string().contains("reversed-reading"));
    // The good set has none.
    let good = json(SET, SIX);
    assert!(
        !good["concerns"].to_string().contains("reversed"),
        "{good:#}"
    );
}

// Source: R² below 0.9 is a poor fit (common practice, no source); R² below 0 means the curve
// is worse than the mean of the readings (definition of R² = 1 − SSR/SST).
#[test]
fn a_poor_fit_is_warned_and_a_negative_r_squared_is_never_a_number() {
    // Invented flat set: the stress barely moves with rate.
    let flat = "shear_rate,shear_stress\n1,10\n2,10.1\n4,9.9\n8,10\n16,10.05\n32,9.95\n";
    let text = human(flat, &["--model", "newtonian"]);
    assert!(text.contains("R² worse than a flat line"), "{text}");
    assert!(!text.contains("R² -"), "{text}");
    assert!(text.contains("poor fit"), "{text}");
    let v = json(flat, &["--model", "newtonian"]);
    assert!(v["concerns"].to_string().contains("worse-than-flat-line"));
    // A scattered set with R² between 0 and 0.9 (invented).
    let scatter = "shear_rate,shear_stress\n1,5\n2,9\n4,6\n8,11\n16,7\n32,12\n";
    let v = json(scatter, &["--model", "power-law"]);
    let r2 = v["r_squared"].as_f64().unwrap();
    assert!((0.0..0.9).contains(&r2), "{r2}");
    assert!(v["warnings"].to_string().contains("poor fit: R²"), "{v:#}");
    assert!(v["reason"].as_str().unwrap().contains("The fit is poor"));
}

// Source: the runs of residual signs. A Newtonian line through a curved (shear-thinning)
// set misses low at both ends and high in the middle in long runs; 8 points in 3 runs with
// the longest of 5 (the limit, common practice, no source).
#[test]
fn a_systematic_run_of_residuals_is_warned() {
    let csv = "shear_rate,shear_stress\n1,2\n2,2.8\n4,4\n8,5.6\n16,8\n32,11.3\n64,16\n128,22.6\n";
    let v = json(csv, &["--model", "newtonian"]);
    assert!(
        v["concerns"].to_string().contains("residual-pattern"),
        "{v:#}"
    );
}

// Source: plastic viscosity below water's (about 1 mPa·s at 20 °C, from memory) and n outside
// 0.1–2 are implausible for plant products (common practice, no source).
#[test]
fn implausible_constants_are_flagged() {
    // Invented: a Bingham line with μp = 0.2 mPa·s (τ = 3 + 0.0002·γ̇).
    let thin = "shear_rate,shear_stress\n10,3.002\n100,3.02\n300,3.06\n600,3.12\n1000,3.2\n";
    let v = json(thin, &["--model", "bingham"]);
    assert!(
        v["concerns"].to_string().contains("implausible-constant"),
        "{v:#}"
    );
    assert!(
        v["warnings"]
            .to_string()
            .contains("below the viscosity of water")
    );
    // Invented: n = 3 exactly (τ = 0.01·γ̇³).
    let thick = "shear_rate,shear_stress\n1,0.01\n2,0.08\n3,0.27\n4,0.64\n5,1.25\n";
    let v = json(thick, &["--model", "power-law"]);
    assert!(
        v["warnings"].to_string().contains("outside 0.1 to 2"),
        "{v:#}"
    );
}

// Source: API RP 13D field relations, as printed in Guo & Liu 2011, *Applied Drilling
// Circulation Systems*, eqs 2.6–2.10, worked by hand for θ600 = 52, θ300 = 34, θ100 = 19,
// θ3 = 6:
//   PV = 52 − 34 = 18 mPa·s = 0.018 Pa·s;   YP = 34 − 18 = 16 lbf/100 ft² × 0.4788026 = 7.66084 Pa;
//   n = 3.322·log10(52/34) = 3.322 × 0.184524 = 0.612990;
//   Kp = 5.11·52/1022^0.612990 = 265.72/69.946 = 3.79892 dyn·sⁿ/cm² = 0.379892 Pa·sⁿ;
//   nₐ = 0.657·log10(19/6) = 0.657 × 0.500602 = 0.328896;
//   Kₐ = 5.11·19/170.2^0.328896 = 97.09/5.41688 = 17.9234 dyn·sⁿ/cm² = 1.79234 Pa·sⁿ.
// 0.4788026 Pa per lbf/100 ft² from the exact lbf (4.4482216152605 N) and ft (0.3048 m).
#[test]
fn api_rp13d_relations_match_the_hand_worked_values() {
    let v = json(SET, SIX);
    let a = &v["api_rp13d"];
    let get = |k: &str| a[k].as_f64().unwrap_or_else(|| panic!("{k} in {a:#}"));
    assert!(rel(get("plastic_viscosity_pa_s"), 0.018) < 1e-12);
    assert!(rel(get("yield_point_lbf_100ft2"), 16.0) < 1e-12);
    assert!(rel(get("yield_point_pa"), 7.66084) < 1e-5);
    assert!(rel(get("n"), 0.612990) < 1e-5);
    assert!(rel(get("k_pa_sn"), 0.379892) < 1e-4);
    assert!(rel(get("n_annulus"), 0.328896) < 1e-5);
    assert!(rel(get("k_annulus_pa_sn"), 1.79234) < 1e-4);
    let text = human(SET, SIX);
    assert!(text.contains("API RP 13D field relations"), "{text}");
    assert!(
        text.contains("0.4788 Pa per lbf/100 ft²") && text.contains("0.511 Pa per dial degree")
    );
    // Without 100 and 3 rpm there is no annulus pair; without 600 rpm no relations at all.
    let v = json("rpm,dial\n600,52\n300,34\n200,27\n", SIX);
    assert!(v["api_rp13d"].get("n_annulus").is_none(), "{v:#}");
    let v = json("rpm,dial\n300,34\n200,27\n100,19\n6,7\n", SIX);
    assert!(v["api_rp13d"].is_null());
}

/// Values made by tests/reference/make_loglog_refs.py (numpy.polyfit on ln rate, ln stress).
fn numpy_refs() -> Value {
    let text = std::fs::read_to_string("tests/reference/loglog_refs.json").unwrap();
    serde_json::from_str(&text).unwrap()
}

// Source: numpy.polyfit(ln γ̇, ln τ, 1), the log–log regression, values in loglog_refs.json.
#[test]
fn weight_log_matches_numpy_loglog_polyfit() {
    let refs = numpy_refs();
    for (name, set) in refs["sets"].as_object().unwrap() {
        let mut csv = String::from("shear_rate,shear_stress\n");
        let rates = set["shear_rate"].as_array().unwrap();
        for (g, t) in rates.iter().zip(set["shear_stress"].as_array().unwrap()) {
            csv.push_str(&format!("{g},{t}\n"));
        }
        let v = json(&csv, &["--weight", "log", "--model", "power-law"]);
        assert_eq!(v["weighting"], "log");
        let k = v["params"]["k_pa_sn"].as_f64().unwrap();
        let n = v["params"]["n"].as_f64().unwrap();
        assert!(
            rel(k, set["k_pa_sn"].as_f64().unwrap()) < 1e-9,
            "{name}: K {k}"
        );
        assert!(rel(n, set["n"].as_f64().unwrap()) < 1e-9, "{name}: n {n}");
        let ci = &v["ci95"]["n"];
        for i in 0..2 {
            let want = set["n_ci95"][i].as_f64().unwrap();
            assert!(
                rel(ci[i].as_f64().unwrap(), want) < 1e-6,
                "{name}: n CI {ci}"
            );
        }
        let r2 = v["r_squared"].as_f64().unwrap();
        assert!(
            (r2 - set["r_squared"].as_f64().unwrap()).abs() < 1e-9,
            "{name}"
        );
    }
}

// Source: none needed — every model must fit under log weighting and give τ0 ≥ 0.
#[test]
fn weight_log_fits_every_model_with_a_non_negative_yield_stress() {
    for model in ["newtonian", "bingham", "herschel-bulkley", "casson"] {
        let v = json(
            SET,
            &[
                "--geometry",
                "standard-six-speed",
                "--weight",
                "log",
                "--model",
                model,
            ],
        );
        let tau0 = v["params"]["tau0_pa"].as_f64().unwrap_or(0.0);
        assert!(tau0 >= 0.0, "{model}: {v:#}");
        assert_eq!(v["weighting"], "log");
    }
}

// Regression: an error used to be printed twice ("cannot fit: X: X"), once as the error and
// once as its source.
#[test]
fn a_fit_error_is_printed_once() {
    let err = stderr_of(fit(
        "shear_rate,shear_stress\n10,5\n20,-1\n30,9\n",
        &["--model", "newtonian"],
    ));
    let first = err
        .find("shear stress must be greater than zero")
        .expect(&err);
    assert!(
        !err[first + 1..].contains("shear stress must be greater than zero"),
        "{err}"
    );
}

// Regressions from fuzzing: absurd stresses (≥ 1e200 Pa) gave a negative yield stress and
// "R² NaN", and one Newtonian point gave μ = 1.0. Stresses above 1e9 Pa are refused at input.
#[test]
fn absurd_stresses_are_refused_at_input() {
    let err = stderr_of(fit(
        "shear_rate,shear_stress\n1,1e200\n",
        &["--model", "newtonian"],
    ));
    assert!(err.contains("beyond what a plant measures"), "{err}");
    let err = stderr_of(fit(
        "shear_rate,shear_stress\n1,1e200\n2,3e200\n3,4e200\n4,1e201\n",
        &["--weight", "relative", "--model", "bingham"],
    ));
    assert!(
        err.contains("shear stress 1e200 Pa") && err.contains("at most 1e9 Pa"),
        "{err}"
    );
}

// Regression: with τ0 held at its bound the interval said "too few points". A Bingham line
// through a shear-thickening set (τ = 0.01·γ̇², invented) has a negative free intercept, so
// τ0 is held at 0 (the straight-line fit's intercept is below zero, worked: x̄ = 6.2,
// ȳ = 0.682, slope 0.1725, intercept 0.682 − 0.1725 × 6.2 = −0.3875).
#[test]
fn a_yield_stress_at_its_bound_says_so() {
    let csv = "shear_rate,shear_stress\n1,0.01\n2,0.04\n4,0.16\n8,0.64\n16,2.56\n";
    let text = human(csv, &["--model", "bingham"]);
    let row = text
        .lines()
        .find(|l| l.contains("τ0 yield stress"))
        .unwrap();
    assert!(
        row.contains("no interval: held at its bound of zero, not estimated"),
        "{row}"
    );
    assert!(!text.contains("too few points"), "{text}");
}
