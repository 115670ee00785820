//! The Readings form's own keys (issue 8): every printable key types in a text field, Tab
//! goes dial to dial and never changes a speed, a field entered by Tab has its text replaced
//! by typing, Left/Right stay in their field, a viscometer change asks before it could part
//! dials from their instrument, the status line clears on the next key and says where the
//! cursor went, short sets ask before saving, and each row's checks show while it is typed.

use crate::support;
use crate::support::{ctrl, press, type_text};

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use rheoside::journal::Payload;
use rheoside::tui::app::App;
use rheoside::tui::keymap::Context;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs};
use rheoside::tui::views;

fn app() -> App {
    support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/test.jsonl")
}

fn screen(app: &App) -> String {
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(app, f))
        .expect("drawing into memory");
    support::screen_text(t.backend().buffer())
}

/// The table row of reading `n` (1-based) as drawn.
fn table_row(app: &App, n: usize) -> String {
    let s = screen(app);
    let want = format!("│{n:>3}  ");
    s.lines()
        .find(|l| l.starts_with(&want))
        .unwrap_or_default()
        .to_string()
}

/// A row's speed and dial cells as drawn (speed 16 columns, dial 12, from the form's layout).
fn cells(speed: &str, dial: &str) -> String {
    format!("  {speed:<16}{dial:<12}")
}

/// Pick TK-1 (and its product), go to Readings and into the form at the first dial.
fn in_form(app: &mut App) {
    press(app, KeyCode::Enter);
    press(app, KeyCode::Enter);
    press(app, KeyCode::Tab);
    assert_eq!(app.active_id(), views::readings::ID);
    press(app, KeyCode::Enter);
    assert_eq!(app.context(), Context::Editing);
}

const DIALS: [&str; 6] = ["110", "76", "61.5", "44", "16", "14"];

fn enter_dials(app: &mut App) {
    for d in DIALS {
        type_text(app, d);
        press(app, KeyCode::Enter);
    }
}

/// The set journalled by a save, if any.
fn saved_set(app: &mut App) -> Option<Payload> {
    app.take_outbox()
        .into_iter()
        .map(|o| o.payload)
        .find(|p| matches!(p, Payload::ViscometerSet { .. }))
}

#[test]
fn every_letter_types_into_notes_and_nothing_is_saved_or_switched() {
    let mut a = app();
    in_form(&mut a);
    enter_dials(&mut a);
    // Enter from the last dial goes to Notes. Every letter a-z, both cases, and the keys
    // that act outside the form (q quit, n note, ? help, m model, s save, Tab).
    let text = "sampled: the quick brown fox jumps over the lazy dog QMS?";
    type_text(&mut a, text);
    assert!(a.take_outbox().is_empty(), "a letter journalled something");
    assert_eq!(a.active_id(), views::readings::ID);
    assert_eq!(a.context(), Context::Editing, "still typing");
    assert!(screen(&a).contains(text), "{}", screen(&a));
    // The note goes with the set when it is saved deliberately.
    ctrl(&mut a, 's');
    let out = a.take_outbox();
    assert!(matches!(out[0].payload, Payload::ViscometerSet { .. }));
    assert_eq!(out[1].payload, Payload::Note { text: text.into() });
}

#[test]
fn tab_through_a_six_speed_set_never_changes_a_speed() {
    let mut a = app();
    in_form(&mut a);
    let speeds = ["600", "300", "200", "100", "6", "3"];
    // Type each dial and Tab on, then Tab through the whole form twice more typing digits
    // wherever the cursor lands: on the six-speed instrument it never lands in a speed.
    for d in DIALS {
        type_text(&mut a, d);
        press(&mut a, KeyCode::Tab);
    }
    for (n, speed) in speeds.iter().enumerate() {
        let row = table_row(&a, n + 1);
        assert!(row.contains(&cells(speed, DIALS[n])), "{row}");
    }
    for _ in 0..2 {
        for _ in 0..9 {
            press(&mut a, KeyCode::BackTab);
        }
        for _ in 0..6 {
            press(&mut a, KeyCode::Tab);
        }
    }
    for (n, speed) in speeds.iter().enumerate() {
        assert!(table_row(&a, n + 1).contains(&cells(speed, DIALS[n])));
    }
    ctrl(&mut a, 's');
    let Some(Payload::ViscometerSet { rows, .. }) = saved_set(&mut a) else {
        panic!("the set was not saved: {}", a.status());
    };
    let rpm: Vec<String> = rows.iter().map(|r| r.rpm_raw.clone()).collect();
    assert_eq!(rpm, speeds);
}

