//! The Journal view: every record of the session as a scrolling list with its local time,
//! its number and whether it is on disk yet. The list follows new records until the operator
//! moves up; End (or Down past the last) follows again. Enter opens the selected record in
//! full (every field, wrapped, scrollable), Esc or Enter closes it.

use super::{Effect, View, ViewId};
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b};
use crate::tui::strings::keys;
use crate::tui::strings::{caution, views as names};
use crate::tui::layout::clip_start;
use crate::tui::session_log::{Entry, EntryStatus};
use crate::tui::strings::journal as s;
use crate::tui::theme::Theme;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Clear, Paragraph, Wrap};

/// This view's id.
pub const ID: ViewId = ViewId("journal");

/// Rows a page key moves (the body is at least this tall at 80×24).
const PAGE: usize = 10;

const KEYS: &[Binding] = &[
    b(Scope::View, &[Key::Enter], Action::Activate, keys::OPEN_RECORD),
    b(Scope::View, &[Key::Esc], Action::Close, keys::CLOSE_RECORD),
];

#[derive(Debug, Default)]
pub struct JournalView {
    /// The selected entry; `None` follows the newest.
    selected: Option<usize>,
    /// The record opened in full, and how far it is scrolled.
    open: Option<(usize, u16)>,
}

impl JournalView {
    pub fn new(_ctx: &Ctx) -> JournalView {
        JournalView::default()
    }

    fn scroll(&mut self, ctx: &Ctx, by: isize) {
        let len = ctx.log.rows(&ctx.session).len();
        if len == 0 {
            return;
        }
        let last = len - 1;
        let from = self.selected.unwrap_or(last) as isize;
        let to = from + by;
        // Down past the newest follows new records again.
        self.selected = if to >= last as isize {
            None
        } else {
            Some(to.max(0) as usize)
        };
    }

    /// The record opened in full, as lines: its place in the list, then every field.
    fn record_text(&self, ctx: &Ctx, index: usize) -> String {
        let entries = ctx.log.rows(&ctx.session);
        let Some(e) = entries.get(index) else {
            return String::new();
        };
        let record = e
            .seq
            .and_then(|n| ctx.session.log.iter().find(|r| r.seq == n));
        let body = match record.map(serde_json::to_string_pretty) {
            Some(Ok(json)) => json,
            _ => s::NOT_NUMBERED.to_string(),
        };
        format!("{}\n\n{body}", sanitize(&e.summary, false))
    }

    fn draw_open(&self, frame: &mut Frame, area: Rect, ctx: &Ctx, index: usize, scroll: u16) {
        let t = &ctx.theme;
        let text = ctx.style().text(&sanitize(&self.record_text(ctx, index), true));
        let para = Paragraph::new(text)
            .wrap(Wrap { trim: false })
            .scroll((scroll, 0))
            .block(t.panel(s::RECORD_TITLE));
        frame.render_widget(Clear, area);
        frame.render_widget(para, area);
    }
}

fn status_span(status: &EntryStatus, t: &Theme) -> Span<'static> {
    match status {
        EntryStatus::Saved => Span::styled(format!("{:<8}", s::SAVED), t.ok),
        EntryStatus::Sending => Span::styled(format!("{:<8}", s::SENDING), t.warn),
        EntryStatus::Unsaved => Span::styled(format!("{:<8}", s::UNSAVED), t.error),
        EntryStatus::Refused(_) => Span::styled(format!("{:<8}", s::REFUSED), t.error),
    }
}

fn entry_line(e: &Entry, t: &Theme, style: crate::present::Style) -> Line<'static> {
    let seq = e
        .seq
        .map(|n| format!("#{n}"))
        .unwrap_or_else(|| "#?".to_string());
    let mut spans = vec![
        Span::styled(e.time.format("%H:%M:%S  ").to_string(), t.dim),
        Span::styled(format!("{seq:<5}"), t.dim),
        status_span(&e.status, t),
        Span::raw(style.text(&sanitize(&e.summary, false))),
    ];
    if let EntryStatus::Refused(why) = &e.status {
        spans.push(Span::styled(
            format!("  ({})", sanitize(why, false)),
            t.error,
        ));
    }
    Line::from(spans)
}

impl View for JournalView {
    view_identity!(ID, names::JOURNAL, caution::JOURNAL, KEYS);


    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if let Some((index, scroll)) = self.open {
            self.open = match action {
                Action::Close | Action::Activate => None,
                Action::Up => Some((index, scroll.saturating_sub(1))),
                Action::Down => Some((index, scroll.saturating_add(1))),
                Action::PageUp => Some((index, scroll.saturating_sub(PAGE as u16))),
                Action::PageDown => Some((index, scroll.saturating_add(PAGE as u16))),
                _ => Some((index, scroll)),
            };
            return Vec::new();
        }
        match action {
            Action::Up => self.scroll(ctx, -1),
            Action::Down => self.scroll(ctx, 1),
            Action::PageUp => self.scroll(ctx, -(PAGE as isize)),
            Action::PageDown => self.scroll(ctx, PAGE as isize),
            Action::Home => self.selected = Some(0),
            Action::End => self.selected = None,
            Action::Activate => {
                let len = ctx.log.rows(&ctx.session).len();
                if len > 0 {
                    self.open = Some((self.selected.unwrap_or(len - 1), 0));
                    return vec![Effect::Status(s::OPENED.to_string())];
                }
            }
            _ => {}
        }
        Vec::new()
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let room = usize::from(area.width).saturating_sub(s::TITLE.len() + s::FILE.len() + 6);
        let path = clip_start(&sanitize(&ctx.journal_path, false), room, t.marks.cut);
        let title = format!("{}({} {path}) ", s::TITLE, s::FILE);
        let block = t.panel(title);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let entries = ctx.log.rows(&ctx.session);
        if entries.is_empty() {
            frame.render_widget(Paragraph::new(s::EMPTY).style(t.dim), inner);
            return;
        }
        let height = usize::from(inner.height).max(1);
        let selected = self.selected.unwrap_or(entries.len() - 1).min(entries.len() - 1);
        // The selected row in view, as low on the panel as it can be.
        let top = (selected + 1).saturating_sub(height);
        let lines: Vec<Line> = entries
            .iter()
            .enumerate()
            .skip(top)
            .take(height)
            .map(|(i, e)| {
                let line = entry_line(e, t, ctx.style());
                if i == selected { line.style(t.selected) } else { line }
            })
            .collect();
        frame.render_widget(Paragraph::new(lines), inner);
        if let Some((index, scroll)) = self.open {
            self.draw_open(frame, area, ctx, index, scroll);
        }
    }
}
