//! Least squares on ln τ (`Weighting::Log`): the log–log regression that published constants
//! are usually fitted by.
//!
//! Each model's curve f is wrapped so the minimiser sees ln f and ∂ln f/∂β = (∂f/∂β)/f, with
//! the readings as ln τ and unit weights: the objective is Σ(ln τ − ln τ̂)². For the power law
//! this is exactly the straight line ln τ = ln K + n·ln γ̇ by ordinary least squares, the fit
//! of e.g. Steffe (1996), *Rheological Methods in Food Process Engineering*, §1.3 and the
//! worked examples of ch. 2. The start is the relative-weighted fit on stress, which the log
//! objective matches to first order ((τ − τ̂)/τ ≈ ln τ − ln τ̂). τ0 ≥ 0 is held as for the
//! other weightings: a free optimum below zero is refitted with τ0 at 0.

use super::curves::{CassonRoots, HerschelBulkley, Line, Linear0, Power};
use super::solve::{Solved, jtj_inverse, run, solve};
use crate::rheology::error::FitError;
use crate::rheology::kind::ModelKind;
use crate::rheology::levenberg::{Curve, Data, Minimum};
use crate::rheology::linalg::{Mat3, Vec3};
use crate::rheology::model::Model;

/// ln of a curve, for residuals on ln τ. A non-positive stress has no logarithm: NaN, which
/// the minimiser refuses like an uphill step.
struct LogOf<'a, C>(&'a C);

impl<C: Curve> Curve for LogOf<'_, C> {
    fn p(&self) -> usize {
        self.0.p()
    }
    fn eval(&self, b: &Vec3, x: f64, lx: f64) -> (f64, Vec3) {
        let (f, g) = self.0.eval(b, x, lx);
        if f > 0.0 {
            (f.ln(), [g[0] / f, g[1] / f, g[2] / f])
        } else {
            (f64::NAN, [0.0; 3])
        }
    }
    fn feasible(&self, b: &Vec3) -> bool {
        self.0.feasible(b)
    }
}

/// Readings on ln τ with unit weights.
struct LogData {
    ly: Vec<f64>,
    ones: Vec<f64>,
}

impl LogData {
    fn view<'a>(&'a self, d: &Data<'a>) -> Data<'a> {
        Data {
            x: d.x,
            lx: d.lx,
            y: &self.ly,
            w: &self.ones,
        }
    }
}

/// Fit `kind` by least squares on ln τ. `d` holds the stresses with relative weights (1/τ).
pub(crate) fn solve_log(kind: ModelKind, d: &Data) -> Result<Solved, FitError> {
    let start = solve(kind, d)?;
    let logs = LogData {
        ly: d.y.iter().map(|y| y.ln()).collect(),
        ones: vec![1.0; d.y.len()],
    };
    let ld = logs.view(d);
    match start.model {
        Model::Newtonian { mu } => {
            let (min, inv) = polish(kind, &Linear0, &ld, [mu, 0.0, 0.0])?;
            Ok(Solved::new(Model::Newtonian { mu: min.beta[0] }, inv, &min))
        }
        Model::PowerLaw { k, n } => {
            let (min, inv) = polish(kind, &Power, &ld, [k, n, 0.0])?;
            let (k, n) = (min.beta[0], min.beta[1]);
            Ok(Solved::new(Model::PowerLaw { k, n }, inv, &min))
        }
        Model::Bingham { tau0, mu_p } => bingham(&ld, tau0, mu_p),
        Model::HerschelBulkley { tau0, k, n } => herschel_bulkley(&ld, [tau0, k, n]),
        Model::Casson { tau0, mu_c } => casson(&ld, tau0, mu_c),
    }
}

/// Minimise on logs from `start`; with (JᵀJ)⁻¹ of the log problem for the intervals.
fn polish<C: Curve>(
    kind: ModelKind,
    c: &C,
    ld: &Data,
    start: Vec3,
) -> Result<(Minimum, Option<Mat3>), FitError> {
    let log = LogOf(c);
    let min = run(kind, &log, ld, start)?;
    let inv = jtj_inverse(&log, ld, &min.beta);
    Ok((min, inv))
}

/// τ = μ·γ̇ on logs, for a τ0 held at zero (μ is μp or μc).
fn origin(kind: ModelKind, ld: &Data, mu: f64) -> Result<(Minimum, Option<Mat3>), FitError> {
    polish(kind, &Linear0, ld, [mu, 0.0, 0.0])
}

fn bingham(ld: &Data, tau0: f64, mu_p: f64) -> Result<Solved, FitError> {
    let kind = ModelKind::Bingham;
    let (min, inv) = polish(kind, &Line, ld, [tau0.max(0.0), mu_p, 0.0])?;
    if min.beta[0] < 0.0 {
        let (lin, inv) = origin(kind, ld, mu_p)?;
        let model = Model::Bingham {
            tau0: 0.0,
            mu_p: lin.beta[0],
        };
        return Ok(Solved::new(model, inv, &lin).tau0_at_bound(min.iterations));
    }
    let model = Model::Bingham {
        tau0: min.beta[0],
        mu_p: min.beta[1],
    };
    Ok(Solved::new(model, inv, &min))
}

fn herschel_bulkley(ld: &Data, start: Vec3) -> Result<Solved, FitError> {
    let kind = ModelKind::HerschelBulkley;
    let (min, inv) = polish(
        kind,
        &HerschelBulkley,
        ld,
        [start[0].max(0.0), start[1], start[2]],
    )?;
    if min.beta[0] < 0.0 {
        let (pl, inv) = polish(kind, &Power, ld, [start[1], start[2], 0.0])?;
        let model = Model::HerschelBulkley {
            tau0: 0.0,
            k: pl.beta[0],
            n: pl.beta[1],
        };
        return Ok(Solved::new(model, inv, &pl).tau0_at_bound(min.iterations));
    }
    let model = Model::HerschelBulkley {
        tau0: min.beta[0],
        k: min.beta[1],
        n: min.beta[2],
    };
    Ok(Solved::new(model, inv, &min))
}

/// On τ = (a + b√γ̇)², as the stress fit does; b ≥ 0 so a carries the sign of √τ0.
fn casson(ld: &Data, tau0: f64, mu_c: f64) -> Result<Solved, FitError> {
    let kind = ModelKind::Casson;
    let start = [tau0.max(0.0).sqrt(), mu_c.max(0.0).sqrt(), 0.0];
    let (min, _) = polish(kind, &CassonRoots, ld, start)?;
    let sign = if min.beta[1] < 0.0 { -1.0 } else { 1.0 };
    let (a, b) = (sign * min.beta[0], sign * min.beta[1]);
    if a < 0.0 {
        let (lin, inv) = origin(kind, ld, mu_c)?;
        let model = Model::Casson {
            tau0: 0.0,
            mu_c: lin.beta[0],
        };
        return Ok(Solved::new(model, inv, &lin).tau0_at_bound(min.iterations));
    }
    // Delta method: C(τ0, μc) = D·C(a, b)·D with D = diag(2a, 2b).
    let scale = [2.0 * a, 2.0 * b, 0.0];
    let inv = jtj_inverse(&LogOf(&CassonRoots), ld, &[a, b, 0.0])
        .map(|c| std::array::from_fn(|i| std::array::from_fn(|j| c[i][j] * scale[i] * scale[j])));
    let model = Model::Casson {
        tau0: a * a,
        mu_c: b * b,
    };
    Ok(Solved::new(model, inv, &min))
}
