//! Reading what an operator typed ("12.5psi", "250 GPM", "-3 °C") into an SI value.

use super::dimension::{Dimension, bare_phrase};
use super::error::UnitError;
use super::table::{self, UnitRow};

/// Longest piece of typed text quoted back in a message.
const ECHO_CHARS: usize = 40;

/// Parse `text` as a quantity of `dim`; a bare number is in `default_unit`.
pub fn parse_with_default(
    text: &str,
    dim: Dimension,
    default_unit: &str,
) -> Result<f64, UnitError> {
    let trimmed = text.trim();
    let shown = echo(trimmed);
    let default = if default_unit.is_empty() {
        bare_phrase(dim)
    } else {
        default_unit
    };
    if trimmed.is_empty() {
        let default = default.to_string();
        return Err(UnitError::Empty { default });
    }
    let (value, rest) = read_number(trimmed, &shown, default)?;
    let unit = match rest.trim() {
        "" => default_unit,
        typed => typed,
    };
    let row = resolve(unit, dim, &shown)?;
    convert(value, row, dim, &shown)
}

/// The finite number at the start of `trimmed`, and the text after it.
fn read_number<'a>(
    trimmed: &'a str,
    shown: &str,
    default: &str,
) -> Result<(f64, &'a str), UnitError> {
    let text = shown.to_string();
    let not_a_number = || UnitError::NotANumber {
        text: text.clone(),
        default: default.to_string(),
    };
    if names_non_finite(trimmed) {
        return Err(UnitError::NotFinite { text });
    }
    let (number, rest) = split_number(trimmed).ok_or_else(not_a_number)?;
    check_after_number(trimmed, rest, shown).map_err(|e| e.unwrap_or_else(not_a_number))?;
    let value: f64 = number.parse().map_err(|_| not_a_number())?;
    if value.is_finite() {
        Ok((value, rest))
    } else {
        Err(UnitError::NotFinite { text })
    }
}

/// Refuse what may not directly follow the digits: a decimal comma (`Some`), a second
/// decimal point (`None`, "not a number").
fn check_after_number(trimmed: &str, rest: &str, shown: &str) -> Result<(), Option<UnitError>> {
    let mut next = rest.chars();
    match (next.next(), next.next()) {
        (Some(','), Some(d)) if d.is_ascii_digit() => Err(Some(UnitError::DecimalComma {
            text: shown.to_string(),
            suggestion: echo(&comma_suggestion(trimmed)),
        })),
        (Some('.'), _) => Err(None),
        _ => Ok(()),
    }
}

/// What to suggest for "1,5 bar": "1.5 bar"; for "1,000 Pa" both readings, since a comma
/// before exactly three digits may be a thousands separator.
pub(super) fn comma_suggestion(trimmed: &str) -> String {
    let commas = trimmed.matches(',').count();
    let removed = trimmed.replace(',', "");
    if commas > 1 {
        return removed;
    }
    let pointed = trimmed.replacen(',', ".", 1);
    let after = trimmed.split(',').nth(1).unwrap_or("");
    let digits = after.chars().take_while(char::is_ascii_digit).count();
    if digits == 3 {
        format!("{pointed}' or '{removed}")
    } else {
        pointed
    }
}

/// "inf", "-infinity", "NaN" (what `f64::from_str` would accept but a field must not).
fn names_non_finite(trimmed: &str) -> bool {
    let body = trimmed.trim_start_matches(['+', '-', '\u{2212}']);
    let word: String = body.chars().take_while(|c| c.is_alphabetic()).collect();
    matches!(word.to_lowercase().as_str(), "inf" | "infinity" | "nan")
}

/// Split "1.2e3 Pa" into the number ("1.2e3", sign normalised) and the rest (" Pa").
/// An exponent is only taken when digits follow the `e`. `None` when there are no digits.
pub(super) fn split_number(s: &str) -> Option<(String, &str)> {
    let (sign, body) = match s.chars().next() {
        Some('+') => ("", &s[1..]),
        Some('-') => ("-", &s[1..]),
        Some('\u{2212}') => ("-", &s['\u{2212}'.len_utf8()..]),
        _ => ("", s),
    };
    let bytes = body.as_bytes();
    let int = count_digits(bytes, 0);
    let mut end = int;
    let mut frac = 0;
    if bytes.get(end) == Some(&b'.') {
        frac = count_digits(bytes, end + 1);
        end += 1 + frac;
    }
    if int + frac == 0 {
        return None;
    }
    if matches!(bytes.get(end), Some(b'e' | b'E')) {
        let mut j = end + 1;
        if matches!(bytes.get(j), Some(b'+' | b'-')) {
            j += 1;
        }
        let exp = count_digits(bytes, j);
        if exp > 0 {
            end = j + exp;
        }
    }
    Some((format!("{sign}{}", &body[..end]), &body[end..]))
}

