//! The Line view on the demo site: the paste line L-2 with filler-paste's nominal curve,
//! the what-if keys, and the screen at 80×24 (and in ASCII).

use crate::support;
use crate::support::press;

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::KeyCode;
use rheoside::journal::{Payload, Record};
use rheoside::line::Disagreement;
use rheoside::session::line::{at_flow, duty_pressure, plant_check, site_case};
use rheoside::session::pump::PumpAnswer;
use rheoside::session::rheology_source::resolve_live;
use rheoside::tui::app::App;
use rheoside::tui::render;
use rheoside::tui::theme::{ColourMode, Glyphs};
use rheoside::tui::views;
use rheoside::tui::views::View;
use rheoside::tui::views::line::{LineShown, LineView, plant_pairs};

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

/// Pick a line (by its row among the sample points) and a product (by its row), then go to
/// the Line view.
fn line_view_on(line_row: usize, product_row: usize) -> App {
    let mut a = support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/test.jsonl");
    // Sample points list tanks, then lines: TK-1, TK-2, L-1, L-2.
    for _ in 0..line_row {
        press(&mut a, KeyCode::Down);
    }
    press(&mut a, KeyCode::Enter);
    for _ in 0..product_row {
        press(&mut a, KeyCode::Down);
    }
    press(&mut a, KeyCode::Enter);
    while a.active_id() != views::line::ID {
        press(&mut a, KeyCode::Tab);
    }
    a
}

/// What the Line view works out from the app's state and picks (a fresh view, refreshed).
fn worked_out(a: &App) -> LineShown {
    let mut v = LineView::new(&a.ctx);
    v.refresh(&a.ctx);
    match v.into_shown() {
        Some(Ok(sh)) => sh,
        Some(Err(e)) => panic!("no line answer: {e}"),
        None => panic!("no line answer"),
    }
}

fn kpa(pa: f64) -> String {
    format!("{:.3} kPa", pa / 1000.0)
}

/// A spot reading on a line as the journal would number it.
fn reading_on(a: &App, seq: u64, line: &str, name: &str, raw: &str, si: f64) -> Record {
    let dimension = match name {
        "flow" => "flow",
        _ => "pressure",
    };
    Record {
        seq,
        session: "test-session".to_string(),
        utc: a.ctx.clock.now.with_timezone(&chrono::Utc),
        offset: *a.ctx.clock.now.offset(),
        operator: a.ctx.operator.clone(),
        equipment: Some(line.to_string()),
        payload: Payload::Reading {
            name: name.to_string(),
            raw: raw.to_string(),
            value_si: si,
            dimension: dimension.to_string(),
        },
        version: env!("CARGO_PKG_VERSION").to_string(),
    }
}

#[test]
fn the_sauce_pumps_duty_point_sits_on_its_corrected_curve_and_the_line() {
    let a = line_view_on(2, 0);
    assert_eq!(a.ctx.picks.equipment.as_deref(), Some("L-1"));
    assert_eq!(a.ctx.picks.product.as_deref(), Some("chilli-sauce"));
    let sh = worked_out(&a);
    let Some(Ok(p)) = &sh.pump else {
        panic!("no pump answer on L-1");
    };
    let PumpAnswer::Centrifugal(c) = &p.answer.answer else {
        panic!("P-1 is centrifugal");
    };
    let d = c
        .duty
        .unwrap_or_else(|| panic!("no duty point: {} {:?}", sh.product, p.answer.notes));
    // The operating point is where the pump's head meets the line's need (the definition of
    // the intersection): ρ·g·H_pump(Q) = ΔP_line(Q), both worked here at the duty flow.
    let rho = p.density_kg_m3;
    let (h, _) = c
        .curve
        .at(d.flow_m3_s)
        .expect("the duty flow is on the curve");
    let line = a.ctx.site.line("L-1").expect("L-1");
    let (need, _) = duty_pressure(line, &sh_model(&a, "chilli-sauce"), rho, d.flow_m3_s);
    let pump_pa = rho * 9.80665 * h;
    assert!(
        (pump_pa - d.pressure_pa).abs() < 1e-6 * pump_pa,
        "{pump_pa} {}",
        d.pressure_pa
    );
    assert!(
        (need - d.pressure_pa).abs() < 2e-3 * need,
        "{need} {}",
        d.pressure_pa
    );
    // The chart carries the corrected curve and the point; the panel says it in words.
    assert_eq!(p.duty, Some((d.flow_m3_s, d.pressure_pa)));
    assert!(!p.curve.is_empty());
    let s = screen(&a);
    assert!(s.contains("Pump P-1 (centrifugal)"), "{s}");
    assert!(s.contains('◆') && s.contains("+ pump"), "{s}");
    insta::assert_snapshot!("line_pump_80x24", s);
}

