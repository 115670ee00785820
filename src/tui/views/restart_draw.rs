//! Drawing the Restart view: the form on the left; on the right gel strength against rest
//! time with the pump's limit (and the limit less the margin, where the longest safe stop
//! is read), and under it the answer in words, scrolled with PgUp/PgDn.

use super::restart::Shown;
use super::restart_form::{Focus, Form, GEL_ROWS};
use crate::line::restart::Outcome;
use crate::present::Style;
use crate::session::duration::format_duration;
use crate::session::restart_chart::RestartChart;
use crate::session::restart_words;
use crate::site::{Line as SiteLine, Pump};
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::layout::{clip_end, row};
use crate::tui::strings::restart as s;
use crate::tui::theme::Glyphs;
use crate::tui::widgets::field::Field;
use crate::tui::widgets::field::draw_in_form;
use crate::tui::widgets::lin_chart::{Level, LinChart, LinRange, Series};
use crate::units::{self, Dimension};
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

/// Width of the form; the chart and the answer take the rest.
const FORM_W: u16 = 38;
/// Height of the chart panel.
const CHART_H: u16 = 10;
const LABEL_W: u16 = 9;
const REST_W: u16 = 10;
const GEL_W: u16 = 12;
/// Rest times up to this long are drawn in minutes, longer ones in hours.
const MINUTES_UP_TO_S: f64 = 3.0 * 3600.0;

pub struct RestartScreen<'a> {
    pub form: &'a Form,
    pub target: Option<(&'a SiteLine, Option<&'a Pump>)>,
    pub shown: Option<&'a Shown>,
    pub waiting: bool,
    pub message: Option<&'a str>,
    pub scroll: u16,
    /// Where the furthest scroll is written back for the view's PgDn.
    pub scroll_most: &'a std::cell::Cell<u16>,
}

