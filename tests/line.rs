//! The pipe-flow engine checked against outside sources: the laminar relations against a
//! numerical integration of the velocity profile written here, the friction laws against the
//! `fluids` package (values made by tests/reference/make_line_refs.py, committed in
//! tests/reference/line_refs.json), Darby–Mun–Boger by a hand derivation, and the
//! Rabinowitsch–Mooney back-calculation by recovering known products.

use rheoside::line::{
    self, Fluid, Pipe, PlantPair, Regime, Uncertainty, colebrook_fanning, darby_mun_boger_blend,
    darby_mun_boger_turbulent, dodge_metzner, flow_at_wall_stress, ryan_johnson,
};
use rheoside::rheology::{self, FitOptions, Model, ModelKind, ParamName, Point};
use serde_json::Value;
use std::f64::consts::PI;

const REFS: &str = include_str!("reference/line_refs.json");

fn refs() -> Value {
    serde_json::from_str(REFS).expect("line_refs.json parses")
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

/// Q by integrating the velocity profile, written out here and independent of the engine:
/// τ(r) = τw·r/R (force balance on a cylinder of radius r), du/dr = −γ̇(τ(r)), u(R) = 0
/// (no slip), so u(r) = ∫ from r to R of γ̇ ds, and Q = ∫ from 0 to R of 2πr·u(r) dr.
/// Both integrals by the trapezoidal rule on 40 000 intervals.
fn profile_flow(model: &Model, radius: f64, tau_w: f64) -> f64 {
    let n = 40_000;
    let h = radius / n as f64;
    let rate = |r: f64| model.rate_at_stress(tau_w * r / radius);
    let mut u = vec![0.0; n + 1];
    for i in (0..n).rev() {
        let (r0, r1) = (i as f64 * h, (i + 1) as f64 * h);
        u[i] = u[i + 1] + 0.5 * h * (rate(r0) + rate(r1));
    }
    let mut q = 0.0;
    for i in 0..n {
        let (r0, r1) = (i as f64 * h, (i + 1) as f64 * h);
        q += 0.5 * h * (2.0 * PI * r0 * u[i] + 2.0 * PI * r1 * u[i + 1]);
    }
    q
}

#[test]
fn hagen_poiseuille_at_n_equal_one() {
    // Hagen–Poiseuille (Hagen 1839; Poiseuille 1840): Q = πR⁴Δp/(8μL), f = 16/Re.
    // Glycerol-like oil, μ = 1.2 Pa·s, ρ = 1260 kg/m³, 50 mm bore, 20 m, 2 L/s.
    let (mu, rho, d, l, q) = (1.2, 1260.0, 0.05, 20.0, 0.002);
    let expect_dp = 8.0 * mu * l * q / (PI * (d / 2.0_f64).powi(4));
    for model in [Model::Newtonian { mu }, Model::PowerLaw { k: mu, n: 1.0 }] {
        let fluid = Fluid {
            model,
            density_kg_m3: rho,
        };
        let a = line::pressure_drop(&Pipe::straight(d, l), &fluid, q).unwrap();
        assert_eq!(a.regime, Regime::Laminar);
        assert!(rel(a.friction_pressure_drop_pa, expect_dp) < 1e-12, "{a:?}");
        // Re = ρVD/μ and f = 16/Re for a Newtonian product.
        let v = q / (PI * d * d / 4.0);
        assert!(rel(a.reynolds, rho * v * d / mu) < 1e-12);
        assert!(rel(a.fanning_friction, 16.0 / a.reynolds) < 1e-12);
    }
}

#[test]
fn power_law_against_the_integrated_profile() {
    // Numerical integration of the velocity profile (above) against the closed form.
    for n in [0.2, 0.4, 0.7, 1.3] {
        let m = Model::PowerLaw { k: 8.0, n };
        for tau_w in [5.0, 40.0, 300.0] {
            let want = profile_flow(&m, 0.04, tau_w);
            let got = flow_at_wall_stress(&m, 0.04, tau_w);
            assert!(rel(got, want) < 1e-6, "n {n} τw {tau_w}: {got} vs {want}");
        }
    }
}

#[test]
fn power_law_wall_rate_is_rabinowitsch_mooney() {
    // Steffe 1996 eq 2.121: for a power law, γ̇w = (8V/D)(3n+1)/(4n) and Re_MR =
    // ρV^(2−n)Dⁿ/(K·8^(n−1)·[(3n+1)/(4n)]ⁿ) (Metzner & Reed 1955).
    let (k, n, rho, d) = (12.0, 0.35, 1120.0, 0.0729);
    let fluid = Fluid {
        model: Model::PowerLaw { k, n },
        density_kg_m3: rho,
    };
    let a = line::pressure_drop(&Pipe::straight(d, 50.0), &fluid, 0.004).unwrap();
    let v = a.velocity_m_s;
    let corr = (3.0 * n + 1.0) / (4.0 * n);
    assert!(rel(a.wall_shear_rate_per_s, 8.0 * v / d * corr) < 1e-9);
    let re = rho * v.powf(2.0 - n) * d.powf(n) / (k * 8f64.powf(n - 1.0) * corr.powf(n));
    assert!(rel(a.reynolds, re) < 1e-9, "{} vs {re}", a.reynolds);
    assert!(rel(a.n_prime, n) < 1e-12);
}

#[test]
fn buckingham_reiner_against_the_bingham_flow_formula() {
    // The Bingham flow-rate formula in friction-factor form (Buckingham 1921, as in Chhabra &
    // Richardson 2008 eq 3.19 with the He/6 coefficient derived from Q = πR³τw/(4μp)·[1 − 4φ/3
    // + φ⁴/3]): f = (16/Re_B)[1 + He/(6Re_B) − He⁴/(3f³Re_B⁷)], Re_B = ρVD/μp, He = ρD²τ0/μp².
    let (tau0, mu_p, rho, d) = (25.0, 0.08, 1550.0, 0.1);
    let fluid = Fluid {
        model: Model::Bingham { tau0, mu_p },
        density_kg_m3: rho,
    };
    for q in [0.001, 0.004, 0.01] {
        let a = line::pressure_drop(&Pipe::straight(d, 100.0), &fluid, q).unwrap();
        assert_eq!(a.regime, Regime::Laminar, "{a:?}");
        let re_b = rho * a.velocity_m_s * d / mu_p;
        let he = rho * d * d * tau0 / (mu_p * mu_p);
        let f = a.fanning_friction;
        let rhs =
            16.0 / re_b * (1.0 + he / (6.0 * re_b) - he.powi(4) / (3.0 * f.powi(3) * re_b.powi(7)));
        assert!(rel(f, rhs) < 1e-9, "q {q}: f {f} vs {rhs}");
        // And against the integrated profile.
        let want = profile_flow(&fluid.model, d / 2.0, a.wall_shear_stress_pa);
        assert!(rel(q, want) < 1e-5, "{q} vs {want}");
    }
}

#[test]
fn herschel_bulkley_closed_form_against_the_integrated_profile() {
    for (tau0, k, n) in [(20.0, 12.0, 0.3), (150.0, 40.0, 0.35), (5.0, 0.5, 1.2)] {
        let m = Model::HerschelBulkley { tau0, k, n };
        for ratio in [1.05, 1.5, 4.0, 20.0] {
            let tau_w = tau0 * ratio;
            let want = profile_flow(&m, 0.03, tau_w);
            let got = flow_at_wall_stress(&m, 0.03, tau_w);
            assert!(rel(got, want) < 1e-5, "{m:?} τw {tau_w}: {got} vs {want}");
        }
    }
}

#[test]
fn casson_general_integral_against_the_integrated_profile() {
    let m = Model::Casson {
        tau0: 12.0,
        mu_c: 0.05,
    };
    for tau_w in [12.5, 20.0, 80.0, 400.0] {
        let want = profile_flow(&m, 0.025, tau_w);
        let got = flow_at_wall_stress(&m, 0.025, tau_w);
        assert!(rel(got, want) < 1e-5, "τw {tau_w}: {got} vs {want}");
    }
}

#[test]
fn dodge_metzner_at_n_one_is_the_smooth_pipe_law() {
    // fluids.friction.Prandtl_von_Karman_Nikuradse (Darcy; Fanning = Darcy/4). Dodge–Metzner
    // writes −0.4 where the smooth-pipe law has −0.396 (4·log10 2 − 1.6 in Fanning form), so
    // they differ by about 0.1 %: allow 0.5 %.
    for case in refs()["smooth_darcy"].as_array().unwrap() {
        let re = case["re"].as_f64().unwrap();
        let want = case["darcy"].as_f64().unwrap() / 4.0;
        let got = dodge_metzner(re, 1.0);
        assert!(rel(got, want) < 5e-3, "Re {re}: {got} vs {want}");
    }
}

#[test]
fn colebrook_against_fluids() {
    // fluids.friction.Colebrook (Darcy, solved exactly by fluids); Fanning = Darcy/4.
    for case in refs()["colebrook_darcy"].as_array().unwrap() {
        let re = case["re"].as_f64().unwrap();
        let ed = case["ed"].as_f64().unwrap();
        let want = case["darcy"].as_f64().unwrap() / 4.0;
        let got = colebrook_fanning(re, ed);
        assert!(rel(got, want) < 1e-9, "Re {re} ε/D {ed}: {got} vs {want}");
    }
}

#[test]
fn newtonian_turbulent_uses_colebrook_with_the_roughness() {
    // Water-like product, 50 mm commercial steel (ε = 0.045 mm), 3 m/s: Re ≈ 1.5×10⁵.
    let d = 0.05;
    let pipe = Pipe {
        roughness_m: 4.5e-5,
        ..Pipe::straight(d, 100.0)
    };
    let fluid = Fluid {
        model: Model::Newtonian { mu: 0.001 },
        density_kg_m3: 1000.0,
    };
    let q = 3.0 * PI * d * d / 4.0;
    let a = line::pressure_drop(&pipe, &fluid, q).unwrap();
    assert_eq!(a.regime, Regime::Turbulent);
    assert!(rel(a.reynolds, 1.5e5) < 1e-9);
    // Δp = 2fρV²L/D (Fanning; Darcy–Weisbach with f_D = 4f).
    let f = colebrook_fanning(1.5e5, 4.5e-5 / d);
    assert!(
        rel(
            a.friction_pressure_drop_pa,
            2.0 * f * 1000.0 * 9.0 * 100.0 / d
        ) < 1e-9
    );
}

#[test]
fn darby_mun_boger_by_hand() {
    // Derived by hand in this test (no published worked value at hand) from Darby, Mun & Boger
    // (1992) as given in Darby 2001, ch. 6, at He = 1×10⁵, Re_B = 2×10⁴:
    //   exp(−2.9×10⁻⁵·10⁵) = exp(−2.9) = 0.055 023 22
    //   a = −1.47·(1 + 0.146·0.055 023 22) = −1.47·1.008 033 39 = −1.481 809 08
    //   10^a = 0.032 975 46
    //   Re_B^−0.193 = exp(−0.193·ln 20 000) = exp(−0.193·9.903 487 55) = exp(−1.911 373 10)
    //               = 0.147 877 20
    //   f_T = 0.032 975 46·0.147 877 20 = 0.004 876 32
    let f_t = darby_mun_boger_turbulent(2e4, 1e5);
    assert!(rel(f_t, 0.004_876_32) < 1e-5, "{f_t}");
    // Blend with f_L = 0.0016: m = 1.7 + 40 000/20 000 = 3.7;
    //   (0.0016^3.7 + 0.004 876 32^3.7)^(1/3.7) = 0.004 897 53.
    let f = darby_mun_boger_blend(0.0016, f_t, 2e4);
    assert!(rel(f, 0.004_897_53) < 1e-5, "{f}");
    // The engine uses the blend in turbulent Bingham flow: D = 0.1 m, ρ = 1000 kg/m³,
    // μp = 0.01 Pa·s, τ0 = 1 Pa gives He = 1000·0.01·1/10⁻⁴ = 10⁵; V = 2 m/s gives Re_B = 2×10⁴.
    let d = 0.1;
    let fluid = Fluid {
        model: Model::Bingham {
            tau0: 1.0,
            mu_p: 0.01,
        },
        density_kg_m3: 1000.0,
    };
    let a = line::pressure_drop(&Pipe::straight(d, 10.0), &fluid, 2.0 * PI * d * d / 4.0).unwrap();
    assert_eq!(a.regime, Regime::Turbulent);
    let want = darby_mun_boger_blend(a.laminar_friction, 0.004_876_32, 2e4);
    assert!(rel(a.fanning_friction, want) < 1e-5, "{a:?}");
}

#[test]
fn ryan_johnson_and_hanks_limits() {
    // Ryan & Johnson 1959: 2099 at n = 1 (6464·3^1.5/16 = 2099.3), about 2400 near n = 0.4.
    assert!((ryan_johnson(1.0) - 2099.3).abs() < 0.1);
    assert!(
        (ryan_johnson(0.4) - 2400.0).abs() < 15.0,
        "{}",
        ryan_johnson(0.4)
    );
    // Hanks 1963: tends to 2100 as He → 0 (derived: φc ≈ He/16800, Re_Bc ≈ He/(8φc)).
    let (re, _) = line::hanks_critical(1e-3);
    assert!((re - 2100.0).abs() < 0.5, "{re}");
    // The critical Re_B rises with He (Hanks 1963); at He = 10⁶ the plug fraction solves
    // φ/(1−φ)³ = 10⁶/16800 = 59.52 (checked here by substitution).
    let (re_mid, _) = line::hanks_critical(1e4);
    let (re_big, phi) = line::hanks_critical(1e6);
    assert!(re_big > re_mid && re_mid > 2100.0, "{re_mid} {re_big}");
    assert!(
        rel(phi / (1.0 - phi).powi(3), 1e6 / 16800.0) < 1e-9,
        "{phi}"
    );
}

fn hb_pipe() -> Pipe {
    Pipe::straight(0.0627, 38.0)
}

/// Plant pairs made by the engine's laminar relation from a known product.
fn pairs_for(model: Model, flows: &[f64]) -> Vec<PlantPair> {
    let fluid = Fluid {
        model,
        density_kg_m3: 1480.0,
    };
    flows
        .iter()
        .map(|&q| {
            let a = line::pressure_drop(&hb_pipe(), &fluid, q).unwrap();
            assert_eq!(a.regime, Regime::Laminar);
            PlantPair {
                pressure_drop_pa: a.pressure_drop_pa,
                flow_m3_s: q,
            }
        })
        .collect()
}

#[test]
fn rabinowitsch_mooney_recovers_a_power_law() {
    // Steffe 1996 eqs 2.119–2.121: for a power law n′ = n and K′ = K[(3n+1)/(4n)]ⁿ.
    let (k, n) = (30.0, 0.32);
    let pairs = pairs_for(
        Model::PowerLaw { k, n },
        &[0.0005, 0.001, 0.002, 0.004, 0.008],
    );
    let b = line::back_calculate(&hb_pipe(), 1480.0, &pairs).unwrap();
    assert!(rel(b.n_prime, n) < 1e-9);
    assert!(rel(b.k_prime_pa_sn, k * ((3.0 * n + 1.0) / (4.0 * n)).powf(n)) < 1e-9);
    let fit = rheology::fit(ModelKind::PowerLaw, &b.fit_points(), &FitOptions::default()).unwrap();
    assert!(
        rel(fit.model.param(ParamName::K).unwrap(), k) < 1e-6,
        "{fit:?}"
    );
    assert!(rel(fit.model.param(ParamName::N).unwrap(), n) < 1e-6);
}

#[test]
fn rabinowitsch_mooney_recovers_a_herschel_bulkley_paste() {
    // The local n′ comes from a quadratic in log–log, so the recovery is close, not exact:
    // within 2 % on each constant over a decade of flow.
    let (tau0, k, n) = (120.0, 35.0, 0.35);
    let flows: Vec<f64> = (0..8).map(|i| 0.0004 * 1.4f64.powi(i)).collect();
    let pairs = pairs_for(Model::HerschelBulkley { tau0, k, n }, &flows);
    let b = line::back_calculate(&hb_pipe(), 1480.0, &pairs).unwrap();
    let fit = rheology::fit(
        ModelKind::HerschelBulkley,
        &b.fit_points(),
        &FitOptions::default(),
    )
    .unwrap();
    let got = |p| fit.model.param(p).unwrap();
    assert!(rel(got(ParamName::Tau0), tau0) < 0.02, "{fit:?}");
    assert!(rel(got(ParamName::K), k) < 0.02, "{fit:?}");
    assert!(rel(got(ParamName::N), n) < 0.02, "{fit:?}");
}

#[test]
fn turbulent_pairs_are_refused_with_the_reason() {
    let water = Fluid {
        model: Model::Newtonian { mu: 0.001 },
        density_kg_m3: 1000.0,
    };
    let pipe = Pipe::straight(0.05, 10.0);
    let pairs: Vec<PlantPair> = [0.002, 0.004]
        .iter()
        .map(|&q| PlantPair {
            pressure_drop_pa: line::pressure_drop(&pipe, &water, q)
                .unwrap()
                .pressure_drop_pa,
            flow_m3_s: q,
        })
        .collect();
    let err = line::back_calculate(&pipe, 1000.0, &pairs)
        .unwrap_err()
        .to_string();
    assert!(err.contains("not laminar"), "{err}");
}

#[test]
fn single_pair_gives_the_wall_viscosity_and_k() {
    // One pair: μw = τw/(8V/D); with n from the viscometer, K = τw/γ̇w^n (Steffe 1996 eq 2.121).
    let (k, n) = (30.0, 0.32);
    let pairs = pairs_for(Model::PowerLaw { k, n }, &[0.002]);
    let s = line::single_pair(&hb_pipe(), 1480.0, pairs[0], Some(n)).unwrap();
    assert!(rel(s.k_pa_sn.unwrap(), k) < 1e-9);
    let p = s.point;
    assert!(
        rel(
            s.apparent_viscosity_pa_s,
            p.wall_shear_stress_pa / p.nominal_shear_rate_per_s
        ) < 1e-12
    );
}

#[test]
fn fit_covariance_matches_scipy() {
    // scipy.optimize.curve_fit pcov (absolute_sigma=False) on the invented PX-2 paste.
    let r = refs();
    let rates = [
        5.0, 9.0, 16.2, 29.2, 52.7, 94.9, 171.0, 308.1, 555.0, 1000.0,
    ];
    let stresses = [
        136.74, 152.54, 164.46, 184.2, 212.87, 244.25, 283.01, 327.46, 393.85, 476.43,
    ];
    let points: Vec<Point> = rates
        .iter()
        .zip(stresses)
        .map(|(&x, y)| Point::new(x, y))
        .collect();
    let fit = rheology::fit(ModelKind::HerschelBulkley, &points, &FitOptions::default()).unwrap();
    let cov = fit.covariance.expect("covariance");
    let want = r["px2_hb"]["covariance"].as_array().unwrap();
    for i in 0..3 {
        for j in 0..3 {
            let w = want[i][j].as_f64().unwrap();
            assert!(rel(cov[i][j], w) < 1e-5, "C[{i}][{j}] {} vs {w}", cov[i][j]);
        }
    }
}

#[test]
fn band_widens_with_the_covariance_and_brackets_the_answer() {
    // Linear propagation (JCGM 100:2008 §5.1.2): for a Newtonian product Δp ∝ μ, so the band is
    // exactly Δp·(1 ± t·σμ/μ) in laminar flow (derived).
    let fluid = Fluid {
        model: Model::Newtonian { mu: 2.0 },
        density_kg_m3: 1000.0,
    };
    let pipe = Pipe::straight(0.05, 20.0);
    let u = Uncertainty {
        covariance: vec![vec![0.04]],
        t: 2.0,
    };
    let p = line::pressure_drop(&pipe, &fluid, 0.001)
        .unwrap()
        .pressure_drop_pa;
    let (lo, hi) = line::pressure_drop_band(&pipe, &fluid, 0.001, &u).unwrap();
    assert!(rel(lo, p * (1.0 - 2.0 * 0.2 / 2.0)) < 1e-6, "{lo} {p}");
    assert!(rel(hi, p * (1.0 + 2.0 * 0.2 / 2.0)) < 1e-6, "{hi} {p}");
}

#[test]
fn bad_input_is_refused() {
    let fluid = Fluid {
        model: Model::PowerLaw { k: 1.0, n: 0.5 },
        density_kg_m3: 1000.0,
    };
    assert!(line::pressure_drop(&Pipe::straight(0.0, 1.0), &fluid, 0.001).is_err());
    assert!(line::pressure_drop(&Pipe::straight(0.05, -1.0), &fluid, 0.001).is_err());
    assert!(line::pressure_drop(&Pipe::straight(0.05, 1.0), &fluid, 0.0).is_err());
    let bad = Fluid {
        model: Model::HerschelBulkley {
            tau0: 5.0,
            k: 0.0,
            n: 0.5,
        },
        ..fluid
    };
    assert!(line::pressure_drop(&Pipe::straight(0.05, 1.0), &bad, 0.001).is_err());
}
