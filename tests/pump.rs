//! The pump engine and the laminar system curve: ANSI/HI 9.6.7 factors derived by hand (no
//! worked example of the standard is known here for certain), the duty point against a
//! hand-worked intersection, the affinity laws, positive-displacement delivery, and the
//! laminar line loss against Hagen–Poiseuille and the power-law closed form.

use rheoside::pump::{
    DisplacementPump, NoDuty, PumpCurve, PumpPoint, Relief, SlipBasis, SystemCurve, correction,
    hi967, operating_point, pd_duty, volumetric_efficiency,
};
use rheoside::rheology::Model;
use rheoside::session::system_curve::{laminar_flow, wall_stress};

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

// Source: Hagen–Poiseuille, Q = πR⁴ΔP/(8μL), i.e. τw = 4μQ/(πR³) for a Newtonian liquid; and
// the power-law closed form Q = πnR³/(3n+1)·(τw/K)^(1/n) (Steffe 1996, eq 2.119 family).
#[test]
fn laminar_system_curve_matches_the_closed_forms() {
    let (d, q) = (0.05, 2e-3);
    let r: f64 = d / 2.0;
    let newt = Model::Newtonian { mu: 0.5 };
    let tw = wall_stress(d, &newt, q);
    assert!(
        rel(tw, 4.0 * 0.5 * q / (std::f64::consts::PI * r.powi(3))) < 1e-6,
        "{tw}"
    );
    let (k, n) = (12.0, 0.35);
    let pl = Model::PowerLaw { k, n };
    let tw = 40.0;
    let closed = std::f64::consts::PI * n * r.powi(3) / (3.0 * n + 1.0) * (tw / k).powf(1.0 / n);
    assert!(rel(laminar_flow(d, &pl, tw), closed) < 1e-5);
    // A yield stress the wall does not exceed moves nothing.
    let hb = Model::HerschelBulkley { tau0: 50.0, k, n };
    assert_eq!(laminar_flow(d, &hb, 45.0), 0.0);
}
