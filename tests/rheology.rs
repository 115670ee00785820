//! Fits checked against scipy.optimize.curve_fit (values made by tests/reference/make_fit_refs.py,
//! committed in tests/reference/fit_refs.json), and the model formulas checked by hand.

use rheoside::rheology::{
    Fit, FitOptions, Model, ModelKind, NoCi, ParamName, Point, Weighting, fit, fit_power_law_log,
};
use serde_json::Value;

const REFS: &str = include_str!("reference/fit_refs.json");

fn refs() -> Value {
    serde_json::from_str(REFS).expect("fit_refs.json parses")
}

fn points_of(refs: &Value, dataset: &str) -> Vec<Point> {
    let d = &refs["datasets"][dataset];
    let xs = d["shear_rate"].as_array().expect("rates");
    let ys = d["shear_stress"].as_array().expect("stresses");
    xs.iter()
        .zip(ys)
        .map(|(x, y)| Point::new(x.as_f64().expect("rate"), y.as_f64().expect("stress")))
        .collect()
}

fn param_of(key: &str) -> ParamName {
    match key {
        "mu" => ParamName::Mu,
        "k" => ParamName::K,
        "n" => ParamName::N,
        "tau0" => ParamName::Tau0,
        "mu_p" => ParamName::MuP,
        "mu_c" => ParamName::MuC,
        other => panic!("unknown parameter {other}"),
    }
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(f64::MIN_POSITIVE)
}

/// Compare one scipy case; returns a description of each mismatch.
fn compare(case: &Value, fit: &Fit) -> Vec<String> {
    let mut bad = Vec::new();
    let at_bound: Vec<&str> = case["at_bound"]
        .as_array()
        .expect("at_bound")
        .iter()
        .filter_map(Value::as_str)
        .collect();
    for (key, want) in case["params"].as_object().expect("params") {
        let name = param_of(key);
        let want = want.as_f64().expect("value");
        let est = fit.estimate(name).expect("estimate present");
        if at_bound.contains(&key.as_str()) {
            if !(est.at_bound && est.value == 0.0 && est.no_ci == Some(NoCi::AtBound)) {
                bad.push(format!("{key}: expected at bound, got {est:?}"));
            }
            continue;
        }
        if rel(est.value, want) > 1e-6 {
            bad.push(format!(
                "{key}: {} vs scipy {want} (rel {:.1e})",
                est.value,
                rel(est.value, want)
            ));
        }
        let ci = case["ci95"][key.as_str()].as_array().expect("ci");
        let want_half = (ci[1].as_f64().expect("hi") - ci[0].as_f64().expect("lo")) / 2.0;
        let (lo, hi) = est.ci95.expect("CI present");
        if rel((hi - lo) / 2.0, want_half) > 1e-4 {
            bad.push(format!(
                "{key} CI half-width {} vs scipy {want_half}",
                (hi - lo) / 2.0
            ));
        }
    }
    if rel(fit.ssr, case["ssr"].as_f64().expect("ssr")) > 1e-9 {
        bad.push(format!("ssr {} vs scipy {}", fit.ssr, case["ssr"]));
    }
    if fit.dof as u64 != case["dof"].as_u64().expect("dof") {
        bad.push(format!("dof {} vs scipy {}", fit.dof, case["dof"]));
    }
    bad
}

