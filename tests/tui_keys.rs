//! Key handling of the terminal UI, fed as key events straight into the app state (no
//! terminal): presses only, asking before losing input, Ctrl-C, the ways out of every
//! screen, and a viscometer set going from keys to a journal record and a fitted curve.

use crate::support;

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyEventKind, KeyModifiers};
use rheoside::instrument::{DialReading, Geometry};
use rheoside::journal::Payload;
use rheoside::session::{FlowCurveInput, FlowCurveOptions, analyse};
use rheoside::tui::app::{App, RunState};
use rheoside::tui::keymap::{BINDINGS, Context};
use rheoside::tui::overlay::Overlay;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs, Theme};
use rheoside::tui::views;
use rheoside::tui::writer::Reply;

fn app() -> App {
    support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/test.jsonl")
}

fn event(code: KeyCode, modifiers: KeyModifiers, kind: KeyEventKind) -> KeyEvent {
    let mut ev = KeyEvent::new(code, modifiers);
    ev.kind = kind;
    ev
}

fn press(app: &mut App, code: KeyCode) {
    app.on_key(&event(code, KeyModifiers::NONE, KeyEventKind::Press));
}

fn ctrl(app: &mut App, c: char) {
    app.on_key(&event(
        KeyCode::Char(c),
        KeyModifiers::CONTROL,
        KeyEventKind::Press,
    ));
}

fn ctrl_arrow(app: &mut App, code: KeyCode) {
    app.on_key(&event(code, KeyModifiers::CONTROL, KeyEventKind::Press));
}

fn ctrl_c(app: &mut App) {
    app.on_key(&event(
        KeyCode::Char('c'),
        KeyModifiers::CONTROL,
        KeyEventKind::Press,
    ));
}

fn type_text(app: &mut App, text: &str) {
    for c in text.chars() {
        press(app, KeyCode::Char(c));
    }
}

fn screen(app: &App) -> String {
    let mut t = Terminal::new(TestBackend::new(80, 24)).expect("a test terminal");
    t.draw(|f| render::draw(app, f))
        .expect("drawing into memory");
    support::screen_text(t.backend().buffer())
}

/// Pick the first sample point (a tank, which also picks its product), go to Readings.
fn picked(app: &mut App) {
    press(app, KeyCode::Enter);
    press(app, KeyCode::Enter);
    press(app, KeyCode::Tab);
    assert_eq!(app.active_id(), views::readings::ID);
}

/// Invented readings of an HB-like sauce on the standard six-speed viscometer (the form
/// starts on the first dial with 600/300/200/100/6/3 rpm filled in).
const DIALS: [&str; 6] = ["110", "76", "61.5", "44", "16", "14"];

fn enter_dials(app: &mut App) {
    for d in DIALS {
        type_text(app, d);
        press(app, KeyCode::Enter);
    }
}

#[test]
fn release_and_repeat_events_are_ignored() {
    let mut a = app();
    for kind in [KeyEventKind::Release, KeyEventKind::Repeat] {
        a.on_key(&event(KeyCode::Char('q'), KeyModifiers::NONE, kind));
        a.on_key(&event(KeyCode::Tab, KeyModifiers::NONE, kind));
    }
    assert_eq!(a.state(), RunState::Running);
    assert_eq!(a.active_id(), views::site::ID);
    press(&mut a, KeyCode::Char('q'));
    assert_eq!(a.state(), RunState::Quit);
}

#[test]
fn q_with_unsaved_input_asks_first() {
    let mut a = app();
    picked(&mut a);
    type_text(&mut a, "52");
    press(&mut a, KeyCode::Enter);
    // In the form `q` types; Esc leaves it (the accepted 52 stays), then `q` asks.
    press(&mut a, KeyCode::Esc);
    press(&mut a, KeyCode::Char('q'));
    assert_eq!(a.state(), RunState::Running);
    assert_eq!(*a.overlay(), Overlay::ConfirmQuit { note: None });
    assert!(screen(&a).contains("The readings form has input that is not saved"));
    press(&mut a, KeyCode::Char('n'));
    assert_eq!(*a.overlay(), Overlay::None);
    assert_eq!(a.state(), RunState::Running);
    press(&mut a, KeyCode::Char('q'));
    press(&mut a, KeyCode::Char('y'));
    assert_eq!(a.state(), RunState::Quit);
}

