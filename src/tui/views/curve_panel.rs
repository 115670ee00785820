//! Drawing the Flow curve view: chart on the left with its warnings, the model panel
//! (constants ± 95 % CI, R², RMSE, the reason, apparent viscosity) on the right, and a
//! table of the points when the screen is tall enough.

use super::curve::{Limits, Shown};
use crate::present::limits;
use crate::present::{self, Style};
use crate::rheology::Fit;
use crate::session::state::{Entry, ViscometerSet};
use crate::session::trend::LimitStatus;
use crate::session::{FlowCurve, ModelPick};
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::session_log::EntryStatus;
use crate::tui::strings::{curve as s, journal as js};
use crate::tui::theme::Theme;
use crate::tui::widgets::field::Field;
use crate::tui::widgets::log_chart::LogChart;
use crate::units::Dimension;
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

/// Width of the model panel; the chart takes the rest.
const PANEL_W: u16 = 38;
/// Body height from which the points table is shown under the chart.
const TALL_ENOUGH_FOR_TABLE: u16 = 30;

pub struct CurveScreen<'a> {
    /// The newest set of the session, with its curve.
    pub entry: Option<&'a Entry<ViscometerSet>>,
    /// Its chart, laid out when the state changed.
    pub chart: Option<&'a Shown>,
    pub rate: &'a Field,
    /// The shear rate the apparent viscosity is shown at.
    pub apparent_at: Option<f64>,
    pub editing: bool,
    /// Show the field relations in the model panel.
    pub relations: bool,
}

