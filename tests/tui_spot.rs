//! The Spot readings view (issue 8): the readings offered fit the picked equipment, a value
//! beyond the site's own limit is called out at once in words with its caution, and saving
//! journals the reading (through the same writer path as a viscometer set) with a warning
//! finding beside it, so the session state holds it for the line, restart and tank views.

use crate::support;
use crate::support::{press, type_text};

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use rheoside::journal::{Payload, Severity};
use rheoside::tui::app::App;
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

/// Pick the `n`th sample point of the demo site (0 is TK-1; P-1 is fifth) and go to Spot.
fn spot_at(app: &mut App, n: usize) {
    for _ in 0..n {
        press(app, KeyCode::Down);
    }
    press(app, KeyCode::Enter);
    press(app, KeyCode::Tab);
    press(app, KeyCode::Tab);
    assert_eq!(app.active_id(), views::spot::ID);
}

#[test]
fn a_pump_is_offered_its_readings_and_a_tank_its_own() {
    let mut a = app();
    spot_at(&mut a, 4);
    let s = screen(&a);
    for name in [
        "suction-pressure",
        "discharge-pressure",
        "flow",
        "pump-speed",
        "motor-current",
    ] {
        assert!(s.contains(name), "{name} not offered:\n{s}");
    }
    assert!(!s.contains("liquid-level"), "{s}");
    let mut b = app();
    spot_at(&mut b, 0);
    let s = screen(&b);
    assert!(s.contains("liquid-level") && s.contains("voltage"), "{s}");
    assert!(!s.contains("discharge-pressure"), "{s}");
}

#[test]
fn a_discharge_above_the_pumps_maximum_is_called_out_on_screen_and_journalled() {
    let mut a = app();
    spot_at(&mut a, 4);
    // Into the form at suction-pressure, Down to discharge-pressure; P-1's maximum discharge
    // pressure is 8 bar in the demo site config, so 8.5 bar (gauge) is above it.
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Down);
    type_text(&mut a, "8.5 bar");
    let s = screen(&a);
    assert!(s.contains("! above the pump's maximum, 8.00 bar"), "{s}");
    // The message wraps in its panel: read it with the borders and line ends taken out.
    let flat: String = s
        .replace('│', " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ");
    assert!(
        flat.contains(
            "discharge-pressure 8.50 bar is above the pump's maximum discharge pressure, 8.00 bar"
        ),
        "{s}"
    );
    assert!(
        flat.contains("Never exceed the rated pressure of the weakest part"),
        "{s}"
    );
    a.on_key(&KeyEvent::new(KeyCode::Char('s'), KeyModifiers::CONTROL));
    assert!(
        a.status().contains("1 above a site limit"),
        "{}",
        a.status()
    );
    let records = support::journal_answers(&mut a, true);
    let reading = records
        .iter()
        .find(|r| matches!(r.payload, Payload::Reading { .. }))
        .expect("the reading is journalled");
    assert_eq!(reading.equipment.as_deref(), Some("P-1"));
    let Payload::Reading { name, value_si, .. } = &reading.payload else {
        unreachable!("matched above");
    };
    assert_eq!(name, "discharge-pressure");
    // 8.5 bar = 850 000 Pa (1 bar = 1e5 Pa exactly, NIST SP 811).
    assert!((value_si - 8.5e5).abs() < 1e-6);
    let warning = records.iter().find_map(|r| match &r.payload {
        Payload::Finding { severity, text } => Some((*severity, text.clone())),
        _ => None,
    });
    let (severity, text) = warning.expect("a finding beside the reading");
    assert_eq!(severity, Severity::Warning);
    assert!(
        text.contains("above the pump's maximum discharge pressure"),
        "{text}"
    );
    // The session state holds it for the other views.
    let held = &a.ctx.session.readings;
    assert!(
        held.iter()
            .any(|e| e.item.name == "discharge-pressure" && e.equipment.as_deref() == Some("P-1"))
    );
}

#[test]
fn a_reading_below_its_limit_is_shown_in_si_and_a_bad_unit_is_refused_in_words() {
    let mut a = app();
    spot_at(&mut a, 4);
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Down);
    type_text(&mut a, "6 bar");
    assert!(screen(&a).contains("= 6.00 bar"), "{}", screen(&a));
    press(&mut a, KeyCode::Down);
    type_text(&mut a, "12 rpm");
    a.on_key(&KeyEvent::new(KeyCode::Char('s'), KeyModifiers::CONTROL));
    assert!(a.take_outbox().is_empty(), "a flow in rpm is refused");
    assert!(
        a.status().contains("the cursor is on flow"),
        "{}",
        a.status()
    );
}
