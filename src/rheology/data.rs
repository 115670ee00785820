//! Readings going into a fit: one point type and the checks every fit runs first.

use super::error::FitError;
use super::kind::ModelKind;

/// One flow-curve reading in SI: shear rate (1/s) and shear stress (Pa).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Point {
    pub shear_rate: f64,
    pub shear_stress: f64,
}

impl Point {
    pub fn new(shear_rate: f64, shear_stress: f64) -> Self {
        Point {
            shear_rate,
            shear_stress,
        }
    }
}

/// Largest shear stress taken as a plant reading, Pa: 1 GPa is far above any paste, gel or
/// slurry, and beyond it the arithmetic of the fits loses its meaning (common practice, no
/// source).
pub const MAX_PLANT_STRESS_PA: f64 = 1e9;
/// Largest shear rate taken as a plant reading, 1/s: spraying and coating reach about 1e5–1e6
/// (common practice, no source).
pub const MAX_PLANT_SHEAR_RATE_PER_S: f64 = 1e7;

/// Check every reading (finite, above zero, within plant sense); readings are numbered from 1
/// in messages.
pub(crate) fn check_points(points: &[Point]) -> Result<(), FitError> {
    if points.is_empty() {
        return Err(FitError::NoPoints);
    }
    for (i, p) in points.iter().enumerate() {
        let index = i + 1;
        if !p.shear_rate.is_finite() {
            return Err(FitError::NotFinite {
                index,
                field: "shear rate",
                unit: "1/s",
            });
        }
        if !p.shear_stress.is_finite() {
            return Err(FitError::NotFinite {
                index,
                field: "shear stress",
                unit: "Pa",
            });
        }
        if p.shear_rate <= 0.0 {
            return Err(FitError::NonPositiveRate {
                index,
                value: p.shear_rate,
            });
        }
        if p.shear_stress <= 0.0 {
            return Err(FitError::NonPositiveStress {
                index,
                value: p.shear_stress,
            });
        }
        check_plant_range(index, p)?;
    }
    Ok(())
}

fn check_plant_range(index: usize, p: &Point) -> Result<(), FitError> {
    let beyond = |field, value, limit, unit| FitError::BeyondPlantRange {
        index,
        field,
        value,
        limit,
        unit,
    };
    if p.shear_stress > MAX_PLANT_STRESS_PA {
        return Err(beyond(
            "shear stress",
            p.shear_stress,
            MAX_PLANT_STRESS_PA,
            "Pa",
        ));
    }
    if p.shear_rate > MAX_PLANT_SHEAR_RATE_PER_S {
        let limit = MAX_PLANT_SHEAR_RATE_PER_S;
        return Err(beyond("shear rate", p.shear_rate, limit, "1/s"));
    }
    Ok(())
}

/// Check there are enough readings, at enough different rates, for `need` free parameters.
pub(crate) fn check_counts(kind: ModelKind, points: &[Point], need: usize) -> Result<(), FitError> {
    if points.len() < need {
        return Err(FitError::TooFewPoints {
            model: kind,
            have: points.len(),
            need,
        });
    }
    let distinct = distinct_rates(points);
    if distinct < need {
        return Err(FitError::TooFewDistinctRates {
            model: kind,
            have: distinct,
            need,
        });
    }
    Ok(())
}

/// Number of different shear rates (exact comparison: repeats are typed or read, not computed).
pub(crate) fn distinct_rates(points: &[Point]) -> usize {
    let mut rates: Vec<f64> = points.iter().map(|p| p.shear_rate).collect();
    rates.sort_by(f64::total_cmp);
    rates.dedup();
    rates.len()
}
