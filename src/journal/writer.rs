//! Appending records: one line, one `write_all`, one fsync, before anything says "saved".

use super::clean;
use super::clock::{Clock, Stamp};
use super::error::{JournalError, Stage};
use super::record::{Payload, Record};
use super::sink::{FileSink, Sink};
use std::collections::VecDeque;
use std::path::{Path, PathBuf};

/// Where a writer picks up: which session, who is writing, and how far the file got.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Continuation {
    pub session_id: String,
    pub operator: String,
    /// Sequence number the next record gets (1 for a new session).
    pub next_seq: u64,
    /// Length of the file through its last saved record.
    pub file_len: u64,
}

/// A record that has its number and its bytes but is not yet known to be on disk.
#[derive(Debug, Clone)]
struct Pending {
    record: Record,
    line: Vec<u8>,
}

/// The one writer of a session file. Records are saved strictly in order: a record that
/// could not be saved stays pending, and nothing after it reaches the file before it does.
pub struct JournalWriter<S: Sink = FileSink> {
    sink: S,
    path: Option<PathBuf>,
    session_id: String,
    operator: String,
    clock: Box<dyn Clock>,
    next_seq: u64,
    good_len: u64,
    saved_through: u64,
    pending: VecDeque<Pending>,
    /// A failed append may have left bytes past `good_len`; cut them before the next try.
    dirty: bool,
    /// Records numbered since the last [`JournalWriter::take_numbered`], saved or not yet.
    numbered: Vec<Record>,
    /// The record most recently saved (kept so a resume can hand its own record back).
    pub(crate) last_saved: Option<Record>,
}

impl<S: Sink> JournalWriter<S> {
    /// A writer over any sink (tests inject failing ones here).
    pub fn with_sink(sink: S, from: Continuation, clock: Box<dyn Clock>) -> Self {
        JournalWriter {
            sink,
            path: None,
            session_id: from.session_id,
            operator: clean::line(&from.operator),
            clock,
            saved_through: from.next_seq.saturating_sub(1),
            next_seq: from.next_seq,
            good_len: from.file_len,
            pending: VecDeque::new(),
            dirty: false,
            numbered: Vec::new(),
            last_saved: None,
        }
    }

    pub(crate) fn set_path(&mut self, path: PathBuf) {
        self.path = Some(path);
    }

    /// Number, stamp and save one record. `Ok(seq)` only once it (and every record before
    /// it) is fsynced; on `Err(Unsaved)` it stays pending and is retried with the next one.
    pub fn append(
        &mut self,
        equipment: Option<&str>,
        payload: Payload,
    ) -> Result<u64, JournalError> {
        let stamp = self.clock.now();
        self.append_at(stamp, equipment, payload)
    }

    pub(crate) fn append_at(
        &mut self,
        stamp: Stamp,
        equipment: Option<&str>,
        payload: Payload,
    ) -> Result<u64, JournalError> {
        let record = Record {
            seq: self.next_seq,
            session: self.session_id.clone(),
            utc: stamp.utc,
            offset: stamp.offset,
            operator: self.operator.clone(),
            equipment: equipment.map(clean::line).filter(|e| !e.is_empty()),
            payload: clean::payload(payload)?,
            version: env!("CARGO_PKG_VERSION").to_string(),
        };
        let mut line = serde_json::to_vec(&record).map_err(JournalError::Encode)?;
        line.push(b'\n');
        self.next_seq += 1;
        let seq = record.seq;
        self.numbered.push(record.clone());
        self.pending.push_back(Pending { record, line });
        self.flush_pending()?;
        Ok(seq)
    }

    /// Try again to save every pending record, oldest first. Returns the highest saved
    /// sequence number.
    pub fn flush_pending(&mut self) -> Result<u64, JournalError> {
        while let Some(p) = self.pending.front() {
            let seq = p.record.seq;
            let result = self.write_one(seq);
            if let Err((stage, source)) = result {
                return Err(JournalError::Unsaved {
                    seq,
                    pending: self.pending.len(),
                    stage,
                    source,
                });
            }
        }
        Ok(self.saved_through)
    }

    /// Cut any leftover, write the front record, fsync it; on failure cut it back at once.
    fn write_one(&mut self, seq: u64) -> Result<(), (Stage, std::io::Error)> {
        if self.dirty {
            self.sink
                .truncate(self.good_len)
                .map_err(|e| (Stage::Truncate, e))?;
            self.dirty = false;
        }
        let Some(p) = self.pending.front() else {
            return Ok(());
        };
        self.dirty = true;
        let done = match self.sink.append(&p.line) {
            Ok(()) => self.sink.sync().map_err(|e| (Stage::Sync, e)),
            Err(e) => Err((Stage::Write, e)),
        };
        if let Err(failure) = done {
            // Never trust a retried fsync: the line is rewritten from memory next time.
            if self.sink.truncate(self.good_len).is_ok() {
                self.dirty = false;
            }
            return Err(failure);
        }
        self.dirty = false;
        self.good_len += p.line.len() as u64;
        self.saved_through = seq;
        self.last_saved = self.pending.pop_front().map(|p| p.record);
        Ok(())
    }

    /// The records numbered since the last call, oldest first, whether or not they are on
    /// disk yet (compare with [`JournalWriter::saved_through`]). The screens apply these to
    /// their live session state, so what they show is exactly what the journal holds.
    pub fn take_numbered(&mut self) -> Vec<Record> {
        std::mem::take(&mut self.numbered)
    }

    /// Write the session-end record.
    pub fn end_session(&mut self) -> Result<u64, JournalError> {
        self.append(None, Payload::SessionEnd)
    }

    /// Highest sequence number known to be on disk (0 if none).
    pub fn saved_through(&self) -> u64 {
        self.saved_through
    }

    /// Records numbered but not yet saved, oldest first: show these as unsaved.
    pub fn pending(&self) -> impl Iterator<Item = &Record> {
        self.pending.iter().map(|p| &p.record)
    }

    pub fn pending_count(&self) -> usize {
        self.pending.len()
    }

    /// Sequence number the next record will get.
    pub fn next_seq(&self) -> u64 {
        self.next_seq
    }

    pub fn session_id(&self) -> &str {
        &self.session_id
    }

    pub fn operator(&self) -> &str {
        &self.operator
    }

    /// A new operator takes over the session (shift handover).
    pub fn set_operator(&mut self, operator: &str) {
        self.operator = clean::line(operator);
    }

    /// The session file, for a writer opened on disk.
    pub fn path(&self) -> Option<&Path> {
        self.path.as_deref()
    }

    pub fn sink(&self) -> &S {
        &self.sink
    }

    pub fn sink_mut(&mut self) -> &mut S {
        &mut self.sink
    }
}

impl<S: Sink> std::fmt::Debug for JournalWriter<S> {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("JournalWriter")
            .field("path", &self.path)
            .field("session_id", &self.session_id)
            .field("operator", &self.operator)
            .field("next_seq", &self.next_seq)
            .field("saved_through", &self.saved_through)
            .field("pending", &self.pending.len())
            .finish_non_exhaustive()
    }
}
