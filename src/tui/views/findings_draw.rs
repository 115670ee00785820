//! Drawing the Findings view: the ranked list (one line each, severity first in words), or
//! one finding opened in full, wrapped inside its panel and scrolled.

use super::findings::{Shown, severity_word, sure_words};
use crate::tui::ctx::Ctx;
use crate::tui::layout::clip_end;
use crate::tui::strings::findings as s;
use crate::tui::theme::Theme;
use crate::tui::widgets::list::scroll_offset;
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::style::Style;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

/// Width of the severity column ("CAUTION" and a space).
const SEVERITY_W: usize = 8;

pub struct FindingsScreen<'a> {
    pub shown: &'a [Shown],
    pub cursor: usize,
    pub open: Option<usize>,
    pub scroll: u16,
    pub assumed: Option<&'a str>,
}

fn severity_style(t: &Theme, f: &Shown) -> Style {
    match f.severity {
        crate::diagnose::Severity::Alarm => t.error,
        crate::diagnose::Severity::Caution => t.warn,
        crate::diagnose::Severity::Information => t.dim,
    }
}

impl FindingsScreen<'_> {
    pub fn draw(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        match self.open.and_then(|i| self.shown.get(i)) {
            Some(f) => self.draw_open(frame, area, f, ctx),
            None => self.draw_list(frame, area, ctx),
        }
    }

    /// The last guided check's note (what it read and assumed), wrapped, above the list.
    fn assumed_lines(&self, t: &Theme) -> Vec<Line<'static>> {
        self.assumed
            .map(|a| vec![Line::styled(a.to_string(), t.title)])
            .unwrap_or_default()
    }

    fn draw_list(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let title = format!("{}({}) ", s::TITLE, self.shown.len());
        let block = t.panel(title);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let head = self.assumed_lines(t);
        // The note about the last check, whole, but never more than half the panel.
        // A blank row under it keeps it apart from the list.
        let head_h = self.assumed.map_or(0, |a| {
            (wrapped_rows(a, usize::from(inner.width)) + 1).min(usize::from(inner.height / 2))
        });
        let head_h = u16::try_from(head_h).unwrap_or(0);
        let [top, list, hint] = Layout::vertical([
            Constraint::Length(head_h),
            Constraint::Min(0),
            Constraint::Length(2),
        ])
        .areas(inner);
        if !head.is_empty() {
            frame.render_widget(Paragraph::new(head).wrap(Wrap { trim: true }), top);
        }
        if self.shown.is_empty() {
            let p = Paragraph::new(s::EMPTY)
                .style(t.dim)
                .wrap(Wrap { trim: true });
            frame.render_widget(p, list);
            return;
        }
        let height = usize::from(list.height);
        let skip = scroll_offset(self.cursor, height);
        let width = usize::from(list.width);
        let rows: Vec<Line> = self
            .shown
            .iter()
            .enumerate()
            .skip(skip)
            .take(height)
            .map(|(i, f)| {
                // The title first: subjects repeat, titles tell the findings apart.
                let rest = format!("{} ({})", f.title, f.subject);
                let room = width.saturating_sub(SEVERITY_W);
                let mut text_style = t.base;
                if i == self.cursor {
                    text_style = text_style.patch(t.selected);
                }
                Line::from(vec![
                    Span::styled(
                        format!("{:<w$}", severity_word(f.severity), w = SEVERITY_W),
                        severity_style(t, f),
                    ),
                    Span::styled(clip_end(&rest, room, t.marks.cut), text_style),
                ])
            })
            .collect();
        frame.render_widget(Paragraph::new(rows), list);
        let p = Paragraph::new(s::OPEN_HINT)
            .style(t.dim)
            .wrap(Wrap { trim: true });
        frame.render_widget(p, hint);
    }

    fn draw_open(&self, frame: &mut Frame, area: Rect, f: &Shown, ctx: &Ctx) {
        let t = &ctx.theme;
        let block = t.panel(s::DETAIL_TITLE);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let bullet = |text: &str| Line::raw(format!("  - {text}"));
        let heading = |text: &str| Line::styled(text.to_string(), t.title);
        let mut lines = vec![
            Line::from(vec![
                Span::styled(
                    format!("{} ", severity_word(f.severity)),
                    severity_style(t, f),
                ),
                Span::raw(format!("{}: {}.", f.subject, f.title)),
            ]),
            Line::raw(""),
            Line::from(vec![
                Span::styled(format!("{}: ", s::HOW_SURE), t.title),
                Span::raw(ctx.style().text(sure_words(f.sure))),
            ]),
            heading(s::NUMBERS),
        ];
        if f.words.numbers.is_empty() {
            lines.push(bullet(s::NO_NUMBERS));
        }
        lines.extend(f.words.numbers.iter().map(|n| bullet(n)));
        lines.push(heading(s::NEXT_CHECKS));
        lines.extend(f.words.next_checks.iter().map(|c| bullet(c)));
        lines.push(Line::from(vec![
            Span::styled(format!("{}: ", s::CAUTION_HEAD), t.caution),
            Span::raw(f.words.caution.clone()),
        ]));
        let p = Paragraph::new(lines)
            .wrap(Wrap { trim: false })
            .scroll((self.scroll, 0));
        frame.render_widget(p, inner);
    }
}

/// Rows `text` takes when wrapped at word boundaries into `width` columns (a word longer
/// than the width is cut across rows, as the paragraph does).
pub fn wrapped_rows(text: &str, width: usize) -> usize {
    let width = width.max(1);
    let mut rows = 1;
    let mut used = 0;
    for word in text.split_whitespace() {
        let w = word.chars().count();
        let need = if used == 0 { w } else { used + 1 + w };
        if need <= width {
            used = need;
        } else {
            // A new row, unless this is the first word; a long word runs on over more rows.
            rows += usize::from(used > 0) + w.saturating_sub(1) / width;
            used = (w - 1) % width + 1;
        }
    }
    rows
}

#[cfg(test)]
mod tests {
    use super::wrapped_rows;

    #[test]
    fn rows_of_wrapped_text_count_whole_words() {
        // Worked by hand: "aaa bbb" fits 7 columns; at 6 "bbb" goes to a second row.
        assert_eq!(wrapped_rows("aaa bbb", 7), 1);
        assert_eq!(wrapped_rows("aaa bbb", 6), 2);
        assert_eq!(wrapped_rows("aaaaaaaaaa", 4), 3);
        assert_eq!(wrapped_rows("", 10), 1);
    }
}
