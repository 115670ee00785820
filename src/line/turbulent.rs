//! Dodge–Metzner for a product with a yield stress: the flow index n′ and K′ taken where the
//! turbulent flow actually runs, at its own wall stress, not at the (lower) laminar one.
//!
//! Metzner & Reed (1955) and Dodge & Metzner (1959) treat the product at each wall stress as
//! a power law with the local n′ and K′ of its laminar pipe flow curve τw against 8V/D. For a
//! power law n′ is the same everywhere; for Herschel–Bulkley and Casson products n′ falls
//! towards zero near the yield stress, so taking it at the laminar wall stress of the same
//! flow would put Dodge–Metzner far outside its data. Here the wall stress, n′ and Re_MR are
//! solved together by a damped fixed-point iteration (our method; the papers give none).

use super::friction::dodge_metzner;
use super::laminar::flow_at_wall_stress;
use super::pipe::{Fluid, Pipe};
use std::f64::consts::PI;

/// Below this n′ the Dodge–Metzner formula itself breaks down (its log term changes sign);
/// the friction factor is evaluated at this floor (our guard, noted as outside the data).
pub(crate) const DM_N_FLOOR: f64 = 0.1;

/// Friction factor, and the n′ and Re_MR it was evaluated at.
#[derive(Debug, Clone, Copy)]
pub(crate) struct AtWall {
    pub f: f64,
    pub n_prime: f64,
    pub reynolds: f64,
}

/// n′ and Re_MR at wall stress `tau_w` for mean velocity `v`, from the laminar pipe flow
/// curve: 8V/D at τw is Γ = 4Q(τw)/(πR³), n′ = Γ/(4γ̇w − 3Γ) (Rabinowitsch–Mooney solved for
/// n′), K′ = τw/Γ^n′, Re_MR = ρV^(2−n′)D^n′/(K′·8^(n′−1)).
fn local(pipe: &Pipe, fluid: &Fluid, v: f64, tau_w: f64) -> (f64, f64) {
    let r = pipe.radius_m();
    let d = pipe.inner_diameter_m;
    let gamma = 4.0 * flow_at_wall_stress(&fluid.model, r, tau_w) / (PI * r.powi(3));
    let wall_rate = fluid.model.rate_at_stress(tau_w);
    let n = (gamma / (4.0 * wall_rate - 3.0 * gamma)).clamp(1e-6, 2.0);
    let k = tau_w / gamma.powf(n);
    let re = fluid.density_kg_m3 * v.powf(2.0 - n) * d.powf(n) / (k * 8f64.powf(n - 1.0));
    (n, re)
}

/// Dodge–Metzner at the turbulent wall stress, starting from the laminar one.
pub(crate) fn dodge_metzner_at_wall(pipe: &Pipe, fluid: &Fluid, v: f64, tau_lam: f64) -> AtWall {
    let dyn_p = 0.5 * fluid.density_kg_m3 * v * v;
    let floor = fluid.model.yield_stress() * (1.0 + 1e-9);
    let mut tau = (2.0 * tau_lam).max(floor);
    let mut last = AtWall {
        f: tau / dyn_p,
        n_prime: 1.0,
        reynolds: 0.0,
    };
    for _ in 0..200 {
        let (n, re) = local(pipe, fluid, v, tau);
        let f = dodge_metzner(re, n.max(DM_N_FLOOR));
        last = AtWall {
            f,
            n_prime: n,
            reynolds: re,
        };
        let next = (tau * f * dyn_p).sqrt().max(floor);
        if (next - tau).abs() <= 1e-12 * tau {
            break;
        }
        tau = next;
    }
    last
}
