//! Dial reading + speed → bob shear stress, Newtonian (Margules) and n-corrected shear rate.

use super::error::InstrumentError;
use super::flags::{ReadingFlag, scale_flags};
use super::geometry::{Geometry, OMEGA_PER_RPM};
use super::slope::{MAX_LOCAL_N, MIN_LOCAL_N, SlopeCurve, fit_slope};

/// One reading: rotor speed (rpm) and dial value (the geometry's dial units).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct DialReading {
    pub rpm: f64,
    pub dial: f64,
}

impl DialReading {
    pub const fn new(rpm: f64, dial: f64) -> DialReading {
        DialReading { rpm, dial }
    }
}

/// One reading turned into bob shear stress and shear rate.
#[derive(Debug, Clone, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct Converted {
    pub rpm: f64,
    pub dial: f64,
    /// Shear stress at the bob, Pa.
    pub shear_stress_pa: f64,
    /// Margules rate at the bob, s⁻¹ (right for a Newtonian fluid only).
    pub newtonian_shear_rate_per_s: f64,
    /// Rate at the bob corrected with the local slope n′, s⁻¹.
    pub shear_rate_per_s: f64,
    /// Local slope n′ = d ln τb / d ln Ω used for the correction (after limiting).
    pub local_n: f64,
    pub flags: Vec<ReadingFlag>,
}

/// Convert readings; the output keeps the input order.
///
/// The slope n′ is estimated from all readings (see `slope`); readings of 0 on the dial
/// are converted (stress 0, flagged low-scale) but take no part in the slope.
pub fn convert(
    geometry: &Geometry,
    readings: &[DialReading],
) -> Result<Vec<Converted>, InstrumentError> {
    geometry.validate()?;
    validate_rows(readings)?;
    let stress_per_dial = geometry.stress_per_dial_pa();
    let mut points = Vec::with_capacity(readings.len());
    for (i, r) in readings.iter().enumerate() {
        let stress = r.dial * stress_per_dial;
        let rate = r.rpm * geometry.newtonian_rate_per_rpm();
        if !(stress.is_finite() && rate.is_finite()) {
            return Err(out_of_range(i, r));
        }
        if r.dial > 0.0 {
            points.push((r.rpm.ln(), stress.ln()));
        }
    }
    let curve = fit_slope(&points);
    readings
        .iter()
        .enumerate()
        .map(|(i, r)| convert_one(geometry, &curve, r).ok_or_else(|| out_of_range(i, r)))
        .collect()
}

/// Reject an empty list, speeds that are not above 0 and dials below 0, naming the row.
pub(crate) fn validate_rows(readings: &[DialReading]) -> Result<(), InstrumentError> {
    if readings.is_empty() {
        return Err(InstrumentError::NoReadings);
    }
    for (i, r) in readings.iter().enumerate() {
        if !(r.rpm.is_finite() && r.rpm > 0.0) {
            return Err(InstrumentError::BadSpeed {
                row: i + 1,
                rpm: r.rpm,
            });
        }
        if !(r.dial.is_finite() && r.dial >= 0.0) {
            return Err(InstrumentError::BadDial {
                row: i + 1,
                dial: r.dial,
            });
        }
    }
    Ok(())
}

fn out_of_range(index: usize, r: &DialReading) -> InstrumentError {
    InstrumentError::OutOfRange {
        row: index + 1,
        rpm: r.rpm,
        dial: r.dial,
    }
}

/// `None` if a result is not finite.
fn convert_one(geometry: &Geometry, curve: &SlopeCurve, r: &DialReading) -> Option<Converted> {
    let mut flags = scale_flags(r.dial, geometry.full_scale_dial());
    let local_n = match curve.slope_at(r.rpm.ln()) {
        Some(n) if (MIN_LOCAL_N..=MAX_LOCAL_N).contains(&n) => n,
        Some(n) if n.is_finite() => {
            flags.push(ReadingFlag::SlopeClamped);
            n.clamp(MIN_LOCAL_N, MAX_LOCAL_N)
        }
        _ => {
            flags.push(ReadingFlag::SlopeNotMeasured);
            1.0
        }
    };
    let omega = r.rpm * OMEGA_PER_RPM;
    let out = Converted {
        rpm: r.rpm,
        dial: r.dial,
        shear_stress_pa: r.dial * geometry.stress_per_dial_pa(),
        newtonian_shear_rate_per_s: r.rpm * geometry.newtonian_rate_per_rpm(),
        shear_rate_per_s: corrected_rate(geometry.radius_ratio(), omega, local_n),
        local_n,
        flags,
    };
    let finite = out.shear_stress_pa.is_finite()
        && out.newtonian_shear_rate_per_s.is_finite()
        && out.shear_rate_per_s.is_finite();
    finite.then_some(out)
}

/// Bob shear rate for a local slope n′, s⁻¹.
///
/// Coaxial: γ̇b = 2Ω / [n′(1 − s^(−2/n′))] (Steffe 1996, *Rheological Methods in Food Process
/// Engineering*, eqs 3.33 and 3.37, with n′ for n after Krieger & Maron 1952); it is exact for
/// a power-law fluid and reduces to Margules at n′ = 1. Spindle in a large container (s → ∞):
/// γ̇b = 2Ω/n′. `expm1` keeps the narrow-gap case (s near 1) accurate.
pub fn corrected_rate(radius_ratio: Option<f64>, omega_rad_s: f64, local_n: f64) -> f64 {
    match radius_ratio {
        Some(s) => 2.0 * omega_rad_s / (local_n * -(-2.0 * s.ln() / local_n).exp_m1()),
        None => 2.0 * omega_rad_s / local_n,
    }
}
