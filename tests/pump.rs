//! The pump engine and the line it works against: ANSI/HI 9.6.7 factors derived by hand (no
//! worked example of the standard is known here for certain), the duty point against a
//! hand-worked intersection, the affinity laws, positive-displacement delivery, and the duty
//! pressure (the line module's, every regime) against Hagen–Poiseuille, Blasius and the plug
//! force balance.

use rheoside::pump::{
    DisplacementPump, NoDuty, PumpCurve, PumpPoint, Relief, SlipBasis, SystemCurve, correction,
    hi967, operating_point, pd_duty, volumetric_efficiency,
};
use rheoside::rheology::Model;
use rheoside::session::line::duty_pressure;

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(1e-300)
}

fn pt(flow_m3_s: f64, head_m: f64, efficiency: f64) -> PumpPoint {
    PumpPoint {
        flow_m3_s,
        head_m,
        efficiency,
    }
}

// Derived by hand from the ANSI/HI 9.6.7-2010 forms (constants from memory, confirmed only in
// secondary sources): ν = 100 cSt, Q_BEP = 20 m³/h, H_BEP = 24 m, N = 1450 rpm.
// 24^0.0625 = e^(0.0625·3.17805) = 1.21972; 20^0.375 = e^(0.375·2.99573) = 3.07520;
// 1450^0.25 = e^(0.25·7.27932) = 6.17068; B = 16.5·10·1.21972/(3.07520·6.17068) = 10.605.
// log B = 1.02552, ^3.15 = 1.08266; C_Q = 2.71^(−0.165·1.08266) = e^(−0.17864·0.99695)
// = 0.8369. B^0.69 = 5.1010; C_η = B^(−0.0547·5.1010) = e^(−0.27903·2.36135) = 0.5175.
// Half the BEP flow: C_H = 1 − (1 − 0.8369)·0.5^0.75 = 1 − 0.1631·0.59460 = 0.9030.
#[test]
fn hi_factors_match_a_hand_derivation() {
    let c = correction(100.0, 20.0, 24.0, 1450.0);
    assert!(rel(c.b, 10.605) < 1e-3, "B {}", c.b);
    assert!(rel(c.c_q, 0.8369) < 1e-3, "C_Q {}", c.c_q);
    assert_eq!(c.c_h_bep, c.c_q);
    assert!(rel(c.c_eta, 0.5175) < 1e-3, "C_eta {}", c.c_eta);
    assert!(rel(hi967::c_h(c.c_h_bep, 0.5), 0.9030) < 1e-3);
    assert_eq!(
        hi967::c_h(c.c_h_bep, 0.0),
        1.0,
        "no head correction at shut-off"
    );
    assert!(c.warnings.is_empty() && !c.none_needed);
}

// Derived: the US form B = 26.6·ν^0.5·H^0.0625/(Q^0.375·N^0.25) with Q in US gpm (1 gpm =
// 3.785411784 L/min, NIST SP 811) and H in ft must give the same B to within the rounding
// of the two published constants (about 0.4 %).
#[test]
fn si_and_us_constants_agree() {
    let q_gpm: f64 = 20.0 / 0.227_124_707_2;
    let h_ft: f64 = 24.0 / 0.3048;
    let b_us =
        hi967::B_CONSTANT_US * 10.0 * h_ft.powf(0.0625) / (q_gpm.powf(0.375) * 1450f64.powf(0.25));
    let b_si = hi967::b_parameter(100.0, 20.0, 24.0, 1450.0);
    assert!(rel(b_us, b_si) < 0.005, "{b_us} vs {b_si}");
}