#[test]
fn tab_goes_from_a_dial_to_the_next_dial_and_typing_replaces_it() {
    let mut a = app();
    in_form(&mut a);
    type_text(&mut a, "110");
    press(&mut a, KeyCode::Tab);
    type_text(&mut a, "76");
    // Back to the first dial: its 110 is selected, so typing replaces it (no "11090").
    press(&mut a, KeyCode::BackTab);
    type_text(&mut a, "90");
    assert!(
        table_row(&a, 1).contains(&cells("600", "90")),
        "{}",
        table_row(&a, 1)
    );
    assert!(
        table_row(&a, 2).contains(&cells("300", "76")),
        "{}",
        table_row(&a, 2)
    );
    // Moving inside the text first keeps it: Left, then a digit, inserts.
    press(&mut a, KeyCode::Tab);
    press(&mut a, KeyCode::End);
    type_text(&mut a, "5");
    assert!(
        table_row(&a, 2).contains(&cells("300", "765")),
        "{}",
        table_row(&a, 2)
    );
}

#[test]
fn left_and_right_stay_inside_their_field() {
    let mut a = app();
    in_form(&mut a);
    type_text(&mut a, "44");
    for _ in 0..5 {
        press(&mut a, KeyCode::Left);
    }
    type_text(&mut a, "1");
    for _ in 0..5 {
        press(&mut a, KeyCode::Right);
    }
    type_text(&mut a, "2");
    // The cursor stopped at each end of the dial: nothing went into the speed column.
    assert!(
        table_row(&a, 1).contains(&cells("600", "1442")),
        "{}",
        table_row(&a, 1)
    );
}

#[test]
fn changing_the_viscometer_asks_before_it_keeps_typed_dials_with_another_instrument() {
    let mut a = app();
    in_form(&mut a);
    type_text(&mut a, "52");
    press(&mut a, KeyCode::Enter);
    // Up past row 1's dial and the temperature to the viscometer; Enter there moves on.
    for _ in 0..3 {
        press(&mut a, KeyCode::Up);
    }
    press(&mut a, KeyCode::Enter);
    assert!(screen(&a).contains("< VIS-A >"), "Enter does not switch");
    press(&mut a, KeyCode::Up);
    press(&mut a, KeyCode::Right);
    assert!(
        screen(&a).contains("< VIS-A >"),
        "the first Right only asks"
    );
    assert!(
        a.status().contains("1 dial(s) typed on VIS-A"),
        "{}",
        a.status()
    );
    assert!(
        a.status().contains("again to switch to VIS-B"),
        "{}",
        a.status()
    );
    press(&mut a, KeyCode::Right);
    let s = screen(&a);
    assert!(s.contains("< VIS-B >"), "{s}");
    assert!(
        a.status()
            .starts_with("Viscometer now VIS-B (was VIS-A): 1 typed dials kept"),
        "{}",
        a.status()
    );
    // The dial and its speed stayed together.
    assert!(
        table_row(&a, 1).contains(&cells("600", "52")),
        "{}",
        table_row(&a, 1)
    );
    // 600 rpm is beyond the 200 rpm the demo's cup-and-bob runs at (its site config).
    assert!(
        table_row(&a, 1).contains("outside 0.5-200 rpm"),
        "{}",
        table_row(&a, 1)
    );
}

