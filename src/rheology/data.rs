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

/// Check every reading (finite, above zero); readings are numbered from 1 in messages.
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
