//! A log–log scatter chart drawn cell by cell: measured points, flagged points and a
//! fitted curve, with tick labels written by hand (ratatui's `Chart` has linear axes only,
//! and its markers are not plain ASCII).

use super::log_axis::{LogRange, tick_label};
use crate::tui::theme::Theme;
use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::widgets::Widget;

/// One measured point (SI values) and whether it carries a flag.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Mark {
    pub x: f64,
    pub y: f64,
    pub flagged: bool,
}

/// The chart: everything it draws is prepared by the caller.
pub struct LogChart<'a> {
    pub marks: &'a [Mark],
    /// The fitted curve sampled densely in log space (x, y), SI.
    pub curve: &'a [(f64, f64)],
    pub x: LogRange,
    pub y: LogRange,
    pub y_unit: &'a str,
    pub theme: &'a Theme,
}

/// The plotting area inside the axes and labels.
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

impl LogChart<'_> {
    fn label_width(&self) -> u16 {
        let widest = self
            .y
            .ticks()
            .into_iter()
            .map(|v| tick_label(v).len())
            .max()
            .unwrap_or(1);
        u16::try_from(widest.max(self.y_unit.len())).unwrap_or(8)
    }

    fn draw_axes(&self, area: Rect, plot: &Plot, buf: &mut Buffer) {
        super::axis_frame(buf, area, plot.0, self.theme, self.y_unit);
        self.draw_y_labels(area, plot, buf);
        self.draw_x_labels(area, plot, buf);
    }

    fn draw_y_labels(&self, area: Rect, plot: &Plot, buf: &mut Buffer) {
        let mut last_row = None;
        for v in self.y.ticks() {
            let Some(fy) = self.y.fraction(v) else {
                continue;
            };
            let row = plot.row(fy);
            // The top row holds the unit; two labels never share a row.
            if row == area.y || last_row == Some(row) {
                continue;
            }
            let label = tick_label(v);
            let x = plot.0.x.saturating_sub(1 + label.len() as u16).max(area.x);
            buf.set_string(x, row, &label, self.theme.axis);
            buf.set_string(
                plot.0.x.saturating_sub(1),
                row,
                self.theme.marks.tick.to_string(),
                self.theme.axis,
            );
            last_row = Some(row);
        }
    }

    fn draw_x_labels(&self, area: Rect, plot: &Plot, buf: &mut Buffer) {
        let row = plot.0.bottom().saturating_add(1);
        if row >= area.bottom() {
            return;
        }
        let mut free_from = area.x;
        for v in self.x.ticks() {
            let Some(fx) = self.x.fraction(v) else {
                continue;
            };
            let col = plot.col(fx);
            let label = tick_label(v);
            let len = label.len() as u16;
            let start = col
                .saturating_sub(len / 2)
                .min(area.right().saturating_sub(len));
            if start >= free_from {
                buf.set_string(start, row, &label, self.theme.axis);
                buf.set_string(
                    col,
                    plot.0.bottom(),
                    self.theme.marks.tick.to_string(),
                    self.theme.axis,
                );
                free_from = start + len + 1;
            }
        }
    }

    fn draw_data(&self, plot: &Plot, buf: &mut Buffer) {
        let m = &self.theme.marks;
        for &(x, y) in self.curve {
            if let (Some(fx), Some(fy)) = (self.x.fraction(x), self.y.fraction(y)) {
                buf.set_string(
                    plot.col(fx),
                    plot.row(fy),
                    m.fit.to_string(),
                    self.theme.chart_fit,
                );
            }
        }
        for mark in self.marks {
            if let (Some(fx), Some(fy)) = (self.x.fraction(mark.x), self.y.fraction(mark.y)) {
                let (glyph, style) = match mark.flagged {
                    true => (m.flagged, self.theme.chart_flagged),
                    false => (m.point, self.theme.chart_point),
                };
                buf.set_string(plot.col(fx), plot.row(fy), glyph.to_string(), style);
            }
        }
    }
}

impl Widget for LogChart<'_> {
    fn render(self, area: Rect, buf: &mut Buffer) {
        let left = self.label_width().saturating_add(1);
        // With fewer than two plot rows or a few columns nothing readable can be drawn.
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
        self.draw_data(&plot, buf);
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::tui::theme::{ColourMode, Glyphs};

    #[test]
    fn points_land_on_their_ticks() {
        let theme = Theme::new(ColourMode::Plain, Glyphs::Ascii);
        let marks = [
            Mark {
                x: 1.0,
                y: 1.0,
                flagged: false,
            },
            Mark {
                x: 100.0,
                y: 100.0,
                flagged: true,
            },
        ];
        let whole = LogRange { lo: 0.0, hi: 2.0 };
        let chart = LogChart {
            marks: &marks,
            curve: &[(10.0, 10.0)],
            x: whole,
            y: whole,
            y_unit: "Pa",
            theme: &theme,
        };
        let area = Rect::new(0, 0, 20, 7);
        let mut buf = Buffer::empty(area);
        chart.render(area, &mut buf);
        let lines: Vec<String> = (0..area.height)
            .map(|y| (0..area.width).map(|x| buf[(x, y)].symbol()).collect())
            .collect();
        // 1, 10 and 100 at the start, middle and end of both axes; the curve's one sample
        // at (10, 10) in the middle.
        assert_eq!(
            lines,
            [
                "Pa |               x",
                "   |                ",
                " 10+        .       ",
                "   |                ",
                "  1+o               ",
                "   ++-------+------+",
                "    1      10    100",
            ]
        );
    }

    #[test]
    fn a_chart_too_small_to_read_draws_nothing() {
        let theme = Theme::new(ColourMode::Plain, Glyphs::Unicode);
        let r = LogRange { lo: 0.0, hi: 1.0 };
        let chart = LogChart {
            marks: &[],
            curve: &[],
            x: r,
            y: r,
            y_unit: "Pa",
            theme: &theme,
        };
        let area = Rect::new(0, 0, 8, 3);
        let mut buf = Buffer::empty(area);
        chart.render(area, &mut buf);
        assert_eq!(buf, Buffer::empty(area));
    }
}
