//! The ranked findings of every session in the report, most urgent first, through the one
//! `session::findings` call the screens use too.

use super::Inputs;
use crate::diagnose::{Finding, order};
use crate::present::Style;
use crate::present::findings::words;
use serde_json::{Value, json};

/// One finding and the session it came from.
pub(crate) struct Ranked {
    pub session: String,
    pub finding: Finding,
}

/// Every session's findings, ranked together. Sorting is stable, so equal findings of two
/// sessions stay in session (start-time) order.
pub(crate) fn ranked(inputs: &Inputs) -> Vec<Ranked> {
    let mut all: Vec<Ranked> = Vec::new();
    for j in &inputs.journals {
        let session = super::clean(&j.state.session_id);
        all.extend(
            crate::session::findings::findings(&j.state, inputs.site)
                .into_iter()
                .map(|finding| Ranked {
                    session: session.clone(),
                    finding,
                }),
        );
    }
    all.sort_by(|a, b| order(&a.finding, &b.finding));
    all
}

/// The JSON object of one finding (`rule`, `severity`, `title`, `sure`, `numbers`,
/// `next_checks`, `caution` are a contract), SI numbers.
pub(crate) fn json(r: &Ranked, style: Style) -> Value {
    let f = &r.finding;
    let w = words(f, style);
    json!({
        "session": r.session,
        "rule": f.rule.id(),
        "severity": f.severity.code(),
        "sure": f.sure.code(),
        "subject": super::clean(&f.subject),
        "title": f.title,
        "headline": w.headline,
        "numbers": f.numbers.iter().zip(&w.numbers).map(|(n, text)| json!({
            "name": n.name,
            "value_si": finite(n.value_si),
            "unit": n.dimension.si_unit(),
            "dimension": n.dimension.name(),
            "interval": n.interval.map(|(lo, hi)| json!([finite(lo), finite(hi)])),
            "text": text,
        })).collect::<Vec<_>>(),
        "next_checks": f.next_checks,
        "caution": f.caution.text(),
        "caution_code": f.caution.code(),
    })
}

fn finite(x: f64) -> Value {
    if x.is_finite() { json!(x) } else { Value::Null }
}