#[test]
fn ctrl_c_quits_at_once_without_input_and_asks_with_it() {
    let mut a = app();
    ctrl_c(&mut a);
    assert_eq!(a.state(), RunState::Quit);

    let mut b = app();
    picked(&mut b);
    type_text(&mut b, "5");
    // Still typing in the field: Ctrl-C is not text, it asks.
    assert_eq!(b.context(), Context::Editing);
    ctrl_c(&mut b);
    assert_eq!(*b.overlay(), Overlay::ConfirmQuit { note: None });
    // A second Ctrl-C means it.
    ctrl_c(&mut b);
    assert_eq!(b.state(), RunState::Quit);
}

#[test]
fn records_not_yet_on_disk_count_as_unsaved() {
    let mut a = app();
    press(&mut a, KeyCode::Char('n'));
    type_text(&mut a, "pump P-1 noisy");
    press(&mut a, KeyCode::Enter);
    let out = a.take_outbox();
    assert_eq!(out.len(), 1);
    press(&mut a, KeyCode::Char('q'));
    assert_eq!(
        *a.overlay(),
        Overlay::ConfirmQuit { note: None },
        "the note is still being written"
    );
    press(&mut a, KeyCode::Esc);
    a.on_reply(&Reply {
        ticket: Some(out[0].ticket),
        seq: Some(2),
        saved_through: 2,
        pending: 0,
        error: None,
        closed: false,
        records: Vec::new(),
    });
    press(&mut a, KeyCode::Char('q'));
    assert_eq!(a.state(), RunState::Quit);
}

#[test]
fn every_overlay_closes_without_esc() {
    let mut a = app();
    press(&mut a, KeyCode::Char('?'));
    assert!(matches!(a.overlay(), Overlay::Help { .. }));
    press(&mut a, KeyCode::Char('?'));
    assert_eq!(*a.overlay(), Overlay::None);
    press(&mut a, KeyCode::Char('?'));
    press(&mut a, KeyCode::Char('q'));
    assert_eq!(*a.overlay(), Overlay::None);
    assert_eq!(
        a.state(),
        RunState::Running,
        "q in the help closes the help only"
    );
    // An empty note box closes with Enter and saves nothing.
    press(&mut a, KeyCode::Char('n'));
    press(&mut a, KeyCode::Enter);
    assert_eq!(*a.overlay(), Overlay::None);
    assert!(a.take_outbox().is_empty());
    // The form is left with Esc.
    picked(&mut a);
    type_text(&mut a, "4");
    press(&mut a, KeyCode::Esc);
    assert!(matches!(a.context(), Context::Top(views::readings::ID)));
}

#[test]
fn tab_and_shift_tab_walk_the_views() {
    let mut a = app();
    let mut seen = vec![a.active_id()];
    for _ in 0..a.views().len() {
        press(&mut a, KeyCode::Tab);
        seen.push(a.active_id());
    }
    assert_eq!(
        seen,
        [
            views::site::ID,
            views::readings::ID,
            views::spot::ID,
            views::curve::ID,
            views::line::ID,
            views::restart::ID,
            views::tank::ID,
            views::guided::ID,
            views::findings::ID,
            views::journal::ID,
            views::site::ID
        ]
    );
    press(&mut a, KeyCode::BackTab);
    assert_eq!(a.active_id(), views::journal::ID);
}

