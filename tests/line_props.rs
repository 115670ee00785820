//! Properties of the pipe-flow engine over random products, lines and flows: the pressure
//! drop rises with flow; flow-for-pressure gives back the flow; n = 1 and τ0 = 0 give the
//! simpler model's answer (each a consequence of the relations' own forms).

use proptest::prelude::*;
use rheoside::line::{self, Fluid, Pipe, flow_at_wall_stress};
use rheoside::rheology::Model;

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(f64::MIN_POSITIVE)
}

/// Any of the five models with plausible process values.
fn model() -> impl Strategy<Value = Model> {
    let mu = 1e-3f64..10.0;
    let k = 0.01f64..100.0;
    let n = 0.2f64..1.0;
    let tau0 = 0.0f64..200.0;
    prop_oneof![
        mu.clone().prop_map(|mu| Model::Newtonian { mu }),
        (k.clone(), n.clone()).prop_map(|(k, n)| Model::PowerLaw { k, n }),
        (tau0.clone(), mu.clone()).prop_map(|(tau0, mu_p)| Model::Bingham { tau0, mu_p }),
        (tau0.clone(), k, n).prop_map(|(tau0, k, n)| Model::HerschelBulkley { tau0, k, n }),
        (tau0, mu).prop_map(|(tau0, mu_c)| Model::Casson { tau0, mu_c }),
    ]
}

fn pipe() -> impl Strategy<Value = Pipe> {
    (0.02f64..0.3, 1.0f64..500.0, 0.0f64..2e-4, -10.0f64..10.0).prop_map(|(d, l, e, z)| Pipe {
        inner_diameter_m: d,
        length_m: l,
        fittings_length_m: 0.1 * l,
        roughness_m: e,
        elevation_change_m: z,
    })
}

fn fluid() -> impl Strategy<Value = Fluid> {
    (model(), 800.0f64..2000.0).prop_map(|(model, density_kg_m3)| Fluid {
        model,
        density_kg_m3,
    })
}

proptest! {
    #[test]
    fn pressure_drop_rises_with_flow(
        pipe in pipe(), fluid in fluid(), q in -5.0f64..-1.0, step in 0.001f64..0.5,
    ) {
        let q1 = 10f64.powf(q);
        let q2 = q1 * (1.0 + step);
        let a = line::pressure_drop(&pipe, &fluid, q1).unwrap();
        let b = line::pressure_drop(&pipe, &fluid, q2).unwrap();
        prop_assert!(b.pressure_drop_pa >= a.pressure_drop_pa, "{a:?}\n{b:?}");
    }

    #[test]
    fn flow_for_pressure_round_trips(pipe in pipe(), fluid in fluid(), q in -5.0f64..-1.0) {
        let q = 10f64.powf(q);
        let p = line::pressure_drop(&pipe, &fluid, q).unwrap().pressure_drop_pa;
        let back = line::flow_for_pressure(&pipe, &fluid, p).unwrap();
        prop_assert!(rel(back.flow_m3_s, q) < 1e-6, "{q} -> {p} Pa -> {back:?}");
    }

    #[test]
    fn simpler_models_are_the_limits(
        mu in 1e-3f64..10.0, k in 0.01f64..100.0, n in 0.2f64..1.0, tau0 in 0.0f64..200.0,
        r in 0.01f64..0.15, ratio in 1.01f64..50.0,
    ) {
        let tau_w = ratio * tau0.max(1.0);
        let q = |m: Model| flow_at_wall_stress(&m, r, tau_w);
        let newtonian = q(Model::Newtonian { mu });
        // n = 1: power law → Newtonian, Herschel–Bulkley → Bingham.
        let pl1 = q(Model::PowerLaw { k: mu, n: 1.0 });
        prop_assert!(rel(pl1, newtonian) < 1e-12, "{} {}", pl1, newtonian);
        let hb1 = q(Model::HerschelBulkley { tau0, k: mu, n: 1.0 });
        let bingham = q(Model::Bingham { tau0, mu_p: mu });
        prop_assert!(rel(hb1, bingham) < 1e-9, "{} {}", hb1, bingham);
        // τ0 = 0: Herschel–Bulkley → power law; Bingham and Casson → Newtonian.
        let hb0 = q(Model::HerschelBulkley { tau0: 0.0, k, n });
        let pl = q(Model::PowerLaw { k, n });
        prop_assert!(rel(hb0, pl) < 1e-12, "{} {}", hb0, pl);
        let b0 = q(Model::Bingham { tau0: 0.0, mu_p: mu });
        prop_assert!(rel(b0, newtonian) < 1e-12, "{} {}", b0, newtonian);
        let c0 = q(Model::Casson { tau0: 0.0, mu_c: mu });
        prop_assert!(rel(c0, newtonian) < 1e-9, "{} {}", c0, newtonian);
    }

    #[test]
    fn herschel_bulkley_without_yield_is_the_power_law_in_every_regime(
        pipe in pipe(), k in 0.01f64..10.0, n in 0.36f64..1.0, q in -4.0f64..-1.0,
    ) {
        let q = 10f64.powf(q);
        let pl = Fluid { model: Model::PowerLaw { k, n }, density_kg_m3: 1000.0 };
        let hb = Fluid { model: Model::HerschelBulkley { tau0: 0.0, k, n }, ..pl };
        let a = line::pressure_drop(&pipe, &pl, q).unwrap();
        let b = line::pressure_drop(&pipe, &hb, q).unwrap();
        prop_assert_eq!(a.regime, b.regime);
        prop_assert!(rel(a.pressure_drop_pa - a.static_pressure_pa, b.pressure_drop_pa - b.static_pressure_pa) < 1e-6, "{a:?}\n{b:?}");
    }
}
