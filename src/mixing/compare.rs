//! The viscosity a motor reading implies against the viscometer's flow curve at the same
//! effective shear rate.

use crate::rheology::Model;
use serde::Serialize;

/// Within this factor either way the two viscosities count as agreeing: generic ks and Kp
/// are uncertain by some tens of percent (common practice, no source).
pub const AGREEMENT_FACTOR: f64 = 1.5;

/// Which way the motor's viscosity differs from the viscometer's.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Agreement {
    Agree,
    /// The motor implies a thicker product than the viscometer.
    MotorHigher,
    /// The motor implies a thinner product than the viscometer.
    MotorLower,
}

/// The two viscosities side by side.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Comparison {
    pub shear_rate_per_s: f64,
    pub from_power_pa_s: f64,
    pub from_viscometer_pa_s: f64,
    /// from power / from viscometer.
    pub ratio: f64,
    pub agreement: Agreement,
}

/// Compare `from_power_pa_s` with the viscometer's model at `rate`.
pub fn compare(viscometer: &Model, from_power_pa_s: f64, rate: f64) -> Comparison {
    let from_viscometer = viscometer.apparent_viscosity(rate);
    let ratio = from_power_pa_s / from_viscometer;
    let agreement = if ratio > AGREEMENT_FACTOR {
        Agreement::MotorHigher
    } else if ratio < 1.0 / AGREEMENT_FACTOR {
        Agreement::MotorLower
    } else {
        Agreement::Agree
    };
    Comparison {
        shear_rate_per_s: rate,
        from_power_pa_s,
        from_viscometer_pa_s: from_viscometer,
        ratio,
        agreement,
    }
}
