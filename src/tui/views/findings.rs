//! The Findings view: the live session's findings, ranked worst first, one line each with
//! its severity in words; Enter opens one in full (its numbers with their ranges, how sure,
//! what to check next and the caution) in a scrolling panel. Worked out again whenever
//! records land (`View::refresh`), never while drawing.

use super::findings_draw;
use super::{Effect, View, ViewId};
use crate::diagnose::{Severity, Sure};
use crate::present::findings::{FindingWords, words};
use crate::session::findings::findings;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b};
use crate::tui::strings::findings as s;
use ratatui::Frame;
use ratatui::layout::Rect;

/// This view's id.
pub const ID: ViewId = ViewId("findings");

/// The Findings view's keys on its list.
const LIST_KEYS: &[Binding] = &[b(Scope::View, &[Key::Enter], Action::Activate, s::OPEN)];

/// Its keys with one finding open.
const OPEN_KEYS: &[Binding] = &[b(
    Scope::View,
    &[Key::Esc, Key::Enter],
    Action::Close,
    s::BACK,
)];

/// Rows a page key scrolls the open finding by.
const PAGE: u16 = 8;

/// One finding as shown: its severity and sureness for the list, and its words.
#[derive(Debug, Clone, PartialEq)]
pub struct Shown {
    pub severity: Severity,
    pub sure: Sure,
    pub subject: String,
    pub title: String,
    pub words: FindingWords,
}

#[derive(Debug, Default)]
pub struct FindingsView {
    shown: Vec<Shown>,
    cursor: usize,
    /// The finding opened in full, and how far its panel is scrolled.
    open: Option<usize>,
    scroll: u16,
    /// What the newest guided check said it assumed (its journalled note), if any.
    assumed: Option<String>,
}

/// The word for a severity on the list: words, not only colour.
pub fn severity_word(s: Severity) -> &'static str {
    match s {
        Severity::Alarm => "ALARM",
        Severity::Caution => "CAUTION",
        Severity::Information => s::INFO,
    }
}

/// How sure, explained.
pub fn sure_words(s: Sure) -> &'static str {
    match s {
        Sure::Certain => s::CERTAIN,
        Sure::Likely => s::LIKELY,
        Sure::Possible => s::POSSIBLE,
    }
}

impl FindingsView {
    pub fn new(ctx: &Ctx) -> FindingsView {
        let mut v = FindingsView::default();
        v.refresh(ctx);
        v
    }

    /// The findings on screen, for tests.
    pub fn shown(&self) -> &[Shown] {
        &self.shown
    }

    fn move_cursor(&mut self, by: isize) {
        let last = self.shown.len().saturating_sub(1) as isize;
        self.cursor = (self.cursor as isize + by).clamp(0, last.max(0)) as usize;
    }

    fn scroll_by(&mut self, by: i32) {
        let to = i32::from(self.scroll) + by;
        self.scroll = u16::try_from(to.max(0)).unwrap_or(u16::MAX);
    }
}

impl View for FindingsView {
    fn id(&self) -> ViewId {
        ID
    }

    fn title(&self) -> &'static str {
        s::NAME
    }

    fn caution(&self) -> &'static str {
        s::CAUTION
    }

    fn keys(&self) -> &'static [Binding] {
        match self.open {
            Some(_) => OPEN_KEYS,
            None => LIST_KEYS,
        }
    }

    fn handle(&mut self, action: Action, _ctx: &Ctx) -> Vec<Effect> {
        match (self.open.is_some(), action) {
            (false, Action::Up) => self.move_cursor(-1),
            (false, Action::Down) => self.move_cursor(1),
            (false, Action::PageUp) => self.move_cursor(-(PAGE as isize)),
            (false, Action::PageDown) => self.move_cursor(PAGE as isize),
            (false, Action::Home) => self.cursor = 0,
            (false, Action::End) => self.move_cursor(isize::MAX / 2),
            (false, Action::Activate) if !self.shown.is_empty() => {
                self.open = Some(self.cursor);
                self.scroll = 0;
            }
            (true, Action::Up) => self.scroll_by(-1),
            (true, Action::Down) => self.scroll_by(1),
            (true, Action::PageUp) => self.scroll_by(-i32::from(PAGE)),
            (true, Action::PageDown) => self.scroll_by(i32::from(PAGE)),
            (true, Action::Home) => self.scroll = 0,
            (true, Action::Activate | Action::Close) => self.open = None,
            _ => {}
        }
        Vec::new()
    }

    fn refresh(&mut self, ctx: &Ctx) {
        let style = ctx.style();
        self.shown = findings(&ctx.session, &ctx.site)
            .iter()
            .map(|f| Shown {
                severity: f.severity,
                sure: f.sure,
                subject: style.text(&crate::text::sanitize(&f.subject, false)),
                title: style.text(&f.title),
                words: words(f, style),
            })
            .collect();
        self.assumed = crate::session::guided::latest_summary(&ctx.session)
            .map(|t| style.text(&crate::text::sanitize(&t, false)));
        self.cursor = self.cursor.min(self.shown.len().saturating_sub(1));
        if self.open.is_some_and(|i| i >= self.shown.len()) {
            self.open = None;
        }
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let screen = findings_draw::FindingsScreen {
            shown: &self.shown,
            cursor: self.cursor,
            open: self.open,
            scroll: self.scroll,
            assumed: self.assumed.as_deref(),
        };
        screen.draw(frame, area, ctx);
    }
}
