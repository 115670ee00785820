//! The gel fit's 95 % intervals carried into the gel stress at a stop and into the longest
//! safe stop, by linear propagation: var τ(t) = gᵀCg with g = ∂τ/∂(τi, τ∞, tr) and C the fit's
//! covariance. The safe stop's band is where the upper and lower edges of that gel band cross
//! the allowed stress (the upper edge gives the short end).

use super::gel_fit::GelFit;
use super::safe_stop::MaxStop;

/// Points per decade of rest time when searching for a crossing, before bisection.
const SCAN_PER_DECADE: usize = 40;
/// Rest times searched, as multiples of the time constant: e^(−50) leaves nothing to build.
const SCAN_SPAN: (f64, f64) = (1e-6, 50.0);

/// The longest safe stop's 95 % band: (short end, long end).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct StopBand {
    pub low: MaxStop,
    pub high: MaxStop,
}

/// The gel stress after a rest with its 95 % band (low, high), Pa; `None` without a covariance.
pub fn gel_band(fit: &GelFit, rest_s: f64) -> Option<(f64, f64)> {
    let c = fit.covariance?;
    let g = fit.curve.gradient_at(rest_s);
    let var: f64 = (0..3)
        .map(|i| (0..3).map(|j| g[i] * c[i][j] * g[j]).sum::<f64>())
        .sum();
    let half = fit.coverage * var.max(0.0).sqrt();
    let mid = fit.curve.stress_at(rest_s);
    Some(((mid - half).max(0.0), mid + half))
}

/// The longest safe stop at each edge of the gel band; `None` without a covariance.
pub fn longest_safe_stop_band(fit: &GelFit, allowed_pa: f64) -> Option<StopBand> {
    fit.covariance?;
    let upper = |t: f64| gel_band(fit, t).map_or(f64::NAN, |b| b.1);
    let lower = |t: f64| gel_band(fit, t).map_or(f64::NAN, |b| b.0);
    Some(StopBand {
        low: first_crossing(&upper, allowed_pa, fit.curve.time_constant_s),
        high: first_crossing(&lower, allowed_pa, fit.curve.time_constant_s),
    })
}

/// The first rest at which `edge(t)` reaches `allowed`: a log scan, then bisection.
fn first_crossing(edge: &dyn Fn(f64) -> f64, allowed: f64, tr: f64) -> MaxStop {
    if allowed <= 0.0 || edge(0.0) >= allowed {
        return MaxStop::AlreadyTooLate;
    }
    let (lo, hi) = (SCAN_SPAN.0 * tr, SCAN_SPAN.1 * tr);
    let steps = ((hi / lo).log10() * SCAN_PER_DECADE as f64).ceil() as usize;
    let ratio = (hi / lo).powf(1.0 / steps as f64);
    let mut before = 0.0;
    let mut t = lo;
    for _ in 0..=steps {
        if edge(t) >= allowed {
            return MaxStop::After(bisect(edge, allowed, before, t));
        }
        before = t;
        t *= ratio;
    }
    MaxStop::Never
}

fn bisect(edge: &dyn Fn(f64) -> f64, allowed: f64, mut a: f64, mut b: f64) -> f64 {
    for _ in 0..100 {
        let m = 0.5 * (a + b);
        if edge(m) >= allowed {
            b = m;
        } else {
            a = m;
        }
        if b - a <= 1e-9 * b {
            break;
        }
    }
    0.5 * (a + b)
}
