//! The power law from a straight line in log–log coordinates, with its textbook intervals.
//!
//! Ordinary least squares on the logarithms (Draper & Smith 1998, *Applied Regression
//! Analysis*, 3rd ed., ch. 1, from memory): fit ln τ = ln K + n·ln γ̇ by ordinary least squares; SE(n) = √(s²/Sxx),
//! s² = SSR/(m − 2); 95 % CI n ± t(0.975, m − 2)·SE(n); for K, exp(ln K ± t·SE(ln K)).
//! A log fit weights relative errors, so it differs from [`super::fit`] on stress; it is the
//! quick look and the nonlinear fit's start.

use super::data::{Point, check_counts, check_points};
use super::error::FitError;
use super::kind::ModelKind;
use super::linear::{LineFit, fit_line};
use super::stats::t975;

/// A power law read off the log–log line.
#[derive(Debug, Clone, PartialEq)]
pub struct LogPowerLaw {
    pub k: f64,
    pub n: f64,
    pub se_n: Option<f64>,
    pub se_ln_k: Option<f64>,
    pub n_ci95: Option<(f64, f64)>,
    /// Not symmetric about K: the interval is taken on ln K and mapped back.
    pub k_ci95: Option<(f64, f64)>,
    /// The line itself, x = ln γ̇, y = ln τ.
    pub line: LineFit,
}

/// Fit the power law on logarithms; needs two readings at two different rates.
pub fn fit_power_law_log(points: &[Point]) -> Result<LogPowerLaw, FitError> {
    check_points(points)?;
    check_counts(ModelKind::PowerLaw, points, 2)?;
    let x: Vec<f64> = points.iter().map(|p| p.shear_rate.ln()).collect();
    let y: Vec<f64> = points.iter().map(|p| p.shear_stress.ln()).collect();
    let line = fit_line(&x, &y).ok_or(FitError::TooFewDistinctRates {
        model: ModelKind::PowerLaw,
        have: 1,
        need: 2,
    })?;
    let (k, n) = (line.intercept.exp(), line.slope);
    if !(k.is_finite() && k > 0.0 && n.is_finite() && n > 0.0) {
        return Err(FitError::NotPhysical {
            model: ModelKind::PowerLaw,
            detail: format!(
                "the log–log line gives K = {k} Pa·sⁿ and n = {n}, not finite values above \
                 zero; the stress does not rise with shear rate in these readings"
            ),
        });
    }
    let t = t975(line.dof());
    let se_n = line.se_slope();
    let se_ln_k = line.se_intercept();
    let interval = |v: f64, se: Option<f64>| t.zip(se).map(|(t, se)| (v - t * se, v + t * se));
    let ln_k_ci = interval(line.intercept, se_ln_k);
    Ok(LogPowerLaw {
        k,
        n,
        se_n,
        se_ln_k,
        n_ci95: interval(line.slope, se_n),
        k_ci95: ln_k_ci.map(|(lo, hi)| (lo.exp(), hi.exp())),
        line,
    })
}
