//! What a field value must be: presence, numeric range, id spelling, and the wording that
//! says so; plus the small conversions the typed reads share.

use crate::units::{Dimension, UnitError};
use toml::de::DeValue;

/// Whether a field must be present.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Need {
    Required,
    Optional,
}

/// The range a number must fall in; each says in words what is accepted.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) enum Rule {
    Any,
    Positive,
    NonNegative,
    /// 0 < x ≤ 1, e.g. an efficiency or a power factor.
    UnitInterval,
    /// lo ≤ x ≤ hi.
    Within(f64, f64),
}

impl Rule {
    pub(crate) fn allows(self, x: f64) -> bool {
        match self {
            Rule::Any => true,
            Rule::Positive => x > 0.0,
            Rule::NonNegative => x >= 0.0,
            Rule::UnitInterval => x > 0.0 && x <= 1.0,
            Rule::Within(lo, hi) => (lo..=hi).contains(&x),
        }
    }

    pub(crate) fn explain(self, dim: Dimension) -> String {
        match self {
            Rule::Any => String::new(),
            Rule::Positive => "must be greater than zero".into(),
            Rule::NonNegative => "must not be negative".into(),
            Rule::UnitInterval => "must be above 0 and at most 1 (e.g. 0.85 or '85 %')".into(),
            Rule::Within(lo, hi) => format!("must be between {lo} and {hi} {}", dim.si_unit())
                .trim_end()
                .to_string(),
        }
    }
}

/// Longest id accepted; ids appear in narrow table columns and journal lines.
pub(crate) const MAX_ID_CHARS: usize = 32;

/// Why `s` is not an acceptable id, or `None` when it is.
pub(crate) fn id_problem(s: &str) -> Option<String> {
    if s.is_empty() {
        return Some("an id must not be empty".into());
    }
    if let Some(c) = s
        .chars()
        .find(|c| !(c.is_ascii_alphanumeric() || matches!(c, '.' | '_' | '-')))
    {
        let shown = if c.is_control() || c.is_whitespace() {
            format!("{:?}", c)
        } else {
            format!("'{c}'")
        };
        return Some(format!(
            "ids may use only letters A-Z a-z, digits 0-9, '.', '_' and '-' (found {shown})"
        ));
    }
    if s.chars().count() > MAX_ID_CHARS {
        return Some(format!("an id may be at most {MAX_ID_CHARS} characters"));
    }
    None
}

/// Whether a bare number means something without a unit (fractions, plain numbers).
pub(crate) fn bare_allowed(dim: Dimension) -> bool {
    matches!(dim, Dimension::Fraction | Dimension::Dimensionless)
}

/// A typical value of a dimension, for "e.g." hints.
pub(crate) fn sample(dim: Dimension) -> &'static str {
    match dim {
        Dimension::Pressure => "'6 bar'",
        Dimension::Stress => "'25 Pa'",
        Dimension::Flow => "'12 m3/h'",
        Dimension::Length => "'150 mm'",
        Dimension::DynamicViscosity => "'850 mPa.s'",
        Dimension::KinematicViscosity => "'100 cSt'",
        Dimension::Speed => "'1450 rpm'",
        Dimension::Density => "'1100 kg/m3'",
        Dimension::Temperature => "'25 C'",
        Dimension::Power => "'7.5 kW'",
        Dimension::Current => "'14 A'",
        Dimension::Voltage => "'400 V'",
        Dimension::Time => "'20 min'",
        Dimension::ShearRate => "'100 1/s'",
        Dimension::Torque => "'1500 N.m'",
        Dimension::MolarEnergy => "'35 kJ/mol'",
        Dimension::Fraction => "0.85 or '85 %'",
        Dimension::Dimensionless => "1.5",
    }
}

/// The unit parser's message, minus its opening quote of the text (our line already quotes
/// it); "not a number" is reworded because a config, unlike a reading, needs the unit.
pub(crate) fn unit_message(err: &UnitError, dim: Dimension) -> String {
    if matches!(err, UnitError::NotANumber { .. } | UnitError::Empty { .. }) {
        return match bare_allowed(dim) {
            true => format!("not a number; give a number, e.g. {}", sample(dim)),
            false => format!(
                "not a number; give a {} with its unit, e.g. {}",
                dim.name(),
                sample(dim)
            ),
        };
    }
    let full = err.to_string();
    let Some(rest) = full.strip_prefix('\'') else {
        return full;
    };
    if let Some((_, why)) = rest.split_once("': ") {
        return why.to_string();
    }
    match rest.split_once("' is ") {
        Some((_, why)) => format!("that is {why}"),
        None => full,
    }
}

/// A TOML integer or float as f64 (underscores allowed, as TOML writes them).
pub(crate) fn toml_f64(v: &DeValue<'_>) -> Option<f64> {
    match v {
        DeValue::Integer(i) => {
            let digits = i.as_str().replace('_', "");
            i64::from_str_radix(&digits, i.radix())
                .ok()
                .map(|n| n as f64)
        }
        DeValue::Float(f) => f.as_str().replace('_', "").parse().ok(),
        _ => None,
    }
}
