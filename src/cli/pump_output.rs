//! `rheoside pump --pump ID`: a site pump on its line, as JSON (contract keys, SI) or text.

use super::pump::{bep_json, bep_text};
use crate::pump::Relief;
use crate::session::pump::{PumpAnswer, SitePumpAnswer};
use crate::session::pump_words;
use crate::units::{self, Dimension, UnitSystem};
use serde_json::{Value, json};

/// The contract keys at the top level: the BEP correction for a centrifugal pump (null for a
/// positive-displacement one), then `operating_point`.
pub fn json(a: &SitePumpAnswer) -> Value {
    let mut v = match &a.answer {
        PumpAnswer::Centrifugal(c) => {
            let mut v = bep_json(&c.bep);
            v["viscosity_pa_s"] = json!(c.viscosity_pa_s);
            v["viscosity_cst"] = json!(c.nu_cst);
            v["curve"] = json!(c.curve.points);
            v["water_curve"] = json!(c.water_curve.points);
            v["system_curve"] = json!(
                c.system_points
                    .iter()
                    .map(|(q, h)| json!({"flow_m3_s": q, "head_m": h}))
                    .collect::<Vec<_>>()
            );
            v["operating_point"] = match (c.duty, c.regime) {
                (Some(d), Some(r)) => json!({
                    "flow_m3_s": d.flow_m3_s,
                    "head_m": d.head_m,
                    "pressure_pa": d.pressure_pa,
                    "power_w": d.power_w,
                    "efficiency": d.efficiency,
                    "motor_margin_w": d.motor_margin_w,
                    "regime": r.name(),
                }),
                _ => Value::Null,
            };
            v
        }
        PumpAnswer::Displacement(d) => {
            let u = &d.duty;
            let head = u.pressure_pa / (d.density_kg_m3 * crate::pump::G);
            json!({
                "b_parameter": null, "c_q": null, "c_h": null, "c_eta": null,
                "flow_m3_s": u.flow_m3_s,
                "head_m": head,
                "efficiency": null,
                "power_w": u.power_w,
                "theoretical_flow_m3_s": u.theoretical_flow_m3_s,
                "volumetric_efficiency": u.volumetric_efficiency,
                "slip_basis": u.basis,
                "relief": u.relief,
                "viscosity_pa_s": d.viscosity_pa_s,
                "operating_point": {
                    "flow_m3_s": u.flow_m3_s,
                    "head_m": head,
                    "pressure_pa": u.pressure_pa,
                    "power_w": u.power_w,
                    "motor_margin_w": u.motor_margin_w,
                    "regime": d.regime.name(),
                },
            })
        }
    };
    v["pump"] = json!(a.pump_id);
    v["line"] = json!(a.line_id);
    v["notes"] = json!(a.notes.iter().map(pump_words::note).collect::<Vec<_>>());
    v["cautions"] = json!(pump_words::CAUTIONS);
    v
}

/// The answer in words.
pub fn text(a: &SitePumpAnswer, system: UnitSystem) -> String {
    let f = |x: f64, d: Dimension| units::format(x, d, system);
    let mut out = format!("Pump {} on line {}\n", a.pump_id, a.line_id);
    match &a.answer {
        PumpAnswer::Centrifugal(c) => {
            out.push_str(&format!(
                "Apparent viscosity {} ({:.0} cSt)\n",
                f(c.viscosity_pa_s, Dimension::DynamicViscosity),
                c.nu_cst
            ));
            out.push_str(
                &bep_text(&c.bep, system)
                    .lines()
                    .filter(|l| !l.starts_with("  -"))
                    .map(|l| format!("{l}\n"))
                    .collect::<String>(),
            );
            match c.duty {
                Some(d) => out.push_str(&format!(
                    "Duty point: {} at {} ({}), efficiency {:.1} %, power {}{}\n",
                    f(d.flow_m3_s, Dimension::Flow),
                    units::format_in(d.head_m, Dimension::Length, "m"),
                    f(d.pressure_pa, Dimension::Pressure),
                    d.efficiency * 100.0,
                    f(d.power_w, Dimension::Power),
                    d.motor_margin_w
                        .map(|m| format!(
                            ", {} in hand to the motor rating",
                            f(m, Dimension::Power)
                        ))
                        .unwrap_or_default(),
                )),
                None => out.push_str("No duty point (see the notes)\n"),
            }
        }
        PumpAnswer::Displacement(d) => {
            let u = &d.duty;
            out.push_str(&format!(
                "Delivers {} of {} displaced (volumetric efficiency {:.0} %) at {}; shaft power {}\n",
                f(u.flow_m3_s, Dimension::Flow),
                f(u.theoretical_flow_m3_s, Dimension::Flow),
                u.volumetric_efficiency * 100.0,
                f(u.pressure_pa, Dimension::Pressure),
                f(u.power_w, Dimension::Power),
            ));
            match u.relief {
                Relief::Below { margin_pa } => out.push_str(&format!(
                    "{} below the relief setting\n",
                    f(margin_pa, Dimension::Pressure)
                )),
                Relief::Opens { excess_pa } => out.push_str(&format!(
                    "the relief opens: {} above its setting\n",
                    f(excess_pa, Dimension::Pressure)
                )),
                Relief::Unknown => out.push_str("no relief setting known\n"),
            }
        }
    }
    out.push_str("Notes:\n");
    for n in &a.notes {
        out.push_str(&format!("  - {}\n", pump_words::note(n)));
    }
    out.push_str("Cautions:\n");
    for c in pump_words::CAUTIONS {
        out.push_str(&format!("  - {c}\n"));
    }
    out
}
