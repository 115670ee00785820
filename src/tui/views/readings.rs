//! The Readings view: enter a viscometer set (speed and dial per row, temperature, notes)
//! with fields checked as they are typed.
//!
//! The form owns its keys: once in it (Enter, Down or a digit), every printable key types
//! into the field that has the focus, so no letter can save a set or switch a model by
//! accident. Saving is deliberate: Ctrl-S anywhere in the form, or Enter on the "Save set"
//! line. Esc puts the field back and leaves the form, where Tab goes to the next view.

use super::readings_draw;
use super::readings_form::{CheckedSet, Focus, Form};
use super::{Draft, Effect, View, ViewId};
use crate::instrument::Geometry;
use crate::journal::Payload;
use crate::rheology::ModelKind;
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b, h};
use crate::tui::strings::readings as s;
use crate::tui::strings::{caution, keys, views as names};
use crate::tui::widgets::editing::{self, EditStep, Leave};
use ratatui::Frame;
use ratatui::layout::Rect;

/// This view's id.
pub const ID: ViewId = ViewId("readings");

/// The Readings view's own keys: outside the form, the ways in; inside it, only Ctrl keys
/// (every printable key types).
const KEYS: &[Binding] = &[
    b(
        Scope::View,
        &[Key::Enter, Key::Down],
        Action::Activate,
        keys::EDIT_FIELD,
    ),
    h(Scope::View, &[Key::Digit], Action::Type('0'), keys::TYPE_VALUE),
    b(Scope::ViewTyping, &[Key::Ctrl('s')], Action::Save, keys::SAVE_SET),
    h(Scope::ViewTyping, &[Key::Ctrl('n')], Action::AddRow, keys::ADD_ROW),
    h(Scope::ViewTyping, &[Key::Ctrl('d')], Action::RemoveRow, keys::REMOVE_ROW),
    h(
        Scope::ViewTyping,
        &[Key::CtrlLeft],
        Action::ToSpeedColumn,
        keys::TO_SPEED,
    ),
    h(
        Scope::ViewTyping,
        &[Key::CtrlRight],
        Action::ToDialColumn,
        keys::TO_DIAL,
    ),
];

/// Fewest readings for the simplest model (Newtonian, one parameter) to be compared by
/// AICc, which needs readings − parameters − 1 > 0 (Hurvich & Tsai 1989, from memory).
fn fewest_readings() -> usize {
    ModelKind::Newtonian.param_count() + 2
}

pub struct ReadingsView {
    form: Form,
    /// In the form: the focused field takes every printable key.
    editing: bool,
    /// A short set was refused once; the next Ctrl-S saves it anyway.
    confirm_few: bool,
    /// Dials are typed and a viscometer change was asked for once (this way); the next
    /// press the same way switches.
    confirm_switch: Option<isize>,
}

fn geometry(ctx: &Ctx, index: usize) -> Option<&Geometry> {
    ctx.site.viscometers.get(index).map(|v| &v.geometry)
}

impl ReadingsView {
    pub fn new(ctx: &Ctx) -> ReadingsView {
        ReadingsView {
            form: Form::new(0, geometry(ctx, 0)),
            editing: false,
            confirm_few: false,
            confirm_switch: None,
        }
    }

    /// Test and bench access to the form.
    pub fn form(&self) -> &Form {
        &self.form
    }

    /// Go into the form at its focus; the field's text is taken for replacing.
    fn enter(&mut self) {
        self.editing = true;
        self.arrive();
    }

    /// The focus has just moved to a new stop: start editing it, text selected.
    fn arrive(&mut self) {
        if let Some(field) = self.form.field_mut(self.form.focus) {
            field.begin_edit();
            self.form.replace_next = !field.is_empty();
        } else {
            self.form.replace_next = false;
        }
    }

    /// Left / Right on the viscometer line. With dials typed, the first press asks and a
    /// second press the same way switches (dials and speeds kept as typed).
    fn cycle_viscometer(&mut self, ctx: &Ctx, step: isize) -> Vec<Effect> {
        let n = ctx.site.viscometers.len();
        if n < 2 {
            return vec![Effect::Status(s::ONLY_VISCOMETER.to_string())];
        }
        let old = self.form.viscometer;
        let new = (old as isize + step).rem_euclid(n as isize) as usize;
        let id = |i: usize| ctx.site.viscometers.get(i).map_or("", |v| v.id.as_str());
        let dials = self.form.dials_typed();
        if dials > 0 && self.confirm_switch != Some(step) {
            self.confirm_switch = Some(step);
            let text = format!(
                "{dials} {} {}. {} {} {}",
                s::DIALS_TYPED_ON,
                sanitize(id(old), false),
                s::PRESS_AGAIN_TO_SWITCH,
                sanitize(id(new), false),
                s::KEEPING_DIALS
            );
            return vec![Effect::Status(text)];
        }
        self.confirm_switch = None;
        let speeds_changed = self
            .form
            .set_viscometer(new, geometry(ctx, old), geometry(ctx, new));
        let speeds = if speeds_changed {
            s::SPEEDS_SET
        } else {
            s::SPEEDS_KEPT
        };
        let text = format!(
            "{} {} ({} {}): {dials} {}; {speeds}.",
            s::SWITCHED,
            sanitize(id(new), false),
            s::WAS,
            sanitize(id(old), false),
            s::DIALS_KEPT
        );
        vec![Effect::Status(text)]
    }

