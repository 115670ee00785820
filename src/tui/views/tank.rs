//! The Tank view: for the picked tank and the product it holds, the power curve (power
//! number against Reynolds number) with today's point, power and torque against the motor
//! and the gearbox, the viscosity the motor implies beside the viscometer's, a side view of
//! the tank with the cavern against the wall and the level, and the cautions.
//!
//! The operator types today's readings (speed, motor current, voltage, temperature); Ctrl-S
//! (or Enter on the Save line) journals them as spot readings on the tank. Once the journal
//! has numbered them, the answer is worked out from what the session holds and journalled as
//! a tank result linked to those readings. Before any save the view shows the answer from
//! the session's latest readings at the tank, else the site's values.

use super::tank_draw;
use super::tank_form::{Focus, Form, TypedReading};
use super::{Draft, Effect, View, ViewId};
use crate::journal::{Payload, Record, ResultKind};
use crate::readings::{ParsedReading, find};
use crate::session::tank_json::tank_json;
use crate::session::tank_live::{TankInputs, TankLive, live};
use crate::session::tank_words;
use crate::site::{Site, Tank};
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding};
use crate::tui::strings::tank as s;
use crate::tui::strings::{caution, views as names};
use crate::tui::widgets::editing::{self, EditStep, Leave};
use ratatui::Frame;
use ratatui::layout::Rect;
use std::cell::Cell;
use std::f64::consts::PI;

/// This view's id.
pub const ID: ViewId = ViewId("tank");

/// The Tank view's own keys; the fields own every other printable key.
const KEYS: &[Binding] = super::FORM_KEYS;

/// Readings sent to the journal, waiting to come back numbered.
#[derive(Debug, Clone, PartialEq)]
struct Pending {
    tank: String,
    product: String,
    want: Vec<Payload>,
    got: Vec<u64>,
}

pub struct TankView {
    form: Form,
    /// A tank picked here; `None` follows the Site view's pick.
    tank_pick: Option<String>,
    pending: Option<Pending>,
    /// The answer on screen (or why there is none).
    shown: Option<Result<TankLive, String>>,
    /// The tank and the inputs of the answer last journalled here: the screen says it is
    /// journalled only while it shows that answer.
    journalled: Option<(String, TankInputs)>,
    message: Option<String>,
    scroll: u16,
    /// How far the answer can scroll, as last drawn (PgDn stops there, so PgUp answers at
    /// once).
    scroll_most: Cell<u16>,
    /// Rows of the answer panel as last drawn: PgUp/PgDn move by this less one.
    page: Cell<u16>,
}

/// The tank the view is about: picked here, else the Site view's pick when it is a tank,
/// else the first tank.
pub fn target<'a>(site: &'a Site, picked: Option<&str>, tank_pick: Option<&str>) -> Option<&'a Tank> {
    tank_pick
        .and_then(|id| site.tank(id))
        .or_else(|| picked.and_then(|id| site.tank(id)))
        .or(site.tanks.first())
}

/// The product in the tank: the Site view's product when the tank itself was picked there,
/// else the tank's own product from the site config.
fn product_for(ctx: &Ctx, tank: &Tank) -> String {
    match (&ctx.picks.equipment, &ctx.picks.product) {
        (Some(e), Some(p)) if *e == tank.id => p.clone(),
        _ => tank.product.clone(),
    }
}

impl TankView {
    pub fn new(_ctx: &Ctx) -> TankView {
        TankView {
            form: Form::new(),
            tank_pick: None,
            pending: None,
            shown: None,
            journalled: None,
            message: None,
            scroll: 0,
            scroll_most: Cell::new(u16::MAX),
            page: Cell::new(4),
        }
    }

    /// The answer on screen, for tests.
    pub fn shown(&self) -> Option<&Result<TankLive, String>> {
        self.shown.as_ref()
    }

