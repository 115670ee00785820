//! Printing line answers: the human text (site units, with the cautions) and the `--json`
//! contract (SI; the keys named in the issue never change, more may be added).

use super::fit_output::finite;
use crate::line::LineAnswer;
use crate::present::{Style, param_text};
use crate::session::line::{AtFlow, AtPressure, LineCase};
use crate::session::line_words::{self, pressure_with_band};
use crate::units::{self, Dimension, UnitSystem};
use anyhow::Result;
use serde_json::{Map, Value, json};
use std::fmt::Write as _;

pub fn at_flow(case: &LineCase, at: &AtFlow, system: UnitSystem, json: bool) -> Result<()> {
    if json {
        let mut v = case_json(case);
        answer_json(&mut v, &at.answer);
        v.insert("pressure_drop_band_pa".into(), band(at.band_pa));
        v.insert("fit_band_pa".into(), band(at.fit_band_pa));
        v.insert("cautions".into(), words(&at.cautions));
        println!("{}", serde_json::to_string_pretty(&Value::Object(v))?);
        return Ok(());
    }
    let mut out = case_text(case, system);
    answer_text(&mut out, &at.answer, at.band_pa, system);
    cautions_text(&mut out, &at.cautions);
    print!("{out}");
    Ok(())
}

pub fn at_pressure(
    case: &LineCase,
    at: &AtPressure,
    target_pa: f64,
    system: UnitSystem,
    json: bool,
) -> Result<()> {
    if json {
        let mut v = case_json(case);
        if let Some(a) = &at.flow.answer {
            answer_json(&mut v, a);
        }
        v.insert("flow_m3_s".into(), finite(at.flow.flow_m3_s));
        v.insert("pressure_drop_pa".into(), finite(target_pa));
        let notes: Vec<String> = at.flow.notes.iter().map(line_words::note).collect();
        v.insert("notes".into(), json!(notes));
        v.insert("cautions".into(), words(&at.cautions));
        println!("{}", serde_json::to_string_pretty(&Value::Object(v))?);
        return Ok(());
    }
    let mut out = case_text(case, system);
    let p = units::format(target_pa, Dimension::Pressure, system);
    let q = units::format(at.flow.flow_m3_s, Dimension::Flow, system);
    let _ = writeln!(out, "A pressure drop of {p} drives {q}.");
    match &at.flow.answer {
        Some(a) => answer_text(&mut out, a, a.transition_range_pa, system),
        None => {
            for n in &at.flow.notes {
                let _ = writeln!(out, "  {}", line_words::note(n));
            }
        }
    }
    cautions_text(&mut out, &at.cautions);
    print!("{out}");
    Ok(())
}

fn band(b: Option<(f64, f64)>) -> Value {
    b.map_or(Value::Null, |(lo, hi)| json!([finite(lo), finite(hi)]))
}

fn words(c: &[line_words::Caution]) -> Value {
    json!(c.iter().map(|c| c.words()).collect::<Vec<_>>())
}

/// The line, product and flow curve behind every answer.
fn case_json(case: &LineCase) -> Map<String, Value> {
    let mut params = Map::new();
    for (name, value) in case.fluid.model.params() {
        params.insert(name.json_key().into(), finite(value));
    }
    let p = &case.pipe;
    let v = json!({
        "line": case.line_id,
        "design_pressure_pa": case.design_pressure_pa.map_or(Value::Null, finite),
        "inner_diameter_m": finite(p.inner_diameter_m),
        "length_m": finite(p.length_m),
        "fittings_length_m": finite(p.fittings_length_m),
        "roughness_m": finite(p.roughness_m),
        "elevation_change_m": finite(p.elevation_change_m),
        "density_kg_m3": finite(case.fluid.density_kg_m3),
        "product": case.source.product.as_ref().map(|p| p.name.clone()),
        "model": case.fluid.model.kind().name(),
        "params": params,
        "temperature_k": case.temperature_k.map_or(Value::Null, finite),
        "rheology_source": case.source.describe(),
    });
    match v {
        Value::Object(m) => m,
        _ => Map::new(),
    }
}

