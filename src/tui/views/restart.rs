//! The Restart view: will the line restart after a stop? For a line and the pump that feeds
//! it, the operator types rested-gel readings (rest time and gel stress) and how long the
//! line has stood; Ctrl-S (or Enter on the Save line) journals them as spot readings on the
//! line. Once the journal has numbered them, the answer is worked out from what the session
//! holds, shown (gel strength against rest with the pump's limit, the answer in words with
//! its band, what was assumed, what to do next, the cautions) and journalled as a restart
//! result linked to those readings.

use super::restart_draw;
use super::restart_journal::{Role, journalled_status, payloads, result_draft};
use super::restart_form::{CheckedForm, Focus, Form};
use super::{Draft, Effect, View, ViewId};
use crate::journal::{Payload, Record};
use crate::line::restart::GelReading;
use crate::session::restart::{self, GelSource, RestartAnswer, RestartSetupError};
use crate::session::restart_chart::{RestartChart, chart};
use crate::site::{Line, Pump, Site};
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding};
use crate::tui::strings::restart as s;
use crate::tui::strings::{caution, views as names};
use crate::tui::widgets::editing::{self, EditStep, Leave};
use ratatui::Frame;
use ratatui::layout::Rect;

/// This view's id.
pub const ID: ViewId = ViewId("restart");

/// The Restart view's own keys; the fields own every other printable key.
const KEYS: &[Binding] = super::FORM_KEYS;

/// Points along the gel curve: more than the widest chart has columns.
const CHART_POINTS: usize = 160;

/// Readings sent to the journal, waiting to come back numbered.
#[derive(Debug, Clone, PartialEq)]
struct Pending {
    question: Question,
    want: Vec<(Role, Payload)>,
    got: Vec<(Role, u64)>,
}

/// The line, pump and product a batch of readings is about.
#[derive(Debug, Clone, PartialEq)]
pub struct Question {
    pub line: String,
    pub pump: String,
    pub product: String,
}

/// The answer on screen, worked out from the journalled readings.
pub struct Shown {
    pub question: Question,
    pub answer: RestartAnswer,
    pub chart: Option<RestartChart>,
    pub cold_chart: Option<RestartChart>,
    /// The readings' record numbers.
    pub from: Vec<u64>,
}

pub struct RestartView {
    form: Form,
    /// A line picked here; `None` follows the Site view's pick.
    line_pick: Option<String>,
    pump_pick: Option<String>,
    pending: Option<Pending>,
    shown: Option<Shown>,
    /// The message under the form (a refusal, or what just happened).
    message: Option<String>,
    scroll: u16,
    /// How far the answer can scroll, as last drawn (PgDn stops there).
    scroll_most: std::cell::Cell<u16>,
}

/// The line and pump the view is about: picked here, else the Site view's pick (a line,
/// or a pump's line), else the first line a pump feeds.
pub fn target<'a>(
    site: &'a Site,
    picked: Option<&str>,
    line_pick: Option<&str>,
    pump_pick: Option<&str>,
) -> Option<(&'a Line, Option<&'a Pump>)> {
    let from_pick = picked.and_then(|id| {
        site.line(id)
            .or_else(|| site.pump(id).and_then(|p| site.line(&p.feeds)))
    });
    let line = line_pick
        .and_then(|id| site.line(id))
        .or(from_pick)
        .or_else(|| {
            site.lines
                .iter()
                .find(|l| !site.pumps_feeding(&l.id).is_empty())
        })
        .or(site.lines.first())?;
    let feeding = site.pumps_feeding(&line.id);
    let picked_pump = picked.and_then(|id| feeding.iter().find(|p| p.id == id));
    let pump = pump_pick
        .and_then(|id| feeding.iter().find(|p| p.id == id))
        .or(picked_pump)
        .or(feeding.first())
        .copied();
    Some((line, pump))
}

