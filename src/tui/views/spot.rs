//! The Spot readings view: the readings of the catalogue that fit the picked equipment (a
//! pump, a line or a tank), each typed with its unit and checked as it is typed against the
//! site's own limits for that equipment, said in words with the caution that applies.
//! Ctrl-S journals them (through the writer thread, like a viscometer set), each reading
//! beyond a limit with a finding beside it; the session state then holds them for the
//! pipe-flow, restart/pump and tank views.

use super::{Draft, Effect, View, ViewId};
use crate::journal::{Payload, Severity};
use crate::present;
use crate::readings::{ParsedReading, ReadingKind, parse_reading_arg_at};
use crate::session::spot::{self, NotChecked, SpotCall};
use crate::site::Site;
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b, h};
use crate::tui::layout::{clip_words, row};
use crate::tui::strings::spot as s;
use crate::tui::strings::{caution, keys, views as names};
use crate::tui::widgets::editing::{self, EditStep, Leave};
use crate::tui::widgets::field::{Field, FieldKind};
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

/// This view's id.
pub const ID: ViewId = ViewId("spot");

const KEYS: &[Binding] = &[
    b(
        Scope::View,
        &[Key::Enter, Key::Down],
        Action::Activate,
        keys::EDIT_FIELD,
    ),
    h(Scope::View, &[Key::Digit], Action::Type('0'), keys::TYPE_VALUE),
    b(
        Scope::ViewTyping,
        &[Key::Ctrl('s')],
        Action::Save,
        keys::SAVE_READINGS,
    ),
];

/// Longest value text ("12.5 bar" and a little room).
const VALUE_MAX_CHARS: usize = 24;
const NAME_W: u16 = 20;
const VALUE_W: u16 = 14;

/// One reading row: what it is, what is typed, and what the typed text gives.
struct SpotRow {
    kind: &'static ReadingKind,
    field: Field,
    checked: RowState,
}

/// A typed reading, parsed and checked against the site's limits.
#[derive(Default)]
enum RowState {
    #[default]
    Empty,
    Invalid(String),
    Read {
        parsed: ParsedReading,
        calls: Vec<SpotCall>,
        not_checked: Option<NotChecked>,
    },
}

pub struct SpotView {
    /// The equipment the rows were made for.
    equipment: Option<String>,
    rows: Vec<SpotRow>,
    focus: usize,
    editing: bool,
    replace_next: bool,
}

fn rows_for(site: &Site, equipment: Option<&str>) -> Vec<SpotRow> {
    let kind = equipment.and_then(|e| spot::kind_of(site, e));
    kind.map(spot::offered)
        .unwrap_or_default()
        .into_iter()
        .map(|kind| SpotRow {
            kind,
            field: Field::new(FieldKind::Text(VALUE_MAX_CHARS)),
            checked: RowState::Empty,
        })
        .collect()
}

/// Parse one typed value with its reading's unit rules, and check it against the site.
fn check_row(site: &Site, equipment: &str, kind: &'static ReadingKind, text: &str) -> RowState {
    if text.trim().is_empty() {
        return RowState::Empty;
    }
    let arg = format!("{}={}", kind.name, text);
    match parse_reading_arg_at(&arg, site.atmospheric_pressure_pa) {
        Err(e) => RowState::Invalid(e.to_string()),
        Ok(parsed) => {
            let (calls, not_checked) = match spot::check(site, equipment, kind.name, parsed.value_si)
            {
                Ok(c) => (c, None),
                Err(n) => (Vec::new(), Some(n)),
            };
            RowState::Read {
                parsed,
                calls,
                not_checked,
            }
        }
    }
}

impl SpotView {
    pub fn new(ctx: &Ctx) -> SpotView {
        let equipment = ctx.picks.equipment.clone();
        SpotView {
            rows: rows_for(&ctx.site, equipment.as_deref()),
            equipment,
            focus: 0,
            editing: false,
            replace_next: false,
        }
    }

    /// New rows when another piece of equipment was picked (typed values belong to the old).
    fn follow_pick(&mut self, ctx: &Ctx) {
        if self.equipment != ctx.picks.equipment {
            *self = SpotView::new(ctx);
        }
    }

