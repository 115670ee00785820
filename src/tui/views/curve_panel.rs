//! Drawing the Flow curve view: chart on the left with its warnings, the model panel
//! (constants ± 95 % CI, R², RMSE, the reason, apparent viscosity) on the right, and a
//! table of the points when the screen is tall enough.

use super::SavedSet;
use super::curve::Shown;
use crate::rheology::{Estimate, Fit};
use crate::session::ModelPick;
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::session_log::EntryStatus;
use crate::tui::strings::{curve as s, journal as js};
use crate::tui::theme::Theme;
use crate::tui::widgets::field::Field;
use crate::tui::widgets::log_chart::LogChart;
use crate::units::significant;
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

/// Width of the model panel; the chart takes the rest.
const PANEL_W: u16 = 38;
/// Body height from which the points table is shown under the chart.
const TALL_ENOUGH_FOR_TABLE: u16 = 30;

pub struct CurveScreen<'a> {
    pub set: Option<&'a SavedSet>,
    pub ticket: Option<u64>,
    pub pick: ModelPick,
    pub result: Option<&'a Result<Shown, String>>,
    pub rate: &'a Field,
    pub apparent: Option<f64>,
    pub editing: bool,
}

impl CurveScreen<'_> {
    pub fn draw(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let [left, right] =
            Layout::horizontal([Constraint::Min(0), Constraint::Length(PANEL_W)]).areas(area);
        self.draw_panel(frame, right, ctx);
        let t = &ctx.theme;
        let shown = match self.result {
            Some(Ok(shown)) => shown,
            Some(Err(e)) => {
                return draw_message(
                    frame,
                    left,
                    &format!("{}: {}", s::FIT_FAILED, sanitize(e, false)),
                    t,
                );
            }
            None => return draw_message(frame, left, s::NO_SET, t),
        };
        let warn_h = warnings_height(&shown.curve.warnings, left);
        let table_h = if area.height >= TALL_ENOUGH_FOR_TABLE {
            shown.marks.len() as u16 + 3
        } else {
            0
        };
        let [chart, table, warnings] = Layout::vertical([
            Constraint::Min(0),
            Constraint::Length(table_h),
            Constraint::Length(warn_h),
        ])
        .areas(left);
        draw_chart(frame, chart, shown, t);
        if table_h > 0 {
            draw_points(frame, table, shown, t);
        }
        if warn_h > 0 {
            let text: Vec<Line> = shown
                .curve
                .warnings
                .iter()
                .map(|w| Line::raw(format!("! {}", sanitize(w, false))))
                .collect();
            let para = Paragraph::new(text)
                .style(t.warn)
                .wrap(Wrap { trim: true })
                .block(t.panel(s::WARNINGS));
            frame.render_widget(para, warnings);
        }
    }

    fn draw_panel(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let outer = t.panel(s::MODEL_TITLE);
        let inner = outer.inner(area);
        frame.render_widget(outer, area);
        let [text_area, rate_area] =
            Layout::vertical([Constraint::Min(0), Constraint::Length(2)]).areas(inner);
        let mut lines = vec![self.set_line(ctx)];
        if let Some(Ok(shown)) = self.result {
            lines.extend(self.fit_lines(&shown.curve.fit, &shown.curve.reason, t));
        }
        frame.render_widget(Paragraph::new(lines).wrap(Wrap { trim: false }), text_area);
        self.draw_rate(frame, rate_area, t);
    }

    fn set_line(&self, ctx: &Ctx) -> Line<'static> {
        let t = &ctx.theme;
        let Some(set) = self.set else {
            return Line::styled(s::NO_SET, t.dim);
        };
        let status = match self.ticket.and_then(|k| ctx.log.status_of(k)) {
            None | Some(EntryStatus::Saved) => Span::styled(js::SAVED, t.ok),
            Some(EntryStatus::Sending) => Span::styled(js::SENDING, t.warn),
            Some(EntryStatus::Unsaved) => Span::styled(js::UNSAVED, t.error),
            Some(EntryStatus::Refused(_)) => Span::styled(js::REFUSED, t.error),
        };
        let temp = set
            .temperature_text
            .as_deref()
            .map(|x| format!(", {}", sanitize(x, false)))
            .unwrap_or_default();
        Line::from(vec![
            Span::styled(format!("{}  ", s::SET), t.dim),
            Span::raw(format!("{}{temp}  ", sanitize(&set.product, false))),
            status,
        ])
    }

    fn fit_lines(&self, fit: &Fit, reason: &str, t: &Theme) -> Vec<Line<'static>> {
        let how = match self.pick {
            ModelPick::Auto => s::AUTO,
            ModelPick::Fixed(_) => s::BY_HAND,
        };
        let mut lines = vec![Line::from(vec![
            Span::styled(fit.model.kind().title().to_string(), t.title),
            Span::styled(format!(" ({how})"), t.dim),
        ])];
        for e in &fit.estimates {
            lines.push(Line::styled(
                format!("{} {}", e.name.symbol(), e.name.label()),
                t.dim,
            ));
            lines.push(Line::raw(format!(
                "   {}",
                estimate_text(e, t.marks.plus_minus)
            )));
        }
        lines.push(Line::raw(format!(
            "{} {:.4}   {} {} {}",
            s::R2,
            fit.r_squared,
            s::RMSE,
            significant(fit.rmse_pa),
            s::STRESS_UNIT
        )));
        lines.push(Line::from(vec![
            Span::styled(format!("{}: ", s::WHY), t.dim),
            Span::raw(sanitize(reason, false)),
        ]));
        lines
    }

    fn draw_rate(&self, frame: &mut Frame, area: Rect, t: &Theme) {
        if area.height < 2 {
            return;
        }
        let [label, value] =
            Layout::vertical([Constraint::Length(1), Constraint::Length(1)]).areas(area);
        frame.render_widget(Paragraph::new(s::APPARENT).style(t.dim), label);
        let field_area = Rect {
            width: value.width.min(10),
            ..value
        };
        let style = if self.editing {
            t.field_editing
        } else {
            t.field
        };
        if let Some(pos) = self
            .rate
            .render(field_area, frame.buffer_mut(), style, self.editing)
        {
            frame.set_cursor_position(pos);
        }
        let rest = Rect {
            x: field_area.right().saturating_add(1),
            width: value.width.saturating_sub(11),
            ..value
        };
        let text = match (self.rate.error(), self.apparent, self.rate.value()) {
            (Some(_), _, _) => Span::styled(format!("! {}?", s::RATE_INVALID), t.error),
            (None, Some(mu), Some(rate)) => Span::styled(
                format!(
                    "= {} {} {} {} {}",
                    significant(mu),
                    s::VISCOSITY_UNIT,
                    s::AT,
                    significant(rate),
                    s::RATE_UNIT
                ),
                t.ok,
            ),
            _ => Span::raw(""),
        };
        frame.render_widget(Paragraph::new(Line::from(text)), rest);
    }
}

