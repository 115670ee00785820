//! Spec limits and constants in words and site units, shared by the Flow curve view,
//! `trend` and `report`, so all three say the same.

use super::Style;
use super::number::quantity;
use super::param::param_text;
use crate::rheology::ParamName;
use crate::session::trend::{LimitCheck, LimitStatus, Param};
use crate::site::{LimitProperty, SpecLimit};
use crate::units::Dimension;

/// The limited quantity's short name, e.g. "K" or "μa at 50.0 1/s".
pub fn property_name(p: LimitProperty, style: Style) -> String {
    let name = match p {
        LimitProperty::ConsistencyIndex => "K".to_string(),
        LimitProperty::FlowIndex => "n".to_string(),
        LimitProperty::YieldStress => "τ0".to_string(),
        LimitProperty::ApparentViscosity { shear_rate_per_s } => {
            format!("μa at {}", rate_text(shear_rate_per_s))
        }
    };
    style.text(&name)
}

/// A shear rate as shown in headings, e.g. "50.0 1/s".
pub fn rate_text(rate_per_s: f64) -> String {
    quantity(rate_per_s, Dimension::ShearRate, Style::SI)
}

/// A value of the limited quantity in site units.
pub fn value_text(p: LimitProperty, si: f64, style: Style) -> String {
    match p {
        LimitProperty::ConsistencyIndex => param_text(ParamName::K, si, style),
        LimitProperty::FlowIndex => format!("{si:.3}"),
        LimitProperty::YieldStress => param_text(ParamName::Tau0, si, style),
        LimitProperty::ApparentViscosity { .. } => quantity(si, Dimension::DynamicViscosity, style),
    }
}

/// "K 8.00 to 16.0 Pa·sⁿ"-style description of one limit.
pub fn describe_limit(l: &SpecLimit, style: Style) -> String {
    let name = property_name(l.property, style);
    let v = |x| value_text(l.property, x, style);
    match (l.min, l.max) {
        (Some(lo), Some(hi)) => format!("{name} {} to {}", v(lo), v(hi)),
        (Some(lo), None) => format!("{name} at least {}", v(lo)),
        (None, Some(hi)) => format!("{name} at most {}", v(hi)),
        (None, None) => format!("{name} (no bound)"),
    }
}

/// Every limit of a product on one line, or a plain statement that there are none.
pub fn describe_limits(limits: &[SpecLimit], style: Style) -> String {
    if limits.is_empty() {
        return "none set in the site config".to_string();
    }
    let parts: Vec<String> = limits.iter().map(|l| describe_limit(l, style)).collect();
    parts.join("; ")
}

/// What one check says: "K above 16.0 Pa·sⁿ", "n within", "K not checked (…)".
pub fn check_text(c: &LimitCheck, style: Style) -> String {
    let name = property_name(c.limit.property, style);
    let bound =
        |b: Option<f64>| b.map_or(String::new(), |x| value_text(c.limit.property, x, style));
    match c.status {
        LimitStatus::Above => format!("{name} above {}", bound(c.limit.max)),
        LimitStatus::Below => format!("{name} below {}", bound(c.limit.min)),
        LimitStatus::Within => format!("{name} within the limit"),
        LimitStatus::NotChecked => format!("{name} not checked: the model fitted has no {name}"),
    }
}

/// "OUT: K above 16.0 Pa·sⁿ; n above 0.400", or `None` when every checked limit is met.
pub fn out_text(checks: &[LimitCheck], style: Style) -> Option<String> {
    let outs: Vec<String> = checks
        .iter()
        .filter(|c| c.is_out())
        .map(|c| check_text(c, style))
        .collect();
    (!outs.is_empty()).then(|| format!("OUT: {}", outs.join("; ")))
}

/// Limits that could not be checked, as one line, or `None`.
pub fn unchecked_text(checks: &[LimitCheck], style: Style) -> Option<String> {
    let skipped: Vec<String> = checks
        .iter()
        .filter(|c| c.status == LimitStatus::NotChecked)
        .map(|c| check_text(c, style))
        .collect();
    (!skipped.is_empty()).then(|| skipped.join("; "))
}

/// A table cell for τ0, K or n; a value fixed by the model's form carries a `*`.
pub fn param_cell(name: ParamName, p: Param, style: Style) -> String {
    match p {
        Param::Fitted(v) => short_param(name, v, style),
        Param::Implied(v) => format!("{}*", short_param(name, v, style)),
        Param::Absent => "-".to_string(),
    }
}

fn short_param(name: ParamName, v: f64, style: Style) -> String {
    match name {
        ParamName::N => format!("{v:.3}"),
        other => param_text(other, v, style),
    }
}
