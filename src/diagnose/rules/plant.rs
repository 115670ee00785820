//! The viscometer and the plant disagree: the line's pressure drop or the motor's power is
//! not what the viscometer's curve predicts.

use crate::diagnose::{Caution, Finding, Number, PlantFacts, PlantSignal, Rule, Severity, Sure};

pub fn check(p: &PlantFacts) -> Option<Finding> {
    let ratio = p.measured / p.predicted.value;
    if !ratio.is_finite() || (p.agree.0..=p.agree.1).contains(&ratio) {
        return None;
    }
    // Outside the prediction's own band as well: the curve's uncertainty does not explain it.
    let outside_band = p
        .predicted
        .interval
        .is_some_and(|(lo, hi)| p.measured < lo || p.measured > hi);
    let sure = if outside_band {
        Sure::Certain
    } else {
        Sure::Likely
    };
    let (what, higher, lower): (&str, &[&str], &[&str]) = match p.signal {
        PlantSignal::LinePressureDrop => (
            "the line's pressure drop",
            &[
                "check the pressure gauges and their tappings (blocked, wrong zero)",
                "check the line temperature: colder product reads thicker",
                "look for a partly closed valve or a build-up in the line",
                "check it is the batch the sample came from",
            ],
            &[
                "wall slip: compare the drop at two flows",
                "air in the product or a gauge reading low",
                "check the flow meter and it is the batch the sample came from",
            ],
        ),
        PlantSignal::MotorPower => (
            "the motor's power",
            &[
                "check the motor reading (one phase, the right motor)",
                "check the tank temperature and the batch",
                "listen for a gearbox or bearing running hard",
            ],
            &[
                "air or foam in the tank, or a lower liquid level than assumed",
                "a cavern: the impeller turns in its own pocket of product",
                "check the motor reading (no-load power, power factor)",
            ],
        ),
    };
    let (side, checks) = if ratio > 1.0 {
        ("higher", higher)
    } else {
        ("lower", lower)
    };
    Some(
        Finding::new(Rule::PlantDisagrees, Severity::Caution, sure, &p.subject)
            .titled(format!(
                "The viscometer and the plant disagree: {what} reads {side} than the curve predicts"
            ))
            .number(Number::plain("measured", p.measured, p.dimension))
            .number(Number::new(
                "predicted from the curve",
                p.predicted,
                p.dimension,
            ))
            .number(Number::plain(
                "measured / predicted",
                ratio,
                crate::units::Dimension::Dimensionless,
            ))
            .checks(checks)
            .caution(match p.signal {
                PlantSignal::LinePressureDrop => Caution::IsolateBeforeOpening,
                PlantSignal::MotorPower => Caution::StopAgitator,
            }),
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diagnose::Measured;
    use crate::units::Dimension;

    fn facts(measured: f64) -> PlantFacts {
        PlantFacts {
            subject: "line L-1".into(),
            signal: PlantSignal::LinePressureDrop,
            measured,
            predicted: Measured::within(1.0e5, (0.9e5, 1.1e5)),
            dimension: Dimension::Pressure,
            agree: (0.85, 1.15),
        }
    }

    // Agreement band ±15 %: the line engine's own (line::AGREE_WITHIN).
    #[test]
    fn fires_outside_the_agreement_band_only() {
        let f = check(&facts(1.5e5)).expect("50 % high disagrees");
        assert_eq!((f.rule, f.sure), (Rule::PlantDisagrees, Sure::Certain));
        assert!(f.title.contains("higher"));
        assert!(check(&facts(1.1e5)).is_none());
        assert!(check(&facts(0.5e5)).unwrap().title.contains("lower"));
    }
}
