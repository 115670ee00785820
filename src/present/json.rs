//! The flow curve as JSON, SI throughout. The key names are a contract with scripts outside
//! the project (`rheoside fit --json`, journalled results, the JSON report): add keys, never
//! rename them.

use super::Style;
use crate::rheology::Weighting;
use crate::session::{FlowCurve, FlowCurveOptions};
use serde_json::{Map, Value, json};

/// The `--json` object. Key names are a contract with outside scripts: add keys, never rename.
pub fn curve_json(curve: &FlowCurve, opts: &FlowCurveOptions, temperature_k: Option<f64>) -> Value {
    let fit = &curve.fit;
    let mut params = Map::new();
    let mut ci95 = Map::new();
    for e in &fit.estimates {
        params.insert(e.name.json_key().into(), finite(e.value));
        ci95.insert(
            e.name.json_key().into(),
            e.ci95
                .map_or(Value::Null, |(lo, hi)| json!([finite(lo), finite(hi)])),
        );
    }
    json!({
        "model": fit.model.kind().name(),
        "params": params,
        "ci95": ci95,
        "r_squared": finite(fit.r_squared),
        "rmse_pa": finite(fit.rmse_pa),
        "aicc": fit.aicc.map_or(Value::Null, finite),
        "reason": super::reason::for_curve(curve, Style::SI),
        "dof": fit.dof,
        "weighting": match opts.weighting { Weighting::Unweighted => "none", Weighting::Relative => "relative" },
        "rate_correction": opts.rate_correction,
        "temperature_k": temperature_k.map_or(Value::Null, finite),
        "candidates": candidates_json(curve),
        "points": points_json(curve),
        "warnings": curve.warnings,
    })
}

/// NaN or infinity never reaches the output: JSON has no such numbers.
pub fn finite(x: f64) -> Value {
    if x.is_finite() { json!(x) } else { Value::Null }
}

fn candidates_json(curve: &FlowCurve) -> Value {
    let Some(choice) = &curve.choice else {
        return json!([]);
    };
    Value::Array(
        choice
            .candidates
            .iter()
            .map(|c| match &c.outcome {
                Ok(fit) => json!({
                    "model": c.kind.name(),
                    "aicc": fit.aicc.map_or(Value::Null, finite),
                    "r_squared": finite(fit.r_squared),
                }),
                Err(e) => json!({
                    "model": c.kind.name(),
                    "aicc": Value::Null,
                    "r_squared": Value::Null,
                    "error": e.to_string(),
                }),
            })
            .collect(),
    )
}

fn points_json(curve: &FlowCurve) -> Value {
    Value::Array(
        curve
            .points
            .iter()
            .map(|p| {
                json!({
                    "rpm": p.rpm.map_or(Value::Null, finite),
                    "dial": p.dial.map_or(Value::Null, finite),
                    "newtonian_shear_rate_per_s": finite(p.newtonian_shear_rate_per_s),
                    "shear_rate_per_s": finite(p.shear_rate_per_s),
                    "shear_stress_pa": finite(p.shear_stress_pa),
                    "flags": p.flags,
                })
            })
            .collect(),
    )
}
