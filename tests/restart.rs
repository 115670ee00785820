//! The restart engine: the plug force balance, the gel build-up fit, the longest safe stop and
//! its band, each against a derivation written out here or a scipy fit kept with its script.

use proptest::prelude::*;
use rheoside::line::restart::{
    GelCurve, GelFit, GelFitKind, GelFitOptions, GelReading, IntervalBasis, MaxStop, Outcome,
    PlugLine, RestartError, allowed_gel_stress, check_restart, fit_gel, gel_band,
    longest_safe_stop, longest_safe_stop_band,
};

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs().max(1e-300)
}

fn readings(curve: &GelCurve, times: &[f64]) -> Vec<GelReading> {
    times
        .iter()
        .map(|&t| GelReading {
            rest_s: t,
            stress_pa: curve.stress_at(t),
        })
        .collect()
}

// Derived: force balance on a gelled plug of length L in a bore D. The wall holds it with
// τ·(πDL); the pressure pushes on πD²/4; they balance at ΔP = 4τL/D. For D = 0.05 m,
// L = 100 m, τ = 10 Pa: wall force 10·π·0.05·100 = 157.0796 N over 1.963495e-3 m² gives
// 80 000 Pa; static head and back-pressure add on.
#[test]
fn restart_pressure_is_the_plug_force_balance() {
    let line = PlugLine::new(0.05, 100.0, 3000.0, 2000.0).unwrap();
    let force = 10.0 * std::f64::consts::PI * 0.05 * 100.0;
    let area = std::f64::consts::PI * 0.05 * 0.05 / 4.0;
    assert!(rel(force / area, 80_000.0) < 1e-12);
    let c = check_restart(&line, 10.0, 90_000.0, Some(84_000.0)).unwrap();
    assert!(rel(c.pressure.plug_pa, force / area) < 1e-12);
    assert!(rel(c.pressure.total_pa, 85_000.0) < 1e-12);
    // 85 000 Pa needed: the pump gives 90 000 but the line is rated for 84 000.
    assert_eq!(c.outcome, Outcome::LineTooWeak);
    assert!(rel(c.margin_to_available_pa, 5000.0) < 1e-9);
    let weak = check_restart(&line, 10.0, 80_000.0, None).unwrap();
    assert_eq!(weak.outcome, Outcome::PumpTooWeak);
    assert!(
        check_restart(&line, 10.0, 86_000.0, Some(1e6))
            .unwrap()
            .will_restart()
    );
}

// Derived: exact data from τ(t) = τ∞ − (τ∞ − τi)e^(−t/tr) with τi = 120 Pa, τ∞ = 520 Pa,
// tr = 1500 s have their least-squares optimum at those constants (zero residual).
#[test]
fn gel_fit_recovers_known_constants_from_exact_data() {
    let truth = GelCurve::new(120.0, 520.0, 1500.0).unwrap();
    let six = readings(&truth, &[10.0, 600.0, 1800.0, 3600.0, 7200.0, 14_400.0]);
    let fit = fit_gel(&six, &GelFitOptions::default()).unwrap();
    assert_eq!(fit.kind, GelFitKind::Fitted);
    assert!(rel(fit.curve.initial_pa, 120.0) < 1e-6, "{:?}", fit.curve);
    assert!(rel(fit.curve.long_rest_pa, 520.0) < 1e-6);
    assert!(rel(fit.curve.time_constant_s, 1500.0) < 1e-6);
    assert_eq!(fit.basis, IntervalBasis::Scatter { dof: 3 });
    // The 10 s / 10 min / 30 min procedure: three readings fix three constants exactly.
    let three = readings(&truth, &[10.0, 600.0, 1800.0]);
    let fit = fit_gel(&three, &GelFitOptions::default()).unwrap();
    assert!(
        rel(fit.curve.time_constant_s, 1500.0) < 1e-6,
        "{:?}",
        fit.curve
    );
    assert!(matches!(
        fit.basis,
        IntervalBasis::AssumedReadingError { .. }
    ));
    let ci = fit.ci95().expect("assumed-error interval");
    assert!(ci[2].0 < 1500.0 && 1500.0 < ci[2].1);
}

