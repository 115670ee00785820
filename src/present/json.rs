//! The flow curve as JSON, SI throughout. The key names are a contract with scripts outside
//! the project (`rheoside fit --json`, journalled results, the JSON report): add keys, never
//! rename them.

use super::Style;
use crate::session::api_rp13d::{ApiRp13d, CONVERSION_NOTE};
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
        "weighting": opts.weighting.name(),
        "rate_correction": opts.rate_correction,
        "temperature_k": temperature_k.map_or(Value::Null, finite),
        "candidates": candidates_json(curve),
        "points": points_json(curve),
        "warnings": curve.warnings,
        "left_out": left_out_json(curve),
        "concerns": concerns_json(curve),
        "api_rp13d": curve.api_rp13d.as_ref().map_or(Value::Null, api_json),
    })
}

/// Readings left out of the fit: row (from 1), rpm, dial, why.
fn left_out_json(curve: &FlowCurve) -> Value {
    Value::Array(
        curve
            .left_out
            .iter()
            .map(|l| {
                json!({
                    "row": l.row,
                    "rpm": finite(l.rpm),
                    "dial": finite(l.dial),
                    "full_scale_dial": finite(l.full_scale_dial),
                    "why": l.why,
                })
            })
            .collect(),
    )
}

/// Each concern's stable code and its sentence.
fn concerns_json(curve: &FlowCurve) -> Value {
    Value::Array(
        curve
            .concerns
            .iter()
            .map(|c| json!({ "code": c.code(), "text": c.explain() }))
            .collect(),
    )
}

/// The `api_rp13d` object: PV (Pa·s), YP (lbf/100 ft² and Pa), pipe n and K (Pa·sⁿ), and the
/// annulus n and K when θ100 and θ3 were read.
fn api_json(a: &ApiRp13d) -> Value {
    let mut v = json!({
        "plastic_viscosity_pa_s": finite(a.plastic_viscosity_pa_s),
        "yield_point_lbf_100ft2": finite(a.yield_point_lbf_100ft2),
        "yield_point_pa": finite(a.yield_point_pa),
        "n": finite(a.n),
        "k_pa_sn": finite(a.k_pa_sn),
        "note": CONVERSION_NOTE,
    });
    if let (Some(n), Some(k), Value::Object(map)) = (a.n_annulus, a.k_annulus_pa_sn, &mut v) {
        map.insert("n_annulus".into(), finite(n));
        map.insert("k_annulus_pa_sn".into(), finite(k));
    }
    v
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
                    "row": p.row,
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
