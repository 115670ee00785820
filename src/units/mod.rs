//! Quantities: every value is held in SI as `f64`; this module reads what operators type and
//! shows values in the site's unit system.
//!
//! Typing: a number, then optionally a unit, any case, space optional ("12.5psi",
//! "12.5 PSI", "250 GPM", "1200 cP", "-3 °C", "1.2e3 Pa", "85 %"). A bare number is in the
//! field's default unit (see [`Dimension::default_unit`], or the one passed to
//! [`parse_with_default`]). Leading `+` and exponents are accepted; a decimal comma is
//! refused with a suggestion, because readings also travel as CSV. A unit that starts with
//! a digit needs a space after the number ("100 1/s"; "1001/s" is 1001 per second).
//!
//! Conventions chosen (each also noted where it is defined in `table`):
//! - Factors follow NIST SP 811 (2008), *Guide for the Use of the International System of
//!   Units*, Appendix B; composite units are derived from its exact definitions (lb, lbf,
//!   in, ft, US gallon), so psi = lbf/in² ≈ 6894.757 293 168 Pa.
//! - Water-column units and SG are *conventional*: ρ = 1000 kg/m³ and g_n = 9.806 65 m/s²
//!   (mH2O = 9806.65 Pa, inH2O = 249.088 91 Pa, SG 1 = 1000 kg/m³).
//! - hp is the mechanical horsepower (550 ft·lbf/s); kcal is the thermochemical 4.184 kJ.
//! - Speed is stored as angular speed in rad/s; 1 rpm = 2π/60 rad/s.
//! - Temperature is stored in kelvin; values below 0 K are refused.
//! - Gauge or absolute: the stored value is whatever the field says it is (each pressure
//!   field's help states gauge, absolute or difference). In a gauge field ([`parse_gauge_pressure`])
//!   "psig", "barg", "kPa(g)" are taken as gauge and "psia", "bara" as absolute, converted by
//!   subtracting the site's atmospheric pressure; a gauge value below −1 atmosphere is
//!   refused. Elsewhere the suffixes are refused with a message instead of being silently
//!   dropped, since taking "psia" as psi would be off by an atmosphere.
//! - "gpm" is the US gallon per minute (231 in³); "igpm" the imperial gallon per minute.
//! - Durations show as hours and minutes ("62 h 30 min"), which also parse back.
//! - "mPa" typed with exactly that case in a pressure field is refused (millipascal vs
//!   megapascal is a factor 10⁹); any other case ("mpa", "MPA") reads as MPa.
//! - A fraction is 0–1 as a bare number, or 0–100 with "%"; outside that it is refused.

mod dimension;
mod duration;
mod error;
mod format;
mod gauge;
mod parse;
pub mod table;

#[cfg(test)]
mod tests;

pub use dimension::{Dimension, UnitSystem, display_unit};
pub use duration::format_duration;
pub use error::UnitError;
pub use format::{NOT_A_VALUE, format, format_in, significant};
pub use gauge::{GaugePressure, PressureBasis, STANDARD_ATMOSPHERE_PA, parse_gauge_pressure};
pub use parse::{normalize, parse_with_default};

/// Parse `text` as a quantity of `dim` and return its SI value; a bare number is in
/// `dim.default_unit()`.
pub fn parse(text: &str, dim: Dimension) -> Result<f64, UnitError> {
    if dim == Dimension::Time
        && let Some(total) = duration::parse_compound(text)
    {
        return total;
    }
    parse_with_default(text, dim, dim.default_unit())
}

/// Like [`parse`], but refuses zero and negative values (speeds, diameters, densities).
pub fn parse_positive(text: &str, dim: Dimension) -> Result<f64, UnitError> {
    let si = parse(text, dim)?;
    if si > 0.0 {
        Ok(si)
    } else {
        Err(UnitError::NotPositive {
            text: parse::echo(text),
            dim,
        })
    }
}

/// SI value of `value` given in `unit` (any accepted spelling) for `dim`.
pub fn to_si(value: f64, unit: &str, dim: Dimension) -> Result<f64, UnitError> {
    let shown = parse::echo(&format!("{value} {unit}"));
    if !value.is_finite() {
        return Err(UnitError::NotFinite { text: shown });
    }
    let row = parse::resolve(unit, dim, &shown)?;
    parse::convert(value, row, dim, &shown)
}

/// Value in `unit` of the SI value `si` for `dim`; the inverse of [`to_si`].
pub fn from_si(si: f64, unit: &str, dim: Dimension) -> Result<f64, UnitError> {
    let shown = parse::echo(&format!("{si} {}", dim.si_unit()));
    parse::check_si(si, dim, &shown)?;
    let row = parse::resolve(unit, dim, &shown)?;
    let value = row.from_si(si);
    if value.is_finite() {
        Ok(value)
    } else {
        Err(UnitError::NotFinite { text: shown })
    }
}
