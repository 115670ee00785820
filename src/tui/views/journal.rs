//! The Journal view: every record of the session as a scrolling list with its local time,
//! its number and whether it is on disk yet. New records scroll into view unless the
//! operator has scrolled up.

use super::{Effect, View, ViewId};
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::Action;
use crate::tui::strings::{caution, views as names};
use crate::tui::layout::clip_start;
use crate::tui::session_log::{Entry, EntryStatus};
use crate::tui::strings::journal as s;
use crate::tui::theme::Theme;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::Paragraph;

/// This view's id.
pub const ID: ViewId = ViewId("journal");

/// Rows a page key moves (the body is at least this tall at 80×24).
const PAGE: usize = 10;

#[derive(Debug, Default)]
pub struct JournalView {
    /// First entry shown; `None` follows the newest.
    top: Option<usize>,
}

impl JournalView {
    pub fn new(_ctx: &Ctx) -> JournalView {
        JournalView::default()
    }

    fn scroll(&mut self, ctx: &Ctx, by: isize) {
        let len = ctx.session.log.len();
        let from = self.top.unwrap_or(len.saturating_sub(PAGE));
        let to = (from as isize + by).clamp(0, len.saturating_sub(1) as isize) as usize;
        self.top = Some(to);
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
    fn id(&self) -> ViewId {
        ID
    }

    fn title(&self) -> &'static str {
        names::JOURNAL
    }

    fn caution(&self) -> &'static str {
        caution::JOURNAL
    }


    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match action {
            Action::Up => self.scroll(ctx, -1),
            Action::Down => self.scroll(ctx, 1),
            Action::PageUp => self.scroll(ctx, -(PAGE as isize)),
            Action::PageDown => self.scroll(ctx, PAGE as isize),
            Action::Home => self.top = Some(0),
            Action::End => self.top = None,
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
        let height = usize::from(inner.height);
        let newest_first_row = entries.len().saturating_sub(height);
        let top = self
            .top
            .map_or(newest_first_row, |t| t.min(newest_first_row));
        let lines: Vec<Line> = entries
            .iter()
            .skip(top)
            .take(height)
            .map(|e| entry_line(e, t, ctx.style()))
            .collect();
        frame.render_widget(Paragraph::new(lines), inner);
    }
}
