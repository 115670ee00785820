//! Findings in words, for the report and the screens: the headline, each number in the
//! site's units with its range, the next checks and the caution.

use super::{Style, quantity, range};
use crate::diagnose::{Finding, Number};

/// The words of one finding, each part ready to print.
#[derive(Debug, Clone, PartialEq)]
pub struct FindingWords {
    /// "ALARM, certain: pump P-2. The discharge pressure is above the pump's relief setting."
    pub headline: String,
    /// "discharge pressure 13.0 bar (12.7 to 13.3)".
    pub numbers: Vec<String>,
    pub next_checks: Vec<String>,
    pub caution: String,
}

/// "ALARM", "CAUTION", "INFORMATION".
pub fn severity_word(f: &Finding) -> String {
    f.severity.code().to_uppercase()
}

/// One number: its name, its value in the site's units and its range when one is known.
pub fn number(n: &Number, style: Style) -> String {
    let value = match n.interval {
        Some(band) if band.0.is_finite() && band.1.is_finite() => {
            range(n.value_si, band, n.dimension, style)
        }
        Some((lo, _)) if lo.is_finite() => format!(
            "{} (from {}, no upper end)",
            quantity(n.value_si, n.dimension, style),
            quantity(lo, n.dimension, style)
        ),
        _ => quantity(n.value_si, n.dimension, style),
    };
    style.text(&format!("{} {value}", n.name))
}

/// Every part of `f` in words.
pub fn words(f: &Finding, style: Style) -> FindingWords {
    let headline = format!(
        "{}, {}: {}. {}.",
        severity_word(f),
        f.sure.code(),
        crate::text::sanitize(&f.subject, false),
        f.title
    );
    FindingWords {
        headline: style.text(&headline),
        numbers: f.numbers.iter().map(|n| number(n, style)).collect(),
        next_checks: f.next_checks.iter().map(|c| style.text(c)).collect(),
        caution: style.text(f.caution.text()),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diagnose::{Measured, Rule, Severity, Sure};
    use crate::units::Dimension;

    #[test]
    fn a_finding_reads_with_its_range_in_bar_and_ascii_when_asked() {
        let f = Finding::new(
            Rule::DischargeOverLimit,
            Severity::Alarm,
            Sure::Certain,
            "pump P-2",
        )
        .titled("The discharge pressure is above the pump's relief setting".into())
        .number(Number::new(
            "discharge pressure",
            Measured::within(13e5, (12.74e5, 13.26e5)),
            Dimension::Pressure,
        ));
        let w = words(&f, Style::SI);
        assert!(
            w.headline
                .starts_with("ALARM, certain: pump P-2. The discharge"),
            "{}",
            w.headline
        );
        // 13e5 Pa = 13 bar (bar = 10^5 Pa, NIST SP 811).
        assert!(
            w.numbers[0].starts_with("discharge pressure 13"),
            "{}",
            w.numbers[0]
        );
        assert!(w.numbers[0].contains("bar ("), "{}", w.numbers[0]);
        let ascii = words(&f, Style::new(crate::units::UnitSystem::Si, true));
        assert!(ascii.caution.is_ascii() && ascii.headline.is_ascii());
    }
}
