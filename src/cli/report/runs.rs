//! The runs of a session: each resumption and how the run before it ended.

use super::md::both;
use crate::journal::PreviousEnd;
use crate::session::SessionState;

/// "1" for a session never resumed; otherwise the count and each resumption.
pub(crate) fn runs_text(s: &SessionState) -> String {
    if s.resumptions.is_empty() {
        return "1".to_string();
    }
    let each: Vec<String> = s
        .resumptions
        .iter()
        .map(|r| {
            let how = match r.item {
                PreviousEnd::Clean => "after a clean end",
                PreviousEnd::NoEndRecord => "after a run that did not end (no end record)",
            };
            format!("resumed at record {}, {}, {how}", r.seq, both(&r.at))
        })
        .collect();
    format!("{} ({})", s.resumptions.len() + 1, each.join("; "))
}

/// A problem line for each run that stopped without an end record and was resumed.
pub(crate) fn unfinished_runs(s: &SessionState) -> Vec<String> {
    s.resumptions
        .iter()
        .filter(|r| r.item == PreviousEnd::NoEndRecord)
        .map(|r| {
            format!(
                "Record {} ({}): the previous run did not end (no session-end record: a crash, \
                 a kill or a power loss); readings it had not saved are lost.",
                r.seq,
                both(&r.at)
            )
        })
        .collect()
}