/// scipy.optimize.curve_fit on invented readings (tests/reference/make_gel_refs.py).
const REFS: &str = include_str!("reference/gel_refs.json");

// Source: scipy.optimize.curve_fit (absolute_sigma=False) and scipy.stats.t.ppf, values kept
// in tests/reference/gel_refs.json with the script that made them.
#[test]
fn gel_fit_and_intervals_match_scipy() {
    let refs: serde_json::Value = serde_json::from_str(REFS).unwrap();
    for name in ["paste-six", "sauce-five"] {
        let r = &refs[name];
        let nums = |k: &str| -> Vec<f64> {
            r[k].as_array()
                .unwrap()
                .iter()
                .map(|v| v.as_f64().unwrap())
                .collect()
        };
        let (t, tau, params) = (nums("t"), nums("tau"), nums("params"));
        let rows: Vec<GelReading> = t
            .iter()
            .zip(&tau)
            .map(|(&rest_s, &stress_pa)| GelReading { rest_s, stress_pa })
            .collect();
        let fit = fit_gel(&rows, &GelFitOptions::default()).unwrap();
        let got = [
            fit.curve.initial_pa,
            fit.curve.long_rest_pa,
            fit.curve.time_constant_s,
        ];
        let ci = fit.ci95().unwrap();
        for i in 0..3 {
            assert!(
                rel(got[i], params[i]) < 1e-5,
                "{name} param {i}: {} vs {}",
                got[i],
                params[i]
            );
            let want = &r["ci95"][i];
            let (lo, hi) = (want[0].as_f64().unwrap(), want[1].as_f64().unwrap());
            assert!(
                rel(ci[i].0, lo) < 1e-4 && rel(ci[i].1, hi) < 1e-4,
                "{name} CI {i}"
            );
        }
    }
}

// Derived: with tr fixed, τ = τi·e + τ∞·(1 − e), e = e^(−t/tr), is linear in (τi, τ∞); two
// readings solve it. Readings from τi = 100, τ∞ = 300, tr = 1800 s at 10 s and 1800 s.
#[test]
fn two_readings_say_what_is_assumed() {
    let truth = GelCurve::new(100.0, 300.0, 1800.0).unwrap();
    let two = readings(&truth, &[10.0, 1800.0]);
    let given = GelFitOptions {
        time_constant_s: Some(1800.0),
        ..GelFitOptions::default()
    };
    let fit = fit_gel(&two, &given).unwrap();
    assert_eq!(fit.kind, GelFitKind::TwoReadingsTimeConstantGiven);
    assert!(rel(fit.curve.initial_pa, 100.0) < 1e-9 && rel(fit.curve.long_rest_pa, 300.0) < 1e-9);
    let assumed = fit_gel(&two, &GelFitOptions::default()).unwrap();
    assert_eq!(assumed.kind, GelFitKind::TwoReadingsTimeConstantAssumed);
    // Assumed equal to the longer rest time, 1800 s: here that is also the truth.
    assert_eq!(assumed.curve.time_constant_s, 1800.0);
    assert!(assumed.ci95().is_none());
}

