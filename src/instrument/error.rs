//! Errors from the instrument module: each names the row or field at fault and what is accepted.

/// What went wrong turning viscometer readings into stress and shear rate.
///
/// Rows are counted from 1 in the order the readings were given.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum InstrumentError {
    #[error(
        "unknown geometry '{name}': the only named geometry is 'standard-six-speed'; \
         coaxial cylinders and spindles are given by their dimensions"
    )]
    UnknownGeometry { name: String },

    #[error("geometry: {field} is {value}; it must be {accepted}")]
    BadGeometry {
        field: &'static str,
        value: f64,
        accepted: &'static str,
    },

    #[error("no readings: give at least one speed (rpm) with its dial reading")]
    NoReadings,

    #[error("row {row}: speed is {rpm} rpm; it must be a finite number above 0 rpm")]
    BadSpeed { row: usize, rpm: f64 },

    #[error("row {row}: dial reading is {dial}; it must be a finite number, 0 or more")]
    BadDial { row: usize, dial: f64 },

    #[error(
        "row {row}: {rpm} rpm with dial {dial} gives a stress or shear rate too large to \
         compute; check the speed and the dial reading"
    )]
    OutOfRange { row: usize, rpm: f64, dial: f64 },

    #[error(
        "standard fluid viscosity is {value} Pa·s; it must be a finite number above 0 \
         (1 mPa·s = 0.001 Pa·s)"
    )]
    BadStandardViscosity { value: f64 },

    #[error(
        "calibration needs the standard fluid read at 2 or more different speeds; \
         got {distinct}"
    )]
    TooFewSpeeds { distinct: usize },

    #[error(
        "row {row}: the standard fluid reads 0 on the dial; every calibration reading must \
         be above 0"
    )]
    ZeroCalibrationReading { row: usize },

    #[error(
        "the standard six-speed geometry has no end-effect factor: its 0.511 Pa per degree \
         already includes end effects; use a coaxial or spindle geometry to set one"
    )]
    NoEndEffectFactor,

    #[error("no reading at {rpm} rpm: this quick check needs the {rpm} rpm dial reading, above 0")]
    MissingSpeed { rpm: f64 },
}
