//! The Checks view driven through the app without a terminal, on the invented demo site:
//! each guided check walked with readings typed into a field that owns its keys, the
//! readings journalled on the step's equipment, skipped steps said as assumed, and the
//! findings that follow. Screens at 80×24 as snapshots, and in ASCII.

use crate::support;
use crate::support::{ctrl, press, type_text};

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::KeyCode;
use rheoside::diagnose::Rule;
use rheoside::journal::{Payload, Record};
use rheoside::session::findings::findings;
use rheoside::tui::app::{App, RunState};
use rheoside::tui::keymap::Context;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs};
use rheoside::tui::views;

fn screen(app: &App) -> String {
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(app, f)).expect("drawing");
    support::screen_text(t.backend().buffer())
}

/// Pick the `n`th sample point (TK-1, TK-2, L-1, L-2, P-1, P-2) and the `p`th product
/// (chilli-sauce, filler-paste, chalk-slurry), then go to the Checks view.
fn on_checks(glyphs: Glyphs, n: usize, p: usize) -> App {
    let mut a = support::demo_app(ColourMode::Plain, glyphs, "ana", "logs/test.jsonl");
    for _ in 0..n {
        press(&mut a, KeyCode::Down);
    }
    press(&mut a, KeyCode::Enter);
    for _ in 0..p {
        press(&mut a, KeyCode::Down);
    }
    press(&mut a, KeyCode::Enter);
    while a.active_id() != views::guided::ID {
        press(&mut a, KeyCode::Tab);
    }
    a
}

/// Start the `n`th check and answer its steps in turn (`None` skips with Ctrl-K); the
/// records the journal numbered come back.
fn walk(a: &mut App, n: usize, answers: &[Option<&str>]) -> Vec<Record> {
    for _ in 0..n {
        press(a, KeyCode::Down);
    }
    press(a, KeyCode::Enter);
    for answer in answers {
        match answer {
            Some(text) => {
                type_text(a, text);
                press(a, KeyCode::Enter);
            }
            None => ctrl(a, 'k'),
        }
    }
    support::journal_answers(a, true)
}

/// (name, raw, equipment) of each reading journalled.
fn readings(records: &[Record]) -> Vec<(String, String, String)> {
    records
        .iter()
        .filter_map(|r| match &r.payload {
            Payload::Reading { name, raw, .. } => Some((
                name.clone(),
                raw.clone(),
                r.equipment.clone().unwrap_or_default(),
            )),
            _ => None,
        })
        .collect()
}

fn note(records: &[Record]) -> String {
    records
        .iter()
        .find_map(|r| match &r.payload {
            Payload::Note { text } => Some(text.clone()),
            _ => None,
        })
        .unwrap_or_default()
}

fn rules(a: &App) -> Vec<(Rule, String)> {
    findings(&a.ctx.session, &a.ctx.site)
        .into_iter()
        .map(|f| (f.rule, f.subject))
        .collect()
}

fn owned(v: &[(&str, &str, &str)]) -> Vec<(String, String, String)> {
    v.iter()
        .map(|(a, b, c)| (a.to_string(), b.to_string(), c.to_string()))
        .collect()
}

#[test]
fn the_checks_list_and_a_step_at_80x24() {
    let mut a = on_checks(Glyphs::Unicode, 3, 1);
    insta::assert_snapshot!("checks_80x24", screen(&a));
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "62 h");
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "2 bar/s");
    insta::assert_snapshot!("checks_step_80x24", screen(&a));
}

#[test]
fn the_checks_screens_in_ascii_are_all_ascii() {
    let mut a = on_checks(Glyphs::Ascii, 3, 1);
    let list = screen(&a);
    assert!(list.chars().all(|c| (c as u32) < 0x80), "{list}");
    press(&mut a, KeyCode::Enter);
    type_text(&mut a, "10 psig");
    let step = screen(&a);
    assert!(step.chars().all(|c| (c as u32) < 0x80), "{step}");
    assert!(step.contains("Caution:"), "{step}");
}