    fn target<'a>(&self, ctx: &'a Ctx) -> Option<&'a Tank> {
        target(
            &ctx.site,
            ctx.picks.equipment.as_deref(),
            self.tank_pick.as_deref(),
        )
    }

    fn work_out(&mut self, ctx: &Ctx) {
        self.shown = Some(match self.target(ctx) {
            None => Err(s::NO_TANK.to_string()),
            Some(tank) => {
                let product = product_for(ctx, tank);
                let inputs = TankInputs::latest(&ctx.session, &tank.id);
                live(&ctx.site, &ctx.session, &tank.id, Some(&product), inputs)
                    .map_err(|e| e.to_string())
            }
        });
    }

    /// Whether the answer on screen is the one journalled here.
    fn shows_journalled(&self) -> bool {
        match (&self.journalled, &self.shown) {
            (Some((tank, inputs)), Some(Ok(d))) => *tank == d.tank_id && *inputs == d.inputs,
            _ => false,
        }
    }

    fn cycle_tank(&mut self, ctx: &Ctx, step: isize) {
        let tanks = &ctx.site.tanks;
        let Some(now) = self.target(ctx) else {
            return;
        };
        let at = tanks.iter().position(|t| t.id == now.id).unwrap_or(0) as isize;
        let n = tanks.len() as isize;
        if let Some(t) = tanks.get((at + step).rem_euclid(n) as usize) {
            self.tank_pick = Some(t.id.clone());
            self.scroll = 0;
            self.work_out(ctx);
        }
    }

    fn handle_field(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if action == Action::Save {
            return self.save(ctx);
        }
        let focus = self.form.focus;
        let Some(field) = self.form.field_mut(focus) else {
            return Vec::new();
        };
        match editing::apply(field, action) {
            EditStep::Typing => {}
            // Esc puts the field back and leaves the fields, so the view's keys work again.
            EditStep::Cancelled => self.form.focus_on(Focus::Tank),
            EditStep::Accepted(Leave::Below | Leave::Next | Leave::Down) => self.form.next(),
            EditStep::Accepted(Leave::Prev | Leave::Up) => self.form.prev(),
        }
        self.message = None;
        Vec::new()
    }

    fn handle_top(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        let focus = self.form.focus;
        match action {
            Action::Up => self.form.prev(),
            Action::Down => self.form.next(),
            Action::Left if focus == Focus::Tank => self.cycle_tank(ctx, -1),
            Action::Right if focus == Focus::Tank => self.cycle_tank(ctx, 1),
            Action::Activate if focus == Focus::Save => return self.save(ctx),
            Action::Activate => self.form.next(),
            Action::Save => return self.save(ctx),
            Action::PageUp => self.scroll = self.scroll.saturating_sub(self.page.get()),
            Action::PageDown => {
                let to = self.scroll.saturating_add(self.page.get());
                self.scroll = to.min(self.scroll_most.get());
            }
            Action::Home => self.scroll = 0,
            Action::End => self.scroll = self.scroll_most.get(),
            _ => {}
        }
        Vec::new()
    }

    /// Check the form and the answer it leads to; journal the readings if it can be answered.
    fn save(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let refuse = |view: &mut TankView, text: String| {
            view.message = Some(text.clone());
            vec![Effect::Status(text)]
        };
        let Some(tank) = self.target(ctx) else {
            return refuse(self, s::NO_TANK.to_string());
        };
        let typed = match self.form.check() {
            Ok(t) => t,
            Err(r) => {
                self.form.focus_on(r.focus);
                return refuse(self, r.message);
            }
        };
        let product = product_for(ctx, tank);
        // The same question the journalled readings will pose: refuse now rather than
        // journal readings that give no answer.
        let inputs = with_typed(TankInputs::latest(&ctx.session, &tank.id), &typed);
        if let Err(e) = live(&ctx.site, &ctx.session, &tank.id, Some(&product), inputs) {
            return refuse(self, format!("{}: {e}", s::CANNOT_ANSWER));
        }
        let want: Vec<Payload> = typed.iter().filter_map(payload).collect();
        let equipment = Some(tank.id.clone());
        let mut effects: Vec<Effect> = want
            .iter()
            .map(|p| Effect::Journal(Draft::new(p.clone(), equipment.clone())))
            .collect();
        self.pending = Some(Pending {
            tank: tank.id.clone(),
            product,
            want,
            got: Vec::new(),
        });
        self.form.reset();
        self.message = Some(s::SENT.to_string());
        effects.push(Effect::Status(s::SENT.to_string()));
        effects
    }

    /// The batch came back whole: answer from the session's copy of the readings.
    fn complete(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let Some(p) = self.pending.take() else {
            return Vec::new();
        };
        let inputs = TankInputs::latest(&ctx.session, &p.tank);
        let done = match live(&ctx.site, &ctx.session, &p.tank, Some(&p.product), inputs) {
            Ok(d) => d,
            Err(e) => {
                let text = format!("{}: {e}", s::CANNOT_ANSWER);
                self.message = Some(text.clone());
                return vec![Effect::Status(text)];
            }
        };
        let status = journalled_status(&done);
        let result = result_draft(&done, p.got);
        self.journalled = Some((done.tank_id.clone(), done.inputs));
        self.shown = Some(Ok(done));
        self.scroll = 0;
        self.message = None;
        vec![Effect::Journal(result), Effect::Status(status)]
    }
}