// Source: ANSI/HI 9.6.7 applies no correction for B ≤ 1 and warns beyond B = 40 (from the
// standard's scope as quoted in secondary sources).
#[test]
fn no_correction_at_low_b_and_a_warning_beyond_forty() {
    let water_like = correction(1.0, 50.0, 30.0, 2900.0);
    assert!(water_like.b <= 1.0 && water_like.none_needed);
    assert_eq!((water_like.c_q, water_like.c_eta), (1.0, 1.0));
    let thick = correction(3000.0, 5.0, 20.0, 1450.0);
    assert!(thick.b > 40.0);
    assert!(thick.warnings.contains(&hi967::HiWarning::BeyondB40));
    let tiny = correction(5000.0, 1.0, 3.0, 1450.0);
    assert!(
        tiny.warnings
            .contains(&hi967::HiWarning::ViscosityOutsideTests)
    );
    assert!(tiny.warnings.contains(&hi967::HiWarning::FlowOutsideTests));
    assert!(tiny.warnings.contains(&hi967::HiWarning::HeadOutsideTests));
}

// Derived by hand: pump H = 30 − 1000·Q (points (0, 30 m) and (0.02 m³/s, 10 m)), η rising
// 0 → 0.8 over the same flows; system H = 10 + 1000·Q. They meet where 30 − 1000Q = 10 +
// 1000Q: Q = 0.01 m³/s, H = 20 m, η = 0.4; P = ρgQH/η = 1000·9.80665·0.01·20/0.4 = 4903.3 W.
#[test]
fn duty_point_is_the_hand_worked_intersection() {
    let pump = PumpCurve::new(vec![pt(0.0, 30.0, 0.0), pt(0.02, 10.0, 0.8)]).unwrap();
    let f = |q: f64| 10.0 + 1000.0 * q;
    let duty = operating_point(&pump, &SystemCurve::Function(&f), 1000.0, Some(6000.0)).unwrap();
    assert!(rel(duty.flow_m3_s, 0.01) < 1e-9 && rel(duty.head_m, 20.0) < 1e-9);
    assert!(rel(duty.power_w, 4903.325) < 1e-6);
    assert!(rel(duty.motor_margin_w.unwrap(), 6000.0 - 4903.325) < 1e-6);
    let sampled = [(0.0, 10.0), (0.02, 30.0)];
    let again = operating_point(&pump, &SystemCurve::Sampled(&sampled), 1000.0, None).unwrap();
    assert!(rel(again.flow_m3_s, 0.01) < 1e-9);
    let tall = |_q: f64| 35.0;
    let none = operating_point(&pump, &SystemCurve::Function(&tall), 1000.0, None);
    assert_eq!(none, Err(NoDuty::PumpBelowSystem));
    let low = |_q: f64| 5.0;
    let past = operating_point(&pump, &SystemCurve::Function(&low), 1000.0, None);
    assert_eq!(past, Err(NoDuty::BeyondCurve));
}

// Source: the affinity laws for one pump at another speed, Q ∝ N and H ∝ N² (Karassik et
// al., Pump Handbook, from memory).
#[test]
fn affinity_laws_scale_the_curve() {
    let pump = PumpCurve::new(vec![
        pt(0.0, 32.0, 0.0),
        pt(0.005, 28.0, 0.6),
        pt(0.007, 24.0, 0.65),
    ])
    .unwrap();
    let half = pump.at_speed(0.5);
    assert_eq!(half.points[1].flow_m3_s, 0.0025);
    assert_eq!(half.points[1].head_m, 7.0);
    assert_eq!(half.bep().efficiency, 0.65);
}

// Derived: a measured volumetric efficiency η_v gives Q = V_d·n·η_v (definition); with the
// line needing 5 bar + 100 bar per m³/s at flow Q the pressure follows. A relief at 5 bar
// opens. Slip falling with viscosity is common practice, no source.
#[test]
fn displacement_pump_delivers_and_meets_its_relief() {
    let pump = DisplacementPump {
        displacement_m3_per_rev: 0.42e-3,
        speed_rev_s: 5.0,
        volumetric_efficiency: Some(0.92),
        relief_pa: Some(12e5),
        motor_rating_w: Some(5500.0),
    };
    let system = |q: f64| 5e5 + 1e7 * q;
    let d = pd_duty(&pump, &system, 10.0);
    assert!(rel(d.flow_m3_s, 0.42e-3 * 5.0 * 0.92) < 1e-9);
    assert!(rel(d.pressure_pa, 5e5 + 1e7 * d.flow_m3_s) < 1e-9);
    assert_eq!(d.basis, SlipBasis::Measured);
    assert!(matches!(d.relief, Relief::Below { .. }));
    let low_relief = DisplacementPump {
        relief_pa: Some(5e5),
        ..pump
    };
    assert!(matches!(
        pd_duty(&low_relief, &system, 10.0).relief,
        Relief::Opens { .. }
    ));
    let estimated = DisplacementPump {
        volumetric_efficiency: None,
        ..pump
    };
    let (thin, _) = volumetric_efficiency(&estimated, 10e5, 0.05);
    let (thick, _) = volumetric_efficiency(&estimated, 10e5, 5.0);
    assert!(thick > thin, "slip falls as the product thickens");
}

