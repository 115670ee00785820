//! A session rebuilt from its journal: readings, viscometer sets with their fitted flow
//! curves, results, notes and findings, in the order they were recorded.
//!
//! Pure: records in, state out. The TUI applies each record as it is saved; `report`
//! replays a whole file; both go through [`SessionState::apply`], so they cannot disagree.

use super::flow_curve::{FlowCurve, FlowCurveError, FlowCurveInput, FlowCurveOptions, analyse};
use crate::instrument::DialReading;
use crate::journal::{DialRow, Payload, PreviousEnd, Record, Severity};
use crate::site::Site;
use chrono::{DateTime, FixedOffset, Utc};

/// When something was recorded: the UTC instant and the local offset in force then.
///
/// Kept apart (not one `DateTime<FixedOffset>`) because that type compares instants only,
/// and a replay must give back the offset too.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Moment {
    pub utc: DateTime<Utc>,
    pub offset: FixedOffset,
}

impl Moment {
    /// Local wall time with its offset.
    pub fn local(&self) -> DateTime<FixedOffset> {
        self.utc.with_timezone(&self.offset)
    }
}

/// One recorded item with its envelope.
#[derive(Debug, Clone, PartialEq)]
pub struct Entry<T> {
    pub seq: u64,
    pub at: Moment,
    pub operator: String,
    pub equipment: Option<String>,
    pub item: T,
}

/// A spot reading as journalled: the text typed and its SI value.
#[derive(Debug, Clone, PartialEq)]
pub struct SpotReading {
    pub name: String,
    pub raw: String,
    pub value_si: f64,
    /// The dimension's name as journalled ("pressure", "shear stress", …).
    pub dimension: String,
}

/// Why a journalled set has no flow curve.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SetError {
    #[error(
        "viscometer '{id}' is not in the site config, so its geometry is unknown; the site's viscometers: {known}"
    )]
    UnknownViscometer { id: String, known: String },
    #[error("{0}")]
    Curve(#[from] FlowCurveError),
}

/// A viscometer set and the flow curve fitted to it through [`analyse`].
#[derive(Debug, Clone)]
pub struct ViscometerSet {
    pub viscometer: String,
    pub product: String,
    pub temperature_raw: Option<String>,
    pub temperature_k: Option<f64>,
    pub rows: Vec<DialRow>,
    pub curve: Result<FlowCurve, SetError>,
}

impl PartialEq for ViscometerSet {
    fn eq(&self, other: &Self) -> bool {
        let curves = match (&self.curve, &other.curve) {
            (Ok(a), Ok(b)) => same_curve(a, b),
            (Err(a), Err(b)) => a == b,
            _ => false,
        };
        curves
            && self.viscometer == other.viscometer
            && self.product == other.product
            && self.temperature_raw == other.temperature_raw
            && self.temperature_k == other.temperature_k
            && self.rows == other.rows
    }
}

/// `FlowCurve` holds a `Choice`, which has no `PartialEq`. Compare the full `Debug` text:
/// it prints every field, floats in their shortest exact form, and NaN equals NaN there,
/// so a curve always equals its own replay.
fn same_curve(a: &FlowCurve, b: &FlowCurve) -> bool {
    format!("{a:?}") == format!("{b:?}")
}

/// A computed answer journalled at the time (e.g. the fit the operator saw).
#[derive(Debug, Clone, PartialEq)]
pub struct SavedResult {
    pub what: String,
    pub data: serde_json::Value,
}

#[derive(Debug, Clone, PartialEq)]
pub struct FindingItem {
    pub severity: Severity,
    pub text: String,
}

/// Everything a session's records say, rebuilt exactly.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct SessionState {
    /// The session id ("" before the first record).
    pub session_id: String,
    pub site_id: Option<String>,
    pub site_source: Option<String>,
    pub started: Option<Moment>,
    pub ended: Option<Moment>,
    /// When the newest record was entered.
    pub last: Option<Moment>,
    pub last_seq: u64,
    pub records: usize,
    /// Everyone who wrote a record, in order of first appearance (handovers add names).
    pub operators: Vec<String>,
    /// Equipment ids named by records, in order of first appearance.
    pub equipment: Vec<String>,
    pub readings: Vec<Entry<SpotReading>>,
    pub sets: Vec<Entry<ViscometerSet>>,
    pub results: Vec<Entry<SavedResult>>,
    pub notes: Vec<Entry<String>>,
    pub findings: Vec<Entry<FindingItem>>,
    /// Each time the session was picked up again, with how the run before it ended.
    pub resumptions: Vec<Entry<PreviousEnd>>,
    /// Things in the record stream that should not happen (out of sequence, after the end…),
    /// in words; the records are still applied.
    pub problems: Vec<String>,
}

impl SessionState {
    /// The state after applying every record in order.
    pub fn replay(site: &Site, records: &[Record]) -> SessionState {
        let mut state = SessionState::default();
        for r in records {
            state.apply(site, r);
        }
        state
    }

    /// Apply one record (as saved). Viscometer sets are fitted here, once.
    pub fn apply(&mut self, site: &Site, record: &Record) {
        self.check_envelope(record);
        self.note_people(record);
        let at = Moment {
            utc: record.utc,
            offset: record.offset,
        };
        self.take(site, record, at);
        self.last = Some(at);
        self.last_seq = record.seq;
        self.records += 1;
    }

