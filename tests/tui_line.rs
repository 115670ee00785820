//! The Line view on the demo site: the paste line L-2 with filler-paste's nominal curve,
//! the what-if keys, and the screen at 80×24 (and in ASCII).

use crate::support;

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::{KeyCode, KeyEvent};
use rheoside::tui::app::App;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs};
use rheoside::tui::views;

fn press(app: &mut App, code: KeyCode) {
    app.on_key(&KeyEvent::from(code));
}

fn screen(app: &App) -> String {
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(app, f)).expect("drawing");
    support::screen_text(t.backend().buffer())
}

fn on_line_view(glyphs: Glyphs) -> App {
    let mut a = support::demo_app(ColourMode::Plain, glyphs, "ana", "logs/test.jsonl");
    for _ in 0..3 {
        press(&mut a, KeyCode::Down);
    }
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Down);
    press(&mut a, KeyCode::Enter);
    while a.active_id() != views::line::ID {
        press(&mut a, KeyCode::Tab);
    }
    a
}

#[test]
fn the_paste_line_curve_at_80x24() {
    let a = on_line_view(Glyphs::Unicode);
    let s = screen(&a);
    assert!(s.contains("L-2  filler-paste"), "{s}");
    assert!(s.contains("Herschel–Bulkley"), "{s}");
    insta::assert_snapshot!("line_80x24", s);
}

// Arrhenius, Steffe 1996 §1.10: K(T) = K_ref·exp[(Ea/R)(1/T − 1/T_ref)]; 20 kJ/mol from 20 °C
// to 15 °C: exp(20000/8.314462618·(1/288.15 − 1/293.15)) = exp(0.14238) = 1.1530.
#[test]
fn cooler_shifts_the_consistency_by_arrhenius() {
    let mut a = on_line_view(Glyphs::Unicode);
    press(&mut a, KeyCode::Char('c'));
    let s = screen(&a);
    assert!(s.contains("5 K cooler, 0 % thicker"), "{s}");
    assert!(s.contains("×1.153"), "{s}");
    press(&mut a, KeyCode::Char('0'));
    assert!(screen(&a).contains("as measured"));
}

#[test]
fn line_view_in_ascii_is_all_ascii() {
    let mut a = on_line_view(Glyphs::Ascii);
    press(&mut a, KeyCode::Char('t'));
    let s = screen(&a);
    let odd: Vec<char> = s.chars().filter(|c| !c.is_ascii()).collect();
    assert!(odd.is_empty(), "not ASCII: {odd:?}\n{s}");
}
