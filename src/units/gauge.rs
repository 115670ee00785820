//! Gauge pressures as plant gauges show them: "6.2 bar" (the field's own basis, gauge),
//! "90 psig" / "6.2 barg" (gauge, said so), "7.2 bara" / "105 psia" (absolute, converted by
//! subtracting the site's atmospheric pressure). A gauge value below −1 atmosphere would be
//! below vacuum and is refused.

use super::dimension::Dimension;
use super::error::UnitError;
use super::parse::{echo, parse_with_default};

/// Standard atmosphere, exact: 101 325 Pa (NIST SP 811, App. B.8). The default site setting.
pub const STANDARD_ATMOSPHERE_PA: f64 = 101_325.0;

/// How the typed pressure was marked.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PressureBasis {
    /// A plain unit ("bar"): taken as the gauge pressure the field asks for.
    AsField,
    /// Marked gauge ("psig", "barg", "kPa(g)").
    Gauge,
    /// Marked absolute ("psia", "bara", "kPa(a)"): this atmosphere (Pa) was subtracted.
    Absolute {
        absolute_pa: f64,
        atmosphere_pa: f64,
    },
}

/// A gauge pressure in Pa and how it was typed.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GaugePressure {
    pub gauge_pa: f64,
    pub basis: PressureBasis,
}

/// Parse a gauge pressure; `atmosphere_pa` is the site's atmospheric pressure (absolute, Pa).
pub fn parse_gauge_pressure(text: &str, atmosphere_pa: f64) -> Result<GaugePressure, UnitError> {
    let trimmed = text.trim();
    let (body, marked) = split_basis(trimmed);
    let value = parse_with_default(
        body,
        Dimension::Pressure,
        Dimension::Pressure.default_unit(),
    )?;
    let (gauge_pa, basis) = match marked {
        Marked::None => (value, PressureBasis::AsField),
        Marked::Gauge => (value, PressureBasis::Gauge),
        Marked::Absolute if value < 0.0 => {
            return Err(UnitError::NegativeAbsolute {
                text: echo(trimmed),
            });
        }
        Marked::Absolute => (
            value - atmosphere_pa,
            PressureBasis::Absolute {
                absolute_pa: value,
                atmosphere_pa,
            },
        ),
    };
    if gauge_pa < -atmosphere_pa {
        return Err(UnitError::BelowVacuum {
            text: echo(trimmed),
            atmosphere_kpa: atmosphere_pa / 1000.0,
        });
    }
    Ok(GaugePressure { gauge_pa, basis })
}

#[derive(Debug, Clone, Copy, PartialEq)]
enum Marked {
    None,
    Gauge,
    Absolute,
}

/// "90 psig" → ("90 psi", Gauge); "7 bar(a)" → ("7 bar", Absolute); "6.2 bar" → as is.
/// Only a suffix on a known pressure unit counts, so "Pa" is never read as "P" + absolute.
fn split_basis(text: &str) -> (&str, Marked) {
    let lower = text.to_ascii_lowercase();
    for (suffix, marked) in [
        ("(g)", Marked::Gauge),
        ("(a)", Marked::Absolute),
        ("g", Marked::Gauge),
        ("a", Marked::Absolute),
    ] {
        let Some(stem) = lower.strip_suffix(suffix) else {
            continue;
        };
        let unit: String = stem
            .trim_end()
            .chars()
            .rev()
            .take_while(|c| c.is_alphabetic())
            .collect::<Vec<_>>()
            .into_iter()
            .rev()
            .collect();
        if matches!(unit.as_str(), "psi" | "bar" | "kpa" | "mpa" | "mbar") {
            // Lower-casing ASCII keeps byte offsets, so the stem's length indexes `text`.
            return (text[..stem.len()].trim_end(), marked);
        }
    }
    (text, Marked::None)
}
