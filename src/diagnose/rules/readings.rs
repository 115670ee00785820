//! Rules on the dial readings themselves: off scale, pegged, low on the scale, out of
//! speed order.

use crate::diagnose::{Caution, Finding, Number, Rule, SetFacts, Severity, Sure};
use crate::units::Dimension;

/// Below this share of full scale a dial reading carries a large share of the instrument's
/// own error (rotational viscometer makers advise 10 % to 100 % of scale; common practice,
/// no source).
pub const LOW_SCALE_FRACTION: f64 = 0.10;

pub fn check(s: &SetFacts) -> Vec<Finding> {
    let mut out = Vec::new();
    if let Some(full) = s.full_scale_dial {
        out.extend(off_scale(s, full));
        out.extend(pegged(s, full));
        out.extend(low_on_scale(s, full));
    }
    out.extend(speed_order(s));
    out
}

fn rows(rows: &[usize]) -> String {
    let list: Vec<String> = rows.iter().map(ToString::to_string).collect();
    list.join(", ")
}

/// A dial above its full scale cannot be read: the value was misread or mistyped.
fn off_scale(s: &SetFacts, full: f64) -> Option<Finding> {
    let over: Vec<_> = s.dials.iter().filter(|d| d.dial > full).collect();
    let first = over.first()?;
    let list: Vec<usize> = over.iter().map(|d| d.row).collect();
    Some(
        Finding::new(Rule::OffScale, Severity::Caution, Sure::Certain, &s.subject)
            .titled(format!(
                "Reading {} is above the dial's full scale: misread or mistyped; left out of the fit",
                rows(&list)
            ))
            .number(Number::plain("dial", first.dial, Dimension::Dimensionless))
            .number(Number::plain("full scale", full, Dimension::Dimensionless))
            .checks(&[
                "check the value against the operator's sheet",
                "read that speed again, with a stiffer spring if it pegs",
            ])
            .caution(Caution::SampleSafely),
    )
}

/// A dial at exactly full scale only says "at least this much".
fn pegged(s: &SetFacts, full: f64) -> Option<Finding> {
    let at: Vec<_> = s.dials.iter().filter(|d| d.dial == full).collect();
    let first = at.first()?;
    let list: Vec<usize> = at.iter().map(|d| d.row).collect();
    Some(
        Finding::new(Rule::Pegged, Severity::Caution, Sure::Certain, &s.subject)
            .titled(format!(
                "Reading {} is pegged at full scale: the stress is at least that; left out of the fit",
                rows(&list)
            ))
            .number(Number::plain("rpm", first.rpm, Dimension::Dimensionless))
            .number(Number::plain("dial", first.dial, Dimension::Dimensionless))
            .checks(&[
                "read again at a lower speed",
                "use a stiffer spring or a smaller bob for this product",
            ])
            .caution(Caution::SampleSafely),
    )
}

/// Readings below [`LOW_SCALE_FRACTION`] of full scale (zero is left to the fit's checks).
fn low_on_scale(s: &SetFacts, full: f64) -> Option<Finding> {
    let low: Vec<_> = s
        .dials
        .iter()
        .filter(|d| d.dial > 0.0 && d.dial < LOW_SCALE_FRACTION * full)
        .collect();
    let first = low.first()?;
    let list: Vec<usize> = low.iter().map(|d| d.row).collect();
    Some(
        Finding::new(
            Rule::LowOnScale,
            Severity::Information,
            Sure::Certain,
            &s.subject,
        )
        .titled(format!(
            "Reading {} is below 10 % of the dial's scale: its error is a large share of it",
            rows(&list)
        ))
        .number(Number::plain("dial", first.dial, Dimension::Dimensionless))
        .number(Number::plain(
            "10 % of full scale",
            LOW_SCALE_FRACTION * full,
            Dimension::Dimensionless,
        ))
        .checks(&["use a softer spring or a larger bob for the low speeds"])
        .caution(Caution::SampleSafely),
    )
}

/// A higher dial at a lower speed: thixotropy, settling, slip or a misread.
fn speed_order(s: &SetFacts) -> Option<Finding> {
    let &(slow, fast) = s.reversed.first()?;
    let dial = |row: usize| s.dials.iter().find(|d| d.row == row);
    let mut f = Finding::new(
        Rule::SpeedOrder,
        Severity::Caution,
        Sure::Certain,
        &s.subject,
    )
    .titled(format!(
        "Readings out of speed order: row {slow} reads higher than row {fast} at a higher speed"
    ))
    .checks(&[
        "check the time between readings (thixotropy) and settling in the cup",
        "look for wall slip (a smooth bob) or a misread dial",
        "read the set again from the highest speed down, the same time at each",
    ])
    .caution(Caution::SampleSafely);
    for row in [slow, fast] {
        if let Some(d) = dial(row) {
            f = f
                .number(Number::plain(
                    &format!("row {row} rpm"),
                    d.rpm,
                    Dimension::Dimensionless,
                ))
                .number(Number::plain(
                    &format!("row {row} dial"),
                    d.dial,
                    Dimension::Dimensionless,
                ));
        }
    }
    Some(f)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diagnose::Dial;

    fn set(dials: &[(f64, f64)]) -> SetFacts {
        SetFacts {
            subject: "set 2".into(),
            dials: dials
                .iter()
                .enumerate()
                .map(|(i, &(rpm, dial))| Dial {
                    row: i + 1,
                    rpm,
                    dial,
                })
                .collect(),
            full_scale_dial: Some(300.0),
            ..SetFacts::default()
        }
    }

    fn rules(s: &SetFacts) -> Vec<Rule> {
        check(s).iter().map(|f| f.rule).collect()
    }

    // Thresholds: full scale 300 is the standard six-speed instrument's dial; 10 % is the
    // common-practice floor above.
    #[test]
    fn off_scale_fires_above_full_scale_only() {
        assert_eq!(rules(&set(&[(600.0, 301.0)])), vec![Rule::OffScale]);
        assert!(rules(&set(&[(600.0, 299.0)])).is_empty());
    }

    #[test]
    fn pegged_fires_at_full_scale_only() {
        assert_eq!(rules(&set(&[(600.0, 300.0)])), vec![Rule::Pegged]);
        assert!(!rules(&set(&[(600.0, 299.9)])).contains(&Rule::Pegged));
    }

    #[test]
    fn low_on_scale_fires_below_ten_percent() {
        assert_eq!(rules(&set(&[(3.0, 29.0)])), vec![Rule::LowOnScale]);
        assert!(rules(&set(&[(3.0, 30.0)])).is_empty());
        // A zero dial is not "low": it is left to the fit.
        assert!(rules(&set(&[(3.0, 0.0)])).is_empty());
    }

    #[test]
    fn speed_order_fires_on_a_reversed_pair_only() {
        let mut s = set(&[(6.0, 50.0), (3.0, 60.0)]);
        s.reversed = vec![(2, 1)];
        let f = check(&s);
        assert_eq!(f.len(), 1);
        assert_eq!(f[0].rule, Rule::SpeedOrder);
        assert!(f[0].title.contains("row 2"));
        assert!(rules(&set(&[(6.0, 60.0), (3.0, 50.0)])).is_empty());
    }
}
