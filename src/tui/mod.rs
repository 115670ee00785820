//! The operator's terminal UI: one loop of event → action → update → draw.
//!
//! Set-up happens before the terminal is touched (site config, journal file), so every
//! error there is plain text on stderr. The journal is written on its own thread; drawing
//! reads state only. On the way out (quit, error, signal) pending records are flushed
//! before the terminal is given back; a panic restores the terminal from its hook.

pub mod app;
pub mod ctx;
pub mod event;
pub mod key;
pub mod keymap;
pub mod layout;
pub mod options;
pub mod overlay;
pub mod render;
pub mod session_log;
pub mod startup;
pub mod strings;
pub mod terminal;
pub mod theme;
pub mod views;
pub mod widgets;
pub mod writer;

use app::{App, RunState};
use event::Input;
pub use options::TuiOptions;
use std::io::IsTerminal;
use std::process::ExitCode;
use std::time::Duration;
use terminal::{StopFlag, Term, TerminalGuard};
use writer::JournalLink;

/// How long to wait for a key before looking at the journal, the clock and signals.
const POLL: Duration = Duration::from_millis(100);

/// Exit code for bad input or a wrong place to run (no terminal), as the command line uses.
pub const EXIT_BAD_INPUT: u8 = 2;

pub fn run(opts: &TuiOptions) -> anyhow::Result<ExitCode> {
    if !std::io::stdout().is_terminal() {
        eprintln!("{}", strings::NOT_A_TERMINAL);
        return Ok(ExitCode::from(EXIT_BAD_INPUT));
    }
    let start = match startup::prepare(opts)? {
        Ok(start) => start,
        Err(code) => return Ok(code),
    };
    let mut app = start.app;
    let mut link = JournalLink::start(start.writer);
    let stop = StopFlag::register()?;
    let mut guard = TerminalGuard::enter()?;
    let outcome = run_loop(&mut guard.terminal, &mut app, &mut link, &stop);
    // Flush first, then give the terminal back.
    for reply in link.close(Some(crate::journal::Payload::SessionEnd)) {
        app.on_reply(&reply);
    }
    drop(guard);
    outcome?;
    Ok(startup::farewell(&app, stop.is_set()))
}

fn run_loop(
    term: &mut Term,
    app: &mut App,
    link: &mut JournalLink,
    stop: &StopFlag,
) -> anyhow::Result<()> {
    let mut dirty = true;
    let mut shown_second = None;
    let drill = panic_drill();
    while app.state() == RunState::Running {
        if stop.is_set() {
            app.force_quit();
            break;
        }
        dirty |= pump_journal(app, link);
        let now = chrono::Local::now().fixed_offset();
        if shown_second != Some(now.timestamp()) {
            shown_second = Some(now.timestamp());
            app.tick(now);
            dirty = true;
        }
        if dirty {
            draw(term, app)?;
            dirty = false;
        }
        match event::next(POLL)? {
            Some(Input::Key(key)) => {
                app.on_key(&key);
                dirty = true;
                if drill && key.code == ratatui::crossterm::event::KeyCode::F(12) {
                    panic!("fault drill: a panic on F12 (RHEOSIDE_FAULT_DRILL=panic)");
                }
            }
            Some(Input::Resize) => dirty = true,
            Some(Input::HangUp) => {
                app.force_quit();
                break;
            }
            None => {}
        }
    }
    pump_journal(app, link);
    Ok(())
}

/// The fault drill of the test suite: with `RHEOSIDE_FAULT_DRILL=panic`, F12 panics inside
/// the loop, so a test can check that a panic gives the terminal back (the panic hook and the
/// guard's drop). Off unless that variable is set; nothing else reads it.
fn panic_drill() -> bool {
    std::env::var("RHEOSIDE_FAULT_DRILL").is_ok_and(|v| v == "panic")
}

/// Hand new records to the writer thread and take in its answers; true if anything changed.
fn pump_journal(app: &mut App, link: &mut JournalLink) -> bool {
    let mut changed = false;
    for out in app.take_outbox() {
        if !link.send(out.ticket, out.equipment, out.payload) {
            app.ctx.log.writer_lost(strings::status::WRITER_GONE);
        }
        changed = true;
    }
    for reply in link.replies() {
        app.on_reply(&reply);
        changed = true;
    }
    changed
}

/// A hung-up terminal can report 0×0: nothing is drawn then.
fn draw(term: &mut Term, app: &App) -> std::io::Result<()> {
    let size = term.size()?;
    if size.width == 0 || size.height == 0 {
        return Ok(());
    }
    term.draw(|frame| render::draw(app, frame))?;
    Ok(())
}
