//! The restart answer in words for both faces: the headline, the longest safe stop with its
//! band, what was assumed, what to do next and the cautions.

use super::duration::format_duration;
use super::restart::{Assumption, Caution, LimitSource, NextStep, RestartAnswer, RestartCase};
use crate::line::restart::{MaxStop, Outcome};
use crate::units::{self, Dimension, UnitSystem};

fn p(pa: f64, system: UnitSystem) -> String {
    units::format(pa, Dimension::Pressure, system)
}

/// "13.1 bar (12.6 to 13.6)", or the value alone without a band.
pub fn with_band(
    value: f64,
    band: Option<(f64, f64)>,
    dim: Dimension,
    system: UnitSystem,
) -> String {
    let v = units::format(value, dim, system);
    match band {
        Some((lo, hi)) => {
            let strip = |x: f64| units::format(x, dim, system);
            let unit = format!(" {}", units::display_unit(dim, system));
            format!(
                "{v} ({} to {})",
                strip(lo).trim_end_matches(&unit),
                strip(hi).trim_end_matches(&unit)
            )
        }
        None => v,
    }
}

fn limit_phrase(source: LimitSource) -> &'static str {
    match source {
        LimitSource::Given => "the pump gives",
        LimitSource::Relief => "the relief opens at",
        LimitSource::CasingLimit => "the pump's discharge limit is",
        LimitSource::MotorTorque => "the motor's torque allows",
        LimitSource::ShutOffHead => "the pump's shut-off head gives",
    }
}

/// "will not restart: needs 13.1 bar, the relief opens at 12.0 bar".
pub fn headline(answer: &RestartAnswer, case: &RestartCase, system: UnitSystem) -> String {
    let needs = with_band(
        case.check.pressure.total_pa,
        case.pressure_band_pa,
        Dimension::Pressure,
        system,
    );
    let limit = format!(
        "{} {}",
        limit_phrase(answer.input.limit_source),
        p(case.check.available_pa, system)
    );
    match case.check.outcome {
        Outcome::Restarts => format!("will restart: needs {needs}, {limit}"),
        Outcome::PumpTooWeak => format!("will not restart: needs {needs}, {limit}"),
        Outcome::LineTooWeak => format!(
            "do not force it: needs {needs}, above the line's design pressure of {} (its weakest part)",
            p(case.check.design_pa.unwrap_or(f64::NAN), system)
        ),
    }
}

fn stop_words(stop: MaxStop) -> String {
    match stop {
        MaxStop::Never => "any length".into(),
        MaxStop::AlreadyTooLate => "none".into(),
        MaxStop::After(s) => format_duration(s),
    }
}

/// "longest safe stop about 2 h 53 min (2 h 19 min to 3 h 40 min)".
pub fn safe_stop(case: &RestartCase) -> String {
    let band = case
        .max_stop_band
        .map(|b| format!(" ({} to {})", stop_words(b.low), stop_words(b.high)))
        .unwrap_or_default();
    match case.max_stop {
        MaxStop::Never => format!("any stop restarts: the gel never gets strong enough{band}"),
        MaxStop::AlreadyTooLate => format!(
            "no stop is safe: even freshly stopped product needs more than the pump gives less the margin{band}"
        ),
        MaxStop::After(s) => format!("longest safe stop about {}{band}", format_duration(s)),
    }
}

