//! The restart answer as JSON (`rheoside restart --json` and the result the Restart view
//! journals): the contract keys (SI) plus the cold case, the gel fit and the
//! notes in words; and the one-line gel summary for the table output.

use crate::line::restart::{GelFit, IntervalBasis, MaxStop};
use crate::session::duration::format_duration;
use crate::session::restart::{RestartAnswer, RestartCase};
use crate::session::restart_words;
use crate::units::{self, Dimension, UnitSystem};
use serde_json::{Value, json};

fn stop_value(stop: MaxStop) -> Value {
    stop.seconds().map_or(Value::Null, |s| json!(s))
}

fn case_json(answer: &RestartAnswer, case: &RestartCase, system: UnitSystem) -> Value {
    let c = &case.check;
    let mut v = json!({
        "restart_pressure_pa": c.pressure.total_pa,
        "available_pressure_pa": c.available_pa,
        "will_restart": c.will_restart(),
        "gel_stress_pa": case.gel_stress_pa,
        "max_stop_s": stop_value(case.max_stop),
        "outcome": c.outcome,
        "rest_s": case.rest_s,
        "plug_pressure_pa": c.pressure.plug_pa,
        "static_pressure_pa": c.pressure.static_pa,
        "back_pressure_pa": c.pressure.back_pressure_pa,
        "design_pressure_pa": c.design_pa,
        "margin_to_available_pa": c.margin_to_available_pa,
        "margin_to_design_pa": c.margin_to_design_pa,
        "allowed_gel_stress_pa": case.allowed_gel_pa,
        "answer": restart_words::headline(answer, case, system),
        "safe_stop": restart_words::safe_stop(case),
    });
    if let Some(b) = case.max_stop_band {
        v["max_stop_band_s"] = json!([stop_value(b.low), stop_value(b.high)]);
    }
    if let Some((lo, hi)) = case.pressure_band_pa {
        v["restart_pressure_band_pa"] = json!([lo, hi]);
    }
    if let Some((lo, hi)) = case.gel_band_pa {
        v["gel_stress_band_pa"] = json!([lo, hi]);
    }
    v
}

/// The whole answer as one JSON object; the `now` case's keys sit at the top level.
pub fn json(answer: &RestartAnswer, system: UnitSystem) -> Value {
    let mut v = case_json(answer, &answer.now, system);
    v["limit_source"] = json!(answer.input.limit_source);
    v["margin"] = json!(answer.input.margin);
    v["gel"] = gel_json(&answer.input.gel);
    if let (Some(cold), Some(c)) = (&answer.cold, answer.input.cold) {
        let mut cj = case_json(answer, cold, system);
        cj["temperature_k"] = json!(c.temperature_k);
        cj["gel_factor"] = json!(c.gel_factor);
        cj["consistency_factor"] = json!(c.consistency_factor);
        v["coldest"] = cj;
    }
    let words = |it: Vec<String>| Value::from(it);
    v["assumptions"] = words(
        answer
            .assumptions
            .iter()
            .map(|a| restart_words::assumption(a, system))
            .collect(),
    );
    v["next_steps"] = words(
        answer
            .next_steps
            .iter()
            .map(|s| restart_words::next_step(*s).to_string())
            .collect(),
    );
    v["cautions"] = words(
        answer
            .cautions
            .iter()
            .map(|c| restart_words::caution(*c).to_string())
            .collect(),
    );
    v
}

fn gel_json(gel: &GelFit) -> Value {
    let c = &gel.curve;
    let mut v = json!({
        "initial_pa": c.initial_pa,
        "long_rest_pa": c.long_rest_pa,
        "time_constant_s": c.time_constant_s,
        "kind": gel.kind,
        "interval_basis": gel.basis,
        "readings": gel.readings,
    });
    if let Some(ci) = gel.ci95() {
        v["initial_ci95_pa"] = json!([ci[0].0, ci[0].1]);
        v["long_rest_ci95_pa"] = json!([ci[1].0, ci[1].1]);
        v["time_constant_ci95_s"] = json!([ci[2].0, ci[2].1]);
    }
    v
}

/// "Gel build-up: 120 Pa at the stop, 520 Pa after a long rest, time constant 2 h (…)".
pub fn gel_line(gel: &GelFit, system: UnitSystem) -> String {
    let c = &gel.curve;
    let s = |pa| units::format(pa, Dimension::Stress, system);
    let ci = gel.ci95();
    // Stresses and the time constant cannot go below zero: the band is shown clamped there.
    let stress = |i: usize, v: f64| {
        let band = ci.map(|ci| (ci[i].0.max(0.0), ci[i].1));
        restart_words::with_band(v, band, Dimension::Stress, system)
    };
    let dur = |x: f64| format_duration(x.max(0.0));
    let tr_band = ci
        .map(|ci| format!(" ({} to {})", dur(ci[2].0), dur(ci[2].1)))
        .unwrap_or_default();
    let basis = match gel.basis {
        IntervalBasis::Scatter { dof } => {
            format!("; 95 % intervals from the readings' scatter ({dof} dof)")
        }
        IntervalBasis::AssumedReadingError { relative_sd } => {
            format!(
                "; 95 % intervals assume ±{:.0} % per reading",
                relative_sd * 100.0
            )
        }
        IntervalBasis::None => String::new(),
    };
    if c.initial_pa == c.long_rest_pa {
        return format!("Gel stress: {} at any stop", s(c.initial_pa));
    }
    format!(
        "Gel build-up: {} at the stop, {} after a long rest, time constant {}{tr_band}{basis}",
        stress(0, c.initial_pa),
        stress(1, c.long_rest_pa),
        dur(c.time_constant_s),
    )
}
