//! What the Restart view journals: each gel reading and the stop as spot readings on the
//! line, and the answer as a restart result linked to them; and the status line said then.

use super::Draft;
use super::restart::Question;
use super::restart_form::CheckedForm;
use crate::journal::{Payload, ResultKind};
use crate::line::restart::Outcome;
use crate::present::restart_json;
use crate::readings::{ParsedReading, find};
use crate::session::restart::RestartAnswer;
use crate::text::sanitize;
use crate::tui::strings::restart as s;

/// What a reading record stands for in a batch sent to the journal.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(super) enum Role {
    Rest(usize),
    Gel(usize),
    Stop,
}

/// "Answer for L-2 journalled: will not restart (coldest: will not restart)."
pub(super) fn journalled_status(q: &Question, answer: &RestartAnswer) -> String {
    let short = |outcome: Outcome| match outcome {
        Outcome::Restarts => s::RESTARTS,
        Outcome::PumpTooWeak => s::STUCK,
        Outcome::LineTooWeak => s::DO_NOT_FORCE,
    };
    let cold = answer
        .cold
        .as_ref()
        .map(|c| format!(" ({}: {})", s::AT_COLDEST, short(c.check.outcome)))
        .unwrap_or_default();
    format!(
        "{} {} {}: {}{cold}.",
        s::ANSWER_FOR,
        sanitize(&q.line, false),
        s::JOURNALLED,
        short(answer.now.check.outcome)
    )
}

/// Each reading as a spot-reading record: a rest time then its gel stress, row by row, and
/// last how long the line has stood (a rest time of its own).
pub(super) fn payloads(c: &CheckedForm) -> Vec<(Role, Payload)> {
    let reading = |name: &str, raw: &str, si: f64| {
        find(name).map(|kind| {
            ParsedReading {
                kind,
                raw: raw.to_string(),
                value_si: si,
                // Rest times and gel stresses are not gauge pressures.
                basis: None,
            }
            .payload()
        })
    };
    let mut out = Vec::new();
    for (i, r) in c.readings.iter().enumerate() {
        out.extend(reading("rest-time", &r.rest.raw, r.rest.si).map(|p| (Role::Rest(i), p)));
        out.extend(reading("yield-stress", &r.gel.raw, r.gel.si).map(|p| (Role::Gel(i), p)));
    }
    if let Some(stop) = &c.stop {
        out.extend(reading("rest-time", &stop.raw, stop.si).map(|p| (Role::Stop, p)));
    }
    out
}

/// The answer as a restart result linked to the readings, in the `restart --json` shape
/// plus the line, pump and product it is about.
pub(super) fn result_draft(
    q: &Question,
    answer: &RestartAnswer,
    from: Vec<u64>,
    system: crate::units::UnitSystem,
) -> Draft {
    let mut data = restart_json::json(answer, system);
    data["line"] = q.line.clone().into();
    data["pump"] = q.pump.clone().into();
    data["product"] = q.product.clone().into();
    data["stopped_for_s"] = answer.input.stopped_for_s.into();
    let payload = Payload::Result {
        what: format!("restart {} by {} ({})", q.line, q.pump, q.product),
        result_kind: Some(ResultKind::Restart),
        from,
        data,
    };
    Draft::new(payload, Some(q.line.clone()))
}
