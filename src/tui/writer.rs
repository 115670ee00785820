//! The journal on its own thread, so an fsync never freezes typing: the UI sends records,
//! the thread appends and fsyncs them and answers with what is on disk.

use crate::journal::{JournalWriter, Payload, Record, Sink};
use std::sync::mpsc::{self, Receiver, RecvTimeoutError, Sender};
use std::thread::JoinHandle;
use std::time::Duration;

/// The UI's own number for a record it sent, before the journal has numbered it.
pub type Ticket = u64;

/// How often unsaved records are tried again while nothing new arrives.
const RETRY_EVERY: Duration = Duration::from_secs(5);
/// How long quitting waits for the last records to reach the disk.
const CLOSE_WAIT: Duration = Duration::from_secs(5);

enum Job {
    Append {
        ticket: Ticket,
        equipment: Option<String>,
        payload: Payload,
    },
    Close,
}

/// What the thread reports after each job or retry.
#[derive(Debug, Clone, PartialEq)]
pub struct Reply {
    /// The record this answers, if any (a retry answers none).
    pub ticket: Option<Ticket>,
    /// The sequence number the journal gave that record.
    pub seq: Option<u64>,
    /// Every record up to here is on disk.
    pub saved_through: u64,
    /// Records numbered but not yet on disk.
    pub pending: usize,
    /// Why the last attempt failed, in words.
    pub error: Option<String>,
    /// The thread has finished; nothing more will come.
    pub closed: bool,
    /// Records the journal numbered since the last reply, saved or not yet (compare their
    /// `seq` with `saved_through`): the UI applies these to its live session state.
    pub records: Vec<Record>,
}

/// The UI's end of the writer thread.
pub struct JournalLink {
    jobs: Option<Sender<Job>>,
    replies: Receiver<Reply>,
    thread: Option<JoinHandle<()>>,
    /// The highest ticket sent, so the session-end record gets a fresh one.
    last_ticket: Ticket,
}

impl JournalLink {
    /// Move the writer onto its own thread.
    pub fn start<S: Sink + Send + 'static>(writer: JournalWriter<S>) -> JournalLink {
        let (job_tx, job_rx) = mpsc::channel();
        let (reply_tx, reply_rx) = mpsc::channel();
        let thread = std::thread::Builder::new()
            .name("journal".to_string())
            .spawn(move || serve(writer, &job_rx, &reply_tx))
            .ok();
        JournalLink {
            jobs: thread.as_ref().map(|_| job_tx),
            replies: reply_rx,
            thread,
            last_ticket: 0,
        }
    }

    /// Queue a record under the UI's ticket; the ticket comes back in a `Reply`. False if
    /// the thread is gone.
    pub fn send(&mut self, ticket: Ticket, equipment: Option<String>, payload: Payload) -> bool {
        let job = Job::Append {
            ticket,
            equipment,
            payload,
        };
        self.last_ticket = self.last_ticket.max(ticket);
        self.jobs
            .as_ref()
            .is_some_and(|jobs| jobs.send(job).is_ok())
    }

    /// Replies that have arrived, without waiting.
    pub fn replies(&self) -> Vec<Reply> {
        self.replies.try_iter().collect()
    }

    /// Write the session-end record, wait (bounded) for the disk, and stop the thread.
    /// Returns the replies that came in meanwhile.
    pub fn close(&mut self, end: Option<Payload>) -> Vec<Reply> {
        let mut got = Vec::new();
        let Some(jobs) = self.jobs.take() else {
            return got;
        };
        if let Some(payload) = end {
            let _ = jobs.send(Job::Append {
                ticket: self.last_ticket + 1,
                equipment: None,
                payload,
            });
        }
        let _ = jobs.send(Job::Close);
        while let Ok(reply) = self.replies.recv_timeout(CLOSE_WAIT) {
            let closed = reply.closed;
            got.push(reply);
            if closed {
                if let Some(t) = self.thread.take() {
                    let _ = t.join();
                }
                break;
            }
        }
        got
    }
}

impl Drop for JournalLink {
    /// On any way out (a panic unwinding included) pending records get their chance.
    fn drop(&mut self) {
        self.close(None);
    }
}

