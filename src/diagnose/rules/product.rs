//! Rules on the product: outside its spec limits, far from its own trend, read far from its
//! reference temperature.

use crate::diagnose::{
    Caution, Finding, LimitFacts, Measured, Number, Rule, SetFacts, Severity, Sure, TrendFacts,
};
use crate::units::Dimension;

/// Earlier sets needed before a trend is judged (common practice, no source).
pub const TREND_MIN_EARLIER: usize = 3;
/// Far from the trend: more than this many standard deviations of the earlier values from
/// their mean (Shewhart's 3-sigma control limits, from memory: Montgomery, *Introduction to
/// Statistical Quality Control*, ch. 5).
pub const TREND_SIGMAS: f64 = 3.0;
/// … and more than this share of the mean, so a very steady product is not flagged for
/// noise (common practice, no source).
pub const TREND_MIN_SHARE: f64 = 0.10;
/// A set read further than this from the product's reference temperature is worth a note:
/// viscosity often changes by several per cent a kelvin (common practice, no source).
pub const TEMPERATURE_GAP_K: f64 = 5.0;

pub fn check(s: &SetFacts) -> Vec<Finding> {
    let mut out: Vec<Finding> = s.limits.iter().filter_map(|l| out_of_spec(s, l)).collect();
    out.extend(s.trend.iter().filter_map(|t| far_from_trend(s, t)));
    out.extend(far_from_reference(s));
    out
}

fn out_of_spec(s: &SetFacts, l: &LimitFacts) -> Option<Finding> {
    let above = l
        .max
        .and_then(|hi| Some((l.value.sure_above(hi)?, "above", hi)));
    let below = l
        .min
        .and_then(|lo| Some((l.value.sure_below(lo)?, "below", lo)));
    let (sure, side, limit) = above.or(below)?;
    let severity = match sure {
        Sure::Possible => Severity::Caution,
        _ => Severity::Alarm,
    };
    let title = match sure {
        Sure::Possible => format!(
            "The product's {} may be {side} its spec limit: the value is inside, its interval reaches past",
            l.property
        ),
        _ => format!(
            "The product is out of spec: {} is {side} its limit",
            l.property
        ),
    };
    let limit_name = if side == "above" {
        "spec maximum"
    } else {
        "spec minimum"
    };
    Some(
        Finding::new(Rule::OutOfSpec, severity, sure, &s.subject)
            .titled(title)
            .number(Number::new(&l.property, l.value, l.dimension))
            .number(Number::plain(limit_name, limit, l.dimension))
            .checks(&[
                "hold the batch until a second sample confirms it",
                "check the recipe, the solids content and the batch temperature",
                "read a fresh sample at the reference temperature",
            ])
            .caution(Caution::StopAgitator),
    )
}

/// Mean and sample standard deviation.
fn mean_sd(xs: &[f64]) -> (f64, f64) {
    let n = xs.len() as f64;
    let mean = xs.iter().sum::<f64>() / n;
    let var = xs.iter().map(|x| (x - mean).powi(2)).sum::<f64>() / (n - 1.0).max(1.0);
    (mean, var.sqrt())
}

fn far_from_trend(s: &SetFacts, t: &TrendFacts) -> Option<Finding> {
    if t.earlier.len() < TREND_MIN_EARLIER || !t.value.is_finite() {
        return None;
    }
    let (mean, sd) = mean_sd(&t.earlier);
    let gap = (t.value - mean).abs();
    if gap <= TREND_SIGMAS * sd || gap <= TREND_MIN_SHARE * mean.abs() {
        return None;
    }
    let band = (mean - TREND_SIGMAS * sd, mean + TREND_SIGMAS * sd);
    Some(
        Finding::new(
            Rule::FarFromTrend,
            Severity::Caution,
            Sure::Likely,
            &s.subject,
        )
        .titled(format!(
            "The product's {} is far from its own trend (more than 3 standard deviations)",
            t.property
        ))
        .number(Number::plain(&t.property, t.value, t.dimension))
        .number(Number::new(
            &format!("mean of {} earlier sets", t.earlier.len()),
            Measured::within(mean, band),
            t.dimension,
        ))
        .checks(&[
            "check it is the right batch and the right product name",
            "check the sample temperature and the viscometer's calibration",
            "read a second sample",
        ])
        .caution(Caution::SampleSafely),
    )
}

