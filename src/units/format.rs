//! Showing an SI value in the site's units, to three or four significant figures.

use super::dimension::{Dimension, UnitSystem, display_unit};
use super::parse::normalize;
use super::table::{self, UnitRow};

/// What a value that is not a finite number is shown as.
pub const NOT_A_VALUE: &str = "—";

/// `si` in the unit `system` shows `dim` in, e.g. "6.20 bar".
pub fn format(si: f64, dim: Dimension, system: UnitSystem) -> String {
    if dim == Dimension::Time {
        return super::duration::format_duration(si);
    }
    format_in(si, dim, display_unit(dim, system))
}

/// `si` in `unit`, e.g. "90.0 psi". A unit `dim` does not accept falls back to the SI unit,
/// so a display never fails. The text parses back to the same value to within the
/// printed precision.
pub fn format_in(si: f64, dim: Dimension, unit: &str) -> String {
    let (row, unit) = match table::find(&normalize(unit), dim) {
        Some(row) => (Some(row), unit),
        None => (si_row(dim), dim.si_unit()),
    };
    let value = row.map_or(si, |row| row.from_si(si));
    if !value.is_finite() {
        return NOT_A_VALUE.to_string();
    }
    let number = match row {
        Some(row) if dim == Dimension::Temperature => temperature_number(value, row),
        _ => significant(value),
    };
    if unit.is_empty() {
        number
    } else {
        format!("{number} {unit}")
    }
}

/// Rounding must not carry a temperature near absolute zero below it ("-460 °F" would be
/// refused when typed back): round towards the warmer side instead.
fn temperature_number(value: f64, row: &UnitRow) -> String {
    let text = significant(value);
    match text.parse::<f64>() {
        Ok(shown) if row.to_si(shown) < 0.0 => {
            let warmer = (value * 100.0).ceil() / 100.0;
            strip_negative_zero(format!("{warmer:.2}"))
        }
        _ => text,
    }
}

fn si_row(dim: Dimension) -> Option<&'static UnitRow> {
    table::find(&normalize(dim.si_unit()), dim)
}

/// Three significant figures, four between 1000 and 9999 (written without exponent), and
/// exponent form below 0.001 or from 10 000 up, e.g. "6.20", "0.0620", "1013", "1.23e4".
pub fn significant(value: f64) -> String {
    if value == 0.0 {
        return "0".to_string();
    }
    let magnitude = value.abs();
    let text = if !(1e-3..1e4).contains(&magnitude) {
        format!("{value:.2e}")
    } else if magnitude >= 1000.0 {
        format!("{value:.0}")
    } else {
        let decimals = (2 - magnitude.log10().floor() as i32).clamp(0, 5) as usize;
        format!("{value:.decimals$}")
    };
    strip_negative_zero(text)
}

/// "-0.00" → "0.00": a value that rounds to zero shows no sign.
fn strip_negative_zero(text: String) -> String {
    match text.strip_prefix('-') {
        Some(rest) if rest.chars().all(|c| c == '0' || c == '.') => rest.to_string(),
        _ => text,
    }
}
