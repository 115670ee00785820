//! A small SVG chart writer for the HTML report: axes (log or linear), point series, lines
//! and shaded bands, all inline text.
//!
//! Our own rather than a plotting crate: the report needs a handful of static charts that
//! print crisply (vector, a few kilobytes each), byte-for-byte the same for the same inputs
//! and with every label escaped; the plotting crates we know either pull in font and raster
//! back ends or write styles and ids we could not keep stable. This writer has no
//! dependencies and no state beyond its input.

use std::fmt::Write as _;

/// How an axis maps values.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Scale {
    Linear,
    Log,
}

/// One thing drawn on a chart.
#[derive(Debug, Clone, PartialEq)]
pub enum Mark {
    /// Measured points, drawn as small circles.
    Points(Vec<(f64, f64)>),
    /// A line through the points in order; `dashed` for limits.
    Line { xy: Vec<(f64, f64)>, dashed: bool },
    /// A shaded band between a low and a high curve over the same x.
    Band(Vec<(f64, f64, f64)>),
}

/// A chart: title, axis labels and scales, the marks, and a legend line under it.
#[derive(Debug, Clone, PartialEq)]
pub struct Chart {
    pub title: String,
    pub x_label: String,
    pub y_label: String,
    pub x_scale: Scale,
    pub y_scale: Scale,
    pub marks: Vec<Mark>,
}

const W: f64 = 640.0;
const H: f64 = 360.0;
const LEFT: f64 = 70.0;
const RIGHT: f64 = 20.0;
const TOP: f64 = 30.0;
const BOTTOM: f64 = 50.0;

/// Text made safe inside XML: the five special characters escaped, control characters gone.
pub fn escape(text: &str) -> String {
    let kept = crate::text::sanitize(text, false);
    let mut out = String::with_capacity(kept.len());
    for c in kept.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&#39;"),
            c if c.is_control() => {}
            c => out.push(c),
        }
    }
    out
}

/// A number for SVG coordinates: two decimals, so the bytes are stable.
fn n(x: f64) -> String {
    format!("{x:.2}")
}

struct Axis {
    scale: Scale,
    lo: f64,
    hi: f64,
}

impl Axis {
    fn of(scale: Scale, values: impl Iterator<Item = f64>) -> Option<Axis> {
        let ok: Vec<f64> = values
            .filter(|v| v.is_finite() && (scale == Scale::Linear || *v > 0.0))
            .collect();
        let lo = ok.iter().copied().fold(f64::INFINITY, f64::min);
        let hi = ok.iter().copied().fold(f64::NEG_INFINITY, f64::max);
        if !lo.is_finite() || !hi.is_finite() {
            return None;
        }
        let (lo, hi) = match scale {
            Scale::Log => {
                let (a, b) = (lo.log10().floor(), hi.log10().ceil());
                (10f64.powf(a), 10f64.powf(if b > a { b } else { a + 1.0 }))
            }
            Scale::Linear => {
                let lo = if lo > 0.0 { 0.0 } else { lo };
                let hi = if hi > lo { hi * 1.05 } else { lo + 1.0 };
                (lo, hi)
            }
        };
        Some(Axis { scale, lo, hi })
    }

    /// 0..1 along the axis.
    fn frac(&self, v: f64) -> f64 {
        match self.scale {
            Scale::Log => (v.log10() - self.lo.log10()) / (self.hi.log10() - self.lo.log10()),
            Scale::Linear => (v - self.lo) / (self.hi - self.lo),
        }
    }

    fn ticks(&self) -> Vec<f64> {
        match self.scale {
            Scale::Log => {
                let (a, b) = (
                    self.lo.log10().round() as i32,
                    self.hi.log10().round() as i32,
                );
                (a..=b).map(|e| 10f64.powi(e)).collect()
            }
            Scale::Linear => (0..=5)
                .map(|i| self.lo + (self.hi - self.lo) * f64::from(i) / 5.0)
                .collect(),
        }
    }
}

fn tick_text(v: f64) -> String {
    crate::units::significant(v)
}

fn xs(marks: &[Mark]) -> Vec<f64> {
    marks
        .iter()
        .flat_map(|m| -> Vec<f64> {
            match m {
                Mark::Points(p) => p.iter().map(|q| q.0).collect(),
                Mark::Line { xy, .. } => xy.iter().map(|q| q.0).collect(),
                Mark::Band(b) => b.iter().map(|q| q.0).collect(),
            }
        })
        .collect()
}

fn ys(marks: &[Mark]) -> Vec<f64> {
    marks
        .iter()
        .flat_map(|m| -> Vec<f64> {
            match m {
                Mark::Points(p) => p.iter().map(|q| q.1).collect(),
                Mark::Line { xy, .. } => xy.iter().map(|q| q.1).collect(),
                Mark::Band(b) => b.iter().flat_map(|q| [q.1, q.2]).collect(),
            }
        })
        .collect()
}