fn count_digits(bytes: &[u8], from: usize) -> usize {
    bytes
        .iter()
        .skip(from)
        .take_while(|b| b.is_ascii_digit())
        .count()
}

/// Reduce a typed unit to the table's form: lower case, no spaces, `·`/`*`/letter-dash as
/// `.`, superscripts as digits, degree signs dropped ("m³/h" → "m3/h", "°C" → "c",
/// "lb-ft" → "lb.ft", "s⁻¹" → "s-1").
pub fn normalize(unit: &str) -> String {
    let chars: Vec<char> = unit.chars().filter(|c| !c.is_whitespace()).collect();
    let mut out = String::with_capacity(unit.len());
    for (i, &c) in chars.iter().enumerate() {
        match c {
            '°' | 'º' | '˚' | '^' => {}
            '·' | '⋅' | '•' | '∙' | '*' | '×' => out.push('.'),
            '-' if chars.get(i + 1).is_some_and(|n| n.is_alphabetic()) => out.push('.'),
            '²' => out.push('2'),
            '³' => out.push('3'),
            '¹' => out.push('1'),
            '⁻' => out.push('-'),
            '℃' => out.push('c'),
            '℉' => out.push('f'),
            c => out.extend(c.to_lowercase()),
        }
    }
    out
}

/// The table row for a typed unit in `dim`, or why there is none.
pub fn resolve(unit: &str, dim: Dimension, shown: &str) -> Result<&'static UnitRow, UnitError> {
    let key = normalize(unit);
    let unknown = || UnitError::UnknownUnit {
        text: shown.to_string(),
        unit: echo(unit),
        dim,
    };
    if key.is_empty() && !unit.trim().is_empty() {
        return Err(unknown());
    }
    let compact: String = unit.chars().filter(|c| !c.is_whitespace()).collect();
    if dim.family() == Dimension::Pressure && compact == "mPa" {
        return Err(UnitError::MilliPascalPressure {
            text: shown.to_string(),
        });
    }
    if let Some(row) = table::find(&key, dim) {
        return Ok(row);
    }
    if let Some(row) = table::find_any(&key) {
        return Err(UnitError::WrongDimension {
            text: shown.to_string(),
            found: row.dim,
            expected: dim,
        });
    }
    if let Some(plain) = strip_gauge_suffix(&compact) {
        if dim.family() != Dimension::Pressure {
            let found = Dimension::Pressure;
            return Err(UnitError::WrongDimension {
                text: shown.to_string(),
                found,
                expected: dim,
            });
        }
        let unit = echo(unit);
        return Err(UnitError::GaugeOrAbsolute {
            text: shown.to_string(),
            unit,
            plain: echo(plain),
        });
    }
    Err(unknown())
}

/// "psig" → "psi", "bar(a)" → "bar": the pressure unit under a gauge/absolute suffix.
fn strip_gauge_suffix(compact: &str) -> Option<&str> {
    let lower = compact.to_ascii_lowercase();
    ["(g)", "(a)", "g", "a"].iter().find_map(|suffix| {
        let stem = lower.strip_suffix(suffix)?;
        // to_ascii_lowercase keeps byte lengths, so the stem's length indexes `compact`.
        let plain = &compact[..stem.len()];
        table::find(&normalize(plain), Dimension::Pressure).map(|_| plain)
    })
}

/// SI value of `value` in `row`, with the checks every dimension's SI value must pass.
pub fn convert(value: f64, row: &UnitRow, dim: Dimension, shown: &str) -> Result<f64, UnitError> {
    let si = row.to_si(value);
    check_si(si, dim, shown)?;
    // A typed "-0" must not come back as a negative zero.
    Ok(if si == 0.0 { 0.0 } else { si })
}

/// Refuse SI values no quantity of `dim` can take.
pub fn check_si(si: f64, dim: Dimension, shown: &str) -> Result<(), UnitError> {
    let text = || shown.to_string();
    if !si.is_finite() {
        return Err(UnitError::NotFinite { text: text() });
    }
    match dim {
        Dimension::Temperature if si < 0.0 => Err(UnitError::BelowAbsoluteZero { text: text() }),
        Dimension::Fraction if !(0.0..=1.0).contains(&si) => {
            Err(UnitError::FractionOutOfRange { text: text() })
        }
        _ => Ok(()),
    }
}

/// Typed text made safe to quote: control and bidirectional-override characters dropped,
/// cut to `ECHO_CHARS` characters.
pub fn echo(text: &str) -> String {
    let clean = text.trim().chars().filter(|&c| {
        !c.is_control() && !matches!(c, '\u{202a}'..='\u{202e}' | '\u{2066}'..='\u{2069}')
    });
    let mut out: String = clean.clone().take(ECHO_CHARS).collect();
    if clean.count() > ECHO_CHARS {
        out.push('…');
    }
    out
}