fn serve<S: Sink>(mut writer: JournalWriter<S>, jobs: &Receiver<Job>, replies: &Sender<Reply>) {
    loop {
        let wait = if writer.pending_count() > 0 {
            RETRY_EVERY
        } else {
            Duration::from_secs(3600)
        };
        match jobs.recv_timeout(wait) {
            Ok(Job::Append {
                ticket,
                equipment,
                payload,
            }) => {
                let before = writer.next_seq();
                let result = writer.append(equipment.as_deref(), payload).map(|_| ());
                let seq = (writer.next_seq() > before).then_some(before);
                let _ = replies.send(reply(&mut writer, Some(ticket), seq, result));
            }
            Ok(Job::Close) | Err(RecvTimeoutError::Disconnected) => break,
            Err(RecvTimeoutError::Timeout) => {
                let result = writer.flush_pending().map(|_| ());
                let _ = replies.send(reply(&mut writer, None, None, result));
            }
        }
    }
    let result = writer.flush_pending().map(|_| ());
    let mut last = reply(&mut writer, None, None, result);
    last.closed = true;
    let _ = replies.send(last);
}

fn reply<S: Sink, E: std::fmt::Display>(
    writer: &mut JournalWriter<S>,
    ticket: Option<Ticket>,
    seq: Option<u64>,
    result: Result<(), E>,
) -> Reply {
    Reply {
        ticket,
        seq,
        saved_through: writer.saved_through(),
        pending: writer.pending_count(),
        error: result.err().map(|e| e.to_string()),
        closed: false,
        records: writer.take_numbered(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::journal::{Continuation, Stamp, StepClock};
    use std::io;
    use std::sync::atomic::{AtomicBool, Ordering};
    use std::sync::{Arc, Mutex};

    /// Storage that fails while `broken` is set, like a full or vanished disk.
    #[derive(Clone, Default)]
    struct Disk {
        bytes: Arc<Mutex<Vec<u8>>>,
        broken: Arc<AtomicBool>,
    }

    impl Sink for Disk {
        fn append(&mut self, bytes: &[u8]) -> io::Result<()> {
            if self.broken.load(Ordering::SeqCst) {
                return Err(io::Error::other("no space left on device"));
            }
            self.bytes
                .lock()
                .map_err(|_| io::Error::other("lock"))?
                .extend_from_slice(bytes);
            Ok(())
        }
        fn sync(&mut self) -> io::Result<()> {
            Ok(())
        }
        fn truncate(&mut self, len: u64) -> io::Result<()> {
            let mut b = self.bytes.lock().map_err(|_| io::Error::other("lock"))?;
            b.truncate(usize::try_from(len).unwrap_or(usize::MAX));
            Ok(())
        }
    }

    fn link(disk: &Disk) -> JournalLink {
        let start = Stamp {
            utc: chrono::DateTime::UNIX_EPOCH,
            offset: chrono::FixedOffset::east_opt(0).expect("UTC"),
        };
        let from = Continuation {
            session_id: "s1".into(),
            operator: "ana".into(),
            next_seq: 2,
            file_len: 0,
        };
        let clock = StepClock::new(start, chrono::Duration::seconds(1));
        JournalLink::start(JournalWriter::with_sink(
            disk.clone(),
            from,
            Box::new(clock),
        ))
    }

    fn note(text: &str) -> Payload {
        Payload::Note { text: text.into() }
    }

    fn next_reply(l: &JournalLink) -> Reply {
        l.replies
            .recv_timeout(Duration::from_secs(10))
            .expect("a reply")
    }

    #[test]
    fn a_record_is_reported_saved_with_its_number() {
        let disk = Disk::default();
        let mut l = link(&disk);
        assert!(l.send(7, Some("TK-1".into()), note("ok")));
        let r = next_reply(&l);
        assert_eq!(
            (r.ticket, r.seq, r.saved_through, r.pending, r.error),
            (Some(7), Some(2), 2, 0, None)
        );
        let closing = l.close(Some(Payload::SessionEnd));
        assert!(
            closing
                .last()
                .is_some_and(|r| r.closed && r.saved_through == 3)
        );
        let text = String::from_utf8(disk.bytes.lock().expect("lock").clone()).expect("UTF-8");
        assert_eq!(text.lines().count(), 2);
        assert!(text.contains("\"kind\":\"session-end\""));
    }

    #[test]
    fn a_failed_write_stays_pending_and_is_saved_on_close() {
        let disk = Disk::default();
        disk.broken.store(true, Ordering::SeqCst);
        let mut l = link(&disk);
        l.send(1, None, note("first"));
        let r = next_reply(&l);
        assert_eq!((r.seq, r.saved_through, r.pending), (Some(2), 1, 1));
        assert!(
            r.error
                .as_deref()
                .is_some_and(|e| e.contains("no space left")),
            "{r:?}"
        );
        disk.broken.store(false, Ordering::SeqCst);
        let closing = l.close(None);
        let last = closing.last().expect("a closing reply");
        assert_eq!(
            (last.saved_through, last.pending, last.closed),
            (2, 0, true)
        );
        assert!(disk.bytes.lock().expect("lock").ends_with(b"\n"));
    }
}