    /// File the payload under its kind.
    fn take(&mut self, site: &Site, record: &Record, at: Moment) {
        match &record.payload {
            Payload::SessionStart {
                site_id,
                site_source,
            } => self.start(record.seq, at, site_id, site_source),
            Payload::Reading {
                name,
                raw,
                value_si,
                dimension,
            } => {
                let item = SpotReading {
                    name: name.clone(),
                    raw: raw.clone(),
                    value_si: *value_si,
                    dimension: dimension.clone(),
                };
                self.readings.push(entry(record, at, item));
            }
            Payload::ViscometerSet { .. } => {
                if let Some(item) = fitted_set(site, &record.payload) {
                    self.sets.push(entry(record, at, item));
                }
            }
            Payload::Result { what, data } => {
                let item = SavedResult {
                    what: what.clone(),
                    data: data.clone(),
                };
                self.results.push(entry(record, at, item));
            }
            Payload::Note { text } => self.notes.push(entry(record, at, text.clone())),
            Payload::Finding { severity, text } => {
                let item = FindingItem {
                    severity: *severity,
                    text: text.clone(),
                };
                self.findings.push(entry(record, at, item));
            }
            Payload::SessionEnd => self.end(record.seq, at),
            Payload::SessionResumed { previous_end } => {
                // A new run starts: records after this one are not "after the end".
                self.ended = None;
                self.resumptions.push(entry(record, at, *previous_end));
            }
        }
    }

    /// The start time, or the first record's time for a journal whose start is missing.
    pub fn sort_key(&self) -> Option<Moment> {
        self.started.or(self.last)
    }

    fn check_envelope(&mut self, record: &Record) {
        if self.records == 0 {
            self.session_id = record.session.clone();
        } else if record.session != self.session_id {
            self.problems.push(format!(
                "record {} belongs to session '{}', not '{}'",
                record.seq, record.session, self.session_id
            ));
        }
        if record.seq != self.last_seq + 1 {
            self.problems.push(format!(
                "record {} follows record {} (expected {})",
                record.seq,
                self.last_seq,
                self.last_seq + 1
            ));
        }
        let resumes = matches!(record.payload, Payload::SessionResumed { .. });
        if let Some(end) = self.ended.filter(|_| !resumes) {
            self.problems.push(format!(
                "record {} was written after the session ended ({} UTC)",
                record.seq,
                end.utc.format("%Y-%m-%d %H:%M:%S")
            ));
        }
    }

    fn note_people(&mut self, record: &Record) {
        if !self.operators.contains(&record.operator) {
            self.operators.push(record.operator.clone());
        }
        if let Some(e) = &record.equipment
            && !self.equipment.contains(e)
        {
            self.equipment.push(e.clone());
        }
    }

    fn start(&mut self, seq: u64, at: Moment, site_id: &str, site_source: &str) {
        if self.started.is_some() {
            self.problems
                .push(format!("record {seq} starts the session a second time"));
            return;
        }
        if seq != 1 {
            self.problems.push(format!(
                "the session-start record is record {seq}, not record 1"
            ));
        }
        self.started = Some(at);
        self.site_id = Some(site_id.to_string());
        self.site_source = Some(site_source.to_string());
    }

    fn end(&mut self, seq: u64, at: Moment) {
        if self.ended.is_some() {
            self.problems
                .push(format!("record {seq} ends the session a second time"));
            return;
        }
        self.ended = Some(at);
    }
}

fn entry<T>(record: &Record, at: Moment, item: T) -> Entry<T> {
    Entry {
        seq: record.seq,
        at,
        operator: record.operator.clone(),
        equipment: record.equipment.clone(),
        item,
    }
}

/// The set with its curve, fitted with the default options (automatic model choice,
/// rate correction on): the same call the faces make for a fresh set.
fn fitted_set(site: &Site, payload: &Payload) -> Option<ViscometerSet> {
    let Payload::ViscometerSet {
        viscometer,
        product,
        temperature_raw,
        temperature_k,
        rows,
    } = payload
    else {
        return None;
    };
    Some(ViscometerSet {
        viscometer: viscometer.clone(),
        product: product.clone(),
        temperature_raw: temperature_raw.clone(),
        temperature_k: *temperature_k,
        rows: rows.clone(),
        curve: fit_rows(site, viscometer, rows),
    })
}

/// Fit journalled dial rows on the site's geometry for `viscometer`.
pub fn fit_rows(site: &Site, viscometer: &str, rows: &[DialRow]) -> Result<FlowCurve, SetError> {
    let Some(v) = site.viscometer(viscometer) else {
        let known: Vec<&str> = site.viscometers.iter().map(|v| v.id.as_str()).collect();
        return Err(SetError::UnknownViscometer {
            id: viscometer.to_string(),
            known: if known.is_empty() {
                "none".to_string()
            } else {
                known.join(", ")
            },
        });
    };
    let readings: Vec<DialReading> = rows
        .iter()
        .map(|r| DialReading::new(r.rpm, r.dial))
        .collect();
    let input = FlowCurveInput::Dial {
        geometry: &v.geometry,
        readings: &readings,
    };
    Ok(analyse(input, &FlowCurveOptions::default())?)
}
