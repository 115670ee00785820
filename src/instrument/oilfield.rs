//! Oilfield quick relations from six-speed dial degrees (API RP 13D), shown beside a full fit.
//!
//! Valid only for the standard rotor–bob with the standard spring (readings in degrees).
//! Dial values of 0 or below give NaN or infinite results from the log forms; use
//! [`quick_check`] for checked input.

use super::convert::{DialReading, validate_rows};
use super::error::InstrumentError;

/// One lbf/100 ft² in Pa (4.4482216152605 N / 9.290304 m², exact definitions of lbf and ft).
pub const LBF_PER_100FT2_IN_PA: f64 = 0.4788026;

/// Bingham plastic viscosity PV = θ600 − θ300, mPa·s (API RP 13D; Guo & Liu 2011,
/// *Applied Drilling Circulation Systems*, eqs 2.6–2.10).
pub fn plastic_viscosity_mpa_s(t600: f64, t300: f64) -> f64 {
    t600 - t300
}

/// Bingham yield point YP = θ300 − PV, lbf/100 ft² (API RP 13D; Guo & Liu 2011, eqs 2.6–2.10).
pub fn yield_point_lbf_100ft2(t600: f64, t300: f64) -> f64 {
    t300 - plastic_viscosity_mpa_s(t600, t300)
}

/// Yield point in Pa: YP(lbf/100 ft²) × 0.4788026.
pub fn yield_point_pa(t600: f64, t300: f64) -> f64 {
    yield_point_lbf_100ft2(t600, t300) * LBF_PER_100FT2_IN_PA
}

/// Pipe flow behaviour index n = 3.322·log10(θ600/θ300) (API RP 13D; Guo & Liu 2011,
/// eqs 2.6–2.10).
pub fn pipe_n(t600: f64, t300: f64) -> f64 {
    3.322 * (t600 / t300).log10()
}

/// Pipe consistency index K = 510·θ300/511ⁿ, mPa·sⁿ (API RP 13D; Guo & Liu 2011,
/// eqs 2.6–2.10).
pub fn pipe_k_mpa_sn(t600: f64, t300: f64) -> f64 {
    510.0 * t300 / 511f64.powf(pipe_n(t600, t300))
}

/// Pipe consistency index in the API RP 13D form Kp = 5.11·θ600/1022ⁿ, dyn·sⁿ/cm²
/// (API RP 13D, 2002 and later editions); 100 × this is within about 0.2 % of [`pipe_k_mpa_sn`]
/// (1 dyn·s/cm² = 100 mPa·s; 511 against 510 in the numerator).
pub fn pipe_k_dyn_sn_cm2(t600: f64, t300: f64) -> f64 {
    5.11 * t600 / 1022f64.powf(pipe_n(t600, t300))
}

/// Annulus flow behaviour index nₐ = 0.657·log10(θ100/θ3) (API RP 13D, 2002 edition on).
pub fn annulus_n(t100: f64, t3: f64) -> f64 {
    0.657 * (t100 / t3).log10()
}

/// Annulus consistency index Kₐ = 5.11·θ100/170.2^nₐ, dyn·sⁿ/cm² (API RP 13D, 2002 edition on).
pub fn annulus_k_dyn_sn_cm2(t100: f64, t3: f64) -> f64 {
    5.11 * t100 / 170.2f64.powf(annulus_n(t100, t3))
}

/// The quick relations for one set of six-speed readings.
#[derive(Debug, Clone, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct QuickCheck {
    pub plastic_viscosity_mpa_s: f64,
    pub yield_point_lbf_100ft2: f64,
    pub yield_point_pa: f64,
    pub pipe_n: f64,
    pub pipe_k_mpa_sn: f64,
    /// (nₐ, Kₐ in dyn·sⁿ/cm²) when the 100 and 3 rpm readings are there and above 0.
    pub annulus: Option<(f64, f64)>,
}

/// Pick θ600, θ300 (needed) and θ100, θ3 (optional) from the readings and apply the
/// relations; repeated readings at one speed are averaged.
pub fn quick_check(readings: &[DialReading]) -> Result<QuickCheck, InstrumentError> {
    validate_rows(readings)?;
    let t600 = dial_at(readings, 600.0).ok_or(InstrumentError::MissingSpeed { rpm: 600.0 })?;
    let t300 = dial_at(readings, 300.0).ok_or(InstrumentError::MissingSpeed { rpm: 300.0 })?;
    let annulus = match (dial_at(readings, 100.0), dial_at(readings, 3.0)) {
        (Some(t100), Some(t3)) => Some((annulus_n(t100, t3), annulus_k_dyn_sn_cm2(t100, t3))),
        _ => None,
    };
    Ok(QuickCheck {
        plastic_viscosity_mpa_s: plastic_viscosity_mpa_s(t600, t300),
        yield_point_lbf_100ft2: yield_point_lbf_100ft2(t600, t300),
        yield_point_pa: yield_point_pa(t600, t300),
        pipe_n: pipe_n(t600, t300),
        pipe_k_mpa_sn: pipe_k_mpa_sn(t600, t300),
        annulus,
    })
}

/// Mean dial at this speed (within 0.5 rpm), if above 0.
pub(crate) fn dial_at(readings: &[DialReading], rpm: f64) -> Option<f64> {
    let at: Vec<f64> = readings
        .iter()
        .filter(|r| (r.rpm - rpm).abs() <= 0.5)
        .map(|r| r.dial)
        .collect();
    let mean = at.iter().sum::<f64>() / at.len().max(1) as f64;
    (!at.is_empty() && mean > 0.0).then_some(mean)
}