impl RestartView {
    pub fn new(_ctx: &Ctx) -> RestartView {
        RestartView {
            form: Form::new(),
            line_pick: None,
            pump_pick: None,
            pending: None,
            shown: None,
            message: None,
            scroll: 0,
            scroll_most: std::cell::Cell::new(u16::MAX),
        }
    }

    /// The answer on screen, for tests.
    pub fn shown(&self) -> Option<&Shown> {
        self.shown.as_ref()
    }

    fn target<'a>(&self, ctx: &'a Ctx) -> Option<(&'a Line, Option<&'a Pump>)> {
        target(
            &ctx.site,
            ctx.picks.equipment.as_deref(),
            self.line_pick.as_deref(),
            self.pump_pick.as_deref(),
        )
    }

    fn cycle_line(&mut self, ctx: &Ctx, step: isize) {
        let lines = &ctx.site.lines;
        let Some((now, _)) = self.target(ctx) else {
            return;
        };
        let at = lines.iter().position(|l| l.id == now.id).unwrap_or(0) as isize;
        let n = lines.len() as isize;
        if let Some(l) = lines.get((at + step).rem_euclid(n) as usize) {
            self.line_pick = Some(l.id.clone());
            self.pump_pick = None;
        }
    }

    fn cycle_pump(&mut self, ctx: &Ctx, step: isize) {
        let Some((line, Some(pump))) = self.target(ctx) else {
            return;
        };
        let feeding = ctx.site.pumps_feeding(&line.id);
        let at = feeding.iter().position(|p| p.id == pump.id).unwrap_or(0) as isize;
        let n = feeding.len() as isize;
        if let Some(p) = feeding.get((at + step).rem_euclid(n) as usize) {
            self.line_pick = Some(line.id.clone());
            self.pump_pick = Some(p.id.clone());
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
            EditStep::Cancelled => self.form.focus_on(Focus::Line),
            EditStep::Accepted(Leave::Below | Leave::Next) => self.form.next(),
            EditStep::Accepted(Leave::Down) => self.form.down(),
            EditStep::Accepted(Leave::Prev) => self.form.prev(),
            EditStep::Accepted(Leave::Up) => self.form.up(),
        }
        self.message = None;
        Vec::new()
    }

    fn handle_top(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        let focus = self.form.focus;
        match action {
            Action::Up => self.form.up(),
            Action::Down => self.form.down(),
            Action::Left if focus == Focus::Line => self.cycle_line(ctx, -1),
            Action::Right if focus == Focus::Line => self.cycle_line(ctx, 1),
            Action::Left if focus == Focus::Pump => self.cycle_pump(ctx, -1),
            Action::Right if focus == Focus::Pump => self.cycle_pump(ctx, 1),
            Action::Activate if focus == Focus::Save => return self.save(ctx),
            Action::Activate => self.form.down(),
            Action::Save => return self.save(ctx),
            Action::PageUp => self.scroll = self.scroll.saturating_sub(4),
            Action::PageDown => {
                self.scroll = self.scroll.saturating_add(4).min(self.scroll_most.get());
            }
            Action::Home => self.scroll = 0,
            _ => {}
        }
        Vec::new()
    }

    /// Check the form and the question it poses; journal the readings if it can be answered.
    fn save(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let refuse = |view: &mut RestartView, text: String| {
            view.message = Some(text.clone());
            vec![Effect::Status(text)]
        };
        let Some(product) = ctx.picks.product.clone() else {
            return refuse(self, s::NEED_PRODUCT.to_string());
        };
        let Some((line, Some(pump))) = self.target(ctx) else {
            return refuse(self, s::NEED_PUMP.to_string());
        };
        let checked = match self.form.check() {
            Ok(c) => c,
            Err(r) => {
                self.form.focus_on(r.focus);
                return refuse(self, r.message);
            }
        };
        let question = Question {
            line: line.id.clone(),
            pump: pump.id.clone(),
            product,
        };
        // The same question the journalled readings will pose: refuse now rather than
        // journal readings that give no answer.
        if let Err(e) = answer_for(&ctx.site, &question, &gel_of(&checked), stop_of(&checked)) {
            return refuse(self, format!("{}: {e}", s::CANNOT_ANSWER));
        }
        let want = payloads(&checked);
        let equipment = Some(question.line.clone());
        let mut effects: Vec<Effect> = want
            .iter()
            .map(|(_, p)| Effect::Journal(Draft::new(p.clone(), equipment.clone())))
            .collect();
        self.pending = Some(Pending {
            question,
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
        let value = |seq: u64| {
            ctx.session
                .readings
                .iter()
                .find(|e| e.seq == seq)
                .map(|e| e.item.value_si)
        };
        let mut rests = Vec::new();
        let mut gels = Vec::new();
        let mut stop = None;
        for &(role, seq) in &p.got {
            let v = value(seq).unwrap_or(f64::NAN);
            match role {
                Role::Rest(_) => rests.push(v),
                Role::Gel(_) => gels.push(v),
                Role::Stop => stop = Some(v),
            }
        }
        let gel: Vec<GelReading> = rests
            .into_iter()
            .zip(gels)
            .map(|(rest_s, stress_pa)| GelReading { rest_s, stress_pa })
            .collect();
        let from: Vec<u64> = p.got.iter().map(|(_, seq)| *seq).collect();
        let answer = match answer_for(&ctx.site, &p.question, &gel, stop) {
            Ok(a) => a,
            Err(e) => {
                let text = format!("{}: {e}", s::CANNOT_ANSWER);
                self.message = Some(text.clone());
                return vec![Effect::Status(text)];
            }
        };
        let system = ctx.site.unit_system;
        let status = journalled_status(&p.question, &answer);
        let result = result_draft(&p.question, &answer, from.clone(), system);
        self.shown = Some(Shown {
            chart: chart(&answer, false, 0.0, CHART_POINTS),
            cold_chart: chart(&answer, true, 0.0, CHART_POINTS),
            question: p.question,
            answer,
            from,
        });
        self.scroll = 0;
        self.message = None;
        vec![
            Effect::Journal(result),
            Effect::Status(status),
        ]
    }
}

fn gel_of(c: &CheckedForm) -> Vec<GelReading> {
    c.readings
        .iter()
        .map(|r| GelReading {
            rest_s: r.rest.si,
            stress_pa: r.gel.si,
        })
        .collect()
}

fn stop_of(c: &CheckedForm) -> Option<f64> {
    c.stop.as_ref().map(|t| t.si)
}

/// The restart answer for a line, pump and product of the site with these readings.
pub fn answer_for(
    site: &Site,
    q: &Question,
    gel: &[GelReading],
    stopped_for_s: Option<f64>,
) -> Result<RestartAnswer, RestartSetupError> {
    let input = restart::from_site(
        site,
        (&q.line, &q.pump, &q.product),
        GelSource::Readings(gel.to_vec(), None),
        stopped_for_s,
    )?;
    Ok(restart::analyse(input)?)
}

impl View for RestartView {
    view_identity!(ID, names::RESTART, caution::RESTART, KEYS);

    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if self.form.focus.is_field() {
            return self.handle_field(action, ctx);
        }
        self.handle_top(action, ctx)
    }

    fn answer(&mut self, record: &Record, ctx: &Ctx) -> Vec<Effect> {
        let Some(p) = &mut self.pending else {
            return Vec::new();
        };
        let next = p.want.get(p.got.len());
        let ours = next.is_some_and(|(_, want)| *want == record.payload)
            && record.equipment.as_deref() == Some(p.question.line.as_str());
        if !ours {
            return Vec::new();
        }
        if let Some((role, _)) = next {
            p.got.push((*role, record.seq));
        }
        if p.got.len() < p.want.len() {
            return Vec::new();
        }
        self.complete(ctx)
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let screen = restart_draw::RestartScreen {
            form: &self.form,
            target: self.target(ctx),
            shown: self.shown.as_ref(),
            waiting: self.pending.is_some(),
            message: self.message.as_deref(),
            scroll: self.scroll,
            scroll_most: &self.scroll_most,
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