impl RestartScreen<'_> {
    pub fn draw(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let [left, right] =
            Layout::horizontal([Constraint::Length(FORM_W), Constraint::Min(0)]).areas(area);
        let [top, bottom] =
            Layout::vertical([Constraint::Length(CHART_H), Constraint::Min(0)]).areas(right);
        self.draw_form(frame, left, ctx);
        self.draw_chart(frame, top, ctx);
        self.draw_answer(frame, bottom, ctx);
    }

    fn draw_form(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let block = t.panel(s::FORM_TITLE);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let (line, pump) = match self.target {
            Some((l, p)) => (Some(l), p),
            None => (None, None),
        };
        let line_text = line.map_or(s::NO_LINE.to_string(), |l| picker(&l.id, &l.description));
        let pump_text = pump.map_or(s::NO_PUMP.to_string(), |p| picker(&p.id, &p.description));
        let width = usize::from(inner.width);
        self.choice(frame, row(inner, 0), s::LINE, &line_text, Focus::Line, ctx);
        self.choice(frame, row(inner, 1), s::PUMP, &pump_text, Focus::Pump, ctx);
        let product = match &ctx.picks.product {
            Some(p) => Span::styled(sanitize(p, false), t.title),
            None => Span::styled(s::NOT_PICKED, t.warn),
        };
        let product_line = Line::from(vec![
            Span::styled(
                format!("{:<w$}", s::PRODUCT, w = usize::from(LABEL_W)),
                t.dim,
            ),
            product,
        ]);
        frame.render_widget(Paragraph::new(product_line), row(inner, 2));
        let header = format!(
            "  #  {:<rw$} {}",
            s::REST,
            s::GEL,
            rw = usize::from(REST_W + 1)
        );
        frame.render_widget(Paragraph::new(header).style(t.dim), row(inner, 3));
        for i in 0..GEL_ROWS {
            let r = row(inner, 4 + i as u16);
            let num = Span::styled(format!("{:>3}", i + 1), t.dim);
            frame.render_widget(Paragraph::new(num), r);
            self.field(frame, r, 5, REST_W, Focus::Rest(i), ctx);
            self.field(frame, r, 5 + REST_W + 2, GEL_W, Focus::Gel(i), ctx);
        }
        let stop_row = row(inner, 5 + GEL_ROWS as u16);
        frame.render_widget(Paragraph::new(Span::styled(s::STOPPED, t.dim)), stop_row);
        self.field(frame, stop_row, LABEL_W, REST_W, Focus::Stop, ctx);
        let hint = Rect {
            x: stop_row.x + LABEL_W + REST_W + 1,
            ..stop_row
        }
        .intersection(stop_row);
        frame.render_widget(Paragraph::new(s::LONG_REST).style(t.dim), hint);
        let save_row = row(inner, 6 + GEL_ROWS as u16);
        let save_style = if self.form.focus == Focus::Save {
            t.selected
        } else {
            t.key
        };
        frame.render_widget(
            Paragraph::new(Span::styled(
                clip_end(s::SAVE, width, t.marks.cut),
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

    /// A picker row: label, then "< id >  description" (selected when focused).
    fn choice(&self, frame: &mut Frame, area: Rect, label: &str, text: &str, f: Focus, ctx: &Ctx) {
        let t = &ctx.theme;
        let style = if self.form.focus == f {
            t.selected
        } else {
            t.base
        };
        let room = usize::from(area.width.saturating_sub(LABEL_W));
        let line = Line::from(vec![
            Span::styled(format!("{label:<w$}", w = usize::from(LABEL_W)), t.dim),
            Span::styled(clip_end(text, room, t.marks.cut), style),
        ]);
        frame.render_widget(Paragraph::new(line), area);
    }

    fn field(&self, frame: &mut Frame, line: Rect, x: u16, width: u16, f: Focus, ctx: &Ctx) {
        let t = &ctx.theme;
        let Some(field) = self.form.field(f) else {
            return;
        };
        let area = Rect {
            x: line.x.saturating_add(x),
            width,
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

    /// The focused field's problem, else the last message, else the hint.
    fn message_for(&self, ctx: &Ctx) -> Paragraph<'static> {
        let t = &ctx.theme;
        let style = ctx.style();
        let error = self.form.field(self.form.focus).and_then(Field::error);
        let (text, look) = match (error, self.message) {
            (Some(e), _) => (format!("! {e}"), t.error),
            (None, Some(m)) => (m.to_string(), t.warn),
            (None, None) => (s::HINT.to_string(), t.dim),
        };
        Paragraph::new(style.text(&sanitize(&text, false)))
            .style(look)
            .wrap(Wrap { trim: true })
    }

    fn draw_chart(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let Some(chart) = self.shown.and_then(|sh| sh.chart.as_ref()) else {
            frame.render_widget(t.panel(s::CHART_TITLE), area);
            return;
        };
        let g = ChartGlyphs::new(t.glyphs);
        let legend = format!(
            " {} {}  {} {}  {} {} ",
            g.reading,
            s::LEGEND_READ,
            t.marks.fit,
            s::LEGEND_FIT,
            g.band,
            s::LEGEND_BAND
        );
        let block = t
            .panel(s::CHART_TITLE)
            .title_bottom(Line::styled(legend, t.dim));
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let d = ChartData::of(chart, ctx.style());
        let series = [
            Series {
                points: &d.band,
                glyph: g.band,
                style: t.dim,
            },
            Series {
                points: &d.curve,
                glyph: t.marks.fit,
                style: t.chart_fit,
            },
            Series {
                points: &d.readings,
                glyph: g.reading,
                style: t.chart_point,
            },
        ];
        let levels = [
            Level {
                y: d.allowed,
                glyph: g.allowed,
                style: t.warn,
                label: s::ALLOWED,
            },
            Level {
                y: d.limit,
                glyph: g.limit,
                style: t.error,
                label: s::LIMIT,
            },
        ];
        let widget = LinChart {
            series: &series,
            levels: &levels,
            x: d.x,
            y: d.y,
            x_unit: d.x_unit,
            y_unit: &d.y_unit,
            theme: t,
        };
        frame.render_widget(widget, inner);
    }

    fn draw_answer(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let t = &ctx.theme;
        let title = format!("{}({}) ", s::ANSWER_TITLE, s::SCROLL);
        let block = t.panel(title);
        let inner = block.inner(area);
        frame.render_widget(block, area);
        let lines = match self.shown {
            Some(sh) => answer_lines(sh, ctx),
            None if self.waiting => vec![Line::styled(s::WAITING, t.dim)],
            None => vec![Line::styled(s::NO_ANSWER, t.dim)],
        };
        let para = Paragraph::new(lines).wrap(Wrap { trim: false });
        // Scrolled no further than the last line at the bottom of the panel.
        let rows = para.line_count(inner.width);
        let most = u16::try_from(rows.saturating_sub(usize::from(inner.height))).unwrap_or(0);
        self.scroll_most.set(most);
        let para = para.scroll((self.scroll.min(most), 0));
        frame.render_widget(para, inner);
    }
}

fn picker(id: &str, description: &str) -> String {
    format!(
        "< {} >  {}",
        sanitize(id, false),
        sanitize(description, false)
    )
}

/// The answer in words: now and at the coldest, then what to do, what was assumed and the
/// cautions.
fn answer_lines(sh: &Shown, ctx: &Ctx) -> Vec<Line<'static>> {
    let t = &ctx.theme;
    let style = ctx.style();
    let system = style.system;
    let a = &sh.answer;
    let say = |text: String| style.text(&sanitize(&text, false));
    let verdict = |outcome: Outcome| match outcome {
        Outcome::Restarts => t.ok,
        _ => t.error,
    };
    let judged = match a.input.stopped_for_s {
        Some(stop) => format!("{} {}:", s::AFTER_STOP, format_duration(stop)),
        None => s::AFTER_LONG_REST.to_string(),
    };
    let mut out = vec![
        Line::styled(say(judged), t.title),
        Line::from(vec![
            Span::styled(format!("{}: ", s::NOW), t.title),
            Span::styled(
                say(restart_words::headline(a, &a.now, system)),
                verdict(a.now.check.outcome),
            ),
        ]),
        Line::raw(say(restart_words::safe_stop(&a.now))),
    ];
    if let (Some(cold), Some(c)) = (&a.cold, a.input.cold) {
        let temp = units::format(c.temperature_k, Dimension::Temperature, system);
        out.push(Line::from(vec![
            Span::styled(say(format!("{} {temp} ({}): ", s::AT, s::COLDEST)), t.title),
            Span::styled(
                say(restart_words::headline(a, cold, system)),
                verdict(cold.check.outcome),
            ),
        ]));
        out.push(Line::raw(say(restart_words::safe_stop(cold))));
    }
    let mut section = |title: &str, items: Vec<String>| {
        if items.is_empty() {
            return;
        }
        out.push(Line::styled(format!("{title}:"), t.title));
        out.extend(items.into_iter().map(|i| Line::raw(say(format!("- {i}")))));
    };
    section(
        s::NEXT,
        a.next_steps
            .iter()
            .map(|n| restart_words::next_step(*n).to_string())
            .collect(),
    );
    section(
        s::CAUTIONS,
        a.cautions
            .iter()
            .map(|c| restart_words::caution(*c).to_string())
            .collect(),
    );
    section(
        s::ASSUMED,
        a.assumptions
            .iter()
            .map(|x| restart_words::assumption(x, system))
            .collect(),
    );
    out
}

/// Marks of the gel chart, plain ASCII under `--ascii`.
struct ChartGlyphs {
    reading: char,
    band: char,
    limit: char,
    allowed: char,
}

impl ChartGlyphs {
    fn new(glyphs: Glyphs) -> ChartGlyphs {
        match glyphs {
            Glyphs::Unicode => ChartGlyphs {
                reading: '●',
                band: '░',
                limit: '━',
                allowed: '╌',
            },
            Glyphs::Ascii => ChartGlyphs {
                reading: 'o',
                band: ':',
                limit: '=',
                allowed: '-',
            },
        }
    }
}

/// The chart's series in the units its axes are labelled in.
struct ChartData {
    curve: Vec<(f64, f64)>,
    band: Vec<(f64, f64)>,
    readings: Vec<(f64, f64)>,
    limit: f64,
    allowed: f64,
    x: LinRange,
    y: LinRange,
    x_unit: &'static str,
    y_unit: String,
}

impl ChartData {
    fn of(c: &RestartChart, style: Style) -> ChartData {
        let until = c.points.last().map_or(0.0, |p| p.rest_s);
        let (x_unit, per) = if until <= MINUTES_UP_TO_S {
            ("min", 60.0)
        } else {
            ("h", 3600.0)
        };
        let y_unit = units::display_unit(Dimension::Stress, style.system);
        let y_of = |pa: f64| units::from_si(pa, y_unit, Dimension::Stress).unwrap_or(pa);
        let curve: Vec<(f64, f64)> = c
            .points
            .iter()
            .map(|p| (p.rest_s / per, y_of(p.stress_pa)))
            .collect();
        let band: Vec<(f64, f64)> = c
            .points
            .iter()
            .filter_map(|p| p.band_pa.map(|b| (p.rest_s / per, b)))
            .flat_map(|(x, (lo, hi))| [(x, y_of(lo.max(0.0))), (x, y_of(hi))])
            .collect();
        let readings: Vec<(f64, f64)> = c
            .readings
            .iter()
            .map(|r| (r.rest_s / per, y_of(r.stress_pa)))
            .collect();
        let limit = y_of(c.limit_gel_pa);
        let allowed = y_of(c.allowed_gel_pa);
        let ys = curve
            .iter()
            .chain(&readings)
            .map(|p| p.1)
            .chain([limit, allowed]);
        let fallback = LinRange { lo: 0.0, hi: 1.0 };
        ChartData {
            x: LinRange::from_zero(curve.iter().map(|p| p.0)).unwrap_or(fallback),
            y: LinRange::from_zero(ys).unwrap_or(fallback),
            curve,
            band,
            readings,
            limit,
            allowed,
            x_unit,
            y_unit: style.text(y_unit),
        }
    }
}
