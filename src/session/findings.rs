//! The session's findings: facts gathered from a replayed journal and the site, handed to
//! the pure `diagnose` rules, ranked. The one call both faces make is [`findings`].
//!
//! Only equipment the session names (a reading at it, or at the line a pump feeds) is
//! judged, so a session about one tank does not report on every pump of the site. Answers
//! not in the journal are worked out here through the existing session functions (restart,
//! line, tank, trend), never re-derived.

use super::findings_equipment::{pumps, restarts, tanks};
use super::findings_line::lines;
use super::state::{Entry, SessionState, ViscometerSet};
use super::trend::{at_reference, check_limits};
use crate::diagnose::{
    self, Dial, Facts, Finding, FitFacts, LimitFacts, Measured, SetFacts, TrendFacts,
};
use crate::rheology::{Model, ParamName};
use crate::session::checks::Concern;
use crate::site::{LimitProperty, Site, SpecLimit};
use crate::units::Dimension;

/// A reading typed off a gauge or a meter carries this share of its value as its error, in
/// both directions (common practice, no source: plant gauges are commonly of accuracy class
/// 1 to 2.5 % of span).
pub const READING_ERROR: f64 = 0.02;

/// Every finding for the session, ranked (`diagnose::rank`).
pub fn findings(state: &SessionState, site: &Site) -> Vec<Finding> {
    diagnose::diagnose(&facts(state, site))
}

/// The facts the rules read, from the session and the site.
pub fn facts(state: &SessionState, site: &Site) -> Facts {
    let (plant, regimes) = lines(state, site);
    let (tanks, tank_plant) = tanks(state, site);
    Facts {
        sets: state
            .sets
            .iter()
            .enumerate()
            .map(|(i, e)| set_facts(site, e, &state.sets[..i]))
            .collect(),
        plant: plant.into_iter().chain(tank_plant).collect(),
        restarts: restarts(state, site),
        regimes,
        pumps: pumps(state, site),
        tanks,
    }
}

/// A reading with [`READING_ERROR`] as its interval.
pub fn read(value: f64) -> Measured {
    let e = (READING_ERROR * value).abs();
    Measured::within(value, (value - e, value + e))
}

/// The newest reading named `name` at any of `at` (equipment ids).
pub(crate) fn latest(state: &SessionState, name: &str, at: &[&str]) -> Option<f64> {
    state
        .readings
        .iter()
        .rev()
        .find(|r| r.item.name == name && r.equipment.as_deref().is_some_and(|e| at.contains(&e)))
        .map(|r| r.item.value_si)
}

/// Whether the session names any of `ids` on a record.
pub(crate) fn touched(state: &SessionState, ids: &[&str]) -> bool {
    state.equipment.iter().any(|e| ids.contains(&e.as_str()))
}

/// The newest fitted model of a product in the session, with its fit.
pub(crate) fn latest_curve<'s>(
    state: &'s SessionState,
    product: &str,
) -> Option<&'s super::FlowCurve> {
    state
        .sets
        .iter()
        .rev()
        .filter(|e| e.item.product == product)
        .find_map(|e| e.item.shown().as_ref().ok())
}

fn set_subject(e: &Entry<ViscometerSet>) -> String {
    format!(
        "set {}, {} on {}",
        e.seq,
        crate::text::sanitize(&e.item.product, false),
        crate::text::sanitize(&e.item.viscometer, false)
    )
}

