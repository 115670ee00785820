//! Output of `rheoside fit` for plant pairs: the usual fit table or JSON, plus n′, K′, the
//! per-point wall quantities and, with a product curve, the disagreement in words.

use super::fit_output::{self, finite};
use crate::line::{Comparison, Pipe, PlantPair, PlantPoint};
use crate::rheology::ParamName;
use crate::session::FlowCurveOptions;
use crate::session::line_plant::{plant_fit, plant_single};
use crate::session::line_words::{self, Caution};
use crate::session::rheology_source::Resolved;
use crate::units::{self, Dimension, UnitSystem};
use anyhow::Result;
use serde_json::{Value, json};
use std::fmt::Write as _;

/// Everything the output needs.
pub struct Job<'a> {
    pub pipe: Pipe,
    pub density: f64,
    pub pairs: &'a [PlantPair],
    pub opts: &'a FlowCurveOptions,
    pub compare: Option<&'a Resolved>,
    pub system: UnitSystem,
    pub json: bool,
}

const CAUTIONS: [Caution; 2] = [Caution::LockOut, Caution::AdviceOnly];

pub fn print(job: &Job) -> Result<()> {
    if let [one] = job.pairs {
        return print_single(job, *one);
    }
    let fitted = plant_fit(&job.pipe, job.density, job.pairs, job.opts)?;
    let cmp = job
        .compare
        .map(|c| crate::line::compare_with_curve(&job.pipe, &c.model, &fitted.back.points));
    if job.json {
        let mut v = fit_output::json(&fitted.curve, job.opts, None);
        v["n_prime"] = finite(fitted.back.n_prime);
        v["k_prime_pa_sn"] = finite(fitted.back.k_prime_pa_sn);
        add_point_keys(&mut v, &fitted.back.points, job.pairs);
        v["comparison"] = comparison_json(cmp.as_ref(), job.compare);
        v["cautions"] = json!(CAUTIONS.iter().map(|c| c.words()).collect::<Vec<_>>());
        println!("{}", serde_json::to_string_pretty(&v)?);
        return Ok(());
    }
    let mut out = fit_output::table(
        &fitted.curve,
        crate::present::Style::new(job.system, false),
        None,
    );
    let _ = writeln!(
        out,
        "\nFrom {} plant pairs: n′ {:.4}, K′ {} (τw = K′(8V/D)^n′), wall rates by \
         Rabinowitsch–Mooney",
        job.pairs.len(),
        fitted.back.n_prime,
        crate::present::param_text(
            ParamName::K,
            fitted.back.k_prime_pa_sn,
            crate::present::Style::new(job.system, false)
        )
    );
    points_text(&mut out, &fitted.back.points, job.pairs, job.system);
    comparison_text(&mut out, cmp.as_ref(), job.compare);
    for c in CAUTIONS {
        let _ = writeln!(out, "  - {}", c.words());
    }
    print!("{out}");
    Ok(())
}

