//! Restart after a stop: gel build-up at rest, the pressure to break the gelled plug, and the
//! longest stop after which the pump can still restart the line. Pure: no terminal, disk or
//! clock; numbers and reasons in, numbers and reasons out.
//!
//! Methods: the force balance on a plug, ΔP = 4·τ_gel·L/D (plus static head and
//! back-pressure), which ignores the product's compressibility and so is conservative for
//! long lines (Smith & Ramsden 1978; Fakroun & Benkreira 2020 find a lower "fragmentation
//! stress" predicts restart better); and first-order structure rebuild at rest (Barnes 1997,
//! *J. Non-Newt. Fluid Mech.* 70:1), which gives τ(t) = τ∞ − (τ∞ − τi)·e^(−t/tr) on the
//! assumption that the static yield stress is linear in the structure parameter.

mod band;
mod error;
mod gel;
mod gel_fit;
mod gel_lsq;
mod pressure;
mod safe_stop;

pub use band::{StopBand, gel_band, longest_safe_stop_band};
pub use error::RestartError;
pub use gel::{GelCurve, Reach};
pub use gel_fit::{
    DEFAULT_READING_RELATIVE_SD, GelFit, GelFitKind, GelFitOptions, GelReading, IntervalBasis,
    fit_gel,
};
pub use pressure::{Outcome, PlugLine, RestartCheck, RestartPressure, check_restart};
pub use safe_stop::{DEFAULT_MARGIN, MaxStop, allowed_gel_stress, longest_safe_stop};