#[test]
fn a_set_goes_to_the_journal_and_its_curve_is_shown() {
    let mut a = app();
    picked(&mut a);
    // Into the form at the first dial, Up to the temperature, Enter back down to the dial.
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Up);
    type_text(&mut a, "45 C");
    press(&mut a, KeyCode::Enter);
    enter_dials(&mut a);
    ctrl(&mut a, 's');
    // Numbered by the journal but not yet on disk: the curve is shown, not called saved.
    let out = support::journal_answers(&mut a, false);
    assert_eq!(a.active_id(), views::curve::ID);
    let Payload::ViscometerSet {
        viscometer,
        product,
        temperature_k,
        rows,
        ..
    } = &out[0].payload
    else {
        panic!("expected a viscometer set, got {:?}", out[0].payload);
    };
    assert_eq!(viscometer, "VIS-A");
    assert_eq!(product, "chilli-sauce");
    assert_eq!(out[0].equipment.as_deref(), Some("TK-1"));
    // 45 °C = 318.15 K (definition of the Celsius scale).
    assert!((temperature_k.unwrap_or(0.0) - 318.15).abs() < 1e-9);
    let rpm: Vec<f64> = rows.iter().map(|r| (r.rpm * 1e9).round() / 1e9).collect();
    assert_eq!(rpm, [600.0, 300.0, 200.0, 100.0, 6.0, 3.0]);
    let dial: Vec<f64> = rows.iter().map(|r| r.dial).collect();
    assert_eq!(dial, [110.0, 76.0, 61.5, 44.0, 16.0, 14.0]);
    let s = screen(&a);
    assert!(s.contains("Herschel–Bulkley (auto)"), "{s}");
    assert!(
        s.contains("yield stress") && s.contains("consistency index"),
        "{s}"
    );
    assert!(
        s.contains("UNSAVED"),
        "not shown as saved before the writer says so:\n{s}"
    );
}

#[test]
fn the_model_can_be_switched_by_hand_and_back() {
    let mut a = app();
    picked(&mut a);
    enter_dials(&mut a);
    ctrl(&mut a, 's');
    support::journal_answers(&mut a, true);
    press(&mut a, KeyCode::Char('m'));
    support::journal_answers(&mut a, true);
    assert!(screen(&a).contains("Newtonian (by hand)"));
    press(&mut a, KeyCode::Char('m'));
    support::journal_answers(&mut a, true);
    assert!(screen(&a).contains("power law (by hand)"));
    press(&mut a, KeyCode::Char('A'));
    support::journal_answers(&mut a, true);
    assert!(screen(&a).contains("Herschel–Bulkley (auto)"));
}

#[test]
fn a_wrong_unit_is_refused_in_words_and_the_set_is_not_saved() {
    let mut a = app();
    picked(&mut a);
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Left);
    ctrl_arrow(&mut a, KeyCode::Left);
    type_text(&mut a, "600 psi");
    ctrl_arrow(&mut a, KeyCode::Right);
    type_text(&mut a, "110");
    press(&mut a, KeyCode::Enter);
    ctrl(&mut a, 's');
    assert!(a.take_outbox().is_empty());
    assert_eq!(a.active_id(), views::readings::ID);
    assert!(a.status().starts_with("row 1 Speed:"), "{}", a.status());
    assert!(a.status().contains("speed is expected"), "{}", a.status());
}

#[test]
fn saving_needs_a_product() {
    let mut a = app();
    press(&mut a, KeyCode::Tab);
    enter_dials(&mut a);
    ctrl(&mut a, 's');
    assert!(a.take_outbox().is_empty());
    assert!(a.status().contains("No product picked"));
}

#[test]
fn a_note_is_journalled_under_the_picked_equipment() {
    let mut a = app();
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Char('n'));
    type_text(&mut a, "agitator stopped for sampling");
    press(&mut a, KeyCode::Enter);
    let out = a.take_outbox();
    assert_eq!(out[0].equipment.as_deref(), Some("TK-1"));
    assert_eq!(
        out[0].payload,
        Payload::Note {
            text: "agitator stopped for sampling".into()
        }
    );
}

