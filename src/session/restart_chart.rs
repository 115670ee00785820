//! What a Restart view draws: gel strength against rest time (with its band and the readings
//! it came from), and the pump's limit as a gel stress — with and without the margin — so the
//! crossing is the longest safe stop.

use super::restart::{GelPoint, RestartAnswer, RestartCase, gel_points};
use crate::line::restart::{GelReading, MaxStop};

/// One chart, for the answer now or at the coldest.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct RestartChart {
    pub points: Vec<GelPoint>,
    pub readings: Vec<GelReading>,
    /// The gel stress at which the pump's limit (or the line's rating) is reached, Pa.
    pub limit_gel_pa: f64,
    /// The same less the margin: where the longest safe stop is read, Pa.
    pub allowed_gel_pa: f64,
    /// The rest judged (the stop given, or a long rest), s.
    pub judged_rest_s: f64,
    pub max_stop: MaxStop,
}

/// The chart from 0 to `until_s` (0: three times the longer of the safe stop, the stop
/// judged within reason, and the longest reading), `n` points.
pub fn chart(answer: &RestartAnswer, cold: bool, until_s: f64, n: usize) -> Option<RestartChart> {
    let case: &RestartCase = if cold {
        answer.cold.as_ref()?
    } else {
        &answer.now
    };
    let factor = match (cold, answer.input.cold) {
        (true, Some(c)) => c.gel_factor.unwrap_or(1.0),
        _ => 1.0,
    };
    let gel = answer.input.gel.scaled(factor);
    let until = if until_s > 0.0 {
        until_s
    } else {
        span(answer, case)
    };
    let line = &answer.input.line;
    Some(RestartChart {
        points: gel_points(&gel, until, n),
        readings: answer.input.gel.readings.clone(),
        limit_gel_pa: line.gel_stress_for(case.check.usable_pa()),
        allowed_gel_pa: case.allowed_gel_pa,
        judged_rest_s: case.rest_s,
        max_stop: case.max_stop,
    })
}

/// A span that shows the build-up and the crossing.
fn span(answer: &RestartAnswer, case: &RestartCase) -> f64 {
    let tr = answer.input.gel.curve.time_constant_s;
    let longest = answer
        .input
        .gel
        .readings
        .iter()
        .map(|r| r.rest_s)
        .fold(0.0, f64::max);
    let stop = match case.max_stop {
        MaxStop::After(s) => s,
        _ => 0.0,
    };
    (3.0 * tr).max(1.5 * stop).max(1.2 * longest).max(60.0)
}
