//! End-effect factor from readings on a Newtonian standard fluid of known viscosity.

use super::convert::{DialReading, validate_rows};
use super::error::InstrumentError;
use super::flags::scale_flags;
use super::geometry::{Geometry, bob_stress_per_torque};
use super::slope::count_distinct_speeds;

/// Usual range of the end-effect factor (common practice, no source).
pub const USUAL_FACTOR_RANGE: (f64, f64) = (1.0, 1.5);
/// Largest relative spread of one speed's ratio from the fitted factor before a warning
/// (common practice, no source).
pub const RATIO_SPREAD_LIMIT: f64 = 0.05;

/// Result of a calibration: factor = measured torque / expected torque
/// = effective bob length / geometric bob length.
#[derive(Debug, Clone, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct Calibration {
    pub factor: f64,
    pub warnings: Vec<String>,
}

/// Compare the torque read on a Newtonian standard (viscosity in Pa·s) with the torque the
/// geometric bob length predicts: T = τ·2πRb²L with τ = μ·γ̇b (Margules; for a spindle
/// μ = T/(4πRb²LΩ), Steffe 1996, §3.3; after Wein, "End effects in rotational
/// viscometry").
///
/// The factor is the least-squares slope through the origin of measured against expected
/// torque, so the better-resolved fast readings count most. Any factor already set in the
/// geometry is ignored. For the standard six-speed geometry the 0.511 Pa per degree already
/// includes end effects, so the factor is a check of the spring, not a length correction.
pub fn end_effect_factor(
    geometry: &Geometry,
    readings: &[DialReading],
    standard_viscosity_pa_s: f64,
) -> Result<Calibration, InstrumentError> {
    geometry.validate()?;
    validate_rows(readings)?;
    let mu = standard_viscosity_pa_s;
    if !(mu.is_finite() && mu > 0.0) {
        return Err(InstrumentError::BadStandardViscosity { value: mu });
    }
    if let Some(row) = readings.iter().position(|r| r.dial <= 0.0) {
        return Err(InstrumentError::ZeroCalibrationReading { row: row + 1 });
    }
    let distinct = count_distinct_speeds(readings.iter().map(|r| r.rpm));
    if distinct < 2 {
        return Err(InstrumentError::TooFewSpeeds { distinct });
    }
    let stress_per_dial = geometric_stress_per_dial(geometry);
    let pairs: Vec<(f64, f64)> = readings
        .iter()
        .map(|r| {
            (
                r.dial * stress_per_dial,
                mu * r.rpm * geometry.newtonian_rate_per_rpm(),
            )
        })
        .collect();
    let factor = through_origin_slope(&pairs);
    if !(factor.is_finite() && factor > 0.0) {
        return Err(InstrumentError::BadStandardViscosity { value: mu });
    }
    let mut warnings = reading_warnings(geometry, readings, &pairs, factor);
    warnings.extend(factor_warning(geometry, factor));
    Ok(Calibration { factor, warnings })
}

/// Bob stress per dial unit with the geometric length (factor 1).
fn geometric_stress_per_dial(geometry: &Geometry) -> f64 {
    match geometry.bob_dimensions() {
        Some((radius, length, torque_per_dial)) => {
            bob_stress_per_torque(radius, length) * torque_per_dial
        }
        None => geometry.stress_per_dial_pa(),
    }
}

/// Slope b of measured = b·expected by least squares through the origin.
fn through_origin_slope(pairs: &[(f64, f64)]) -> f64 {
    let num: f64 = pairs.iter().map(|(m, e)| m * e).sum();
    let den: f64 = pairs.iter().map(|(_, e)| e * e).sum();
    num / den
}

fn reading_warnings(
    geometry: &Geometry,
    readings: &[DialReading],
    pairs: &[(f64, f64)],
    factor: f64,
) -> Vec<String> {
    let mut out = Vec::new();
    for (i, (r, (measured, expected))) in readings.iter().zip(pairs).enumerate() {
        for flag in scale_flags(r.dial, geometry.full_scale_dial()) {
            out.push(format!("row {} ({} rpm): {}", i + 1, r.rpm, flag.explain()));
        }
        let ratio = measured / expected;
        let spread = ratio / factor - 1.0;
        if spread.abs() > RATIO_SPREAD_LIMIT {
            out.push(format!(
                "row {} ({} rpm): measured/expected torque is {:.3}, {:+.1} % from the \
                 fitted {:.3}; the standard may not be Newtonian at this temperature, or the \
                 reading is off: read it again",
                i + 1,
                r.rpm,
                ratio,
                100.0 * spread,
                factor
            ));
        }
    }
    out
}

fn factor_warning(geometry: &Geometry, factor: f64) -> Option<String> {
    let (low, high) = USUAL_FACTOR_RANGE;
    match geometry {
        Geometry::StandardSixSpeed => Some(format!(
            "standard geometry: measured/expected reading is {factor:.3} ({:+.1} %); its 0.511 \
             Pa per degree already includes end effects, so a ratio away from 1 points to the \
             spring or its calibration",
            100.0 * (factor - 1.0)
        )),
        _ if !(low..=high).contains(&factor) => Some(format!(
            "end-effect factor {factor:.3} is outside the usual {low:.1} to {high:.1}; check \
             the standard's viscosity at the test temperature, the bob dimensions and the \
             torque per dial unit"
        )),
        _ => None,
    }
}
