//! The catalogue of spot readings an operator can record, and parsing `NAME=VALUE UNIT`.
//!
//! Each reading has one name, the dimension its value must have, and a one-line help that
//! says where it is taken and (for pressures) whether it is gauge or a difference.

mod suggest;

pub use suggest::nearest_name;

use crate::journal::Payload;
use crate::text::{first_hidden_char, sanitize};
use crate::units::{self, Dimension, PressureBasis, STANDARD_ATMOSPHERE_PA, UnitError};

/// Which values make physical sense for a reading.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Sign {
    Any,
    /// A gauge pressure: below atmospheric is fine (a suction under vacuum), below −1
    /// atmosphere is not; "psig"/"barg" and "psia"/"bara" are understood.
    Gauge,
    NonNegative,
    Positive,
}

/// One entry of the catalogue.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct ReadingKind {
    pub name: &'static str,
    pub dimension: Dimension,
    pub sign: Sign,
    /// Short names also accepted when typed.
    pub aliases: &'static [&'static str],
    pub help: &'static str,
}

const fn kind(
    name: &'static str,
    dimension: Dimension,
    sign: Sign,
    aliases: &'static [&'static str],
    help: &'static str,
) -> ReadingKind {
    ReadingKind {
        name,
        dimension,
        sign,
        aliases,
        help,
    }
}

use Dimension as D;
use Sign::{Any, Gauge, NonNegative, Positive};

/// Every reading `record --reading` accepts.
#[rustfmt::skip]
pub const CATALOGUE: &[ReadingKind] = &[
    kind("suction-pressure", D::Pressure, Gauge, &["suction"], "gauge pressure at the pump inlet"),
    kind("discharge-pressure", D::Pressure, Gauge, &["discharge"], "gauge pressure at the pump outlet"),
    kind("line-pressure", D::Pressure, Gauge, &[], "gauge pressure at a tapping on the line"),
    kind("pressure-drop", D::Pressure, Any, &["dp"], "pressure difference between two tappings"),
    kind("flow", D::Flow, NonNegative, &["flow-rate"], "volumetric flow in the line (gpm is US gallons per minute, igpm imperial)"),
    kind("pump-speed", D::Speed, NonNegative, &[], "pump shaft speed"),
    kind("agitator-speed", D::Speed, NonNegative, &[], "agitator shaft speed"),
    kind("agitator-torque", D::Torque, NonNegative, &["torque"], "torque on the agitator shaft"),
    kind("motor-current", D::Current, NonNegative, &["current"], "motor current, one phase"),
    kind("motor-power", D::Power, NonNegative, &["power"], "electrical power drawn by the motor"),
    kind("voltage", D::Voltage, NonNegative, &[], "supply voltage, line to line"),
    kind("temperature", D::Temperature, Any, &["temp"], "product temperature"),
    kind("liquid-level", D::Length, NonNegative, &["level"], "liquid height above the tank bottom"),
    kind("density", D::Density, Positive, &[], "product density"),
    kind("apparent-viscosity", D::DynamicViscosity, Positive, &[], "viscosity read off an inline or spot meter"),
    kind("yield-stress", D::Stress, NonNegative, &[], "yield stress from a vane or gel test"),
    kind("solids-content", D::Fraction, NonNegative, &["solids"], "solids fraction of the product"),
    kind("rest-time", D::Time, NonNegative, &["downtime"], "how long the product has stood still"),
];

/// Look a reading up by name or alias; case and `_` for `-` do not matter.
pub fn find(name: &str) -> Option<&'static ReadingKind> {
    let wanted = name.trim().to_ascii_lowercase().replace('_', "-");
    CATALOGUE
        .iter()
        .find(|k| k.name == wanted || k.aliases.contains(&wanted.as_str()))
}

/// All names, for messages: "suction-pressure, discharge-pressure, …".
pub fn accepted_names() -> String {
    let names: Vec<&str> = CATALOGUE.iter().map(|k| k.name).collect();
    names.join(", ")
}

/// A reading that parsed: what it is, what was typed, and the SI value.
#[derive(Debug, Clone, PartialEq)]
pub struct ParsedReading {
    pub kind: &'static ReadingKind,
    /// The value and unit as typed (cleaned), e.g. `6.2 bar`.
    pub raw: String,
    pub value_si: f64,
    /// For a gauge pressure: how it was typed (plain, marked gauge, or absolute converted).
    pub basis: Option<PressureBasis>,
}

