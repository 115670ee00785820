//! Taking over the terminal and giving it back: raw mode and the alternate screen on entry;
//! restored on drop, on panic (a hook) and after SIGHUP/SIGTERM (a flag the loop checks).
//! No mouse capture, no keyboard-protocol query, nothing that waits for the terminal.

use ratatui::Terminal;
use ratatui::backend::CrosstermBackend;
use ratatui::crossterm::{cursor, execute, style, terminal};
use std::io::{self, Stdout};
use std::sync::Arc;
use std::sync::Once;
use std::sync::atomic::{AtomicBool, Ordering};

pub type Term = Terminal<CrosstermBackend<Stdout>>;

/// Put the terminal back as it was. Errors are ignored: after a hang-up there may be no
/// terminal left to write to.
pub fn restore() {
    let _ = terminal::disable_raw_mode();
    let _ = execute!(io::stdout(), terminal::LeaveAlternateScreen, cursor::Show);
}

/// Restores the terminal when dropped, on every way out of the loop, errors included.
pub struct TerminalGuard {
    pub terminal: Term,
}

impl TerminalGuard {
    pub fn enter() -> io::Result<TerminalGuard> {
        install_panic_hook();
        // crossterm writes a bare `ESC[m` (reset all) for colours under NO_COLOR, which
        // would cancel inverse display; the theme maps colours to Reset itself instead.
        style::force_color_output(true);
        terminal::enable_raw_mode()?;
        if let Err(e) = execute!(io::stdout(), terminal::EnterAlternateScreen, cursor::Hide) {
            restore();
            return Err(e);
        }
        match Terminal::new(CrosstermBackend::new(io::stdout())) {
            Ok(terminal) => Ok(TerminalGuard { terminal }),
            Err(e) => {
                restore();
                Err(e)
            }
        }
    }
}

impl Drop for TerminalGuard {
    fn drop(&mut self) {
        restore();
    }
}

/// The panic hook restores the terminal first, so the message is readable, then runs the
/// hook that was there before. Installed once per process.
fn install_panic_hook() {
    static ONCE: Once = Once::new();
    ONCE.call_once(|| {
        let previous = std::panic::take_hook();
        std::panic::set_hook(Box::new(move |info| {
            restore();
            previous(info);
        }));
    });
}

/// Set when SIGHUP, SIGTERM or SIGINT arrives; the loop then flushes the journal and leaves.
#[derive(Clone, Default)]
pub struct StopFlag(Arc<AtomicBool>);

impl StopFlag {
    /// Register for the signals that end a session from outside.
    pub fn register() -> io::Result<StopFlag> {
        let flag = StopFlag::default();
        #[cfg(unix)]
        {
            use signal_hook::consts::{SIGHUP, SIGINT, SIGTERM};
            for sig in [SIGHUP, SIGTERM, SIGINT] {
                // A second signal while the first is being handled ends the process at once,
                // so a stuck disk can never make the program unkillable.
                signal_hook::flag::register_conditional_shutdown(sig, 1, Arc::clone(&flag.0))?;
                signal_hook::flag::register(sig, Arc::clone(&flag.0))?;
            }
        }
        Ok(flag)
    }

    pub fn is_set(&self) -> bool {
        self.0.load(Ordering::SeqCst)
    }

    #[cfg(test)]
    pub fn set(&self) {
        self.0.store(true, Ordering::SeqCst);
    }
}

#[cfg(test)]
mod tests {
    use super::StopFlag;

    #[test]
    fn a_stop_flag_starts_clear_and_is_shared_by_clones() {
        let f = StopFlag::default();
        let g = f.clone();
        assert!(!f.is_set());
        g.set();
        assert!(f.is_set());
    }
}
