//! Stop durations as operators type them ("62 h", "1 h 30 min", "90 min", "2 d") and as the
//! answers show them (hours and minutes).

use crate::units::{self, Dimension};

/// Why a typed duration was refused.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum DurationError {
    #[error("'{text}': give a duration with its units, e.g. '62 h', '1 h 30 min' or '90 min'")]
    NotADuration { text: String },
    #[error("'{text}': a stop cannot be negative; give how long the line stood, e.g. '8 h'")]
    Negative { text: String },
}

/// Seconds from text such as "1 h 30 min": numbers each followed by a time unit, summed.
pub fn parse_duration(text: &str) -> Result<f64, DurationError> {
    let shown = crate::text::sanitize(text.trim(), false);
    let bad = || DurationError::NotADuration {
        text: shown.clone(),
    };
    let pieces = pieces(text.trim()).ok_or_else(bad)?;
    if pieces.is_empty() {
        return Err(bad());
    }
    let mut total = 0.0;
    for piece in &pieces {
        let s = units::parse(piece, Dimension::Time).map_err(|_| bad())?;
        if s < 0.0 {
            return Err(DurationError::Negative {
                text: shown.clone(),
            });
        }
        total += s;
    }
    Ok(total)
}

/// Split "1 h 30 min" / "1h30min" into "1 h", "30 min": each piece a number then letters.
fn pieces(text: &str) -> Option<Vec<String>> {
    let mut out = Vec::new();
    let mut rest = text.trim();
    while !rest.is_empty() {
        let num_end = rest
            .find(|c: char| !(c.is_ascii_digit() || c == '.' || c == '-' || c == '+'))
            .unwrap_or(rest.len());
        if num_end == 0 {
            return None;
        }
        let after = rest[num_end..].trim_start();
        let unit_end = after
            .find(|c: char| !c.is_alphabetic())
            .unwrap_or(after.len());
        if unit_end == 0 {
            return None;
        }
        out.push(format!("{} {}", &rest[..num_end], &after[..unit_end]));
        rest = after[unit_end..]
            .trim_start()
            .trim_start_matches(',')
            .trim_start();
    }
    Some(out)
}

/// Hours and minutes: "2 h 53 min", "45 min", "62 h", "40 s" (under a minute).
pub fn format_duration(seconds: f64) -> String {
    if !seconds.is_finite() {
        return units::NOT_A_VALUE.to_string();
    }
    if seconds < 59.5 {
        return format!("{:.0} s", seconds.max(0.0));
    }
    let minutes = (seconds / 60.0).round() as u64;
    let (h, m) = (minutes / 60, minutes % 60);
    match (h, m) {
        (0, m) => format!("{m} min"),
        (h, 0) => format!("{h} h"),
        (h, m) => format!("{h} h {m} min"),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: 1 h = 3600 s, 1 min = 60 s, 1 d = 86 400 s (SI Brochure, 9th ed., table 8).
    #[test]
    fn reads_what_operators_type() {
        assert_eq!(parse_duration("62 h"), Ok(62.0 * 3600.0));
        assert_eq!(parse_duration("1 h 30 min"), Ok(5400.0));
        assert_eq!(parse_duration("1h30min"), Ok(5400.0));
        assert_eq!(parse_duration("90 min"), Ok(5400.0));
        assert_eq!(parse_duration("2 d"), Ok(172_800.0));
        assert!(parse_duration("90").is_err());
        assert!(parse_duration("soon").is_err());
        assert!(matches!(
            parse_duration("-2 h"),
            Err(DurationError::Negative { .. })
        ));
    }

    #[test]
    fn shows_hours_and_minutes() {
        assert_eq!(format_duration(5400.0), "1 h 30 min");
        assert_eq!(format_duration(62.0 * 3600.0), "62 h");
        assert_eq!(format_duration(2700.0), "45 min");
        assert_eq!(format_duration(40.0), "40 s");
    }
}
