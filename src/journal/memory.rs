//! A journal kept in memory: for tests, and for trying what a failing disk does to a writer.

use super::sink::Sink;
use std::collections::VecDeque;
use std::io;

/// A disk failure to inject.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Fault {
    /// Half the bytes land, then the write reports an error (a full disk does this).
    WriteFailsHalfway,
    SyncFails,
    TruncateFails,
}

/// Bytes in a `Vec`, with the length the last successful sync covered.
#[derive(Debug, Default, Clone)]
pub struct MemorySink {
    data: Vec<u8>,
    durable: usize,
    faults: VecDeque<Fault>,
}

impl MemorySink {
    /// Queue a fault; queued faults fire in order, each at the next call of its kind.
    pub fn fail_next(&mut self, fault: Fault) {
        self.faults.push_back(fault);
    }

    pub fn data(&self) -> &[u8] {
        &self.data
    }

    /// How many bytes a power cut now would keep.
    pub fn durable_len(&self) -> usize {
        self.durable
    }

    fn fires(&mut self, fault: Fault) -> bool {
        let hit = self.faults.front() == Some(&fault);
        if hit {
            self.faults.pop_front();
        }
        hit
    }
}

impl Sink for MemorySink {
    fn append(&mut self, bytes: &[u8]) -> io::Result<()> {
        if self.fires(Fault::WriteFailsHalfway) {
            self.data.extend_from_slice(&bytes[..bytes.len() / 2]);
            return Err(io::Error::other("no space left on device (injected)"));
        }
        self.data.extend_from_slice(bytes);
        Ok(())
    }

    fn sync(&mut self) -> io::Result<()> {
        if self.fires(Fault::SyncFails) {
            return Err(io::Error::other("input/output error (injected)"));
        }
        self.durable = self.data.len();
        Ok(())
    }

    fn truncate(&mut self, len: u64) -> io::Result<()> {
        if self.fires(Fault::TruncateFails) {
            return Err(io::Error::other("truncate refused (injected)"));
        }
        self.data
            .truncate(usize::try_from(len).unwrap_or(usize::MAX));
        self.durable = self.durable.min(self.data.len());
        Ok(())
    }
}
