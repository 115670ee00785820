//! Terminal input, reduced to what the app reacts to: key presses, resizes, and the
//! terminal going away.

use ratatui::crossterm::event::{self, Event};
use rustix::event::{PollFd, PollFlags, Timespec};
use std::io::{self, IsTerminal};
use std::time::Duration;

/// Something from the terminal the app must react to.
#[derive(Debug, Clone, PartialEq)]
pub enum Input {
    Key(event::KeyEvent),
    /// The size changed; redraw. A 0×0 size (a dropped SSH session) is not drawn.
    Resize,
    /// The terminal hung up (SSH dropped, tmux killed): flush the journal and leave.
    HangUp,
}

/// Wait up to `timeout` for input; `None` when nothing came. Mouse, focus and paste
/// events are not enabled, and any that arrive anyway are dropped.
///
/// Why the terminal is checked here before crossterm reads it: crossterm 0.29's reader
/// loops for ever when the terminal has hung up (its read gets EOF or EIO and tries again
/// without returning), so a dropped SSH session would leave a process spinning a core and
/// never journalling its session end. A hang-up seen first is reported as `HangUp`.
pub fn next(timeout: Duration) -> io::Result<Option<Input>> {
    if terminal_state(Duration::ZERO) == Terminal::Gone {
        return Ok(Some(Input::HangUp));
    }
    // Events crossterm already holds (several keys arrive in one read) come first.
    if event::poll(Duration::ZERO)? {
        return read();
    }
    if terminal_state(timeout) == Terminal::Gone {
        return Ok(Some(Input::HangUp));
    }
    // Zero-wait: picks up input that just arrived and a pending resize signal.
    if event::poll(Duration::ZERO)? {
        return read();
    }
    Ok(None)
}

fn read() -> io::Result<Option<Input>> {
    Ok(match event::read()? {
        Event::Key(k) => Some(Input::Key(k)),
        Event::Resize(..) => Some(Input::Resize),
        _ => None,
    })
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Terminal {
    /// Input is waiting, or the wait timed out: crossterm may read.
    Alive,
    Gone,
}

/// Wait up to `timeout` on standard input (the terminal crossterm reads when stdin is a
/// terminal) and say whether it hung up.
fn terminal_state(timeout: Duration) -> Terminal {
    let stdin = io::stdin();
    if !stdin.is_terminal() {
        // crossterm then reads /dev/tty, which we do not hold; wait as before.
        std::thread::sleep(timeout.min(Duration::from_millis(10)));
        return Terminal::Alive;
    }
    let mut fds = [PollFd::new(&stdin, PollFlags::IN)];
    let wait = Timespec {
        tv_sec: timeout.as_secs() as i64,
        tv_nsec: i64::from(timeout.subsec_nanos()),
    };
    match rustix::event::poll(&mut fds, Some(&wait)) {
        Ok(_) => classify(fds[0].revents()),
        // Interrupted by a signal: the caller looks at its stop flag next.
        Err(_) => Terminal::Alive,
    }
}

fn classify(revents: PollFlags) -> Terminal {
    if revents.intersects(PollFlags::HUP | PollFlags::ERR | PollFlags::NVAL) {
        Terminal::Gone
    } else {
        Terminal::Alive
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn hang_up_error_and_closed_descriptor_mean_gone() {
        assert_eq!(classify(PollFlags::HUP | PollFlags::IN), Terminal::Gone);
        assert_eq!(classify(PollFlags::ERR), Terminal::Gone);
        assert_eq!(classify(PollFlags::NVAL), Terminal::Gone);
        assert_eq!(classify(PollFlags::IN), Terminal::Alive);
        assert_eq!(classify(PollFlags::empty()), Terminal::Alive);
    }
}
