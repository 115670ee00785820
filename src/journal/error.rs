//! Everything that can go wrong with a session journal, worded for the operator.

use std::fmt;
use std::io;
use std::path::PathBuf;

/// Which step of saving a record failed; a failed sync is never retried on its own.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Stage {
    Write,
    Sync,
    Truncate,
}

impl fmt::Display for Stage {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Stage::Write => "writing it",
            Stage::Sync => "flushing it to disk",
            Stage::Truncate => "removing a half-written line",
        })
    }
}

#[derive(Debug, thiserror::Error)]
pub enum JournalError {
    #[error(
        "site id {id:?} cannot name a journal file: {reason} (accepted: letters, digits, '.', '_', '-', not starting with '.')"
    )]
    BadName { id: String, reason: &'static str },

    #[error(
        "cannot create the log folder {}: {source}; choose a writable folder with --log-dir or RHEOSIDE_LOG_DIR",
        dir.display()
    )]
    CreateDir { dir: PathBuf, source: io::Error },

    #[error("cannot open session file {}: {source}", path.display())]
    Open { path: PathBuf, source: io::Error },

    #[error(
        "session file {} is open in another rheoside ({}); finish or close that one first, or start a new session (leave out --session)",
        path.display(), holder(*pid)
    )]
    Busy { path: PathBuf, pid: Option<u32> },

    #[error("cannot read session file {}: {source}", path.display())]
    Read { path: PathBuf, source: io::Error },

    #[error(
        "{}:{line}: {reason}; the file was left as it is: look at that line, or start a new session",
        path.display()
    )]
    Corrupt {
        path: PathBuf,
        line: usize,
        reason: String,
    },

    #[error(
        "session file {} holds no saved record, so there is no session to continue; start a new session",
        path.display()
    )]
    Empty { path: PathBuf },

    #[error("cannot set aside the cut-off last line of {}: {source}; the file was left as it is", path.display())]
    Recover { path: PathBuf, source: io::Error },

    #[error(
        "record {seq} is NOT saved: {stage} failed: {source}; {pending} record(s) wait in memory and are retried with the next record"
    )]
    Unsaved {
        seq: u64,
        pending: usize,
        stage: Stage,
        source: io::Error,
    },

    #[error("record not written: {what} is {value}, not a finite number")]
    NotFinite { what: String, value: f64 },

    #[error("cannot encode the record as JSON: {0}")]
    Encode(#[source] serde_json::Error),
}

fn holder(pid: Option<u32>) -> String {
    match pid {
        Some(pid) => format!("pid {pid}?"),
        None => "its pid could not be read".to_string(),
    }
}
