//! Fitting the gel build-up to rested-gel readings: nonlinear least squares for (τi, τ∞, tr)
//! with 95 % intervals from three or more readings; two readings fix τi and τ∞ only once the
//! time constant is given or assumed.
//!
//! Intervals: C = s²(JᵀJ)⁻¹ with s² = SSR/(m − 3) and t(0.975, m − 3) when the readings leave
//! scatter to size them (the convention of `rheology::stats`). Three readings fit the three
//! constants exactly and leave none; the interval then assumes each reading is good to a
//! relative standard deviation (default 5 %, common practice, no source) with z = 1.96.

use super::error::RestartError;
use super::gel::GelCurve;
use crate::rheology::levenberg::{Curve, Data, minimise, normal};
use crate::rheology::linalg::{Mat3, Vec3, inverse_spd};
use crate::rheology::stats::t975;

/// Assumed relative standard deviation of one gel reading when the fit leaves no scatter
/// (common practice, no source: gel readings repeat to a few per cent at best).
pub const DEFAULT_READING_RELATIVE_SD: f64 = 0.05;
/// Two-sided 95 % normal quantile.
const Z975: f64 = 1.959_963_985;
/// Time constants beyond this multiple of the longest rest are not told apart from a gel
/// still building linearly; the fit is held there and says so.
const MAX_TR_PER_LONGEST_REST: f64 = 100.0;

/// One rested-gel reading: rest time before it, s, and the gel stress, Pa.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct GelReading {
    pub rest_s: f64,
    pub stress_pa: f64,
}

/// What the fit may assume.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GelFitOptions {
    /// With two readings: the time constant to use (from the site); `None` assumes it equals
    /// the longer rest time.
    pub time_constant_s: Option<f64>,
    /// Relative standard deviation of one reading, used only when no scatter is left.
    pub reading_relative_sd: f64,
}

impl Default for GelFitOptions {
    fn default() -> Self {
        GelFitOptions {
            time_constant_s: None,
            reading_relative_sd: DEFAULT_READING_RELATIVE_SD,
        }
    }
}

/// How the constants were found.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum GelFitKind {
    /// All three fitted by least squares.
    Fitted,
    /// Two readings; the time constant came with the question (the site's value).
    TwoReadingsTimeConstantGiven,
    /// Two readings; the time constant was assumed equal to the longer rest time.
    TwoReadingsTimeConstantAssumed,
    /// Given directly (the site's constants, flags), not fitted.
    Given,
    /// Fitted, but the gel was still building at the longest rest: tr was held at its cap
    /// and τ∞ is an extrapolation.
    StillBuilding,
}

/// Where the intervals come from.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum IntervalBasis {
    /// The readings' own scatter, with this many degrees of freedom.
    Scatter { dof: usize },
    /// No scatter left (three readings); each reading assumed good to this relative SD.
    AssumedReadingError { relative_sd: f64 },
    /// No interval (two readings, or the covariance could not be formed).
    None,
}

/// The fitted build-up with its uncertainty.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct GelFit {
    pub curve: GelCurve,
    pub kind: GelFitKind,
    /// Covariance of (τi, τ∞, tr), when known.
    pub covariance: Option<[[f64; 3]; 3]>,
    /// t or z factor for 95 % intervals from `covariance`.
    pub coverage: f64,
    pub basis: IntervalBasis,
    pub readings: Vec<GelReading>,
}

impl GelFit {
    /// 95 % intervals on (τi, τ∞, tr), when known.
    pub fn ci95(&self) -> Option<[(f64, f64); 3]> {
        let c = self.covariance?;
        let v = [
            self.curve.initial_pa,
            self.curve.long_rest_pa,
            self.curve.time_constant_s,
        ];
        Some(std::array::from_fn(|i| {
            let h = self.coverage * c[i][i].max(0.0).sqrt();
            (v[i] - h, v[i] + h)
        }))
    }

