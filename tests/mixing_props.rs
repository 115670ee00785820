//! Properties of the mixing engine: power rises with speed for every flow model and impeller,
//! and the viscosity read back from power is the one that made it in the laminar regime.

use proptest::prelude::*;
use rheoside::mixing::{self, BackCalc, Baffling, Fluid, ImpellerKind, Overrides, Regime, Vessel};
use rheoside::rheology::Model;

fn impeller() -> impl Strategy<Value = ImpellerKind> {
    prop::sample::select(ImpellerKind::ALL.to_vec())
}

fn model() -> impl Strategy<Value = Model> {
    prop_oneof![
        (0.001f64..100.0).prop_map(|mu| Model::Newtonian { mu }),
        (0.1f64..100.0, 0.15f64..1.2).prop_map(|(k, n)| Model::PowerLaw { k, n }),
        (0.5f64..300.0, 0.005f64..2.0).prop_map(|(tau0, mu_p)| Model::Bingham { tau0, mu_p }),
        (0.5f64..300.0, 0.1f64..80.0, 0.15f64..1.0)
            .prop_map(|(tau0, k, n)| Model::HerschelBulkley { tau0, k, n }),
        (0.5f64..300.0, 0.005f64..2.0).prop_map(|(tau0, mu_c)| Model::Casson { tau0, mu_c }),
    ]
}

fn vessel(impeller: ImpellerKind, d: f64, baffling: Baffling) -> Vessel {
    Vessel {
        impeller,
        impeller_diameter_m: d,
        baffling,
        tank_diameter_m: Some(d * 1.25),
        liquid_height_m: Some(d * 1.25),
        overrides: Overrides::default(),
        ribbon: None,
    }
}

proptest! {
    #[test]
    fn power_rises_with_speed(
        imp in impeller(),
        model in model(),
        d in 0.05f64..3.0,
        rho in 800.0f64..2000.0,
        n1 in 0.01f64..20.0,
        step in 1.001f64..3.0,
        baffled in any::<bool>(),
    ) {
        let baffling = if baffled { Baffling::Baffled } else { Baffling::Unbaffled };
        let v = vessel(imp, d, baffling);
        let fluid = Fluid { density_kg_m3: rho, model };
        let p1 = mixing::operate(&v, &Default::default(), &fluid, n1).unwrap().point;
        let p2 = mixing::operate(&v, &Default::default(), &fluid, n1 * step).unwrap().point;
        prop_assert!(p2.power_w > p1.power_w, "{p1:?} then {p2:?}");
        prop_assert!(p2.torque_n_m >= p1.torque_n_m * (1.0 - 1e-12), "{p1:?} then {p2:?}");
    }

    #[test]
    fn viscosity_from_power_round_trips_when_laminar(
        imp in impeller(),
        model in model(),
        d in 0.05f64..2.0,
        rho in 800.0f64..2000.0,
        log_n in -4.0f64..0.0,
    ) {
        // Speeds spread on a log scale, 10⁻⁴ to 1 rev/s, so most cases are laminar.
        let n = 10f64.powf(log_n);
        let v = vessel(imp, d, Baffling::Baffled);
        let fluid = Fluid { density_kg_m3: rho, model };
        let p = mixing::operate(&v, &Default::default(), &fluid, n).unwrap().point;
        prop_assume!(p.regime == Regime::Laminar);
        let BackCalc::Done(back) = mixing::viscosity_from_power(&v, &fluid, n, p.power_w).unwrap()
        else {
            return Err(TestCaseError::fail("refused in the laminar regime"));
        };
        prop_assert_eq!(back.regime, Regime::Laminar);
        let rel = (back.apparent_viscosity_pa_s - p.apparent_viscosity_pa_s).abs()
            / p.apparent_viscosity_pa_s;
        prop_assert!(rel < 1e-9, "{} vs {}", back.apparent_viscosity_pa_s, p.apparent_viscosity_pa_s);
        // And K (where the model has one) comes back as the viscometer's.
        if let (Ok(k), Some(k0)) = (back.k, model.param(rheoside::rheology::ParamName::K)) {
            prop_assert!((k - k0).abs() / k0 < 1e-6, "{} vs {}", k, k0);
        }
    }

    #[test]
    fn viscosity_from_power_round_trips_when_transitional(
        imp in impeller(),
        mu in 0.001f64..10.0,
        d in 0.05f64..3.0,
        n in 0.01f64..10.0,
    ) {
        let v = vessel(imp, d, Baffling::Baffled);
        let fluid = Fluid { density_kg_m3: 1000.0, model: Model::Newtonian { mu } };
        let p = mixing::operate(&v, &Default::default(), &fluid, n).unwrap().point;
        prop_assume!(p.regime == Regime::Transitional);
        let BackCalc::Done(back) = mixing::viscosity_from_power(&v, &fluid, n, p.power_w).unwrap()
        else {
            return Err(TestCaseError::fail("refused in the transitional regime"));
        };
        prop_assert!((back.apparent_viscosity_pa_s - mu).abs() / mu < 1e-6);
    }
}
