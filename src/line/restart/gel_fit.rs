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
use super::gel_lsq::{least_squares, linear_for};

/// Assumed relative standard deviation of one gel reading when the fit leaves no scatter
/// (common practice, no source: gel readings repeat to a few per cent at best).
pub const DEFAULT_READING_RELATIVE_SD: f64 = 0.05;

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
