//! Making a record safe to journal: untrusted text stripped, numbers checked finite.
//!
//! JSON would escape control characters anyway, but a report or a `cat` of the file
//! later shows them, so they are removed before they ever reach the disk.

use super::error::JournalError;
use super::record::{DialRow, Payload};
use crate::text::sanitize;
use serde_json::Value;

/// One-line text: names, ids, raw entries.
pub(crate) fn line(s: &str) -> String {
    sanitize(s, false).trim().to_string()
}

/// Free text that may keep its line breaks: notes, findings.
fn prose(s: &str) -> String {
    sanitize(s, true).trim().to_string()
}

pub(crate) fn payload(p: Payload) -> Result<Payload, JournalError> {
    Ok(match p {
        Payload::SessionStart {
            site_id,
            site_source,
        } => Payload::SessionStart {
            site_id: line(&site_id),
            site_source: line(&site_source),
        },
        Payload::Reading {
            name,
            raw,
            value_si,
            dimension,
        } => Payload::Reading {
            value_si: finite(&name, value_si)?,
            name: line(&name),
            raw: line(&raw),
            dimension: line(&dimension),
        },
        Payload::ViscometerSet {
            viscometer,
            product,
            temperature_raw,
            temperature_k,
            rows,
        } => Payload::ViscometerSet {
            viscometer: line(&viscometer),
            product: line(&product),
            temperature_raw: temperature_raw.as_deref().map(line),
            temperature_k: temperature_k
                .map(|t| finite("temperature", t))
                .transpose()?,
            rows: rows.into_iter().map(row).collect::<Result<_, _>>()?,
        },
        Payload::Result {
            what,
            result_kind,
            from,
            data,
        } => Payload::Result {
            what: line(&what),
            result_kind,
            from,
            data: value(data)?,
        },
        Payload::Choice {
            set,
            model,
            shear_rate_per_s,
            include_off_scale,
        } => Payload::Choice {
            set,
            model: line(&model),
            shear_rate_per_s: shear_rate_per_s.filter(|r| r.is_finite()),
            include_off_scale,
        },
        Payload::Note { text } => Payload::Note { text: prose(&text) },
        Payload::Finding { severity, text } => Payload::Finding {
            severity,
            text: prose(&text),
        },
        Payload::SessionEnd => Payload::SessionEnd,
        resumed @ Payload::SessionResumed { .. } => resumed,
    })
}

fn row(r: DialRow) -> Result<DialRow, JournalError> {
    Ok(DialRow {
        rpm: finite("rpm", r.rpm)?,
        dial: finite("dial", r.dial)?,
        rpm_raw: line(&r.rpm_raw),
        dial_raw: line(&r.dial_raw),
    })
}

/// serde_json cannot hold NaN or infinity (it would write `null`), so they never get here.
fn finite(what: &str, v: f64) -> Result<f64, JournalError> {
    if v.is_finite() {
        Ok(v)
    } else {
        Err(JournalError::NotFinite {
            what: line(what),
            value: v,
        })
    }
}

fn value(v: Value) -> Result<Value, JournalError> {
    Ok(match v {
        Value::String(s) => Value::String(prose(&s)),
        Value::Array(items) => {
            Value::Array(items.into_iter().map(value).collect::<Result<_, _>>()?)
        }
        Value::Object(map) => Value::Object(
            map.into_iter()
                .map(|(k, v)| Ok((line(&k), value(v)?)))
                .collect::<Result<_, JournalError>>()?,
        ),
        other => other,
    })
}
