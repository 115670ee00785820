//! A fitted curve's 95 % confidence band: the parameter covariance carried into the stress at
//! a shear rate by linear propagation through central finite-difference gradients (the delta
//! method, e.g. JCGM 100:2008 *Guide to the expression of uncertainty in measurement*,
//! §5.1.2), scaled by the same Student t factor as the parameters' intervals.

use super::fit::Fit;
use super::model::Model;
use super::stats::t975;

/// Relative step of the finite differences.
const STEP: f64 = 1e-5;

/// [low, high] of the fitted stress at `rate`, Pa: τ ± t(0.975, dof)·√(gᵀCg). `None` without
/// a covariance or degrees of freedom.
pub fn stress_band(fit: &Fit, rate: f64) -> Option<(f64, f64)> {
    let c = fit.covariance.as_ref()?;
    let t = t975(fit.dof)?;
    let sd = propagated_sd(fit.model, c, |m| Ok::<f64, ()>(m.stress(rate))).ok()?;
    let half = t * sd;
    let y = fit.model.stress(rate);
    Some((y - half, y + half))
}

/// √(gᵀCg) for a quantity `f` of the model, g its gradient in the parameters (in
/// `param_names` order, as C is); a parameter with no variance (held at a bound) adds nothing.
pub fn propagated_sd<E>(
    model: Model,
    covariance: &[Vec<f64>],
    f: impl Fn(Model) -> Result<f64, E>,
) -> Result<f64, E> {
    let values: Vec<f64> = model.params().iter().map(|(_, v)| *v).collect();
    let entry = |i: usize, j: usize| {
        covariance
            .get(i)
            .and_then(|r| r.get(j))
            .copied()
            .unwrap_or(0.0)
    };
    let mut grad = vec![0.0; values.len()];
    for (i, g) in grad.iter_mut().enumerate() {
        let var = entry(i, i);
        if var <= 0.0 {
            continue;
        }
        let h = STEP * values[i].abs().max(var.sqrt());
        let lo = (values[i] - h).max(0.0);
        let up = f(model.with_param(i, values[i] + h))?;
        let down = f(model.with_param(i, lo))?;
        *g = (up - down) / (values[i] + h - lo);
    }
    let mut var = 0.0;
    for (i, gi) in grad.iter().enumerate() {
        for (j, gj) in grad.iter().enumerate() {
            var += gi * entry(i, j) * gj;
        }
    }
    Ok(var.max(0.0).sqrt())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rheology::{FitOptions, ModelKind, Point, fit};

    // Derivation: for τ = μ·γ̇ the gradient in μ is γ̇, so √(gᵀCg) = γ̇·se(μ) and the band's
    // half-width at γ̇ is γ̇ times the half-width of μ's own 95 % interval (same t).
    #[test]
    fn a_newtonian_band_is_the_rate_times_the_viscosity_interval() {
        let scatter = [0.01, -0.02, 0.015, -0.01, 0.02];
        let points: Vec<Point> = [10.0, 20.0, 50.0, 100.0, 200.0]
            .iter()
            .zip(scatter)
            .map(|(&g, e)| Point::new(g, 0.5 * g * (1.0 + e)))
            .collect();
        let f = fit(ModelKind::Newtonian, &points, &FitOptions::default()).unwrap();
        let (lo, hi) = f.estimates[0].ci95.unwrap();
        let (blo, bhi) = stress_band(&f, 80.0).unwrap();
        let want = 80.0 * (hi - lo) / 2.0;
        assert!(
            ((bhi - blo) / 2.0 - want).abs() < 1e-6 * want,
            "{blo} {bhi} {want}"
        );
    }
}
