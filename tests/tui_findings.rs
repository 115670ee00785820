//! The Findings view on the demo site: a weekend stop on the paste line L-2 and a discharge
//! pressure above pump P-2's relief setting, journalled as spot readings; the ranked list
//! at 80×24 (and in ASCII), Enter opening one finding in full, Esc back.

use crate::support;
use crate::support::press;

use chrono::Utc;
use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::KeyCode;
use rheoside::diagnose::{Rule, Severity};
use rheoside::journal::{Payload, Record};
use rheoside::tui::app::App;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs};
use rheoside::tui::views;

fn screen(app: &App) -> String {
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(app, f)).expect("drawing");
    support::screen_text(t.backend().buffer())
}

fn reading(app: &App, seq: u64, at: &str, name: &str, raw: &str, si: f64, dim: &str) -> Record {
    Record {
        seq,
        session: "test-session".into(),
        utc: app.ctx.clock.now.with_timezone(&Utc),
        offset: *app.ctx.clock.now.offset(),
        operator: "ana".into(),
        equipment: Some(at.into()),
        payload: Payload::Reading {
            name: name.into(),
            raw: raw.into(),
            value_si: si,
            dimension: dim.into(),
        },
        version: env!("CARGO_PKG_VERSION").into(),
    }
}

/// A 62 h stop on L-2 (62·3600 = 223 200 s) and 13 bar at P-2's outlet (1 bar = 10^5 Pa),
/// already in the journal; then on to the Findings view.
fn on_findings(glyphs: Glyphs) -> App {
    let mut a = support::demo_app(ColourMode::Plain, glyphs, "ana", "logs/test.jsonl");
    let records = [
        reading(&a, 2, "L-2", "rest-time", "62 h", 223_200.0, "time"),
        reading(
            &a,
            3,
            "P-2",
            "discharge-pressure",
            "13 bar",
            13e5,
            "pressure",
        ),
    ];
    a.apply_saved(&records);
    while a.active_id() != views::findings::ID {
        press(&mut a, KeyCode::Tab);
    }
    a
}

#[test]
fn the_findings_are_listed_worst_first_with_severity_in_words() {
    let a = on_findings(Glyphs::Unicode);
    let text = screen(&a);
    // 13 bar is above the 12 bar relief of P-2 (demo site): an alarm, said in words.
    assert!(text.contains("ALARM"), "{text}");
    assert!(text.contains("relief"), "{text}");
    insta::assert_snapshot!("findings_80x24", text);
}

#[test]
fn the_ascii_findings_screen_is_plain_ascii() {
    let mut a = on_findings(Glyphs::Ascii);
    let list = screen(&a);
    assert!(list.chars().all(|c| (c as u32) < 0x80), "{list}");
    press(&mut a, KeyCode::Enter);
    let open = screen(&a);
    assert!(open.chars().all(|c| (c as u32) < 0x80), "{open}");
    assert!(open.contains("How sure"), "{open}");
}

#[test]
fn enter_opens_a_finding_in_full_and_esc_goes_back() {
    let mut a = on_findings(Glyphs::Unicode);
    let list = screen(&a);
    // The ranking puts the alarms first; the first line is the one Enter opens.
    press(&mut a, KeyCode::Down);
    press(&mut a, KeyCode::Up);
    press(&mut a, KeyCode::Enter);
    let open = screen(&a);
    for want in ["How sure", "The numbers", "Check next", "Caution:"] {
        assert!(open.contains(want), "{want} missing:\n{open}");
    }
    insta::assert_snapshot!("findings_open_80x24", open);
    press(&mut a, KeyCode::PageDown);
    press(&mut a, KeyCode::Esc);
    assert_eq!(screen(&a), list);
}

#[test]
fn the_view_follows_the_records_as_they_land() {
    let mut a = support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/t.jsonl");
    while a.active_id() != views::findings::ID {
        press(&mut a, KeyCode::Tab);
    }
    assert!(screen(&a).contains("No findings"), "{}", screen(&a));
    let r = reading(
        &a,
        2,
        "P-2",
        "discharge-pressure",
        "13 bar",
        13e5,
        "pressure",
    );
    a.apply_saved(&[r]);
    let text = screen(&a);
    assert!(text.contains("ALARM"), "{text}");
    // The same ranked findings the report shows (session::findings).
    let f = rheoside::session::findings::findings(&a.ctx.session, &a.ctx.site);
    assert_eq!(f[0].rule, Rule::DischargeOverLimit);
    assert_eq!(f[0].severity, Severity::Alarm);
}
