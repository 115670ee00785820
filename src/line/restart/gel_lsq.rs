//! The least-squares part of the gel fit: the linear solve for (τi, τ∞) at a fixed time
//! constant, a grid start over tr, Levenberg–Marquardt polish (the minimiser of
//! `rheology::levenberg`), and the covariance the intervals come from.

use super::error::RestartError;
use super::gel::GelCurve;
use super::gel_fit::{GelFit, GelFitKind, GelFitOptions, GelReading, IntervalBasis};
use crate::rheology::levenberg::{Curve, Data, minimise, normal};
use crate::rheology::linalg::{Mat3, Vec3, inverse_spd};
use crate::rheology::stats::t975;

/// Two-sided 95 % normal quantile.
const Z975: f64 = 1.959_963_985;
/// Time constants beyond this multiple of the longest rest are not told apart from a gel
/// still building linearly; the fit is held there and says so.
const MAX_TR_PER_LONGEST_REST: f64 = 100.0;

/// With tr fixed the curve is linear in (τi, τ∞): τ = τi·e + τ∞·(1 − e). Least squares on
/// the 2×2 normal equations; `None` if the two columns cannot be told apart.
pub(super) fn linear_for(sorted: &[GelReading], tr: f64) -> Option<(f64, f64, f64)> {
    let (mut a11, mut a12, mut a22, mut b1, mut b2) = (0.0, 0.0, 0.0, 0.0, 0.0);
    for r in sorted {
        let e = (-r.rest_s / tr).exp();
        let (u, v) = (e, 1.0 - e);
        a11 += u * u;
        a12 += u * v;
        a22 += v * v;
        b1 += u * r.stress_pa;
        b2 += v * r.stress_pa;
    }
    let det = a11 * a22 - a12 * a12;
    if det.abs() <= 1e-12 * (a11 * a22).max(f64::MIN_POSITIVE) {
        return None;
    }
    let ti = (a22 * b1 - a12 * b2) / det;
    let tinf = (a11 * b2 - a12 * b1) / det;
    let curve = GelCurve {
        initial_pa: ti,
        long_rest_pa: tinf,
        time_constant_s: tr,
    };
    let ssr = sorted
        .iter()
        .map(|r| (r.stress_pa - curve.stress_at(r.rest_s)).powi(2))
        .sum();
    Some((ti, tinf, ssr))
}

/// The curve in the minimiser's parameters β = (τi, τ∞, tr).
struct BuildUp {
    tr_cap: f64,
}

impl Curve for BuildUp {
    fn p(&self) -> usize {
        3
    }
    fn eval(&self, b: &Vec3, x: f64, _lx: f64) -> (f64, Vec3) {
        let c = GelCurve {
            initial_pa: b[0],
            long_rest_pa: b[1],
            time_constant_s: b[2],
        };
        (c.stress_at(x), c.gradient_at(x))
    }
    fn feasible(&self, b: &Vec3) -> bool {
        b[2] > 0.0 && b[2] <= self.tr_cap
    }
}

pub(super) fn least_squares(
    sorted: &[GelReading],
    opts: &GelFitOptions,
) -> Result<GelFit, RestartError> {
    let longest = sorted
        .last()
        .map_or(1.0, |r| r.rest_s)
        .max(f64::MIN_POSITIVE);
    let tr_cap = MAX_TR_PER_LONGEST_REST * longest;
    let start = grid_start(sorted, tr_cap).ok_or(RestartError::FitFailed)?;
    let x: Vec<f64> = sorted.iter().map(|r| r.rest_s).collect();
    let y: Vec<f64> = sorted.iter().map(|r| r.stress_pa).collect();
    let (lx, w) = (vec![0.0; x.len()], vec![1.0; x.len()]);
    let data = Data {
        x: &x,
        lx: &lx,
        y: &y,
        w: &w,
    };
    let model = BuildUp { tr_cap };
    let beta = minimise(&model, &data, start).map_or(start, |m| m.beta);
    let kind = if beta[2] >= 0.999 * tr_cap {
        GelFitKind::StillBuilding
    } else {
        GelFitKind::Fitted
    };
    let curve =
        GelCurve::new(beta[0].max(0.0), beta[1], beta[2]).map_err(|_| RestartError::FitFailed)?;
    let (covariance, coverage, basis) = covariance(&model, &data, &beta, opts);
    Ok(GelFit {
        curve,
        kind,
        covariance,
        coverage,
        basis,
        readings: sorted.to_vec(),
    })
}

/// Best (τi, τ∞) for each tr on a log grid from 1/100 of the shortest non-zero rest to the
/// cap: a start the minimiser cannot miss by a wide margin.
fn grid_start(sorted: &[GelReading], tr_cap: f64) -> Option<Vec3> {
    let shortest = sorted.iter().map(|r| r.rest_s).find(|t| *t > 0.0)?;
    let lo = (shortest / 100.0).ln();
    let hi = tr_cap.ln();
    let steps = 200;
    (0..=steps)
        .filter_map(|i| {
            let tr = (lo + (hi - lo) * i as f64 / steps as f64).exp();
            linear_for(sorted, tr).map(|(a, b, ssr)| ([a, b, tr], ssr))
        })
        .min_by(|a, b| a.1.total_cmp(&b.1))
        .map(|(beta, _)| beta)
}

type Cov = (Option<Mat3>, f64, IntervalBasis);

fn covariance(model: &BuildUp, data: &Data, beta: &Vec3, opts: &GelFitOptions) -> Cov {
    let m = data.x.len();
    if m > 3 {
        let n = normal(model, data, beta);
        let dof = m - 3;
        let s2 = n.ssr / dof as f64;
        let cov = inverse_spd(&n.jtj, 3).map(|inv| scale(inv, s2));
        let t = t975(dof).unwrap_or(Z975);
        return match cov {
            Some(c) => (Some(c), t, IntervalBasis::Scatter { dof }),
            None => (None, 0.0, IntervalBasis::None),
        };
    }
    // No scatter left: weight each reading by 1/σ with σ = relative SD × reading.
    let w: Vec<f64> = data
        .y
        .iter()
        .map(|y| 1.0 / (opts.reading_relative_sd * y.abs()).max(1e-9))
        .collect();
    let weighted = Data { w: &w, ..*data };
    let n = normal(model, &weighted, beta);
    match inverse_spd(&n.jtj, 3) {
        Some(c) => (
            Some(c),
            Z975,
            IntervalBasis::AssumedReadingError {
                relative_sd: opts.reading_relative_sd,
            },
        ),
        None => (None, 0.0, IntervalBasis::None),
    }
}

fn scale(m: Mat3, s: f64) -> Mat3 {
    std::array::from_fn(|i| std::array::from_fn(|j| m[i][j] * s))
}