fn set_facts(site: &Site, e: &Entry<ViscometerSet>, earlier: &[Entry<ViscometerSet>]) -> SetFacts {
    let v = &e.item;
    let product = site.product(&v.product);
    let mut facts = SetFacts {
        subject: set_subject(e),
        dials: v
            .rows
            .iter()
            .enumerate()
            .map(|(i, r)| Dial {
                row: i + 1,
                rpm: r.rpm,
                dial: r.dial,
            })
            .collect(),
        full_scale_dial: site
            .viscometer(&v.viscometer)
            .map(|x| x.geometry.full_scale_dial()),
        temperature_k: v.temperature_k,
        reference_k: product.map(|p| p.reference_temperature_k),
        ..SetFacts::default()
    };
    let Ok(curve) = v.shown() else {
        return facts;
    };
    facts.reversed = curve
        .concerns
        .iter()
        .filter_map(|c| match c {
            Concern::Reversed {
                slower_row,
                faster_row,
                ..
            } => Some((*slower_row, *faster_row)),
            _ => None,
        })
        .collect();
    facts.fit = Some(FitFacts {
        r_squared: curve.fit.r_squared,
        residual_pattern: curve.concerns.iter().find_map(|c| match c {
            Concern::ResidualPattern {
                runs,
                longest,
                points,
            } => Some((*runs, *longest, *points)),
            _ => None,
        }),
        yield_stress_pa: curve.fit.estimate(ParamName::Tau0).map(|t| Measured {
            value: t.value,
            interval: t.ci95,
        }),
    });
    if let Some(p) = product {
        let (model, shifted) = at_reference(p, &curve.fit.model, v.temperature_k);
        facts.shifted_to_reference = shifted.is_some();
        facts.limits = limit_facts(&p.limits, &model, &curve.fit);
        facts.trend = trend_facts(site, p, &model, earlier);
    }
    facts
}

/// What a limit is about, in words, and the dimension of its value.
fn property(limit: &SpecLimit) -> (String, Dimension) {
    match limit.property {
        LimitProperty::ConsistencyIndex => ("consistency index K".into(), Dimension::Dimensionless),
        LimitProperty::FlowIndex => ("flow behaviour index n".into(), Dimension::Dimensionless),
        LimitProperty::YieldStress => ("yield stress".into(), Dimension::Stress),
        LimitProperty::ApparentViscosity { shear_rate_per_s } => (
            format!(
                "apparent viscosity at {}",
                crate::units::format(
                    shear_rate_per_s,
                    Dimension::ShearRate,
                    crate::units::UnitSystem::Si
                )
            ),
            Dimension::DynamicViscosity,
        ),
    }
}

/// The fit's 95 % interval of the constant a limit reads, scaled as the constant was scaled
/// to the reference temperature (a shift multiplies K or μ; τ0 and n are unchanged by it).
fn interval_for(limit: &SpecLimit, value: f64, fit: &crate::rheology::Fit) -> Option<(f64, f64)> {
    let name = match limit.property {
        LimitProperty::ConsistencyIndex => ParamName::K,
        LimitProperty::FlowIndex => ParamName::N,
        LimitProperty::YieldStress => ParamName::Tau0,
        LimitProperty::ApparentViscosity { .. } => return None,
    };
    let e = fit.estimate(name)?;
    let (lo, hi) = e.ci95?;
    let scale = if e.value != 0.0 { value / e.value } else { 1.0 };
    scale.is_finite().then_some((lo * scale, hi * scale))
}

fn limit_facts(limits: &[SpecLimit], model: &Model, fit: &crate::rheology::Fit) -> Vec<LimitFacts> {
    check_limits(limits, model)
        .iter()
        .filter_map(|c| {
            let value = c.value?;
            let (property, dimension) = property(&c.limit);
            Some(LimitFacts {
                property,
                dimension,
                value: Measured {
                    value,
                    interval: interval_for(&c.limit, value, fit),
                },
                min: c.limit.min,
                max: c.limit.max,
            })
        })
        .collect()
}

/// Each limited property of this set beside the same property in the earlier sets of the
/// product in this session (all at the reference temperature when they can be shifted).
fn trend_facts(
    _site: &Site,
    product: &crate::site::Product,
    model: &Model,
    earlier: &[Entry<ViscometerSet>],
) -> Vec<TrendFacts> {
    let earlier_models: Vec<Model> = earlier
        .iter()
        .filter(|e| e.item.product == product.name)
        .filter_map(|e| {
            let c = e.item.shown().as_ref().ok()?;
            Some(at_reference(product, &c.fit.model, e.item.temperature_k).0)
        })
        .collect();
    let now = check_limits(&product.limits, model);
    now.iter()
        .enumerate()
        .filter_map(|(i, c)| {
            let value = c.value?;
            let (property, dimension) = property(&c.limit);
            let earlier: Vec<f64> = earlier_models
                .iter()
                .filter_map(|m| check_limits(&product.limits, m).get(i)?.value)
                .collect();
            Some(TrendFacts {
                property,
                dimension,
                value,
                earlier,
            })
        })
        .collect()
}
