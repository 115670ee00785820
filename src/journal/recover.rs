//! Setting a cut-off last line aside before a session continues.
//!
//! The fragment goes to `<name>.torn-<n>` (fsynced, folder fsynced) before the journal is
//! truncated, so nothing is lost even if power fails half-way through the repair.

use super::error::JournalError;
use super::reader::TornTail;
use super::sink::sync_dir;
use std::fs::{File, OpenOptions};
use std::io::{self, Write};
use std::path::{Path, PathBuf};

/// Move `bytes[tail.offset..]` of the locked `file` aside and cut the file back.
pub(crate) fn set_aside(
    file: &File,
    path: &Path,
    bytes: &[u8],
    tail: &mut TornTail,
) -> Result<(), JournalError> {
    let err = |source| JournalError::Recover {
        path: path.to_path_buf(),
        source,
    };
    let fragment = &bytes[tail.offset as usize..];
    let side = write_side_file(path, fragment).map_err(err)?;
    file.set_len(tail.offset).map_err(err)?;
    file.sync_all().map_err(err)?;
    tail.side_file = Some(side);
    Ok(())
}

/// The first free `<name>.torn-1`, `-2`, …; earlier fragments are never overwritten.
fn write_side_file(path: &Path, fragment: &[u8]) -> io::Result<PathBuf> {
    for n in 1..=9999u32 {
        let mut name = path.as_os_str().to_owned();
        name.push(format!(".torn-{n}"));
        let candidate = PathBuf::from(name);
        match OpenOptions::new()
            .write(true)
            .create_new(true)
            .open(&candidate)
        {
            Ok(mut side) => {
                side.write_all(fragment)?;
                side.sync_all()?;
                sync_dir(path.parent().unwrap_or(Path::new(".")))?;
                return Ok(candidate);
            }
            Err(e) if e.kind() == io::ErrorKind::AlreadyExists => {
                if holds_exactly(&candidate, fragment)? {
                    return Ok(candidate);
                }
            }
            Err(e) => return Err(e),
        }
    }
    Err(io::Error::other("no free side-file name"))
}

/// An earlier repair may have been cut off after saving the side file but before cutting
/// the journal back: reuse that copy instead of making a second one.
fn holds_exactly(side: &Path, fragment: &[u8]) -> io::Result<bool> {
    if std::fs::metadata(side)?.len() != fragment.len() as u64 {
        return Ok(false);
    }
    let same = std::fs::read(side)? == fragment;
    if same {
        File::open(side)?.sync_all()?;
    }
    Ok(same)
}