#[test]
fn without_dials_the_viscometer_switches_at_once_with_its_own_speeds() {
    let mut a = app();
    in_form(&mut a);
    press(&mut a, KeyCode::Up);
    press(&mut a, KeyCode::Up);
    press(&mut a, KeyCode::Left);
    assert!(screen(&a).contains("< VIS-B >"));
    assert!(
        a.status()
            .contains("speeds set to this instrument's usual ones")
    );
    assert!(!table_row(&a, 1).contains("600"), "{}", table_row(&a, 1));
}

#[test]
fn the_status_line_clears_on_the_next_key_and_a_refusal_says_where_the_cursor_is() {
    let mut a = app();
    in_form(&mut a);
    type_text(&mut a, "-3");
    press(&mut a, KeyCode::Enter);
    ctrl(&mut a, 's');
    assert!(saved_set(&mut a).is_none());
    assert!(
        a.status().contains("the cursor is on row 1 dial"),
        "{}",
        a.status()
    );
    // The cursor is in that dial, its text selected: the next key replaces it.
    type_text(&mut a, "9");
    assert!(a.status().is_empty(), "{}", a.status());
    assert!(
        table_row(&a, 1).contains(&cells("600", "9")),
        "{}",
        table_row(&a, 1)
    );
    // Up from there goes up a field, it does not type.
    press(&mut a, KeyCode::Up);
    type_text(&mut a, "20");
    assert!(screen(&a).contains("Temperature   20"), "{}", screen(&a));
}

#[test]
fn a_set_shorter_than_the_simplest_model_needs_asks_before_it_is_saved() {
    let mut a = app();
    in_form(&mut a);
    type_text(&mut a, "110");
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "76");
    press(&mut a, KeyCode::Enter);
    ctrl(&mut a, 's');
    assert!(saved_set(&mut a).is_none());
    // Newtonian has one constant; AICc needs readings - constants - 1 > 0, so 3 readings.
    assert!(a.status().contains("2 readings"), "{}", a.status());
    assert!(a.status().contains("Ctrl-S again"), "{}", a.status());
    ctrl(&mut a, 's');
    assert!(saved_set(&mut a).is_some());
}

#[test]
fn each_row_shows_its_rate_stress_and_checks_as_it_is_typed() {
    let mut a = app();
    in_form(&mut a);
    // 600 rpm x 1.7023 1/s per rpm = 1021 1/s; 52 x 0.511 Pa = 26.6 Pa (API RP 13D standard
    // geometry constants).
    type_text(&mut a, "52");
    assert!(
        table_row(&a, 1).contains("1021 1/s  26.6 Pa"),
        "{}",
        table_row(&a, 1)
    );
    // Row 3 (200 rpm) reads above rows 1 and 2 (600 and 300 rpm): out of speed order.
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "150");
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "160");
    assert!(
        table_row(&a, 3).contains("! above row 1"),
        "{}",
        table_row(&a, 3)
    );
    // At full scale (300): pegged; the message line says it in full.
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "300");
    assert!(
        table_row(&a, 4).contains("! pegged"),
        "{}",
        table_row(&a, 4)
    );
    assert!(
        screen(&a).contains("at full scale (pegged)"),
        "{}",
        screen(&a)
    );
    // A negative dial.
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "-1");
    assert!(
        table_row(&a, 5).contains("! negative"),
        "{}",
        table_row(&a, 5)
    );
    // A typed speed beyond the six-speed instrument's 3 to 600 rpm ("30041", the speed
    // appended to in the issue) is called out.
    press(&mut a, KeyCode::Enter);
    ctrl_arrow(&mut a, KeyCode::Left);
    type_text(&mut a, "30041");
    assert!(
        table_row(&a, 6).contains("! outside 3-600 rpm"),
        "{}",
        table_row(&a, 6)
    );
}

fn ctrl_arrow(app: &mut App, code: KeyCode) {
    app.on_key(&KeyEvent::new(code, KeyModifiers::CONTROL));
}
