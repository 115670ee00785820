//! Drawing the Line view: pressure drop against flow on the left (the band, the curve marked
//! by regime, the plant's points, the line's design pressure), the answer in words on the
//! right.

use super::text_rows::wrapped_rows;
use crate::line::Regime;
use crate::present::Style;
use crate::session::line_pump;
use crate::session::line_shown::{LineShown, regime_runs};
use crate::session::line_words::pressure_with_band;
use crate::text::sanitize;
use crate::tui::ctx::Ctx;
use crate::tui::strings::line as s;
use crate::tui::theme::Glyphs;
use crate::tui::widgets::lin_chart::{Level, LinChart, LinRange, Series};
use crate::units::{self, Dimension};
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::Line;
use ratatui::widgets::{Paragraph, Wrap};
use std::cell::Cell;

const PANEL_W: u16 = 38;

pub struct LineScreen<'a> {
    pub shown: Option<&'a Result<LineShown, String>>,
    pub cooler_k: f64,
    pub thicker: f64,
    /// The text panel's scroll; how far it can go is written back for the view's PgDn.
    pub scroll: u16,
    pub scroll_most: &'a Cell<u16>,
    pub page: &'a Cell<u16>,
}

pub fn draw(frame: &mut Frame, area: Rect, ctx: &Ctx, screen: LineScreen) {
    let t = &ctx.theme;
    let [left, right] =
        Layout::horizontal([Constraint::Min(0), Constraint::Length(PANEL_W)]).areas(area);
    let sh = match screen.shown {
        Some(Ok(sh)) => sh,
        Some(Err(e)) => {
            let text = ctx.style().text(&sanitize(e, false));
            frame.render_widget(
                Paragraph::new(text)
                    .style(t.warn)
                    .wrap(Wrap { trim: true })
                    .block(t.panel(s::PANEL_TITLE)),
                right,
            );
            frame.render_widget(t.panel(s::CHART_TITLE), left);
            return;
        }
        None => {
            frame.render_widget(
                Paragraph::new(s::NEED_PRODUCT)
                    .style(t.dim)
                    .wrap(Wrap { trim: true })
                    .block(t.panel(s::PANEL_TITLE)),
                right,
            );
            frame.render_widget(t.panel(s::CHART_TITLE), left);
            return;
        }
    };
    draw_chart(frame, left, sh, ctx);
    let lines = words(sh, &screen, ctx.style());
    let block = t.panel(format!("{}({}) ", s::PANEL_TITLE, s::SCROLL));
    let inner = block.inner(right);
    let rows: usize = lines
        .iter()
        .map(|(_, l)| wrapped_rows(l, usize::from(inner.width)))
        .sum();
    // Scrolled no further than the last line at the bottom of the panel.
    let most = u16::try_from(rows.saturating_sub(usize::from(inner.height))).unwrap_or(0);
    screen.scroll_most.set(most);
    screen.page.set(inner.height.saturating_sub(1).max(1));
    let styled: Vec<Line> = lines
        .into_iter()
        .map(|(title, text)| match title {
            true => Line::styled(text, t.title),
            false => Line::raw(text),
        })
        .collect();
    frame.render_widget(
        Paragraph::new(styled)
            .wrap(Wrap { trim: false })
            .scroll((screen.scroll.min(most), 0))
            .block(block),
        right,
    );
}

