//! The Readings view: enter a viscometer set (speed and dial per row, temperature, notes)
//! with fields checked as they are typed; `s` journals the set and shows its flow curve.

use super::readings_draw;
use super::readings_form::{CheckedSet, Focus, Form};
use super::{Draft, Effect, View, ViewId};
use crate::instrument::Geometry;
use crate::journal::Payload;
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b, h};
use crate::tui::strings::{caution, keys, views as names};
use crate::tui::session_log::summarize;
use crate::tui::strings::readings as s;
use crate::tui::widgets::editing::{self, EditStep, Leave};
use ratatui::Frame;
use ratatui::layout::Rect;

/// This view's id.
pub const ID: ViewId = ViewId("readings");

/// The Readings view's own keys.
const KEYS: &[Binding] = &[
    b(Scope::View, &[Key::Enter, Key::Char('e')], Action::Activate, keys::EDIT_FIELD),
    h(Scope::View, &[Key::Digit], Action::Type('0'), keys::TYPE_VALUE),
    b(Scope::View, &[Key::Char('s')], Action::Save, keys::SAVE_SET),
    h(Scope::View, &[Key::Char('a')], Action::AddRow, keys::ADD_ROW),
    h(Scope::View, &[Key::Char('x')], Action::RemoveRow, keys::REMOVE_ROW),
];

pub struct ReadingsView {
    form: Form,
    editing: bool,
}

fn geometry(ctx: &Ctx, index: usize) -> Option<&Geometry> {
    ctx.site.viscometers.get(index).map(|v| &v.geometry)
}

impl ReadingsView {
    pub fn new(ctx: &Ctx) -> ReadingsView {
        ReadingsView {
            form: Form::new(0, geometry(ctx, 0)),
            editing: false,
        }
    }

    /// Test and bench access to the form.
    pub fn form(&self) -> &Form {
        &self.form
    }

    fn begin_edit(&mut self, first: Option<char>) {
        let Some(field) = self.form.field_mut(self.form.focus) else {
            return;
        };
        match first {
            Some(c) => editing::start_with(field, c),
            None => field.begin_edit(),
        }
        self.editing = true;
    }

    fn cycle_viscometer(&mut self, ctx: &Ctx, step: isize) {
        let n = ctx.site.viscometers.len();
        if n == 0 {
            return;
        }
        let old = self.form.viscometer;
        let new = (old as isize + step).rem_euclid(n as isize) as usize;
        self.form
            .set_viscometer(new, geometry(ctx, old), geometry(ctx, new));
    }

    fn handle_editing(&mut self, action: Action) {
        let focus = self.form.focus;
        let Some(field) = self.form.field_mut(focus) else {
            self.editing = false;
            return;
        };
        match editing::apply(field, action) {
            EditStep::Typing => {}
            EditStep::Cancelled => self.editing = false,
            EditStep::Accepted(leave) => self.leave_field(leave),
        }
    }

    fn leave_field(&mut self, leave: Leave) {
        match leave {
            Leave::Below | Leave::Down => self.form.down(),
            Leave::Up => self.form.up(),
            Leave::Next => self.form.next(),
            Leave::Prev => self.form.prev(),
        }
        let keep_typing = matches!(leave, Leave::Next | Leave::Prev);
        self.editing = false;
        if keep_typing {
            self.begin_edit(None);
        }
    }

    fn handle_top(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        let on_choice = self.form.focus == Focus::Viscometer;
        match action {
            Action::Up => self.form.up(),
            Action::Down => self.form.down(),
            Action::Left if on_choice => self.cycle_viscometer(ctx, -1),
            Action::Right | Action::Activate if on_choice => self.cycle_viscometer(ctx, 1),
            Action::Left | Action::Right => self.form.across(),
            Action::Home => self.form.focus = Focus::Viscometer,
            Action::End => self.form.focus = Focus::Notes,
            Action::Activate => self.begin_edit(None),
            Action::Type(c) => self.begin_edit(Some(c)),
            Action::AddRow => return status(self.form.add_row()),
            Action::RemoveRow => return status(self.form.remove_row()),
            Action::Save => return self.save(ctx),
            _ => {}
        }
        Vec::new()
    }

    fn save(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let Some(product) = ctx.picks.product.clone() else {
            return vec![Effect::Status(s::NEED_PRODUCT.to_string())];
        };
        let Some(visc) = ctx.site.viscometers.get(self.form.viscometer) else {
            return vec![Effect::Status(s::NEED_VISCOMETER.to_string())];
        };
        let checked = match self.form.check() {
            Ok(c) => c,
            Err(refusal) => {
                self.form.focus = refusal.focus;
                return vec![Effect::Status(refusal.message)];
            }
        };
        let drafts = drafts(&checked, &visc.id, &product, ctx.picks.equipment.clone());
        self.form.reset(Some(&visc.geometry));
        let mut effects: Vec<Effect> = drafts.into_iter().map(Effect::Journal).collect();
        effects.push(Effect::Status(s::SAVED.to_string()));
        effects
    }
}

fn status(result: Result<(), &'static str>) -> Vec<Effect> {
    match result {
        Ok(()) => Vec::new(),
        Err(msg) => vec![Effect::Status(msg.to_string())],
    }
}

/// The set record, then the notes typed with it as a note record on the same equipment.
/// The flow curve is fitted once, when the journal's numbered record is applied to the
/// session state; the app then journals it as a result linked to the set.
fn drafts(
    checked: &CheckedSet,
    viscometer: &str,
    product: &str,
    equipment: Option<String>,
) -> Vec<Draft> {
    let set = Payload::ViscometerSet {
        viscometer: viscometer.to_string(),
        product: product.to_string(),
        temperature_raw: checked.temperature.as_ref().map(|t| t.0.clone()),
        temperature_k: checked.temperature.as_ref().map(|t| t.1),
        rows: checked.rows.clone(),
    };
    let mut out = vec![draft(set, equipment.clone())];
    if let Some(text) = &checked.notes {
        out.push(draft(
            Payload::Note {
                text: sanitize(text, false),
            },
            equipment,
        ));
    }
    out
}

fn draft(payload: Payload, equipment: Option<String>) -> Draft {
    Draft {
        summary: summarize(&payload, equipment.as_deref()),
        equipment,
        payload,
    }
}

impl View for ReadingsView {
    fn id(&self) -> ViewId {
        ID
    }

    fn title(&self) -> &'static str {
        names::READINGS
    }

    fn caution(&self) -> &'static str {
        caution::READINGS
    }

    fn keys(&self) -> &'static [Binding] {
        KEYS
    }


    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if self.editing {
            self.handle_editing(action);
            return Vec::new();
        }
        self.handle_top(action, ctx)
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let block = ctx.theme.panel(s::TITLE);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        readings_draw::draw(frame, inner, &self.form, self.editing, ctx);
    }

    fn editing(&self) -> bool {
        self.editing
    }

    fn unsaved_input(&self) -> Option<&'static str> {
        self.form.has_input().then_some(s::FORM_NAME)
    }
}
