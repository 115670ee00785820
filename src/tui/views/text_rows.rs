//! How many rows a panel's text takes once wrapped, so a scrolled panel stops with its last
//! line at the bottom (ratatui's own count is behind an unstable feature).

/// Rows a line takes when word-wrapped to `width` (greedy; a word longer than the width is
/// broken): never fewer than the wrapping widget uses, so the end stays in reach.
pub fn wrapped_rows(text: &str, width: usize) -> usize {
    if width == 0 {
        return 0;
    }
    let mut rows = 1;
    let mut used = 0;
    for word in text.split(' ') {
        let len = word.chars().count();
        let need = if used == 0 { len } else { used + 1 + len };
        if need <= width {
            used = need;
        } else {
            rows += 1 + len.saturating_sub(1) / width;
            used = len % width;
        }
    }
    rows
}

#[cfg(test)]
mod tests {
    use super::wrapped_rows;

    #[test]
    fn wrapping_counts_rows_as_words_fall() {
        assert_eq!(wrapped_rows("", 10), 1);
        assert_eq!(wrapped_rows("aaaa bbbb", 9), 1);
        assert_eq!(wrapped_rows("aaaa bbbb", 8), 2);
        assert_eq!(wrapped_rows("aaaa bbbb cccc", 9), 2);
    }
}
