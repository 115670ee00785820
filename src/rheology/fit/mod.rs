//! Least-squares fit of one flow model to shear-stress readings, with 95 % intervals.

mod curves;
mod log;
pub(crate) mod solve;

use super::data::{Point, check_counts, check_points};
use super::error::{FitError, NoCi};
use super::kind::{ModelKind, ParamName};
use super::levenberg::Data;
use super::model::Model;
use super::stats;

/// How residuals are weighted in the objective.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Weighting {
    /// Residual τ − τ̂ in Pa: every reading counts the same in Pa.
    #[default]
    Unweighted,
    /// Residual (τ − τ̂)/τ: every reading counts the same in per cent; for data spanning decades.
    Relative,
    /// Residual ln τ − ln τ̂: the log–log regression published constants are usually fitted by.
    Log,
}

impl Weighting {
    /// The name typed on the command line and written in JSON (`weighting`).
    pub fn name(self) -> &'static str {
        match self {
            Weighting::Unweighted => "none",
            Weighting::Relative => "relative",
            Weighting::Log => "log",
        }
    }
}

#[derive(Debug, Clone, Copy, Default)]
pub struct FitOptions {
    pub weighting: Weighting,
}

/// One parameter's estimate.
#[derive(Debug, Clone, PartialEq)]
pub struct Estimate {
    pub name: ParamName,
    pub value: f64,
    pub std_error: Option<f64>,
    /// 95 % interval, estimate ± t(0.975, dof)·SE.
    pub ci95: Option<(f64, f64)>,
    /// Held at its bound (τ0 = 0) because the free optimum lay beyond it.
    pub at_bound: bool,
    /// Why `ci95` is `None`.
    pub no_ci: Option<NoCi>,
}

impl Estimate {
    pub(crate) fn without_ci(name: ParamName, value: f64, why: NoCi, at_bound: bool) -> Self {
        Estimate {
            name,
            value,
            std_error: None,
            ci95: None,
            at_bound,
            no_ci: Some(why),
        }
    }

    /// True when the interval reaches or crosses `value` (say, a yield stress CI including 0).
    /// With no interval (bound, no dof, singular) nothing shows the parameter differs: true.
    pub fn ci_includes(&self, value: f64) -> bool {
        self.ci95.is_none_or(|(lo, hi)| lo <= value && value <= hi)
    }
}

/// A fitted model with everything needed to judge it. See [`super::stats`] for the conventions.
#[derive(Debug, Clone, PartialEq)]
pub struct Fit {
    pub model: Model,
    /// In the order of [`ModelKind::param_names`].
    pub estimates: Vec<Estimate>,
    /// C = s²(JᵀJ)⁻¹ in the order of [`ModelKind::param_names`] (the matrix the intervals
    /// use); a parameter held at its bound has a zero row and column. `None` with no degrees
    /// of freedom or a singular JᵀJ.
    pub covariance: Option<Vec<Vec<f64>>>,
    /// On raw stress, unweighted.
    pub r_squared: f64,
    /// √(Σ(τ − τ̂)²/m), Pa, unweighted.
    pub rmse_pa: f64,
    /// `None` unless m − p − 1 > 0.
    pub aicc: Option<f64>,
    /// τ − τ̂ per reading, Pa, in input order.
    pub residuals_pa: Vec<f64>,
    /// m − number of estimated (not bound) parameters.
    pub dof: usize,
    /// Minimiser passes, summed over all starts and any refit at the bound.
    pub iterations: usize,
    /// The minimised objective: Σ(τ − τ̂)² in Pa², or Σ((τ − τ̂)/τ)² for relative weighting.
    pub ssr: f64,
    pub weighting: Weighting,
}

impl Fit {
    pub fn estimate(&self, p: ParamName) -> Option<&Estimate> {
        self.estimates.iter().find(|e| e.name == p)
    }
}

/// Fit one model to the readings by least squares on shear stress.
pub fn fit(kind: ModelKind, points: &[Point], opts: &FitOptions) -> Result<Fit, FitError> {
    check_points(points)?;
    check_counts(kind, points, kind.param_count())?;
    let x: Vec<f64> = points.iter().map(|p| p.shear_rate).collect();
    let lx: Vec<f64> = x.iter().map(|x| x.ln()).collect();
    let y: Vec<f64> = points.iter().map(|p| p.shear_stress).collect();
    let w: Vec<f64> = match opts.weighting {
        Weighting::Unweighted => vec![1.0; points.len()],
        Weighting::Relative | Weighting::Log => y.iter().map(|t| 1.0 / t).collect(),
    };
    let d = Data {
        x: &x,
        lx: &lx,
        y: &y,
        w: &w,
    };
    let solved = match opts.weighting {
        Weighting::Log => log::solve_log(kind, &d)?,
        Weighting::Unweighted | Weighting::Relative => solve::solve(kind, &d)?,
    };
    check_physical(&solved.model)?;
    let fit = stats::assemble(solved, &d, opts.weighting);
    check_quality(&fit)?;
    Ok(fit)
}

/// A fit whose quality figures are not finite numbers cannot be judged, so it is not shown.
fn check_quality(fit: &Fit) -> Result<(), FitError> {
    let finite = fit.r_squared.is_finite() && fit.rmse_pa.is_finite() && fit.ssr.is_finite();
    if finite {
        Ok(())
    } else {
        Err(FitError::QualityNotFinite {
            model: fit.model.kind(),
        })
    }
}

/// Viscosities and K must come out above zero, and nothing may be NaN.
fn check_physical(model: &Model) -> Result<(), FitError> {
    for (name, value) in model.params() {
        let must_be_positive = !matches!(name, ParamName::Tau0);
        // τ0 ≥ 0 is held by every solver; this is the last guard on the number reported.
        if !value.is_finite() || (must_be_positive && value <= 0.0) || value < 0.0 {
            return Err(FitError::NotPhysical {
                model: model.kind(),
                detail: format!(
                    "the fitted {} is {value}, not a finite value above zero; \
                     the stress does not rise with shear rate in these readings",
                    name.label()
                ),
            });
        }
    }
    Ok(())
}
