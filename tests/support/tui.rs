//! Helpers shared by the terminal-UI tests and benches (included with `#[path]` from
//! benches/tui.rs). Each includer uses a part, hence the allowance below.
#![allow(dead_code)]

use chrono::DateTime;
use portable_pty::{PtyPair, PtySize, native_pty_system};
use ratatui::buffer::Buffer;
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use rheoside::journal::{Payload, Record};
use rheoside::tui::app::App;
use rheoside::tui::startup;
use rheoside::tui::theme::{ColourMode, Glyphs, Theme};
use rheoside::tui::writer::Reply;
use std::io::{self, Write};
use std::sync::Arc;
use std::sync::atomic::{AtomicUsize, Ordering};

/// One key press, no modifiers.
pub fn press(app: &mut App, code: KeyCode) {
    app.on_key(&KeyEvent::from(code));
}

/// Ctrl and a letter (Ctrl-S saves a form).
pub fn ctrl(app: &mut App, c: char) {
    app.on_key(&KeyEvent::new(KeyCode::Char(c), KeyModifiers::CONTROL));
}

/// Each character of `text` as a key press.
pub fn type_text(app: &mut App, text: &str) {
    for c in text.chars() {
        press(app, KeyCode::Char(c));
    }
}

/// The app on the bundled demo site at a fixed moment, so screens are repeatable, with its
/// session-start record on disk as the real start-up leaves it.
pub fn demo_app(mode: ColourMode, glyphs: Glyphs, operator: &str, journal: &str) -> App {
    let site = rheoside::site::demo().expect("the demo site loads");
    let now = DateTime::parse_from_rfc3339("2026-12-01T08:00:00+01:00").expect("a valid time");
    let start = Payload::SessionStart {
        site_id: site.id.clone(),
        site_source: site.source.clone(),
    };
    let mut app = startup::app_for(site, operator, Theme::new(mode, glyphs), now, journal);
    let first = record(&app, 1, start);
    app.apply_saved(&[first]);
    app
}

/// A record as the journal would number and stamp it for this app.
fn record(app: &App, seq: u64, payload: Payload) -> Record {
    Record {
        seq,
        session: "test-session".to_string(),
        utc: app.ctx.clock.now.with_timezone(&chrono::Utc),
        offset: *app.ctx.clock.now.offset(),
        operator: app.ctx.operator.clone(),
        equipment: None,
        payload,
        version: env!("CARGO_PKG_VERSION").to_string(),
    }
}

/// Stand in for the writer thread: number what the app has sent as the journal would and
/// answer, saved on disk or (with `saved = false`) numbered but not yet fsynced, until the
/// app sends nothing more (a saved set is answered by its curve). Returns the records.
pub fn journal_answers(app: &mut App, saved: bool) -> Vec<Record> {
    let mut all = Vec::new();
    let mut through = app.ctx.log.saved_through();
    loop {
        let out = app.take_outbox();
        if out.is_empty() {
            return all;
        }
        for o in out {
            let seq = app.ctx.session.last_seq + 1;
            let mut r = record(app, seq, o.payload);
            r.equipment = o.equipment;
            if saved {
                through = seq;
            }
            app.on_reply(&Reply {
                ticket: Some(o.ticket),
                seq: Some(seq),
                saved_through: through,
                pending: usize::from(!saved),
                error: None,
                closed: false,
                records: vec![r.clone()],
            });
            all.push(r);
        }
    }
}

/// A drawn buffer as text, one line per row.
pub fn screen_text(buf: &Buffer) -> String {
    (0..buf.area.height)
        .map(|y| {
            (0..buf.area.width)
                .map(|x| buf[(x, y)].symbol())
                .collect::<String>()
        })
        .collect::<Vec<_>>()
        .join("\n")
}

/// Counts the bytes the app sends to the terminal.
#[derive(Clone, Default)]
pub struct Counter(pub Arc<AtomicUsize>);

impl Write for Counter {
    fn write(&mut self, buf: &[u8]) -> io::Result<usize> {
        self.0.fetch_add(buf.len(), Ordering::Relaxed);
        Ok(buf.len())
    }
    fn flush(&mut self) -> io::Result<()> {
        Ok(())
    }
}

/// A pseudo-terminal of the size the product promises to work in.
pub fn pty_80x24() -> PtyPair {
    native_pty_system()
        .openpty(PtySize {
            rows: 24,
            cols: 80,
            pixel_width: 0,
            pixel_height: 0,
        })
        .expect("a pty")
}