#[test]
fn the_help_lists_every_binding_of_the_key_map() {
    let a = app();
    let theme = Theme::new(ColourMode::Plain, Glyphs::Unicode);
    let text: String = rheoside::tui::overlay::help_lines(a.views(), &theme)
        .iter()
        .map(|l| l.to_string() + "\n")
        .collect();
    let own = a.views().iter().flat_map(|v| v.keys().iter());
    let mut n = 0;
    for b in BINDINGS.iter().chain(own) {
        assert!(text.contains(b.label), "help lacks {:?}", b.label);
        n += 1;
    }
    assert!(n > BINDINGS.len(), "the views' own keys are listed too");
}

#[test]
fn the_footer_shows_what_the_keys_do_here() {
    let mut a = app();
    assert!(
        screen(&a)
            .lines()
            .last()
            .is_some_and(|l| l.contains("pick") && l.contains("help"))
    );
    picked(&mut a);
    type_text(&mut a, "1");
    let s = screen(&a);
    let footer = s.lines().last().unwrap_or_default();
    assert!(footer.contains("Enter accept"), "{footer}");
    assert!(
        !footer.contains("q quit"),
        "q types while editing: {footer}"
    );
}

#[test]
fn a_note_being_typed_survives_saying_no_to_quitting() {
    let mut a = app();
    press(&mut a, KeyCode::Char('n'));
    type_text(&mut a, "half a note");
    ctrl_c(&mut a);
    assert!(matches!(
        a.overlay(),
        Overlay::ConfirmQuit { note: Some(_) }
    ));
    assert!(screen(&a).contains("Note has input that is not saved"));
    press(&mut a, KeyCode::Char('n'));
    type_text(&mut a, ", finished");
    press(&mut a, KeyCode::Enter);
    let out = a.take_outbox();
    assert_eq!(
        out[0].payload,
        Payload::Note {
            text: "half a note, finished".into()
        }
    );
}

#[test]
fn another_viscometer_takes_its_own_speeds() {
    let mut a = app();
    picked(&mut a);
    // Into the form, up past the temperature to the viscometer, Right to the next one.
    press(&mut a, KeyCode::Enter);
    press(&mut a, KeyCode::Up);
    press(&mut a, KeyCode::Up);
    press(&mut a, KeyCode::Right);
    let s = screen(&a);
    assert!(s.contains("< VIS-B >"), "{s}");
    // The cup-and-bob has no usual speeds: the prefilled six-speed values are gone.
    assert!(!s.contains("62.8 rad/s"), "{s}");
    press(&mut a, KeyCode::Down);
    press(&mut a, KeyCode::Down);
    type_text(&mut a, "50");
    press(&mut a, KeyCode::Enter);
    ctrl(&mut a, 's');
    assert!(
        a.status()
            .starts_with("row 1 Speed: a dial reading needs a speed"),
        "{}",
        a.status()
    );
}