/// The contract keys of one answer.
fn answer_json(v: &mut Map<String, Value>, a: &LineAnswer) {
    let add = |v: &mut Map<String, Value>, k: &str, x: f64| {
        v.insert(k.into(), finite(x));
    };
    add(v, "flow_m3_s", a.flow_m3_s);
    add(v, "velocity_m_s", a.velocity_m_s);
    add(v, "wall_shear_stress_pa", a.wall_shear_stress_pa);
    add(v, "wall_shear_rate_per_s", a.wall_shear_rate_per_s);
    add(v, "nominal_shear_rate_per_s", a.nominal_shear_rate_per_s);
    add(v, "reynolds", a.reynolds);
    add(v, "critical_reynolds", a.critical_reynolds);
    v.insert("regime".into(), json!(a.regime.name()));
    v.insert(
        "critical_rule".into(),
        json!(line_words::critical_rule(&a.critical_rule)),
    );
    add(v, "n_prime", a.n_prime);
    add(v, "fanning_friction", a.fanning_friction);
    v.insert("correlation".into(), json!(a.correlation));
    add(v, "pressure_drop_pa", a.pressure_drop_pa);
    add(v, "friction_pressure_drop_pa", a.friction_pressure_drop_pa);
    add(v, "static_pressure_pa", a.static_pressure_pa);
    v.insert("transition_range_pa".into(), band(a.transition_range_pa));
    let notes: Vec<String> = a.notes.iter().map(line_words::note).collect();
    v.insert("notes".into(), json!(notes));
}

fn case_text(case: &LineCase, system: UnitSystem) -> String {
    let len = |m: f64| units::format(m, Dimension::Length, system);
    let long_unit = match system {
        UnitSystem::Si => "m",
        UnitSystem::UsCustomary => "ft",
    };
    let long = |m: f64| units::format_in(m, Dimension::Length, long_unit);
    let p = &case.pipe;
    let mut out = String::new();
    let name = case
        .line_id
        .as_deref()
        .map_or("Pipe".to_string(), |id| format!("Line {id}"));
    let _ = write!(
        out,
        "{name}: {} bore, {} straight + {} fittings, rise {}",
        len(p.inner_diameter_m),
        long(p.length_m),
        long(p.fittings_length_m),
        long(p.elevation_change_m),
    );
    if let Some(d) = case.design_pressure_pa {
        let _ = write!(
            out,
            ", design {}",
            units::format(d, Dimension::Pressure, system)
        );
    }
    out.push('\n');
    let product = case
        .source
        .product
        .as_ref()
        .map_or("Product", |p| p.name.as_str());
    let params: Vec<String> = case
        .fluid
        .model
        .params()
        .iter()
        .map(|(n, v)| {
            format!(
                "{} {}",
                n.symbol(),
                param_text(*n, *v, Style::new(system, false))
            )
        })
        .collect();
    let _ = writeln!(
        out,
        "{product}: {}, {}; density {}",
        case.fluid.model.kind().title(),
        params.join(", "),
        units::format(case.fluid.density_kg_m3, Dimension::Density, system)
    );
    let _ = writeln!(out, "  {}", case.source.describe());
    out
}

fn answer_text(out: &mut String, a: &LineAnswer, band: Option<(f64, f64)>, system: UnitSystem) {
    let pa = |v: f64| units::format(v, Dimension::Pressure, system);
    let _ = writeln!(
        out,
        "At {} (mean velocity {:.3} m/s):",
        units::format(a.flow_m3_s, Dimension::Flow, system),
        a.velocity_m_s
    );
    let _ = writeln!(
        out,
        "  pressure drop   {}",
        pressure_with_band(a.pressure_drop_pa, band, system)
    );
    let _ = writeln!(
        out,
        "                  friction {} + static head {}",
        pa(a.friction_pressure_drop_pa),
        pa(a.static_pressure_pa)
    );
    let _ = writeln!(
        out,
        "  regime          {}: Re {:.0} against a critical {:.0} by {}",
        a.regime.name(),
        a.reynolds,
        a.critical_reynolds,
        line_words::critical_rule(&a.critical_rule)
    );
    let _ = writeln!(
        out,
        "  at the wall     stress {}, shear rate {:.3} 1/s (8V/D {:.3} 1/s, n′ {:.3})",
        units::format(a.wall_shear_stress_pa, Dimension::Stress, system),
        a.wall_shear_rate_per_s,
        a.nominal_shear_rate_per_s,
        a.n_prime
    );
    let _ = writeln!(
        out,
        "  Fanning f       {:.4} ({})",
        a.fanning_friction,
        line_words::correlation(a.correlation)
    );
    for n in &a.notes {
        let _ = writeln!(out, "  note: {}", line_words::note(n));
    }
}

fn cautions_text(out: &mut String, cautions: &[line_words::Caution]) {
    out.push_str("Cautions:\n");
    for c in cautions {
        let _ = writeln!(out, "  - {}", c.words());
    }
}
