//! `rheoside fit` end to end: the `--json` contract, the numbers against outside sources,
//! and bad input (exit 2, the message on stderr).

use assert_cmd::Command;
use serde_json::Value;
use std::io::Write;

fn fit(csv: &str, args: &[&str]) -> assert_cmd::assert::Assert {
    let mut file = tempfile::NamedTempFile::new().unwrap();
    file.write_all(csv.as_bytes()).unwrap();
    let path = file.path().to_str().unwrap().to_string();
    let assert = Command::cargo_bin("rheoside")
        .unwrap()
        .arg("fit")
        .arg(&path)
        .args(args)
        .assert();
    drop(file);
    assert
}

fn fit_json(csv: &str, args: &[&str]) -> Value {
    let mut all = vec!["--json"];
    all.extend_from_slice(args);
    let out = fit(csv, &all).success().get_output().stdout.clone();
    serde_json::from_slice(&out).unwrap()
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(1e-300)
}

/// The reference values made by tests/reference/make_fit_refs.py (scipy.optimize.curve_fit).
fn scipy_refs() -> Value {
    let text = std::fs::read_to_string("tests/reference/fit_refs.json").unwrap();
    serde_json::from_str(&text).unwrap()
}

fn dataset_csv(refs: &Value, name: &str) -> String {
    let set = &refs["datasets"][name];
    let mut csv = String::from("shear_rate,shear_stress\n");
    for (g, t) in set["shear_rate"]
        .as_array()
        .unwrap()
        .iter()
        .zip(set["shear_stress"].as_array().unwrap())
    {
        csv.push_str(&format!(
            "{},{}\n",
            g.as_f64().unwrap(),
            t.as_f64().unwrap()
        ));
    }
    csv
}

/// scipy's short parameter names to the contract's JSON keys.
fn contract_key(model: &str, scipy_name: &str) -> &'static str {
    match (model, scipy_name) {
        ("newtonian", "mu") => "mu_pa_s",
        (_, "k") => "k_pa_sn",
        (_, "n") => "n",
        (_, "tau0") => "tau0_pa",
        (_, "mu_p") => "mu_p_pa_s",
        (_, "mu_c") => "mu_c_pa_s",
        other => panic!("unexpected parameter {other:?}"),
    }
}

#[test]
fn json_parameters_match_scipy_curve_fit() {
    // Source: scipy.optimize.curve_fit (absolute_sigma=False) and scipy.stats.t.ppf(0.975, dof),
    // values made by tests/reference/make_fit_refs.py; three invented data sets, every model,
    // both weightings. Parameters to 1e-6 relative, CI ends to 1e-4 relative.
    let refs = scipy_refs();
    let mut checked = 0;
    for case in refs["cases"].as_array().unwrap() {
        let dataset = case["dataset"].as_str().unwrap();
        if !["ts4-sauce", "px2-paste", "t3-slurry"].contains(&dataset) {
            continue;
        }
        let model = case["model"].as_str().unwrap();
        let weighting = case["weighting"].as_str().unwrap();
        let mut args = vec!["--model", model];
        if weighting == "relative" {
            args.extend(["--weight", "relative"]);
        }
        let got = fit_json(&dataset_csv(&refs, dataset), &args);
        assert_eq!(got["model"], model);
        for (name, expected) in case["params"].as_object().unwrap() {
            let key = contract_key(model, name);
            let value = got["params"][key].as_f64().unwrap();
            let expected = expected.as_f64().unwrap();
            assert!(
                rel(value, expected) < 1e-6,
                "{dataset} {model} {weighting} {key}: {value} vs scipy {expected}"
            );
            let ci = &got["ci95"][key];
            let want = &case["ci95"][name];
            for end in 0..2 {
                let (a, b) = (ci[end].as_f64().unwrap(), want[end].as_f64().unwrap());
                assert!(rel(a, b) < 1e-4, "{dataset} {model} {key} CI: {a} vs {b}");
            }
        }
        checked += 1;
    }
    assert!(checked >= 30, "only {checked} scipy cases checked");
}

