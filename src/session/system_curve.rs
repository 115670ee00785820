//! A line's system curve for the pump answers, until the line module's pressure-drop code is
//! merged: laminar flow only, for any flow model, from the general tube-flow integral
//! Q = (πR³/τw³)·∫ from τ0 to τw of τ²·γ̇(τ) dτ (Rabinowitsch–Mooney; Steffe 1996,
//! *Rheological Methods in Food Process Engineering*, eq 2.110 form), solved for the wall
//! stress τw by bisection; ΔP = 4·τw·L/D plus static head and back-pressure. The regime is
//! judged by the Metzner–Reed Reynolds number in laminar flow, Re = 8ρV²/τw, against 2100
//! (the simple rule): above it the laminar answer understates the loss and says so.
//!
//! One function, [`line_pressure_pa`], is the seam the line module replaces.

use crate::pump::G;
use crate::rheology::Model;
use crate::site::Line;

/// Reynolds number above which this laminar-only estimate is not trusted (simple rule).
pub const LAMINAR_LIMIT: f64 = 2100.0;
/// Simpson intervals across the sheared annulus.
const INTERVALS: usize = 200;

/// The flow regime at a duty, as far as this estimate can tell.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Regime {
    Laminar,
    /// Re above the laminar limit: transitional or turbulent; the laminar loss understates.
    NotLaminar,
}

impl Regime {
    pub fn name(self) -> &'static str {
        match self {
            Regime::Laminar => "laminar",
            Regime::NotLaminar => "transitional",
        }
    }
}

/// Pressure the pump must give at flow Q (gauge, Pa): friction + static head + back-pressure.
pub fn line_pressure_pa(line: &Line, model: &Model, density: f64, flow_m3_s: f64) -> f64 {
    let tau_w = wall_stress(line.inner_diameter_m, model, flow_m3_s);
    let friction = 4.0 * tau_w * line.total_length_m() / line.inner_diameter_m;
    friction + density * G * line.elevation_change_m + line.back_pressure_pa
}

/// Regime at flow Q by Re = 8ρV²/τw.
pub fn regime(line: &Line, model: &Model, density: f64, flow_m3_s: f64) -> Regime {
    let d = line.inner_diameter_m;
    let v = flow_m3_s / (std::f64::consts::PI * d * d / 4.0);
    let tau_w = wall_stress(d, model, flow_m3_s);
    let re = if tau_w > 0.0 {
        8.0 * density * v * v / tau_w
    } else {
        0.0
    };
    if re > LAMINAR_LIMIT {
        Regime::NotLaminar
    } else {
        Regime::Laminar
    }
}

/// Laminar flow for a wall stress: the general integral by Simpson's rule.
pub fn laminar_flow(diameter_m: f64, model: &Model, tau_w: f64) -> f64 {
    let tau0 = model.yield_stress();
    if tau_w <= tau0 {
        return 0.0;
    }
    let r = diameter_m / 2.0;
    let h = (tau_w - tau0) / INTERVALS as f64;
    let f = |tau: f64| tau * tau * model.rate_at_stress(tau);
    let sum: f64 = (0..=INTERVALS)
        .map(|i| {
            let w = if i == 0 || i == INTERVALS {
                1.0
            } else if i % 2 == 1 {
                4.0
            } else {
                2.0
            };
            w * f(tau0 + h * i as f64)
        })
        .sum();
    std::f64::consts::PI * r.powi(3) / tau_w.powi(3) * sum * h / 3.0
}

/// Wall stress carrying flow Q in laminar flow (bisection; Q rises with τw).
pub fn wall_stress(diameter_m: f64, model: &Model, flow_m3_s: f64) -> f64 {
    let tau0 = model.yield_stress();
    if flow_m3_s <= 0.0 {
        return tau0;
    }
    let mut hi = tau0.max(1.0) * 2.0;
    while laminar_flow(diameter_m, model, hi) < flow_m3_s && hi < 1e12 {
        hi *= 2.0;
    }
    let mut lo = tau0;
    for _ in 0..100 {
        let mid = 0.5 * (lo + hi);
        if laminar_flow(diameter_m, model, mid) < flow_m3_s {
            lo = mid
        } else {
            hi = mid
        }
        if hi - lo <= 1e-10 * hi {
            break;
        }
    }
    0.5 * (lo + hi)
}
