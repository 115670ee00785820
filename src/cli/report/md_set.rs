//! One viscometer set in the Markdown handover: its rows, the recomputed fit with 95 %
//! intervals, the spec limits, and what was saved at the time.

use super::md::{byline, cell};
use super::seen::{Agreement, compare, seen_for, seen_text};
use crate::cli::fit_output::param_text;
use crate::cli::trend::text::{check_text, describe_limit, rate_text, value_text};
use crate::rheology::{Estimate, Fit};
use crate::session::FlowCurve;
use crate::session::state::{Entry, SessionState, ViscometerSet};
use crate::session::trend::{LimitStatus, at_reference, check_limits, spec_rate};
use crate::site::Site;
use crate::units::{self, Dimension, UnitSystem};
use std::fmt::Write as _;

pub(crate) fn set_section(site: &Site, e: &Entry<ViscometerSet>, s: &SessionState) -> String {
    let set = &e.item;
    let system = site.unit_system;
    let mut out = format!(
        "\n#### Set at record {}: {} on {}, {}\n\n",
        e.seq,
        cell(&set.product),
        cell(&set.viscometer),
        temperature(set, system)
    );
    let _ = writeln!(out, "Recorded: {}.\n", byline(e));
    out.push_str("| row | rpm | dial |\n|---:|---:|---:|\n");
    for (i, r) in set.rows.iter().enumerate() {
        let _ = writeln!(
            out,
            "| {} | {} | {} |",
            i + 1,
            cell(&r.rpm_raw),
            cell(&r.dial_raw)
        );
    }
    match &set.curve {
        Ok(curve) => out.push_str(&curve_text(site, set, curve)),
        Err(why) => {
            let _ = writeln!(out, "\nNo flow curve: {}.", cell(&why.to_string()));
        }
    }
    out.push_str(&seen(e, s, system));
    out
}

fn temperature(set: &ViscometerSet, system: UnitSystem) -> String {
    match (set.temperature_k, &set.temperature_raw) {
        (Some(k), _) => format!("at {}", units::format(k, Dimension::Temperature, system)),
        (None, Some(raw)) => format!("at {}", cell(raw)),
        (None, None) => "temperature not recorded".to_string(),
    }
}

fn curve_text(site: &Site, set: &ViscometerSet, curve: &FlowCurve) -> String {
    let system = site.unit_system;
    let fit = &curve.fit;
    let mut out = format!(
        "\nFlow curve recomputed from these readings: **{}**. Why: {}\n\n",
        fit.model.kind().title(),
        cell(&curve.reason)
    );
    out.push_str("| parameter | value | 95 % confidence interval |\n|---|---:|---|\n");
    for est in &fit.estimates {
        out.push_str(&estimate_row(est, system));
    }
    let _ = writeln!(out, "\n{}", quality(fit, system));
    let product = site.product(&set.product);
    let rate = product.map_or(crate::session::trend::DEFAULT_RATE_PER_S, spec_rate);
    let _ = writeln!(
        out,
        "Apparent viscosity at {}: {}.",
        rate_text(rate),
        units::format(
            curve.apparent_viscosity_at(rate),
            Dimension::DynamicViscosity,
            system
        )
    );
    for w in &curve.warnings {
        let _ = writeln!(out, "- Warning: {}", cell(w));
    }
    match product {
        Some(p) => out.push_str(&limits(p, fit, set.temperature_k, system)),
        None => {
            let _ = writeln!(
                out,
                "\nProduct '{}' is not in the site config: no spec limits to check.",
                cell(&set.product)
            );
        }
    }
    out
}

fn estimate_row(e: &Estimate, system: UnitSystem) -> String {
    let ci = match e.ci95 {
        Some((lo, hi)) => format!(
            "{} to {}",
            param_text(e.name, lo, system),
            param_text(e.name, hi, system)
        ),
        None => format!(
            "not available: {}",
            e.no_ci.map_or("no interval", |w| w.explain())
        ),
    };
    format!(
        "| {} {} | {} | {ci} |\n",
        e.name.symbol(),
        e.name.label(),
        param_text(e.name, e.value, system)
    )
}

fn quality(fit: &Fit, system: UnitSystem) -> String {
    let aicc = fit
        .aicc
        .map_or("not available".to_string(), |a| format!("{a:.2}"));
    format!(
        "Fit quality: R² {}, RMSE {}, AICc {aicc}, degrees of freedom {}.",
        crate::session::checks::r_squared_text(fit.r_squared, 5),
        units::format(fit.rmse_pa, Dimension::Stress, system),
        fit.dof
    )
}

fn limits(
    product: &crate::site::Product,
    fit: &Fit,
    temperature_k: Option<f64>,
    system: UnitSystem,
) -> String {
    let (model, shifted_to) = at_reference(product, &fit.model, temperature_k);
    let basis = match shifted_to {
        Some(t) => format!(
            "K or the viscosity shifted to {} by the product's activation energy",
            units::format(t, Dimension::Temperature, system)
        ),
        None => "checked as measured, at the set's temperature".to_string(),
    };
    let mut out = format!("\nSpec limits of {} ({basis}):\n\n", product.name);
    if product.limits.is_empty() {
        out.push_str("- none set in the site config\n");
    }
    for c in check_limits(&product.limits, &model) {
        let verdict = match c.status {
            LimitStatus::Above | LimitStatus::Below => {
                format!("**OUT**: {}", check_text(&c, system))
            }
            LimitStatus::Within => "within".to_string(),
            LimitStatus::NotChecked => check_text(&c, system),
        };
        let value = c.value.map_or(String::new(), |v| {
            format!(" ({})", value_text(c.limit.property, v, system))
        });
        let _ = writeln!(
            out,
            "- {}: {verdict}{value}",
            describe_limit(&c.limit, system)
        );
    }
    out
}

/// What the journal says was shown at the time, against the recomputed fit.
fn seen(e: &Entry<ViscometerSet>, s: &SessionState, system: UnitSystem) -> String {
    let mut out = String::new();
    for r in seen_for(e.seq, &s.sets, &s.results) {
        let agreement = match compare(&r.item.data, e.item.curve.as_ref().ok()) {
            Agreement::Same => "the same as recomputed".to_string(),
            Agreement::Differs(why) => {
                format!("**differs** from the recomputed fit: {}", cell(&why))
            }
            Agreement::NotComparable => "not comparable with the recomputed fit".to_string(),
        };
        let _ = writeln!(
            out,
            "\nSeen at the time ({}): {}; {agreement}.",
            byline(r),
            cell(&seen_text(&r.item.data, system))
        );
    }
    out
}