/// An invented Newtonian standard oil of 0.100 Pa·s read on the standard six-speed geometry.
/// Derived: τ = 0.511 θ Pa and γ̇ = 1.7023 rpm s⁻¹ (API RP 13B-1 geometry; API RP 13D glossary),
/// so θ = μ·1.7023·rpm/0.511.
fn newtonian_six_speed_csv(mu: f64) -> String {
    let mut csv = String::from("rpm,dial\n");
    for rpm in [600.0, 300.0, 200.0, 100.0, 6.0, 3.0] {
        let dial = mu * 1.7023 * rpm / 0.511;
        csv.push_str(&format!("{rpm},{dial}\n"));
    }
    csv
}

#[test]
fn newtonian_standard_reads_back_its_viscosity() {
    let got = fit_json(
        &newtonian_six_speed_csv(0.100),
        &["--geometry", "standard-six-speed"],
    );
    assert_eq!(got["model"], "newtonian");
    // Derived above; the geometry's rate constant is 1.7023 to 5 figures, hence 1e-4.
    let mu = got["params"]["mu_pa_s"].as_f64().unwrap();
    assert!(rel(mu, 0.100) < 1e-4, "μ = {mu}");
    // For a Newtonian fluid the local slope is 1 and the corrected rate equals Margules'.
    for p in got["points"].as_array().unwrap() {
        let a = p["newtonian_shear_rate_per_s"].as_f64().unwrap();
        let b = p["shear_rate_per_s"].as_f64().unwrap();
        assert!(rel(a, b) < 1e-9, "{a} vs {b}");
    }
}

#[test]
fn bingham_on_600_and_300_matches_the_api_relations() {
    // API RP 13D (via Guo & Liu 2011, eqs 2.6–2.8): PV = θ600 − θ300 mPa·s. With the Newtonian
    // rates, a Bingham line through the two readings (γ̇600 = 2γ̇300 exactly) has μp = 0.511(θ600 − θ300)/(1.7023·300)
    // Pa·s = 1.0006e-3 (θ600 − θ300) Pa·s (derived), τ0 = 0.511(2θ300 − θ600) Pa (derived).
    let csv = "rpm,dial\n600,52\n300,34\n";
    let got = fit_json(
        csv,
        &[
            "--geometry",
            "standard-six-speed",
            "--model",
            "bingham",
            "--no-rate-correction",
        ],
    );
    let mu_p = got["params"]["mu_p_pa_s"].as_f64().unwrap();
    let tau0 = got["params"]["tau0_pa"].as_f64().unwrap();
    let pv_mpa_s = 52.0 - 34.0;
    // 1.7023 is given to 5 figures (the code derives it from the radii), hence 1e-4.
    assert!(rel(mu_p * 1000.0, pv_mpa_s * 0.511 / (1.7023 * 300.0) * 1000.0) < 1e-4);
    assert!(rel(mu_p * 1000.0, pv_mpa_s) < 1e-3, "PV within 0.1 %");
    assert!(rel(tau0, 0.511 * (2.0 * 34.0 - 52.0)) < 1e-9, "τ0 = {tau0}");
}

#[test]
fn json_has_every_contract_key() {
    let got = fit_json(
        "rpm,dial\n600,52\n300,34\n200,27\n100,19\n6,7\n3,6\n",
        &["--geometry", "standard-six-speed"],
    );
    for key in [
        "model",
        "params",
        "ci95",
        "r_squared",
        "rmse_pa",
        "aicc",
        "candidates",
        "points",
        "warnings",
    ] {
        assert!(got.get(key).is_some(), "missing key {key}");
    }
    let candidate = &got["candidates"][0];
    for key in ["model", "aicc", "r_squared"] {
        assert!(candidate.get(key).is_some(), "candidate lacks {key}");
    }
    let point = &got["points"][0];
    for key in [
        "rpm",
        "dial",
        "newtonian_shear_rate_per_s",
        "shear_rate_per_s",
        "shear_stress_pa",
        "flags",
    ] {
        assert!(point.get(key).is_some(), "point lacks {key}");
    }
    let names = [
        "newtonian",
        "power-law",
        "bingham",
        "herschel-bulkley",
        "casson",
    ];
    assert!(names.contains(&got["model"].as_str().unwrap()));
    // 27 of 300 is below 10 % of full scale: common practice, no source.
    assert_eq!(got["points"][2]["flags"][0], "low-scale");
}

