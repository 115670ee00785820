//! Property tests: parameters come back from exact model data, and every model's inverse
//! undoes its stress. Source: the model equations (Steffe 1996, ch. 1) — exact data have a
//! zero-residual least-squares optimum at the generating parameters, whatever the weighting.

use proptest::prelude::*;
use rheoside::rheology::{FitOptions, Model, Point, Weighting, fit};

/// 6–12 rates spread geometrically over 5–1000 1/s.
fn rates(m: usize) -> Vec<f64> {
    let (lo, hi) = (5.0_f64.ln(), 1000.0_f64.ln());
    (0..m)
        .map(|i| (lo + (hi - lo) * i as f64 / (m - 1) as f64).exp())
        .collect()
}

fn exact(model: &Model, m: usize) -> Vec<Point> {
    rates(m)
        .into_iter()
        .map(|x| Point::new(x, model.stress(x)))
        .collect()
}

fn weighting() -> impl Strategy<Value = Weighting> {
    prop_oneof![Just(Weighting::Unweighted), Just(Weighting::Relative)]
}

/// Fit `model`'s own family to its exact data and compare every parameter.
fn round_trip(model: Model, m: usize, weighting: Weighting, tol: f64) -> Result<(), TestCaseError> {
    let points = exact(&model, m);
    let got = fit(model.kind(), &points, &FitOptions { weighting })
        .map_err(|e| TestCaseError::fail(e.to_string()))?;
    for ((name, want), (_, value)) in model.params().into_iter().zip(got.model.params()) {
        let err = (value - want).abs() / want.abs();
        prop_assert!(
            err < tol,
            "{:?} {name:?}: {value} vs {want} (rel {err:.1e})",
            model.kind()
        );
    }
    prop_assert!(got.r_squared > 1.0 - 1e-9);
    prop_assert!(got.estimates.iter().all(|e| !e.at_bound));
    Ok(())
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(96))]

    #[test]
    fn herschel_bulkley_round_trips(tau0 in 0.5..200.0, k in 0.05..50.0, n in 0.2..0.95,
                                    m in 6usize..=12, w in weighting()) {
        round_trip(Model::HerschelBulkley { tau0, k, n }, m, w, 1e-6)?;
    }

    #[test]
    fn power_law_round_trips(k in 0.05..100.0, n in 0.15..1.3, m in 6usize..=12, w in weighting()) {
        round_trip(Model::PowerLaw { k, n }, m, w, 1e-8)?;
    }

    #[test]
    fn bingham_round_trips(tau0 in 0.5..200.0, mu_p in 0.005..2.0, m in 6usize..=12, w in weighting()) {
        round_trip(Model::Bingham { tau0, mu_p }, m, w, 1e-8)?;
    }

    #[test]
    fn casson_round_trips(tau0 in 0.5..200.0, mu_c in 0.005..2.0, m in 6usize..=12, w in weighting()) {
        round_trip(Model::Casson { tau0, mu_c }, m, w, 1e-8)?;
    }

    #[test]
    fn newtonian_round_trips(mu in 0.001..100.0, m in 6usize..=12, w in weighting()) {
        round_trip(Model::Newtonian { mu }, m, w, 1e-10)?;
    }

    #[test]
    fn rate_at_stress_inverts_stress(tau0 in 0.0..100.0, k in 0.05..50.0, n in 0.2..1.5,
                                     rate in 0.01..5000.0, kind in 0usize..5) {
        let model = match kind {
            0 => Model::Newtonian { mu: k },
            1 => Model::PowerLaw { k, n },
            2 => Model::Bingham { tau0, mu_p: k },
            3 => Model::HerschelBulkley { tau0, k, n },
            _ => Model::Casson { tau0, mu_c: k },
        };
        let back = model.rate_at_stress(model.stress(rate));
        prop_assert!((back - rate).abs() <= 1e-8 * rate.max(1.0), "{model:?}: {back} vs {rate}");
        prop_assert_eq!(model.rate_at_stress(model.yield_stress()), 0.0);
        prop_assert!(!model.apparent_viscosity(rate).is_nan());
    }
}
