//! Screen regions: the frame split into bars and body, the minimum size, and popups that
//! always fit inside the frame. All arithmetic saturates, so no size makes it panic.

use ratatui::layout::{Constraint, Layout, Rect};

/// Smallest screen the views are laid out for.
pub const MIN_WIDTH: u16 = 80;
pub const MIN_HEIGHT: u16 = 24;

/// The fixed regions of every screen.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Regions {
    /// Site, operator, clock, journal state.
    pub top: Rect,
    /// The list of views.
    pub tabs: Rect,
    pub body: Rect,
    /// One line of caution for what the view shows.
    pub caution: Rect,
    /// Status message (last thing that happened, or what is wrong).
    pub status: Rect,
    /// Keys for the current screen.
    pub footer: Rect,
}

/// Most lines the status message may take (the body gives them up).
pub const MAX_STATUS_LINES: u16 = 3;

impl Regions {
    /// The regions with a one-line status message.
    pub fn split(area: Rect) -> Regions {
        Regions::with_status(area, 1)
    }

    /// The regions with room for a status message of `status_lines` lines (1 to 3), so a
    /// long message wraps instead of being cut.
    pub fn with_status(area: Rect, status_lines: u16) -> Regions {
        let n = status_lines.clamp(1, MAX_STATUS_LINES);
        let [top, tabs, body, caution, status, footer] = Layout::vertical([
            Constraint::Length(1),
            Constraint::Length(1),
            Constraint::Min(0),
            Constraint::Length(1),
            Constraint::Length(n),
            Constraint::Length(1),
        ])
        .areas(area);
        Regions {
            top,
            tabs,
            body,
            caution,
            status,
            footer,
        }
    }
}

/// Whether the frame is big enough for the views.
pub fn fits(area: Rect) -> bool {
    area.width >= MIN_WIDTH && area.height >= MIN_HEIGHT
}

/// A popup of at most `width` × `height`, centred, never larger than the frame.
pub fn popup(frame: Rect, width: u16, height: u16) -> Rect {
    let w = width.min(frame.width);
    let h = height.min(frame.height);
    let x = frame.x.saturating_add((frame.width - w) / 2);
    let y = frame.y.saturating_add((frame.height - h) / 2);
    Rect::new(x, y, w, h).intersection(frame)
}

/// The rows `from..` of an area (for scrolling lists and stacked panels).
pub fn rows_from(area: Rect, from: u16) -> Rect {
    let skip = from.min(area.height);
    Rect::new(
        area.x,
        area.y.saturating_add(skip),
        area.width,
        area.height - skip,
    )
}

/// One row of an area, or an empty rect past its end.
pub fn row(area: Rect, index: u16) -> Rect {
    if index >= area.height {
        return Rect::new(area.x, area.bottom(), area.width, 0);
    }
    Rect::new(area.x, area.y + index, area.width, 1)
}

/// How many lines `text` takes when wrapped at word boundaries into `width` columns (a word
/// longer than the width takes lines of its own, as ratatui's wrap breaks it).
pub fn wrapped_lines(text: &str, width: u16) -> u16 {
    let width = usize::from(width.max(1));
    let mut lines = 0usize;
    let mut used = 0usize;
    for word in text.split_whitespace() {
        let w = word.chars().count();
        let need = if used == 0 { w } else { used + 1 + w };
        if used > 0 && need <= width {
            used = need;
        } else {
            lines += if used > 0 { 1 } else { 0 };
            lines += (w.saturating_sub(1)) / width;
            used = (w.saturating_sub(1)) % width + 1;
        }
    }
    if used > 0 {
        lines += 1;
    }
    u16::try_from(lines.max(1)).unwrap_or(u16::MAX)
}

