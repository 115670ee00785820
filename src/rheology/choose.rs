//! Model choice: fit every family, take the lowest AICc, then step down to the simpler nested
//! model while the extra parameter is not shown to be needed (its 95 % CI includes the value
//! that turns it off).
//!
//! Nesting used: Herschel–Bulkley → power law (τ0 = 0) or → Bingham (n = 1); Bingham → Newtonian
//! (τ0 = 0); Casson → Newtonian (τ0 = 0); power law → Newtonian (n = 1). AICc: Hurvich & Tsai
//! (1989), from memory; the step-down rule is common practice, no source.

use super::data::{Point, check_points};
use super::error::FitError;
use super::fit::{Estimate, Fit, FitOptions, fit};
use super::kind::{ModelKind, ParamName};

/// One family tried in a choice, with its fit or why it could not take part.
#[derive(Debug, Clone)]
pub struct Candidate {
    pub kind: ModelKind,
    pub outcome: Result<Fit, FitError>,
}

/// The chosen fit, every candidate, and the steps the rule took (the facts a reason is
/// worded from, in the presentation layer).
#[derive(Debug, Clone)]
pub struct Choice {
    pub best: Fit,
    pub candidates: Vec<Candidate>,
    /// Each step down from the lowest-AICc family to a simpler one, in order.
    pub steps: Vec<StepDown>,
    /// The family with the lowest AICc, when the step-down rule moved away from it.
    pub lowest_aicc: Option<ModelKind>,
}

/// Why the rule stepped from one family to a simpler one.
#[derive(Debug, Clone)]
pub struct StepDown {
    pub from: ModelKind,
    pub to: ModelKind,
    /// The parameter that was not shown to be needed (τ0 or n) and the value that turns it off.
    pub estimate: Estimate,
    pub null_value: f64,
}

/// Fit all five families and choose one.
pub fn choose(points: &[Point], opts: &FitOptions) -> Result<Choice, FitError> {
    check_points(points)?;
    let candidates: Vec<Candidate> = ModelKind::ALL
        .into_iter()
        .map(|kind| Candidate {
            kind,
            outcome: fit(kind, points, opts).and_then(|f| comparable(f, points.len())),
        })
        .collect();
    let mut ranked: Vec<&Fit> = candidates
        .iter()
        .filter_map(|c| c.outcome.as_ref().ok())
        .collect();
    ranked.sort_by(|a, b| aicc_of(a).total_cmp(&aicc_of(b)));
    let Some(&lowest) = ranked.first() else {
        return Err(no_comparable(&candidates));
    };
    let (best, steps) = simplify(lowest, &ranked);
    let best = best.clone();
    let lowest_aicc = (!steps.is_empty()).then(|| lowest.model.kind());
    Ok(Choice {
        best,
        lowest_aicc,
        candidates,
        steps,
    })
}

/// Step down from the lowest-AICc fit while the rule allows and the simpler fit exists.
fn simplify<'a>(lowest: &'a Fit, ranked: &[&'a Fit]) -> (&'a Fit, Vec<StepDown>) {
    let mut best = lowest;
    let mut steps = Vec::new();
    while let Some(step) = step_down(best) {
        let Some(simpler) = ranked.iter().find(|f| f.model.kind() == step.to) else {
            break;
        };
        steps.push(step);
        best = simpler;
    }
    (best, steps)
}

impl Choice {
    /// The fits that could be compared, lowest AICc first.
    pub fn ranked(&self) -> Vec<&Fit> {
        let mut ranked: Vec<&Fit> = self
            .candidates
            .iter()
            .filter_map(|c| c.outcome.as_ref().ok())
            .collect();
        ranked.sort_by(|a, b| aicc_of(a).total_cmp(&aicc_of(b)));
        ranked
    }
}

fn aicc_of(f: &Fit) -> f64 {
    f.aicc.unwrap_or(f64::INFINITY)
}

/// A fit without an AICc cannot be ranked: list it with the reason instead.
fn comparable(f: Fit, m: usize) -> Result<Fit, FitError> {
    match f.aicc {
        Some(_) => Ok(f),
        None => Err(FitError::TooFewForComparison {
            model: f.model.kind(),
            have: m,
            need: f.model.kind().param_count() + 2,
        }),
    }
}

fn no_comparable(candidates: &[Candidate]) -> FitError {
    let detail = candidates
        .iter()
        .filter_map(|c| c.outcome.as_ref().err())
        .next()
        .map_or_else(|| "no candidates".to_string(), |e| e.to_string());
    FitError::NoComparableModel { detail }
}

/// The next simpler family, if this fit's extra parameter is not shown to be needed.
fn step_down(f: &Fit) -> Option<StepDown> {
    let from = f.model.kind();
    let tau0 = f.estimate(ParamName::Tau0);
    let n = f.estimate(ParamName::N);
    let make = |to, e: &Estimate, null_value| StepDown {
        from,
        to,
        estimate: e.clone(),
        null_value,
    };
    match from {
        ModelKind::HerschelBulkley => match (tau0, n) {
            (Some(t), _) if t.ci_includes(0.0) => Some(make(ModelKind::PowerLaw, t, 0.0)),
            (_, Some(n)) if n.ci_includes(1.0) => Some(make(ModelKind::Bingham, n, 1.0)),
            _ => None,
        },
        ModelKind::Bingham | ModelKind::Casson => tau0
            .filter(|t| t.ci_includes(0.0))
            .map(|t| make(ModelKind::Newtonian, t, 0.0)),
        ModelKind::PowerLaw => n
            .filter(|n| n.ci_includes(1.0))
            .map(|n| make(ModelKind::Newtonian, n, 1.0)),
        ModelKind::Newtonian => None,
    }
}
