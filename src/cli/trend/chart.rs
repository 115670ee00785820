//! The `trend` chart: one limited property (K, n, τ0 or the apparent viscosity) per set as
//! ASCII columns with the limit lines, so it reads the same over any SSH link or terminal font.

use crate::present::limits::{rate_text, value_text};
use crate::session::trend::{SessionPoint, Trend};
use crate::session::trend_property::property_value;
use crate::site::{LimitProperty, Product};
use crate::units::UnitSystem;
use std::fmt::Write as _;

/// Widest plot area in columns; more sessions share a column.
const MAX_COLUMNS: usize = 60;
const HEIGHT: usize = 10;
const LABEL: usize = 11;

/// One column of the chart: the highest value of its sets, and whether any is out of spec.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Column {
    value: Option<f64>,
    out: bool,
}

/// The chart, or a line saying why there is none. Pure ASCII.
pub fn chart(
    trend: &Trend,
    product: &Product,
    system: UnitSystem,
    property: LimitProperty,
) -> String {
    let per = trend.points.len().div_ceil(MAX_COLUMNS).max(1);
    let columns: Vec<Column> = trend
        .points
        .chunks(per)
        .map(|c| column(c, property))
        .collect();
    let limits = property_limits(product, property);
    let label = |v: f64| ascii_value(property, v, system);
    let highest = columns
        .iter()
        .filter_map(|c| c.value)
        .chain(limits.iter().copied())
        .fold(0.0_f64, f64::max);
    if columns.is_empty() || !(highest > 0.0 && highest.is_finite()) {
        return format!(
            "\n(no chart of {}: no fitted set in the window has a value above zero)\n",
            property_title(property)
        );
    }
    let top = highest * 1.1;
    let mut out = title(property, per, &limits, &label);
    let limit_rows: Vec<(usize, f64)> = limits.iter().map(|&l| (level(l, top), l)).collect();
    for r in (1..=HEIGHT).rev() {
        out.push_str(&plot_row(r, &columns, &limit_rows, top, &label));
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

fn column(points: &[SessionPoint], property: LimitProperty) -> Column {
    let fitted = points.iter().filter_map(|p| p.outcome.as_ref().ok());
    let value = fitted
        .clone()
        .filter_map(|c| property_value(c, property))
        .reduce(f64::max);
    Column {
        value,
        out: fitted.clone().any(|c| c.is_out()),
    }
}

/// The bounds of every limit on this property (the apparent viscosity at the same rate).
fn property_limits(product: &Product, property: LimitProperty) -> Vec<f64> {
    product
        .limits
        .iter()
        .filter(|l| l.property == property)
        .flat_map(|l| [l.min, l.max])
        .flatten()
        .collect()
}

/// The chart's name for the property, ASCII.
fn property_title(property: LimitProperty) -> String {
    match property {
        LimitProperty::ConsistencyIndex => "Consistency index K".to_string(),
        LimitProperty::FlowIndex => "Flow behaviour index n".to_string(),
        LimitProperty::YieldStress => "Yield stress tau0".to_string(),
        LimitProperty::ApparentViscosity { shear_rate_per_s } => {
            format!("Apparent viscosity at {}", rate_text(shear_rate_per_s))
        }
    }
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

fn title(
    property: LimitProperty,
    per: usize,
    limits: &[f64],
    label: &dyn Fn(f64) -> String,
) -> String {
    let spread = if per == 1 {
        "one column per set".to_string()
    } else {
        format!("one column per {per} sets, the highest shown")
    };
    let lines = if limits.is_empty() {
        "no limit on it".to_string()
    } else {
        let shown: Vec<String> = limits.iter().map(|&l| label(l)).collect();
        format!(
            "'-' marks the limits {} ('=' across a bar)",
            shown.join(" and ")
        )
    };
    format!(
        "\n{}, {spread}, oldest left.\n{lines}; '?' no fit; '^' a set out of any limit.\n",
        property_title(property)
    )
}

fn plot_row(
    r: usize,
    columns: &[Column],
    limits: &[(usize, f64)],
    top: f64,
    value_label: &dyn Fn(f64) -> String,
) -> String {
    let on_limit = limits.iter().find(|(l, _)| *l == r);
    let label = match on_limit {
        Some((_, v)) => value_label(*v),
        None if r == HEIGHT => value_label(top * r as f64 / HEIGHT as f64),
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

/// A value in site units with non-ASCII spellings replaced, for the chart only.
fn ascii_value(property: LimitProperty, si: f64, system: UnitSystem) -> String {
    value_text(property, si, crate::present::Style::new(system, true))
}
