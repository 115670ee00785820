//! Pieces the views are drawn with: the unit-aware text field and its editing keys, the
//! log–log chart, the linear chart, and the pick list.

pub mod editing;
pub mod field;
pub mod lin_chart;
pub mod list;
pub mod log_axis;
pub mod log_chart;

use crate::tui::theme::Theme;
use ratatui::buffer::Buffer;
use ratatui::layout::Rect;

/// A chart's axis lines left of and under `plot`, their corner, and the y unit at the top
/// left of `area`: the frame both charts share.
fn axis_frame(buf: &mut Buffer, area: Rect, plot: Rect, theme: &Theme, y_unit: &str) {
    let m = &theme.marks;
    let style = theme.axis;
    let axis_col = plot.x.saturating_sub(1);
    let axis_row = plot.bottom();
    for row in plot.y..plot.bottom() {
        buf.set_string(axis_col, row, m.axis_v.to_string(), style);
    }
    for col in plot.x..plot.right() {
        buf.set_string(col, axis_row, m.axis_h.to_string(), style);
    }
    buf.set_string(axis_col, axis_row, m.axis_corner.to_string(), style);
    buf.set_string(area.x, area.y, y_unit, style);
}
