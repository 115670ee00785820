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
    for j in judged(state, site) {
        let margin = j.answer.input.margin;
        // One gel stress read after the stop says nothing of how the gel builds up, so no
        // longest safe stop is judged from it.
        let longest = |case: &RestartCase| match j.gel_read {
            Some(_) => None,
            None => longest_safe_stop(case),
        };
        let now = &j.answer.now;
        out.push(restart_facts(
            &j.subject,
            now,
            margin,
            j.stop,
            longest(now),
            "now",
        ));
        if let Some(cold) = &j.answer.cold {
            let when = "at the line's coldest expected temperature";
            out.push(restart_facts(
                &j.subject,
                cold,
                margin,
                j.stop,
                longest(cold),
                when,
            ));
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
    judged(state, site)
        .into_iter()
        .map(|j| (j.subject, j.answer, j.stop))
        .collect()
}

/// One line's restart as judged for the findings.
struct Judged {
    subject: String,
    answer: RestartAnswer,
    /// The stop recorded at the line or its pump, s.
    stop: Option<f64>,
    /// A gel stress read after that stop (a guided check's gel test), Pa.
    gel_read: Option<f64>,
}

/// The newest gel stress read at `at` after the newest stop recorded there: the gel at that
/// stop. Rested-gel readings taken before the stop (the Restart view journals its rests and
/// gels, then the stop) are a build-up, not this stop's gel, and are left to the site's.
fn gel_after_stop(state: &SessionState, at: &[&str]) -> Option<f64> {
    let here = |e: &Option<String>| e.as_deref().is_some_and(|e| at.contains(&e));
    let stop_seq = state
        .readings
        .iter()
        .rev()
        .find(|r| r.item.name == "rest-time" && here(&r.equipment))?
        .seq;
    state
        .readings
        .iter()
        .rev()
        .take_while(|r| r.seq > stop_seq)
        .find(|r| r.item.name == "yield-stress" && here(&r.equipment))
        .map(|r| r.item.value_si)
}

fn judged(state: &SessionState, site: &Site) -> Vec<Judged> {
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
        let gel_read = gel_after_stop(state, &at);
        let source = gel_read.map_or(GelSource::Product, GelSource::Stress);
        let Ok(input) = from_site(site, (&line.id, &pump.id, product), source, stop) else {
            continue;
        };
        let Ok(answer) = analyse(input) else {
            continue;
        };
        let gel = match gel_read {
            Some(_) => ", gel read after the stop",
            None => "",
        };
        let subject = match assumed {
            false => format!("line {} with pump {}, {product}{gel}", line.id, pump.id),
            true => format!(
                "line {} with pump {}, {product} assumed (the only product with a gel build-up){gel}",
                line.id, pump.id
            ),
        };
        out.push(Judged {
            subject,
            answer,
            stop,
            gel_read,
        });
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

/// The longest safe stop of a case, with its band.
fn longest_safe_stop(case: &RestartCase) -> Option<Measured> {
    case.max_stop.seconds().map(|value| Measured {
        value,
        interval: case.max_stop_band.map(|b| {
            (
                b.low.seconds().unwrap_or(f64::INFINITY),
                b.high.seconds().unwrap_or(f64::INFINITY),
            )
        }),
    })
}

fn restart_facts(
    subject: &str,
    case: &RestartCase,
    margin: f64,
    stop_s: Option<f64>,
    longest: Option<Measured>,
    when: &str,
) -> RestartFacts {
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
