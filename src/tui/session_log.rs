//! What the UI knows about the journal: one entry per record sent, and whether each is on
//! disk yet, from the writer thread's replies. Drives the top bar and the Journal view.

use super::strings::journal as s;
use super::writer::{Reply, Ticket};
use crate::journal::Payload;
use crate::session::SessionState;
use chrono::{DateTime, FixedOffset};

/// Where one record stands.
#[derive(Debug, Clone, PartialEq)]
pub enum EntryStatus {
    /// Sent to the writer thread, no answer yet.
    Sending,
    /// Numbered, but the write or fsync failed; retried with the next record.
    Unsaved,
    /// On disk.
    Saved,
    /// The journal would not take it (the reason in words).
    Refused(String),
}

/// One line of the Journal view.
#[derive(Debug, Clone, PartialEq)]
pub struct Entry {
    pub seq: Option<u64>,
    pub time: DateTime<FixedOffset>,
    pub summary: String,
    pub status: EntryStatus,
}

/// The journal as the top bar shows it.
#[derive(Debug, Clone, PartialEq)]
pub enum JournalState {
    Saved,
    Unsaved(usize),
    Error { unsaved: usize, message: String },
}

/// A record sent to the writer thread and not numbered yet.
#[derive(Debug, Clone, PartialEq)]
struct InFlight {
    ticket: Ticket,
    time: DateTime<FixedOffset>,
    summary: String,
}

/// The UI's side of the journal link: what is in flight, what was refused, how far the disk
/// has got. The records themselves live in the session state, applied as they are numbered.
#[derive(Debug, Clone, Default)]
pub struct SessionLog {
    in_flight: Vec<InFlight>,
    refused: Vec<(InFlight, String)>,
    last_error: Option<String>,
    next_ticket: Ticket,
    /// Every record up to this number is on disk.
    saved_through: u64,
}

impl SessionLog {
    /// Records already on disk before the UI started (a resumed file, the start record).
    pub fn saved_up_to(&mut self, seq: u64) {
        self.saved_through = self.saved_through.max(seq);
    }

    pub fn saved_through(&self) -> u64 {
        self.saved_through
    }

    /// Add a record about to be sent; returns its ticket.
    pub fn push(&mut self, time: DateTime<FixedOffset>, summary: String) -> Ticket {
        self.next_ticket = self.next_ticket.max(1);
        let ticket = self.next_ticket;
        self.next_ticket += 1;
        self.in_flight.push(InFlight {
            ticket,
            time,
            summary,
        });
        ticket
    }

    /// Take in the writer thread's answer (its records go to the session state).
    pub fn apply(&mut self, reply: &Reply) {
        if let Some(ticket) = reply.ticket
            && let Some(i) = self.in_flight.iter().position(|e| e.ticket == ticket)
        {
            let sent = self.in_flight.remove(i);
            if let (None, Some(why)) = (reply.seq, &reply.error) {
                self.refused.push((sent, why.clone()));
            }
        }
        self.last_error = reply.error.clone();
        self.saved_through = self.saved_through.max(reply.saved_through);
    }

    /// The writer thread is gone: whatever was not answered will never be.
    pub fn writer_lost(&mut self, why: &str) {
        self.last_error = Some(why.to_string());
    }

    /// Where a numbered record stands.
    pub fn status_of_seq(&self, seq: u64) -> EntryStatus {
        if seq <= self.saved_through {
            EntryStatus::Saved
        } else {
            EntryStatus::Unsaved
        }
    }

    /// Whether anything sent has not been numbered yet.
    pub fn sending(&self) -> bool {
        !self.in_flight.is_empty()
    }

    /// The Journal view's rows: every record of the session, then refused and in-flight ones.
    pub fn rows(&self, state: &SessionState) -> Vec<Entry> {
        let numbered = state.log.iter().map(|r| Entry {
            seq: Some(r.seq),
            time: r.utc.with_timezone(&r.offset),
            summary: summarize(&r.payload, r.equipment.as_deref()),
            status: self.status_of_seq(r.seq),
        });
        let refused = self.refused.iter().map(|(e, why)| Entry {
            seq: None,
            time: e.time,
            summary: e.summary.clone(),
            status: EntryStatus::Refused(why.clone()),
        });
        let sending = self.in_flight.iter().map(|e| Entry {
            seq: None,
            time: e.time,
            summary: e.summary.clone(),
            status: EntryStatus::Sending,
        });
        numbered.chain(refused).chain(sending).collect()
    }

