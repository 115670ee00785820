//! Numbers for people: quantities in the site's units, a value with its uncertainty to two
//! significant figures and the value to match, ranges, and R² in words when it has none.

use super::Style;
use crate::units::{self, Dimension, NOT_A_VALUE, significant};

/// A quantity in the style's unit system, e.g. "6.20 bar", "77.0 °F".
pub fn quantity(si: f64, dim: Dimension, style: Style) -> String {
    if !si.is_finite() {
        return not_a_value(style);
    }
    style.text(&units::format(si, dim, style.system))
}

/// "1.80 bar (1.60 to 2.10)": an answer with the band it may lie in.
pub fn range(si: f64, (lo, hi): (f64, f64), dim: Dimension, style: Style) -> String {
    let unit = units::display_unit(dim, style.system);
    let shown = |x: f64| units::from_si(x, unit, dim).unwrap_or(f64::NAN);
    let (v, a, b) = (shown(si), shown(lo), shown(hi));
    if !(v.is_finite() && a.is_finite() && b.is_finite()) {
        return quantity(si, dim, style);
    }
    let text = format!(
        "{} {unit} ({} to {})",
        significant(v),
        significant(a),
        significant(b)
    );
    style.text(&text)
}

/// "5.02 ± 0.19 Pa": the value of `si` with the half-width of its 95 % interval.
pub fn interval(si: f64, (lo, hi): (f64, f64), dim: Dimension, style: Style) -> String {
    let unit = units::display_unit(dim, style.system);
    let shown = |x: f64| units::from_si(x, unit, dim).unwrap_or(f64::NAN);
    let (v, a, b) = (shown(si), shown(lo), shown(hi));
    let (value, half) = value_pm(v, (b - a).abs() / 2.0);
    let pm = if style.ascii { "+/-" } else { "±" };
    let body = if half.is_empty() {
        value
    } else {
        format!("{value} {pm} {half}")
    };
    style.text(&join_unit(&body, unit))
}

/// More significant figures than this in a value are noise to a plant reader.
const MAX_DIGITS: i32 = 6;

/// The value and its uncertainty as text: the uncertainty to two significant figures, the
/// value rounded to the same decimal place ("5.02", "0.19"). Without a usable uncertainty
/// the value alone, to three significant figures, and an empty second string.
pub fn value_pm(value: f64, half: f64) -> (String, String) {
    if !value.is_finite() {
        return (NOT_A_VALUE.to_string(), String::new());
    }
    if !(half.is_finite() && half > 0.0) {
        return (significant(value), String::new());
    }
    let big = value.abs().max(half);
    if !(1e-3..1e6).contains(&big) {
        let exp = big.log10().floor() as i32;
        let scale = 10f64.powi(-exp);
        let (v, h) = value_pm(value * scale, half * scale);
        return (format!("{v}e{exp}"), format!("{h}e{exp}"));
    }
    let place = half.log10().floor() as i32 - 1;
    let digits = value.abs().log10().floor() as i32 - place + 1;
    if digits > MAX_DIGITS {
        // An interval far narrower than the value (exact or invented data): the value to six
        // significant figures and the uncertainty in exponent form, not twenty digits.
        let decimals = (MAX_DIGITS - 1 - value.abs().log10().floor() as i32).max(0) as usize;
        return (tidy(format!("{value:.decimals$}")), format!("{half:.1e}"));
    }
    let text = |x: f64| {
        if place >= 0 {
            let step = 10f64.powi(place);
            tidy(format!("{:.0}", (x / step).round() * step))
        } else {
            let decimals = (-place) as usize;
            tidy(format!("{x:.decimals$}"))
        }
    };
    (text(value), text(half))
}

/// R² as a number, or in words where a number would mislead: below zero the model fits
/// worse than the mean of the readings (a flat line).
pub fn r_squared(r2: f64) -> String {
    if !r2.is_finite() {
        "not available".to_string()
    } else if r2 < 0.0 {
        "worse than a flat line".to_string()
    } else {
        format!("{r2:.4}")
    }
}

fn not_a_value(style: Style) -> String {
    if style.ascii {
        "n/a".to_string()
    } else {
        NOT_A_VALUE.to_string()
    }
}

fn join_unit(number: &str, unit: &str) -> String {
    if unit.is_empty() {
        number.to_string()
    } else {
        format!("{number} {unit}")
    }
}

/// "-0.00" shows no sign.
fn tidy(text: String) -> String {
    match text.strip_prefix('-') {
        Some(rest) if rest.chars().all(|c| c == '0' || c == '.') => rest.to_string(),
        _ => text,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // A negative R² (a flat-set Newtonian fit printed "-114.1360") is said in words.
    #[test]
    fn negative_r_squared_is_never_a_number() {
        assert_eq!(r_squared(-114.136), "worse than a flat line");
        assert_eq!(r_squared(0.427), "0.4270");
        assert_eq!(r_squared(f64::NAN), "not available");
    }

    // The rule: uncertainty to two significant figures, value to the same decimal place
    // (the convention of the GUM, JCGM 100:2008 §7.2.6, as commonly applied).
    #[test]
    fn an_uncertainty_sets_the_digits_of_its_value() {
        assert_eq!(value_pm(5.0163, 0.1942), ("5.02".into(), "0.19".into()));
        assert_eq!(value_pm(5.0163, 0.0952), ("5.016".into(), "0.095".into()));
        assert_eq!(value_pm(236.4, 14.3), ("236".into(), "14".into()));
        assert_eq!(value_pm(2364.0, 143.0), ("2360".into(), "140".into()));
        assert_eq!(
            value_pm(0.008864299698979502, 0.0),
            ("0.00886".into(), String::new())
        );
        assert_eq!(
            value_pm(5.0e-4, 1.9e-5),
            ("5.00e-4".into(), "0.19e-4".into())
        );
        assert_eq!(
            value_pm(50.000142727, 2.1e-14),
            ("50.0001".into(), "2.1e-14".into())
        );
    }

    #[test]
    fn a_negative_r_squared_is_said_in_words() {
        assert_eq!(r_squared(-114.136), "worse than a flat line");
        assert_eq!(r_squared(0.99871), "0.9987");
    }

    #[test]
    fn intervals_and_ranges_read_in_site_units() {
        let si = Style::SI;
        assert_eq!(
            interval(5.0163, (4.8221, 5.2105), Dimension::Stress, si),
            "5.02 ± 0.19 Pa"
        );
        let ascii = Style { ascii: true, ..si };
        assert_eq!(
            interval(5.0163, (4.8221, 5.2105), Dimension::Stress, ascii),
            "5.02 +/- 0.19 Pa"
        );
        // 1.8 bar = 180 000 Pa (NIST SP 811: 1 bar = 1e5 Pa).
        assert_eq!(
            range(1.8e5, (1.6e5, 2.1e5), Dimension::Pressure, si),
            "1.80 bar (1.60 to 2.10)"
        );
    }
}