#[test]
fn the_field_owns_every_printable_key_and_esc_leaves_then_stops() {
    let mut a = on_checks(Glyphs::Unicode, 3, 1);
    press(&mut a, KeyCode::Enter);
    assert_eq!(a.context(), Context::Editing);
    // q, n and ? would quit, open a note and the help at the top level.
    type_text(&mut a, "q n?");
    assert_eq!(a.state(), RunState::Running);
    assert_eq!(*a.overlay(), rheoside::tui::overlay::Overlay::None);
    // Not a time: refused in words, nothing journalled, still on step 1.
    press(&mut a, KeyCode::Enter);
    assert!(a.take_outbox().is_empty());
    let text = screen(&a);
    assert!(
        text.contains("Step 1 of 3") && text.contains("rest-time"),
        "{text}"
    );
    // Esc leaves the field; Esc again stops the check; nothing was journalled.
    press(&mut a, KeyCode::Esc);
    assert!(matches!(a.context(), Context::Top(_)));
    press(&mut a, KeyCode::Esc);
    assert!(screen(&a).contains("Check stopped"), "{}", screen(&a));
    assert!(a.take_outbox().is_empty());
    // An empty reading is not saved either: it asks for the reading or a skip.
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Enter);
    assert!(screen(&a).contains("Ctrl-K to skip"), "{}", screen(&a));
    assert!(a.take_outbox().is_empty());
}

#[test]
fn the_pump_check_files_each_reading_on_its_equipment_and_says_what_it_assumed() {
    let mut a = on_checks(Glyphs::Unicode, 3, 1);
    let records = walk(&mut a, 0, &[Some("62 h"), None, Some("13 bar")]);
    assert_eq!(
        readings(&records),
        owned(&[
            ("rest-time", "62 h", "L-2"),
            ("discharge-pressure", "13 bar", "P-2"),
        ])
    );
    let text = note(&records);
    assert!(text.contains("assumed: no gel test"), "{text}");
    assert_eq!(a.active_id(), views::findings::ID);
    // Once the check's records are in, its findings are journalled too, worst first.
    let last = records.last().map(|r| r.payload.clone());
    let Some(Payload::Note { text }) = last else {
        panic!("the findings note last, got {last:?}");
    };
    assert!(
        text.starts_with("Findings at the end of guided check 'Pump will not start"),
        "{text}"
    );
    assert!(
        text.contains("1. ALARM, certain: pump P-2. The discharge pressure is above"),
        "{text}"
    );
    let found = rules(&a);
    // 13 bar above the 12 bar relief; the site's gel after 62 h (520 Pa) needs 13.1 bar
    // (force balance, see tui_guided_e2e).
    assert!(found.iter().any(|(r, _)| *r == Rule::DischargeOverLimit));
    assert!(found.iter().any(|(r, _)| *r == Rule::LineWillNotRestart));
}

#[test]
fn a_gel_read_after_the_stop_is_the_gel_the_restart_is_judged_with() {
    let mut a = on_checks(Glyphs::Unicode, 3, 1);
    let records = walk(&mut a, 0, &[Some("62 h"), Some("100 Pa"), None]);
    assert_eq!(
        readings(&records)[1],
        owned(&[("yield-stress", "100 Pa", "L-2")])[0]
    );
    // Force balance on the plug of L-2 (32 m + 6 m of fittings, 62.7 mm bore, 2 m rise,
    // 0.2 bar back-pressure, paste 1480 kg/m3; demo site): with 100 Pa, 4·100·38/0.0627
    // = 24 242 Pa, plus 1480·9.80665·2 = 29 028 Pa, plus 20 000 Pa: 0.73 bar, far below
    // the 12 bar relief; ×1.3 at the coldest (0.81 bar) too. So the line restarts.
    let found = rules(&a);
    assert!(
        !found.iter().any(|(r, _)| *r == Rule::LineWillNotRestart),
        "{found:?}"
    );
    // One gel stress gives no build-up, so no longest safe stop is judged from it.
    assert!(
        !found.iter().any(|(r, _)| *r == Rule::StopTooLong),
        "{found:?}"
    );
}

