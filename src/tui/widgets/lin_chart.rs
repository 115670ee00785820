//! A linear-axes chart drawn cell by cell, for answers read off against a limit: gel
//! strength against rest time, pressure against flow. Series of points (a curve, its band,
//! measured points) and level lines (a pump's limit) are prepared by the caller in the units
//! the axes are labelled in; every glyph comes from the caller, so `--ascii` stays ASCII.

use crate::tui::theme::Theme;
use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;
use ratatui::widgets::Widget;

/// One linear axis from `lo` to `hi`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LinRange {
    pub lo: f64,
    pub hi: f64,
}

/// Headroom above the highest value, as a fraction of the span (so the top is not on the
/// frame).
const HEADROOM: f64 = 0.08;

impl LinRange {
    /// From zero (or the least value, if below zero) to a little above the greatest finite
    /// value; `None` with no finite value.
    pub fn from_zero(values: impl Iterator<Item = f64>) -> Option<LinRange> {
        let finite: Vec<f64> = values.filter(|v| v.is_finite()).collect();
        let max = finite.iter().copied().reduce(f64::max)?;
        let min = finite.iter().copied().reduce(f64::min)?.min(0.0);
        let span = (max - min).max(f64::MIN_POSITIVE);
        let hi = if max > 0.0 {
            max + span * HEADROOM
        } else {
            1.0
        };
        Some(LinRange { lo: min, hi })
    }

    /// Position of `v` along the axis, 0..=1; `None` off the axis.
    pub fn fraction(self, v: f64) -> Option<f64> {
        if !v.is_finite() || self.hi <= self.lo {
            return None;
        }
        let f = (v - self.lo) / (self.hi - self.lo);
        (0.0..=1.0).contains(&f).then_some(f)
    }

    /// Labelled values on the finest 1–2–5 step that gives at most `most` steps (at least
    /// one) across the span.
    pub fn ticks(self, most: usize) -> Vec<f64> {
        let span = self.hi - self.lo;
        if !(span > 0.0 && span.is_finite()) {
            return Vec::new();
        }
        let most = most.max(1) as f64;
        let decade = 10f64.powf((span / most).log10().floor());
        let step = [1.0, 2.0, 5.0, 10.0]
            .iter()
            .map(|m| m * decade)
            .find(|s| span / s <= most)
            .unwrap_or(10.0 * decade);
        let first = (self.lo / step).ceil() as i64;
        let last = (self.hi / step).floor() as i64;
        (first..=last).map(|i| i as f64 * step).collect()
    }
}

/// A linear tick as plain text: "0", "0.5", "-2", "1200".
pub fn lin_label(v: f64) -> String {
    let text = format!("{v:.3}");
    let text = text.trim_end_matches('0').trim_end_matches('.');
    match text {
        "" | "-0" => "0".to_string(),
        t => t.to_string(),
    }
}

/// Points drawn with one glyph.
pub struct Series<'a> {
    pub points: &'a [(f64, f64)],
    pub glyph: char,
    pub style: Style,
}

/// A level across the whole plot (a limit), with a short label at its right end.
pub struct Level<'a> {
    pub y: f64,
    pub glyph: char,
    pub style: Style,
    pub label: &'a str,
}

/// The chart: later series are drawn over earlier ones, levels under every series.
pub struct LinChart<'a> {
    pub series: &'a [Series<'a>],
    pub levels: &'a [Level<'a>],
    pub x: LinRange,
    pub y: LinRange,
    pub x_unit: &'a str,
    pub y_unit: &'a str,
    pub theme: &'a Theme,
}

struct Plot(Rect);

impl Plot {
    fn col(&self, fx: f64) -> u16 {
        let w = f64::from(self.0.width.saturating_sub(1));
        self.0.x + (fx * w).round() as u16
    }

    fn row(&self, fy: f64) -> u16 {
        let h = f64::from(self.0.height.saturating_sub(1));
        self.0.bottom().saturating_sub(1) - (fy * h).round() as u16
    }
}

