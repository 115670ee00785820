//! How many rows a panel's text takes once wrapped, so a scrolled panel stops with its last
//! line at the bottom and a message panel grows to hold its whole message.

use ratatui::widgets::{Paragraph, Wrap};

/// Rows one line of text takes when word-wrapped to `width`, as the panels wrap it
/// (ratatui's own count; behind its `unstable-rendered-line-info` feature).
pub fn wrapped_rows(text: &str, width: usize) -> usize {
    if width == 0 {
        return 0;
    }
    let width = u16::try_from(width).unwrap_or(u16::MAX);
    Paragraph::new(text)
        .wrap(Wrap { trim: false })
        .line_count(width)
}

#[cfg(test)]
mod tests {
    use super::wrapped_rows;

    #[test]
    fn wrapping_counts_rows_as_words_fall() {
        assert_eq!(wrapped_rows("aaaa bbbb", 9), 1);
        assert_eq!(wrapped_rows("aaaa bbbb", 8), 2);
        assert_eq!(wrapped_rows("aaaa bbbb cccc", 9), 2);
    }
}
