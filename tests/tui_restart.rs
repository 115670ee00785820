//! The Restart view driven through the app without a terminal: the paste line L-2 and its
//! pump P-2 on the demo site, three rested-gel readings typed into fields that own their
//! keys, saved with Ctrl-S; the readings journalled on the line, the answer journalled as a
//! restart result linked to them, and its numbers checked against the force balance worked
//! here. Screens at 80×24 as snapshots, and in ASCII mode.

use crate::support;
use crate::support::{ctrl, press, type_text};

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::KeyCode;
use rheoside::journal::{Payload, Record, ResultKind};
use rheoside::tui::app::{App, RunState};
use rheoside::tui::keymap::Context;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs};
use rheoside::tui::views;

/// Invented rested-gel readings made exactly from the demo paste's own build-up,
/// τ(t) = 520 − 400·e^(−t/7200 s) Pa (τi 120 Pa, τ∞ 520 Pa, tr 2 h), at 10 s, 10 min, 30 min.
const GELS: [&str; 3] = ["120.555", "151.982", "208.480"];

fn screen(app: &App) -> String {
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(app, f)).expect("drawing");
    support::screen_text(t.backend().buffer())
}

/// Pick L-2 and filler-paste on the Site view, then go to the Restart view.
fn on_restart_view(glyphs: Glyphs) -> App {
    let mut a = support::demo_app(ColourMode::Plain, glyphs, "ana", "logs/test.jsonl");
    // Sample points list tanks, then lines, then pumps: TK-1, TK-2, L-1, L-2.
    for _ in 0..3 {
        press(&mut a, KeyCode::Down);
    }
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Down);
    press(&mut a, KeyCode::Enter);
    assert_eq!(a.ctx.picks.equipment.as_deref(), Some("L-2"));
    assert_eq!(a.ctx.picks.product.as_deref(), Some("filler-paste"));
    while a.active_id() != views::restart::ID {
        press(&mut a, KeyCode::Tab);
    }
    a
}

/// Into the first gel field, the three readings typed, with a 62 h stop, then Ctrl-S.
fn enter_and_save(a: &mut App) -> Vec<Record> {
    press(a, KeyCode::Down);
    press(a, KeyCode::Down);
    for (i, g) in GELS.iter().enumerate() {
        type_text(a, g);
        press(a, KeyCode::Tab);
        if i < GELS.len() - 1 {
            press(a, KeyCode::Tab);
        }
    }
    // On row 4's rest time: down to row 5, then to the stop.
    press(a, KeyCode::Down);
    press(a, KeyCode::Down);
    type_text(a, "62 h");
    ctrl(a, 's');
    support::journal_answers(a, true)
}

#[test]
fn the_paste_line_will_not_restart_after_a_weekend_and_the_answer_is_journalled() {
    let mut a = on_restart_view(Glyphs::Unicode);
    let records = enter_and_save(&mut a);
    let kinds: Vec<&str> = records.iter().map(|r| r.payload.kind()).collect();
    assert_eq!(kinds, [["reading"; 7].as_slice(), &["result"]].concat());
    // The readings on the line, as typed: rest, gel, rest, gel, rest, gel, then the stop.
    let typed: Vec<(String, String)> = records[..7]
        .iter()
        .map(|r| match &r.payload {
            Payload::Reading { name, raw, .. } => (name.clone(), raw.clone()),
            other => panic!("expected a reading, got {other:?}"),
        })
        .collect();
    let want = [
        ("rest-time", "10 s"),
        ("yield-stress", GELS[0]),
        ("rest-time", "10 min"),
        ("yield-stress", GELS[1]),
        ("rest-time", "30 min"),
        ("yield-stress", GELS[2]),
        ("rest-time", "62 h"),
    ]
    .map(|(a, b)| (a.to_string(), b.to_string()));
    assert_eq!(typed, want);
    assert!(
        records
            .iter()
            .all(|r| r.equipment.as_deref() == Some("L-2"))
    );
    let result = &records[7];
    let Payload::Result {
        result_kind,
        from,
        data,
        ..
    } = &result.payload
    else {
        panic!("expected the restart result");
    };
    assert_eq!(*result_kind, Some(ResultKind::Restart));
    let seqs: Vec<u64> = records[..7].iter().map(|r| r.seq).collect();
    assert_eq!(from, &seqs);
    assert_eq!(data["pump"], "P-2");
    assert_eq!(data["will_restart"], false);
    // Force balance on the gelled plug, worked here: ΔP = 4·τ·L/D + ρ·g·Δz + back-pressure,
    // with L = 32 m + 6 m of fittings, D = 62.7 mm, ρ = 1480 kg/m³, Δz = 2 m, 0.2 bar held at
    // the outlet (the demo site). After 62 h (31 time constants) the gel is τ∞ = 520 Pa to
    // within e^(−31): 4·520·38/0.0627 + 1480·9.80665·2 + 20 000 = 1 309 634 Pa.
    let restart = data["restart_pressure_pa"].as_f64().unwrap_or(0.0);
    assert!(
        (restart - 1_309_634.0).abs() < 0.002 * 1_309_634.0,
        "{restart}"
    );
    assert_eq!(data["available_pressure_pa"].as_f64(), Some(1.2e6));
    // The fit of three exact readings gives back the build-up they were made from.
    let tr = data["gel"]["time_constant_s"].as_f64().unwrap_or(0.0);
    assert!((tr - 7200.0).abs() < 0.01 * 7200.0, "{tr}");
    let s = screen(&a);
    assert!(s.contains("will not restart: needs 13.1 bar"), "{s}");
    assert!(
        s.contains("the relief opens at") && s.contains("12.0 bar"),
        "{s}"
    );
    assert!(
        s.contains("Answer for L-2 journalled: will not restart"),
        "{s}"
    );
    insta::assert_snapshot!("restart_answer_80x24", s);
}