fn far_from_reference(s: &SetFacts) -> Option<Finding> {
    let (t, reference) = (s.temperature_k?, s.reference_k?);
    if (t - reference).abs() <= TEMPERATURE_GAP_K {
        return None;
    }
    let (severity, title) = if s.shifted_to_reference {
        (
            Severity::Information,
            "The set was read far from the product's reference temperature; limits were checked \
             on constants shifted by the activation energy",
        )
    } else {
        (
            Severity::Caution,
            "The set was read far from the product's reference temperature, and with no \
             activation energy the limits were checked on the constants as read",
        )
    };
    Some(
        Finding::new(
            Rule::FarFromReferenceTemperature,
            severity,
            Sure::Certain,
            &s.subject,
        )
        .titled(title.into())
        .number(Number::plain(
            "reading temperature",
            t,
            Dimension::Temperature,
        ))
        .number(Number::plain(
            "reference temperature",
            reference,
            Dimension::Temperature,
        ))
        .checks(&[
            "bring the sample to the reference temperature and read again",
            "give the product's activation energy in the site config",
        ])
        .caution(Caution::SampleSafely),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn limit(value: Measured, min: Option<f64>, max: Option<f64>) -> SetFacts {
        SetFacts {
            subject: "set 2".into(),
            limits: vec![LimitFacts {
                property: "consistency index K".into(),
                dimension: Dimension::Dimensionless,
                value,
                min,
                max,
            }],
            ..SetFacts::default()
        }
    }

    #[test]
    fn out_of_spec_fires_above_the_maximum_and_below_the_minimum() {
        let f = check(&limit(
            Measured::within(40.0, (35.0, 45.0)),
            None,
            Some(16.0),
        ));
        assert_eq!(f.len(), 1);
        assert_eq!(
            (f[0].rule, f[0].severity, f[0].sure),
            (Rule::OutOfSpec, Severity::Alarm, Sure::Certain)
        );
        let f = check(&limit(Measured::exact(5.0), Some(8.0), None));
        assert_eq!((f[0].severity, f[0].sure), (Severity::Alarm, Sure::Likely));
        assert!(
            check(&limit(
                Measured::within(12.0, (11.0, 13.0)),
                Some(8.0),
                Some(16.0)
            ))
            .is_empty()
        );
    }

    #[test]
    fn an_interval_reaching_past_the_limit_is_a_possible_caution() {
        let f = check(&limit(
            Measured::within(15.0, (13.0, 17.0)),
            None,
            Some(16.0),
        ));
        assert_eq!(
            (f[0].severity, f[0].sure),
            (Severity::Caution, Sure::Possible)
        );
    }

    fn trend(value: f64, earlier: &[f64]) -> SetFacts {
        SetFacts {
            subject: "set 2".into(),
            trend: vec![TrendFacts {
                property: "K".into(),
                dimension: Dimension::Dimensionless,
                value,
                earlier: earlier.to_vec(),
            }],
            ..SetFacts::default()
        }
    }

    // Derived: earlier 10, 11, 12 have mean 11 and sample sd 1, so the 3-sigma band is 8 to 14.
    #[test]
    fn far_from_trend_fires_outside_three_sigma_only() {
        assert_eq!(
            check(&trend(14.5, &[10.0, 11.0, 12.0]))[0].rule,
            Rule::FarFromTrend
        );
        assert!(check(&trend(13.9, &[10.0, 11.0, 12.0])).is_empty());
        // Too few earlier sets to judge.
        assert!(check(&trend(100.0, &[10.0, 11.0])).is_empty());
    }

    fn temps(t: f64, shifted: bool) -> SetFacts {
        SetFacts {
            subject: "set 2".into(),
            temperature_k: Some(t),
            reference_k: Some(298.15),
            shifted_to_reference: shifted,
            ..SetFacts::default()
        }
    }

    #[test]
    fn far_from_reference_fires_beyond_five_kelvin() {
        let f = check(&temps(310.0, false));
        assert_eq!(
            (f[0].rule, f[0].severity),
            (Rule::FarFromReferenceTemperature, Severity::Caution)
        );
        assert_eq!(
            check(&temps(310.0, true))[0].severity,
            Severity::Information
        );
        assert!(check(&temps(302.0, false)).is_empty());
    }
}