/// One assumption in words.
pub fn assumption(a: &Assumption, system: UnitSystem) -> String {
    match *a {
        Assumption::PlugForceBalance => "restart pressure from the force balance on the gelled plug, 4·τ_gel·L/D plus static head and back-pressure; it ignores the product's compressibility, so it is conservative for long lines".into(),
        Assumption::FittingsIncluded => "the fittings' equivalent length is counted as gelled line (errs on the safe side)".into(),
        Assumption::LongRestNoStopGiven => "no stop length given: judged after a long rest (the gel fully built)".into(),
        Assumption::SingleGelStress => "one gel stress is taken for any stop; the longest safe stop needs rested-gel readings or the build-up constants".into(),
        Assumption::GelLinearInStructure => "gel builds up at rest as τ(t) = τ∞ − (τ∞ − τi)·e^(−t/tr) (first-order rebuild, static yield stress taken as linear in the structure)".into(),
        Assumption::TimeConstantAssumed { time_constant_s } => format!("two readings cannot fit the time constant; it is assumed equal to the longer rest time, {}", format_duration(time_constant_s)),
        Assumption::TimeConstantFromSite { time_constant_s } => format!(
            "two readings cannot fit the time constant; the value given ({}, from the command line or the site's product) is used",
            format_duration(time_constant_s)
        ),
        Assumption::ReadingErrorAssumed { relative_sd } => format!("three readings fit the three constants exactly; the band assumes each reading good to ±{:.0} % (one standard deviation)", relative_sd * 100.0),
        Assumption::StillBuilding { longest_rest_s } => format!("the gel was still building at the longest rest read ({}); the long-rest strength is an extrapolation", format_duration(longest_rest_s)),
        Assumption::BeyondLongestReading { longest_rest_s } => format!("the readings reach only {} at rest; the answer for a longer stop is an extrapolation of the build-up curve (a reading after a rest as long as the stops you expect narrows it)", format_duration(longest_rest_s)),
        Assumption::GelGivenNoInterval => "the build-up constants carry no interval; the answer has no band".into(),
        Assumption::Margin { fraction, default } => format!("{:.0} % kept below the usable pressure{}", fraction * 100.0, if default { " (default, common practice)" } else { " (site setting)" }),
        Assumption::ColdGelFactor { factor } => format!("at the coldest the gel is {factor:.2} times as strong (the site's factor)"),
        Assumption::ColdConsistency { factor } => format!("at the coldest the flowing product is {factor:.2} times as thick (K or μ by Arrhenius)"),
        Assumption::MotorNoLosses => "the motor's limit ignores mechanical losses, so it overstates what the motor can push".into(),
        Assumption::ShutOffUncorrected => "a centrifugal pump's shut-off head is not lowered by viscosity (the ANSI/HI head factor is 1 at zero flow)".into(),
        Assumption::LinearPropagation => format!("the band carries the gel fit's 95 % intervals by linear propagation (in {})", units::display_unit(Dimension::Pressure, system)),
    }
}

/// One caution in words.
pub fn caution(c: Caution) -> &'static str {
    match c {
        Caution::NeverRaiseRelief => "never raise a relief setting to force a restart",
        Caution::WeakestPart => "never exceed the rated pressure of the weakest part of the line",
        Caution::IsolateBeforeOpening => "isolate and lock out the pump before opening the line",
        Caution::BlockedInHeated => {
            "a blocked-in line that is heated builds pressure: keep a path open when warming it"
        }
        Caution::HotProduct => "the product may be hot: protect against spills when opening",
        Caution::ColdRaisesGel => {
            "cold raises the gel strength and the site gives no factor for it: the cold answer is optimistic"
        }
        Caution::AdvisesOnly => {
            "this tool advises; it does not certify: local codes and licensed practice come first"
        }
    }
}

/// One next step in words.
pub fn next_step(s: NextStep) -> &'static str {
    match s {
        NextStep::WarmTheLine => {
            "warm the line (trace heating, a hot-water jacket) to soften the gel, with a path open"
        }
        NextStep::FlushBeforeLongStops => {
            "flush or displace the line with a thin product before a long stop"
        }
        NextStep::RestartInSections => {
            "restart in sections: open a drain or a spool to push a shorter plug"
        }
        NextStep::LowerStaticHead => {
            "lower the static head or back-pressure: open the outlet, drain the riser"
        }
        NextStep::KeepStopsShort => {
            "keep stops shorter than the longest safe stop, or keep the product moving slowly"
        }
        NextStep::TakeMoreReadings => {
            "take more rested-gel readings (longer rests too) to narrow the answer"
        }
    }
}

/// The whole answer as lines of text.
pub fn lines(answer: &RestartAnswer, system: UnitSystem) -> Vec<String> {
    let mut out = vec![
        format!("Now: {}", headline(answer, &answer.now, system)),
        format!("     {}", safe_stop(&answer.now)),
    ];
    if let (Some(cold), Some(c)) = (&answer.cold, answer.input.cold) {
        let t = units::format(c.temperature_k, Dimension::Temperature, system);
        out.push(format!(
            "At {t} (coldest): {}",
            headline(answer, cold, system)
        ));
        out.push(format!("     {}", safe_stop(cold)));
    }
    out.push("Assumed:".into());
    out.extend(
        answer
            .assumptions
            .iter()
            .map(|a| format!("  - {}", assumption(a, system))),
    );
    if !answer.next_steps.is_empty() {
        out.push("Next:".into());
        out.extend(
            answer
                .next_steps
                .iter()
                .map(|s| format!("  - {}", next_step(*s))),
        );
    }
    out.push("Cautions:".into());
    out.extend(
        answer
            .cautions
            .iter()
            .map(|c| format!("  - {}", caution(*c))),
    );
    out
}