/// The product's nominal model at its reference temperature, as the view uses it with no
/// readings in the session (the site's constants).
fn sh_model(a: &App, product: &str) -> rheoside::rheology::Model {
    resolve_live(&a.ctx.site, &a.ctx.session, product, None)
        .expect("the product's nominal curve")
        .model
}

#[test]
fn the_paste_pump_is_judged_against_its_relief() {
    let a = line_view_on(3, 1);
    let s = screen(&a);
    assert!(s.contains("Pump P-2 (positive"), "{s}");
    assert!(s.contains("Relief at 12.0 bar"), "{s}");
    assert!(s.contains("relief"), "{s}");
}

#[test]
fn the_text_panel_scrolls_to_its_last_caution_at_80x24() {
    let mut a = line_view_on(3, 1);
    // Before scrolling the cautions are cut at the bottom of the panel.
    assert!(
        !screen(&a).contains("Pump: shaft power counts"),
        "{}",
        screen(&a)
    );
    let mut seen = false;
    for _ in 0..12 {
        press(&mut a, KeyCode::PageDown);
        if screen(&a).contains("Pump: shaft power counts no") {
            seen = true;
            break;
        }
    }
    assert!(seen, "{}", screen(&a));
    press(&mut a, KeyCode::Home);
    assert!(screen(&a).contains("L-2  filler-paste"));
    // End goes straight to the last line.
    press(&mut a, KeyCode::End);
    assert!(screen(&a).contains("Pump: shaft power counts no"));
}

// Plant readings on L-2, the static head of Δz = 2 m kept and the friction part made 30 %
// above the curve's: measured τw = ΔP_friction·D/(4L), so the wall stresses read 1.3× the
// curve's at the same 8V/D (the force balance on the fluid in the pipe). The curve's stress
// is taken at the Rabinowitsch–Mooney rate from the pairs' own slope, which for data scaled
// by a constant is the curve's secant slope, close to its tangent between nearby flows: so
// about +30 %, within a few per cent.
#[test]
fn plant_flow_and_pressure_drop_readings_are_paired_and_checked() {
    let mut a = line_view_on(3, 1);
    let site = a.ctx.site.clone();
    let resolved = resolve_live(&site, &a.ctx.session, "filler-paste", None).expect("curve");
    let case = site_case(&site, "L-2", resolved, None).expect("the L-2 case");
    let rho = case.fluid.density_kg_m3;
    let static_pa = rho * 9.80665 * 2.0;
    let flows = [5.0 / 3600.0, 6.0 / 3600.0];
    let dps: Vec<f64> = flows
        .iter()
        .map(|&q| {
            let total = at_flow(&case, q).expect("a drop").answer.pressure_drop_pa;
            static_pa + 1.3 * (total - static_pa)
        })
        .collect();
    let records = [
        reading_on(&a, 2, "L-2", "flow", "5 m3/h", flows[0]),
        reading_on(&a, 3, "L-2", "pressure-drop", &kpa(dps[0]), dps[0]),
        // A reading on another line is not paired with L-2's.
        reading_on(&a, 4, "L-1", "flow", "9 m3/h", 9.0 / 3600.0),
        reading_on(&a, 5, "L-2", "pressure-drop", &kpa(dps[1]), dps[1]),
        reading_on(&a, 6, "L-2", "flow", "6 m3/h", flows[1]),
    ];
    a.apply_saved(&records);
    let pairs = plant_pairs(&a.ctx.session, "L-2");
    assert_eq!(pairs.len(), 2);
    assert_eq!(
        (pairs[0].flow_m3_s, pairs[0].pressure_drop_pa),
        (flows[0], dps[0])
    );
    assert_eq!(
        (pairs[1].flow_m3_s, pairs[1].pressure_drop_pa),
        (flows[1], dps[1])
    );
    let sh = worked_out(&a);
    let check = sh.check.as_ref().expect("a plant check");
    let direct = plant_check(&case, &pairs).expect("plant_check");
    assert_eq!(check.comparison.mean_ratio, direct.comparison.mean_ratio);
    let r = check.comparison.mean_ratio;
    assert!((r - 1.3).abs() < 0.04, "{r}");
    assert_eq!(check.comparison.direction, Disagreement::PlantHigher);
    let s = screen(&a);
    assert!(s.contains("The line needs more"), "{s}");
    assert!(s.contains('●'), "{s}");
}
