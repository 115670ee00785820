//! Pump and restart facts for the findings: what was read at each pump the session names,
//! its limits and best-efficiency flow, the product's flow index; each line's restart worked
//! out through `session::restart` with the product's gel build-up from the site.

use super::findings::{latest, read, touched};
use super::restart::{GelSource, RestartAnswer, RestartCase, analyse, from_site};
use super::state::SessionState;
use super::trend::{Param, hb_equivalent};
use crate::diagnose::{Measured, PumpFacts, PumpType, RestartFacts};
use crate::rheology::ParamName;
use crate::site::{Pump, PumpKind, Site};

pub use super::findings_tank::{tank_answers, tanks};

/// Facts for every pump the session names (at the pump or at the line it feeds).
pub fn pumps(state: &SessionState, site: &Site) -> Vec<PumpFacts> {
    site.pumps
        .iter()
        .filter(|p| touched(state, &[p.id.as_str(), p.feeds.as_str()]))
        .map(|p| pump_facts(state, p))
        .collect()
}

fn pump_facts(state: &SessionState, p: &Pump) -> PumpFacts {
    let at = [p.id.as_str(), p.feeds.as_str()];
    PumpFacts {
        subject: format!("pump {}", p.id),
        kind: match p.kind {
            PumpKind::Centrifugal { .. } => PumpType::Centrifugal,
            PumpKind::PositiveDisplacement { .. } => PumpType::PositiveDisplacement,
        },
        discharge_pa: latest(state, "discharge-pressure", &[p.id.as_str()]).map(read),
        max_discharge_pa: p.max_discharge_pressure_pa,
        relief_pa: p.relief_setting_pa,
        flow_m3_s: latest(state, "flow", &at),
        bep_flow_m3_s: bep_flow(p, latest(state, "pump-speed", &[p.id.as_str()])),
        flow_index: flow_index(state),
    }
}

/// The water curve's best-efficiency flow, moved to the speed read by the affinity law
/// Q ∝ N (Karassik et al., *Pump Handbook*, from memory).
fn bep_flow(p: &Pump, speed_rad_s: Option<f64>) -> Option<f64> {
    let best = p
        .curve()
        .iter()
        .max_by(|a, b| a.efficiency.total_cmp(&b.efficiency))?;
    let ratio = speed_rad_s.map_or(1.0, |n| n / p.rated_speed_rad_s);
    Some(best.flow_m3_s * ratio)
}

/// The flow index n of the newest fitted set, with its interval when n was fitted.
fn flow_index(state: &SessionState) -> Option<Measured> {
    let curve = state
        .sets
        .iter()
        .rev()
        .find_map(|e| e.item.shown().as_ref().ok())?;
    let value = match hb_equivalent(&curve.fit.model, ParamName::N) {
        Param::Fitted(v) | Param::Implied(v) => v,
        Param::Absent => return None,
    };
    let interval = curve.fit.estimate(ParamName::N).and_then(|e| e.ci95);
    Some(Measured { value, interval })
}

/// A restart judged for every line the session names, with its first pump and the newest
/// product set in the session that has a gel build-up on the site.
pub fn restarts(state: &SessionState, site: &Site) -> Vec<RestartFacts> {
    let mut out = Vec::new();
    for (subject, answer, stop) in restart_answers(state, site) {
        let margin = answer.input.margin;
        out.push(restart_facts(&subject, &answer.now, margin, stop, "now"));
        if let Some(cold) = &answer.cold {
            let when = "at the line's coldest expected temperature";
            out.push(restart_facts(&subject, cold, margin, stop, when));
        }
    }
    out
}

/// The restart answer for every line the session names: (subject, answer, stop recorded).
/// The report draws its gel chart from these.
pub fn restart_answers(
    state: &SessionState,
    site: &Site,
) -> Vec<(String, RestartAnswer, Option<f64>)> {
    let Some((product, assumed)) = restart_product(state, site) else {
        return Vec::new();
    };
    let mut out = Vec::new();
    for line in &site.lines {
        let Some(pump) = site.pumps_feeding(&line.id).first().copied() else {
            continue;
        };
        let at = [line.id.as_str(), pump.id.as_str()];
        if !touched(state, &at) {
            continue;
        }
        let stop = latest(state, "rest-time", &at);
        if assumed && stop.is_none() {
            // No set names the product and no stop was recorded here: nothing to judge.
            continue;
        }
        let Ok(input) = from_site(
            site,
            (&line.id, &pump.id, product),
            GelSource::Product,
            stop,
        ) else {
            continue;
        };
        let Ok(answer) = analyse(input) else {
            continue;
        };
        let subject = match assumed {
            false => format!("line {} with pump {}, {product}", line.id, pump.id),
            true => format!(
                "line {} with pump {}, {product} assumed (the only product with a gel build-up)",
                line.id, pump.id
            ),
        };
        out.push((subject, answer, stop));
    }
    out
}

/// The product judged for a restart: the newest set's product with a gel build-up on the
/// site; with none in the session, the site's only product with one (said as assumed, and
/// judged only where a stop was recorded).
fn restart_product<'s>(state: &'s SessionState, site: &'s Site) -> Option<(&'s str, bool)> {
    let from_sets = state
        .sets
        .iter()
        .rev()
        .map(|e| e.item.product.as_str())
        .find(|p| site.product(p).is_some_and(|p| p.gel.is_some()));
    if let Some(p) = from_sets {
        return Some((p, false));
    }
    let mut gelling = site.products.iter().filter(|p| p.gel.is_some());
    match (gelling.next(), gelling.next()) {
        (Some(only), None) => Some((only.name.as_str(), true)),
        _ => None,
    }
}

fn restart_facts(
    subject: &str,
    case: &RestartCase,
    margin: f64,
    stop_s: Option<f64>,
    when: &str,
) -> RestartFacts {
    let longest = case.max_stop.seconds().map(|value| Measured {
        value,
        interval: case.max_stop_band.map(|b| {
            (
                b.low.seconds().unwrap_or(f64::INFINITY),
                b.high.seconds().unwrap_or(f64::INFINITY),
            )
        }),
    });
    RestartFacts {
        subject: subject.to_string(),
        needed_pa: Measured {
            value: case.check.pressure.total_pa,
            interval: case.pressure_band_pa,
        },
        usable_pa: case.check.usable_pa(),
        margin,
        stop_s,
        longest_safe_stop_s: longest,
        when: when.to_string(),
    }
}
