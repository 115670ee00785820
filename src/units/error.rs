//! Why a typed quantity was refused, worded for the operator who typed it.

use super::dimension::Dimension;

/// A refused quantity. Every message quotes what was typed, says what is wrong and what
/// would be accepted. `text` fields hold the typed text with control characters removed
/// and long input cut short, so a message is always safe to show.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum UnitError {
    /// Nothing typed.
    #[error("'': empty; type a number, optionally followed by a unit (default {default})")]
    Empty { default: String },

    /// No number at the start.
    #[error(
        "'{text}': not a number; type a number, optionally followed by a unit (default {default})"
    )]
    NotANumber { text: String, default: String },

    /// inf, NaN, or a number too large to hold.
    #[error("'{text}': not a finite number; type an ordinary number such as 12.5")]
    NotFinite { text: String },

    /// "1,5": CSV files use commas to separate fields, so a decimal comma is never guessed at.
    #[error(
        "'{text}': a comma is not accepted in a number; write decimals with a point \
         (e.g. '{suggestion}') and no thousands separators"
    )]
    DecimalComma { text: String, suggestion: String },

    /// A unit no dimension knows.
    #[error("'{text}': unknown unit '{unit}' for a {}; accepted: {}", .dim.name(), .dim.accepted_list())]
    UnknownUnit {
        text: String,
        unit: String,
        dim: Dimension,
    },

    /// A known unit of another dimension.
    #[error(
        "'{text}' is a {}, but a {} is expected here; accepted: {}",
        .found.name(), .expected.name(), .expected.accepted_list()
    )]
    WrongDimension {
        text: String,
        found: Dimension,
        expected: Dimension,
    },

    /// "psig", "bara": whether a pressure is gauge or absolute belongs to the field, not to
    /// the unit, so the suffix is refused rather than silently dropped.
    #[error(
        "'{text}': '{unit}' marks gauge or absolute pressure, which is not taken as a unit; \
         type the value in '{plain}' (the field's help says whether it is gauge or absolute)"
    )]
    GaugeOrAbsolute {
        text: String,
        unit: String,
        plain: String,
    },

    /// "mPa" typed exactly so in a pressure field: millipascal, a factor 10⁹ from MPa.
    #[error(
        "'{text}': 'mPa' is millipascal, not a plant pressure; for megapascal type 'MPa' \
         (a viscosity in mPa.s belongs in a viscosity field)"
    )]
    MilliPascalPressure { text: String },

    /// A gauge pressure below −1 atmosphere: below vacuum.
    #[error(
        "'{text}' is below vacuum: a gauge pressure cannot be lower than minus one atmosphere \
         (−{atmosphere_kpa} kPa at this site); check the sign and the unit"
    )]
    BelowVacuum { text: String, atmosphere_kpa: f64 },

    /// An absolute pressure below zero.
    #[error("'{text}': an absolute pressure cannot be negative; check the sign and the unit")]
    NegativeAbsolute { text: String },

    /// A temperature below 0 K.
    #[error("'{text}' is below absolute zero (0 K = -273.15 C = -459.67 F)")]
    BelowAbsoluteZero { text: String },

    /// A fraction outside 0–1.
    #[error(
        "'{text}': a fraction must be between 0 and 1 (or 0 % to 100 %); \
         for a percentage type e.g. '85 %'"
    )]
    FractionOutOfRange { text: String },

    /// Zero or negative where only a positive value makes sense.
    #[error("'{text}': must be greater than zero; type a positive {}", .dim.name())]
    NotPositive { text: String, dim: Dimension },
}
