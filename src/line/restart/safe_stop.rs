//! The longest stop after which the line still restarts with a margin in hand.
//!
//! Allowed gel stress τ_allow = (P_usable·(1 − margin) − static − back)·D/(4L), with P_usable
//! the lower of the pump's limit and the line's design pressure; then
//! t_max = −tr·ln[(τ∞ − τ_allow)/(τ∞ − τi)] from the build-up curve. The margin default of
//! 10 % is common practice, no source.

use super::error::RestartError;
use super::gel::{GelCurve, Reach};
use super::pressure::PlugLine;

/// Margin kept below the usable pressure (common practice, no source).
pub const DEFAULT_MARGIN: f64 = 0.10;

/// How long the line may stand.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum MaxStop {
    /// Any stop restarts: the gel never gets strong enough.
    Never,
    /// No stop restarts: even the freshly stopped product needs more than is allowed.
    AlreadyTooLate,
    /// Stops up to this long restart, s.
    After(f64),
}

impl MaxStop {
    /// The contract's `max_stop_s`: `None` for any stop, 0 for none, else seconds.
    pub fn seconds(&self) -> Option<f64> {
        match self {
            MaxStop::Never => None,
            MaxStop::AlreadyTooLate => Some(0.0),
            MaxStop::After(s) => Some(*s),
        }
    }
}

/// τ_allow for a usable pressure and a margin (fraction 0 ≤ m < 1).
pub fn allowed_gel_stress(
    line: &PlugLine,
    usable_pa: f64,
    margin: f64,
) -> Result<f64, RestartError> {
    if !(margin.is_finite() && (0.0..1.0).contains(&margin)) {
        return Err(RestartError::BadMargin { value: margin });
    }
    if !(usable_pa.is_finite() && usable_pa > 0.0) {
        return Err(RestartError::NoLimit);
    }
    Ok(line.gel_stress_for(usable_pa * (1.0 - margin)))
}

/// The longest safe stop for a build-up curve against an allowed gel stress.
pub fn longest_safe_stop(gel: &GelCurve, allowed_pa: f64) -> MaxStop {
    if allowed_pa <= 0.0 {
        return MaxStop::AlreadyTooLate;
    }
    // A stress the product holds right at the stop is already too much to restart.
    if gel.initial_pa >= allowed_pa {
        return MaxStop::AlreadyTooLate;
    }
    match gel.rest_to_reach(allowed_pa) {
        Reach::Never => MaxStop::Never,
        Reach::AtOnce => MaxStop::AlreadyTooLate,
        Reach::After(s) => MaxStop::After(s),
    }
}
