//! The one theme: named styles from the 16 ANSI colours, and the glyphs for borders and marks.
//!
//! Without colour (`NO_COLOR`, `TERM=dumb`) every colour becomes `Reset` and emphasis is
//! carried by modifiers alone, so selection stays visible: it is always inverse display or
//! bold, never a colour on its own.

use ratatui::style::{Color, Modifier, Style};
use ratatui::symbols::border;

/// Whether colours may be used.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ColourMode {
    Colour,
    Plain,
}

impl ColourMode {
    /// `NO_COLOR` set to anything non-empty, or `TERM=dumb`, means no colour.
    pub fn from_env(no_color: Option<&str>, term: Option<&str>) -> ColourMode {
        let no_color = no_color.is_some_and(|v| !v.is_empty());
        if no_color || term == Some("dumb") {
            ColourMode::Plain
        } else {
            ColourMode::Colour
        }
    }

    /// Read the process environment once, at start-up.
    pub fn detect() -> ColourMode {
        let no_color = std::env::var("NO_COLOR").ok();
        let term = std::env::var("TERM").ok();
        ColourMode::from_env(no_color.as_deref(), term.as_deref())
    }
}

/// Which glyphs the terminal can be trusted with.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Glyphs {
    Unicode,
    Ascii,
}

impl Glyphs {
    /// ASCII when asked (`--ascii`) or when the terminal is `TERM=dumb`, which cannot be
    /// trusted with box drawing or symbols either.
    pub fn from_env(ascii_asked: bool, term: Option<&str>) -> Glyphs {
        if ascii_asked || term == Some("dumb") {
            Glyphs::Ascii
        } else {
            Glyphs::Unicode
        }
    }

    /// Read the process environment once, at start-up.
    pub fn detect(ascii_asked: bool) -> Glyphs {
        let term = std::env::var("TERM").ok();
        Glyphs::from_env(ascii_asked, term.as_deref())
    }
}

/// Border, chart and list glyphs for one glyph set.
#[derive(Debug, Clone, Copy)]
pub struct Marks {
    pub border: border::Set<'static>,
    pub point: char,
    pub flagged: char,
    pub fit: char,
    pub axis_v: char,
    pub axis_h: char,
    pub axis_corner: char,
    pub tick: char,
    pub plus_minus: &'static str,
    /// Marks where text was cut to fit.
    pub cut: char,
}

const ASCII_BORDER: border::Set<'static> = border::Set {
    top_left: "+",
    top_right: "+",
    bottom_left: "+",
    bottom_right: "+",
    vertical_left: "|",
    vertical_right: "|",
    horizontal_top: "-",
    horizontal_bottom: "-",
};

impl Marks {
    pub fn new(glyphs: Glyphs) -> Marks {
        match glyphs {
            Glyphs::Unicode => Marks {
                border: border::PLAIN,
                point: '●',
                flagged: '×',
                fit: '·',
                axis_v: '│',
                axis_h: '─',
                axis_corner: '└',
                tick: '┼',
                plus_minus: "±",
                cut: '…',
            },
            Glyphs::Ascii => Marks {
                border: ASCII_BORDER,
                point: 'o',
                flagged: 'x',
                fit: '.',
                axis_v: '|',
                axis_h: '-',
                axis_corner: '+',
                tick: '+',
                plus_minus: "+/-",
                cut: '~',
            },
        }
    }
}

/// Every style the screens use, by what it means.
#[derive(Debug, Clone, Copy)]
pub struct Theme {
    pub glyphs: Glyphs,
    pub marks: Marks,
    pub base: Style,
    pub title: Style,
    pub dim: Style,
    pub tab: Style,
    pub tab_active: Style,
    pub selected: Style,
    pub field: Style,
    pub field_editing: Style,
    pub ok: Style,
    pub warn: Style,
    pub error: Style,
    pub caution: Style,
    pub key: Style,
    pub chart_point: Style,
    pub chart_flagged: Style,
    pub chart_fit: Style,
    pub axis: Style,
}

