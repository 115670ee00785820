//! The app's state and its one update path: a key becomes an action (through the key map),
//! the overlay or the active view handles it, and the effects it returns are applied here.
//! Records for the journal wait in an outbox that the loop hands to the writer thread; the
//! records the journal numbers come back in its replies and are applied to the live session
//! state, from which every view draws. A set is fitted there, once.

use super::ctx::Ctx;
use super::keymap::{self, Action, Context, Key};
use super::overlay::Overlay;
use super::strings::{confirm as cs, note as ns, status as ss};
use super::views::{self, Draft, Effect, View, ViewId};
use super::widgets::editing::{self, EditStep, Leave};
use super::writer::{Reply, Ticket};
use crate::journal::{Payload, Record, ResultKind};
use crate::present::json::curve_json;
use crate::session::{FlowCurve, FlowCurveOptions};
use chrono::{DateTime, FixedOffset};
use ratatui::crossterm::event::KeyEvent;

/// A record for the writer thread.
#[derive(Debug, Clone, PartialEq)]
pub struct Outgoing {
    pub ticket: Ticket,
    pub equipment: Option<String>,
    pub payload: Payload,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum RunState {
    Running,
    Quit,
}

pub struct App {
    pub ctx: Ctx,
    views: Vec<Box<dyn View>>,
    active: usize,
    overlay: Overlay,
    status: String,
    outbox: Vec<Outgoing>,
    state: RunState,
}

impl App {
    pub fn new(ctx: Ctx, status: &str) -> App {
        let views = views::all(&ctx);
        App {
            ctx,
            views,
            active: 0,
            overlay: Overlay::None,
            status: status.to_string(),
            outbox: Vec::new(),
            state: RunState::Running,
        }
    }

    /// Records already on disk before the screens started (the session-start record, or a
    /// resumed file): applied to the live state, with nothing journalled in answer.
    pub fn apply_saved(&mut self, records: &[Record]) {
        for r in records {
            self.ctx.session.apply(&self.ctx.site, r);
            self.ctx.log.saved_up_to(r.seq);
        }
        self.refresh_views();
    }

    /// Pick up where a resumed journal left off: its records fill the state (through the
    /// same replay the handover report uses), and its last set's product and sample point
    /// become the picks, with its curve shown as it was.
    pub fn resume_from(&mut self, records: &[Record]) {
        self.apply_saved(records);
        self.status = format!(
            "{} {} {}; {}.",
            ss::RESUMED,
            records.len(),
            ss::RECORDS,
            ss::RESUMED_TAIL
        );
        let Some(last) = self.ctx.session.latest_set() else {
            return;
        };
        self.ctx.picks.product = Some(last.item.product.clone());
        self.ctx.picks.equipment = last.equipment.clone();
        self.apply(vec![Effect::Show(views::curve::ID)]);
    }

    pub fn state(&self) -> RunState {
        self.state
    }

    pub fn status(&self) -> &str {
        &self.status
    }

    pub fn set_status(&mut self, text: String) {
        self.status = text;
    }

    pub fn overlay(&self) -> &Overlay {
        &self.overlay
    }

    pub fn views(&self) -> &[Box<dyn View>] {
        &self.views
    }

    pub fn active_view(&self) -> &dyn View {
        self.views[self.active].as_ref()
    }

    pub fn active_id(&self) -> ViewId {
        self.active_view().id()
    }

    /// What the screen is doing, for the key map.
    pub fn context(&self) -> Context {
        match &self.overlay {
            Overlay::Help { .. } => Context::Help,
            Overlay::ConfirmQuit { .. } => Context::ConfirmQuit,
            Overlay::Note(_) => Context::Note,
            Overlay::None if self.active_view().editing() => Context::Editing,
            Overlay::None => Context::Top(self.active_id()),
        }
    }

    /// Records waiting to go to the writer thread.
    pub fn take_outbox(&mut self) -> Vec<Outgoing> {
        std::mem::take(&mut self.outbox)
    }

    /// The writer thread's answer: its numbered records join the live state, and a new set
    /// or a model picked by hand gets its curve journalled as a result linked to it.
    pub fn on_reply(&mut self, reply: &Reply) {
        self.ctx.log.apply(reply);
        for record in &reply.records {
            let pick_before = self.pick_of_choice(record);
            self.ctx.session.apply(&self.ctx.site, record);
            self.answer(record, pick_before);
            let ctx = &self.ctx;
            let effects: Vec<Effect> = self
                .views
                .iter_mut()
                .flat_map(|v| v.answer(record, ctx))
                .collect();
            self.apply(effects);
        }
        if !reply.records.is_empty() {
            self.refresh_views();
        }
    }

