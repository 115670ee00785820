//! Where record time stamps come from: the system clock, or a fixed one in tests.

use chrono::{DateTime, Duration, FixedOffset, Local, Utc};
use std::sync::Mutex;

/// A moment in UTC and the local offset in force at that moment.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Stamp {
    pub utc: DateTime<Utc>,
    pub offset: FixedOffset,
}

/// Passed in so the journal (and its tests) never reach for the clock behind your back.
pub trait Clock: Send {
    fn now(&self) -> Stamp;
}

/// The wall clock: `chrono::Local::now`, split into UTC and the local offset.
#[derive(Debug, Clone, Copy, Default)]
pub struct SystemClock;

impl Clock for SystemClock {
    fn now(&self) -> Stamp {
        let local = Local::now();
        Stamp {
            utc: local.with_timezone(&Utc),
            offset: *local.offset(),
        }
    }
}

impl<F: Fn() -> Stamp + Send> Clock for F {
    fn now(&self) -> Stamp {
        self()
    }
}

/// A clock for tests: starts at `start` and moves on by `step` each time it is read.
#[derive(Debug)]
pub struct StepClock {
    next: Mutex<Stamp>,
    step: Duration,
}

impl StepClock {
    pub fn new(start: Stamp, step: Duration) -> Self {
        StepClock {
            next: Mutex::new(start),
            step,
        }
    }
}

impl Clock for StepClock {
    fn now(&self) -> Stamp {
        // A poisoned lock only means another test thread panicked; the stamp is still valid.
        let mut next = self.next.lock().unwrap_or_else(|e| e.into_inner());
        let now = *next;
        next.utc += self.step;
        now
    }
}