impl CurveScreen<'_> {
    pub fn draw(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let [left, right] =
            Layout::horizontal([Constraint::Min(0), Constraint::Length(PANEL_W)]).areas(area);
        self.draw_panel(frame, right, ctx);
        let t = &ctx.theme;
        let curve = match self.entry.map(|e| e.item.shown()) {
            Some(Ok(curve)) => curve,
            Some(Err(e)) => {
                let text = format!("{}: {}", s::FIT_FAILED, sanitize(&e.to_string(), false));
                return draw_message(frame, left, &ctx.style().text(&text), t);
            }
            None => return draw_message(frame, left, s::NO_SET, t),
        };
        let Some(shown) = self.chart else {
            return draw_message(frame, left, s::NO_SET, t);
        };
        let warn_h = warnings_height(&curve.warnings, left);
        let table_h = if area.height >= TALL_ENOUGH_FOR_TABLE {
            shown.marks.len() as u16 + 3
        } else {
            0
        };
        let limit_lines = shown
            .limits
            .as_ref()
            .map(|l| limit_lines(l, ctx))
            .unwrap_or_default();
        let limits_h = lines_height(&limit_lines, left);
        let [chart, limits, table, warnings] = Layout::vertical([
            Constraint::Min(0),
            Constraint::Length(limits_h),
            Constraint::Length(table_h),
            Constraint::Length(warn_h),
        ])
        .areas(left);
        draw_chart(frame, chart, shown, t);
        if let Some(l) = shown.limits.as_ref().filter(|_| limits_h > 0) {
            let para = Paragraph::new(limit_lines)
                .wrap(Wrap { trim: true })
                .block(t.panel(limits_title(l, ctx)));
            frame.render_widget(para, limits);
        }
        if table_h > 0 {
            draw_points(frame, table, curve, ctx.style(), t);
        }
        if warn_h > 0 {
            let style = ctx.style();
            let text: Vec<Line> = curve
                .warnings
                .iter()
                .map(|w| Line::raw(style.text(&format!("! {}", sanitize(w, false)))))
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
        let relations = self
            .entry
            .and_then(|e| e.item.shown().as_ref().ok())
            .and_then(|c| c.api_rp13d.as_ref())
            .filter(|_| self.relations);
        if let Some(a) = relations {
            let style = ctx.style();
            let mut lines = vec![self.set_line(ctx)];
            for (label, value) in present::relations::field_relations(a, style) {
                lines.push(Line::styled(label, t.dim));
                lines.push(Line::raw(format!("   {value}")));
            }
            lines.push(Line::styled(s::RELATIONS_FROM, t.dim));
            lines.push(Line::styled(
                style.text(crate::session::api_rp13d::CONVERSION_NOTE),
                t.dim,
            ));
            let p = Paragraph::new(lines)
                .wrap(Wrap { trim: false })
                .block(t.panel(s::RELATIONS_TITLE));
            frame.render_widget(p, area);
            return;
        }
        let outer = t.panel(s::MODEL_TITLE);
        let inner = outer.inner(area);
        frame.render_widget(outer, area);
        let [text_area, rate_area] =
            Layout::vertical([Constraint::Min(0), Constraint::Length(2)]).areas(inner);
        let mut lines = vec![self.set_line(ctx)];
        if let Some(e) = self.entry
            && let Ok(curve) = e.item.shown()
        {
            lines.extend(fit_lines(curve, e.item.pick, ctx.style(), t));
        }
        frame.render_widget(Paragraph::new(lines).wrap(Wrap { trim: false }), text_area);
        self.draw_rate(frame, rate_area, ctx);
    }

    fn set_line(&self, ctx: &Ctx) -> Line<'static> {
        let t = &ctx.theme;
        let Some(entry) = self.entry else {
            return Line::styled(s::NO_SET, t.dim);
        };
        let status = match ctx.log.status_of_seq(entry.seq) {
            EntryStatus::Saved => Span::styled(js::SAVED, t.ok),
            _ => Span::styled(js::UNSAVED, t.error),
        };
        let set = &entry.item;
        let temp = set
            .temperature_k
            .map(|k| {
                format!(
                    ", {}",
                    present::quantity(k, Dimension::Temperature, ctx.style())
                )
            })
            .unwrap_or_default();
        Line::from(vec![
            Span::styled(format!("{} #{}  ", s::SET, entry.seq), t.dim),
            Span::raw(format!("{}{temp}  ", sanitize(&set.product, false))),
            status,
        ])
    }

    fn draw_rate(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
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
        let curve = self.entry.and_then(|e| e.item.shown().as_ref().ok());
        let text = match (self.rate.error(), curve, self.apparent_at) {
            (Some(_), _, _) => Span::styled(format!("! {}?", s::RATE_INVALID), t.error),
            (None, Some(curve), Some(rate)) => {
                let style = ctx.style();
                let mu = curve.apparent_viscosity_at(rate);
                Span::styled(
                    format!(
                        "= {} {} {}",
                        present::quantity(mu, Dimension::DynamicViscosity, style),
                        s::AT,
                        present::quantity(rate, Dimension::ShearRate, style),
                    ),
                    t.ok,
                )
            }
            _ => Span::raw(""),
        };
        frame.render_widget(Paragraph::new(Line::from(text)), rest);
    }
}

/// The model panel's lines: the model, each constant ± its 95 % interval, fit quality, why.
fn fit_lines(curve: &FlowCurve, pick: ModelPick, style: Style, t: &Theme) -> Vec<Line<'static>> {
    let fit: &Fit = &curve.fit;
    let how = match pick {
        ModelPick::Auto => s::AUTO,
        ModelPick::Fixed(_) => s::BY_HAND,
    };
    let mut lines = vec![Line::from(vec![
        Span::styled(style.text(fit.model.kind().title()), t.title),
        Span::styled(format!(" ({how})"), t.dim),
    ])];
    for e in &fit.estimates {
        lines.push(Line::styled(
            format!("{} {}", present::symbol(e.name, style), e.name.label()),
            t.dim,
        ));
        lines.push(Line::raw(format!("   {}", present::estimate(e, style))));
    }
    lines.push(Line::styled(style.text(s::PM_IS_95), t.dim));
    lines.push(Line::raw(style.text(&format!(
        "{} {}   {} {}",
        s::R2,
        present::r_squared(fit.r_squared),
        s::RMSE,
        present::quantity(fit.rmse_pa, Dimension::Stress, style)
    ))));
    lines.push(Line::from(vec![
        Span::styled(format!("{}: ", s::WHY), t.dim),
        Span::raw(sanitize(&present::reason::for_curve(curve, style), false)),
    ]));
    lines
}

