//! Rotational viscometer readings → bob shear stress and shear rate, with the n-dependent
//! correction, reading flags, end-effect calibration and the oilfield quick relations.
//!
//! Pure: no terminal, no disk, no clock.

mod calibrate;
mod convert;
mod error;
mod flags;
mod geometry;
pub mod oilfield;
mod slope;

pub use calibrate::{Calibration, RATIO_SPREAD_LIMIT, USUAL_FACTOR_RANGE, end_effect_factor};
pub use convert::{Converted, DialReading, convert, corrected_rate};
pub use error::InstrumentError;
pub use flags::{LOW_SCALE_FRACTION, ReadingFlag, flag_unsheared_gap};
pub use geometry::{
    Coaxial, Geometry, STANDARD_BOB_LENGTH_M, STANDARD_BOB_RADIUS_M, STANDARD_FULL_SCALE_DIAL,
    STANDARD_ROTOR_RADIUS_M, STANDARD_SPEEDS_RPM, STANDARD_STRESS_PER_DIAL_PA, Spindle,
};
pub use slope::{MAX_LOCAL_N, MIN_LOCAL_N};