/// One pair: the wall's apparent viscosity, and K with n from the product's curve.
fn print_single(job: &Job, pair: PlantPair) -> Result<()> {
    let n = job.compare.and_then(|c| c.model.param(ParamName::N));
    let s = plant_single(&job.pipe, job.density, pair, n)?;
    let cmp = job
        .compare
        .map(|c| crate::line::compare_with_curve(&job.pipe, &c.model, &[s.point]));
    if job.json {
        let mut v = json!({
            "apparent_viscosity_pa_s": finite(s.apparent_viscosity_pa_s),
            "k_pa_sn": s.k_pa_sn.map_or(Value::Null, finite),
            "n_from_viscometer": n.map_or(Value::Null, finite),
            "points": [],
        });
        add_point_keys(&mut v, &[s.point], &[pair]);
        v["comparison"] = comparison_json(cmp.as_ref(), job.compare);
        println!("{}", serde_json::to_string_pretty(&v)?);
        return Ok(());
    }
    let mut out = String::new();
    let _ = writeln!(
        out,
        "One plant pair: apparent viscosity at the wall {} (τw/(8V/D))",
        units::format(
            s.apparent_viscosity_pa_s,
            Dimension::DynamicViscosity,
            job.system
        )
    );
    match (s.k_pa_sn, n) {
        (Some(k), Some(n)) => {
            let k = crate::present::param_text(
                ParamName::K,
                k,
                crate::present::Style::new(job.system, false),
            );
            let _ = writeln!(out, "  with n = {n:.4} from the product's curve: K = {k}");
        }
        _ => out.push_str("  give --product P (a curve with n) for K; two or more pairs give n′\n"),
    }
    points_text(&mut out, &[s.point], &[pair], job.system);
    comparison_text(&mut out, cmp.as_ref(), job.compare);
    for c in CAUTIONS {
        let _ = writeln!(out, "  - {}", c.words());
    }
    print!("{out}");
    Ok(())
}

/// Per point: the contract keys added to the fit's points (same order as the pairs).
fn add_point_keys(v: &mut Value, points: &[PlantPoint], pairs: &[PlantPair]) {
    let rows: Vec<Value> = points
        .iter()
        .zip(pairs)
        .map(|(p, pair)| {
            json!({
                "flow_m3_s": finite(p.flow_m3_s),
                "pressure_drop_pa": finite(pair.pressure_drop_pa),
                "wall_shear_stress_pa": finite(p.wall_shear_stress_pa),
                "nominal_shear_rate_per_s": finite(p.nominal_shear_rate_per_s),
                "shear_rate_per_s": finite(p.shear_rate_per_s),
                "n_prime": finite(p.n_prime),
                "reynolds": finite(p.reynolds),
            })
        })
        .collect();
    match v.get_mut("points").and_then(Value::as_array_mut) {
        Some(existing) if existing.len() == rows.len() => {
            for (e, r) in existing.iter_mut().zip(rows) {
                if let (Some(e), Value::Object(r)) = (e.as_object_mut(), r) {
                    e.extend(r);
                }
            }
        }
        _ => v["points"] = Value::Array(rows),
    }
}

fn comparison_json(cmp: Option<&Comparison>, source: Option<&Resolved>) -> Value {
    match (cmp, source) {
        (Some(c), Some(s)) => json!({
            "against": s.describe(),
            "ratios": c.ratios.iter().map(|r| finite(*r)).collect::<Vec<_>>(),
            "mean_ratio": finite(c.mean_ratio),
            "direction": c.direction,
            "words": line_words::disagreement(c),
        }),
        _ => Value::Null,
    }
}

fn points_text(out: &mut String, points: &[PlantPoint], pairs: &[PlantPair], system: UnitSystem) {
    let _ = writeln!(
        out,
        "  {:>12} {:>12} {:>12} {:>10} {:>10} {:>8}",
        "flow", "Δp", "τw", "8V/D 1/s", "γ̇w 1/s", "Re"
    );
    for (p, pair) in points.iter().zip(pairs) {
        let _ = writeln!(
            out,
            "  {:>12} {:>12} {:>12} {:>10.2} {:>10.2} {:>8.1}",
            units::format(p.flow_m3_s, Dimension::Flow, system),
            units::format(pair.pressure_drop_pa, Dimension::Pressure, system),
            units::format(p.wall_shear_stress_pa, Dimension::Stress, system),
            p.nominal_shear_rate_per_s,
            p.shear_rate_per_s,
            p.reynolds
        );
    }
}

fn comparison_text(out: &mut String, cmp: Option<&Comparison>, source: Option<&Resolved>) {
    if let (Some(c), Some(s)) = (cmp, source) {
        let _ = writeln!(out, "\nAgainst the {}:", s.describe());
        let _ = writeln!(out, "  {}", line_words::disagreement(c));
    }
}