    /// A key while in the form.
    fn handle_editing(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match action {
            Action::Save => return self.save(ctx),
            Action::AddRow => return self.row_change(Form::add_row),
            Action::RemoveRow => return self.row_change(Form::remove_row),
            Action::ToSpeedColumn | Action::ToDialColumn => {
                self.form.go_to_column(action == Action::ToSpeedColumn);
                self.arrive();
                return self.moved();
            }
            _ => {}
        }
        match self.form.focus {
            Focus::Viscometer => self.on_viscometer(action, ctx),
            Focus::Save => self.on_save_line(action, ctx),
            _ => self.on_field(action),
        }
    }

    fn on_viscometer(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match action {
            Action::Left => self.cycle_viscometer(ctx, -1),
            Action::Right => self.cycle_viscometer(ctx, 1),
            Action::Cancel => self.park(),
            Action::Accept | Action::AcceptNext | Action::AcceptDown => self.leave(Leave::Down),
            Action::Type(_) => vec![Effect::Status(s::ON_VISCOMETER.to_string())],
            _ => Vec::new(),
        }
    }

    fn on_save_line(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match action {
            Action::Accept => self.save(ctx),
            Action::Cancel => self.park(),
            Action::AcceptPrev | Action::AcceptUp => self.leave(Leave::Up),
            Action::Type(_) => vec![Effect::Status(s::ON_SAVE_LINE.to_string())],
            _ => Vec::new(),
        }
    }

    fn on_field(&mut self, action: Action) -> Vec<Effect> {
        let focus = self.form.focus;
        let replace = std::mem::take(&mut self.form.replace_next);
        let Some(field) = self.form.field_mut(focus) else {
            return Vec::new();
        };
        if let (Action::Type(c), true) = (action, replace) {
            editing::start_with(field, c);
            return Vec::new();
        }
        match editing::apply(field, action) {
            EditStep::Typing => Vec::new(),
            EditStep::Cancelled => self.park(),
            EditStep::Accepted(leave) => self.leave(leave),
        }
    }

    /// Leave the form: the field being typed goes back as it was.
    fn park(&mut self) -> Vec<Effect> {
        self.editing = false;
        self.form.replace_next = false;
        vec![Effect::Status(s::LEFT_FORM.to_string())]
    }

    fn leave(&mut self, leave: Leave) -> Vec<Effect> {
        match leave {
            Leave::Below | Leave::Down => self.form.down(),
            Leave::Up => self.form.up(),
            Leave::Next => self.form.next(),
            Leave::Prev => self.form.prev(),
        }
        self.arrive();
        Vec::new()
    }

    fn moved(&self) -> Vec<Effect> {
        vec![Effect::Status(format!(
            "{} {}.",
            s::MOVED_TO,
            self.form.focus.describe()
        ))]
    }

    fn row_change(&mut self, change: fn(&mut Form) -> Result<(), &'static str>) -> Vec<Effect> {
        let result = change(&mut self.form);
        self.arrive();
        match result {
            Ok(()) => self.moved(),
            Err(msg) => vec![Effect::Status(msg.to_string())],
        }
    }

    fn handle_top(&mut self, action: Action) -> Vec<Effect> {
        match action {
            Action::Activate => {
                self.enter();
                self.moved()
            }
            Action::Type(c) => {
                self.enter();
                self.on_field(Action::Type(c))
            }
            _ => Vec::new(),
        }
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
                self.editing = true;
                self.arrive();
                let text = format!(
                    "{} — {} {}.",
                    refusal.message,
                    s::REFUSED_AT,
                    refusal.focus.describe()
                );
                return vec![Effect::Status(text)];
            }
        };
        let few = checked.rows.len() < fewest_readings();
        if few && !std::mem::replace(&mut self.confirm_few, true) {
            let text = format!(
                "{} {} ({}). {}",
                checked.rows.len(),
                s::FEW_READINGS,
                fewest_readings(),
                s::CONFIRM_FEW
            );
            return vec![Effect::Status(text)];
        }
        self.confirm_few = false;
        let drafts = drafts(&checked, &visc.id, &product, ctx.picks.equipment.clone());
        self.form.reset(Some(&visc.geometry));
        self.editing = false;
        let mut effects: Vec<Effect> = drafts.into_iter().map(Effect::Journal).collect();
        effects.push(Effect::Status(s::SAVED.to_string()));
        effects
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
    let mut out = vec![Draft::new(set, equipment.clone())];
    if let Some(text) = &checked.notes {
        out.push(Draft::new(
            Payload::Note {
                text: sanitize(text, false),
            },
            equipment,
        ));
    }
    out
}

impl View for ReadingsView {
    view_identity!(ID, names::READINGS, caution::READINGS, KEYS);


    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if self.editing {
            if action != Action::Save {
                self.confirm_few = false;
            }
            if !matches!(action, Action::Left | Action::Right) {
                self.confirm_switch = None;
            }
            return self.handle_editing(action, ctx);
        }
        self.handle_top(action)
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
