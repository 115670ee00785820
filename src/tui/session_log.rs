//! What the UI knows about the journal: one entry per record sent, and whether each is on
//! disk yet, from the writer thread's replies. Drives the top bar and the Journal view.

use super::strings::journal as s;
use super::writer::{Reply, Ticket};
use crate::journal::{Payload, Record};
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
    pub ticket: Option<Ticket>,
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

#[derive(Debug, Clone, Default)]
pub struct SessionLog {
    entries: Vec<Entry>,
    last_error: Option<String>,
    next_ticket: Ticket,
    /// Every record up to this number is on disk.
    saved_through: u64,
}

impl SessionLog {
    /// Records already in a file (on resume): all saved.
    pub fn from_records(records: &[Record]) -> SessionLog {
        let entries = records
            .iter()
            .map(|r| Entry {
                ticket: None,
                seq: Some(r.seq),
                time: r.utc.with_timezone(&r.offset),
                summary: summarize(&r.payload, r.equipment.as_deref()),
                status: EntryStatus::Saved,
            })
            .collect();
        SessionLog {
            entries,
            last_error: None,
            next_ticket: 1,
            saved_through: records.last().map_or(0, |r| r.seq),
        }
    }

    /// A record the journal saved before the UI started (the session-start record).
    pub fn push_saved(&mut self, seq: u64, time: DateTime<FixedOffset>, summary: String) {
        self.entries.push(Entry {
            ticket: None,
            seq: Some(seq),
            time,
            summary,
            status: EntryStatus::Saved,
        });
        self.saved_through = self.saved_through.max(seq);
    }

    pub fn saved_through(&self) -> u64 {
        self.saved_through
    }

    /// Add an entry for a record about to be sent; returns its ticket.
    pub fn push(&mut self, time: DateTime<FixedOffset>, summary: String) -> Ticket {
        self.next_ticket = self.next_ticket.max(1);
        let ticket = self.next_ticket;
        self.next_ticket += 1;
        self.entries.push(Entry {
            ticket: Some(ticket),
            seq: None,
            time,
            summary,
            status: EntryStatus::Sending,
        });
        ticket
    }

    /// Take in the writer thread's answer.
    pub fn apply(&mut self, reply: &Reply) {
        if let Some(ticket) = reply.ticket
            && let Some(e) = self.entries.iter_mut().find(|e| e.ticket == Some(ticket))
        {
            e.seq = reply.seq;
            e.status = match (&reply.error, reply.seq) {
                (Some(msg), None) => EntryStatus::Refused(msg.clone()),
                _ => EntryStatus::Unsaved,
            };
        }
        for e in &mut self.entries {
            let numbered_unsaved = matches!(e.status, EntryStatus::Unsaved | EntryStatus::Sending);
            if numbered_unsaved && e.seq.is_some_and(|seq| seq <= reply.saved_through) {
                e.status = EntryStatus::Saved;
            }
        }
        self.last_error = reply.error.clone();
        self.saved_through = self.saved_through.max(reply.saved_through);
    }

    /// The writer thread is gone: whatever was not answered will never be.
    pub fn writer_lost(&mut self, why: &str) {
        self.last_error = Some(why.to_string());
    }

    pub fn entries(&self) -> &[Entry] {
        &self.entries
    }

    pub fn status_of(&self, ticket: Ticket) -> Option<&EntryStatus> {
        self.entries
            .iter()
            .find(|e| e.ticket == Some(ticket))
            .map(|e| &e.status)
    }

    /// Records sent but not known to be on disk.
    pub fn unsaved(&self) -> usize {
        self.entries
            .iter()
            .filter(|e| matches!(e.status, EntryStatus::Sending | EntryStatus::Unsaved))
            .count()
    }

    pub fn state(&self) -> JournalState {
        let unsaved = self.unsaved();
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
        Payload::Result { what, .. } => format!("{}{at}: {}", s::RESULT, clean(what)),
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
        }
    }

    #[test]
    fn an_entry_is_saved_only_once_the_writer_says_so() {
        let mut log = SessionLog::default();
        let t = log.push(t0(), "Note: a".into());
        assert_eq!(log.state(), JournalState::Unsaved(1));
        log.apply(&reply(Some(t), Some(2), 1, Some("disk full")));
        assert_eq!(log.status_of(t), Some(&EntryStatus::Unsaved));
        assert!(matches!(
            log.state(),
            JournalState::Error { unsaved: 1, .. }
        ));
        // A later retry gets it onto the disk.
        log.apply(&reply(None, None, 2, None));
        assert_eq!(log.status_of(t), Some(&EntryStatus::Saved));
        assert_eq!(log.state(), JournalState::Saved);
    }

    #[test]
    fn a_refused_record_is_not_counted_as_waiting() {
        let mut log = SessionLog::default();
        let t = log.push(t0(), "Note".into());
        log.apply(&reply(Some(t), None, 1, Some("bad text")));
        assert_eq!(
            log.status_of(t),
            Some(&EntryStatus::Refused("bad text".into()))
        );
        assert_eq!(log.unsaved(), 0);
    }

    #[test]
    fn summaries_strip_escape_sequences_from_file_text() {
        let p = Payload::Note {
            text: "ok\u{1b}[2Jgone".into(),
        };
        assert_eq!(summarize(&p, Some("T\u{7}-1")), "Note at T-1: okgone");
    }
}