#[test]
fn the_apparent_viscosity_follows_the_typed_shear_rate() {
    let mut a = app();
    picked(&mut a);
    enter_dials(&mut a);
    ctrl(&mut a, 's');
    support::journal_answers(&mut a, true);
    type_text(&mut a, "r1000");
    press(&mut a, KeyCode::Enter);
    let chosen = support::journal_answers(&mut a, true);
    assert!(
        matches!(
            chosen.first().map(|r| &r.payload),
            Some(Payload::Choice { shear_rate_per_s: Some(r), .. }) if (*r - 1000.0).abs() < 1e-9
        ),
        "the chosen rate is journalled: {chosen:?}"
    );
    // Herschel–Bulkley: μa = τ/γ̇ = (τ0 + K·γ̇ⁿ)/γ̇, from the constants the engine fitted.
    let readings: Vec<DialReading> = [600.0, 300.0, 200.0, 100.0, 6.0, 3.0]
        .into_iter()
        .zip(DIALS.map(|d| d.parse::<f64>().unwrap_or(f64::NAN)))
        .map(|(r, d)| DialReading::new(r, d))
        .collect();
    let input = FlowCurveInput::Dial {
        geometry: &Geometry::StandardSixSpeed,
        readings: &readings,
    };
    let fit = analyse(input, &FlowCurveOptions::default())
        .expect("the set fits")
        .fit;
    let p: Vec<f64> = fit.estimates.iter().map(|e| e.value).collect();
    let mu = (p[0] + p[1] * 1000f64.powf(p[2])) / 1000.0;
    let want = format!(
        "= {} at 1000 1/s",
        rheoside::present::quantity(
            mu,
            rheoside::units::Dimension::DynamicViscosity,
            rheoside::present::Style::SI
        )
    );
    let s = screen(&a);
    assert!(s.contains(&want), "{want} not in\n{s}");
}

/// `f` on the Flow curve view shows the API RP 13D field relations of a six-speed set:
/// PV = θ600 − θ300 = 110 − 76 = 34 mPa·s, YP = θ300 − PV = 42 lbf/100 ft², pipe
/// n = 3.322·log10(θ600/θ300) = 0.5334 (API RP 13D via Guo & Liu 2011 eqs 2.6–2.8).
#[test]
fn the_flow_curve_view_shows_the_field_relations_of_a_six_speed_set() {
    let mut a = app();
    picked(&mut a);
    enter_dials(&mut a);
    ctrl(&mut a, 's');
    support::journal_answers(&mut a, true);
    press(&mut a, KeyCode::Char('f'));
    let s = screen(&a);
    assert!(s.contains("Field relations (API RP 13D)"), "{s}");
    assert!(s.contains("34.0 mPa.s"), "{s}");
    assert!(s.contains("42.0 lbf/100 ft²"), "{s}");
    let n = 3.322 * (110f64 / 76.0).log10();
    assert!(s.contains(&format!("{n:.4}")), "{n:.4} not in\n{s}");
    press(&mut a, KeyCode::Char('f'));
    assert!(screen(&a).contains("Herschel–Bulkley (auto)"));
}

fn add_note(a: &mut App, text: &str) {
    press(a, KeyCode::Char('n'));
    type_text(a, text);
    press(a, KeyCode::Enter);
    support::journal_answers(a, true);
}

/// The Journal view follows new records past its height, stops following once moved up,
/// follows again with End, and Enter opens the selected record in full (every field of it,
/// wrapped, never cut at the panel edge).
#[test]
fn the_journal_follows_new_records_and_opens_one_in_full() {
    let mut a = app();
    press(&mut a, KeyCode::BackTab);
    assert_eq!(a.active_id(), views::journal::ID);
    for i in 1..=25 {
        add_note(&mut a, &format!("note number {i}"));
    }
    assert!(screen(&a).contains("note number 25"), "{}", screen(&a));
    press(&mut a, KeyCode::Up);
    add_note(&mut a, "note number 26");
    assert!(
        !screen(&a).contains("note number 26"),
        "moved up: not followed"
    );
    press(&mut a, KeyCode::End);
    assert!(screen(&a).contains("note number 26"));
    let long = "the sauce line L-1 was warm to the touch past the second bend and the operator \
                on shift asked for the lagging to be checked before the next batch";
    add_note(&mut a, long);
    press(&mut a, KeyCode::Enter);
    let s = screen(&a);
    let flat: String = s
        .replace('│', " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ");
    assert!(flat.contains("\"kind\": \"note\""), "{s}");
    assert!(
        flat.contains("next batch"),
        "the whole note is readable:\n{s}"
    );
    press(&mut a, KeyCode::Esc);
    assert!(!screen(&a).contains("\"kind\""));
}
