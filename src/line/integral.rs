//! The general laminar pipe-flow integral for any flow model:
//! Q = (πR³/τw³)·∫ from τ0 to τw of τ²·γ̇(τ) dτ (Rabinowitsch 1929, Z. Phys. Chem. A145:1;
//! Mooney 1931, J. Rheol. 2:210), used where no closed form is coded (Casson).

use crate::rheology::Model;
use std::f64::consts::PI;

/// Gauss–Legendre nodes and weights on [−1, 1], 8 points (Abramowitz & Stegun 1964, table 25.4).
const NODES: [(f64, f64); 4] = [
    (0.183_434_642_495_65, 0.362_683_783_378_362),
    (0.525_532_409_916_329, 0.313_706_645_877_887),
    (0.796_666_477_413_627, 0.222_381_034_453_374),
    (0.960_289_856_497_536, 0.101_228_536_290_376),
];

/// Panels the √τ range is cut into; with 8 points each, a Casson integrand (a polynomial of
/// degree 7 in √τ) is exact, and a Herschel–Bulkley one agrees with its closed form to ~1e-9.
const PANELS: usize = 16;

/// Q (m³/s) at wall stress `tau_w` by quadrature in s = √τ (so τ = s², dτ = 2s ds), which
/// makes the Casson integrand a polynomial. Zero at or below the yield stress.
pub fn general_flow(model: &Model, radius: f64, tau_w: f64) -> f64 {
    let tau0 = model.yield_stress();
    if tau_w.is_nan() || tau_w <= tau0 {
        return 0.0;
    }
    let (s0, s1) = (tau0.sqrt(), tau_w.sqrt());
    let h = (s1 - s0) / PANELS as f64;
    let integrand = |s: f64| {
        let tau = s * s;
        tau * tau * model.rate_at_stress(tau) * 2.0 * s
    };
    let mut sum = 0.0;
    for p in 0..PANELS {
        let mid = s0 + (p as f64 + 0.5) * h;
        for (x, w) in NODES {
            let dx = 0.5 * h * x;
            sum += w * (integrand(mid - dx) + integrand(mid + dx));
        }
    }
    PI * radius.powi(3) / tau_w.powi(3) * sum * 0.5 * h
}
