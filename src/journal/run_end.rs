//! How the previous run of a session ended, as journalled when the session is resumed.
//!
//! A run that ended on purpose wrote a session-end record; one that was killed, crashed or
//! lost power did not. The journal cannot tell those three apart, so it says which it could be.

use serde::{Deserialize, Serialize};

/// What the journal showed of the previous run's end when the session was picked up again.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum PreviousEnd {
    /// The last record was a session-end record: the run was closed on purpose.
    Clean,
    /// No session-end record: the run stopped by a crash, a kill or a power loss.
    NoEndRecord,
}

impl PreviousEnd {
    /// From the records already in the file.
    pub fn of(records: &[super::Record]) -> PreviousEnd {
        match records.last().map(|r| &r.payload) {
            Some(super::Payload::SessionEnd) => PreviousEnd::Clean,
            _ => PreviousEnd::NoEndRecord,
        }
    }

    /// One sentence for the report and the screens.
    pub fn explain(self) -> &'static str {
        match self {
            PreviousEnd::Clean => "resumed; the previous run ended cleanly",
            PreviousEnd::NoEndRecord => {
                "resumed; the previous run did not end (no session-end record: a crash, a kill \
                 or a power loss); readings it had not saved are lost"
            }
        }
    }
}
