//! Which assumptions, cautions and next steps go with a restart answer.

use super::restart::{Assumption, Caution, LimitSource, NextStep, RestartCase, RestartInput};
use crate::line::restart::{GelFitKind, IntervalBasis, MaxStop, Outcome};

/// The assumptions behind this input, in the order they matter.
pub(super) fn assumptions(input: &RestartInput) -> Vec<Assumption> {
    let mut out = vec![Assumption::PlugForceBalance];
    if input.fittings_included {
        out.push(Assumption::FittingsIncluded);
    }
    if input.stopped_for_s.is_none() {
        out.push(Assumption::LongRestNoStopGiven);
    }
    out.extend(gel_assumptions(input));
    if let Some(longest) = beyond_readings(input) {
        out.push(Assumption::BeyondLongestReading {
            longest_rest_s: longest,
        });
    }
    out.push(Assumption::Margin {
        fraction: input.margin,
        default: input.margin_is_default,
    });
    match input.limit_source {
        LimitSource::MotorTorque => out.push(Assumption::MotorNoLosses),
        LimitSource::ShutOffHead => out.push(Assumption::ShutOffUncorrected),
        _ => {}
    }
    if let Some(c) = input.cold {
        if let Some(f) = c.gel_factor {
            out.push(Assumption::ColdGelFactor { factor: f });
        }
        if let Some(f) = c.consistency_factor {
            out.push(Assumption::ColdConsistency { factor: f });
        }
    }
    out
}

/// The longest rest read, when the stop judged (or a long rest) goes past it.
fn beyond_readings(input: &RestartInput) -> Option<f64> {
    let longest = input
        .gel
        .readings
        .iter()
        .map(|r| r.rest_s)
        .fold(None, |m: Option<f64>, t| Some(m.map_or(t, |m| m.max(t))))?;
    let judged = input.stopped_for_s.unwrap_or(f64::INFINITY);
    (judged > longest).then_some(longest)
}

fn gel_assumptions(input: &RestartInput) -> Vec<Assumption> {
    if input.single_gel_stress {
        return vec![Assumption::SingleGelStress];
    }
    let gel = &input.gel;
    let mut out = vec![Assumption::GelLinearInStructure];
    let tr = gel.curve.time_constant_s;
    match gel.kind {
        GelFitKind::TwoReadingsTimeConstantAssumed => out.push(Assumption::TimeConstantAssumed {
            time_constant_s: tr,
        }),
        GelFitKind::TwoReadingsTimeConstantGiven => out.push(Assumption::TimeConstantFromSite {
            time_constant_s: tr,
        }),
        GelFitKind::StillBuilding => {
            let longest = gel.readings.last().map_or(0.0, |r| r.rest_s);
            out.push(Assumption::StillBuilding {
                longest_rest_s: longest,
            })
        }
        _ => {}
    }
    match gel.basis {
        IntervalBasis::AssumedReadingError { relative_sd } => {
            out.push(Assumption::ReadingErrorAssumed { relative_sd });
            out.push(Assumption::LinearPropagation);
        }
        IntervalBasis::Scatter { .. } => out.push(Assumption::LinearPropagation),
        IntervalBasis::None => out.push(Assumption::GelGivenNoInterval),
    }
    out
}

/// The cautions: always the relief, the weakest part, lock-out, heating a blocked-in line
/// and that the tool only advises; plus cold where the site gives no gel factor.
pub(super) fn cautions(input: &RestartInput) -> Vec<Caution> {
    let mut out = vec![
        Caution::NeverRaiseRelief,
        Caution::WeakestPart,
        Caution::IsolateBeforeOpening,
        Caution::BlockedInHeated,
        Caution::HotProduct,
    ];
    if input.cold.is_some_and(|c| c.gel_factor.is_none()) {
        out.push(Caution::ColdRaisesGel);
    }
    out.push(Caution::AdvisesOnly);
    out
}

/// What to do next, from how the answer came out.
pub(super) fn next_steps(
    input: &RestartInput,
    now: &RestartCase,
    cold: Option<&RestartCase>,
) -> Vec<NextStep> {
    let mut out = Vec::new();
    let stuck = now.check.outcome != Outcome::Restarts;
    let limited =
        |c: &RestartCase| matches!(c.max_stop, MaxStop::After(_) | MaxStop::AlreadyTooLate);
    if stuck {
        out.extend([NextStep::WarmTheLine, NextStep::RestartInSections]);
        if input.line.static_pa + input.line.back_pressure_pa > 0.0 {
            out.push(NextStep::LowerStaticHead);
        }
    }
    if limited(now) || cold.is_some_and(limited) {
        out.extend([NextStep::KeepStopsShort, NextStep::FlushBeforeLongStops]);
    }
    let few = input.gel.readings.len() < 4 && !input.gel.readings.is_empty();
    if few || input.single_gel_stress {
        out.push(NextStep::TakeMoreReadings);
    }
    out
}