/// The chart as one `<svg>` element, or a short paragraph when there is nothing to draw.
pub fn render(c: &Chart) -> String {
    let (Some(x), Some(y)) = (
        Axis::of(c.x_scale, xs(&c.marks).into_iter()),
        Axis::of(c.y_scale, ys(&c.marks).into_iter()),
    ) else {
        return format!(
            "<p class=\"nochart\">{}: nothing to draw.</p>\n",
            escape(&c.title)
        );
    };
    let px = |v: f64| LEFT + x.frac(v) * (W - LEFT - RIGHT);
    let py = |v: f64| H - BOTTOM - y.frac(v) * (H - TOP - BOTTOM);
    let drawable = |(a, b): (f64, f64)| {
        a.is_finite()
            && b.is_finite()
            && (x.scale == Scale::Linear || a > 0.0)
            && (y.scale == Scale::Linear || b > 0.0)
    };
    let mut s = format!(
        "<svg class=\"chart\" viewBox=\"0 0 {W} {H}\" width=\"{W}\" height=\"{H}\" role=\"img\" aria-label=\"{}\">\n",
        escape(&c.title)
    );
    let _ = writeln!(s, "<title>{}</title>", escape(&c.title));
    let _ = writeln!(
        s,
        "<rect x=\"{}\" y=\"{}\" width=\"{}\" height=\"{}\" fill=\"none\" stroke=\"#444\"/>",
        n(LEFT),
        n(TOP),
        n(W - LEFT - RIGHT),
        n(H - TOP - BOTTOM)
    );
    for t in x.ticks() {
        let p = px(t);
        let _ = writeln!(
            s,
            "<line x1=\"{0}\" y1=\"{1}\" x2=\"{0}\" y2=\"{2}\" stroke=\"#ddd\"/><text x=\"{0}\" y=\"{3}\" font-size=\"11\" text-anchor=\"middle\">{4}</text>",
            n(p),
            n(TOP),
            n(H - BOTTOM),
            n(H - BOTTOM + 15.0),
            escape(&tick_text(t))
        );
    }
    for t in y.ticks() {
        let p = py(t);
        let _ = writeln!(
            s,
            "<line x1=\"{0}\" y1=\"{1}\" x2=\"{2}\" y2=\"{1}\" stroke=\"#ddd\"/><text x=\"{3}\" y=\"{4}\" font-size=\"11\" text-anchor=\"end\">{5}</text>",
            n(LEFT),
            n(p),
            n(W - RIGHT),
            n(LEFT - 5.0),
            n(p + 4.0),
            escape(&tick_text(t))
        );
    }
    for m in &c.marks {
        match m {
            Mark::Band(b) => {
                let ok: Vec<_> = b
                    .iter()
                    .filter(|q| drawable((q.0, q.1)) && drawable((q.0, q.2)))
                    .collect();
                if ok.len() > 1 {
                    let mut pts: Vec<String> = ok
                        .iter()
                        .map(|q| format!("{},{}", n(px(q.0)), n(py(q.2))))
                        .collect();
                    pts.extend(
                        ok.iter()
                            .rev()
                            .map(|q| format!("{},{}", n(px(q.0)), n(py(q.1)))),
                    );
                    let _ = writeln!(
                        s,
                        "<polygon class=\"band\" points=\"{}\" fill=\"#9ecae1\" fill-opacity=\"0.5\" stroke=\"none\"/>",
                        pts.join(" ")
                    );
                }
            }
            Mark::Line { xy, dashed } => {
                let pts: Vec<String> = xy
                    .iter()
                    .copied()
                    .filter(|&q| drawable(q))
                    .map(|q| format!("{},{}", n(px(q.0)), n(py(q.1))))
                    .collect();
                if pts.len() > 1 {
                    let dash = if *dashed {
                        " stroke-dasharray=\"6 4\""
                    } else {
                        ""
                    };
                    let _ = writeln!(
                        s,
                        "<polyline class=\"line\" points=\"{}\" fill=\"none\" stroke=\"#08519c\" stroke-width=\"1.5\"{dash}/>",
                        pts.join(" ")
                    );
                }
            }
            Mark::Points(p) => {
                for &q in p.iter().filter(|&&q| drawable(q)) {
                    let _ = writeln!(
                        s,
                        "<circle class=\"point\" cx=\"{}\" cy=\"{}\" r=\"3\" fill=\"#d94801\"/>",
                        n(px(q.0)),
                        n(py(q.1))
                    );
                }
            }
        }
    }
    let _ = writeln!(
        s,
        "<text x=\"{}\" y=\"{}\" font-size=\"12\" text-anchor=\"middle\">{}</text>",
        n(LEFT + (W - LEFT - RIGHT) / 2.0),
        n(H - 12.0),
        escape(&c.x_label)
    );
    let _ = writeln!(
        s,
        "<text x=\"14\" y=\"{}\" font-size=\"12\" text-anchor=\"middle\" transform=\"rotate(-90 14 {})\">{}</text>",
        n(TOP + (H - TOP - BOTTOM) / 2.0),
        n(TOP + (H - TOP - BOTTOM) / 2.0),
        escape(&c.y_label)
    );
    let _ = writeln!(
        s,
        "<text x=\"{}\" y=\"18\" font-size=\"13\" font-weight=\"bold\">{}</text>",
        n(LEFT),
        escape(&c.title)
    );
    s.push_str("</svg>\n");
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn escape_keeps_markup_out() {
        assert_eq!(escape("<b>&\"'\u{7}"), "&lt;b&gt;&amp;&quot;&#39;");
    }

    #[test]
    fn a_log_axis_spans_whole_decades() {
        let a = Axis::of(Scale::Log, [3.0, 450.0].into_iter()).unwrap();
        assert_eq!((a.lo, a.hi), (1.0, 1000.0));
        assert_eq!(a.ticks(), vec![1.0, 10.0, 100.0, 1000.0]);
        assert!((a.frac(10.0) - 1.0 / 3.0).abs() < 1e-12);
    }
}
