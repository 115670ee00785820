//! The catalogue of spot readings an operator can record, and parsing `NAME=VALUE UNIT`.
//!
//! Each reading has one name, the dimension its value must have, and a one-line help that
//! says where it is taken and (for pressures) whether it is gauge or a difference.

use crate::journal::Payload;
use crate::text::sanitize;
use crate::units::{self, Dimension, UnitError};

/// Which values make physical sense for a reading.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Sign {
    /// Gauge pressures may be below atmospheric (a suction under vacuum).
    Any,
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
use Sign::{Any, NonNegative, Positive};

/// Every reading `record --reading` accepts.
#[rustfmt::skip]
pub const CATALOGUE: &[ReadingKind] = &[
    kind("suction-pressure", D::Pressure, Any, &["suction"], "gauge pressure at the pump inlet"),
    kind("discharge-pressure", D::Pressure, Any, &["discharge"], "gauge pressure at the pump outlet"),
    kind("line-pressure", D::Pressure, Any, &[], "gauge pressure at a tapping on the line"),
    kind("pressure-drop", D::Pressure, Any, &["dp"], "pressure difference between two tappings"),
    kind("flow", D::Flow, NonNegative, &["flow-rate"], "volumetric flow in the line"),
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
}

impl ParsedReading {
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

    #[error("'{name}' is not a reading rheoside knows; accepted: {accepted}")]
    UnknownName { name: String, accepted: String },

    #[error("{name}: {source}")]
    Value {
        name: &'static str,
        #[source]
        source: UnitError,
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
/// dimension's default unit.
pub fn parse_reading_arg(s: &str) -> Result<ParsedReading, ReadingError> {
    let clean = sanitize(s, false);
    let Some((name, value)) = clean.split_once('=') else {
        return Err(ReadingError::Shape {
            text: clip(clean.trim()),
        });
    };
    let kind = find(name).ok_or_else(|| ReadingError::UnknownName {
        name: clip(name.trim()),
        accepted: accepted_names(),
    })?;
    let raw = value.trim().to_string();
    let value_si = units::parse(&raw, kind.dimension).map_err(|source| ReadingError::Value {
        name: kind.name,
        source,
    })?;
    check_sign(kind, &raw, value_si)?;
    Ok(ParsedReading {
        kind,
        raw,
        value_si,
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
mod tests {
    use super::*;

    #[test]
    fn names_values_and_units_parse_to_si() {
        // 1 bar = 100 000 Pa exactly (NIST SP 811, 2008, Appendix B).
        let r = parse_reading_arg("discharge-pressure=6.2 bar").unwrap();
        assert_eq!(
            (r.kind.name, r.raw.as_str()),
            ("discharge-pressure", "6.2 bar")
        );
        assert!((r.value_si - 620_000.0).abs() < 1e-6);
        // 1 rpm = 2π/60 rad/s, by definition of the revolution.
        let r = parse_reading_arg("agitator_speed = 60 rpm").unwrap();
        assert!((r.value_si - std::f64::consts::TAU).abs() < 1e-12);
        // T/K = t/°C + 273.15 (SI Brochure, 9th ed., 2.3.1).
        let r = parse_reading_arg("Temp=25 C").unwrap();
        assert_eq!(r.kind.name, "temperature");
        assert!((r.value_si - 298.15).abs() < 1e-9);
        // A bare number is the dimension's default unit: bar for pressure.
        let r = parse_reading_arg("suction=-0.3").unwrap();
        assert!((r.value_si + 30_000.0).abs() < 1e-6);
    }

    #[test]
    fn unknown_name_lists_what_is_accepted() {
        let err = parse_reading_arg("pressure=3 bar").unwrap_err();
        let msg = err.to_string();
        assert!(matches!(err, ReadingError::UnknownName { .. }));
        assert!(
            msg.contains("'pressure'") && msg.contains("discharge-pressure, line-pressure"),
            "{msg}"
        );
        for k in CATALOGUE {
            assert!(msg.contains(k.name), "{msg} misses {}", k.name);
        }
    }

    #[test]
    fn bad_value_gives_the_units_message() {
        let err = parse_reading_arg("flow=12 bar").unwrap_err();
        assert!(
            matches!(err, ReadingError::Value { name: "flow", .. }),
            "{err}"
        );
        assert!(
            err.to_string().starts_with("flow: '12 bar' is a pressure"),
            "{err}"
        );
        let err = parse_reading_arg("density=").unwrap_err();
        assert!(matches!(err, ReadingError::Value { .. }), "{err}");
    }

    #[test]
    fn shape_and_sign_are_checked() {
        assert!(matches!(
            parse_reading_arg("flow 12"),
            Err(ReadingError::Shape { .. })
        ));
        let err = parse_reading_arg("motor-current=-3 A").unwrap_err();
        assert_eq!(
            err.to_string(),
            "motor-current: '-3 A' is negative; a current reading must be zero or more"
        );
        assert!(parse_reading_arg("density=0").is_err());
        assert!(parse_reading_arg("rest-time=0 s").is_ok());
    }

    #[test]
    fn catalogue_names_and_aliases_are_unique_and_file_safe() {
        let mut seen = std::collections::HashSet::new();
        for k in CATALOGUE {
            for n in std::iter::once(&k.name).chain(k.aliases) {
                assert!(seen.insert(*n), "{n} twice");
                assert!(n.chars().all(|c| c.is_ascii_lowercase() || c == '-'), "{n}");
            }
            assert!(!k.help.is_empty());
        }
    }

    #[test]
    fn control_characters_are_stripped_from_the_raw_text() {
        let r = parse_reading_arg("flow=12\u{1b}[2J m3/h").unwrap();
        assert_eq!(r.raw, "12 m3/h");
        assert_eq!(r.payload().kind(), "reading");
    }
}