/// The panel's lines: (is a heading, text), already in the screen's style.
fn words(sh: &LineShown, screen: &LineScreen, style: Style) -> Vec<(bool, String)> {
    let sys = style.system;
    let say = |t: String| style.text(&sanitize(&t, false));
    let flow = |q: f64| units::format(q, Dimension::Flow, sys);
    let mut out = vec![(true, say(format!("{}  {}", sh.line_id, sh.product)))];
    let temp = sh
        .temperature_k
        .map(|k| {
            format!(
                " {} {}",
                s::AT,
                units::format(k, Dimension::Temperature, sys)
            )
        })
        .unwrap_or_default();
    out.push((false, say(format!("{}{temp}: {}", s::SOURCE, sh.source))));
    let what_if = if screen.cooler_k == 0.0 && screen.thicker == 0.0 {
        s::AS_MEASURED.to_string()
    } else {
        format!(
            "{:.0} K {}, {:.0} % {}",
            screen.cooler_k,
            s::COOLER,
            screen.thicker * 100.0,
            s::THICKER
        )
    };
    out.push((false, say(format!("{}: {what_if}", s::WHAT_IF))));
    // The pump on the line first: its duty point is what an operator acts on.
    let (pump, notes) = match &sh.pump {
        Some(Ok(p)) => line_pump::words(p, sys),
        Some(Err(e)) => (vec![format!("{}: {e}", s::NO_PUMP_ANSWER)], Vec::new()),
        None => (vec![s::NO_PUMP.to_string()], Vec::new()),
    };
    out.extend(pump.into_iter().map(|l| (false, say(l))));
    if let Some(p) = sh.curve.last() {
        out.push((
            false,
            say(format!(
                "{} {}: {} ({})",
                s::AT_TOP,
                flow(p.answer.flow_m3_s),
                pressure_with_band(p.answer.pressure_drop_pa, p.band_pa, sys),
                p.answer.regime.name()
            )),
        ));
    }
    let runs: Vec<String> = regime_runs(&sh.curve)
        .into_iter()
        .map(|(r, _, to)| format!("{} {} {}", r.name(), s::UP_TO, flow(to)))
        .collect();
    out.push((false, say(format!("{}: {}", s::REGIMES, runs.join("; ")))));
    let plant = match &sh.check {
        Some(c) => c.words.clone(),
        None => s::NO_PAIRS.to_string(),
    };
    out.push((false, say(format!("{}: {plant}", s::PLANT))));
    out.push((true, format!("{}:", s::CAUTIONS)));
    out.extend(sh.cautions.iter().map(|c| (false, say(format!("- {c}")))));
    // The pump's notes after the cautions: they qualify its answer, above.
    out.extend(notes.into_iter().map(|n| (false, say(n))));
    out
}

struct Glyph {
    band: char,
    transitional: char,
    turbulent: char,
    plant: char,
    design: char,
    pump: char,
    duty: char,
    relief: char,
}

fn glyphs(g: Glyphs) -> Glyph {
    match g {
        Glyphs::Unicode => Glyph {
            band: '░',
            transitional: '~',
            turbulent: '*',
            plant: '●',
            design: '━',
            pump: '+',
            duty: '◆',
            relief: '╌',
        },
        Glyphs::Ascii => Glyph {
            band: ':',
            transitional: '~',
            turbulent: '*',
            plant: 'o',
            design: '=',
            pump: '+',
            duty: 'X',
            relief: '-',
        },
    }
}