/// "5.02 ± 0.194 Pa", or the value with why it has no interval.
pub fn estimate_text(e: &Estimate, pm: &str) -> String {
    let unit = e.name.unit();
    let unit = if unit.is_empty() {
        String::new()
    } else {
        format!(" {unit}")
    };
    match (e.ci95, e.no_ci) {
        (Some((lo, hi)), _) => format!(
            "{} {pm} {}{unit}",
            significant(e.value),
            significant((hi - lo) / 2.0)
        ),
        (None, Some(why)) => format!("{}{unit} ({}: {why})", significant(e.value), s::NO_CI),
        (None, None) => format!("{}{unit}", significant(e.value)),
    }
}

fn draw_message(frame: &mut Frame, area: Rect, text: &str, t: &Theme) {
    let para = Paragraph::new(text.to_string())
        .style(t.dim)
        .wrap(Wrap { trim: true })
        .block(t.panel(s::CHART_TITLE));
    frame.render_widget(para, area);
}

fn warnings_height(warnings: &[String], area: Rect) -> u16 {
    if warnings.is_empty() {
        return 0;
    }
    let width = usize::from(area.width.saturating_sub(2)).max(1);
    let lines: usize = warnings
        .iter()
        .map(|w| (w.chars().count() + 2).div_ceil(width))
        .sum();
    (lines as u16 + 2).min(area.height / 2)
}

fn draw_chart(frame: &mut Frame, area: Rect, shown: &Shown, t: &Theme) {
    let m = &t.marks;
    let legend = format!(
        " {} {}  {} {}  {} {} ",
        m.point,
        s::LEGEND_MEASURED,
        m.flagged,
        s::LEGEND_FLAGGED,
        m.fit,
        s::LEGEND_FIT
    );
    let b = t
        .panel(s::CHART_TITLE)
        .title_bottom(Line::styled(legend, t.dim));
    let inner = b.inner(area);
    frame.render_widget(b, area);
    let chart = LogChart {
        marks: &shown.marks,
        curve: &shown.samples,
        x: shown.x,
        y: shown.y,
        y_unit: s::STRESS_UNIT,
        theme: t,
    };
    frame.render_widget(chart, inner);
}

fn draw_points(frame: &mut Frame, area: Rect, shown: &Shown, t: &Theme) {
    let header = format!(
        "{:>6} {:>6} {:>9} {:>9}  {}",
        s::COL_RPM,
        s::COL_DIAL,
        s::COL_RATE,
        s::COL_STRESS,
        s::COL_FLAGS
    );
    let mut lines = vec![Line::styled(header, t.dim)];
    for p in &shown.curve.points {
        let opt = |v: Option<f64>| v.map(significant).unwrap_or_default();
        lines.push(Line::raw(format!(
            "{:>6} {:>6} {:>9} {:>9}  {}",
            opt(p.rpm),
            opt(p.dial),
            significant(p.shear_rate_per_s),
            significant(p.shear_stress_pa),
            p.flags.join(", ")
        )));
    }
    frame.render_widget(Paragraph::new(lines).block(t.panel(s::POINTS_TITLE)), area);
}