    /// For a choice record, the model its set showed before it and whether pegged readings
    /// were kept.
    fn pick_of_choice(&self, record: &Record) -> Option<(crate::session::ModelPick, bool)> {
        let Payload::Choice { set, .. } = &record.payload else {
            return None;
        };
        let s = &self.ctx.session;
        s.sets
            .iter()
            .find(|e| e.seq == *set)
            .map(|e| (e.item.pick, e.item.include_off_scale))
    }

    /// Journal what the tool answered for a record just applied.
    fn answer(&mut self, record: &Record, pick_before: Option<(crate::session::ModelPick, bool)>) {
        let seq = record.seq;
        match &record.payload {
            Payload::ViscometerSet { .. } => {
                let Some(entry) = self.ctx.session.sets.iter().find(|e| e.seq == seq) else {
                    return;
                };
                let draft = entry.item.curve.as_ref().ok().map(|curve| {
                    curve_result(curve, entry.item.temperature_k, vec![seq], &entry.equipment)
                });
                if let Some(d) = draft {
                    self.journal(d);
                }
                self.apply(vec![Effect::Show(views::curve::ID)]);
            }
            Payload::Choice { set, .. } => {
                let Some(entry) = self.ctx.session.sets.iter().find(|e| e.seq == *set) else {
                    return;
                };
                if pick_before == Some((entry.item.pick, entry.item.include_off_scale)) {
                    return;
                }
                let hand = entry.item.by_hand.as_ref().and_then(|c| c.as_ref().ok());
                let draft = hand.map(|curve| {
                    curve_result(
                        curve,
                        entry.item.temperature_k,
                        vec![*set, seq],
                        &entry.equipment,
                    )
                });
                if let Some(d) = draft {
                    self.journal(d);
                }
            }
            _ => {}
        }
    }

    /// Let every view bring what it derives from the state up to date.
    fn refresh_views(&mut self) {
        for view in &mut self.views {
            view.refresh(&self.ctx);
        }
    }

    pub fn tick(&mut self, now: DateTime<FixedOffset>) {
        self.ctx.clock.now = now;
    }

    /// Why quitting now would lose something, one line per reason.
    pub fn unsaved_reasons(&self) -> Vec<String> {
        let mut out: Vec<String> = self
            .views
            .iter()
            .filter_map(|v| v.unsaved_input())
            .map(|what| format!("{what} {}.", cs::FORM_INPUT))
            .collect();
        let note = match &self.overlay {
            Overlay::Note(f) | Overlay::ConfirmQuit { note: Some(f) } => !f.is_empty(),
            _ => false,
        };
        if note {
            out.push(format!("{} {}.", ns::SUMMARY, cs::FORM_INPUT));
        }
        let n = self.ctx.unsaved();
        if n > 0 {
            out.push(format!("{n} {}.", cs::RECORDS_UNSAVED));
        }
        out
    }

    /// Quit, or ask first when something would be lost.
    pub fn request_quit(&mut self) {
        if self.unsaved_reasons().is_empty() {
            self.state = RunState::Quit;
        } else {
            let note = match std::mem::replace(&mut self.overlay, Overlay::None) {
                Overlay::Note(f) | Overlay::ConfirmQuit { note: Some(f) } => Some(f),
                _ => None,
            };
            self.overlay = Overlay::ConfirmQuit { note };
        }
    }

    /// Quit without asking (a signal): the loop still flushes the journal.
    pub fn force_quit(&mut self) {
        self.state = RunState::Quit;
    }

    /// One key event: releases and repeats are dropped here, before the key map.
    pub fn on_key(&mut self, ev: &KeyEvent) {
        let Some(key) = Key::from_event(ev) else {
            return;
        };
        // Every key press starts with a clear status line: a message belongs to the action
        // that caused it, never to a later one.
        self.status.clear();
        let context = self.context();
        let view_keys = self.active_view().keys();
        let Some(action) = keymap::lookup(context, key, view_keys) else {
            return;
        };
        if action == Action::Interrupt {
            return self.request_quit();
        }
        match context {
            Context::Help => self.help_key(action),
            Context::ConfirmQuit => self.confirm_key(action),
            Context::Note => self.note_key(action),
            Context::Editing => self.view_key(action),
            Context::Top(_) => self.top_key(action),
        }
    }

