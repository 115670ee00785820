//! From a least-squares optimum to what is reported: standard errors, 95 % intervals, R², RMSE,
//! AICc.
//!
//! Conventions (the same for every model and weighting):
//! - Covariance C = s²(JᵀJ)⁻¹ with s² = SSR/(m − p_free), SSR the fit's own (weighted) objective;
//!   CI = estimate ± t(0.975, m − p_free)·√Cjj. This is what scipy's `curve_fit` returns with
//!   `absolute_sigma=False` (SciPy documentation of `scipy.optimize.curve_fit`).
//! - R² = 1 − Σ(τ − τ̂)²/Σ(τ − τ̄)² and RMSE = √(Σ(τ − τ̂)²/m) are always on the raw stresses
//!   in Pa, unweighted, so they read the same whichever weighting was fitted.
//! - AICc = m·ln(SSR/m) + 2k + 2k(k+1)/(m − k − 1) (Hurvich & Tsai 1989, from memory), with SSR
//!   the weighted objective and k = the model family's parameter count p (σ not counted; a τ0
//!   held at its bound still counts, so a collapsed family never beats the simpler one).

use super::error::NoCi;
use super::fit::solve::Solved;
use super::fit::{Estimate, Fit, Weighting};
use super::kind::ParamName;
use super::levenberg::Data;
use statrs::distribution::{ContinuousCDF, StudentsT};

/// Degrees of freedom whose quantile is kept after first use (every plant set is smaller).
const T975_CACHED: usize = 64;

/// Student t quantile t(0.975, dof); `None` for zero degrees of freedom. The quantile is an
/// iterative inverse of the incomplete beta function, a noticeable share of a fit's time, so
/// small dof are computed once per process.
pub fn t975(dof: usize) -> Option<f64> {
    static TABLE: std::sync::OnceLock<[Option<f64>; T975_CACHED]> = std::sync::OnceLock::new();
    if dof < T975_CACHED {
        return TABLE.get_or_init(|| std::array::from_fn(t975_computed))[dof];
    }
    t975_computed(dof)
}

fn t975_computed(dof: usize) -> Option<f64> {
    if dof == 0 {
        return None;
    }
    let t = StudentsT::new(0.0, 1.0, dof as f64)
        .ok()?
        .inverse_cdf(0.975);
    t.is_finite().then_some(t)
}

/// AICc for a weighted SSR over m points with k parameters; `None` unless m − k − 1 > 0.
/// SSR is floored at rounding level (8ε of the RMS weighted reading) so exact data stays finite.
pub fn aicc(ssr: f64, m: usize, k: usize, rms_reading: f64) -> Option<f64> {
    if m <= k + 1 {
        return None;
    }
    let (mf, kf) = (m as f64, k as f64);
    let floor = mf * (8.0 * f64::EPSILON * rms_reading).powi(2);
    let ssr = ssr.max(floor).max(f64::MIN_POSITIVE);
    Some(mf * (ssr / mf).ln() + 2.0 * kf + 2.0 * kf * (kf + 1.0) / (mf - kf - 1.0))
}

/// Build the reported fit from an optimum.
pub(crate) fn assemble(solved: Solved, d: &Data, weighting: Weighting) -> Fit {
    let kind = solved.model.kind();
    let m = d.x.len();
    let dof = m - solved.free();
    let estimates = estimates(&solved, dof);
    let covariance = covariance(&solved, dof);
    let residuals_pa: Vec<f64> =
        d.x.iter()
            .zip(d.y)
            .map(|(&x, &y)| y - solved.model.stress(x))
            .collect();
    let raw_ssr: f64 = residuals_pa.iter().map(|r| r * r).sum();
    let rms_w =
        (d.y.iter()
            .zip(d.w)
            .map(|(y, w)| (y * w).powi(2))
            .sum::<f64>()
            / m as f64)
            .sqrt();
    Fit {
        model: solved.model,
        estimates,
        covariance,
        r_squared: r_squared(d.y, raw_ssr),
        rmse_pa: (raw_ssr / m as f64).sqrt(),
        aicc: aicc(solved.ssr, m, kind.param_count(), rms_w),
        residuals_pa,
        dof,
        iterations: solved.iterations,
        ssr: solved.ssr,
        weighting,
    }
}

fn estimates(solved: &Solved, dof: usize) -> Vec<Estimate> {
    let s2 = (dof > 0).then(|| solved.ssr / dof as f64);
    let t = t975(dof);
    let mut free_index = 0;
    let mut one = |(name, value): (ParamName, f64)| {
        if solved.at_bound == Some(name) {
            return Estimate::without_ci(name, value, NoCi::AtBound, true);
        }
        let j = free_index;
        free_index += 1;
        let variance = match (s2, &solved.jtj_inv) {
            (None, _) => Err(NoCi::NoDegreesOfFreedom),
            (Some(_), None) => Err(NoCi::Singular),
            (Some(s2), Some(c)) => Ok(s2 * c[j][j]),
        };
        with_interval(name, value, variance, t)
    };
    solved.model.params().into_iter().map(&mut one).collect()
}

/// s²(JᵀJ)⁻¹ spread over every parameter, zeros for one held at its bound.
fn covariance(solved: &Solved, dof: usize) -> Option<Vec<Vec<f64>>> {
    let s2 = (dof > 0).then(|| solved.ssr / dof as f64)?;
    let inv = solved.jtj_inv.as_ref()?;
    let names = solved.model.kind().param_names();
    let free: Vec<Option<usize>> = names
        .iter()
        .scan(0, |next, name| {
            Some((solved.at_bound != Some(*name)).then(|| {
                *next += 1;
                *next - 1
            }))
        })
        .collect();
    let cell = |i: usize, j: usize| match (free[i], free[j]) {
        (Some(a), Some(b)) => s2 * inv[a][b],
        _ => 0.0,
    };
    let c: Vec<Vec<f64>> = (0..names.len())
        .map(|i| (0..names.len()).map(|j| cell(i, j)).collect())
        .collect();
    c.iter().flatten().all(|v| v.is_finite()).then_some(c)
}

/// SE = √variance and CI = value ± t·SE, or no interval with the reason.
fn with_interval(
    name: ParamName,
    value: f64,
    variance: Result<f64, NoCi>,
    t: Option<f64>,
) -> Estimate {
    match (variance, t) {
        (Ok(var), Some(t)) if var >= 0.0 && var.is_finite() => {
            let se = var.sqrt();
            Estimate {
                name,
                value,
                std_error: Some(se),
                ci95: Some((value - t * se, value + t * se)),
                at_bound: false,
                no_ci: None,
            }
        }
        (Err(why), _) => Estimate::without_ci(name, value, why, false),
        (Ok(_), None) => Estimate::without_ci(name, value, NoCi::NoDegreesOfFreedom, false),
        (Ok(_), Some(_)) => Estimate::without_ci(name, value, NoCi::Singular, false),
    }
}

/// 1 − SSR/SST on raw stress; with all stresses equal (SST = 0) it is 1 for a perfect fit, else 0.
fn r_squared(y: &[f64], raw_ssr: f64) -> f64 {
    let mean = y.iter().sum::<f64>() / y.len() as f64;
    let sst: f64 = y.iter().map(|v| (v - mean).powi(2)).sum();
    if sst > 0.0 {
        1.0 - raw_ssr / sst
    } else if raw_ssr == 0.0 {
        1.0
    } else {
        0.0
    }
}
