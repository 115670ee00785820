//! Boxes drawn over the views: the help (generated from the key map), the question before
//! quitting, and the note box. Each is intersected with the frame, so none can overflow it.

use super::keymap::Binding;
use super::keymap::{self, Scope};
use super::layout::popup;
use super::strings::{confirm as cs, help as hs, note as ns};
use super::theme::Theme;
use super::views::View;
use super::widgets::field::{Field, FieldKind};
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Clear, Paragraph, Wrap};

/// Longest note accepted (one journal line stays readable).
const NOTE_MAX_CHARS: usize = 500;
const KEY_COL: usize = 22;

#[derive(Debug, Clone, PartialEq)]
pub enum Overlay {
    None,
    Help {
        scroll: u16,
    },
    /// Asking before quitting; a note being typed waits underneath and comes back on "no".
    ConfirmQuit {
        note: Option<Field>,
    },
    Note(Field),
}

impl Overlay {
    pub fn new_note() -> Overlay {
        let mut field = Field::new(FieldKind::Text(NOTE_MAX_CHARS));
        field.begin_edit();
        Overlay::Note(field)
    }
}

/// Every binding, by where it applies; the views' own sections in tab order.
pub fn help_lines(views: &[Box<dyn View>], t: &Theme) -> Vec<Line<'static>> {
    let shared = |title: &str, scope| {
        let rows: Vec<&'static Binding> = keymap::in_scope(scope).collect();
        (title.to_string(), scope, rows)
    };
    let mut sections = vec![
        shared(hs::EVERYWHERE, Scope::Always),
        shared(hs::TOP_LEVEL, Scope::Global),
        shared(hs::MOVING, Scope::Moving),
    ];
    for v in views {
        sections.push((
            v.title().to_string(),
            Scope::View,
            v.keys().iter().collect(),
        ));
    }
    sections.extend([
        shared(hs::EDITING, Scope::Editing),
        shared(hs::NOTE_BOX, Scope::NoteBox),
        shared(hs::IN_HELP, Scope::Help),
        shared(hs::CONFIRM, Scope::ConfirmQuit),
    ]);
    let mut lines = Vec::new();
    for (title, scope, bindings) in sections {
        let rows: Vec<Line> = bindings
            .into_iter()
            .map(|b| {
                Line::from(vec![
                    Span::styled(format!("  {:<KEY_COL$}", keymap::key_names(b.keys)), t.key),
                    Span::raw(b.label),
                ])
            })
            .collect();
        if rows.is_empty() {
            continue;
        }
        lines.push(Line::styled(title, t.title));
        lines.extend(rows);
        if scope == Scope::Editing {
            lines.push(Line::styled(
                format!("  {:<KEY_COL$}{}", "", hs::TYPING_TEXT),
                t.dim,
            ));
        }
    }
    lines
}

pub fn draw_help(frame: &mut Frame, scroll: u16, views: &[Box<dyn View>], t: &Theme) {
    let area = popup(frame.area(), 74, frame.area().height.saturating_sub(2));
    let lines = help_lines(views, t);
    let block = t
        .panel(hs::TITLE)
        .title_bottom(Line::styled(format!(" {} ", hs::SCROLL_HINT), t.dim));
    let inner = block.inner(area);
    let max_scroll = (lines.len() as u16).saturating_sub(inner.height);
    frame.render_widget(Clear, area);
    frame.render_widget(
        Paragraph::new(lines)
            .scroll((scroll.min(max_scroll), 0))
            .block(block),
        area,
    );
}

pub fn draw_confirm(frame: &mut Frame, reasons: &[String], t: &Theme) {
    let height = reasons.len().max(1) as u16 * 2 + 5;
    let area = popup(frame.area(), 64, height);
    let mut lines: Vec<Line> = reasons
        .iter()
        .map(|r| Line::raw(format!("- {r}")))
        .collect();
    // The last record may reach the disk while the question is open.
    if reasons.is_empty() {
        lines.push(Line::styled(cs::NOTHING_UNSAVED, t.ok));
    }
    lines.push(Line::raw(""));
    let mut question = vec![Span::styled(format!("{}  ", cs::QUESTION), t.warn)];
    for b in keymap::in_scope(Scope::ConfirmQuit).filter(|b| b.footer) {
        question.push(Span::styled(keymap::key_names(b.keys), t.key));
        question.push(Span::raw(format!(" {}   ", b.label)));
    }
    lines.push(Line::from(question));
    frame.render_widget(Clear, area);
    let para = Paragraph::new(lines)
        .wrap(Wrap { trim: true })
        .block(t.panel(cs::TITLE));
    frame.render_widget(para, area);
}

pub fn draw_note(frame: &mut Frame, field: &Field, t: &Theme) {
    let area = popup(frame.area(), 72, 5);
    let block = t.panel(ns::TITLE);
    let inner = block.inner(area);
    frame.render_widget(Clear, area);
    frame.render_widget(block, area);
    let field_row = Rect {
        height: inner.height.min(1),
        ..inner
    };
    if let Some(pos) = field.render(field_row, frame.buffer_mut(), t.field_editing, true) {
        frame.set_cursor_position(pos);
    }
    let hint = Rect {
        y: inner.y.saturating_add(2),
        height: 1,
        ..inner
    }
    .intersection(inner);
    frame.render_widget(Paragraph::new(ns::HINT).style(t.dim), hint);
}
