//! The one order findings are shown in: severity (alarms first), then how sure (certain
//! first), then the rule's place in [`super::Rule`], then the subject, then the title. Every
//! key is a total order, so the same facts in any order give the same list.

use super::Finding;
use std::cmp::Ordering;

/// Sort into the ranking order (stable: findings equal on every key keep their order).
pub fn rank(findings: &mut [Finding]) {
    findings.sort_by(order);
}

/// The ranking order of two findings.
pub fn order(a: &Finding, b: &Finding) -> Ordering {
    a.severity
        .cmp(&b.severity)
        .then(a.sure.cmp(&b.sure))
        .then(a.rule.cmp(&b.rule))
        .then_with(|| a.subject.cmp(&b.subject))
        .then_with(|| a.title.cmp(&b.title))
}

#[cfg(test)]
mod tests {
    use crate::diagnose::*;

    fn pump(subject: &str, discharge: f64) -> PumpFacts {
        PumpFacts {
            subject: subject.into(),
            kind: PumpType::PositiveDisplacement,
            discharge_pa: Some(Measured::within(
                discharge,
                (0.98 * discharge, 1.02 * discharge),
            )),
            max_discharge_pa: Some(14e5),
            relief_pa: Some(12e5),
            flow_m3_s: None,
            bep_flow_m3_s: None,
            flow_index: Some(Measured::within(1.1, (0.9, 1.3))),
        }
    }

    fn facts() -> Facts {
        Facts {
            sets: vec![SetFacts {
                subject: "set 3".into(),
                dials: vec![Dial {
                    row: 1,
                    rpm: 600.0,
                    dial: 300.0,
                }],
                full_scale_dial: Some(300.0),
                fit: Some(FitFacts {
                    r_squared: 0.5,
                    residual_pattern: None,
                    yield_stress_pa: None,
                }),
                ..SetFacts::default()
            }],
            // P-3 at 11.9 bar is "possible" (its band reaches the 12 bar relief), P-2 and P-1
            // "certain"; equal keys fall to the subject.
            pumps: vec![
                pump("pump P-3", 11.9e5),
                pump("pump P-2", 13e5),
                pump("pump P-1", 15e5),
            ],
            ..Facts::default()
        }
    }

    fn key(f: &Finding) -> (Severity, Sure, Rule, String) {
        (f.severity, f.sure, f.rule, f.subject.clone())
    }

    #[test]
    fn ranking_is_severity_then_sureness_then_rule_then_subject() {
        let ranked = diagnose(&facts());
        let keys: Vec<_> = ranked.iter().map(key).collect();
        let mut sorted = keys.clone();
        sorted.sort();
        assert_eq!(keys, sorted);
        assert_eq!(keys[0].3, "pump P-1");
        assert_eq!(keys[1].3, "pump P-2");
        assert_eq!(keys[0].0, Severity::Alarm);
        assert!(
            keys.iter()
                .any(|k| k.0 == Severity::Caution && k.1 == Sure::Possible)
        );
    }

    #[test]
    fn ranking_does_not_depend_on_the_order_of_the_facts() {
        let a = diagnose(&facts());
        let mut f = facts();
        f.pumps.reverse();
        let mut b = diagnose(&f);
        assert_eq!(a, b);
        // Ranking a ranked list again changes nothing, from any starting order.
        b.reverse();
        rank(&mut b);
        assert_eq!(a, b);
    }

    // Derived from the definitions in `Measured::sure_above`.
    #[test]
    fn sureness_comes_from_where_the_interval_lies() {
        let m = |v, lo, hi| Measured::within(v, (lo, hi));
        assert_eq!(m(12.0, 11.0, 13.0).sure_above(10.0), Some(Sure::Certain));
        assert_eq!(m(12.0, 9.0, 13.0).sure_above(10.0), Some(Sure::Likely));
        assert_eq!(m(9.0, 8.0, 11.0).sure_above(10.0), Some(Sure::Possible));
        assert_eq!(m(9.0, 8.0, 9.5).sure_above(10.0), None);
        assert_eq!(Measured::exact(12.0).sure_above(10.0), Some(Sure::Likely));
        assert_eq!(m(8.0, 7.0, 9.0).sure_below(10.0), Some(Sure::Certain));
        assert_eq!(m(11.0, 9.0, 12.0).sure_below(10.0), Some(Sure::Possible));
    }
}
