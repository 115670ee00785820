//! Curves for charts: Np against Re over a range, and the tank's power and torque over a
//! range of speeds.

use super::curve::Shape;
use super::error::{MixError, positive};
use super::power::{Fluid, Point, Vessel, point_on};

/// `count` values spaced evenly on a log scale from `lo` to `hi` (both included).
pub fn log_spaced(lo: f64, hi: f64, count: usize) -> Result<Vec<f64>, MixError> {
    let lo = positive("lowest value of the range", lo)?;
    let hi = positive("highest value of the range", hi)?;
    let steps = count.max(2) - 1;
    let ratio = (hi / lo).ln() / steps as f64;
    Ok((0..=steps).map(|i| lo * (ratio * i as f64).exp()).collect())
}

/// (Re, Np) pairs of one curve from `re_lo` to `re_hi`.
pub fn power_number_curve(
    shape: &Shape,
    re_lo: f64,
    re_hi: f64,
    count: usize,
) -> Result<Vec<(f64, f64)>, MixError> {
    let res = log_spaced(re_lo, re_hi, count)?;
    Ok(res
        .into_iter()
        .map(|re| (re, shape.power_number(re)))
        .collect())
}

/// The tank's operating point at each of `count` speeds from `lo_rps` to `hi_rps`, on the
/// nominal curve.
pub fn speed_sweep(
    vessel: &Vessel,
    fluid: &Fluid,
    lo_rps: f64,
    hi_rps: f64,
    count: usize,
) -> Result<Vec<Point>, MixError> {
    let shape = vessel.power_curve()?.nominal();
    let d = vessel.impeller_diameter_m;
    log_spaced(lo_rps, hi_rps, count)?
        .into_iter()
        .map(|n| point_on(&shape, d, fluid, n))
        .collect()
}
