//! A session rebuilt from its journal: readings, viscometer sets with their fitted flow
//! curves, results, notes and findings, in the order they were recorded.
//!
//! Pure: records in, state out. The TUI applies each record as it is saved; `report`
//! replays a whole file; both go through [`SessionState::apply`], so they cannot disagree.

use super::checks::OffScale;
use super::flow_curve::{FlowCurve, FlowCurveError, ModelPick};
use super::state_fit::fitted_set;
pub use super::state_fit::{fit_rows, fit_rows_as, fit_rows_with};
use crate::journal::{DialRow, Payload, PreviousEnd, Record, ResultKind, Severity};
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
    /// The curve by the choice rule, fitted once when the set is applied.
    pub curve: Result<FlowCurve, SetError>,
    /// What the operator last chose to see for this set (a `choice` record).
    pub pick: ModelPick,
    /// The shear rate the apparent viscosity was read at, when one was chosen.
    pub shear_rate_per_s: Option<f64>,
    /// Readings at or above full scale kept in the fit (a `choice` record asked for it).
    pub include_off_scale: bool,
    /// The curve as the operator chose it (a model picked by hand, or pegged readings kept);
    /// `None` while the rule's choice on the usual readings is shown.
    pub by_hand: Option<Result<FlowCurve, SetError>>,
}

impl ViscometerSet {
    /// The curve on screen: the hand-picked model's, or the rule's.
    pub fn shown(&self) -> &Result<FlowCurve, SetError> {
        self.by_hand.as_ref().unwrap_or(&self.curve)
    }
}

impl PartialEq for ViscometerSet {
    fn eq(&self, other: &Self) -> bool {
        let curves = match (&self.curve, &other.curve) {
            (Ok(a), Ok(b)) => same_curve(a, b),
            (Err(a), Err(b)) => a == b,
            _ => false,
        };
        let hand = match (&self.by_hand, &other.by_hand) {
            (Some(Ok(a)), Some(Ok(b))) => same_curve(a, b),
            (Some(Err(a)), Some(Err(b))) => a == b,
            (None, None) => true,
            _ => false,
        };
        curves
            && hand
            && self.pick == other.pick
            && self.include_off_scale == other.include_off_scale
            && self.shear_rate_per_s == other.shear_rate_per_s
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
    /// What kind of answer it is; `None` in journals written before results were typed.
    pub kind: Option<ResultKind>,
    /// The records it was computed from.
    pub from: Vec<u64>,
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
    /// Every record applied, in order (the Journal view lists these).
    pub log: Vec<Record>,
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
        self.log.push(record.clone());
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
            Payload::Result {
                what,
                result_kind,
                from,
                data,
            } => {
                let item = SavedResult {
                    what: what.clone(),
                    kind: *result_kind,
                    from: from.clone(),
                    data: data.clone(),
                };
                self.results.push(entry(record, at, item));
            }
            Payload::Choice {
                set,
                model,
                shear_rate_per_s,
                include_off_scale,
            } => {
                let asked = Asked {
                    model,
                    rate: *shear_rate_per_s,
                    include_off_scale: *include_off_scale,
                };
                self.choose(site, record.seq, *set, asked)
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

    /// A by-hand model or shear rate for a set: refit with that model (the rule's curve is
    /// kept), so a replay shows what was on screen.
    fn choose(&mut self, site: &Site, seq: u64, set: u64, asked: Asked<'_>) {
        let model = asked.model;
        let pick = match model.parse::<ModelPick>() {
            Ok(p) => p,
            Err(e) => {
                self.problems
                    .push(format!("record {seq}: choice of model '{model}': {e}"));
                return;
            }
        };
        let Some(entry) = self.sets.iter_mut().find(|e| e.seq == set) else {
            self.problems.push(format!(
                "record {seq} chooses how to show record {set}, which is not a viscometer set"
            ));
            return;
        };
        let s = &mut entry.item;
        if s.pick != pick || s.include_off_scale != asked.include_off_scale {
            let off_scale = if asked.include_off_scale {
                OffScale::Include
            } else {
                OffScale::LeaveOut
            };
            s.by_hand = match (pick, off_scale) {
                (ModelPick::Auto, OffScale::LeaveOut) => None,
                _ => Some(fit_rows_as(site, &s.viscometer, &s.rows, pick, off_scale)),
            };
            s.pick = pick;
            s.include_off_scale = asked.include_off_scale;
        }
        s.shear_rate_per_s = asked.rate.or(s.shear_rate_per_s);
    }

    /// The newest set, if any.
    pub fn latest_set(&self) -> Option<&Entry<ViscometerSet>> {
        self.sets.last()
    }

    /// The newest set of one product.
    pub fn latest_set_of(&self, product: &str) -> Option<&Entry<ViscometerSet>> {
        self.sets.iter().rev().find(|e| e.item.product == product)
    }

    /// Results computed from the record `seq`, oldest first.
    pub fn results_from(&self, seq: u64) -> impl Iterator<Item = &Entry<SavedResult>> {
        self.results
            .iter()
            .filter(move |r| r.item.from.contains(&seq))
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

/// What a `choice` record asks for.
struct Asked<'a> {
    model: &'a str,
    rate: Option<f64>,
    include_off_scale: bool,
}