fn draw_message(frame: &mut Frame, area: Rect, text: &str, t: &Theme) {
    let para = Paragraph::new(text.to_string())
        .style(t.dim)
        .wrap(Wrap { trim: true })
        .block(t.panel(s::CHART_TITLE));
    frame.render_widget(para, area);
}

/// The limits panel's title: the product and the temperature the limits are checked at.
fn limits_title(l: &Limits, ctx: &Ctx) -> String {
    let style = ctx.style();
    let basis = match l.shifted_to_k {
        Some(k) => format!(
            "{} {}",
            s::LIMITS_AT,
            present::quantity(k, Dimension::Temperature, style)
        ),
        None => s::LIMITS_AS_MEASURED.to_string(),
    };
    style.text(&format!(
        " {} {}, {basis} ",
        s::LIMITS_TITLE,
        sanitize(&l.product, false)
    ))
}

/// One line per spec limit: OUT (with which way), in, or not checked, in words, with the
/// value the curve gives; the same words as `report`.
fn limit_lines(l: &Limits, ctx: &Ctx) -> Vec<Line<'static>> {
    let t = &ctx.theme;
    let style = ctx.style();
    if l.checks.is_empty() {
        return vec![Line::styled(s::NO_LIMITS, t.dim)];
    }
    l.checks
        .iter()
        .map(|c| {
            let value = c.value.map_or(String::new(), |v| {
                format!(
                    " ({} {})",
                    s::IS,
                    limits::value_text(c.limit.property, v, style)
                )
            });
            let (mark, words, mark_style) = match c.status {
                LimitStatus::Above | LimitStatus::Below => {
                    (s::OUT, limits::check_text(c, style), t.error)
                }
                LimitStatus::Within => (s::IN, limits::describe_limit(&c.limit, style), t.ok),
                LimitStatus::NotChecked => ("--", limits::check_text(c, style), t.dim),
            };
            Line::from(vec![
                Span::styled(format!("{mark:<4}"), mark_style),
                Span::raw(style.text(&format!("{words}{value}"))),
            ])
        })
        .collect()
}

/// Rows a bordered panel of these lines needs when wrapped (at most half the area).
fn lines_height(lines: &[Line], area: Rect) -> u16 {
    if lines.is_empty() {
        return 0;
    }
    let width = area.width.saturating_sub(2);
    let rows: u16 = lines
        .iter()
        .map(|l| crate::tui::layout::wrapped_lines(&l.to_string(), width))
        .sum();
    (rows + 2).min(area.height / 2)
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
        y_unit: &shown.y_unit,
        theme: t,
    };
    frame.render_widget(chart, inner);
}

fn draw_points(frame: &mut Frame, area: Rect, curve: &FlowCurve, style: Style, t: &Theme) {
    let header = format!(
        "{:>6} {:>6} {:>9} {:>9}  {}",
        s::COL_RPM,
        s::COL_DIAL,
        s::COL_RATE,
        format!(
            "{} {}",
            s::COL_STRESS,
            crate::units::display_unit(Dimension::Stress, style.system)
        ),
        s::COL_FLAGS
    );
    let mut lines = vec![Line::styled(header, t.dim)];
    let number = |si: f64, dim| {
        let shown = present::quantity(si, dim, style);
        shown.split(' ').next().unwrap_or_default().to_string()
    };
    for p in &curve.points {
        let opt = |v: Option<f64>| v.map(crate::units::significant).unwrap_or_default();
        lines.push(Line::raw(format!(
            "{:>6} {:>6} {:>9} {:>9}  {}",
            opt(p.rpm),
            opt(p.dial),
            number(p.shear_rate_per_s, Dimension::ShearRate),
            number(p.shear_stress_pa, Dimension::Stress),
            p.flags.join(", ")
        )));
    }
    frame.render_widget(Paragraph::new(lines).block(t.panel(s::POINTS_TITLE)), area);
}