impl LinChart<'_> {
    /// At most one labelled tick every other row, and one every eight columns.
    fn y_ticks(&self, area: Rect) -> Vec<f64> {
        self.y.ticks(usize::from(area.height.saturating_sub(2) / 2))
    }

    fn x_ticks(&self, plot: &Plot) -> Vec<f64> {
        self.x.ticks(usize::from(plot.0.width / 8))
    }

    fn label_width(&self, area: Rect) -> u16 {
        let widest = self
            .y_ticks(area)
            .into_iter()
            .map(|v| lin_label(v).len())
            .max()
            .unwrap_or(1);
        u16::try_from(widest.max(self.y_unit.len())).unwrap_or(8)
    }

    fn draw_axes(&self, area: Rect, plot: &Plot, buf: &mut Buffer) {
        super::axis_frame(buf, area, plot.0, self.theme, self.y_unit);
        let (m, style, axis_col) = (
            &self.theme.marks,
            self.theme.axis,
            plot.0.x.saturating_sub(1),
        );
        let mut last_row = None;
        for v in self.y_ticks(area) {
            let Some(fy) = self.y.fraction(v) else {
                continue;
            };
            let row = plot.row(fy);
            if row == area.y || last_row == Some(row) {
                continue;
            }
            let label = lin_label(v);
            let x = axis_col.saturating_sub(label.len() as u16).max(area.x);
            buf.set_string(x, row, &label, style);
            buf.set_string(axis_col, row, m.tick.to_string(), style);
            last_row = Some(row);
        }
        self.draw_x_labels(area, plot, buf);
    }

    fn draw_x_labels(&self, area: Rect, plot: &Plot, buf: &mut Buffer) {
        let row = plot.0.bottom().saturating_add(1);
        if row >= area.bottom() {
            return;
        }
        let style = self.theme.axis;
        // The unit sits at the right end; labels stop short of it.
        let unit_len = self.x_unit.len() as u16;
        let unit_at = area.right().saturating_sub(unit_len);
        buf.set_string(unit_at, row, self.x_unit, style);
        let mut free_from = area.x;
        for v in self.x_ticks(plot) {
            let Some(fx) = self.x.fraction(v) else {
                continue;
            };
            let col = plot.col(fx);
            let label = lin_label(v);
            let len = label.len() as u16;
            let start = col.saturating_sub(len / 2);
            if start >= free_from && start + len < unit_at {
                buf.set_string(start, row, &label, style);
                buf.set_string(
                    col,
                    plot.0.bottom(),
                    self.theme.marks.tick.to_string(),
                    style,
                );
                free_from = start + len + 1;
            }
        }
    }

    fn draw_levels(&self, plot: &Plot, buf: &mut Buffer) {
        for level in self.levels {
            let Some(fy) = self.y.fraction(level.y) else {
                continue;
            };
            let row = plot.row(fy);
            for col in plot.0.x..plot.0.right() {
                buf.set_string(col, row, level.glyph.to_string(), level.style);
            }
        }
    }

    /// Each level's label at its right end, over the series so it stays readable.
    fn draw_level_labels(&self, plot: &Plot, buf: &mut Buffer) {
        let mut used = Vec::new();
        // The last level is drawn on top; two labels never share a row.
        for level in self.levels.iter().rev() {
            let Some(fy) = self.y.fraction(level.y) else {
                continue;
            };
            let row = plot.row(fy);
            if used.contains(&row) {
                continue;
            }
            used.push(row);
            let len = level.label.chars().count() as u16;
            let at = plot.0.right().saturating_sub(len);
            if at > plot.0.x {
                buf.set_string(at, row, level.label, level.style);
            }
        }
    }

    fn draw_series(&self, plot: &Plot, buf: &mut Buffer) {
        for s in self.series {
            for &(x, y) in s.points {
                if let (Some(fx), Some(fy)) = (self.x.fraction(x), self.y.fraction(y)) {
                    buf.set_string(plot.col(fx), plot.row(fy), s.glyph.to_string(), s.style);
                }
            }
        }
    }
}

impl Widget for LinChart<'_> {
    fn render(self, area: Rect, buf: &mut Buffer) {
        let left = self.label_width(area).saturating_add(1);
        if area.height < 4 || area.width < left.saturating_add(6) {
            return;
        }
        let plot = Plot(Rect::new(
            area.x + left,
            area.y,
            area.width - left,
            area.height.saturating_sub(2),
        ));
        self.draw_axes(area, &plot, buf);
        self.draw_levels(&plot, buf);
        self.draw_series(&plot, buf);
        self.draw_level_labels(&plot, buf);
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::tui::theme::{ColourMode, Glyphs};

    #[test]
    fn ticks_step_by_one_two_five() {
        let r = LinRange { lo: 0.0, hi: 540.0 };
        assert_eq!(r.ticks(3), [0.0, 200.0, 400.0]);
        let r = LinRange { lo: 0.0, hi: 9.5 };
        assert_eq!(r.ticks(5), [0.0, 2.0, 4.0, 6.0, 8.0]);
        assert_eq!(r.ticks(1), [0.0]);
        assert!(LinRange { lo: 1.0, hi: 1.0 }.ticks(4).is_empty());
        assert_eq!(lin_label(-0.5), "-0.5");
        assert_eq!(lin_label(1200.0), "1200");
    }

    #[test]
    fn the_range_starts_at_zero_with_headroom() {
        let r = LinRange::from_zero([10.0, 100.0, f64::NAN].into_iter());
        let r = r.unwrap_or(LinRange { lo: 9.0, hi: 9.0 });
        // 8 % of the 0–100 span above the top.
        assert_eq!(r.lo, 0.0);
        assert!((r.hi - 108.0).abs() < 1e-9, "{r:?}");
        assert_eq!(LinRange::from_zero([f64::NAN].into_iter()), None);
    }

    #[test]
    fn points_and_a_level_land_where_their_values_say() {
        let theme = Theme::new(ColourMode::Plain, Glyphs::Ascii);
        let pts = [(0.0, 0.0), (10.0, 10.0)];
        let series = [Series {
            points: &pts,
            glyph: 'o',
            style: Style::new(),
        }];
        let levels = [Level {
            y: 5.0,
            glyph: '=',
            style: Style::new(),
            label: "lim",
        }];
        let r = LinRange { lo: 0.0, hi: 10.0 };
        let chart = LinChart {
            series: &series,
            levels: &levels,
            x: r,
            y: r,
            x_unit: "s",
            y_unit: "Pa",
            theme: &theme,
        };
        let area = Rect::new(0, 0, 16, 7);
        let mut buf = Buffer::empty(area);
        chart.render(area, &mut buf);
        let lines: Vec<String> = (0..area.height)
            .map(|y| (0..area.width).map(|x| buf[(x, y)].symbol()).collect())
            .collect();
        // Five plot rows for 0..10: 5 sits on the middle row, 0 and 10 at the corners; a
        // label every other row at most, so only 0 and 5 are labelled (10 is the unit's row).
        assert_eq!(
            lines,
            [
                "Pa|            o",
                "  |             ",
                " 5+==========lim",
                "  |             ",
                " 0+o            ",
                "  ++------------",
                "   0           s",
            ]
        );
    }
}
