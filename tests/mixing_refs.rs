//! The mixing engine against the `fluids` package: the helical ribbon's Rieger Kp and the
//! power number. Values made by tests/reference/make_mixing_refs.py (fluids 1.3.1),
//! committed in tests/reference/mixing_refs.json.

use rheoside::mixing::{
    self, BackCalc, Baffling, Fluid, ImpellerKind, Overrides, Refusal, RibbonGeometry, Vessel,
};
use rheoside::rheology::Model;
use serde_json::Value;

fn refs() -> Value {
    let text = std::fs::read_to_string("tests/reference/mixing_refs.json").unwrap();
    serde_json::from_str(&text).unwrap()
}

fn f(v: &Value, key: &str) -> f64 {
    v[key].as_f64().unwrap_or_else(|| panic!("{key} in {v}"))
}

#[test]
fn ribbon_kp_matches_fluids_kp_helical_ribbon_rieger() {
    let cases = refs()["kp_helical_ribbon_rieger"]
        .as_array()
        .unwrap()
        .clone();
    assert!(cases.len() >= 5);
    for c in &cases {
        let g = RibbonGeometry {
            height_m: f(c, "h"),
            pitch_m: f(c, "pitch"),
            width_m: f(c, "width"),
            blades: c["nb"].as_u64().unwrap() as u32,
        };
        let kp = mixing::kp_rieger(&g, f(c, "D"), f(c, "T")).unwrap();
        // fluids.mixing.Kp_helical_ribbon_Rieger.
        let want = f(c, "Kp");
        assert!((kp - want).abs() / want < 1e-12, "{c}: {kp}");
    }
    // Paul, Atiemo-Obeng & Kresta (2004), Handbook of Industrial Mixing, example 9-6: ≈ 357.
    assert!((f(&cases[0], "Kp") - 357.0).abs() < 1.0);
}

#[test]
fn the_ribbon_kp_from_geometry_reaches_the_power_curve() {
    let c = refs()["kp_helical_ribbon_rieger"][0].clone();
    let v = Vessel {
        impeller: ImpellerKind::HelicalRibbon,
        impeller_diameter_m: f(&c, "D"),
        baffling: Baffling::Unbaffled,
        tank_diameter_m: Some(f(&c, "T")),
        liquid_height_m: Some(f(&c, "h")),
        overrides: Overrides::default(),
        ribbon: Some(RibbonGeometry {
            height_m: f(&c, "h"),
            pitch_m: f(&c, "pitch"),
            width_m: f(&c, "width"),
            blades: 2,
        }),
    };
    let curve = v.power_curve().unwrap();
    // fluids.mixing.Kp_helical_ribbon_Rieger, example 9-6 geometry.
    assert!((curve.kp.spread.value - f(&c, "Kp")).abs() < 1e-9);
    assert_eq!(curve.kp.source, mixing::ConstantSource::RiegerCorrelation);
}

#[test]
fn power_number_matches_fluids_power_number() {
    for c in refs()["power_number"].as_array().unwrap() {
        let v = Vessel {
            impeller: ImpellerKind::RushtonTurbine,
            impeller_diameter_m: f(c, "L"),
            baffling: Baffling::Baffled,
            tank_diameter_m: None,
            liquid_height_m: None,
            overrides: Overrides::default(),
            ribbon: None,
        };
        let fluid = Fluid {
            density_kg_m3: f(c, "rho"),
            model: Model::Newtonian { mu: 1.0 },
        };
        let back = mixing::viscosity_from_power(&v, &fluid, f(c, "N"), f(c, "P")).unwrap();
        let np = match back {
            BackCalc::Done(d) => d.power_number,
            BackCalc::Refused(Refusal::Turbulent { power_number, .. }) => power_number,
            other => panic!("{other:?}"),
        };
        // fluids.core.Power_number(P, L, N, rho).
        let want = f(c, "Po");
        assert!((np - want).abs() / want < 1e-12, "{c}: {np}");
    }
}

#[test]
fn forward_power_gives_back_the_fluids_power_number() {
    // P from the engine, then Po = P/(ρN³L⁵) as fluids.core.Power_number defines it, must be
    // the power number the engine read off its curve.
    let c = &refs()["power_number"][1];
    let (d, n, rho) = (f(c, "L"), f(c, "N"), f(c, "rho"));
    let v = Vessel {
        impeller: ImpellerKind::PitchedBladeTurbine,
        impeller_diameter_m: d,
        baffling: Baffling::Baffled,
        tank_diameter_m: Some(2.4),
        liquid_height_m: Some(2.2),
        overrides: Overrides::default(),
        ribbon: None,
    };
    let fluid = Fluid {
        density_kg_m3: rho,
        model: Model::Bingham {
            tau0: 20.0,
            mu_p: 0.05,
        },
    };
    let p = mixing::operate(&v, &Default::default(), &fluid, n)
        .unwrap()
        .point;
    let po = p.power_w / (rho * n.powi(3) * d.powi(5));
    assert!((po - p.power_number).abs() / po < 1e-12);
}