// Source: scipy 1.17 curve_fit (method="lm", absolute_sigma=False, sigma=None or sigma=τ),
// CIs with scipy.stats.t.ppf(0.975, dof); parameters to 1e-6 relative, CI half-widths to 1e-4.
#[test]
fn every_model_matches_scipy_on_the_invented_data_sets() {
    let refs = refs();
    let cases = refs["cases"].as_array().expect("cases");
    assert!(
        cases.len() >= 5 * 2 * 3,
        "at least three data sets, five models, two weightings"
    );
    let mut failures = Vec::new();
    for case in cases {
        let dataset = case["dataset"].as_str().expect("dataset");
        let kind: ModelKind = case["model"]
            .as_str()
            .expect("model")
            .parse()
            .expect("kind");
        let weighting = match case["weighting"].as_str().expect("weighting") {
            "relative" => Weighting::Relative,
            _ => Weighting::Unweighted,
        };
        let points = points_of(&refs, dataset);
        let got = fit(kind, &points, &FitOptions { weighting });
        let label = format!("{dataset} {} {weighting:?}", kind.name());
        match got {
            Ok(f) => failures.extend(
                compare(case, &f)
                    .into_iter()
                    .map(|m| format!("{label}: {m}")),
            ),
            Err(e) => failures.push(format!("{label}: {e}")),
        }
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}

// Source: AICc = m·ln(SSR/m) + 2k + 2k(k+1)/(m−k−1) (Hurvich & Tsai 1989, from memory), k = the
// model's parameter count (σ not counted), evaluated here on scipy's SSR from fit_refs.json.
#[test]
fn aicc_follows_the_formula_on_scipys_ssr() {
    let refs = refs();
    for case in refs["cases"].as_array().expect("cases") {
        let kind: ModelKind = case["model"]
            .as_str()
            .expect("model")
            .parse()
            .expect("kind");
        let dataset = case["dataset"].as_str().expect("dataset");
        let weighting = match case["weighting"].as_str() {
            Some("relative") => Weighting::Relative,
            _ => Weighting::Unweighted,
        };
        let points = points_of(&refs, dataset);
        let (m, k) = (points.len() as f64, kind.param_count() as f64);
        let ssr = case["ssr"].as_f64().expect("ssr");
        let want = m * (ssr / m).ln() + 2.0 * k + 2.0 * k * (k + 1.0) / (m - k - 1.0);
        let got = fit(kind, &points, &FitOptions { weighting })
            .expect("fit")
            .aicc
            .expect("aicc");
        assert!(
            (got - want).abs() < 1e-6 * want.abs().max(1.0),
            "{dataset} {kind}: {got} vs {want}"
        );
    }
}

// Source: R² = 1 − Σ(τ − τ̂)²/Σ(τ − τ̄)² on raw stress, with τ̂ from scipy's parameters
// (fit_refs.json, px2-paste Herschel–Bulkley, relative weighting: R² is still unweighted).
#[test]
fn r_squared_and_rmse_are_on_raw_stress() {
    let refs = refs();
    let case = refs["cases"]
        .as_array()
        .expect("cases")
        .iter()
        .find(|c| {
            c["dataset"] == "px2-paste"
                && c["model"] == "herschel-bulkley"
                && c["weighting"] == "relative"
        })
        .expect("case");
    let p = &case["params"];
    let (t0, k, n) = (
        p["tau0"].as_f64().unwrap(),
        p["k"].as_f64().unwrap(),
        p["n"].as_f64().unwrap(),
    );
    let points = points_of(&refs, "px2-paste");
    let mean = points.iter().map(|p| p.shear_stress).sum::<f64>() / points.len() as f64;
    let (mut ssr, mut sst) = (0.0, 0.0);
    for q in &points {
        ssr += (q.shear_stress - t0 - k * q.shear_rate.powf(n)).powi(2);
        sst += (q.shear_stress - mean).powi(2);
    }
    let got = fit(
        ModelKind::HerschelBulkley,
        &points,
        &FitOptions {
            weighting: Weighting::Relative,
        },
    )
    .unwrap();
    assert!((got.r_squared - (1.0 - ssr / sst)).abs() < 1e-9);
    assert!(rel(got.rmse_pa, (ssr / points.len() as f64).sqrt()) < 1e-6);
    let sum_sq: f64 = got.residuals_pa.iter().map(|r| r * r).sum();
    assert!(rel(sum_sq, ssr) < 1e-6);
}

// Source: derived here. Take x = ln γ̇ = ln 5 + j (j = 0..4) and residuals e = c·(1, −2, 0, 2, −1),
// which sum to zero and are orthogonal to j, so OLS on ln τ = ln K + n·x + e returns ln K and n
// exactly and SSR = Σe² = 10c². Then s² = SSR/(m − 2) = 10c²/3, Sxx = Σ(j − 2)² = 10,
// SE(n) = √(s²/Sxx) = c/√3, SE(ln K) = √(s²(1/m + x̄²/Sxx)) with x̄ = ln 5 + 2, and
// t(0.975, 3) = 3.182446 (Student t table, e.g. NIST/SEMATECH e-Handbook §1.3.6.7.2).
#[test]
fn power_law_log_fit_standard_errors_follow_the_textbook_formulas() {
    let (k, n, c) = (12.0_f64, 0.4_f64, 0.01_f64);
    let e = [1.0, -2.0, 0.0, 2.0, -1.0];
    let points: Vec<Point> = (0..5)
        .map(|j| {
            let x = 5.0_f64.ln() + j as f64;
            Point::new(x.exp(), (k.ln() + n * x + c * e[j]).exp())
        })
        .collect();
    let f = fit_power_law_log(&points).expect("log fit");
    let s2 = 10.0 * c * c / 3.0;
    let x_bar = 5.0_f64.ln() + 2.0;
    let se_n = c / 3.0_f64.sqrt();
    let se_ln_k = (s2 * (1.0 / 5.0 + x_bar * x_bar / 10.0)).sqrt();
    let t = 3.182446;
    assert!(rel(f.n, n) < 1e-12 && rel(f.k, k) < 1e-12);
    assert!(rel(f.se_n.unwrap(), se_n) < 1e-9);
    assert!(rel(f.se_ln_k.unwrap(), se_ln_k) < 1e-9);
    let (lo, hi) = f.n_ci95.unwrap();
    assert!(rel(hi - n, t * se_n) < 1e-6 && rel(n - lo, t * se_n) < 1e-6);
    let (klo, khi) = f.k_ci95.unwrap();
    assert!(rel(klo, (k.ln() - t * se_ln_k).exp()) < 1e-6);
    assert!(rel(khi, (k.ln() + t * se_ln_k).exp()) < 1e-6);
}

// Source: the model equations (Steffe 1996, ch. 1), worked by hand in the comments.
#[test]
fn model_formulas_worked_by_hand() {
    // HB τ0 = 5, K = 2, n = 0.5 at 100 1/s: 5 + 2·√100 = 25 Pa, μa = 25/100 = 0.25 Pa·s.
    let hb = Model::HerschelBulkley {
        tau0: 5.0,
        k: 2.0,
        n: 0.5,
    };
    assert!((hb.stress(100.0) - 25.0).abs() < 1e-12);
    assert!((hb.apparent_viscosity(100.0) - 0.25).abs() < 1e-12);
    // Inverse: ((25 − 5)/2)² = 100 1/s; at or below τ0 it does not flow.
    assert!((hb.rate_at_stress(25.0) - 100.0).abs() < 1e-9);
    assert_eq!(hb.rate_at_stress(5.0), 0.0);
    assert_eq!(hb.rate_at_stress(3.0), 0.0);
    // Casson τ0 = 4, μc = 0.01 at 100 1/s: √τ = 2 + √1 = 3, τ = 9 Pa; inverse (3 − 2)²/0.01 = 100.
    let ca = Model::Casson {
        tau0: 4.0,
        mu_c: 0.01,
    };
    assert!((ca.stress(100.0) - 9.0).abs() < 1e-12);
    assert!((ca.rate_at_stress(9.0) - 100.0).abs() < 1e-9);
    // Bingham τ0 = 10, μp = 0.05 at 200 1/s: 10 + 10 = 20 Pa; inverse (20 − 10)/0.05 = 200.
    let bi = Model::Bingham {
        tau0: 10.0,
        mu_p: 0.05,
    };
    assert!((bi.stress(200.0) - 20.0).abs() < 1e-12);
    assert!((bi.rate_at_stress(20.0) - 200.0).abs() < 1e-9);
    // Power law K = 4, n = 0.5 at 25 1/s: 4·5 = 20 Pa, μa = 0.8 Pa·s; inverse (20/4)² = 25.
    let pl = Model::PowerLaw { k: 4.0, n: 0.5 };
    assert!((pl.stress(25.0) - 20.0).abs() < 1e-12);
    assert!((pl.apparent_viscosity(25.0) - 0.8).abs() < 1e-12);
    assert!((pl.rate_at_stress(20.0) - 25.0).abs() < 1e-9);
    // Newtonian μ = 0.5 at 10 1/s: 5 Pa.
    let nw = Model::Newtonian { mu: 0.5 };
    assert!((nw.stress(10.0) - 5.0).abs() < 1e-12);
    assert!((nw.rate_at_stress(5.0) - 10.0).abs() < 1e-12);
    // At rest: a yield-stress or thinning fluid has unbounded μa, never NaN; stress → τ0.
    assert_eq!(hb.apparent_viscosity(0.0), f64::INFINITY);
    assert_eq!(pl.apparent_viscosity(0.0), f64::INFINITY);
    assert_eq!(nw.apparent_viscosity(0.0), 0.5);
    assert_eq!(bi.stress(0.0), 10.0);
    assert_eq!(hb.yield_stress(), 5.0);
    assert_eq!(pl.yield_stress(), 0.0);
}

// Source: the public names fixed in the issue (JSON keys, CLI names).
#[test]
fn names_parse_and_print() {
    for kind in ModelKind::ALL {
        assert_eq!(kind.name().parse::<ModelKind>().unwrap(), kind);
        assert_eq!(kind.param_names().len(), kind.param_count());
    }
    assert_eq!(
        "Herschel_Bulkley".parse::<ModelKind>().unwrap(),
        ModelKind::HerschelBulkley
    );
    assert_eq!(ModelKind::HerschelBulkley.title(), "Herschel–Bulkley");
    let err = "carreau".parse::<ModelKind>().unwrap_err().to_string();
    assert!(
        err.contains("'carreau'")
            && err.contains("newtonian, power-law, bingham, herschel-bulkley, casson"),
        "{err}"
    );
    assert_eq!(ParamName::K.json_key(), "k_pa_sn");
    assert_eq!(ParamName::Tau0.symbol(), "τ0");
    assert_eq!(ParamName::N.label(), "flow behaviour index");
    assert_eq!(
        serde_json::to_string(&ModelKind::PowerLaw).unwrap(),
        "\"power-law\""
    );
    let hb = Model::HerschelBulkley {
        tau0: 1.0,
        k: 2.0,
        n: 0.5,
    };
    assert_eq!(hb.param(ParamName::N), Some(0.5));
    assert_eq!(hb.param(ParamName::Mu), None);
    assert_eq!(
        hb.params(),
        vec![
            (ParamName::Tau0, 1.0),
            (ParamName::K, 2.0),
            (ParamName::N, 0.5)
        ]
    );
}
