//! Laminar flow in a round pipe: the exact relation between flow and wall stress for each
//! flow model, and its inverse (the wall stress that carries a flow) by a bracketed
//! root-find on the monotone Q(τw).

use super::integral::general_flow;
use super::solve::{bisect, grow};
use crate::rheology::Model;
use std::f64::consts::PI;

/// Volumetric flow, m³/s, in laminar flow at wall stress `tau_w` (Pa) in a pipe of radius
/// `radius` (m). Zero at or below the yield stress (the product stands as a plug).
pub fn flow_at_wall_stress(model: &Model, radius: f64, tau_w: f64) -> f64 {
    if tau_w.is_nan() || tau_w <= model.yield_stress() {
        return 0.0;
    }
    let r3 = radius.powi(3);
    match *model {
        Model::Newtonian { mu } => hagen_poiseuille(r3, tau_w, mu),
        Model::PowerLaw { k, n } => power_law(r3, tau_w, k, n),
        Model::Bingham { tau0, mu_p } => buckingham_reiner(r3, tau_w, tau0, mu_p),
        Model::HerschelBulkley { tau0, k, n } => herschel_bulkley(r3, tau_w, tau0, k, n),
        Model::Casson { .. } => general_flow(model, radius, tau_w),
    }
}

/// Q = πR³τw/(4μ), the Hagen–Poiseuille law (Hagen 1839, Poiseuille 1840) written with the
/// wall stress τw = RΔp/(2L); equals πR⁴Δp/(8μL).
fn hagen_poiseuille(r3: f64, tau_w: f64, mu: f64) -> f64 {
    PI * r3 * tau_w / (4.0 * mu)
}

/// Q = πnR³/(3n+1)·(τw/K)^(1/n): the power-law (Ostwald–de Waele) pipe flow, from the
/// velocity profile u(r) = V(3n+1)/(n+1)·[1 − (r/R)^((n+1)/n)] (e.g. Chhabra & Richardson
/// 2008, *Non-Newtonian Flow and Applied Rheology*, eq 3.7). At n = 1 it is Hagen–Poiseuille.
fn power_law(r3: f64, tau_w: f64, k: f64, n: f64) -> f64 {
    PI * n * r3 / (3.0 * n + 1.0) * (tau_w / k).powf(1.0 / n)
}

/// Buckingham–Reiner: Q = πR³τw/(4μp)·[1 − 4φ/3 + φ⁴/3], φ = τ0/τw (Buckingham 1921, Proc.
/// ASTM 21:1154; Reiner 1926). Valid for τw > τ0; the plug has radius φR.
fn buckingham_reiner(r3: f64, tau_w: f64, tau0: f64, mu_p: f64) -> f64 {
    let phi = tau0 / tau_w;
    PI * r3 * tau_w / (4.0 * mu_p) * (1.0 - 4.0 * phi / 3.0 + phi.powi(4) / 3.0)
}

/// Herschel–Bulkley pipe flow in closed form, φ = τ0/τw:
/// Q = πR³(τw/K)^(1/n)(1−φ)^((n+1)/n)·[(1−φ)²/(3+1/n) + 2φ(1−φ)/(2+1/n) + φ²/(1+1/n)]
/// (Skelland 1967, *Non-Newtonian Flow and Heat Transfer*; Chhabra & Richardson 2008 eq 3.13).
/// It is the integral Q = (πR³/τw³)∫τ0..τw τ²γ̇(τ)dτ (Rabinowitsch 1929) done by hand.
fn herschel_bulkley(r3: f64, tau_w: f64, tau0: f64, k: f64, n: f64) -> f64 {
    let phi = tau0 / tau_w;
    let a = 1.0 - phi;
    let m = 1.0 / n;
    let bracket = a * a / (3.0 + m) + 2.0 * phi * a / (2.0 + m) + phi * phi / (1.0 + m);
    PI * r3 * (tau_w / k).powf(m) * a.powf(1.0 + m) * bracket
}

/// Wall stress, Pa, that carries a laminar flow `flow` (m³/s, above zero) in a pipe of radius
/// `radius`: closed-form inverses for the Newtonian and power-law models, a bracketed
/// bisection on the monotone Q(τw) for the others.
pub fn wall_stress_at_flow(model: &Model, radius: f64, flow: f64) -> f64 {
    let r3 = radius.powi(3);
    match *model {
        Model::Newtonian { mu } => 4.0 * mu * flow / (PI * r3),
        Model::PowerLaw { k, n } => k * ((3.0 * n + 1.0) * flow / (PI * n * r3)).powf(n),
        _ => by_bisection(model, radius, flow),
    }
}

fn by_bisection(model: &Model, radius: f64, flow: f64) -> f64 {
    let tau0 = model.yield_stress();
    let g = |tau_w: f64| flow_at_wall_stress(model, radius, tau_w) - flow;
    // Start above the yield stress by the stress the model carries at the nominal rate 8V/D.
    let nominal = 4.0 * flow / (PI * radius.powi(3));
    let start = tau0 + model.stress(nominal).max(f64::MIN_POSITIVE);
    match grow(start, g) {
        Some(hi) => bisect(tau0, hi, g),
        None => f64::INFINITY,
    }
}
