//! Rules on the fitted curve: a poor fit, residuals in a pattern, a yield stress that may be
//! zero.

use crate::diagnose::{Caution, Finding, Measured, Number, Rule, SetFacts, Severity, Sure};
use crate::units::Dimension;

/// R² below which a fit is called poor (common practice, no source; the same value the
/// flow-curve checks use).
pub const POOR_R_SQUARED: f64 = 0.9;

pub fn check(s: &SetFacts) -> Vec<Finding> {
    let Some(fit) = &s.fit else {
        return Vec::new();
    };
    let mut out = Vec::new();
    if fit.r_squared < POOR_R_SQUARED {
        out.push(poor_fit(s, fit.r_squared));
    }
    if let Some(pattern) = fit.residual_pattern {
        out.push(residual_pattern(s, pattern));
    }
    if let Some(tau0) = fit.yield_stress_pa {
        out.extend(yield_may_be_zero(s, tau0));
    }
    out
}

fn poor_fit(s: &SetFacts, r2: f64) -> Finding {
    Finding::new(Rule::PoorFit, Severity::Caution, Sure::Certain, &s.subject)
        .titled(
            "Poor fit: the curve does not follow these readings; do not use its constants yet"
                .into(),
        )
        .number(Number::plain("R²", r2, Dimension::Dimensionless))
        .number(Number::plain(
            "poor below",
            POOR_R_SQUARED,
            Dimension::Dimensionless,
        ))
        .checks(&[
            "read the set again on a fresh sample",
            "look for pegged, reversed or mistyped readings",
            "try another model by hand and compare",
        ])
        .caution(Caution::SampleSafely)
}

fn residual_pattern(s: &SetFacts, (runs, longest, points): (usize, usize, usize)) -> Finding {
    Finding::new(
        Rule::ResidualPattern,
        Severity::Information,
        Sure::Likely,
        &s.subject,
    )
    .titled(
        "The curve misses the readings in a pattern: another model may fit, or the sample changed"
            .into(),
    )
    .number(Number::plain(
        "runs of one sign",
        runs as f64,
        Dimension::Dimensionless,
    ))
    .number(Number::plain(
        "longest run",
        longest as f64,
        Dimension::Dimensionless,
    ))
    .number(Number::plain(
        "points",
        points as f64,
        Dimension::Dimensionless,
    ))
    .checks(&[
        "compare the other models' fits",
        "check the sample for settling or drying during the set",
    ])
    .caution(Caution::SampleSafely)
}

/// The 95 % interval of τ0 reaches zero or below: the data do not show a yield stress.
fn yield_may_be_zero(s: &SetFacts, tau0: Measured) -> Option<Finding> {
    let (lo, _) = tau0.interval?;
    if lo > 0.0 || tau0.value <= 0.0 {
        return None;
    }
    Some(
        Finding::new(
            Rule::YieldMayBeZero,
            Severity::Information,
            Sure::Possible,
            &s.subject,
        )
        .titled(
            "The yield stress may be zero: its interval includes zero; do not rely on it for a restart"
                .into(),
        )
        .number(Number::new("yield stress", tau0, Dimension::Stress))
        .checks(&[
            "add readings at the lowest speeds (3 and 6 rpm)",
            "measure the gel or yield stress directly (vane or gel test)",
        ])
        .caution(Caution::SampleSafely),
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diagnose::FitFacts;

    fn set(r2: f64, pattern: Option<(usize, usize, usize)>, tau0: Option<Measured>) -> SetFacts {
        SetFacts {
            subject: "set 2".into(),
            fit: Some(FitFacts {
                r_squared: r2,
                residual_pattern: pattern,
                yield_stress_pa: tau0,
            }),
            ..SetFacts::default()
        }
    }

    fn rules(s: &SetFacts) -> Vec<Rule> {
        check(s).iter().map(|f| f.rule).collect()
    }

    #[test]
    fn poor_fit_fires_below_the_threshold_only() {
        assert_eq!(rules(&set(0.89, None, None)), vec![Rule::PoorFit]);
        assert!(rules(&set(0.90, None, None)).is_empty());
    }

    #[test]
    fn residual_pattern_fires_when_the_fit_reports_one() {
        assert_eq!(
            rules(&set(0.99, Some((2, 5, 6)), None)),
            vec![Rule::ResidualPattern]
        );
        assert!(rules(&set(0.99, None, None)).is_empty());
    }

    #[test]
    fn yield_may_be_zero_fires_when_the_interval_reaches_zero() {
        let wide = Measured::within(2.0, (-1.0, 5.0));
        let tight = Measured::within(2.0, (1.0, 3.0));
        assert_eq!(
            rules(&set(0.99, None, Some(wide))),
            vec![Rule::YieldMayBeZero]
        );
        assert!(rules(&set(0.99, None, Some(tight))).is_empty());
        // No interval: nothing to judge by.
        assert!(rules(&set(0.99, None, Some(Measured::exact(2.0)))).is_empty());
    }
}
