//! The power drawn against what the drive can give (motor rating, gearbox torque) and the
//! power per volume against the rules of thumb.

use super::impeller::Spread;
use serde::Serialize;

/// How close a demand is to its limit.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum LoadVerdict {
    /// Below [`NEAR_LIMIT_FRACTION`] of the limit even at the high end of the range.
    Within,
    /// Within the limit at the nominal value but inside the margin, or over it at the high
    /// end of the range.
    Near,
    /// Over the limit at the nominal value.
    Over,
}

/// Above this fraction of a rating a drive counts as near its limit: keep about 20 % in hand
/// for a thicker batch or a cold start (common practice, no source).
pub const NEAR_LIMIT_FRACTION: f64 = 0.8;

/// A demand (its range) against one limit.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct LoadCheck {
    pub limit: f64,
    pub demand: Spread,
    /// demand / limit, nominal.
    pub fraction: f64,
    pub verdict: LoadVerdict,
}

impl LoadCheck {
    pub fn new(demand: Spread, limit: f64) -> LoadCheck {
        let fraction = demand.value / limit;
        let verdict = if fraction > 1.0 {
            LoadVerdict::Over
        } else if fraction > NEAR_LIMIT_FRACTION || demand.high > limit {
            LoadVerdict::Near
        } else {
            LoadVerdict::Within
        };
        LoadCheck {
            limit,
            demand,
            fraction,
            verdict,
        }
    }
}

/// What a power per volume is usually enough for (common practice, no source; bands from
/// general mixing practice, kW/m³): below 0.05 little more than keeping the tank moving;
/// 0.05–0.1 keeping a tank uniform; 0.1–0.5 blending and heat transfer; 0.5–2 solids
/// suspension and gas dispersion; 2–5 viscous pastes (often torque-limited); above 5
/// unusually high.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum SpecificPowerBand {
    BelowUsual,
    KeepingUniform,
    BlendingHeatTransfer,
    SuspensionDispersion,
    ViscousPaste,
    AboveUsual,
}

impl SpecificPowerBand {
    /// The band a power per volume (W/m³) falls in.
    pub fn of(w_per_m3: f64) -> SpecificPowerBand {
        match w_per_m3 {
            x if x < 50.0 => SpecificPowerBand::BelowUsual,
            x if x < 100.0 => SpecificPowerBand::KeepingUniform,
            x if x < 500.0 => SpecificPowerBand::BlendingHeatTransfer,
            x if x < 2000.0 => SpecificPowerBand::SuspensionDispersion,
            x if x <= 5000.0 => SpecificPowerBand::ViscousPaste,
            _ => SpecificPowerBand::AboveUsual,
        }
    }
}