    fn recheck(&mut self, ctx: &Ctx) {
        let Some(eq) = self.equipment.clone() else {
            return;
        };
        if let Some(r) = self.rows.get_mut(self.focus) {
            r.checked = check_row(&ctx.site, &eq, r.kind, r.field.text());
        }
    }

    fn arrive(&mut self) {
        if let Some(r) = self.rows.get_mut(self.focus) {
            r.field.begin_edit();
            self.replace_next = !r.field.is_empty();
        }
    }

    fn on_field(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        let replace = std::mem::take(&mut self.replace_next);
        let last = self.rows.len().saturating_sub(1);
        let Some(r) = self.rows.get_mut(self.focus) else {
            return Vec::new();
        };
        let step = match (action, replace) {
            (Action::Type(c), true) => {
                editing::start_with(&mut r.field, c);
                EditStep::Typing
            }
            _ => editing::apply(&mut r.field, action),
        };
        self.recheck(ctx);
        match step {
            EditStep::Typing => Vec::new(),
            EditStep::Cancelled => {
                self.editing = false;
                vec![Effect::Status(s::LEFT_FORM.to_string())]
            }
            EditStep::Accepted(leave) => {
                self.focus = match leave {
                    Leave::Up | Leave::Prev => self.focus.saturating_sub(1),
                    _ => (self.focus + 1).min(last),
                };
                self.arrive();
                Vec::new()
            }
        }
    }

    fn save(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let Some(equipment) = self.equipment.clone() else {
            return vec![Effect::Status(s::NEED_EQUIPMENT.to_string())];
        };
        let style = ctx.style();
        let mut drafts = Vec::new();
        let mut over = 0;
        for (i, r) in self.rows.iter().enumerate() {
            match &r.checked {
                RowState::Empty => {}
                RowState::Invalid(msg) => {
                    let text = format!("{msg} - {} {}.", s::CURSOR_ON, r.kind.name);
                    self.focus = i;
                    self.editing = true;
                    self.arrive();
                    return vec![Effect::Status(text)];
                }
                RowState::Read { parsed, calls, .. } => {
                    drafts.push(draft(parsed.payload(), &equipment));
                    if let Some(text) = parsed.conversion_note() {
                        let note = Payload::Finding {
                            severity: Severity::Info,
                            text,
                        };
                        drafts.push(draft(note, &equipment));
                    }
                    for c in calls {
                        over += 1;
                        let finding = Payload::Finding {
                            severity: Severity::Warning,
                            text: present::spot::call_with_caution(c, style),
                        };
                        drafts.push(draft(finding, &equipment));
                    }
                }
            }
        }
        let readings = drafts
            .iter()
            .filter(|d| matches!(d.payload, Payload::Reading { .. }))
            .count();
        if readings == 0 {
            return vec![Effect::Status(s::NOTHING_TYPED.to_string())];
        }
        *self = SpotView {
            editing: false,
            ..SpotView::new(ctx)
        };
        let mut effects: Vec<Effect> = drafts.into_iter().map(Effect::Journal).collect();
        let tail = if over > 0 {
            format!(" {over} {}", s::OVER_JOURNALLED)
        } else {
            String::new()
        };
        effects.push(Effect::Status(format!(
            "{readings} {} {}.{tail}",
            s::SENT,
            sanitize(&equipment, false)
        )));
        effects
    }

    fn draw_row(&self, frame: &mut Frame, area: Rect, i: usize, ctx: &Ctx) {
        let t = &ctx.theme;
        let style = ctx.style();
        let r = &self.rows[i];
        let selected = i == self.focus;
        frame.render_widget(
            Paragraph::new(Span::styled(r.kind.name, t.dim)),
            Rect {
                width: NAME_W,
                ..area
            }
            .intersection(area),
        );
        let field_area = Rect {
            x: area.x + NAME_W,
            width: VALUE_W,
            ..area
        }
        .intersection(area);
        let field_style = match (selected, self.editing) {
            (true, true) if self.replace_next => t.selected,
            (true, true) => t.field_editing,
            (true, false) => t.selected,
            _ => t.field,
        };
        if let Some(pos) = r.field.render(
            field_area,
            frame.buffer_mut(),
            field_style,
            selected && self.editing,
        ) {
            frame.set_cursor_position(pos);
        }
        let rest = Rect {
            x: field_area.right() + 2,
            ..area
        }
        .intersection(area);
        let width = usize::from(rest.width);
        let line = match &r.checked {
            RowState::Empty => Line::styled(style.text(&unit_hint(r.kind)), t.dim),
            RowState::Invalid(msg) => {
                Line::styled(clip_words(&style.text(msg), width, t.marks.cut), t.error)
            }
            RowState::Read { calls, .. } if !calls.is_empty() => {
                let text = format!("! {}", present::spot::short_text(&calls[0], style));
                Line::styled(clip_words(&text, width, t.marks.cut), t.error)
            }
            RowState::Read { parsed, .. } => Line::styled(
                format!(
                    "= {}",
                    present::quantity(parsed.value_si, parsed.kind.dimension, style)
                ),
                t.ok,
            ),
        };
        frame.render_widget(Paragraph::new(line), rest);
    }

