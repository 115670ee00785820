//! Helpers shared by the terminal-UI tests and benches (included with `#[path]` from
//! benches/tui.rs). Each includer uses a part, hence the allowance below.
#![allow(dead_code)]

use chrono::DateTime;
use portable_pty::{PtyPair, PtySize, native_pty_system};
use ratatui::buffer::Buffer;
use rheoside::tui::app::App;
use rheoside::tui::startup;
use rheoside::tui::theme::{ColourMode, Glyphs, Theme};
use std::io::{self, Write};
use std::sync::Arc;
use std::sync::atomic::{AtomicUsize, Ordering};

/// The app on the bundled demo site at a fixed moment, so screens are repeatable.
pub fn demo_app(mode: ColourMode, glyphs: Glyphs, operator: &str, journal: &str) -> App {
    let site = rheoside::site::demo().expect("the demo site loads");
    let now = DateTime::parse_from_rfc3339("2026-12-01T08:00:00+01:00").expect("a valid time");
    startup::app_for(site, operator, Theme::new(mode, glyphs), now, journal)
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
