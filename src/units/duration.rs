//! Durations as people read them: "62 h 30 min", "45 min", "12.5 s"; and the same compound
//! form typed back ("62 h 30 min" parses to 225 000 s).

use super::dimension::Dimension;
use super::error::UnitError;
use super::format::significant;
use super::parse::{echo, parse_with_default};

const MINUTE: f64 = 60.0;
const HOUR: f64 = 3600.0;

/// A duration in seconds as hours and minutes (rounded to the minute) from one hour up,
/// minutes and seconds from one minute, seconds below.
pub fn format_duration(seconds: f64) -> String {
    if !seconds.is_finite() {
        return super::format::NOT_A_VALUE.to_string();
    }
    let sign = if seconds < 0.0 { "-" } else { "" };
    let s = seconds.abs();
    if s < MINUTE {
        return format!("{sign}{} s", significant(s));
    }
    if s < HOUR {
        let whole = s.round();
        let (m, rest) = ((whole / MINUTE).floor(), whole % MINUTE);
        return if rest == 0.0 {
            format!("{sign}{m} min")
        } else {
            format!("{sign}{m} min {rest} s")
        };
    }
    let minutes = (s / MINUTE).round();
    let (h, m) = ((minutes / 60.0).floor(), minutes % 60.0);
    format!("{sign}{h} h {m} min")
}

/// "62 h 30 min", "1 h 5 min 10 s": several number–unit pairs summed; `None` when the text is
/// a single quantity (left to the ordinary parser).
pub fn parse_compound(text: &str) -> Option<Result<f64, UnitError>> {
    let parts = split_pairs(text)?;
    let mut total = 0.0;
    for part in parts {
        match parse_with_default(&part, Dimension::Time, "s") {
            Ok(v) => total += v,
            Err(e) => return Some(Err(e)),
        }
    }
    if total.is_finite() {
        Some(Ok(total))
    } else {
        Some(Err(UnitError::NotFinite { text: echo(text) }))
    }
}

/// Split at each number that follows a unit word and a space: "62 h 30 min" → ["62 h",
/// "30 min"]. An exponent ("1.00e4 s") is not a unit word: no space comes before its digits.
fn split_pairs(text: &str) -> Option<Vec<String>> {
    let mut parts: Vec<String> = Vec::new();
    let mut current = String::new();
    let mut seen_letter = false;
    for c in text.trim().chars() {
        let after_space = current.ends_with(' ');
        if (c.is_ascii_digit() || c == '.') && seen_letter && after_space {
            parts.push(current.trim().to_string());
            current.clear();
            seen_letter = false;
        }
        if c.is_alphabetic() {
            seen_letter = true;
        }
        current.push(c);
    }
    parts.push(current.trim().to_string());
    (parts.len() > 1).then_some(parts)
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: 1 h = 3600 s and 1 min = 60 s (SI Brochure, 9th ed., table 8).
    #[test]
    fn durations_read_as_hours_and_minutes_and_parse_back() {
        assert_eq!(format_duration(62.0 * 3600.0), "62 h 0 min");
        assert_eq!(format_duration(223_200.0 + 1800.0), "62 h 30 min");
        assert_eq!(format_duration(45.0 * 60.0), "45 min");
        assert_eq!(format_duration(90.0), "1 min 30 s");
        assert_eq!(format_duration(12.5), "12.5 s");
        for s in [225_000.0, 2700.0, 90.0, 3600.0] {
            let shown = format_duration(s);
            let back = parse_compound(&shown)
                .unwrap_or_else(|| parse_with_default(&shown, Dimension::Time, "s"))
                .unwrap();
            assert!((back - s).abs() <= 30.0, "{shown} → {back}");
        }
        assert!(parse_compound("62 h").is_none());
    }
}
