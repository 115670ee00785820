//! Drawing the Tank view: the form and the side view of the tank on the left; on the right
//! the power curve with today's point (log axes) and under it the answer in words, scrolled
//! with PgUp/PgDn.

use super::tank_form::{FIELDS, Focus, Form};
use super::tank_sketch::{self, TankShape};
use super::tank_text;
use super::text_rows::wrapped_rows;
use crate::session::tank_live::TankLive;
use crate::site::Tank;
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::layout::{clip_end, row};
use crate::tui::strings::tank as s;
use crate::tui::theme::Glyphs;
use crate::tui::widgets::field::Field;
use crate::tui::widgets::field::draw_in_form;
use crate::tui::widgets::log_axis::LogRange;
use crate::tui::widgets::log_chart::{LogChart, Mark};
use crate::units;
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};
use std::cell::Cell;

/// Width of the form and the side view; the chart and the answer take the rest.
const FORM_W: u16 = 38;
/// Height of the form panel without its message, and the message's usual rows.
const FORM_ROWS: u16 = 9;
const MESSAGE_ROWS: u16 = 2;
/// Height of the chart panel.
const CHART_H: u16 = 9;
const LABEL_W: u16 = 9;
const FIELD_W: u16 = 12;

pub struct TankScreen<'a> {
    pub form: &'a Form,
    pub tank: Option<&'a Tank>,
    pub shown: Option<&'a Result<TankLive, String>>,
    pub journalled: bool,
    pub waiting: bool,
    pub message: Option<&'a str>,
    pub scroll: u16,
    /// Where the furthest scroll is written back for the view's PgDn.
    pub scroll_most: &'a Cell<u16>,
    /// Where the panel's page size is written back.
    pub page: &'a Cell<u16>,
}