#[test]
fn bad_gel_input_is_refused_with_the_reason() {
    let neg = [
        GelReading {
            rest_s: -5.0,
            stress_pa: 10.0,
        },
        GelReading {
            rest_s: 60.0,
            stress_pa: 12.0,
        },
    ];
    assert!(matches!(
        fit_gel(&neg, &GelFitOptions::default()),
        Err(RestartError::NegativeRestTime { index: 1, .. })
    ));
    let falls = [
        GelReading {
            rest_s: 10.0,
            stress_pa: 20.0,
        },
        GelReading {
            rest_s: 600.0,
            stress_pa: 10.0,
        },
    ];
    assert_eq!(
        fit_gel(&falls, &GelFitOptions::default()),
        Err(RestartError::GelFalls)
    );
    let one = [GelReading {
        rest_s: 10.0,
        stress_pa: 20.0,
    }];
    assert!(matches!(
        fit_gel(&one, &GelFitOptions::default()),
        Err(RestartError::TooFewReadings { .. })
    ));
    assert!(matches!(
        GelCurve::new(20.0, 10.0, 60.0),
        Err(RestartError::FinalBelowInitial { .. })
    ));
    let line = PlugLine::new(0.05, 100.0, 0.0, 0.0).unwrap();
    assert_eq!(
        check_restart(&line, 10.0, 0.0, None),
        Err(RestartError::NoLimit)
    );
    assert!(PlugLine::new(-0.05, 100.0, 0.0, 0.0).is_err());
}

// Derived: the restart pressure reaches P_allow = P·(1 − m) when the gel reaches
// τ_allow = (P_allow − static − back)·D/(4L); τ(t) = τ_allow solves to
// t = −tr·ln[(τ∞ − τ_allow)/(τ∞ − τi)]. Line D = 0.0627 m, L = 38 m, static 29 028 Pa,
// back 20 000 Pa, pump 12 bar, margin 10 %: τ_allow = (1.08e6 − 49 028)·0.0627/152
// = 425.28 Pa; with τi = 120, τ∞ = 520, tr = 7200 s, t = 7200·ln(400/94.72) = 10 372 s.
#[test]
fn safe_stop_matches_the_closed_form() {
    let line = PlugLine::new(0.0627, 38.0, 29_028.0, 20_000.0).unwrap();
    let allowed = allowed_gel_stress(&line, 12e5, 0.10).unwrap();
    let by_hand = (12e5 * 0.9 - 29_028.0 - 20_000.0) * 0.0627 / (4.0 * 38.0);
    assert!(rel(allowed, by_hand) < 1e-12 && rel(allowed, 425.28) < 1e-4);
    let gel = GelCurve::new(120.0, 520.0, 7200.0).unwrap();
    let closed = -7200.0 * ((520.0 - by_hand) / (520.0 - 120.0)).ln();
    let MaxStop::After(t) = longest_safe_stop(&gel, allowed) else {
        panic!("a finite stop")
    };
    assert!(rel(t, closed) < 1e-12 && rel(t, 10_372.0) < 1e-3, "{t}");
    // Never: τ∞ below the allowed stress. Already too late: τi at or above it.
    let weak_gel = GelCurve::new(100.0, 400.0, 7200.0).unwrap();
    assert_eq!(longest_safe_stop(&weak_gel, allowed), MaxStop::Never);
    assert_eq!(MaxStop::Never.seconds(), None);
    let strong_gel = GelCurve::new(430.0, 900.0, 7200.0).unwrap();
    assert_eq!(
        longest_safe_stop(&strong_gel, allowed),
        MaxStop::AlreadyTooLate
    );
    assert_eq!(MaxStop::AlreadyTooLate.seconds(), Some(0.0));
}

// Derived: with a covariance C, var τ(t) = gᵀCg; the band's upper edge crosses τ_allow
// before the centre does, the lower edge after; a diagonal C with only σ(τ∞) gives
// half-width 1.96·σ·(1 − e^(−t/tr)), checked here by hand.
#[test]
fn band_brackets_the_safe_stop() {
    let curve = GelCurve::new(120.0, 520.0, 7200.0).unwrap();
    let mut fit = GelFit::given(curve);
    fit.covariance = Some([[0.0; 3], [0.0, 20.0 * 20.0, 0.0], [0.0; 3]]);
    fit.coverage = 1.96;
    let (lo, hi) = gel_band(&fit, 7200.0).unwrap();
    let half = 1.96 * 20.0 * (1.0 - (-1.0f64).exp());
    assert!(rel(hi - lo, 2.0 * half) < 1e-12);
    let band = longest_safe_stop_band(&fit, 425.28).unwrap();
    let MaxStop::After(mid) = longest_safe_stop(&curve, 425.28) else {
        panic!()
    };
    let (MaxStop::After(a), MaxStop::After(b)) = (band.low, band.high) else {
        panic!("{band:?}")
    };
    assert!(a < mid && mid < b, "{a} {mid} {b}");
    // At the short end, the upper edge equals τ_allow.
    assert!(rel(gel_band(&fit, a).unwrap().1, 425.28) < 1e-6);
}