    /// The focused row in full: its problem, its call-outs with their caution, or its help.
    fn message(&self, ctx: &Ctx) -> (String, ratatui::style::Style) {
        let t = &ctx.theme;
        let style = ctx.style();
        if !self.editing {
            return (s::PARKED_HINT.to_string(), t.dim);
        }
        let Some(r) = self.rows.get(self.focus) else {
            return (String::new(), t.dim);
        };
        match &r.checked {
            RowState::Invalid(msg) => (format!("! {msg}"), t.error),
            RowState::Read { calls, .. } if !calls.is_empty() => {
                let all: Vec<String> = calls
                    .iter()
                    .map(|c| present::spot::call_with_caution(c, style))
                    .collect();
                (format!("! {}", all.join(" ")), t.error)
            }
            RowState::Read {
                not_checked: Some(n),
                ..
            } => (
                format!("{}: {}.", r.kind.name, present::spot::not_checked_text(n)),
                t.warn,
            ),
            _ => (format!("{}: {}.", r.kind.name, r.kind.help), t.dim),
        }
    }
}

/// "(bar unless a unit is typed)".
fn unit_hint(kind: &ReadingKind) -> String {
    format!("({} {})", kind.dimension.default_unit(), s::UNLESS_UNIT)
}

fn draft(payload: Payload, equipment: &str) -> Draft {
    Draft::new(payload, Some(equipment.to_string()))
}

impl View for SpotView {
    view_identity!(ID, names::SPOT, caution::SPOT, KEYS);

    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        self.follow_pick(ctx);
        if self.rows.is_empty() {
            return vec![Effect::Status(s::PICK_EQUIPMENT.to_string())];
        }
        if !self.editing {
            return match action {
                Action::Activate => {
                    self.editing = true;
                    self.arrive();
                    Vec::new()
                }
                Action::Type(c) => {
                    self.editing = true;
                    self.arrive();
                    self.on_field(Action::Type(c), ctx)
                }
                _ => Vec::new(),
            };
        }
        match action {
            Action::Save => self.save(ctx),
            other => self.on_field(other, ctx),
        }
    }

    fn refresh(&mut self, ctx: &Ctx) {
        self.follow_pick(ctx);
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let title = match &self.equipment {
            Some(e) => format!(" {} {} ", s::TITLE, sanitize(e, false)),
            None => format!(" {} ", s::TITLE),
        };
        let block = t.panel(title);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        if self.rows.is_empty() {
            let p = Paragraph::new(s::PICK_EQUIPMENT)
                .style(t.dim)
                .wrap(Wrap { trim: true });
            frame.render_widget(p, inner);
            return;
        }
        for i in 0..self.rows.len() {
            self.draw_row(frame, row(inner, i as u16), i, ctx);
        }
        let top = self.rows.len() as u16 + 1;
        let message = Rect {
            y: inner.y + top,
            height: inner.height.saturating_sub(top),
            ..inner
        }
        .intersection(inner);
        let (text, style) = self.message(ctx);
        let p = Paragraph::new(ctx.style().text(&text))
            .style(style)
            .wrap(Wrap { trim: true });
        frame.render_widget(p, message);
    }

    fn editing(&self) -> bool {
        self.editing
    }

    fn unsaved_input(&self) -> Option<&'static str> {
        self.rows
            .iter()
            .any(|r| !r.field.is_empty())
            .then_some(s::FORM_NAME)
    }
}
