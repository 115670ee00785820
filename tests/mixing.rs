//! The mixing engine against outside sources: the laminar power relation worked by hand,
//! the Metzner–Otto definition of ks, Elson's cavern against its torque balance, the
//! three-phase power relation, and the inputs it must refuse.

use rheoside::mixing::{
    self, BackCalc, Baffling, CavernFinding, Drive, Electrical, Fluid, ImpellerKind, MixError,
    MotorReading, Overrides, Refusal, Regime, Vessel, WallSpeed,
};
use rheoside::rheology::Model;
use std::f64::consts::PI;

pub(crate) fn vessel(impeller: ImpellerKind, d: f64, t: Option<f64>) -> Vessel {
    Vessel {
        impeller,
        impeller_diameter_m: d,
        baffling: Baffling::Baffled,
        tank_diameter_m: t,
        liquid_height_m: t,
        overrides: Overrides::default(),
        ribbon: None,
    }
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

#[test]
fn laminar_power_newtonian_worked_by_hand() {
    // By hand: μ = 10 Pa·s, ρ = 1200 kg/m³, disc turbine D = 0.2 m at N = 1 rev/s.
    // Re = ρND²/μ = 1200·1·0.04/10 = 4.8 (laminar, below 10).
    // P = Kp·μ·N²·D³ = 70·10·1·0.008 = 5.6 W; torque = P/(2πN) = 0.891 27 N·m.
    let v = vessel(ImpellerKind::RushtonTurbine, 0.2, None);
    let fluid = Fluid {
        density_kg_m3: 1200.0,
        model: Model::Newtonian { mu: 10.0 },
    };
    let op = mixing::operate(&v, &Drive::default(), &fluid, 1.0).unwrap();
    assert_eq!(op.point.regime, Regime::Laminar);
    assert!(rel(op.point.reynolds, 4.8) < 1e-12);
    assert!(rel(op.point.power_w, 5.6) < 1e-12, "{}", op.point.power_w);
    assert!(rel(op.point.torque_n_m, 0.891_27) < 1e-5);
    // Np = Kp/Re = 70/4.8 = 14.583 3.
    assert!(rel(op.point.power_number, 14.583_33) < 1e-6);
}

#[test]
fn laminar_power_power_law_worked_by_hand() {
    // By hand: K = 20 Pa·sⁿ, n = 0.3, ρ = 1120 kg/m³, anchor D = 1.7 m (ks 25, Kp 300),
    // N = 0.05 rev/s. γ̇ = ks·N = 1.25 1/s; μa = 20·1.25^(−0.7) = 17.108 Pa·s;
    // Re = 1120·0.05·1.7²/17.108 = 9.460 (laminar, below 30);
    // P = Kp·μa·N²·D³ = 300·17.108·0.0025·4.913 = 63.04 W.
    let v = vessel(ImpellerKind::Anchor, 1.7, Some(1.8));
    let fluid = Fluid {
        density_kg_m3: 1120.0,
        model: Model::PowerLaw { k: 20.0, n: 0.3 },
    };
    let p = mixing::operate(&v, &Drive::default(), &fluid, 0.05)
        .unwrap()
        .point;
    assert!(rel(p.effective_shear_rate_per_s, 1.25) < 1e-12);
    assert!(rel(p.apparent_viscosity_pa_s, 17.108) < 1e-4);
    assert!(rel(p.reynolds, 9.460) < 1e-3);
    assert_eq!(p.regime, Regime::Laminar);
    assert!(rel(p.power_w, 63.04) < 1e-3, "{}", p.power_w);
}

#[test]
fn ks_recovers_from_its_definition() {
    // Metzner & Otto (1957) define ks by matching laminar power: the non-Newtonian product
    // draws the power a Newtonian liquid of viscosity μ draws, and ks·N is the shear rate at
    // which the product's apparent viscosity equals μ. Work μ out from the power alone
    // (μ = P/(Kp·N²·D³)), then the rate from the power law, and ks must come back.
    let (k, n) = (15.0, 0.35);
    for imp in ImpellerKind::ALL {
        let v = vessel(imp, 0.5, Some(0.55));
        let fluid = Fluid {
            density_kg_m3: 1100.0,
            model: Model::PowerLaw { k, n },
        };
        let speed = 0.02;
        let p = mixing::operate(&v, &Drive::default(), &fluid, speed)
            .unwrap()
            .point;
        assert_eq!(p.regime, Regime::Laminar, "{imp:?}");
        let kp = imp.constants().kp.value;
        let mu_newtonian = p.power_w / (kp * speed * speed * 0.5f64.powi(3));
        let rate = (mu_newtonian / k).powf(1.0 / (n - 1.0));
        let ks = rate / speed;
        assert!(rel(ks, imp.constants().ks.value) < 1e-9, "{imp:?}: {ks}");
    }
}

#[test]
fn elson_cavern_balances_the_impeller_torque() {
    // Derivation (torque balance on a cylinder of diameter Dc and height Hc with the yield
    // stress τ0 on its surface): side wall τ0·πDcHc·Dc/2; top and bottom each
    // ∫₀^(Dc/2) τ0·2πr·r dr = τ0πDc³/12. Sum: τ0·π·Dc³/2·(Hc/Dc + 1/3). This must equal the
    // impeller torque Γ = P/(2πN). With Hc = 0.4·Dc (Elson et al. 1986, from memory).
    let v = vessel(ImpellerKind::RushtonTurbine, 0.8, Some(2.4));
    let tau0 = 40.0;
    let fluid = Fluid {
        density_kg_m3: 1550.0,
        model: Model::Bingham { tau0, mu_p: 0.05 },
    };
    let speed = 0.7;
    let op = mixing::operate(&v, &Drive::default(), &fluid, speed).unwrap();
    let c = mixing::cavern(&v, &fluid, speed)
        .unwrap()
        .expect("a yield stress");
    let dc = c.diameter_m;
    let resisting = tau0 * PI * dc.powi(3) / 2.0 * (0.4 + 1.0 / 3.0);
    assert!(
        rel(resisting, op.point.torque_n_m) < 1e-9,
        "{resisting} vs {}",
        op.point.torque_n_m
    );
    assert!(rel(c.height_m, 0.4 * dc) < 1e-12);
    assert_eq!(c.finding, Some(CavernFinding::StagnantRing), "Dc = {dc}");
}

#[test]
fn the_cavern_reaches_the_wall_at_the_speed_found() {
    let v = vessel(ImpellerKind::PitchedBladeTurbine, 0.8, Some(2.4));
    let fluid = Fluid {
        density_kg_m3: 1550.0,
        model: Model::HerschelBulkley {
            tau0: 30.0,
            k: 2.0,
            n: 0.5,
        },
    };
    let c = mixing::cavern(&v, &fluid, 1.0).unwrap().unwrap();
    let Some(WallSpeed::Rps(n_wall)) = c.speed_to_wall else {
        panic!("expected a speed, got {:?}", c.speed_to_wall);
    };
    // Dc = T there (the definition), a little below it the cavern falls short, above it
    // the cavern reaches the wall.
    let at = mixing::cavern(&v, &fluid, n_wall).unwrap().unwrap();
    assert!(rel(at.diameter_m, 2.4) < 1e-6, "{}", at.diameter_m);
    let below = mixing::cavern(&v, &fluid, n_wall * 0.95).unwrap().unwrap();
    assert_eq!(below.finding, Some(CavernFinding::StagnantRing));
    let above = mixing::cavern(&v, &fluid, n_wall * 1.05).unwrap().unwrap();
    assert_eq!(above.finding, Some(CavernFinding::ReachesWall));
}

#[test]
fn three_phase_shaft_power_by_hand() {
    // P = √3·V·I·PF·η_motor·η_gear − P_no-load (balanced three-phase supply):
    // √3·400·5·0.8 = 2771.28 W; ×0.86×0.94 = 2240.30 W; less 300 W = 1940.304 W.
    let reading = MotorReading {
        electrical: Electrical::ThreePhase {
            current_a: 5.0,
            voltage_v: 400.0,
            power_factor: 0.8,
        },
        motor_efficiency: 0.86,
        gearbox_efficiency: Some(0.94),
        no_load_power_w: Some(300.0),
    };
    let e = mixing::electrical_power_w(&reading.electrical).unwrap();
    assert!(rel(e, 2771.28) < 1e-6, "{e}");
    let s = mixing::shaft_power_w(&reading).unwrap();
    assert!(rel(s, 1940.304) < 1e-6, "{s}");
}

#[test]
fn an_impeller_wider_than_the_tank_is_refused() {
    let v = vessel(ImpellerKind::Anchor, 1.9, Some(1.8));
    let fluid = Fluid {
        density_kg_m3: 1000.0,
        model: Model::Newtonian { mu: 1.0 },
    };
    let err = mixing::operate(&v, &Drive::default(), &fluid, 0.5).unwrap_err();
    assert!(matches!(err, MixError::ImpellerNotInsideTank { .. }));
    assert!(
        err.to_string().contains("must be smaller than the tank"),
        "{err}"
    );
}

#[test]
fn zero_speed_with_a_yield_stress_is_refused() {
    let v = vessel(ImpellerKind::Anchor, 1.7, Some(1.8));
    let fluid = Fluid {
        density_kg_m3: 1480.0,
        model: Model::HerschelBulkley {
            tau0: 120.0,
            k: 40.0,
            n: 0.3,
        },
    };
    let err = mixing::operate(&v, &Drive::default(), &fluid, 0.0).unwrap_err();
    assert_eq!(err, MixError::ZeroSpeedWithYieldStress { tau0: 120.0 });
    assert!(err.to_string().contains("yield stress (120 Pa)"), "{err}");
    let newtonian = Fluid {
        model: Model::Newtonian { mu: 1.0 },
        ..fluid
    };
    let err = mixing::operate(&v, &Drive::default(), &newtonian, -1.0).unwrap_err();
    assert!(matches!(err, MixError::SpeedNotPositive { .. }), "{err}");
}

#[test]
fn a_turbulent_back_calculation_is_refused_with_the_reason() {
    // Water-like product, disc turbine at 3 rev/s: Re = 1000·3·0.09/0.001 = 2.7·10⁵.
    let v = vessel(ImpellerKind::RushtonTurbine, 0.3, Some(0.9));
    let fluid = Fluid {
        density_kg_m3: 1000.0,
        model: Model::Newtonian { mu: 0.001 },
    };
    let op = mixing::operate(&v, &Drive::default(), &fluid, 3.0).unwrap();
    assert_eq!(op.point.regime, Regime::Turbulent);
    let back = mixing::viscosity_from_power(&v, &fluid, 3.0, op.point.power_w).unwrap();
    let BackCalc::Refused(Refusal::Turbulent { power_number, .. }) = back else {
        panic!("expected a refusal, got {back:?}");
    };
    assert!(rel(power_number, 5.5) < 1e-9);
}

#[test]
fn no_power_left_after_the_no_load_power_is_refused() {
    let v = vessel(ImpellerKind::Anchor, 1.7, Some(1.8));
    let fluid = Fluid {
        density_kg_m3: 1120.0,
        model: Model::PowerLaw { k: 12.0, n: 0.3 },
    };
    let back = mixing::viscosity_from_power(&v, &fluid, 0.5, -20.0).unwrap();
    assert!(matches!(
        back,
        BackCalc::Refused(Refusal::NoPowerLeft { .. })
    ));
}

#[test]
fn the_drive_limits_are_checked_at_the_range_ends() {
    // Demand over the motor's rating: 5.6 W impeller power (the hand-worked case above)
    // through a 0.8-efficient gearbox is 7 W at the motor; a 6 W motor is over.
    let v = vessel(ImpellerKind::RushtonTurbine, 0.2, None);
    let fluid = Fluid {
        density_kg_m3: 1200.0,
        model: Model::Newtonian { mu: 10.0 },
    };
    let drive = Drive {
        motor_rating_w: Some(6.0),
        gearbox_efficiency: Some(0.8),
        gearbox_torque_limit_n_m: Some(100.0),
    };
    let op = mixing::operate(&v, &drive, &fluid, 1.0).unwrap();
    let motor = op.motor.unwrap();
    assert!(rel(motor.demand.value, 7.0) < 1e-12);
    assert_eq!(motor.verdict, mixing::LoadVerdict::Over);
    assert_eq!(op.gearbox.unwrap().verdict, mixing::LoadVerdict::Within);
    // The range brackets the nominal value: Kp 65–75 gives 5.2–6.0 W.
    assert!(rel(op.power_w.low, 5.2) < 1e-12 && rel(op.power_w.high, 6.0) < 1e-12);
}

#[test]
fn the_wall_speed_matches_elsons_closed_form_when_turbulent() {
    // Derived from Elson's torque balance with Dc = T and a constant (turbulent) power
    // number: N = √[(T/D)³·π²(0.4 + 1/3)·τ0/(Po·ρ·D²)]. Disc turbine, D = 0.1 m in a 1 m
    // tank, τ0 = 5 Pa, ρ = 1000 kg/m³, Po = 5.5: N = √(1000·π²·0.7333·5/(5.5·1000·0.01))
    // = 25.65 rev/s; there Re ≈ 1.5·10⁴, so the power number is the turbulent one.
    let v = vessel(ImpellerKind::RushtonTurbine, 0.1, Some(1.0));
    let fluid = Fluid {
        density_kg_m3: 1000.0,
        model: Model::Bingham {
            tau0: 5.0,
            mu_p: 1e-4,
        },
    };
    let c = mixing::cavern(&v, &fluid, 5.0).unwrap().unwrap();
    let Some(WallSpeed::Rps(n)) = c.speed_to_wall else {
        panic!("{:?}", c.speed_to_wall);
    };
    let closed = (1000.0 * PI * PI * (0.4 + 1.0 / 3.0) * 5.0 / (5.5 * 1000.0 * 0.01)).sqrt();
    assert!(rel(n, closed) < 1e-6, "{n} vs {closed}");
    assert!(rel(closed, 25.65) < 1e-3);
    let at = mixing::operate(&v, &Drive::default(), &fluid, n).unwrap();
    assert_eq!(at.point.regime, Regime::Turbulent);
}

#[test]
fn the_transitional_bridge_meets_both_ends() {
    // Our own bridge (no source) must equal Kp/Re at Re_L and the turbulent Np at Re_T.
    for imp in ImpellerKind::ALL {
        let curve = vessel(imp, 0.5, Some(1.0)).power_curve().unwrap();
        let s = curve.nominal();
        let at_l = s.power_number(s.re_laminar_below);
        assert!(rel(at_l, s.kp / s.re_laminar_below) < 1e-12, "{imp:?}");
        let just_below_t = s.power_number(s.re_turbulent_above * (1.0 - 1e-12));
        assert!(rel(just_below_t, s.np_turbulent) < 1e-9, "{imp:?}");
    }
}