fn draw_chart(frame: &mut Frame, area: Rect, sh: &LineShown, ctx: &Ctx) {
    let t = &ctx.theme;
    let style = ctx.style();
    let g = glyphs(t.glyphs);
    let x_unit = units::display_unit(Dimension::Flow, style.system);
    let y_unit = units::display_unit(Dimension::Pressure, style.system);
    let xq = |q: f64| units::from_si(q, x_unit, Dimension::Flow).unwrap_or(q);
    let yp = |p: f64| units::from_si(p, y_unit, Dimension::Pressure).unwrap_or(p);
    let by = |r: Regime| -> Vec<(f64, f64)> {
        sh.curve
            .iter()
            .filter(|p| p.answer.regime == r)
            .map(|p| (xq(p.answer.flow_m3_s), yp(p.answer.pressure_drop_pa)))
            .collect()
    };
    let band: Vec<(f64, f64)> = sh
        .curve
        .iter()
        .filter_map(|p| p.band_pa.map(|b| (xq(p.answer.flow_m3_s), b)))
        .flat_map(|(x, (lo, hi))| [(x, yp(lo)), (x, yp(hi))])
        .collect();
    let plant: Vec<(f64, f64)> = sh
        .pairs
        .iter()
        .map(|p| (xq(p.flow_m3_s), yp(p.pressure_drop_pa)))
        .collect();
    let pump = sh.pump.as_ref().and_then(|p| p.as_ref().ok());
    let pump_curve: Vec<(f64, f64)> = pump
        .map(|p| p.curve.iter().map(|&(q, pa)| (xq(q), yp(pa))).collect())
        .unwrap_or_default();
    let duty: Vec<(f64, f64)> = pump
        .and_then(|p| p.duty)
        .map(|(q, pa)| (xq(q), yp(pa)))
        .into_iter()
        .collect();
    let (lam, tra, tur) = (
        by(Regime::Laminar),
        by(Regime::Transitional),
        by(Regime::Turbulent),
    );
    let series = [
        Series {
            points: &band,
            glyph: g.band,
            style: t.dim,
        },
        Series {
            points: &lam,
            glyph: t.marks.fit,
            style: t.chart_fit,
        },
        Series {
            points: &tra,
            glyph: g.transitional,
            style: t.warn,
        },
        Series {
            points: &tur,
            glyph: g.turbulent,
            style: t.chart_fit,
        },
        Series {
            points: &pump_curve,
            glyph: g.pump,
            style: t.key,
        },
        Series {
            points: &plant,
            glyph: g.plant,
            style: t.chart_point,
        },
        Series {
            points: &duty,
            glyph: g.duty,
            style: t.warn,
        },
    ];
    let relief = pump.and_then(|p| p.relief_pa);
    let levels: Vec<Level> = sh
        .design_pa
        .map(|d| Level {
            y: yp(d),
            glyph: g.design,
            style: t.error,
            label: s::DESIGN,
        })
        .into_iter()
        .chain(relief.map(|r| Level {
            y: yp(r),
            glyph: g.relief,
            style: t.warn,
            label: s::RELIEF,
        }))
        .collect();
    let ys = lam
        .iter()
        .chain(&tra)
        .chain(&tur)
        .chain(&plant)
        .chain(&pump_curve)
        .chain(&duty)
        .map(|p| p.1)
        // The design pressure and the relief are in range, so the headroom to them shows.
        .chain(sh.design_pa.map(yp))
        .chain(relief.map(yp));
    let xs = sh
        .curve
        .iter()
        .map(|p| xq(p.answer.flow_m3_s))
        .chain(pump_curve.iter().chain(&duty).map(|p| p.0));
    let fallback = LinRange { lo: 0.0, hi: 1.0 };
    let mut legend = format!(
        " {} {} {} {} {} {} ",
        t.marks.fit,
        s::LEGEND_CURVE,
        g.band,
        s::LEGEND_BAND,
        g.plant,
        s::LEGEND_PLANT
    );
    if !pump_curve.is_empty() {
        legend.push_str(&format!("{} {} ", g.pump, s::LEGEND_PUMP));
    }
    if !duty.is_empty() {
        legend.push_str(&format!("{} {} ", g.duty, s::LEGEND_DUTY));
    }
    let block = t
        .panel(s::CHART_TITLE)
        .title_bottom(Line::styled(legend, t.dim));
    let inner = block.inner(area);
    frame.render_widget(block, area);
    let x_label = style.text(x_unit);
    let y_label = style.text(y_unit);
    let chart = LinChart {
        series: &series,
        levels: &levels,
        x: LinRange::from_zero(xs).unwrap_or(fallback),
        y: LinRange::from_zero(ys).unwrap_or(fallback),
        x_unit: &x_label,
        y_unit: &y_label,
        theme: t,
    };
    frame.render_widget(chart, inner);
}
