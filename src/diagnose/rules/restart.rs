//! Rules on a line's restart after a stop: it will not restart, its margin is thin, or the
//! stop is longer than the longest safe stop.

use crate::diagnose::{Caution, Finding, Number, RestartFacts, Rule, Severity, Sure};
use crate::units::Dimension;

pub fn check(r: &RestartFacts) -> Vec<Finding> {
    let mut out = Vec::new();
    out.extend(will_not_restart(r).or_else(|| thin_margin(r)));
    out.extend(stop_too_long(r));
    out
}

fn numbers(f: Finding, r: &RestartFacts) -> Finding {
    f.number(Number::new(
        "pressure needed to restart",
        r.needed_pa,
        Dimension::Pressure,
    ))
    .number(Number::plain(
        "usable pressure (pump or line, the lower)",
        r.usable_pa,
        Dimension::Pressure,
    ))
}

fn will_not_restart(r: &RestartFacts) -> Option<Finding> {
    let sure = r.needed_pa.sure_above(r.usable_pa)?;
    let (severity, title) = match sure {
        Sure::Possible => (
            Severity::Caution,
            format!(
                "The line may not restart {}: the high end of the band needs more than the pump or the line allows",
                r.when
            ),
        ),
        _ => (
            Severity::Alarm,
            format!(
                "The line will not restart {}: breaking the gel needs more than the pump or the line allows",
                r.when
            ),
        ),
    };
    let f = Finding::new(Rule::LineWillNotRestart, severity, sure, &r.subject)
        .titled(title)
        .checks(&[
            "do not raise the relief setting or push past the line's rating",
            "warm the line, or restart it in sections",
            "lower the static head or the back-pressure before the start",
            "keep stops short, or flush the line before a long one",
        ])
        .caution(Caution::WeakestPart);
    Some(numbers(f, r))
}

/// Needed pressure above the usable pressure less the margin, but not above the usable.
fn thin_margin(r: &RestartFacts) -> Option<Finding> {
    let keep = r.usable_pa * (1.0 - r.margin);
    let sure = r.needed_pa.sure_above(keep)?;
    let f = Finding::new(Rule::ThinRestartMargin, Severity::Caution, sure, &r.subject)
        .titled(format!(
            "The restart margin is thin {}: breaking the gel needs most of what the pump or the line allows",
            r.when
        ))
        .number(Number::plain(
            "margin kept in hand",
            r.margin,
            Dimension::Fraction,
        ))
        .checks(&[
            "keep stops short",
            "measure the gel strength after a stop like the planned one",
        ])
        .caution(Caution::WeakestPart);
    Some(numbers(f, r))
}

fn stop_too_long(r: &RestartFacts) -> Option<Finding> {
    let (stop, longest) = (r.stop_s?, r.longest_safe_stop_s?);
    // Sure that the stop is longer: the longest safe stop below the stop, judged on its band.
    let sure = longest.sure_below(stop)?;
    let severity = match sure {
        Sure::Possible => Severity::Caution,
        _ => Severity::Alarm,
    };
    Some(
        Finding::new(Rule::StopTooLong, severity, sure, &r.subject)
            .titled(format!(
                "The stop is longer than the longest safe stop {}: the gel may be too strong to break",
                r.when
            ))
            .number(Number::plain("stop", stop, Dimension::Time))
            .number(Number::new("longest safe stop", longest, Dimension::Time))
            .checks(&[
                "work out the restart pressure for this stop before starting",
                "warm or flush the line before restarting",
                "shorten planned stops, or flush before them",
            ])
            .caution(Caution::WeakestPart),
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diagnose::Measured;

    fn facts(needed: f64, band_pa: (f64, f64)) -> RestartFacts {
        RestartFacts {
            subject: "line L-2".into(),
            needed_pa: Measured::within(needed, band_pa),
            usable_pa: 12e5,
            margin: 0.10,
            stop_s: None,
            longest_safe_stop_s: None,
            when: "now".into(),
        }
    }

    fn rules(r: &RestartFacts) -> Vec<(Rule, Severity)> {
        check(r).iter().map(|f| (f.rule, f.severity)).collect()
    }

    // Derived: usable 12 bar less a 10 % margin keeps 10.8 bar in hand.
    #[test]
    fn will_not_restart_fires_above_the_usable_pressure() {
        assert_eq!(
            rules(&facts(14e5, (13e5, 15e5))),
            vec![(Rule::LineWillNotRestart, Severity::Alarm)]
        );
        assert!(rules(&facts(5e5, (4e5, 6e5))).is_empty());
    }

    #[test]
    fn thin_margin_fires_between_the_margin_and_the_limit() {
        assert_eq!(
            rules(&facts(11.2e5, (11.0e5, 11.4e5))),
            vec![(Rule::ThinRestartMargin, Severity::Caution)]
        );
        assert!(rules(&facts(10e5, (9.5e5, 10.5e5))).is_empty());
    }

    #[test]
    fn stop_too_long_fires_when_the_stop_exceeds_the_longest_safe_stop() {
        let mut r = facts(5e5, (4e5, 6e5));
        r.stop_s = Some(8.0 * 3600.0);
        r.longest_safe_stop_s = Some(Measured::within(3600.0, (3000.0, 4000.0)));
        assert_eq!(rules(&r), vec![(Rule::StopTooLong, Severity::Alarm)]);
        r.stop_s = Some(600.0);
        assert!(rules(&r).is_empty());
        // Any stop restarts: nothing to compare.
        r.stop_s = Some(1e9);
        r.longest_safe_stop_s = None;
        assert!(rules(&r).is_empty());
    }
}
