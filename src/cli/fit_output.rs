//! Printing a fitted flow curve: the human table (site units) and the `--json` contract (SI).

use crate::present::{self, Style};
use crate::rheology::{Estimate, Fit};
use crate::session::FlowCurve;
use crate::session::temperature::TemperatureSeries;
use crate::units::{Dimension, significant};
use serde_json::{Map, Value, json};
use std::fmt::Write as _;

/// The one temperature the readings were taken at, if the CSV says and all rows agree (±0.05 K).
pub fn single_temperature(temps_k: Option<&[f64]>) -> Option<f64> {
    let temps = temps_k?;
    let first = *temps.first()?;
    temps
        .iter()
        .all(|t| (t - first).abs() <= 0.05)
        .then_some(first)
}

pub use crate::present::json::{curve_json as json, finite};

/// The human-readable result, in the site's unit system.
pub fn table(curve: &FlowCurve, style: Style, temperature_k: Option<f64>) -> String {
    let fit = &curve.fit;
    let mut out = String::new();
    let _ = writeln!(out, "Flow curve: {}", fit.model.kind().title());
    if let Some(t) = temperature_k {
        let _ = writeln!(
            out,
            "  at {}",
            present::quantity(t, Dimension::Temperature, style)
        );
    }
    let _ = writeln!(out, "  why: {}", present::reason::for_curve(curve, style));
    out.push('\n');
    let _ = writeln!(out, "  {:<24} {:>22}", "parameter", "value ± 95 % interval");
    for e in &fit.estimates {
        let _ = writeln!(out, "{}", estimate_row(e, style));
    }
    out.push('\n');
    let _ = writeln!(out, "{}", quality_line(fit, style));
    out.push_str(&candidates_table(curve));
    out.push_str(&points_table(curve, style));
    out.push_str(&super::fit_extra::sections(curve, style));
    for w in &curve.warnings {
        let _ = writeln!(out, "  ! {w}");
    }
    out.push_str(
        "\nAdvice only: confirm against the plant's own procedures before acting on it.\n",
    );
    style.text(&out)
}

fn estimate_row(e: &Estimate, style: Style) -> String {
    let label = format!("{} {}", present::symbol(e.name, style), e.name.label());
    format!("  {label:<24} {:>22}", present::estimate(e, style))
}

fn quality_line(fit: &Fit, style: Style) -> String {
    let aicc = fit
        .aicc
        .map_or("not available".to_string(), present::reason::fmt_aicc);
    format!(
        "  fit quality: R² {}   RMSE {}   AICc {aicc}   degrees of freedom {}",
        present::r_squared(fit.r_squared),
        present::quantity(fit.rmse_pa, Dimension::Stress, style),
        fit.dof
    )
}

fn candidates_table(curve: &FlowCurve) -> String {
    let Some(choice) = &curve.choice else {
        return String::new();
    };
    let mut out = String::from("\n  models compared (lower AICc is better):\n");
    for c in &choice.candidates {
        let line = match &c.outcome {
            Ok(fit) => format!(
                "    {:<18} AICc {:>9}   R² {}",
                c.kind.title(),
                fit.aicc.map_or("—".to_string(), present::reason::fmt_aicc),
                present::r_squared(fit.r_squared)
            ),
            Err(e) => format!("    {:<18} not fitted: {e}", c.kind.title()),
        };
        let _ = writeln!(out, "{line}");
    }
    out
}

fn points_table(curve: &FlowCurve, style: Style) -> String {
    let mut out = String::from("\n  readings:\n");
    let _ = writeln!(
        out,
        "    {:>3} {:>7} {:>7} {:>15} {:>15} {:>15}  flags",
        "#", "rpm", "dial", "Newtonian rate", "rate used", "stress"
    );
    for p in &curve.points {
        let opt = |v: Option<f64>| v.map_or("—".to_string(), significant);
        let row = format!(
            "    {:>3} {:>7} {:>7} {:>15} {:>15} {:>15}  {}",
            p.row,
            opt(p.rpm),
            opt(p.dial),
            present::quantity(p.newtonian_shear_rate_per_s, Dimension::ShearRate, style),
            present::quantity(p.shear_rate_per_s, Dimension::ShearRate, style),
            present::quantity(p.shear_stress_pa, Dimension::Stress, style),
            p.flags.join(", ")
        );
        let _ = writeln!(out, "{}", row.trim_end());
    }
    out
}

/// Extra keys for readings at several temperatures (added beside the contract keys).
pub fn add_series_json(value: &mut Value, series: &TemperatureSeries) {
    let curves: Vec<Value> = series
        .curves
        .iter()
        .map(|c| {
            let params: Map<String, Value> = c
                .curve
                .fit
                .estimates
                .iter()
                .map(|e| (e.name.json_key().to_string(), finite(e.value)))
                .collect();
            json!({
                "temperature_k": finite(c.temperature_k),
                "model": c.curve.fit.model.kind().name(),
                "params": params,
                "r_squared": finite(c.curve.fit.r_squared),
            })
        })
        .collect();
    let activation = match &series.activation {
        Ok(a) => json!({
            "parameter": series.parameter.json_key(),
            "ea_j_per_mol": finite(a.ea_j_per_mol),
            "ci95": a.ci95.map_or(Value::Null, |(lo, hi)| json!([finite(lo), finite(hi)])),
            "reference_temperature_k": finite(series.reference_k),
            "value_at_reference": finite(a.value_at_ref),
        }),
        Err(e) => json!({ "error": e.to_string() }),
    };
    if let Value::Object(map) = value {
        map.insert("temperatures".into(), Value::Array(curves));
        map.insert("activation_energy".into(), activation);
    }
}

/// The per-temperature summary and the activation energy, for the human table.
pub fn series_table(series: &TemperatureSeries, style: Style) -> String {
    let mut out = format!(
        "\nAt each temperature ({} throughout, so the constants compare):\n",
        series.model.title()
    );
    for c in &series.curves {
        let params: Vec<String> = c
            .curve
            .fit
            .estimates
            .iter()
            .map(|e| {
                format!(
                    "{} {}",
                    present::symbol(e.name, style),
                    present::param_text(e.name, e.value, style)
                )
            })
            .collect();
        let _ = writeln!(
            out,
            "  {:>9}   {}   R² {}",
            present::quantity(c.temperature_k, Dimension::Temperature, style),
            params.join("   "),
            present::r_squared(c.curve.fit.r_squared)
        );
    }
    let _ = match &series.activation {
        Ok(a) => writeln!(
            out,
            "  activation energy of {}: {:.1} kJ/mol{}",
            series.parameter.symbol(),
            a.ea_j_per_mol / 1000.0,
            a.ci95.map_or(
                " (two temperatures: no interval)".to_string(),
                |(lo, hi)| { format!(", 95 % CI {:.1} to {:.1} kJ/mol", lo / 1000.0, hi / 1000.0) }
            )
        ),
        Err(e) => writeln!(out, "  activation energy not fitted: {e}"),
    };
    out
}
