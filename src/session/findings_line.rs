//! Line facts for the findings: the pressure drop the plant read against the one the
//! viscometer's curve predicts, and where the flow sits against the transition. Worked out
//! through `session::line` with the product's newest curve in the session.

use super::findings::{latest, touched};
use super::line::{at_flow, site_case};
use super::rheology_source::{SourceRequest, resolve};
use super::state::SessionState;
use crate::diagnose::{Measured, PlantFacts, PlantSignal, RegimeFacts};
use crate::line::AGREE_WITHIN;
use crate::site::Site;
use crate::units::Dimension;

/// Plant comparisons and regimes for every line the session names.
pub fn lines(state: &SessionState, site: &Site) -> (Vec<PlantFacts>, Vec<RegimeFacts>) {
    let mut plant = Vec::new();
    let mut regimes = Vec::new();
    for line in &site.lines {
        let pumps = site.pumps_feeding(&line.id);
        let mut ids: Vec<&str> = vec![line.id.as_str()];
        ids.extend(pumps.iter().map(|p| p.id.as_str()));
        if !touched(state, &ids) {
            continue;
        }
        let Some(flow) = latest(state, "flow", &ids) else {
            continue;
        };
        let Some(at) = answer(state, site, &line.id, flow) else {
            continue;
        };
        let subject = format!("line {}", line.id);
        regimes.push(RegimeFacts {
            subject: subject.clone(),
            flow_m3_s: flow,
            reynolds: at.answer.reynolds,
            critical_reynolds: at.answer.critical_reynolds,
        });
        if let Some(dp) = latest(state, "pressure-drop", &[line.id.as_str()]) {
            plant.push(PlantFacts {
                // The reading is taken as the drop over the whole line, friction and rise.
                subject: format!("{subject} (pressure drop over the whole line)"),
                signal: PlantSignal::LinePressureDrop,
                measured: dp,
                predicted: Measured {
                    value: at.answer.pressure_drop_pa,
                    interval: at.band_pa,
                },
                dimension: Dimension::Pressure,
                agree: (1.0 - AGREE_WITHIN, 1.0 + AGREE_WITHIN),
            });
        }
    }
    (plant, regimes)
}

/// The line's answer at `flow` with the newest fitted curve in the session.
fn answer(
    state: &SessionState,
    site: &Site,
    line_id: &str,
    flow: f64,
) -> Option<super::line::AtFlow> {
    let set = state
        .sets
        .iter()
        .rev()
        .find(|e| e.item.shown().is_ok() && site.product(&e.item.product).is_some())?;
    let curve = set.item.shown().as_ref().ok()?;
    let req = SourceRequest {
        flags: Some(curve.fit.model),
        product: Some(set.item.product.clone()),
        journal: None,
        temperature_k: None,
    };
    let mut resolved = resolve(site, &req).ok()?;
    // Keep the fit so the prediction carries its band.
    resolved.fit = Some(curve.fit.clone());
    let case = site_case(site, line_id, resolved, None).ok()?;
    at_flow(&case, flow).ok()
}
