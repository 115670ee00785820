//! The `trend` chart: apparent viscosity per session as ASCII columns with the limit lines,
//! so it reads the same over any SSH link or terminal font.

use crate::present::limits::rate_text;
use crate::session::trend::{SessionPoint, Trend};
use crate::site::{LimitProperty, Product};
use crate::units::{self, Dimension, UnitSystem};
use std::fmt::Write as _;

/// Widest plot area in columns; more sessions share a column.
const MAX_COLUMNS: usize = 60;
const HEIGHT: usize = 10;
const LABEL: usize = 11;

/// One column of the chart: the highest μa of its sessions, and whether any is out.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Column {
    value: Option<f64>,
    out: bool,
}

/// The chart, or a line saying why there is none. Pure ASCII.
pub fn chart(trend: &Trend, product: &Product, system: UnitSystem) -> String {
    let per = trend.points.len().div_ceil(MAX_COLUMNS).max(1);
    let columns: Vec<Column> = trend.points.chunks(per).map(column).collect();
    let limits = viscosity_limits(product, trend.rate_per_s);
    let highest = columns
        .iter()
        .filter_map(|c| c.value)
        .chain(limits.iter().copied())
        .fold(0.0_f64, f64::max);
    if columns.is_empty() || !(highest > 0.0 && highest.is_finite()) {
        return "\n(no chart: no fitted session in the window)\n".to_string();
    }
    let top = highest * 1.1;
    let mut out = title(trend, per, &limits, system);
    let limit_rows: Vec<(usize, f64)> = limits.iter().map(|&l| (level(l, top), l)).collect();
    for r in (1..=HEIGHT).rev() {
        out.push_str(&plot_row(r, &columns, &limit_rows, top, system));
    }
    let _ = writeln!(out, "{:>LABEL$} +{}", "0", "-".repeat(columns.len()));
    if columns.iter().any(|c| c.out) {
        let marks: String = columns
            .iter()
            .map(|c| if c.out { '^' } else { ' ' })
            .collect();
        let _ = writeln!(out, "{:>LABEL$}  {marks}", "OUT");
    }
    out.push_str(&date_row(trend, columns.len()));
    out
}

fn column(points: &[SessionPoint]) -> Column {
    let fitted = points.iter().filter_map(|p| p.outcome.as_ref().ok());
    let value = fitted
        .clone()
        .map(|c| c.mu_a_pa_s)
        .filter(|v| v.is_finite())
        .reduce(f64::max);
    Column {
        value,
        out: fitted.clone().any(|c| c.is_out()),
    }
}

/// The bounds of every apparent-viscosity limit stated at the chart's shear rate.
fn viscosity_limits(product: &Product, rate: f64) -> Vec<f64> {
    product
        .limits
        .iter()
        .filter(|l| matches!(l.property, LimitProperty::ApparentViscosity { shear_rate_per_s } if shear_rate_per_s == rate))
        .flat_map(|l| [l.min, l.max])
        .flatten()
        .collect()
}

/// Row 1..=HEIGHT a value reaches; anything above zero shows at least one mark.
fn level(v: f64, top: f64) -> usize {
    let l = (v / top * HEIGHT as f64).round();
    if v > 0.0 {
        (l as usize).clamp(1, HEIGHT)
    } else {
        0
    }
}

fn title(trend: &Trend, per: usize, limits: &[f64], system: UnitSystem) -> String {
    let spread = if per == 1 {
        "one column per session".to_string()
    } else {
        format!("one column per {per} sessions, the highest shown")
    };
    let lines = if limits.is_empty() {
        "no viscosity limit at this rate".to_string()
    } else {
        let shown: Vec<String> = limits.iter().map(|&l| ascii_viscosity(l, system)).collect();
        format!(
            "'-' marks the limits {} ('=' across a bar)",
            shown.join(" and ")
        )
    };
    format!(
        "\nApparent viscosity at {}, {spread}, oldest left.\n{lines}; '?' no fit.\n",
        rate_text(trend.rate_per_s)
    )
}

fn plot_row(
    r: usize,
    columns: &[Column],
    limits: &[(usize, f64)],
    top: f64,
    system: UnitSystem,
) -> String {
    let on_limit = limits.iter().find(|(l, _)| *l == r);
    let label = match on_limit {
        Some((_, v)) => ascii_viscosity(*v, system),
        None if r == HEIGHT => ascii_viscosity(top * r as f64 / HEIGHT as f64, system),
        None => String::new(),
    };
    let cells: String = columns
        .iter()
        .map(|c| {
            let bar = c.value.is_some_and(|v| level(v, top) >= r);
            match (bar, on_limit.is_some()) {
                (true, true) => '=',
                (true, false) => '#',
                (false, true) => '-',
                (false, false) if c.value.is_none() && r == 1 => '?',
                (false, false) => ' ',
            }
        })
        .collect();
    format!("{label:>LABEL$} |{cells}\n")
}

fn date_row(trend: &Trend, width: usize) -> String {
    let (Some(first), Some(last)) = (trend.points.first(), trend.points.last()) else {
        return String::new();
    };
    let a = first.at.local().format("%Y-%m-%d").to_string();
    let b = last.at.local().format("%Y-%m-%d").to_string();
    let gap = width.saturating_sub(a.len() + b.len()).max(1);
    format!("{:LABEL$}  {a}{}{b}\n", "", " ".repeat(gap))
}

/// Viscosity text with any non-ASCII unit spelling replaced, for the chart only.
fn ascii_viscosity(si: f64, system: UnitSystem) -> String {
    units::format(si, Dimension::DynamicViscosity, system)
        .chars()
        .map(|c| if c.is_ascii() { c } else { '?' })
        .collect()
}
