//! Opening a session file with an exclusive advisory lock, so two writers never interleave.
//!
//! The lock is `flock` (std `File::try_lock`), taken on a read+append handle: Windows will
//! not lock an append-only handle. It is advisory and unreliable on NFS: keep logs on a
//! local disk.

use super::error::JournalError;
use std::fs::{File, OpenOptions, TryLockError};
use std::path::Path;

/// Whether the file must be new or must already exist.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Open {
    CreateNew,
    Existing,
}

pub(crate) fn open_locked(path: &Path, how: Open) -> Result<File, JournalError> {
    let mut opts = OpenOptions::new();
    opts.read(true).append(true);
    if how == Open::CreateNew {
        opts.create_new(true);
    }
    let file = opts.open(path).map_err(|source| JournalError::Open {
        path: path.to_path_buf(),
        source,
    })?;
    match file.try_lock() {
        Ok(()) => Ok(file),
        Err(TryLockError::WouldBlock) => Err(JournalError::Busy {
            path: path.to_path_buf(),
            pid: holder_pid(&file),
        }),
        Err(TryLockError::Error(source)) => Err(JournalError::Open {
            path: path.to_path_buf(),
            source,
        }),
    }
}

/// Best guess at who holds the lock, from `/proc/locks` (Linux); only a hint for the message.
#[cfg(target_os = "linux")]
fn holder_pid(file: &File) -> Option<u32> {
    use std::os::unix::fs::MetadataExt;
    let inode = file.metadata().ok()?.ino();
    let locks = std::fs::read_to_string("/proc/locks").ok()?;
    locks.lines().find_map(|l| flock_holder(l, inode))
}

#[cfg(not(target_os = "linux"))]
fn holder_pid(_file: &File) -> Option<u32> {
    None
}

/// A `/proc/locks` line looks like `3: FLOCK  ADVISORY  WRITE 2150 fd:01:1234 0 EOF`;
/// waiting requests carry `->` and are skipped.
#[cfg(target_os = "linux")]
fn flock_holder(line: &str, inode: u64) -> Option<u32> {
    let mut words = line.split_whitespace().skip(1);
    if words.next()? != "FLOCK" {
        return None;
    }
    let pid = words.nth(2)?.parse().ok()?;
    let ino = words.next()?.rsplit(':').next()?.parse::<u64>().ok()?;
    (ino == inode).then_some(pid)
}
