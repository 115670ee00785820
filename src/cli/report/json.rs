//! The handover as one JSON object for scripts. Key names are a contract: add keys, never
//! rename. SI units throughout; keys print sorted, so the same journals give the same bytes.

use super::seen::{Agreement, compare, linked_set, seen_for};
use super::{CAUTIONS, Inputs, Journal, dimension_of, problems, rfc3339};
use crate::cli::fit_output;
use crate::session::FlowCurveOptions;
use crate::session::state::{Entry, Moment, SessionState, ViscometerSet};
use crate::session::trend::{LimitStatus, at_reference, check_limits, spec_rate};
use crate::site::{LimitProperty, Site};
use serde_json::{Map, Value, json};

pub(crate) fn render(inputs: &Inputs) -> anyhow::Result<String> {
    let site = inputs.site;
    let value = json!({
        "format": "rheoside-report",
        "format_version": 1,
        "site": {
            "id": site.id,
            "name": site.name,
            "unit_system": site.unit_system,
            "source": site.source,
        },
        "sessions": inputs.journals.iter().map(|j| session(site, j)).collect::<Vec<_>>(),
        "left_out": inputs.failed,
        "cautions": CAUTIONS,
    });
    let mut text = serde_json::to_string_pretty(&value)?;
    text.push('\n');
    Ok(text)
}

fn session(site: &Site, j: &Journal) -> Value {
    let s = &j.state;
    json!({
        "session": s.session_id,
        "journal": j.path,
        "site_id": s.site_id,
        "site_source": s.site_source,
        "started": s.started.as_ref().map(moment),
        "ended": s.ended.as_ref().map(moment),
        "operators": s.operators,
        "equipment": s.equipment,
        "records": s.records,
        "last_seq": s.last_seq,
        "torn_tail": j.torn.as_ref().map(|t| json!({
            "offset": t.offset,
            "len": t.len,
            "preview": t.preview,
        })),
        "problems": problems(site, j),
        "resumptions": s.resumptions.iter().map(|r| with_envelope(r, json!({ "previous_end": r.item }))).collect::<Vec<_>>(),
        "readings": s.readings.iter().map(|r| with_envelope(r, json!({
            "name": r.item.name,
            "raw": r.item.raw,
            "value_si": r.item.value_si,
            "dimension": r.item.dimension,
            "unit": dimension_of(&r.item.dimension).map(|d| d.si_unit()),
        }))).collect::<Vec<_>>(),
        "sets": s.sets.iter().map(|e| set(site, e, s)).collect::<Vec<_>>(),
        "results": s.results.iter().map(|r| with_envelope(r, json!({
            "what": r.item.what,
            "data": r.item.data,
            "set_seq": linked_set(r, &s.sets, &s.results),
        }))).collect::<Vec<_>>(),
        "notes": s.notes.iter().map(|n| with_envelope(n, json!({ "text": n.item }))).collect::<Vec<_>>(),
        "findings": s.findings.iter().map(|f| with_envelope(f, json!({
            "severity": f.item.severity,
            "text": f.item.text,
        }))).collect::<Vec<_>>(),
    })
}

fn moment(m: &Moment) -> Value {
    let (utc, local) = rfc3339(m);
    json!({ "utc": utc, "local": local })
}

/// The item's own keys plus `seq`, `utc`, `local`, `operator`, `equipment`.
fn with_envelope<T>(e: &Entry<T>, item: Value) -> Value {
    let (utc, local) = rfc3339(&e.at);
    let mut map = match item {
        Value::Object(map) => map,
        other => Map::from_iter([("value".to_string(), other)]),
    };
    map.insert("seq".into(), json!(e.seq));
    map.insert("utc".into(), json!(utc));
    map.insert("local".into(), json!(local));
    map.insert("operator".into(), json!(e.operator));
    map.insert("equipment".into(), json!(e.equipment));
    Value::Object(map)
}

fn set(site: &Site, e: &Entry<ViscometerSet>, s: &SessionState) -> Value {
    let v = &e.item;
    let curve = v.shown().as_ref().ok();
    let product = site.product(&v.product);
    let spec = product.map_or(crate::session::trend::DEFAULT_RATE_PER_S, spec_rate);
    let rate = v.shear_rate_per_s.unwrap_or(spec);
    let curves = super::md_set::recomputed(v);
    let limits: Vec<Value> = match (product, curve) {
        (Some(p), Some(c)) => {
            check_limits(&p.limits, &at_reference(p, &c.fit.model, v.temperature_k).0)
                .iter()
                .map(limit)
                .collect()
        }
        _ => Vec::new(),
    };
    let seen: Vec<Value> = seen_for(e.seq, &s.sets, &s.results)
        .into_iter()
        .map(|r| {
            let agreement = compare(&r.item.data, &curves);
            let detail = match &agreement {
                Agreement::Differs(why) => Some(why.clone()),
                _ => None,
            };
            json!({ "seq": r.seq, "what": r.item.what, "data": r.item.data,
                    "agreement": agreement.json(), "detail": detail })
        })
        .collect();
    with_envelope(
        e,
        json!({
            "viscometer": v.viscometer,
            "product": v.product,
            "temperature_raw": v.temperature_raw,
            "temperature_k": v.temperature_k,
            "rows": v.rows,
            "fit": curve.map(|c| fit_output::json(c, &FlowCurveOptions::default(), v.temperature_k)),
            "fit_error": v.shown().as_ref().err().map(ToString::to_string),
            "chosen_by_hand": v.by_hand.is_some(),
            "apparent_viscosity": curve.map(|c| json!({
                "shear_rate_per_s": rate,
                "pa_s": finite(c.apparent_viscosity_at(rate)),
            })),
            "limits": limits,
            "seen": seen,
        }),
    )
}

fn limit(c: &crate::session::trend::LimitCheck) -> Value {
    let (property, rate) = match c.limit.property {
        LimitProperty::ConsistencyIndex => ("consistency-index", None),
        LimitProperty::FlowIndex => ("flow-index", None),
        LimitProperty::YieldStress => ("yield-stress", None),
        LimitProperty::ApparentViscosity { shear_rate_per_s } => {
            ("apparent-viscosity", Some(shear_rate_per_s))
        }
    };
    let status = match c.status {
        LimitStatus::Within => "within",
        LimitStatus::Above => "above",
        LimitStatus::Below => "below",
        LimitStatus::NotChecked => "not-checked",
    };
    json!({
        "property": property,
        "shear_rate_per_s": rate,
        "min": c.limit.min,
        "max": c.limit.max,
        "value": c.value.map(finite),
        "status": status,
    })
}

fn finite(x: f64) -> Value {
    if x.is_finite() { json!(x) } else { Value::Null }
}