/// The latest inputs with what was just typed laid over them.
fn with_typed(mut inputs: TankInputs, typed: &[TypedReading]) -> TankInputs {
    for t in typed {
        match t.name {
            "agitator-speed" => inputs.readings.speed_rps = Some(t.si / (2.0 * PI)),
            "motor-current" => inputs.readings.motor_current_a = Some(t.si),
            "voltage" => inputs.readings.voltage_v = Some(t.si),
            "temperature" => inputs.temperature_k = Some(t.si),
            _ => {}
        }
    }
    inputs
}

/// A typed reading as a spot-reading record.
fn payload(t: &TypedReading) -> Option<Payload> {
    find(t.name).map(|kind| {
        ParsedReading {
            kind,
            raw: t.raw.clone(),
            value_si: t.si,
            // None of these is a gauge pressure.
            basis: None,
        }
        .payload()
    })
}

/// "Answer for TK-1 journalled: motor at 53 %, gearbox at 47 % of its limit."
fn journalled_status(d: &TankLive) -> String {
    let op = &d.answer.operating;
    let share = |what: &str, c: &crate::mixing::LoadCheck| {
        format!("{} {:.0} %", what.to_lowercase(), 100.0 * c.fraction)
    };
    let parts: Vec<String> = [(s::MOTOR, &op.motor), (s::GEARBOX, &op.gearbox)]
        .into_iter()
        .filter_map(|(what, c)| c.as_ref().map(|c| share(what, c)))
        .collect();
    let loads = match parts.is_empty() {
        true => tank_words::regime(op.point.regime).to_string(),
        false => format!("{} {}", parts.join(", "), s::OF_LIMITS),
    };
    format!(
        "{} {} {}: {loads}.",
        s::ANSWER_FOR,
        sanitize(&d.tank_id, false),
        s::JOURNALLED,
    )
}

/// The answer as a tank result linked to the readings, in the `mix --json` shape plus the
/// tank, product and curve it is about.
fn result_draft(d: &TankLive, from: Vec<u64>) -> Draft {
    let mut data = tank_json(&d.answer);
    data["tank"] = d.tank_id.clone().into();
    data["product"] = d.product.clone().into();
    data["rheology_source"] = d.source.describe().into();
    data["temperature_k"] = d.inputs.temperature_k.into();
    let payload = Payload::Result {
        what: format!("tank {} ({})", d.tank_id, d.product),
        result_kind: Some(ResultKind::Tank),
        from,
        data,
    };
    Draft::new(payload, Some(d.tank_id.clone()))
}

impl View for TankView {
    view_identity!(ID, names::TANK, caution::TANK, KEYS);

    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if self.form.focus.is_field() {
            return self.handle_field(action, ctx);
        }
        self.handle_top(action, ctx)
    }

    fn refresh(&mut self, ctx: &Ctx) {
        self.work_out(ctx);
    }

    fn answer(&mut self, record: &Record, ctx: &Ctx) -> Vec<Effect> {
        let Some(p) = &mut self.pending else {
            return Vec::new();
        };
        let ours = p.want.get(p.got.len()) == Some(&record.payload)
            && record.equipment.as_deref() == Some(p.tank.as_str());
        if !ours {
            return Vec::new();
        }
        p.got.push(record.seq);
        if p.got.len() < p.want.len() {
            return Vec::new();
        }
        self.complete(ctx)
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let screen = tank_draw::TankScreen {
            form: &self.form,
            tank: self.target(ctx),
            shown: self.shown.as_ref(),
            journalled: self.shows_journalled(),
            waiting: self.pending.is_some(),
            message: self.message.as_deref(),
            scroll: self.scroll,
            scroll_most: &self.scroll_most,
            page: &self.page,
        };
        screen.draw(frame, area, ctx);
    }

    fn editing(&self) -> bool {
        self.form.focus.is_field()
    }

    fn unsaved_input(&self) -> Option<&'static str> {
        self.form.has_input().then_some(s::FORM_NAME)
    }
}
