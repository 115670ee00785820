//! The line runs near the laminar–turbulent transition: the pressure drop there is a band,
//! and a small change of flow or temperature moves it a lot.

use crate::diagnose::{Caution, Finding, Number, RegimeFacts, Rule, Severity, Sure};
use crate::units::Dimension;

/// "Near" the transition: Re between these shares of the critical Reynolds number (common
/// practice, no source).
pub const NEAR_TRANSITION: (f64, f64) = (0.8, 1.25);

pub fn check(r: &RegimeFacts) -> Option<Finding> {
    let share = r.reynolds / r.critical_reynolds;
    if !(NEAR_TRANSITION.0..=NEAR_TRANSITION.1).contains(&share) {
        return None;
    }
    Some(
        Finding::new(Rule::NearTransition, Severity::Information, Sure::Likely, &r.subject)
            .titled(
                "The line runs near the laminar–turbulent transition: its pressure drop is a wide band there"
                    .into(),
            )
            .number(Number::plain("flow", r.flow_m3_s, Dimension::Flow))
            .number(Number::plain("Reynolds number", r.reynolds, Dimension::Dimensionless))
            .number(Number::plain(
                "critical Reynolds number",
                r.critical_reynolds,
                Dimension::Dimensionless,
            ))
            .checks(&[
                "allow for the high end of the pressure-drop band",
                "run clearly below or above the transition flow if the process allows",
            ])
            .caution(Caution::WeakestPart),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn facts(re: f64) -> RegimeFacts {
        RegimeFacts {
            subject: "line L-1".into(),
            flow_m3_s: 0.005,
            reynolds: re,
            critical_reynolds: 2100.0,
        }
    }

    #[test]
    fn fires_near_the_critical_reynolds_number_only() {
        assert_eq!(check(&facts(2000.0)).unwrap().rule, Rule::NearTransition);
        assert!(check(&facts(500.0)).is_none());
        assert!(check(&facts(10_000.0)).is_none());
    }
}