    /// The same fit with both stresses (and their uncertainty) multiplied by `factor`.
    pub fn scaled(&self, factor: f64) -> GelFit {
        let mut out = self.clone();
        out.curve = self.curve.scaled(factor);
        out.covariance = self.covariance.map(|c| {
            std::array::from_fn(|i| {
                std::array::from_fn(|j| {
                    let fi = if i < 2 { factor } else { 1.0 };
                    let fj = if j < 2 { factor } else { 1.0 };
                    c[i][j] * fi * fj
                })
            })
        });
        out
    }

    /// A build-up given directly (the site's constants, flags): no interval.
    pub fn given(curve: GelCurve) -> GelFit {
        GelFit {
            curve,
            kind: GelFitKind::Given,
            covariance: None,
            coverage: 0.0,
            basis: IntervalBasis::None,
            readings: Vec::new(),
        }
    }
}

/// Fit τ(t) = τ∞ − (τ∞ − τi)·e^(−t/tr) to the readings.
pub fn fit_gel(readings: &[GelReading], opts: &GelFitOptions) -> Result<GelFit, RestartError> {
    check(readings)?;
    let mut sorted = readings.to_vec();
    sorted.sort_by(|a, b| a.rest_s.total_cmp(&b.rest_s));
    let distinct = distinct_times(&sorted);
    if distinct < 2 {
        return Err(RestartError::TooFewReadings { have: distinct });
    }
    if falls(&sorted) {
        return Err(RestartError::GelFalls);
    }
    if distinct == 2 {
        return two_readings(&sorted, opts);
    }
    least_squares(&sorted, opts)
}

fn check(readings: &[GelReading]) -> Result<(), RestartError> {
    for (i, r) in readings.iter().enumerate() {
        if !r.rest_s.is_finite() || r.rest_s < 0.0 {
            return Err(RestartError::NegativeRestTime {
                index: i + 1,
                value: r.rest_s,
            });
        }
        if !r.stress_pa.is_finite() || r.stress_pa < 0.0 {
            return Err(RestartError::BadGelStress {
                index: i + 1,
                value: r.stress_pa,
            });
        }
    }
    Ok(())
}

fn distinct_times(sorted: &[GelReading]) -> usize {
    let mut times: Vec<f64> = sorted.iter().map(|r| r.rest_s).collect();
    times.dedup();
    times.len()
}

/// The longest rest reads lower than the shortest: not a build-up.
fn falls(sorted: &[GelReading]) -> bool {
    match (sorted.first(), sorted.last()) {
        (Some(a), Some(b)) => b.stress_pa < a.stress_pa,
        _ => false,
    }
}

/// With tr fixed the curve is linear in (τi, τ∞): τ = τi·e + τ∞·(1 − e). Least squares on
/// the 2×2 normal equations; `None` if the two columns cannot be told apart.
fn linear_for(sorted: &[GelReading], tr: f64) -> Option<(f64, f64, f64)> {
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

fn two_readings(sorted: &[GelReading], opts: &GelFitOptions) -> Result<GelFit, RestartError> {
    let longest = sorted.last().map_or(0.0, |r| r.rest_s);
    let (tr, kind) = match opts.time_constant_s {
        Some(tr) => (tr, GelFitKind::TwoReadingsTimeConstantGiven),
        None => (longest, GelFitKind::TwoReadingsTimeConstantAssumed),
    };
    let (ti, tinf, _) = linear_for(sorted, tr).ok_or(RestartError::FitFailed)?;
    if ti < 0.0 {
        return Err(RestartError::FitFailed);
    }
    Ok(GelFit {
        curve: GelCurve::new(ti, tinf, tr)?,
        kind,
        covariance: None,
        coverage: 0.0,
        basis: IntervalBasis::None,
        readings: sorted.to_vec(),
    })
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

fn least_squares(sorted: &[GelReading], opts: &GelFitOptions) -> Result<GelFit, RestartError> {
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
