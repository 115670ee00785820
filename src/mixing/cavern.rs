//! Caverns in yield-stress products: the well-mixed region around the impeller by Elson's
//! cylindrical model, the speed at which it reaches the wall, and what is left stagnant.
//!
//! Elson, Cheesman & Nienow (1986), Chem. Eng. Sci. 41:2555 (volume and pages from memory):
//! the cavern is a cylinder of diameter Dc and height Hc = 0.4·Dc centred on the impeller; the
//! impeller's torque is balanced by the yield stress acting on the cavern's side, top and
//! bottom. With Re_y = ρN²D²/τ0 this gives (Dc/D)³ = Po·Re_y / [π²(Hc/Dc + 1/3)].
//! Assumptions: the product outside the cavern is at rest and just at its yield stress; the
//! cavern does not touch the wall (valid for D < Dc < T); the power number is the impeller's
//! at the operating point (Elson used the turbulent value). The 0.4 ratio is from memory.

use super::error::{MixError, positive};
use super::impeller::Spread;
use super::power::{Fluid, Vessel, point_on};
use serde::Serialize;
use std::f64::consts::PI;

/// Elson's cavern height to diameter ratio Hc/Dc (from memory).
pub const ELSON_HEIGHT_RATIO: f64 = 0.4;

/// What the cavern means for the tank.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum CavernFinding {
    /// Dc ≤ D: the product barely moves beyond the blades (below the model's range).
    WithinImpeller,
    /// D < Dc < T: a ring of product between the cavern and the wall does not move.
    StagnantRing,
    /// Dc ≥ T: the cavern reaches the wall (the model ends there; it grows upward after).
    ReachesWall,
}

/// The speed at which the cavern reaches the wall.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum WallSpeed {
    Rps(f64),
    /// The cavern is wider than the tank even at the lowest speed (close-clearance impeller).
    AtAnySpeed,
    /// Not reached below [`MAX_SEARCH_RPS`].
    NotReached,
}

/// Highest speed searched for the cavern to reach the wall, rev/s.
pub const MAX_SEARCH_RPS: f64 = 100.0;

/// The cavern at one speed.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Cavern {
    pub yield_reynolds: f64,
    pub power_number: f64,
    pub diameter_m: f64,
    /// Dc over the ranges of the curve's constants (through the power number).
    pub diameter_range_m: Spread,
    pub height_m: f64,
    pub finding: Option<CavernFinding>,
    /// Share of the liquid inside the cavern (cylinder in cylinder), when the tank is known.
    pub moving_volume_fraction: Option<f64>,
    pub speed_to_wall: Option<WallSpeed>,
}

/// Dc from the torque balance: (Dc/D)³ = Po·Re_y / [π²(Hc/Dc + 1/3)].
pub fn elson_diameter_m(power_number: f64, yield_reynolds: f64, impeller_diameter_m: f64) -> f64 {
    let ratio3 = power_number * yield_reynolds / (PI * PI * (ELSON_HEIGHT_RATIO + 1.0 / 3.0));
    impeller_diameter_m * ratio3.cbrt()
}

/// The cavern at `speed_rps`; `None` when the product has no yield stress.
pub fn cavern(vessel: &Vessel, fluid: &Fluid, speed_rps: f64) -> Result<Option<Cavern>, MixError> {
    let tau0 = fluid.model.yield_stress();
    if tau0 <= 0.0 {
        return Ok(None);
    }
    let (re_y, po, dc) = diameter_at(vessel, fluid, speed_rps)?;
    let d = vessel.impeller_diameter_m;
    let diameter_range_m = diameter_range(vessel, fluid, speed_rps, re_y, dc)?;
    let hc = ELSON_HEIGHT_RATIO * dc;
    let finding = vessel.tank_diameter_m.map(|t| match dc {
        x if x <= d => CavernFinding::WithinImpeller,
        x if x < t => CavernFinding::StagnantRing,
        _ => CavernFinding::ReachesWall,
    });
    let moving = match (vessel.tank_diameter_m, vessel.liquid_height_m) {
        (Some(t), Some(h)) => Some((dc.min(t).powi(2) * hc.min(h)) / (t * t * h)),
        _ => None,
    };
    let speed_to_wall = match vessel.tank_diameter_m {
        Some(t) => Some(speed_to_wall(vessel, fluid, t)?),
        None => None,
    };
    Ok(Some(Cavern {
        yield_reynolds: re_y,
        power_number: po,
        diameter_m: dc,
        diameter_range_m,
        height_m: hc,
        finding,
        moving_volume_fraction: moving,
        speed_to_wall,
    }))
}

/// (Re_y, Po, Dc) at one speed on the nominal curve.
fn diameter_at(
    vessel: &Vessel,
    fluid: &Fluid,
    speed_rps: f64,
) -> Result<(f64, f64, f64), MixError> {
    let curve = vessel.power_curve()?;
    let d = vessel.impeller_diameter_m;
    let p = point_on(&curve.nominal(), d, fluid, speed_rps)?;
    let tau0 = positive("yield stress", fluid.model.yield_stress())?;
    let re_y = fluid.density_kg_m3 * speed_rps * speed_rps * d * d / tau0;
    Ok((
        re_y,
        p.power_number,
        elson_diameter_m(p.power_number, re_y, d),
    ))
}

/// Dc on every corner curve of the constants' ranges.
fn diameter_range(
    vessel: &Vessel,
    fluid: &Fluid,
    speed_rps: f64,
    re_y: f64,
    dc: f64,
) -> Result<Spread, MixError> {
    let d = vessel.impeller_diameter_m;
    let (mut low, mut high) = (dc, dc);
    for shape in vessel.power_curve()?.corners() {
        let po = point_on(&shape, d, fluid, speed_rps)?.power_number;
        let x = elson_diameter_m(po, re_y, d);
        low = low.min(x);
        high = high.max(x);
    }
    Ok(Spread::new(low, dc, high))
}

/// The speed at which Dc = T, by bisection on log N. Po·Re_y is proportional to the shaft
/// torque, which rises with speed on the curves [`super::curve`] accepts, so Dc does too.
fn speed_to_wall(vessel: &Vessel, fluid: &Fluid, t: f64) -> Result<WallSpeed, MixError> {
    let dc = |n: f64| diameter_at(vessel, fluid, n).map(|(_, _, dc)| dc);
    let mut lo = 1e-6;
    if dc(lo)? >= t {
        return Ok(WallSpeed::AtAnySpeed);
    }
    let mut hi = MAX_SEARCH_RPS;
    if dc(hi)? < t {
        return Ok(WallSpeed::NotReached);
    }
    for _ in 0..200 {
        let mid = (lo * hi).sqrt();
        if dc(mid)? < t {
            lo = mid;
        } else {
            hi = mid;
        }
        if hi / lo < 1.0 + 1e-12 {
            break;
        }
    }
    Ok(WallSpeed::Rps((lo * hi).sqrt()))
}
