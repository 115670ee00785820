//! Terminal UI costs: the first frame (app built on the demo site, drawn once at 80×24),
//! one typed digit (time, and bytes on the wire through the real crossterm backend), a
//! full redraw at 200×60 of the Flow curve, Line and Tank views, and process start to first
//! frame in a pseudo-terminal.
//! Run with `cargo bench --bench tui`. Readings are invented (an HB-like sauce).

#[path = "../tests/support/tui.rs"]
mod support;

use divan::{Bencher, black_box};
use portable_pty::CommandBuilder;
use ratatui::backend::{CrosstermBackend, TestBackend};
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use ratatui::layout::Rect;
use ratatui::{Terminal, TerminalOptions, Viewport};
use rheoside::tui::app::App;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs};
use std::io::Read;
use std::num::NonZeroU16;
use std::sync::atomic::Ordering;
use std::sync::{Arc, Mutex};
use std::time::{Duration, Instant};

fn main() {
    let (full, digit) = digit_bytes();
    eprintln!("bytes for a full 80x24 frame of the Readings form: {full}");
    eprintln!("bytes for one digit typed into a dial field: {digit}");
    divan::main();
}

fn app() -> App {
    support::demo_app(
        ColourMode::Colour,
        Glyphs::Unicode,
        "bench",
        "logs/bench.jsonl",
    )
}

fn keys(app: &mut App, text: &str) {
    for c in text.chars() {
        let code = match c {
            '\r' => KeyCode::Enter,
            '\t' => KeyCode::Tab,
            c => KeyCode::Char(c),
        };
        app.on_key(&KeyEvent::from(code));
    }
}

/// The readings form with the picks made and the first dial being typed into ("1": below
/// 10 % of scale, so the next digit changes no check and only the digit, the row's stress
/// and the cursor are sent; the same case as the render test's byte count).
fn typing_app() -> App {
    let mut a = app();
    keys(&mut a, "\r\r\t1");
    a
}

/// A saved set on the Flow curve view: the busiest screen. Ctrl-S saves (a bare `s` types).
fn curve_app() -> App {
    let mut a = app();
    keys(&mut a, "\r\r\t110\r76\r61.5\r44\r16\r14\r");
    a.on_key(&KeyEvent::new(KeyCode::Char('s'), KeyModifiers::CONTROL));
    support::journal_answers(&mut a, true);
    a
}

/// The demo app with `downs` Down presses then Enter on the Site list (equipment), Down and
/// Enter on the product, then Tab until the view `id` is active.
fn app_on_view(downs: usize, id: rheoside::tui::views::ViewId) -> App {
    let mut a = app();
    for _ in 0..downs {
        a.on_key(&KeyEvent::from(KeyCode::Down));
    }
    keys(&mut a, "\r");
    a.on_key(&KeyEvent::from(KeyCode::Down));
    keys(&mut a, "\r");
    for _ in 0..a.views().len() {
        if a.active_id() == id {
            break;
        }
        keys(&mut a, "\t");
    }
    a
}

fn redraw_200x60(bencher: Bencher, a: &App) {
    let mut t = Terminal::new(TestBackend::new(200, 60)).expect("a test terminal");
    bencher.bench_local(|| {
        t.clear().expect("clearing");
        t.draw(|f| render::draw(black_box(a), f)).expect("drawing");
    });
}

/// The Line view on the paste line L-2 with filler-paste: curve, band, pump and words.
#[divan::bench]
fn line_view_redraw_200x60(bencher: Bencher) {
    redraw_200x60(bencher, &app_on_view(3, rheoside::tui::views::line::ID));
}

/// The Tank view on TK-1: power curve, side view and the answer.
#[divan::bench]
fn tank_view_redraw_200x60(bencher: Bencher) {
    redraw_200x60(bencher, &app_on_view(0, rheoside::tui::views::tank::ID));
}

