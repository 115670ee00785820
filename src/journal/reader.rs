//! Reading a session file back: every complete line a record, a cut-off last line reported.

use super::error::JournalError;
use super::record::{Payload, Record};
use std::fmt;
use std::path::{Path, PathBuf};

/// A last line that was never completely written (no newline, or not a record).
///
/// Such a line was never reported saved: records are reported only after their fsync,
/// and a record is written only once the one before it is saved, so only the last line
/// can be cut off.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct TornTail {
    /// Byte offset where the cut-off line starts (= length of the good part).
    pub offset: u64,
    pub len: u64,
    /// The start of the fragment, cleaned for display.
    pub preview: String,
    /// Where the fragment was moved, once it has been set aside (on resume).
    pub side_file: Option<PathBuf>,
}

impl fmt::Display for TornTail {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "the last line ({} bytes at offset {}, starting '{}') was cut off and was never reported saved; ",
            self.len, self.offset, self.preview
        )?;
        match &self.side_file {
            Some(p) => write!(f, "it was moved to {}", p.display()),
            None => f.write_str("it is left in place and set aside when the session is resumed"),
        }
    }
}

/// A journal as read from disk.
#[derive(Debug, Clone, PartialEq)]
pub struct Loaded {
    pub path: PathBuf,
    pub records: Vec<Record>,
    pub torn: Option<TornTail>,
}

impl Loaded {
    pub fn session_id(&self) -> Option<&str> {
        self.records.first().map(|r| r.session.as_str())
    }

    pub fn last_seq(&self) -> u64 {
        self.records.last().map_or(0, |r| r.seq)
    }

    /// The site id from the session-start record.
    pub fn site_id(&self) -> Option<&str> {
        self.records.iter().find_map(|r| match &r.payload {
            Payload::SessionStart { site_id, .. } => Some(site_id.as_str()),
            _ => None,
        })
    }
}

/// Read a journal without changing it.
///
/// Safe while another rheoside is appending: its line in flight shows up as `torn`
/// and is left alone. Any bad line other than the last is an error, never skipped.
pub fn load(path: &Path) -> Result<Loaded, JournalError> {
    let bytes = std::fs::read(path).map_err(|source| JournalError::Read {
        path: path.to_path_buf(),
        source,
    })?;
    scan(path, &bytes)
}

/// Split `bytes` into records and a possible torn tail, and check the sequence (the reader
/// behind [`load`], public for the fuzz target that feeds it arbitrary bytes).
pub fn scan(path: &Path, bytes: &[u8]) -> Result<Loaded, JournalError> {
    let corrupt = |line, reason| JournalError::Corrupt {
        path: path.to_path_buf(),
        line,
        reason,
    };
    let complete = bytes.iter().rposition(|&b| b == b'\n').map_or(0, |i| i + 1);
    let mut records = Vec::new();
    let mut good = 0usize;
    let mut torn_at = None;
    for (i, line) in bytes[..complete]
        .split_inclusive(|&b| b == b'\n')
        .enumerate()
    {
        match serde_json::from_slice::<Record>(line) {
            Ok(r) => records.push(r),
            Err(_) if good + line.len() == complete && complete == bytes.len() => {
                torn_at = Some(good);
                break;
            }
            Err(e) => return Err(corrupt(i + 1, format!("not a journal record ({e})"))),
        }
        good += line.len();
    }
    if torn_at.is_none() && complete < bytes.len() {
        torn_at = Some(complete);
    }
    check_sequence(&records).map_err(|(i, reason)| corrupt(i + 1, reason))?;
    Ok(Loaded {
        path: path.to_path_buf(),
        records,
        torn: torn_at.map(|at| torn_tail(&bytes[at..], at)),
    })
}

fn torn_tail(fragment: &[u8], at: usize) -> TornTail {
    let text = String::from_utf8_lossy(&fragment[..fragment.len().min(60)]);
    TornTail {
        offset: at as u64,
        len: fragment.len() as u64,
        preview: crate::text::sanitize(&text, false),
        side_file: None,
    }
}

/// Records must run 1, 2, 3… in one session; a gap means a line went missing.
fn check_sequence(records: &[Record]) -> Result<(), (usize, String)> {
    let Some(first) = records.first() else {
        return Ok(());
    };
    for (i, r) in records.iter().enumerate() {
        let want = i as u64 + 1;
        if r.seq != want {
            return Err((
                i,
                format!("record number {} where {want} was expected", r.seq),
            ));
        }
        if r.session != first.session {
            return Err((
                i,
                format!("session {:?} inside session {:?}", r.session, first.session),
            ));
        }
    }
    Ok(())
}
