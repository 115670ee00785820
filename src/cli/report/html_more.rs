//! Two more of the report's charts: each line the session touched, pressure drop against
//! flow with the pump that feeds it (the Line view's answer, `session::line_shown`), and each
//! product's spec-limited properties set by set against their limits, checked exactly as
//! `report` and `trend` check them (at the reference temperature, `checks_at_reference`).

use super::Journal;
use super::html_charts::figure;
use super::svg::{Chart, Mark, Scale, render};
use crate::present::{Style, limits::property_name};
use crate::session::line_shown::{LineShown, shown_for};
use crate::session::state::SessionState;
use crate::session::trend::checks_at_reference;
use crate::site::Site;

const BAR: f64 = 1e5;
const M3H: f64 = 3600.0;

/// Pressure drop against flow for every line the session names (or whose pump it names),
/// with the product of the session's newest set.
pub(crate) fn line_charts(state: &SessionState, site: &Site) -> String {
    let Some(product) = state
        .sets
        .iter()
        .rev()
        .map(|e| e.item.product.as_str())
        .find(|p| site.product(p).is_some())
    else {
        return String::new();
    };
    let mut out = String::new();
    for line in &site.lines {
        let mut ids = vec![line.id.as_str()];
        ids.extend(site.pumps_feeding(&line.id).iter().map(|p| p.id.as_str()));
        if !state.equipment.iter().any(|e| ids.contains(&e.as_str())) {
            continue;
        }
        let Ok(shown) = shown_for(site, state, &line.id, product, 0, 0) else {
            continue;
        };
        out.push_str("<h3>Line pressure drop</h3>\n");
        out.push_str(&figure(render(&line_chart(&shown)), LINE_CAPTION));
    }
    out
}

const LINE_CAPTION: &str = "Solid line: pressure drop (friction plus static head) against flow from the product's curve, shaded: its band; second solid line: the feeding pump's viscosity-corrected curve (centrifugal); points: plant readings on the line and the pump's duty point; dashed: the line's design pressure and, for a positive-displacement pump, its relief setting. Never exceed the rated pressure of the weakest part of the line.";

fn line_chart(sh: &LineShown) -> Chart {
    let q = |m3_s: f64| m3_s * M3H;
    let mut marks = Vec::new();
    let band: Vec<(f64, f64, f64)> = sh
        .curve
        .iter()
        .filter_map(|p| {
            p.band_pa
                .map(|(lo, hi)| (q(p.answer.flow_m3_s), lo / BAR, hi / BAR))
        })
        .collect();
    if !band.is_empty() {
        marks.push(Mark::Band(band));
    }
    let xy: Vec<(f64, f64)> = sh
        .curve
        .iter()
        .map(|p| (q(p.answer.flow_m3_s), p.answer.pressure_drop_pa / BAR))
        .collect();
    let (x0, x1) = (
        xy.first().map_or(0.0, |p| p.0),
        xy.last().map_or(1.0, |p| p.0),
    );
    marks.push(Mark::Line { xy, dashed: false });
    let mut points: Vec<(f64, f64)> = sh
        .pairs
        .iter()
        .map(|p| (q(p.flow_m3_s), p.pressure_drop_pa / BAR))
        .collect();
    if let Some(Ok(pump)) = &sh.pump {
        if !pump.curve.is_empty() {
            marks.push(Mark::Line {
                xy: pump.curve.iter().map(|&(f, p)| (q(f), p / BAR)).collect(),
                dashed: false,
            });
        }
        points.extend(pump.duty.map(|(f, p)| (q(f), p / BAR)));
        if let Some(relief) = pump.relief_pa {
            marks.push(level(x0, x1, relief / BAR));
        }
    }
    if !points.is_empty() {
        marks.push(Mark::Points(points));
    }
    if let Some(design) = sh.design_pa {
        marks.push(level(x0, x1, design / BAR));
    }
    Chart {
        title: format!("Line {}: {}", sh.line_id, sh.product),
        x_label: "flow, m³/h".into(),
        y_label: "pressure, bar".into(),
        x_scale: Scale::Linear,
        y_scale: Scale::Linear,
        marks,
    }
}

fn level(x0: f64, x1: f64, y: f64) -> Mark {
    Mark::Line {
        xy: vec![(x0, y), (x1, y)],
        dashed: true,
    }
}

/// For each product with sets in these journals, each of its spec limits: the property set
/// by set (in time order over every journal) against the limit's bounds.
pub(crate) fn trend_charts(journals: &[Journal], site: &Site) -> String {
    let mut out = String::new();
    for product in &site.products {
        let mut sets: Vec<_> = journals
            .iter()
            .flat_map(|j| j.state.sets.iter())
            .filter(|e| e.item.product == product.name)
            .filter_map(|e| e.item.shown().as_ref().ok().map(|c| (e, c)))
            .collect();
        if sets.is_empty() || product.limits.is_empty() {
            continue;
        }
        sets.sort_by_key(|(e, _)| e.at.utc);
        let first = sets[0].0.at.utc;
        let hours = |e: &crate::session::Entry<_>| (e.at.utc - first).num_seconds() as f64 / 3600.0;
        for (i, limit) in product.limits.iter().enumerate() {
            let values: Vec<(f64, f64)> = sets
                .iter()
                .filter_map(|(e, c)| {
                    let (checks, _) =
                        checks_at_reference(product, &c.fit.model, e.item.temperature_k);
                    checks.get(i).and_then(|k| k.value).map(|v| (hours(e), v))
                })
                .collect();
            if values.is_empty() {
                continue;
            }
            let (x0, x1) = (
                values[0].0,
                values[values.len() - 1].0.max(values[0].0 + 1.0),
            );
            let mut marks = vec![Mark::Points(values.clone())];
            if values.len() > 1 {
                marks.push(Mark::Line {
                    xy: values,
                    dashed: false,
                });
            }
            marks.extend(limit.min.map(|m| level(x0, x1, m)));
            marks.extend(limit.max.map(|m| level(x0, x1, m)));
            let name = property_name(limit.property, Style::SI);
            let chart = Chart {
                title: format!("Trend of {}: {name}", product.name),
                x_label: "hours since the first set in these journals".into(),
                y_label: format!("{name}, SI units"),
                x_scale: Scale::Linear,
                y_scale: Scale::Linear,
                marks,
            };
            out.push_str(&figure(
                render(&chart),
                "Points: each set's value at the product's reference temperature, as report and trend check it; dashed: the spec limit.",
            ));
        }
    }
    if out.is_empty() {
        return out;
    }
    format!("<h2>Product trends against their limits</h2>\n{out}")
}
