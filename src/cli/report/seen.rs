//! Results journalled at the time (what the operator saw), matched to their sets and
//! compared with the fit recomputed from the journalled readings.
//!
//! A result belongs to a set when it names the set's record in `from`. Journals written
//! before results carried links (no `result_kind`) are matched the old way: `"set_seq": N`
//! in the data, or the first `flow-curve…` result after the set. The data is read as the
//! `fit --json` object (`model`, `params`); anything else is shown as JSON.

use crate::present::{self, Style};
use crate::rheology::ModelKind;
use crate::session::FlowCurve;
use crate::session::state::{Entry, SavedResult, ViscometerSet};
use serde_json::Value;

/// Relative difference under which a saved parameter counts as the same number.
const SAME: f64 = 1e-6;

/// The seq of the set a result belongs to, if any.
pub(crate) fn linked_set(
    result: &Entry<SavedResult>,
    sets: &[Entry<ViscometerSet>],
    results: &[Entry<SavedResult>],
) -> Option<u64> {
    if result.item.kind.is_some() {
        return sets
            .iter()
            .find(|s| result.item.from.contains(&s.seq))
            .map(|s| s.seq);
    }
    legacy_link(result, sets, results)
}

/// How results were matched before they named their inputs (journals of 0.1).
fn legacy_link(
    result: &Entry<SavedResult>,
    sets: &[Entry<ViscometerSet>],
    results: &[Entry<SavedResult>],
) -> Option<u64> {
    if let Some(seq) = result.item.data.get("set_seq").and_then(Value::as_u64) {
        return sets.iter().any(|s| s.seq == seq).then_some(seq);
    }
    if !result.item.what.starts_with("flow-curve") {
        return None;
    }
    let set = sets.iter().rev().find(|s| s.seq < result.seq)?;
    let first_after = results
        .iter()
        .filter(|r| r.item.kind.is_none())
        .filter(|r| r.seq > set.seq && r.item.what.starts_with("flow-curve"))
        .filter(|r| r.item.data.get("set_seq").is_none())
        .map(|r| r.seq)
        .min();
    (first_after == Some(result.seq)).then_some(set.seq)
}

/// The results linked to one set, in seq order.
pub(crate) fn seen_for<'a>(
    set_seq: u64,
    sets: &[Entry<ViscometerSet>],
    results: &'a [Entry<SavedResult>],
) -> Vec<&'a Entry<SavedResult>> {
    results
        .iter()
        .filter(|r| linked_set(r, sets, results) == Some(set_seq))
        .collect()
}

/// How a saved fit compares with the recomputed one.
#[derive(Debug, Clone, PartialEq)]
pub(crate) enum Agreement {
    Same,
    Differs(String),
    /// The saved data is not a fit object, or there is no recomputed fit.
    NotComparable,
}

impl Agreement {
    pub(crate) fn json(&self) -> Value {
        match self {
            Agreement::Same => Value::from("same"),
            Agreement::Differs(_) => Value::from("differs"),
            Agreement::NotComparable => Value::Null,
        }
    }
}

/// Compare a saved fit with the recomputed curve of the same model (the rule's, or the one
/// picked by hand), or with the first curve when none has that model.
pub(crate) fn compare(data: &Value, curves: &[&FlowCurve]) -> Agreement {
    let Some(model) = data.get("model").and_then(Value::as_str) else {
        return Agreement::NotComparable;
    };
    let same_model = curves
        .iter()
        .find(|c| c.fit.model.kind().name() == model)
        .or(curves.first());
    let Some(curve) = same_model else {
        return Agreement::NotComparable;
    };
    let now = curve.fit.model.kind();
    if model != now.name() {
        return Agreement::Differs(format!(
            "the saved model is {model}, the recomputed one {}",
            now.name()
        ));
    }
    let params = data.get("params");
    for e in &curve.fit.estimates {
        let saved = params
            .and_then(|p| p.get(e.name.json_key()))
            .and_then(Value::as_f64);
        let same = saved.is_some_and(|v| (v - e.value).abs() <= SAME * e.value.abs().max(1e-12));
        if !same {
            return Agreement::Differs(format!(
                "{} was {}, recomputed {}",
                e.name.symbol(),
                saved.map_or("missing".to_string(), |v| v.to_string()),
                e.value
            ));
        }
    }
    Agreement::Same
}

/// "Herschel–Bulkley: τ0 3.46 Pa, K 9.89 Pa·sⁿ, n 0.3570", or the data as compact JSON.
pub(crate) fn seen_text(data: &Value, style: Style) -> String {
    let model = data
        .get("model")
        .and_then(Value::as_str)
        .and_then(|m| m.parse::<ModelKind>().ok());
    let params = data.get("params").and_then(Value::as_object);
    match (model, params) {
        (Some(kind), Some(params)) => {
            let shown: Vec<String> = kind
                .param_names()
                .iter()
                .filter_map(|p| {
                    let v = params.get(p.json_key())?.as_f64()?;
                    Some(format!(
                        "{} {}",
                        present::symbol(*p, style),
                        present::param_text(*p, v, style)
                    ))
                })
                .collect();
            format!("{}: {}", kind.title(), shown.join(", "))
        }
        _ => compact(data),
    }
}

/// One-line JSON, cleaned for display.
pub(crate) fn compact(data: &Value) -> String {
    crate::text::sanitize(&data.to_string(), false)
}
