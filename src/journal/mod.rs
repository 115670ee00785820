//! Session journals: one append-only JSON Lines file per session, crash-safe.
//!
//! Every record is one line written with one `write_all` and fsynced before it is reported
//! saved; the folder is fsynced when a file is created. A session file is locked by its one
//! writer. On resume a cut-off last line is moved to a side file, never dropped silently.
//! Reading (`load`) never changes a file.

mod clean;
mod clock;
mod error;
mod lock;
mod memory;
mod naming;
mod open;
mod reader;
mod record;
mod recover;
mod run_end;
mod sink;
mod writer;

pub use clock::{Clock, Stamp, StepClock, SystemClock};
pub use error::{JournalError, Stage};
pub use memory::{Fault, MemorySink};
pub use naming::{new_session_id, os_user, session_file_name, site_file_stem};
pub use open::{NewSession, Resumed};
pub use reader::{Loaded, TornTail, load};
pub use record::{DialRow, Payload, Record, ResultKind, Severity};
pub use run_end::PreviousEnd;
pub use sink::{FileSink, Sink};
pub use writer::{Continuation, JournalWriter};