impl ParsedReading {
    /// What the program did to the typed value, when it did more than convert units: an
    /// absolute pressure turned gauge. Journalled beside the reading so the record says so.
    pub fn conversion_note(&self) -> Option<String> {
        let Some(PressureBasis::Absolute {
            absolute_pa,
            atmosphere_pa,
        }) = self.basis
        else {
            return None;
        };
        let bar = |pa: f64| units::format(pa, Dimension::Pressure, units::UnitSystem::Si);
        Some(format!(
            "{}: '{}' is an absolute pressure ({}); the site's atmospheric pressure {} kPa \
             was subtracted, so {} gauge ({} Pa) was saved",
            self.kind.name,
            self.raw,
            bar(absolute_pa),
            atmosphere_pa / 1000.0,
            bar(self.value_si),
            self.value_si
        ))
    }

    /// The journal payload for this reading.
    pub fn payload(&self) -> Payload {
        Payload::Reading {
            name: self.kind.name.to_string(),
            raw: self.raw.clone(),
            value_si: self.value_si,
            dimension: self.kind.dimension.name().to_string(),
        }
    }
}

#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum ReadingError {
    #[error("'{text}': expected NAME=VALUE UNIT, e.g. 'discharge-pressure=6.2 bar'")]
    Shape { text: String },

    #[error("'{name}' is not a reading rheoside knows;{} accepted: {accepted}",
        .suggestion.map_or(String::new(), |s| format!(" did you mean '{s}'?")))]
    UnknownName {
        name: String,
        suggestion: Option<&'static str>,
        accepted: String,
    },

    // The unit message is the text; it is not repeated as a source.
    #[error("{name}: {detail}")]
    Value {
        name: &'static str,
        detail: UnitError,
    },

    #[error(
        "'{text}': character {position} is an invisible control or format character \
         ({code}); type the value again with plain characters"
    )]
    HiddenCharacter {
        text: String,
        position: usize,
        code: String,
    },

    #[error("{name}: '{raw}' is {problem}; a {} reading must be {expected}", .dim.name())]
    Sign {
        name: &'static str,
        raw: String,
        dim: Dimension,
        problem: &'static str,
        expected: &'static str,
    },
}

/// Parse `NAME=VALUE UNIT`, e.g. `discharge-pressure=6.2 bar`; a bare value means the
/// dimension's default unit. Absolute gauge-field pressures use the standard atmosphere.
pub fn parse_reading_arg(s: &str) -> Result<ParsedReading, ReadingError> {
    parse_reading_arg_at(s, STANDARD_ATMOSPHERE_PA)
}

/// As [`parse_reading_arg`], with the site's atmospheric pressure (Pa, absolute) for
/// "psia"/"bara" in gauge fields. A control or format character anywhere is refused, not
/// cleaned away: cleaning first would turn "1\u{7f}2 bar" into 12 bar.
pub fn parse_reading_arg_at(s: &str, atmosphere_pa: f64) -> Result<ParsedReading, ReadingError> {
    if let Some((position, c)) = first_hidden_char(s) {
        return Err(ReadingError::HiddenCharacter {
            text: clip(&sanitize(s, false)),
            position,
            code: format!("U+{:04X}", u32::from(c)),
        });
    }
    let Some((name, value)) = s.split_once('=') else {
        return Err(ReadingError::Shape {
            text: clip(s.trim()),
        });
    };
    let kind = find(name).ok_or_else(|| ReadingError::UnknownName {
        name: clip(name.trim()),
        suggestion: nearest_name(name),
        accepted: accepted_names(),
    })?;
    let raw = value.trim().to_string();
    let value_error = |detail| ReadingError::Value {
        name: kind.name,
        detail,
    };
    let (value_si, basis) = match kind.sign {
        Sign::Gauge => {
            let g = units::parse_gauge_pressure(&raw, atmosphere_pa).map_err(value_error)?;
            (g.gauge_pa, Some(g.basis))
        }
        _ => (
            units::parse(&raw, kind.dimension).map_err(value_error)?,
            None,
        ),
    };
    check_sign(kind, &raw, value_si)?;
    Ok(ParsedReading {
        kind,
        raw,
        value_si,
        basis,
    })
}

fn check_sign(kind: &'static ReadingKind, raw: &str, v: f64) -> Result<(), ReadingError> {
    let (problem, expected) = match kind.sign {
        Sign::NonNegative if v < 0.0 => ("negative", "zero or more"),
        Sign::Positive if v <= 0.0 => ("zero or negative", "greater than zero"),
        _ => return Ok(()),
    };
    Err(ReadingError::Sign {
        name: kind.name,
        raw: clip(raw),
        dim: kind.dimension,
        problem,
        expected,
    })
}

/// Messages quote what was typed, but not a whole pasted paragraph.
fn clip(s: &str) -> String {
    const MAX: usize = 40;
    let mut out: String = s.chars().take(MAX).collect();
    if s.chars().count() > MAX {
        out.push('…');
    }
    out
}

#[cfg(test)]
mod tests;