    fn top_key(&mut self, action: Action) {
        let n = self.views.len();
        match action {
            Action::Quit => self.request_quit(),
            Action::Help => self.overlay = Overlay::Help { scroll: 0 },
            Action::NextView => self.active = (self.active + 1) % n,
            Action::PrevView => self.active = (self.active + n - 1) % n,
            Action::AddNote => self.overlay = Overlay::new_note(),
            _ => self.view_key(action),
        }
    }

    fn view_key(&mut self, action: Action) {
        let effects = self.views[self.active].handle(action, &self.ctx);
        self.apply(effects);
    }

    fn help_key(&mut self, action: Action) {
        if let Overlay::Help { scroll } = &mut self.overlay {
            match action {
                Action::Close => self.overlay = Overlay::None,
                Action::Up => *scroll = scroll.saturating_sub(1),
                Action::Down => *scroll = scroll.saturating_add(1),
                Action::PageUp => *scroll = scroll.saturating_sub(10),
                Action::PageDown => *scroll = scroll.saturating_add(10),
                _ => {}
            }
        }
    }

    fn confirm_key(&mut self, action: Action) {
        match action {
            Action::Yes => self.state = RunState::Quit,
            Action::No => {
                self.overlay = match std::mem::replace(&mut self.overlay, Overlay::None) {
                    Overlay::ConfirmQuit { note: Some(f) } => Overlay::Note(f),
                    _ => Overlay::None,
                };
            }
            _ => {}
        }
    }

    fn note_key(&mut self, action: Action) {
        let Overlay::Note(field) = &mut self.overlay else {
            return;
        };
        match editing::apply(field, action) {
            EditStep::Cancelled => self.overlay = Overlay::None,
            // Enter saves; Tab and the arrows have nowhere to go in a one-field box.
            EditStep::Accepted(Leave::Below) => {
                let text = field.text().trim().to_string();
                self.overlay = Overlay::None;
                self.save_note(text);
            }
            EditStep::Accepted(_) | EditStep::Typing => {}
        }
    }

    fn save_note(&mut self, text: String) {
        if text.is_empty() {
            self.status = ns::EMPTY.to_string();
            return;
        }
        let equipment = self.ctx.picks.equipment.clone();
        let payload = Payload::Note { text };
        let summary = super::session_log::summarize(&payload, equipment.as_deref());
        self.journal(Draft {
            equipment,
            payload,
            summary,
        });
        self.status = ns::SAVED.to_string();
    }

    fn apply(&mut self, effects: Vec<Effect>) {
        let picks_before = self.ctx.picks.clone();
        for effect in effects {
            match effect {
                Effect::Status(s) => self.status = s,
                Effect::PickEquipment(id) => {
                    self.ctx.picks.equipment = Some(id);
                    self.refresh_views();
                }
                Effect::PickProduct(p) => {
                    self.ctx.picks.product = Some(p);
                    self.refresh_views();
                }
                Effect::Journal(d) => {
                    self.journal(d);
                }
                Effect::Show(id) => {
                    if let Some(i) = self.views.iter().position(|v| v.id() == id) {
                        self.active = i;
                    }
                }
            }
        }
        // Views that follow the picks (the spot readings offered) see the new ones.
        if self.ctx.picks != picks_before {
            self.refresh_views();
        }
    }

    fn journal(&mut self, draft: Draft) -> Ticket {
        let ticket = self.ctx.log.push(self.ctx.clock.now, draft.summary);
        self.outbox.push(Outgoing {
            ticket,
            equipment: draft.equipment,
            payload: draft.payload,
        });
        ticket
    }
}

/// The curve shown, as a result record linked to what it was computed from.
fn curve_result(
    curve: &FlowCurve,
    temperature_k: Option<f64>,
    from: Vec<u64>,
    equipment: &Option<String>,
) -> Draft {
    let payload = Payload::Result {
        what: format!("flow-curve {}", curve.fit.model.kind().title()),
        result_kind: Some(ResultKind::FlowCurve),
        from,
        data: curve_json(curve, &FlowCurveOptions::default(), temperature_k),
    };
    Draft {
        summary: super::session_log::summarize(&payload, equipment.as_deref()),
        equipment: equipment.clone(),
        payload,
    }
}