impl Theme {
    /// A bordered panel in this theme's border marks (plain ASCII with `--ascii`).
    pub fn panel<'a>(
        &self,
        title: impl Into<ratatui::text::Line<'a>>,
    ) -> ratatui::widgets::Block<'a> {
        ratatui::widgets::Block::new()
            .borders(ratatui::widgets::Borders::ALL)
            .border_set(self.marks.border)
            .title(title)
            .title_style(self.title)
    }

    pub fn new(mode: ColourMode, glyphs: Glyphs) -> Theme {
        let c = |colour: Color| match mode {
            ColourMode::Colour => Style::new().fg(colour),
            ColourMode::Plain => Style::new().fg(Color::Reset),
        };
        let bold = Modifier::BOLD;
        Theme {
            glyphs,
            marks: Marks::new(glyphs),
            base: Style::new(),
            title: c(Color::Cyan).add_modifier(bold),
            dim: c(Color::DarkGray),
            tab: c(Color::Gray),
            tab_active: Style::new().add_modifier(Modifier::REVERSED | bold),
            selected: Style::new().add_modifier(Modifier::REVERSED),
            field: c(Color::White).add_modifier(Modifier::UNDERLINED),
            // No colour here: every byte counts while typing over a slow link.
            field_editing: Style::new()
                .fg(Color::Reset)
                .add_modifier(bold | Modifier::UNDERLINED),
            ok: c(Color::Green),
            warn: c(Color::Yellow).add_modifier(bold),
            error: c(Color::LightRed).add_modifier(bold),
            caution: c(Color::LightYellow),
            key: c(Color::LightCyan).add_modifier(bold),
            chart_point: c(Color::LightGreen).add_modifier(bold),
            chart_flagged: c(Color::LightRed).add_modifier(bold),
            chart_fit: c(Color::LightBlue),
            axis: c(Color::Gray),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn no_color_and_dumb_terminal_turn_colour_off() {
        assert_eq!(
            ColourMode::from_env(Some("1"), Some("xterm")),
            ColourMode::Plain
        );
        assert_eq!(ColourMode::from_env(None, Some("dumb")), ColourMode::Plain);
        // no-color.org: an empty NO_COLOR does not count.
        assert_eq!(
            ColourMode::from_env(Some(""), Some("xterm")),
            ColourMode::Colour
        );
        assert_eq!(ColourMode::from_env(None, None), ColourMode::Colour);
    }

    #[test]
    fn plain_theme_uses_no_colour_but_keeps_selection_visible() {
        let t = Theme::new(ColourMode::Plain, Glyphs::Unicode);
        for s in [t.title, t.error, t.warn, t.ok, t.chart_point, t.key] {
            assert!(matches!(s.fg, None | Some(Color::Reset)), "{s:?}");
        }
        assert!(t.selected.add_modifier.contains(Modifier::REVERSED));
        assert!(t.tab_active.add_modifier.contains(Modifier::REVERSED));
    }

    #[test]
    fn a_dumb_terminal_gets_ascii_glyphs() {
        assert_eq!(Glyphs::from_env(false, Some("dumb")), Glyphs::Ascii);
        assert_eq!(
            Glyphs::from_env(true, Some("xterm-256color")),
            Glyphs::Ascii
        );
        assert_eq!(
            Glyphs::from_env(false, Some("xterm-256color")),
            Glyphs::Unicode
        );
        assert_eq!(Glyphs::from_env(false, None), Glyphs::Unicode);
    }

    #[test]
    fn ascii_marks_are_ascii() {
        let m = Marks::new(Glyphs::Ascii);
        let all = [
            m.point,
            m.flagged,
            m.fit,
            m.axis_v,
            m.axis_h,
            m.axis_corner,
            m.tick,
        ];
        assert!(all.iter().all(char::is_ascii));
        assert!(m.border.top_left.is_ascii());
    }
}