#[test]
fn fields_own_every_printable_key() {
    let mut a = on_restart_view(Glyphs::Unicode);
    press(&mut a, KeyCode::Down);
    press(&mut a, KeyCode::Down);
    assert_eq!(a.context(), Context::Editing);
    // q, n and ? would quit, open a note and the help at the top level; a quantity field
    // takes the letters (units are typed there) and refuses the '?' without acting on it.
    type_text(&mut a, "q n?");
    assert_eq!(a.state(), RunState::Running);
    assert_eq!(*a.overlay(), rheoside::tui::overlay::Overlay::None);
    assert!(a.take_outbox().is_empty());
    assert!(screen(&a).contains("q n "));
    // Esc puts the field back and leaves the fields: Tab walks the views again.
    press(&mut a, KeyCode::Esc);
    assert!(matches!(a.context(), Context::Top(_)));
    assert!(!screen(&a).contains("q n "));
    let ids: Vec<_> = a.views().iter().map(|v| v.id()).collect();
    let next = ids
        .iter()
        .position(|id| *id == views::restart::ID)
        .map(|i| ids[i + 1]);
    press(&mut a, KeyCode::Tab);
    assert_eq!(Some(a.active_id()), next);
}

#[test]
fn a_bad_reading_is_refused_in_words_and_nothing_is_journalled() {
    let mut a = on_restart_view(Glyphs::Unicode);
    press(&mut a, KeyCode::Down);
    press(&mut a, KeyCode::Down);
    type_text(&mut a, "150 rpm");
    press(&mut a, KeyCode::Tab);
    press(&mut a, KeyCode::Tab);
    type_text(&mut a, "200");
    ctrl(&mut a, 's');
    assert!(a.take_outbox().is_empty());
    assert!(
        a.status().starts_with("row 1 gel stress:"),
        "{}",
        a.status()
    );
    // The refusal took the focus to the bad field. Gel that falls with rest is not a
    // build-up: refused before anything is journalled.
    ctrl(&mut a, 'u');
    type_text(&mut a, "300");
    ctrl(&mut a, 's');
    assert!(a.take_outbox().is_empty());
    assert!(a.status().starts_with("Not saved:"), "{}", a.status());
}

#[test]
fn without_a_product_nothing_is_saved() {
    let mut a = support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "t.jsonl");
    while a.active_id() != views::restart::ID {
        press(&mut a, KeyCode::Tab);
    }
    // With nothing picked the view takes the first line a pump feeds.
    assert!(screen(&a).contains("< L-1 >"));
    ctrl(&mut a, 's');
    assert!(a.take_outbox().is_empty());
    assert!(a.status().contains("No product picked"), "{}", a.status());
    // Left and right on the line row pick another line, and its pump with it.
    press(&mut a, KeyCode::Right);
    let s = screen(&a);
    assert!(s.contains("< L-2 >") && s.contains("< P-2 >"), "{s}");
}

#[test]
fn restart_view_before_any_reading_at_80x24() {
    let a = on_restart_view(Glyphs::Unicode);
    insta::assert_snapshot!("restart_empty_80x24", screen(&a));
}

#[test]
fn restart_view_in_ascii_is_all_ascii() {
    let mut a = on_restart_view(Glyphs::Ascii);
    enter_and_save(&mut a);
    let s = screen(&a);
    assert!(s.contains("will not restart"), "{s}");
    let odd: Vec<char> = s.chars().filter(|c| !c.is_ascii()).collect();
    assert!(odd.is_empty(), "not ASCII: {odd:?}\n{s}");
    insta::assert_snapshot!("restart_ascii_80x24", s);
}

#[test]
fn the_answer_scrolls_no_further_than_its_last_line() {
    let mut a = on_restart_view(Glyphs::Unicode);
    enter_and_save(&mut a);
    // Each key followed by a frame, as in the app: far past the end, then one page back.
    for _ in 0..30 {
        press(&mut a, KeyCode::PageDown);
        screen(&a);
    }
    let end = screen(&a);
    press(&mut a, KeyCode::PageDown);
    assert_eq!(screen(&a), end);
    press(&mut a, KeyCode::PageUp);
    assert_ne!(screen(&a), end, "PgUp at the end moves at once");
}
