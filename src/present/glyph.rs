//! ASCII spellings of the symbols the tool prints, for terminals without them.

/// Symbol → ASCII spelling. Longer sequences first, so "Pa·sⁿ" becomes "Pa.s^n".
const SPELLINGS: &[(&str, &str)] = &[
    ("τ0", "tau0"),
    ("τ", "tau"),
    ("μp", "mu_p"),
    ("μc", "mu_c"),
    ("μa", "mu_a"),
    ("μ", "mu"),
    ("γ̇", "gamma-dot"),
    ("ⁿ", "^n"),
    ("²", "^2"),
    ("³", "^3"),
    ("⁻¹", "^-1"),
    ("·", "."),
    ("−", "-"),
    ("–", "-"),
    ("—", "-"),
    ("…", "..."),
    ("±", "+/-"),
    ("°C", "degC"),
    ("°F", "degF"),
    ("°", "deg"),
    ("≤", "<="),
    ("≥", ">="),
    ("×", "x"),
    ("→", "->"),
    ("′", "'"),
    ("‘", "'"),
    ("’", "'"),
    ("“", "\""),
    ("”", "\""),
];

/// The text with every known symbol spelt in ASCII and anything else non-ASCII as '?',
/// so the result is pure ASCII whatever came in.
pub fn ascii_fold(text: &str) -> String {
    if text.is_ascii() {
        return text.to_string();
    }
    let mut out = String::with_capacity(text.len());
    let mut rest = text;
    'outer: while let Some(c) = rest.chars().next() {
        for (symbol, ascii) in SPELLINGS {
            if let Some(after) = rest.strip_prefix(symbol) {
                out.push_str(ascii);
                rest = after;
                continue 'outer;
            }
        }
        out.push(if c.is_ascii() { c } else { '?' });
        rest = &rest[c.len_utf8()..];
    }
    out
}

#[cfg(test)]
mod tests {
    use super::ascii_fold;

    #[test]
    fn every_symbol_has_an_ascii_spelling() {
        assert_eq!(
            ascii_fold("τ0 4.2 Pa, K 2.1 Pa·sⁿ, R² 0.99"),
            "tau0 4.2 Pa, K 2.1 Pa.s^n, R^2 0.99"
        );
        assert_eq!(ascii_fold("−3 to 5 °C … ±"), "-3 to 5 degC ... +/-");
        assert!(ascii_fold("ünknown ✓").is_ascii());
    }
}
