//! The `trend` table: one row per session, out-of-limit sessions marked in words.

use super::scan::ScanCounts;
use crate::present::Style;
use crate::present::limits::{describe_limits, out_text, param_cell, rate_text, unchecked_text};
use crate::rheology::{ModelKind, ParamName};
use crate::session::trend::{Constants, SessionPoint, Trend};
use crate::site::{Product, Site};
use crate::text::sanitize;
use crate::units::{self, Dimension, UnitSystem};
use std::fmt::Write as _;

/// The heading: which product, which site, which window, its limits.
pub fn heading(site: &Site, product: &Product, trend: &Trend, since_text: &str) -> String {
    let system = site.unit_system;
    let mut out = String::new();
    let _ = writeln!(
        out,
        "Trend of {} ({}) at {} ({})",
        product.name,
        sanitize(&product.description, false),
        sanitize(&site.name, false),
        site.id
    );
    let _ = writeln!(
        out,
        "Sessions with a viscometer set of it since {} UTC (--since {}): {}",
        trend.since.format("%Y-%m-%d %H:%M"),
        sanitize(since_text, false),
        trend.points.len()
    );
    let _ = writeln!(
        out,
        "Spec limits: {}",
        describe_limits(&product.limits, Style::new(system, false))
    );
    out
}

/// The table of sessions, oldest first, with a legend.
pub fn table(trend: &Trend, system: UnitSystem) -> String {
    let mut out = String::new();
    if trend.points.is_empty() {
        out.push_str("\nNo session in the window has a viscometer set of this product.\n");
        return out;
    }
    let mu_head = format!("μa at {}", rate_text(trend.rate_per_s));
    let _ = writeln!(
        out,
        "\n    {:<16} {:<12} {:<7} {:<8} {:<13} {:<6} {mu_head}",
        "local time", "operator", "model", "τ0", "K", "n"
    );
    for p in &trend.points {
        out.push_str(&row(p, system));
    }
    out.push_str("\n* fixed by the model's form (e.g. n = 1 for Bingham), not fitted.\n");
    out.push_str(&temperature_legend(trend, system));
    out
}

/// Say which rows were brought to the reference temperature and which are as measured.
fn temperature_legend(trend: &Trend, system: UnitSystem) -> String {
    let shifted: Vec<f64> = trend.points.iter().filter_map(|p| p.shifted_to_k).collect();
    let mut out = String::from("Each row is one set of this product in the window");
    match shifted.first() {
        Some(t_ref) if shifted.len() == trend.points.len() => out.push_str(&format!(
            ";\nK (or the viscosity) and μa shifted to {} by the product's activation energy,\n\
             τ0 and n as measured.\n",
            crate::units::format(*t_ref, crate::units::Dimension::Temperature, system)
        )),
        Some(t_ref) => out.push_str(&format!(
            ";\nrows with a temperature are shifted to {} by the product's activation energy\n\
             (K or the viscosity, and μa); rows without one are as measured.\n",
            crate::units::format(*t_ref, crate::units::Dimension::Temperature, system)
        )),
        None => out.push_str(
            ", as measured:\nat the set's temperature, not shifted (no temperature or no\n\
             activation energy for the product in the site config).\n",
        ),
    }
    out
}

fn row(p: &SessionPoint, system: UnitSystem) -> String {
    let when = p.at.local().format("%Y-%m-%d %H:%M").to_string();
    let operator: String = sanitize(&p.operator, false).chars().take(12).collect();
    match &p.outcome {
        Ok(c) => fitted_row(&when, &operator, c, system),
        Err(why) => format!(
            "    {when:<16} {operator:<12} no fit: {}\n",
            sanitize(why, false)
        ),
    }
}

fn fitted_row(when: &str, operator: &str, c: &Constants, system: UnitSystem) -> String {
    let out = out_text(&c.checks, Style::new(system, false));
    let mark = if out.is_some() { "OUT" } else { "" };
    let mut line = format!(
        "{mark:<3} {when:<16} {operator:<12} {:<7} {:<8} {:<13} {:<6} {}\n",
        model_short(c.model.kind()),
        param_cell(ParamName::Tau0, c.tau0, Style::new(system, false)),
        param_cell(ParamName::K, c.k, Style::new(system, false)),
        param_cell(ParamName::N, c.n, Style::new(system, false)),
        units::format(c.mu_a_pa_s, Dimension::DynamicViscosity, system),
    );
    if let Some(text) = out {
        let _ = writeln!(line, "      {text}");
    }
    if let Some(text) = unchecked_text(&c.checks, Style::new(system, false)) {
        let _ = writeln!(line, "      {text}");
    }
    line
}

/// A model name that fits the column.
pub fn model_short(kind: ModelKind) -> &'static str {
    match kind {
        ModelKind::Newtonian => "Newton",
        ModelKind::PowerLaw => "power",
        ModelKind::Bingham => "Bingham",
        ModelKind::HerschelBulkley => "H-B",
        ModelKind::Casson => "Casson",
    }
}

/// What was read and what was skipped, so nothing is left out silently.
pub fn footer(trend: &Trend, scan: &ScanCounts) -> String {
    let mut out = String::new();
    let site_journals = scan.journals.saturating_sub(trend.other_site);
    let _ = write!(out, "\nRead {site_journals} journal(s) of this site");
    let mut skipped = Vec::new();
    if trend.other_site > 0 {
        skipped.push(format!("{} of another site", trend.other_site));
    }
    let not_journal = scan.not_journal + trend.not_journal;
    if not_journal > 0 {
        skipped.push(format!(
            "{not_journal} file(s) that are not session journals"
        ));
    }
    if !skipped.is_empty() {
        let _ = write!(out, "; skipped {}", skipped.join(" and "));
    }
    out.push_str(".\n");
    if scan.bad_lines > 0 {
        let _ = writeln!(
            out,
            "{} line(s) could not be read (a cut-off last line, or damage) and were skipped.",
            scan.bad_lines
        );
    }
    for u in &scan.unreadable {
        let _ = writeln!(out, "Could not read {}", sanitize(u, false));
    }
    out.push_str(
        "Advice only: the tool does not certify product; act on the plant's own QC procedure.\n",
    );
    out
}
