//! Where record bytes go: a small trait so tests can put a failing disk under the writer.

use std::fs::File;
use std::io::{self, Write};
use std::path::Path;

/// The three things the writer asks of storage.
pub trait Sink {
    /// Append all of `bytes` at the end (one `write_all`).
    fn append(&mut self, bytes: &[u8]) -> io::Result<()>;
    /// Make everything appended so far durable (data and the length).
    fn sync(&mut self) -> io::Result<()>;
    /// Cut the store back to `len` bytes, dropping anything a failed append left behind.
    fn truncate(&mut self, len: u64) -> io::Result<()>;
}

/// A session file opened read+append and locked; the lock lives as long as this does.
#[derive(Debug)]
pub struct FileSink {
    file: File,
}

impl FileSink {
    pub(crate) fn new(file: File) -> Self {
        FileSink { file }
    }
}

impl Sink for FileSink {
    fn append(&mut self, bytes: &[u8]) -> io::Result<()> {
        self.file.write_all(bytes)
    }

    fn sync(&mut self) -> io::Result<()> {
        self.file.sync_data()
    }

    fn truncate(&mut self, len: u64) -> io::Result<()> {
        self.file.set_len(len)
    }
}

/// fsync a folder so a file just created (or renamed) in it survives a power cut.
pub(crate) fn sync_dir(dir: &Path) -> io::Result<()> {
    #[cfg(unix)]
    {
        let dir = if dir.as_os_str().is_empty() {
            Path::new(".")
        } else {
            dir
        };
        File::open(dir)?.sync_all()
    }
    #[cfg(not(unix))]
    {
        // Windows cannot open a folder as a file; NTFS journals the directory entry itself.
        let _ = dir;
        Ok(())
    }
}
