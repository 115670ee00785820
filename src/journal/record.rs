//! The record types: one JSON object per line, the envelope plus a payload tagged by `kind`.

use chrono::{DateTime, FixedOffset, Utc};
use serde::{Deserialize, Serialize};

/// One line of a session journal.
///
/// The envelope (sequence, session, time, who, what equipment, which program) is the same
/// for every kind; the payload's fields sit beside it in the same JSON object.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Record {
    /// 1, 2, 3… within the session; 1 is always the session-start record.
    pub seq: u64,
    pub session: String,
    /// When the record was entered (not when it reached the disk), RFC 3339 UTC.
    pub utc: DateTime<Utc>,
    /// The local offset at that moment, `+HH:MM`, so local wall time can be shown.
    #[serde(with = "offset_text")]
    pub offset: FixedOffset,
    pub operator: String,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub equipment: Option<String>,
    #[serde(flatten)]
    pub payload: Payload,
    /// Version of rheoside that wrote the record.
    pub version: String,
}

/// What a record says. Each variant is written whole in one line, so a set is atomic.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(tag = "kind", rename_all = "kebab-case")]
pub enum Payload {
    SessionStart {
        site_id: String,
        /// Where the site came from: a config path, or the bundled demo.
        site_source: String,
    },
    /// A spot reading: the text typed and its SI value.
    Reading {
        name: String,
        raw: String,
        value_si: f64,
        dimension: String,
    },
    /// A whole set of viscometer dial readings at one temperature.
    ViscometerSet {
        viscometer: String,
        product: String,
        #[serde(default, skip_serializing_if = "Option::is_none")]
        temperature_raw: Option<String>,
        #[serde(default, skip_serializing_if = "Option::is_none")]
        temperature_k: Option<f64>,
        rows: Vec<DialRow>,
    },
    /// A computed answer (e.g. a fitted model), kept so a report can show what was seen.
    Result {
        what: String,
        /// What kind of answer `data` holds; absent in journals written before links.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        result_kind: Option<ResultKind>,
        /// Sequence numbers of the records it was computed from (a set, readings).
        #[serde(default, skip_serializing_if = "Vec::is_empty")]
        from: Vec<u64>,
        data: serde_json::Value,
    },
    /// What the operator chose to be shown for a set: the model (`auto` or a model name)
    /// and the shear rate the apparent viscosity is read at. A replay shows the same.
    Choice {
        /// Sequence number of the viscometer set this choice is about.
        set: u64,
        model: String,
        #[serde(default, skip_serializing_if = "Option::is_none")]
        shear_rate_per_s: Option<f64>,
        /// Keep readings at or above full scale (pegged) in the fit, as `fit
        /// --include-off-scale` does; absent in older journals (left out).
        #[serde(default, skip_serializing_if = "std::ops::Not::not")]
        include_off_scale: bool,
    },
    Note {
        text: String,
    },
    Finding {
        severity: Severity,
        text: String,
    },
    SessionEnd,
    /// The session was picked up again (after a clean end or none); `previous_end` says which.
    SessionResumed {
        previous_end: super::run_end::PreviousEnd,
    },
}

/// One viscometer row: speed in rev/min and the dial reading, each with the text typed.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct DialRow {
    pub rpm_raw: String,
    pub rpm: f64,
    pub dial_raw: String,
    pub dial: f64,
}

/// The kinds of computed answer a journal holds.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum ResultKind {
    /// A fitted flow curve in the `fit --json` shape.
    FlowCurve,
    PipeFlow,
    Restart,
    Pump,
    Tank,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum Severity {
    Info,
    Caution,
    Warning,
    Danger,
}

impl Payload {
    /// The `kind` string as written in the file.
    pub fn kind(&self) -> &'static str {
        match self {
            Payload::SessionStart { .. } => "session-start",
            Payload::Reading { .. } => "reading",
            Payload::ViscometerSet { .. } => "viscometer-set",
            Payload::Result { .. } => "result",
            Payload::Choice { .. } => "choice",
            Payload::Note { .. } => "note",
            Payload::Finding { .. } => "finding",
            Payload::SessionEnd => "session-end",
            Payload::SessionResumed { .. } => "session-resumed",
        }
    }
}

/// `+HH:MM` (or `+HH:MM:SS` for the odd historical offset) both ways.
mod offset_text {
    use chrono::FixedOffset;
    use serde::{Deserialize, Deserializer, Serializer, de::Error};

    pub fn serialize<S: Serializer>(offset: &FixedOffset, s: S) -> Result<S::Ok, S::Error> {
        s.serialize_str(&format(offset.local_minus_utc()))
    }

    pub fn deserialize<'de, D: Deserializer<'de>>(d: D) -> Result<FixedOffset, D::Error> {
        let text = String::deserialize(d)?;
        parse(&text)
            .and_then(FixedOffset::east_opt)
            .ok_or_else(|| D::Error::custom(format!("offset {text:?} is not +HH:MM")))
    }

    fn format(secs: i32) -> String {
        let sign = if secs < 0 { '-' } else { '+' };
        let a = secs.unsigned_abs();
        let (h, m, s) = (a / 3600, a / 60 % 60, a % 60);
        if s == 0 {
            format!("{sign}{h:02}:{m:02}")
        } else {
            format!("{sign}{h:02}:{m:02}:{s:02}")
        }
    }

    fn parse(text: &str) -> Option<i32> {
        let (sign, rest) = match text.as_bytes().first()? {
            b'+' => (1, &text[1..]),
            b'-' => (-1, &text[1..]),
            _ => return None,
        };
        let mut parts = rest.split(':').map(|p| p.parse::<i32>().ok());
        let h = parts.next()??;
        let m = parts.next()??;
        let s = parts.next().unwrap_or(Some(0))?;
        if parts.next().is_some() || !(0..60).contains(&m) || !(0..60).contains(&s) {
            return None;
        }
        Some(sign * (h * 3600 + m * 60 + s))
    }
}
