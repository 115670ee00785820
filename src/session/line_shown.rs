//! A site line as the Line view and the report's chart show it: pressure drop against flow
//! from the product's latest curve in the session (else the site's nominal constants) at the
//! line's temperature, with its band and the regime along it; the session's flow and
//! pressure-drop readings on the line and their check against the curve; the pump that feeds
//! it. "What if" steps: the product cooler by 5 K steps, or thicker by 10 % steps.

use super::line::{LineCase, PlantCheck, plant_check, site_case, system_curve};
use super::line_pump::{PumpShown, pump_on_line};
use super::rheology_source::{Resolved, resolve_live, scale_viscosity};
use super::state::SessionState;
use crate::line::{CurvePoint, PlantPair, Regime};
use crate::site::Site;

/// A what-if step: 5 K cooler, 10 % thicker (round steps an operator asks about; no source).
pub const COOLER_STEP_K: f64 = 5.0;
pub const THICKER_STEP: f64 = 0.10;
pub const MAX_STEPS: u32 = 6;
/// Points along the curve.
const CURVE_POINTS: usize = 60;
/// The curve runs to this mean velocity when nothing else sets the range, m/s (a brisk
/// transfer velocity; common practice, no source).
const DEFAULT_TOP_VELOCITY_M_S: f64 = 2.0;

/// What the view shows, worked out when the state or a what-if changes.
pub struct LineShown {
    pub line_id: String,
    pub product: String,
    pub source: String,
    pub temperature_k: Option<f64>,
    pub curve: Vec<CurvePoint>,
    pub design_pa: Option<f64>,
    pub pairs: Vec<PlantPair>,
    pub check: Option<PlantCheck>,
    pub cautions: Vec<&'static str>,
    /// The pump that feeds the line, on it (`None` when no pump feeds it).
    pub pump: Option<Result<PumpShown, String>>,
}

/// The line's temperature: its newest temperature reading in the session, else none (the
/// curve is then used at its own temperature).
fn line_temperature(state: &SessionState, line_id: &str) -> Option<f64> {
    state
        .readings
        .iter()
        .rev()
        .find(|e| e.equipment.as_deref() == Some(line_id) && e.item.name == "temperature")
        .map(|e| e.item.value_si)
}

/// Flow and pressure-drop readings on the line, paired in the order taken (a pressure drop
/// with the flow read just before or after it).
pub fn plant_pairs(state: &SessionState, line_id: &str) -> Vec<PlantPair> {
    let mut out = Vec::new();
    let mut flow: Option<f64> = None;
    let mut dp: Option<f64> = None;
    for e in state
        .readings
        .iter()
        .filter(|e| e.equipment.as_deref() == Some(line_id))
    {
        match e.item.name.as_str() {
            "flow" => flow = Some(e.item.value_si),
            "pressure-drop" => dp = Some(e.item.value_si),
            _ => continue,
        }
        if let (Some(q), Some(p)) = (flow, dp)
            && q > 0.0
            && p > 0.0
        {
            out.push(PlantPair {
                pressure_drop_pa: p,
                flow_m3_s: q,
            });
            flow = None;
            dp = None;
        }
    }
    out
}

pub fn shown_for(
    site: &Site,
    state: &SessionState,
    line_id: &str,
    product: &str,
    cooler: u32,
    thicker: u32,
) -> Result<LineShown, Box<dyn std::error::Error>> {
    let line = site
        .line(line_id)
        .ok_or("no such line in the site config")?;
    let base_t = line_temperature(state, line_id);
    let first: Resolved = resolve_live(site, state, product, base_t)?;
    let at_k = (cooler > 0)
        .then(|| first.applies_at_k.or(first.measured_at_k))
        .flatten()
        .map(|t| t - COOLER_STEP_K * f64::from(cooler));
    let mut source = match at_k {
        Some(t) => resolve_live(site, state, product, Some(t))?,
        None => first,
    };
    let thick = 1.0 + THICKER_STEP * f64::from(thicker);
    source.model = scale_viscosity(source.model, thick);
    let words = source.describe();
    let model = source.model;
    let case: LineCase = site_case(site, line_id, source, None)?;
    let pairs = plant_pairs(state, line_id);
    let pump = pump_on_line(site, line_id, product, model);
    let top = top_flow(&case, &pairs).max(pump_top(pump.as_ref()));
    let curve = system_curve(&case, top / CURVE_POINTS as f64, top, CURVE_POINTS)?;
    let check = (!pairs.is_empty())
        .then(|| plant_check(&case, &pairs).ok())
        .flatten();
    let top_answer = curve.last().map(|p| &p.answer);
    let band = curve.last().and_then(|p| p.band_pa);
    let cautions = crate::session::line_words::cautions(&case, top_answer, band)
        .into_iter()
        .map(|c| c.words())
        .collect();
    Ok(LineShown {
        line_id: line.id.clone(),
        product: product.to_string(),
        source: words,
        temperature_k: case.temperature_k,
        curve,
        design_pa: case.design_pressure_pa,
        pairs,
        check,
        cautions,
        pump,
    })
}

/// The curve runs past the pump's duty point and to the end of its curve.
fn pump_top(pump: Option<&Result<PumpShown, String>>) -> f64 {
    let Some(Ok(p)) = pump else {
        return 0.0;
    };
    let duty = p.duty.map_or(0.0, |(q, _)| q * 1.2);
    p.curve.iter().map(|c| c.0).fold(duty, f64::max)
}

/// The curve's top flow: past the plant readings, else a brisk velocity in the line.
fn top_flow(case: &LineCase, pairs: &[PlantPair]) -> f64 {
    let d = case.pipe.inner_diameter_m;
    let brisk = DEFAULT_TOP_VELOCITY_M_S * std::f64::consts::PI * d * d / 4.0;
    let read = pairs.iter().map(|p| p.flow_m3_s * 1.5).fold(0.0, f64::max);
    brisk.max(read)
}

/// Flow ranges of each regime along the curve, in order: (regime, from, to) m³/s.
pub fn regime_runs(curve: &[CurvePoint]) -> Vec<(Regime, f64, f64)> {
    let mut out: Vec<(Regime, f64, f64)> = Vec::new();
    for p in curve {
        let q = p.answer.flow_m3_s;
        match out.last_mut() {
            Some(last) if last.0 == p.answer.regime => last.2 = q,
            _ => out.push((p.answer.regime, q, q)),
        }
    }
    out
}
