//! Drawing the Checks view: the list of guided checks with what each needs, or the step
//! being asked (what to read and where, the field, its caution) beside the list of steps
//! with what became of each. Every message wraps inside its panel.

use super::guided::Walk;
use crate::session::guided::{CHECKS, Outcome, Step, target};
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::layout::clip_end;
use crate::tui::strings::guided as s;
use crate::tui::theme::Theme;
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

/// Width of the steps panel on the right.
const STEPS_W: u16 = 28;
/// Rows under the field: the preview or message, the caution and the key hint.
const BELOW_H: u16 = 9;

pub struct GuidedScreen<'a> {
    pub cursor: usize,
    pub walk: Option<&'a Walk>,
    pub message: Option<&'a str>,
}

fn wrapped<'a>(lines: Vec<Line<'a>>) -> Paragraph<'a> {
    Paragraph::new(lines).wrap(Wrap { trim: true })
}

impl GuidedScreen<'_> {
    pub fn draw(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        match self.walk {
            Some(w) => self.draw_walk(frame, area, w, ctx),
            None => self.draw_list(frame, area, ctx),
        }
    }

    fn draw_list(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let style = ctx.style();
        let block = t.panel(s::LIST_TITLE);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let mut lines = Vec::new();
        for (i, c) in CHECKS.iter().enumerate() {
            let mark = if i == self.cursor { "> " } else { "  " };
            let title_style = if i == self.cursor { t.selected } else { t.base };
            lines.push(Line::from(vec![
                Span::raw(mark),
                Span::styled(format!("{}. {}", i + 1, c.title), title_style),
            ]));
            lines.push(Line::styled(
                style.text(&format!("     {}: {}", s::NEEDS, c.needs)),
                t.dim,
            ));
        }
        lines.push(Line::raw(""));
        if let Some(c) = CHECKS.get(self.cursor) {
            let on = target(&ctx.site, c.id, ctx.picks.equipment.as_deref())
                .map_or(s::NOTHING_TO_CHECK.to_string(), |t| t.words());
            lines.push(Line::from(vec![
                Span::styled(format!("{}: ", s::ON), t.title),
                Span::raw(sanitize(&on, false)),
            ]));
        }
        lines.push(Line::styled(s::START_HINT, t.dim));
        if let Some(m) = self.message {
            lines.push(Line::raw(""));
            lines.push(Line::styled(style.text(m), t.warn));
        }
        // Not trimmed: the marks and the indents at the start of a line are kept.
        frame.render_widget(Paragraph::new(lines).wrap(Wrap { trim: false }), inner);
    }

    fn draw_walk(&self, frame: &mut Frame, area: Rect, w: &Walk, ctx: &Ctx) {
        let [left, right] =
            Layout::horizontal([Constraint::Min(0), Constraint::Length(STEPS_W)]).areas(area);
        self.draw_step(frame, left, w, ctx);
        draw_steps(frame, right, w, &ctx.theme);
    }

    fn draw_step(&self, frame: &mut Frame, area: Rect, w: &Walk, ctx: &Ctx) {
        let t = &ctx.theme;
        let style = ctx.style();
        let n = w.check.steps.len();
        let title = format!(" {} ", w.check.title);
        let block = t.panel(title);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let Some(step) = w.check.steps.get(w.step) else {
            return;
        };
        let [top, field_row, below] = Layout::vertical([
            Constraint::Min(0),
            Constraint::Length(1),
            Constraint::Length(BELOW_H),
        ])
        .areas(inner);
        let at = w.target.equipment(step.at).unwrap_or("");
        let at_words = describe(ctx, at);
        let top_lines = vec![
            Line::from(vec![
                Span::styled(format!("{}: ", s::ON), t.dim),
                Span::raw(sanitize(&w.target.words(), false)),
            ]),
            Line::from(vec![
                Span::styled(
                    format!("{} {} {} {}: ", s::STEP, w.step + 1, s::OF, n),
                    t.title,
                ),
                Span::raw(style.text(step.ask)),
            ]),
            Line::from(vec![
                Span::styled(format!("{}: ", s::READ_AT), t.dim),
                Span::raw(style.text(&at_words)),
            ]),
        ];
        frame.render_widget(wrapped(top_lines), top);
        draw_field(frame, field_row, w, step, t);
        frame.render_widget(wrapped(self.below_lines(w, step, ctx)), below);
    }

    fn below_lines(&self, w: &Walk, step: &Step, ctx: &Ctx) -> Vec<Line<'static>> {
        let t = &ctx.theme;
        let style = ctx.style();
        let mut lines = Vec::new();
        match (&w.preview, self.message) {
            (_, Some(m)) => lines.push(Line::styled(style.text(m), t.warn)),
            (Some(Ok(v)), None) => lines.push(Line::styled(
                style.text(&format!("{} {v}", s::WILL_SAVE)),
                t.ok,
            )),
            (Some(Err(e)), None) => lines.push(Line::styled(style.text(e), t.error)),
            (None, None) => lines.push(Line::raw("")),
        }
        lines.push(Line::from(vec![
            Span::styled(format!("{}: ", s::CAUTION_HEAD), t.caution),
            Span::raw(style.text(step.caution)),
        ]));
        let hint = if w.typing { s::STEP_HINT } else { s::TOP_HINT };
        lines.push(Line::styled(hint, t.dim));
        lines
    }
}

