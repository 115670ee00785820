//! Arrhenius shift and activation-energy fit (Arrhenius; Steffe 1996, ch. 1).

use rheoside::rheology::temperature::{
    GAS_CONSTANT, arrhenius_factor, fit_activation_energy, shift_to_reference,
};
use serde_json::Value;

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

// Source: CODATA 2018 molar gas constant, R = 8.314 462 618 J/(mol·K) (exact in the 2019 SI).
#[test]
fn gas_constant_is_codata_2018() {
    assert_eq!(GAS_CONSTANT, 8.314462618);
}

// Source: worked by hand from K(T) = K_ref·exp[(Ea/R)(1/T − 1/T_ref)] (Arrhenius; Steffe 1996, ch. 1).
// Ea = 40 kJ/mol, T = 60 °C = 333.15 K, T_ref = 20 °C = 293.15 K:
//   Ea/R          = 40000 / 8.314462618      = 4810.8942 K
//   1/T − 1/T_ref = 0.00300165 − 0.00341122 = −0.000409572 1/K
//   exponent      = 4810.8942 × −0.000409572 = −1.970408
//   factor        = exp(−1.970408)           = 0.139400
#[test]
fn arrhenius_factor_worked_by_hand() {
    let f = arrhenius_factor(40_000.0, 333.15, 293.15);
    assert!((f - 0.139400).abs() < 5e-7, "{f}");
    // Hotter thins the product; at the reference temperature nothing changes.
    assert_eq!(arrhenius_factor(40_000.0, 293.15, 293.15), 1.0);
    // K read as 2.0 Pa·sⁿ at 60 °C is 2.0/0.139400 = 14.347 Pa·sⁿ at 20 °C.
    let k_ref = shift_to_reference(2.0, 40_000.0, 333.15, 293.15);
    assert!((k_ref - 14.3472).abs() < 1e-3, "{k_ref}");
}

// Source: exact data made from the Arrhenius form itself (Ea = 35 kJ/mol, K_ref = 12 at 20 °C):
// the regression of ln K on 1/T must return them, with a zero-width interval.
#[test]
fn activation_energy_from_exact_data() {
    let (ea, k_ref, t_ref) = (35_000.0, 12.0, 293.15);
    let samples: Vec<(f64, f64)> = [278.15, 293.15, 313.15, 333.15]
        .iter()
        .map(|&t| (t, k_ref * arrhenius_factor(ea, t, t_ref)))
        .collect();
    let fit = fit_activation_energy(&samples, t_ref).unwrap();
    assert!(rel(fit.ea_j_per_mol, ea) < 1e-9);
    assert!(rel(fit.value_at_ref, k_ref) < 1e-12);
    let (lo, hi) = fit.ci95.unwrap();
    assert!(hi - lo < 1e-6 * ea);
}

// Source: with exactly two temperatures the line has no residual degrees of freedom (m − 2 = 0),
// so no interval; Ea = R·ln(K1/K2)/(1/T1 − 1/T2) worked here by hand.
#[test]
fn two_temperatures_give_ea_without_ci() {
    let fit = fit_activation_energy(&[(293.15, 10.0), (313.15, 5.0)], 293.15).unwrap();
    let want = GAS_CONSTANT * (10.0_f64 / 5.0).ln() / (1.0 / 293.15 - 1.0 / 313.15);
    assert!(rel(fit.ea_j_per_mol, want) < 1e-12);
    assert_eq!(fit.ci95, None);
    assert_eq!(fit.std_error_j_per_mol, None);
}

// Source: scipy.stats.linregress on ln K against 1/T − 1/T_ref with t.ppf(0.975, m − 2)
// (tests/reference/make_fit_refs.py, "arrhenius" in fit_refs.json; invented readings).
#[test]
fn activation_energy_ci_matches_scipy() {
    let refs: Value = serde_json::from_str(include_str!("reference/fit_refs.json")).unwrap();
    let a = &refs["arrhenius"];
    let samples: Vec<(f64, f64)> = a["samples"]
        .as_array()
        .unwrap()
        .iter()
        .map(|s| (s[0].as_f64().unwrap(), s[1].as_f64().unwrap()))
        .collect();
    let fit = fit_activation_energy(&samples, a["t_ref_k"].as_f64().unwrap()).unwrap();
    assert!(rel(fit.ea_j_per_mol, a["ea_j_per_mol"].as_f64().unwrap()) < 1e-9);
    assert!(rel(fit.value_at_ref, a["value_at_ref"].as_f64().unwrap()) < 1e-9);
    let (lo, hi) = fit.ci95.unwrap();
    assert!(rel(lo, a["ci95"][0].as_f64().unwrap()) < 1e-6);
    assert!(rel(hi, a["ci95"][1].as_f64().unwrap()) < 1e-6);
}