#[test]
fn human_output_names_the_model_and_why() {
    let out = fit(
        &newtonian_six_speed_csv(0.05),
        &["--geometry", "standard-six-speed"],
    )
    .success()
    .get_output()
    .stdout
    .clone();
    let text = String::from_utf8(out).unwrap();
    assert!(text.contains("Flow curve: Newtonian"), "{text}");
    assert!(text.contains("why:"), "{text}");
    assert!(text.contains("± 95 % interval"), "{text}");
}

#[test]
fn several_temperatures_give_an_activation_energy() {
    // Invented product: power law, n = 0.5, K = 10 Pa·sⁿ at 20 °C, Ea = 30 kJ/mol.
    // K(T) = 10·exp[(30000/8.314462618)(1/T − 1/293.15)] (Arrhenius; Steffe 1996, ch. 1):
    // at 40 °C, 1/313.15 − 1/293.15 = −2.17863e-4, so K = 10·exp(−0.786099) = 4.55629.
    let mut csv = String::from("shear_rate,shear_stress,temperature\n");
    for (t_c, k) in [(20.0, 10.0), (40.0, 4.556_29)] {
        for rate in [10.0_f64, 50.0, 100.0, 500.0] {
            csv.push_str(&format!("{rate},{},{t_c}\n", k * rate.sqrt()));
        }
    }
    let got = fit_json(&csv, &["--model", "power-law"]);
    let ea = got["activation_energy"]["ea_j_per_mol"].as_f64().unwrap();
    assert!(rel(ea, 30_000.0) < 1e-4, "Ea = {ea}");
    assert_eq!(got["temperatures"].as_array().unwrap().len(), 2);
    assert!(rel(got["params"]["k_pa_sn"].as_f64().unwrap(), 10.0) < 1e-9);
}

fn stderr_of(assert: assert_cmd::assert::Assert) -> String {
    let out = assert.code(2).get_output().stderr.clone();
    String::from_utf8(out).unwrap()
}

#[test]
fn bad_input_exits_2_with_a_message() {
    let err = stderr_of(fit("rpm,dial\n600,52\n", &[]));
    assert!(err.contains("need a geometry"), "{err}");
    let err = stderr_of(fit(
        "rpm,dial\n600,abc\n",
        &["--geometry", "standard-six-speed"],
    ));
    assert!(
        err.contains("line 2, column 'dial': 'abc' is not a number"),
        "{err}"
    );
    let err = stderr_of(fit("speed,dial\n600,52\n", &[]));
    assert!(err.contains("unknown column 'speed'"), "{err}");
    let err = stderr_of(fit(
        "shear_rate,shear_stress\n1,2\n",
        &["--model", "carreau"],
    ));
    assert!(err.contains("--model 'carreau'"), "{err}");
    let err = stderr_of(fit(
        "shear_rate,shear_stress\n1,2\n",
        &["--weight", "heavy"],
    ));
    assert!(
        err.contains("accepted values are 'none', 'relative' or 'log'"),
        "{err}"
    );
    let err = stderr_of(fit(
        "shear_rate,shear_stress\n10,5\n20,-1\n30,9\n",
        &["--model", "newtonian"],
    ));
    assert!(err.contains("cannot fit"), "{err}");
    assert!(!err.contains("panicked"), "{err}");
}

#[test]
fn missing_file_is_bad_input() {
    let err = stderr_of(
        Command::cargo_bin("rheoside")
            .unwrap()
            .args(["fit", "/nonexistent/readings.csv"])
            .assert(),
    );
    assert!(
        err.contains("cannot read '/nonexistent/readings.csv'"),
        "{err}"
    );
}
