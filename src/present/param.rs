//! Flow-model parameters in the site's units: τ0 as a stress, the viscosities as dynamic
//! viscosities, K with the stress unit times sⁿ, n as a bare number to three decimals.

use super::Style;
use super::number::value_pm;
use crate::rheology::{Estimate, NoCi, ParamName};
use crate::units::{self, Dimension, NOT_A_VALUE, significant};

/// The parameter's symbol as the style prints it ("τ0", or "tau0" in ASCII).
pub fn symbol(name: ParamName, style: Style) -> String {
    style.text(name.symbol())
}

/// The unit a parameter is shown in ("Pa", "lbf/100ft2·sⁿ", "" for n).
pub fn param_unit(name: ParamName, style: Style) -> String {
    let unit = match name {
        ParamName::Tau0 => units::display_unit(Dimension::Stress, style.system).to_string(),
        ParamName::Mu | ParamName::MuP | ParamName::MuC => {
            units::display_unit(Dimension::DynamicViscosity, style.system).to_string()
        }
        ParamName::K => format!(
            "{}·sⁿ",
            units::display_unit(Dimension::Stress, style.system)
        ),
        ParamName::N => String::new(),
    };
    style.text(&unit)
}

/// The SI value in the parameter's display unit. K carries stress·sⁿ, so it converts with
/// the stress unit.
fn displayed(name: ParamName, si: f64, style: Style) -> f64 {
    let dim = match name {
        ParamName::Tau0 | ParamName::K => Dimension::Stress,
        ParamName::Mu | ParamName::MuP | ParamName::MuC => Dimension::DynamicViscosity,
        ParamName::N => return si,
    };
    let unit = units::display_unit(dim, style.system);
    units::from_si(si, unit, dim).unwrap_or(f64::NAN)
}

/// The bare number of a parameter in its display unit (n to three decimals).
fn number(name: ParamName, shown: f64) -> String {
    if !shown.is_finite() {
        return NOT_A_VALUE.to_string();
    }
    match name {
        ParamName::N => format!("{shown:.3}"),
        _ => significant(shown),
    }
}

/// A parameter's value in its display unit, without the unit ("4.20").
pub(crate) fn param_number(name: ParamName, si: f64, style: Style) -> String {
    number(name, displayed(name, si, style))
}

/// A parameter's value with its unit, e.g. "4.20 Pa", "0.412".
pub fn param_text(name: ParamName, si: f64, style: Style) -> String {
    let body = number(name, displayed(name, si, style));
    style.text(&with_unit(body, &param_unit(name, style)))
}

/// An estimate with its 95 % interval as value ± half-width ("5.02 ± 0.19 Pa"), or the value
/// with the reason it has none ("0 Pa (no interval: held at its bound of zero)").
pub fn estimate(e: &Estimate, style: Style) -> String {
    let unit = param_unit(e.name, style);
    let shown = displayed(e.name, e.value, style);
    let text = match e.ci95 {
        Some((lo, hi)) => {
            let half = (displayed(e.name, hi, style) - displayed(e.name, lo, style)).abs() / 2.0;
            let (v, h) = value_pm(shown, half);
            let pm = if style.ascii { "+/-" } else { "±" };
            let body = if h.is_empty() {
                v
            } else {
                format!("{v} {pm} {h}")
            };
            with_unit(body, &unit)
        }
        None => format!(
            "{} (no interval: {})",
            with_unit(number(e.name, shown), &unit),
            no_interval_reason(e)
        ),
    };
    style.text(&text)
}

/// Why an estimate has no interval, in words.
fn no_interval_reason(e: &Estimate) -> String {
    match (e.at_bound, e.no_ci) {
        (true, _) | (_, Some(NoCi::AtBound)) => NoCi::AtBound.explain().to_string(),
        (_, Some(why)) => why.explain().to_string(),
        (_, None) => "not computed".to_string(),
    }
}

fn with_unit(number: String, unit: &str) -> String {
    if unit.is_empty() {
        number
    } else {
        format!("{number} {unit}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::units::UnitSystem;

    #[test]
    fn stresses_and_k_follow_the_site_units() {
        let us = Style::new(UnitSystem::UsCustomary, false);
        // 1 lbf/100ft² = 0.478 802 6 Pa (NIST SP 811: lbf = 4.448 222 N, ft = 0.3048 m).
        assert_eq!(param_text(ParamName::Tau0, 4.788026, us), "10.0 lbf/100ft2");
        assert_eq!(param_text(ParamName::K, 4.788026, us), "10.0 lbf/100ft2·sⁿ");
        let ascii = Style::new(UnitSystem::Si, true);
        assert_eq!(param_text(ParamName::K, 2.5, ascii), "2.50 Pa.s^n");
        assert_eq!(param_text(ParamName::N, 0.41234, ascii), "0.412");
        // 1 cP = 1 mPa·s (NIST SP 811).
        assert_eq!(param_text(ParamName::MuP, 0.0252, us), "25.2 cP");
    }
}