proptest! {
    // Derived: τ(t) rises with t when τ∞ > τi (its derivative (τ∞ − τi)e^(−t/tr)/tr > 0), and
    // the restart pressure is increasing in τ.
    #[test]
    fn restart_pressure_rises_with_rest(ti in 1.0..200.0f64, extra in 1.0..500.0f64,
                                        tr in 60.0..1e5f64, t1 in 0.0..1e5f64, dt in 1.0..1e4f64) {
        let gel = GelCurve::new(ti, ti + extra, tr).unwrap();
        let line = PlugLine::new(0.08, 50.0, 1e4, 0.0).unwrap();
        let p = |t: f64| check_restart(&line, gel.stress_at(t), 1e7, None).unwrap().pressure.total_pa;
        prop_assert!(p(t1 + dt) >= p(t1));
    }

    // Derived: τ_allow falls with the pump's limit and t_max = τ⁻¹(τ_allow) rises with
    // τ_allow, so the safe stop shrinks (or stays "never"/"too late") as the limit falls.
    #[test]
    fn safe_stop_shrinks_as_the_limit_falls(limit in 2e5..3e6f64, cut in 0.01..0.5f64) {
        let gel = GelCurve::new(120.0, 520.0, 7200.0).unwrap();
        let line = PlugLine::new(0.0627, 38.0, 29_028.0, 20_000.0).unwrap();
        let stop = |p: f64| {
            let a = allowed_gel_stress(&line, p, 0.1).unwrap();
            match longest_safe_stop(&gel, a) {
                MaxStop::Never => f64::INFINITY,
                MaxStop::AlreadyTooLate => 0.0,
                MaxStop::After(s) => s,
            }
        };
        prop_assert!(stop(limit * (1.0 - cut)) <= stop(limit));
    }
}

// Derived: the chart's limit line is the gel stress at the usable pressure, (P − static −
// back)·D/(4L); for the demo's paste line (12 bar, 49 028 Pa fixed, 62.7 mm, 38 m) that is
// (12e5 − 49 028)·0.0627/152 = 474.77 Pa, and the allowed line (10 % margin) 425.28 Pa.
#[test]
fn chart_data_for_a_restart_view() {
    use rheoside::session::restart::{self, GelSource};
    let site = rheoside::site::demo().unwrap();
    let input = restart::from_site(
        &site,
        ("L-2", "P-2", "filler-paste"),
        GelSource::Product,
        None,
    )
    .unwrap();
    let answer = restart::analyse(input).unwrap();
    let chart = rheoside::session::restart_chart::chart(&answer, false, 0.0, 50).unwrap();
    assert_eq!(chart.points.len(), 50);
    let static_pa = 1480.0 * 9.80665 * 2.0;
    let limit = (12e5 - static_pa - 20_000.0) * 0.0627 / (4.0 * 38.0);
    assert!(rel(chart.limit_gel_pa, limit) < 1e-9 && rel(limit, 474.77) < 1e-4);
    assert!(rel(chart.allowed_gel_pa, 425.28) < 1e-4);
    assert!(
        chart
            .points
            .windows(2)
            .all(|w| w[1].stress_pa >= w[0].stress_pa)
    );
    let cold = rheoside::session::restart_chart::chart(&answer, true, 0.0, 10).unwrap();
    // The demo's cold factor 1.3 scales the gel: at rest 0 it is 1.3 × 120 Pa.
    assert!(rel(cold.points[0].stress_pa, 156.0) < 1e-12);
}