impl TankScreen<'_> {
    pub fn draw(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let [left, right] =
            Layout::horizontal([Constraint::Length(FORM_W), Constraint::Min(0)]).areas(area);
        let [form, side] = Layout::vertical([
            Constraint::Length(self.form_height(ctx)),
            Constraint::Min(0),
        ])
        .areas(left);
        let [top, bottom] =
            Layout::vertical([Constraint::Length(CHART_H), Constraint::Min(0)]).areas(right);
        self.draw_form(frame, form, ctx);
        self.draw_side(frame, side, ctx);
        self.draw_chart(frame, top, ctx);
        self.draw_answer(frame, bottom, ctx);
    }

    fn done(&self) -> Option<&TankLive> {
        self.shown.and_then(|r| r.as_ref().ok())
    }

    fn draw_form(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let block = t.panel(s::FORM_TITLE);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let tank_text = self.tank.map_or(s::NO_TANK.to_string(), |k| {
            format!(
                "< {} >  {}",
                sanitize(&k.id, false),
                sanitize(&k.description, false)
            )
        });
        let style = if self.form.focus == Focus::Tank {
            t.selected
        } else {
            t.base
        };
        let room = usize::from(inner.width.saturating_sub(LABEL_W));
        let label =
            |text: &str| Span::styled(format!("{text:<w$}", w = usize::from(LABEL_W)), t.dim);
        frame.render_widget(
            Paragraph::new(Line::from(vec![
                label(s::TANK),
                Span::styled(clip_end(&tank_text, room, t.marks.cut), style),
            ])),
            row(inner, 0),
        );
        let product = self
            .done()
            .map(|d| d.product.clone())
            .or(self.tank.map(|k| k.product.clone()))
            .unwrap_or_default();
        frame.render_widget(
            Paragraph::new(Line::from(vec![
                label(s::PRODUCT),
                Span::styled(sanitize(&product, false), t.title),
            ])),
            row(inner, 1),
        );
        for (i, (_, name, kind)) in FIELDS.iter().enumerate() {
            let r = row(inner, 2 + i as u16);
            frame.render_widget(Paragraph::new(label(name)), r);
            self.field(frame, r, Focus::Field(i), ctx);
            let unit = match kind {
                crate::tui::widgets::field::FieldKind::Quantity(d)
                | crate::tui::widgets::field::FieldKind::Positive(d) => {
                    units::display_unit(*d, ctx.site.unit_system)
                }
                crate::tui::widgets::field::FieldKind::Text(_) => "",
            };
            let hint = Rect {
                x: r.x + LABEL_W + FIELD_W + 2,
                ..r
            }
            .intersection(r);
            frame.render_widget(Paragraph::new(ctx.style().text(unit)).style(t.dim), hint);
        }
        let save_row = row(inner, 2 + FIELDS.len() as u16);
        let save_style = if self.form.focus == Focus::Save {
            t.selected
        } else {
            t.key
        };
        frame.render_widget(
            Paragraph::new(Span::styled(
                clip_end(s::SAVE, usize::from(inner.width), t.marks.cut),
                save_style,
            )),
            save_row,
        );
        let msg_area = Rect {
            y: save_row.y + 1,
            height: inner.bottom().saturating_sub(save_row.y + 1),
            ..inner
        }
        .intersection(inner);
        frame.render_widget(self.message_for(ctx), msg_area);
    }

    fn field(&self, frame: &mut Frame, line: Rect, f: Focus, ctx: &Ctx) {
        let t = &ctx.theme;
        let Some(field) = self.form.field(f) else {
            return;
        };
        let area = Rect {
            x: line.x.saturating_add(LABEL_W),
            width: FIELD_W,
            ..line
        }
        .intersection(line);
        let selected = self.form.focus == f;
        let style = match selected {
            true => t.field_editing,
            false if field.error().is_some() => t.error,
            false => t.field,
        };
        draw_in_form(frame, (area, line), field, style, selected, t.error);
    }

    /// The form is as tall as its message needs (a long one takes rows from the side view,
    /// so it is never cut).
    fn form_height(&self, ctx: &Ctx) -> u16 {
        let (text, _) = self.message_text(ctx);
        let width = usize::from(FORM_W.saturating_sub(2));
        let rows = u16::try_from(wrapped_rows(&text, width)).unwrap_or(u16::MAX);
        FORM_ROWS.saturating_add(rows.max(MESSAGE_ROWS))
    }

    /// The focused field's problem, else the last message, else the hint.
    fn message_text(&self, ctx: &Ctx) -> (String, ratatui::style::Style) {
        let t = &ctx.theme;
        let error = self.form.field(self.form.focus).and_then(Field::error);
        let (text, look) = match (error, self.message) {
            (Some(e), _) => (format!("! {e}"), t.error),
            (None, Some(m)) => (m.to_string(), t.warn),
            (None, None) => (s::HINT.to_string(), t.dim),
        };
        (ctx.style().text(&sanitize(&text, false)), look)
    }

    fn message_for(&self, ctx: &Ctx) -> Paragraph<'static> {
        let (text, look) = self.message_text(ctx);
        Paragraph::new(text).style(look).wrap(Wrap { trim: true })
    }

    fn draw_side(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let g = match t.glyphs {
            Glyphs::Unicode => tank_sketch::UNICODE,
            Glyphs::Ascii => tank_sketch::ASCII,
        };
        let legend = format!(
            " {} {}  {} {} ",
            g.moving,
            s::LEGEND_CAVERN,
            g.still,
            s::LEGEND_STILL
        );
        let block = t
            .panel(s::SIDE_TITLE)
            .title_bottom(Line::styled(legend, t.dim));
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let (Some(d), Some(tank)) = (self.done(), self.tank) else {
            return;
        };
        let v = &d.answer.request.vessel;
        let shape = TankShape {
            tank_diameter_m: v.tank_diameter_m.unwrap_or(tank.diameter_m),
            liquid_height_m: v.liquid_height_m.unwrap_or(tank.liquid_height_m),
            full_height_m: tank.liquid_height_m,
            impeller_diameter_m: v.impeller_diameter_m,
            cavern_m: d.answer.cavern.map(|c| (c.diameter_m, c.height_m)),
        };
        // Drawn a little narrower than the panel, so the walls stand clear of its border.
        let width = usize::from(inner.width.saturating_sub(2));
        let lines: Vec<Line> = tank_sketch::side_view(&shape, width, usize::from(inner.height), g)
            .into_iter()
            .map(|l| Line::styled(format!(" {l}"), t.base))
            .collect();
        frame.render_widget(Paragraph::new(lines), inner);
    }

    fn draw_chart(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let legend = format!(
            " {} {}  {} {} ",
            t.marks.fit,
            s::LEGEND_CURVE,
            t.marks.point,
            s::LEGEND_TODAY
        );
        let block = t
            .panel(s::CHART_TITLE)
            .title_bottom(Line::styled(legend, t.dim));
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let Some(d) = self.done() else {
            return;
        };
        let p = &d.answer.operating.point;
        let marks = [Mark {
            x: p.reynolds,
            y: p.power_number,
            flagged: false,
        }];
        let xs = d.answer.chart.iter().map(|c| c.0).chain([p.reynolds]);
        let ys = d.answer.chart.iter().map(|c| c.1).chain([p.power_number]);
        let (Some(x), Some(y)) = (LogRange::covering(xs), LogRange::covering(ys)) else {
            return;
        };
        let chart = LogChart {
            marks: &marks,
            curve: &d.answer.chart,
            x,
            y,
            y_unit: "Np",
            theme: t,
        };
        frame.render_widget(chart, inner);
    }

    fn draw_answer(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let title = format!("{}({}) ", s::ANSWER_TITLE, s::SCROLL);
        let block = t.panel(title);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let lines: Vec<(bool, String)> = match self.shown {
            Some(Ok(d)) => tank_text::lines(d, self.journalled, ctx.style()),
            Some(Err(e)) => vec![(false, ctx.style().text(&sanitize(e, false)))],
            None if self.waiting => vec![(false, s::SENT.to_string())],
            None => Vec::new(),
        };
        let rows: usize = lines
            .iter()
            .map(|(_, l)| wrapped_rows(l, usize::from(inner.width)))
            .sum();
        // Scrolled no further than the last line at the bottom of the panel.
        let most = u16::try_from(rows.saturating_sub(usize::from(inner.height))).unwrap_or(0);
        self.scroll_most.set(most);
        self.page.set(inner.height.saturating_sub(1).max(1));
        let look = |heading: bool| match (heading, &self.shown) {
            (true, _) => t.title,
            (false, Some(Err(_))) => t.warn,
            (false, _) => t.base,
        };
        let lines: Vec<Line> = lines
            .into_iter()
            .map(|(heading, text)| Line::styled(text, look(heading)))
            .collect();
        let para = Paragraph::new(lines)
            .wrap(Wrap { trim: false })
            .scroll((self.scroll.min(most), 0));
        frame.render_widget(para, inner);
    }
}