/// `text` in at most `width` characters, cut after the last whole word that fits and
/// marked with `cut`, so no word is shown broken (for one-line cells whose full text is
/// shown elsewhere).
pub fn clip_words(text: &str, width: usize, cut: char) -> String {
    if text.chars().count() <= width {
        return text.to_string();
    }
    let mut out = String::new();
    for word in text.split_whitespace() {
        let need = out.chars().count() + usize::from(!out.is_empty()) + word.chars().count();
        if need + 1 > width {
            break;
        }
        if !out.is_empty() {
            out.push(' ');
        }
        out.push_str(word);
    }
    if out.is_empty() {
        return clip_end(text, width, cut);
    }
    out.push(cut);
    out
}

/// `text` in at most `width` characters, "…" marking a cut at the end.
pub fn clip_end(text: &str, width: usize, cut: char) -> String {
    if text.chars().count() <= width {
        return text.to_string();
    }
    if width == 0 {
        return String::new();
    }
    let head: String = text.chars().take(width - 1).collect();
    format!("{head}{cut}")
}

/// `text` in at most `width` characters, "…" marking a cut at the start (a file is told
/// apart by its name, not by its folder).
pub fn clip_start(text: &str, width: usize, cut: char) -> String {
    let n = text.chars().count();
    if n <= width {
        return text.to_string();
    }
    if width == 0 {
        return String::new();
    }
    let tail: String = text.chars().skip(n + 1 - width).collect();
    format!("{cut}{tail}")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn clipped_text_keeps_the_telling_end() {
        assert_eq!(clip_end("Marrowdale Unit 4", 40, '…'), "Marrowdale Unit 4");
        assert_eq!(clip_end("Marrowdale Unit 4", 8, '…'), "Marrowd…");
        assert_eq!(
            clip_start("/tmp/logs/site_1.jsonl", 13, '…'),
            "…site_1.jsonl"
        );
        assert_eq!(clip_start("abc", 0, '…'), "");
        assert_eq!(clip_end("abc", 0, '…'), "");
        assert_eq!(clip_end("Marrowdale Unit 4", 8, '~'), "Marrowd~");
    }

    #[test]
    fn popups_never_leave_the_frame() {
        let frame = Rect::new(0, 0, 20, 5);
        let p = popup(frame, 60, 18);
        assert_eq!(p, frame);
        let p = popup(Rect::new(0, 0, 80, 24), 40, 10);
        assert_eq!(p, Rect::new(20, 7, 40, 10));
        assert_eq!(popup(Rect::new(0, 0, 0, 0), 10, 10), Rect::new(0, 0, 0, 0));
    }

    #[test]
    fn regions_fill_80x24_and_survive_tiny_frames() {
        let r = Regions::split(Rect::new(0, 0, 80, 24));
        assert_eq!(r.body, Rect::new(0, 2, 80, 19));
        assert_eq!(r.footer, Rect::new(0, 23, 80, 1));
        let tiny = Regions::split(Rect::new(0, 0, 3, 2));
        let two = Regions::with_status(Rect::new(0, 0, 80, 24), 2);
        assert_eq!((two.status.height, two.body.height), (2, r.body.height - 1));
        assert!(tiny.body.height == 0);
        assert!(!fits(Rect::new(0, 0, 79, 24)) && fits(Rect::new(0, 0, 80, 24)));
    }

    #[test]
    fn rows_saturate() {
        let a = Rect::new(2, 3, 10, 4);
        assert_eq!(rows_from(a, 9), Rect::new(2, 7, 10, 0));
        assert_eq!(row(a, 1), Rect::new(2, 4, 10, 1));
        assert_eq!(row(a, 4).height, 0);
    }

    #[test]
    fn wrapped_lines_counts_word_wrapped_lines() {
        assert_eq!(wrapped_lines("", 10), 1);
        assert_eq!(wrapped_lines("one two", 7), 1);
        assert_eq!(wrapped_lines("one two", 6), 2);
        assert_eq!(wrapped_lines("abcdefghij", 4), 3);
    }

    #[test]
    fn clip_words_never_breaks_a_word() {
        assert_eq!(clip_words("short", 10, '~'), "short");
        assert_eq!(
            clip_words("unknown unit for a number", 14, '~'),
            "unknown unit~"
        );
        assert_eq!(clip_words("abcdefghijkl", 5, '~'), "abcd~");
    }
}