    /// Records sent but not known to be on disk.
    pub fn unsaved(&self, state: &SessionState) -> usize {
        let numbered = state
            .log
            .iter()
            .rev()
            .take_while(|r| r.seq > self.saved_through)
            .count();
        numbered + self.in_flight.len()
    }

    pub fn state(&self, session: &SessionState) -> JournalState {
        let unsaved = self.unsaved(session);
        match (&self.last_error, unsaved) {
            (Some(message), _) => JournalState::Error {
                unsaved,
                message: message.clone(),
            },
            (None, 0) => JournalState::Saved,
            (None, n) => JournalState::Unsaved(n),
        }
    }
}

/// One line saying what a record holds (names come from the file: cleaned).
pub fn summarize(payload: &Payload, equipment: Option<&str>) -> String {
    let clean = |t: &str| crate::text::sanitize(t, false);
    let at = equipment
        .map(|e| format!(" at {}", clean(e)))
        .unwrap_or_default();
    match payload {
        Payload::SessionStart { site_id, .. } => {
            format!("{} (site {})", s::SESSION_START, clean(site_id))
        }
        Payload::Reading { name, raw, .. } => {
            format!("{}{at}: {} = {}", s::READING, clean(name), clean(raw))
        }
        Payload::ViscometerSet {
            viscometer,
            product,
            temperature_raw,
            rows,
            ..
        } => {
            let temp = temperature_raw
                .as_deref()
                .map(clean)
                .unwrap_or_else(|| "-".to_string());
            format!(
                "{}{at}: {}, {}, {} {}, {temp}",
                super::strings::readings::SET_SUMMARY,
                clean(product),
                clean(viscometer),
                rows.len(),
                super::strings::readings::READINGS_WORD
            )
        }
        Payload::Result { what, from, .. } => {
            let of = match from.first() {
                Some(seq) => format!(" (from #{seq})"),
                None => String::new(),
            };
            format!("{}{at}: {}{of}", s::RESULT, clean(what))
        }
        Payload::Choice {
            set,
            model,
            shear_rate_per_s,
            include_off_scale,
        } => {
            let pegged = if *include_off_scale {
                ", pegged readings kept in the fit"
            } else {
                ""
            };
            let rate = shear_rate_per_s
                .map(|r| {
                    format!(
                        ", apparent viscosity at {} 1/s",
                        crate::units::significant(r)
                    )
                })
                .unwrap_or_default();
            format!("{} #{set}: {}{rate}{pegged}", s::CHOICE, clean(model))
        }
        Payload::Note { text } => format!("{}{at}: {}", super::strings::note::SUMMARY, clean(text)),
        Payload::Finding { text, .. } => format!("{}{at}: {}", s::FINDING, clean(text)),
        Payload::SessionEnd => s::SESSION_END.to_string(),
        Payload::SessionResumed { previous_end } => previous_end.explain().to_string(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn t0() -> DateTime<FixedOffset> {
        DateTime::parse_from_rfc3339("2026-12-01T08:00:00+01:00").unwrap_or_default()
    }

    fn reply(ticket: Option<u64>, seq: Option<u64>, through: u64, error: Option<&str>) -> Reply {
        Reply {
            ticket,
            seq,
            saved_through: through,
            pending: 0,
            error: error.map(str::to_string),
            closed: false,
            records: Vec::new(),
        }
    }

    #[test]
    fn a_numbered_record_is_saved_only_once_the_writer_says_so() {
        let mut log = SessionLog::default();
        log.push(t0(), "Note: a".into());
        assert!(log.sending());
        log.apply(&reply(Some(1), Some(2), 1, Some("disk full")));
        assert!(!log.sending());
        assert_eq!(log.status_of_seq(2), EntryStatus::Unsaved);
        log.apply(&reply(None, None, 2, None));
        assert_eq!(log.status_of_seq(2), EntryStatus::Saved);
    }

    #[test]
    fn a_refused_record_is_listed_with_its_reason_and_not_counted_as_waiting() {
        let mut log = SessionLog::default();
        log.push(t0(), "Note".into());
        log.apply(&reply(Some(1), None, 1, Some("bad text")));
        let rows = log.rows(&SessionState::default());
        assert_eq!(rows.len(), 1);
        assert_eq!(rows[0].status, EntryStatus::Refused("bad text".into()));
        assert_eq!(log.unsaved(&SessionState::default()), 0);
    }

    #[test]
    fn summaries_strip_escape_sequences_from_file_text() {
        let p = Payload::Note {
            text: "ok\u{1b}[2Jgone".into(),
        };
        assert_eq!(summarize(&p, Some("T\u{7}-1")), "Note at T-1: okgone");
    }
}
