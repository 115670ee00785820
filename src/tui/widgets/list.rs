//! A bordered pick list: the cursor in inverse display, picked rows marked `*` and bold, and
//! scrolled so the cursor stays in view. Row text is cleaned before it is drawn.

use crate::text::sanitize;
use crate::tui::theme::Theme;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::style::Modifier;
use ratatui::text::Line;
use ratatui::widgets::Paragraph;

/// One row of a pick list.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct ListRow {
    pub text: String,
    pub picked: bool,
}

/// First row to show so that `cursor` is visible in `height` rows.
pub fn scroll_offset(cursor: usize, height: usize) -> usize {
    (cursor + 1).saturating_sub(height.max(1))
}

/// Draw the list; `cursor` is `None` when the list does not have the focus.
pub fn draw_list(
    frame: &mut Frame,
    area: Rect,
    title: &str,
    rows: &[ListRow],
    cursor: Option<usize>,
    empty: &str,
    theme: &Theme,
) {
    let block = theme.panel(title).title_style(if cursor.is_some() {
        theme.title
    } else {
        theme.dim
    });
    let inner = block.inner(area);
    frame.render_widget(block, area);
    if rows.is_empty() {
        frame.render_widget(Paragraph::new(empty).style(theme.dim), inner);
        return;
    }
    let height = usize::from(inner.height);
    let skip = scroll_offset(cursor.unwrap_or(0), height);
    let lines: Vec<Line> = rows
        .iter()
        .enumerate()
        .skip(skip)
        .take(height)
        .map(|(i, row)| {
            let mark = if row.picked { "* " } else { "  " };
            let mut style = theme.base;
            if row.picked {
                style = style.add_modifier(Modifier::BOLD);
            }
            if cursor == Some(i) {
                style = style.patch(theme.selected);
            }
            Line::styled(format!("{mark}{}", sanitize(&row.text, false)), style)
        })
        .collect();
    frame.render_widget(Paragraph::new(lines), inner);
}

#[cfg(test)]
mod tests {
    use super::scroll_offset;

    #[test]
    fn the_cursor_stays_in_view() {
        assert_eq!(scroll_offset(0, 5), 0);
        assert_eq!(scroll_offset(4, 5), 0);
        assert_eq!(scroll_offset(5, 5), 1);
        assert_eq!(scroll_offset(3, 0), 3);
    }
}
