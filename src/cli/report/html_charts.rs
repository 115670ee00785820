//! The report's charts, each as a figure with its caption: a set's flow curve, a line's gel
//! build-up against rest time with the pump's limit, a tank's power curve with today's point.

use super::svg::{Chart, Mark, Scale, escape, render};
use crate::rheology::band::stress_band;
use crate::session::findings_equipment::{restart_answers, tank_answers};
use crate::session::restart_chart::chart;
use crate::session::state::{Entry, SessionState, ViscometerSet};
use crate::site::Site;
use std::fmt::Write as _;

/// Points on a drawn curve.
const CURVE_POINTS: usize = 48;

pub(crate) fn figure(svg: String, caption: &str) -> String {
    format!(
        "<figure>\n{svg}<figcaption>{}</figcaption>\n</figure>\n",
        escape(caption)
    )
}

/// `n` log-spaced values from `lo` to `hi` (both above zero).
fn log_spaced(lo: f64, hi: f64, n: usize) -> Vec<f64> {
    let (a, b) = (lo.ln(), hi.ln());
    (0..n)
        .map(|i| (a + (b - a) * i as f64 / (n - 1) as f64).exp())
        .collect()
}

/// A set's flow curve chart and its readings table.
pub(crate) fn set_chart(e: &Entry<ViscometerSet>) -> String {
    let v = &e.item;
    let title = format!("Set {}: {} on {}", e.seq, v.product, v.viscometer);
    let mut out = format!("<h4>{}</h4>\n", escape(&title));
    match v.shown() {
        Ok(c) => {
            let pts: Vec<(f64, f64)> = c
                .points
                .iter()
                .map(|p| (p.shear_rate_per_s, p.shear_stress_pa))
                .collect();
            let rates = pts.iter().map(|p| p.0).filter(|r| *r > 0.0);
            let lo = rates.clone().fold(f64::INFINITY, f64::min);
            let hi = rates.fold(0.0, f64::max);
            let mut marks = Vec::new();
            if lo.is_finite() && hi > lo {
                let xs = log_spaced(lo / 1.5, hi * 1.5, CURVE_POINTS);
                let band: Vec<(f64, f64, f64)> = xs
                    .iter()
                    .filter_map(|&x| {
                        let (lo, hi) = stress_band(&c.fit, x)?;
                        // Log axes: keep the band's floor above zero.
                        Some((x, lo.max(c.fit.model.stress(x) * 0.05), hi))
                    })
                    .collect();
                if !band.is_empty() {
                    marks.push(Mark::Band(band));
                }
                marks.push(Mark::Line {
                    xy: xs.iter().map(|&x| (x, c.fit.model.stress(x))).collect(),
                    dashed: false,
                });
            }
            marks.push(Mark::Points(pts));
            let chart = Chart {
                title: title.clone(),
                x_label: "shear rate, 1/s (log)".into(),
                y_label: "shear stress, Pa (log)".into(),
                x_scale: Scale::Log,
                y_scale: Scale::Log,
                marks,
            };
            let caption = format!(
                "Points: the readings; line: the {} fit (R² {:.3}); shaded: the fit's 95 % confidence band for the curve (the parameters' covariance carried through, Student t), where it has one.",
                c.fit.model.kind().name(),
                c.fit.r_squared
            );
            out.push_str(&figure(render(&chart), &caption));
        }
        Err(err) => {
            let _ = writeln!(out, "<p>No curve: {}</p>", escape(&err.to_string()));
        }
    }
    out.push_str("<table>\n<tr><th>row</th><th>rpm</th><th>dial</th></tr>\n");
    for (i, r) in v.rows.iter().enumerate() {
        let _ = writeln!(
            out,
            "<tr><td>{}</td><td>{}</td><td>{}</td></tr>",
            i + 1,
            escape(&r.rpm_raw),
            escape(&r.dial_raw)
        );
    }
    out.push_str("</table>\n");
    out
}

/// Gel build-up against rest time for each line judged, with the pump's limit as a gel stress.
pub(crate) fn restart_charts(state: &SessionState, site: &Site) -> String {
    let mut out = String::new();
    for (subject, answer, _) in restart_answers(state, site) {
        let Some(c) = chart(&answer, false, 0.0, CURVE_POINTS) else {
            continue;
        };
        let hours = |s: f64| s / 3600.0;
        let xs: Vec<f64> = c.points.iter().map(|p| hours(p.rest_s)).collect();
        let mut marks = Vec::new();
        let band: Vec<(f64, f64, f64)> = c
            .points
            .iter()
            .filter_map(|p| p.band_pa.map(|(lo, hi)| (hours(p.rest_s), lo, hi)))
            .collect();
        if !band.is_empty() {
            marks.push(Mark::Band(band));
        }
        marks.push(Mark::Line {
            xy: c
                .points
                .iter()
                .map(|p| (hours(p.rest_s), p.stress_pa))
                .collect(),
            dashed: false,
        });
        let (x0, x1) = (
            xs.first().copied().unwrap_or(0.0),
            xs.last().copied().unwrap_or(1.0),
        );
        for level in [c.limit_gel_pa, c.allowed_gel_pa] {
            marks.push(Mark::Line {
                xy: vec![(x0, level), (x1, level)],
                dashed: true,
            });
        }
        let title = format!("Gel build-up: {subject}");
        let chart = Chart {
            title: title.clone(),
            x_label: "rest time, h".into(),
            y_label: "gel strength, Pa".into(),
            x_scale: Scale::Linear,
            y_scale: Scale::Linear,
            marks,
        };
        out.push_str("<h3>Restart after a stop</h3>\n");
        out.push_str(&figure(
            render(&chart),
            "Line: gel strength against rest time (site gel build-up); dashed: the gel the pump's limit breaks, and the same less the margin. Where the curve crosses the lower dashed line is the longest safe stop.",
        ));
    }
    out
}

/// Each tank's power-number curve with today's point.
pub(crate) fn tank_charts(state: &SessionState, site: &Site) -> String {
    let mut out = String::new();
    for (tank, a) in tank_answers(state, site) {
        let point = (a.operating.point.reynolds, a.operating.point.power_number);
        let chart = Chart {
            title: format!("Power curve: tank {}", tank.id),
            x_label: "Reynolds number (log)".into(),
            y_label: "power number (log)".into(),
            x_scale: Scale::Log,
            y_scale: Scale::Log,
            marks: vec![
                Mark::Line {
                    xy: a.chart.clone(),
                    dashed: false,
                },
                Mark::Points(vec![point]),
            ],
        };
        out.push_str("<h3>Agitated tank</h3>\n");
        out.push_str(&figure(
            render(&chart),
            "Line: the impeller's power number against Reynolds number in this tank; point: today's speed with the product's curve.",
        ));
    }
    out
}