/// "L-2 (Paste line, mixer to packing)".
fn describe(ctx: &Ctx, id: &str) -> String {
    let description = ctx
        .sample_points()
        .into_iter()
        .find(|(i, _, _)| *i == id)
        .map(|(_, _, d)| d.to_string())
        .unwrap_or_default();
    let id = sanitize(id, false);
    match description.is_empty() {
        true => id,
        false => format!("{id} ({})", sanitize(&description, false)),
    }
}

/// "Reading  rest-time  [62 h      ]".
fn draw_field(frame: &mut Frame, area: Rect, w: &Walk, step: &Step, t: &Theme) {
    let label = format!("{} {}: ", s::READING, step.reading);
    let label_w = u16::try_from(label.chars().count()).unwrap_or(u16::MAX);
    frame.render_widget(Paragraph::new(Span::styled(label, t.dim)), area);
    let field_area = Rect {
        x: area.x.saturating_add(label_w),
        width: area.width.saturating_sub(label_w).min(24),
        ..area
    }
    .intersection(area);
    let field_style = if w.typing { t.field_editing } else { t.field };
    let cursor = w
        .field
        .render(field_area, frame.buffer_mut(), field_style, w.typing);
    if let Some(p) = cursor {
        frame.set_cursor_position(p);
    }
}

/// The steps with what became of each: saved (with the value), skipped, asked now, to come.
fn draw_steps(frame: &mut Frame, area: Rect, w: &Walk, t: &Theme) {
    let block = t.panel(s::STEPS_TITLE);
    let inner = block.inner(area);
    frame.render_widget(block, area);
    let width = usize::from(inner.width);
    let mut lines = Vec::new();
    for (i, step) in w.check.steps.iter().enumerate() {
        let (mark, style, after) = match w.outcomes.get(i) {
            Some(Outcome::Read(raw)) => ("ok", t.ok, format!("{} {raw}", s::SAVED)),
            Some(Outcome::Skipped) => ("--", t.warn, s::SKIPPED.to_string()),
            None if i == w.step => (">>", t.title, String::new()),
            None => ("  ", t.dim, String::new()),
        };
        lines.push(Line::styled(
            clip_end(
                &format!("{mark} {}. {}", i + 1, step.reading),
                width,
                t.marks.cut,
            ),
            style,
        ));
        if !after.is_empty() {
            let text = format!("     {}", sanitize(&after, false));
            lines.push(Line::styled(clip_end(&text, width, t.marks.cut), t.dim));
        }
    }
    frame.render_widget(Paragraph::new(lines), inner);
}
