//! Spot readings beyond a site limit, in words and site units, with their caution.

use super::Style;
use super::number::quantity;
use crate::session::spot::{NotChecked, SpotCall, SpotLimit, caution};
use crate::units::Dimension;

/// "discharge-pressure 8.50 bar is above the pump's maximum discharge pressure, 8.00 bar".
pub fn call_text(c: &SpotCall, style: Style) -> String {
    let p = |pa| quantity(pa, Dimension::Pressure, style);
    let a = |amps| quantity(amps, Dimension::Current, style);
    let line = c.line_id.as_deref().unwrap_or("");
    let (value, limit) = match c.limit {
        SpotLimit::PumpMaximum { pa } => (
            p(c.value_si),
            format!("the pump's maximum discharge pressure, {}", p(pa)),
        ),
        SpotLimit::ReliefSetting { pa } => (
            p(c.value_si),
            format!(
                "the relief setting, {}: the relief valve should be lifting",
                p(pa)
            ),
        ),
        SpotLimit::LineDesign { fed: true, pa } => (
            p(c.value_si),
            format!("the design pressure of line {line} it feeds, {}", p(pa)),
        ),
        SpotLimit::LineDesign { fed: false, pa } => (
            p(c.value_si),
            format!("the design pressure of line {line}, {}", p(pa)),
        ),
        SpotLimit::FullLoadCurrent { amps } => (
            a(c.value_si),
            format!(
                "the motor's full-load current, {} (from its rating, voltage, power factor \
                 and efficiency)",
                a(amps)
            ),
        ),
    };
    style.text(&format!("{} {value} is above {limit}", c.reading))
}

/// A few words for a table cell: "above the pump's maximum, 8.00 bar".
pub fn short_text(c: &SpotCall, style: Style) -> String {
    let p = |pa| quantity(pa, Dimension::Pressure, style);
    let line = c.line_id.as_deref().unwrap_or("");
    let text = match c.limit {
        SpotLimit::PumpMaximum { pa } => format!("above the pump's maximum, {}", p(pa)),
        SpotLimit::ReliefSetting { pa } => format!("above the relief setting, {}", p(pa)),
        SpotLimit::LineDesign { pa, .. } => format!("above {line}'s design pressure, {}", p(pa)),
        SpotLimit::FullLoadCurrent { amps } => format!(
            "above full-load current, {}",
            quantity(amps, Dimension::Current, style)
        ),
    };
    style.text(&text)
}

/// The call-out with its caution: "… is above …. Stop the pump …".
pub fn call_with_caution(c: &SpotCall, style: Style) -> String {
    style.text(&format!("{}. {}", call_text(c, style), caution(&c.limit)))
}

/// Why a reading could not be checked against a limit.
pub fn not_checked_text(n: &NotChecked) -> &'static str {
    match n {
        NotChecked::NoMotorData => {
            "not checked against a full-load current: the site config has no voltage, power \
             factor or efficiency for this motor"
        }
    }
}