/// The demo site's paste line L-2: 62.7 mm bore, 32 m + 6 m of fittings, 2 m rise, 0.2 bar
/// held at the outlet.
fn paste_line() -> rheoside::site::Line {
    let site = rheoside::site::demo().expect("the demo site");
    site.line("L-2").expect("L-2 on the demo site").clone()
}

// Source: Hagen–Poiseuille, ΔP = 128·μ·L·Q/(π·D⁴) for laminar Newtonian flow, plus the
// static head ρ·g·Δz and the back-pressure held at the outlet (worked here).
#[test]
fn the_duty_pressure_is_hagen_poiseuille_in_laminar_flow() {
    let line = paste_line();
    let (mu, rho, q) = (2.0, 1200.0, 2e-3);
    let (p, regime) = duty_pressure(&line, &Model::Newtonian { mu }, rho, q);
    let l = 38.0;
    let d: f64 = 0.0627;
    let friction = 128.0 * mu * l * q / (std::f64::consts::PI * d.powi(4));
    let want = friction + rho * 9.80665 * 2.0 + 20_000.0;
    assert!(rel(p, want) < 1e-4, "{p} vs {want}");
    assert_eq!(regime, Some(rheoside::line::Regime::Laminar));
}

// Source: Blasius' smooth-pipe friction factor, f_Fanning = 0.0791·Re^(−1/4) for
// 4000 < Re < 10⁵ (Darby, *Chemical Engineering Fluid Mechanics*, from memory); the line's
// 0.0015 mm drawn-stainless roughness is hydraulically smooth here, so Colebrook should agree
// within a few per cent.
#[test]
fn the_duty_pressure_handles_turbulent_flow_that_the_stand_in_could_not() {
    let line = paste_line();
    let (mu, rho, q) = (1e-3, 1000.0, 4e-3);
    let (p, regime) = duty_pressure(&line, &Model::Newtonian { mu }, rho, q);
    assert_eq!(regime, Some(rheoside::line::Regime::Turbulent));
    let d: f64 = 0.0627;
    let v = q / (std::f64::consts::PI * d * d / 4.0);
    let re = rho * v * d / mu;
    assert!((4000.0..1e5).contains(&re), "{re}");
    let f = 0.0791 * re.powf(-0.25);
    let friction = 2.0 * f * rho * v * v * 38.0 / d;
    let want = friction + rho * 9.80665 * 2.0 + 20_000.0;
    assert!(rel(p, want) < 0.05, "{p} vs {want} (Re {re})");
}

// Source: the force balance on a plug that has not yet moved, ΔP = 4·τ0·L/D (worked here).
#[test]
fn at_no_flow_a_yield_stress_product_needs_its_plug_broken() {
    let line = paste_line();
    let hb = Model::HerschelBulkley {
        tau0: 160.0,
        k: 45.0,
        n: 0.33,
    };
    let (p, regime) = duty_pressure(&line, &hb, 1480.0, 0.0);
    let want = 4.0 * 160.0 * 38.0 / 0.0627 + 1480.0 * 9.80665 * 2.0 + 20_000.0;
    assert!(rel(p, want) < 1e-9, "{p} vs {want}");
    assert_eq!(regime, None);
}