#[test]
fn a_gel_read_before_the_stop_is_a_build_up_reading_and_not_the_stops_gel() {
    let mut a = on_checks(Glyphs::Unicode, 3, 1);
    // The gel first (a 100 Pa test from earlier), then the check's stop of 62 h.
    let earlier = Payload::Reading {
        name: "yield-stress".into(),
        raw: "100 Pa".into(),
        value_si: 100.0,
        dimension: "stress".into(),
    };
    let mut r = a.ctx.session.log[0].clone();
    r.seq = 2;
    r.equipment = Some("L-2".into());
    r.payload = earlier;
    a.apply_saved(&[r]);
    walk(&mut a, 0, &[Some("62 h"), None, None]);
    let found = rules(&a);
    assert!(
        found.iter().any(|(r, _)| *r == Rule::LineWillNotRestart),
        "{found:?}"
    );
}

#[test]
fn the_mixer_check_reads_at_the_tank_and_finds_a_current_over_full_load() {
    // TK-1 and chilli-sauce.
    let mut a = on_checks(Glyphs::Unicode, 0, 0);
    let records = walk(&mut a, 1, &[Some("30 rpm"), Some("9 A"), None, None]);
    assert_eq!(
        readings(&records),
        owned(&[
            ("agitator-speed", "30 rpm", "TK-1"),
            ("motor-current", "9 A", "TK-1"),
        ])
    );
    assert!(note(&records).contains("no power"), "{}", note(&records));
    // TK-1's nameplate (demo site): 3 kW, 400 V, pf 0.80, η 86 %: full-load current
    // I = P/(√3·V·pf·η) = 3000/(1.732·400·0.80·0.86) = 6.29 A; 9 A (8.82 to 9.18) is above.
    let found = rules(&a);
    assert!(
        found
            .iter()
            .any(|(r, s)| *r == Rule::CurrentOverFullLoad && s == "tank TK-1"),
        "{found:?}"
    );
}

#[test]
fn the_batch_check_reads_on_the_line_and_compares_the_plant_with_the_viscometer() {
    // L-1 and chilli-sauce, with a thick set of the sauce already journalled.
    let mut a = on_checks(Glyphs::Unicode, 2, 0);
    let mut r = a.ctx.session.log[0].clone();
    r.seq = 2;
    r.equipment = Some("TK-1".into());
    r.payload = crate::report_findings::thick_sauce_set();
    a.apply_saved(&[r]);
    let records = walk(&mut a, 2, &[None, Some("10 m3/h"), Some("30 bar")]);
    assert_eq!(
        readings(&records),
        owned(&[
            ("flow", "10 m3/h", "L-1"),
            ("pressure-drop", "30 bar", "L-1")
        ])
    );
    // Power law K = 30 Pa·s^n, n = 0.3 (the set) in L-1 (72.9 mm, 85 m + 14 m, 4.5 m rise),
    // laminar (Metzner & Reed, from memory): V = 0.666 m/s, 8V/D = 73.1 1/s, wall shear
    // rate ×(3n+1)/4n = 116 1/s, τw = 30·116^0.3 = 125 Pa, 4τw·99/0.0729 = 6.8 bar, plus
    // 1120·9.81·4.5 = 0.49 bar: about 7.3 bar. 30 bar is four times that.
    let found = rules(&a);
    assert!(
        found
            .iter()
            .any(|(r, s)| *r == Rule::PlantDisagrees && s.starts_with("line L-1")),
        "{found:?}"
    );
    assert!(
        note(&records).contains("no temperature"),
        "{}",
        note(&records)
    );
}