#[divan::bench]
fn first_frame_80x24() -> Terminal<TestBackend> {
    let a = app();
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(&a, f)).expect("drawing");
    t
}

#[divan::bench]
fn full_redraw_200x60(bencher: Bencher) {
    let a = curve_app();
    let mut t = Terminal::new(TestBackend::new(200, 60)).expect("a test terminal");
    bencher.bench_local(|| {
        // Clearing forgets the last frame, so every cell is drawn and sent again.
        t.clear().expect("clearing");
        t.draw(|f| render::draw(black_box(&a), f)).expect("drawing");
    });
}

#[divan::bench]
fn typed_digit_80x24(bencher: Bencher) {
    let mut a = typing_app();
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(&a, f)).expect("drawing");
    bencher.bench_local(|| {
        keys(&mut a, "2");
        t.draw(|f| render::draw(&a, f)).expect("drawing");
        a.on_key(&KeyEvent::from(KeyCode::Backspace));
        t.draw(|f| render::draw(&a, f)).expect("drawing");
    });
}

/// Bytes the crossterm backend writes for a whole first frame, and for the frame after one
/// more digit.
fn digit_bytes() -> (usize, usize) {
    let mut a = typing_app();
    let counter = support::Counter::default();
    let options = TerminalOptions {
        viewport: Viewport::Fixed(Rect::new(0, 0, 80, 24)),
    };
    let backend = CrosstermBackend::new(counter.clone());
    let Ok(mut t) = Terminal::with_options(backend, options) else {
        return (0, 0);
    };
    let _ = t.draw(|f| render::draw(&a, f));
    let full = counter.0.swap(0, Ordering::Relaxed);
    keys(&mut a, "2");
    let _ = t.draw(|f| render::draw(&a, f));
    (full, counter.0.load(Ordering::Relaxed))
}

/// A started program; stopping it (SIGHUP, up to 250 ms until portable-pty's SIGKILL) and
/// removing its journal happen on drop, which divan does after the timed part.
struct Started {
    child: Box<dyn portable_pty::Child + Send + Sync>,
    _logs: tempfile::TempDir,
}

impl Drop for Started {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

/// The release binary in a pty at 80×24 until its first frame is on the parsed screen:
/// process creation, site load, journal create (two fsyncs), terminal set-up, first draw.
#[divan::bench(sample_count = 10, sample_size = 1)]
fn process_start_to_first_frame(bencher: Bencher) {
    bencher.bench_local(|| {
        let logs = tempfile::tempdir().expect("a temp dir");
        let pty = support::pty_80x24();
        let mut cmd = CommandBuilder::new(env!("CARGO_BIN_EXE_rheoside"));
        cmd.args(["--log-dir", logs.path().to_str().expect("a UTF-8 path")]);
        cmd.env("TERM", "xterm-256color");
        let child = pty.slave.spawn_command(cmd).expect("the binary starts");
        drop(pty.slave);
        let mut reader = pty.master.try_clone_reader().expect("a pty reader");
        let (rows, cols) = (
            NonZeroU16::new(24).expect("24"),
            NonZeroU16::new(80).expect("80"),
        );
        let screen = Arc::new(Mutex::new(vt100::Parser::new(rows, cols, 0)));
        let sink = Arc::clone(&screen);
        std::thread::spawn(move || {
            let mut buf = [0u8; 4096];
            while let Ok(n) = reader.read(&mut buf) {
                if n == 0 {
                    break;
                }
                sink.lock().expect("screen lock").process(&buf[..n]);
            }
            drop(pty.master);
        });
        let start = Instant::now();
        while !screen
            .lock()
            .expect("screen lock")
            .screen()
            .contents()
            .contains("Sample point")
        {
            assert!(start.elapsed() < Duration::from_secs(20), "no first frame");
            std::thread::sleep(Duration::from_micros(200));
        }
        Started { child, _logs: logs }
    });
}
