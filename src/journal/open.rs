//! Starting a new session file, or continuing one after a stop or a crash.

use super::clock::Clock;
use super::error::JournalError;
use super::lock::{Open, open_locked};
use super::naming::{new_session_id, session_file_name};
use super::reader::{Loaded, scan};
use super::record::Payload;
use super::recover::set_aside;
use super::run_end::PreviousEnd;
use super::sink::{FileSink, sync_dir};
use super::writer::{Continuation, JournalWriter};
use std::fs::File;
use std::io::Read;
use std::path::{Path, PathBuf};

/// What a new session needs to know.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct NewSession {
    pub log_dir: PathBuf,
    pub site_id: String,
    /// A config path, or a note that the bundled demo site is used.
    pub site_source: String,
    pub operator: String,
}

#[derive(Debug)]
/// A session picked up again: the writer, what was already in the file, and any repair.
pub struct Resumed {
    pub writer: JournalWriter<FileSink>,
    /// The records already saved; `loaded.torn` says what was set aside, if anything.
    pub loaded: Loaded,
}

impl JournalWriter<FileSink> {
    /// Create `<log_dir>/<site>_<start>_<id>.jsonl`, lock it and save the session-start record.
    pub fn create(new: &NewSession, clock: Box<dyn Clock>) -> Result<Self, JournalError> {
        let stamp = clock.now();
        let session_id = new_session_id(stamp.utc);
        let name = session_file_name(&new.site_id, stamp.utc, &session_id)?;
        make_log_dir(&new.log_dir)?;
        let path = new.log_dir.join(name);
        let file = open_locked(&path, Open::CreateNew)?;
        let from = Continuation {
            session_id,
            operator: operator_or_unknown(&new.operator),
            next_seq: 1,
            file_len: 0,
        };
        let mut writer = JournalWriter::with_sink(FileSink::new(file), from, clock);
        writer.set_path(path.clone());
        let start = Payload::SessionStart {
            site_id: new.site_id.clone(),
            site_source: new.site_source.clone(),
        };
        let saved = sync_dir(&new.log_dir)
            .map_err(|source| JournalError::Open {
                path: path.clone(),
                source,
            })
            .and_then(|()| writer.append_at(stamp, None, start));
        if let Err(e) = saved {
            drop(writer);
            // An empty file would only confuse a later resume.
            let _ = std::fs::remove_file(&path);
            return Err(e);
        }
        Ok(writer)
    }

    /// Lock an existing session file, set aside a cut-off last line, and continue the same
    /// session with the next sequence number. A session-resumed record saying how the
    /// previous run ended (cleanly, or with no end record) is saved first; it is the last of
    /// `loaded.records`.
    pub fn resume(
        path: &Path,
        operator: &str,
        clock: Box<dyn Clock>,
    ) -> Result<Resumed, JournalError> {
        let file = open_locked(path, Open::Existing)?;
        let bytes = read_all(&file, path)?;
        let mut loaded = scan(path, &bytes)?;
        if let Some(tail) = loaded.torn.as_mut() {
            set_aside(&file, path, &bytes, tail)?;
        }
        let Some(last) = loaded.records.last() else {
            return Err(JournalError::Empty {
                path: path.to_path_buf(),
            });
        };
        let from = Continuation {
            session_id: last.session.clone(),
            operator: operator_or_unknown(operator),
            next_seq: last.seq + 1,
            file_len: loaded
                .torn
                .as_ref()
                .map_or(bytes.len() as u64, |t| t.offset),
        };
        let mut writer = JournalWriter::with_sink(FileSink::new(file), from, clock);
        writer.set_path(path.to_path_buf());
        // Say how the previous run ended before anything else is added, so a report shows a
        // kill or a power loss instead of running the two runs together.
        let previous_end = PreviousEnd::of(&loaded.records);
        writer.append(None, Payload::SessionResumed { previous_end })?;
        if let Some(record) = writer.last_saved.take() {
            loaded.records.push(record);
        }
        Ok(Resumed { writer, loaded })
    }
}

fn operator_or_unknown(operator: &str) -> String {
    let clean = super::clean::line(operator);
    if clean.is_empty() {
        "unknown".to_string()
    } else {
        clean
    }
}

fn read_all(mut file: &File, path: &Path) -> Result<Vec<u8>, JournalError> {
    let mut bytes = Vec::new();
    file.read_to_end(&mut bytes)
        .map_err(|source| JournalError::Read {
            path: path.to_path_buf(),
            source,
        })?;
    Ok(bytes)
}

/// Create the log folder if needed; a folder just made is fsynced into its parent.
fn make_log_dir(dir: &Path) -> Result<(), JournalError> {
    let err = |source| JournalError::CreateDir {
        dir: dir.to_path_buf(),
        source,
    };
    if dir.is_dir() {
        return Ok(());
    }
    std::fs::create_dir_all(dir).map_err(err)?;
    match dir.parent() {
        Some(parent) => sync_dir(parent).map_err(err),
        None => Ok(()),
    }
}
