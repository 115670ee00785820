//! Per-model least squares: starting values, the minimiser, and the τ0 ≥ 0 bound by refit.

use super::curves::{CassonRoots, HerschelBulkley, Line, Linear0, Power};
use crate::rheology::error::FitError;
use crate::rheology::kind::{ModelKind, ParamName};
use crate::rheology::levenberg::{Curve, Data, Minimum, minimise, normal, ssr_at};
use crate::rheology::linalg::{Mat3, Vec3, inverse_spd};
use crate::rheology::linear::{fit_line, weighted_line, weighted_origin_slope};
use crate::rheology::model::Model;

/// Fractions of the smallest stress tried as Herschel–Bulkley starts for τ0 (0.5–1× is
/// common practice, no source; 0 covers the power-law end).
const HB_TAU0_STARTS: [f64; 4] = [0.0, 0.5, 0.75, 0.9];

/// A least-squares optimum in the reported parameters.
pub(crate) struct Solved {
    pub model: Model,
    /// A parameter held at its bound (always τ0 here), not estimated.
    pub at_bound: Option<ParamName>,
    /// (JᵀJ)⁻¹ over the free parameters, in `param_names` order without the bound one.
    pub jtj_inv: Option<Mat3>,
    pub ssr: f64,
    pub iterations: usize,
}

impl Solved {
    pub(crate) fn new(model: Model, jtj_inv: Option<Mat3>, min: &Minimum) -> Self {
        Solved {
            model,
            at_bound: None,
            jtj_inv,
            ssr: min.ssr,
            iterations: min.iterations,
        }
    }

    /// Mark τ0 as held at zero, adding the iterations spent finding it out.
    pub(crate) fn tau0_at_bound(mut self, extra_iterations: usize) -> Self {
        self.at_bound = Some(ParamName::Tau0);
        self.iterations += extra_iterations;
        self
    }

    pub fn free(&self) -> usize {
        self.model.kind().param_count() - usize::from(self.at_bound.is_some())
    }
}

pub(crate) fn solve(kind: ModelKind, d: &Data) -> Result<Solved, FitError> {
    match kind {
        ModelKind::Newtonian => {
            let (min, inv) = origin_line(kind, d)?;
            Ok(Solved::new(Model::Newtonian { mu: min.beta[0] }, inv, &min))
        }
        ModelKind::PowerLaw => power_law(d, kind),
        ModelKind::Bingham => bingham(d),
        ModelKind::HerschelBulkley => herschel_bulkley(d),
        ModelKind::Casson => casson(d),
    }
}

pub(crate) fn run<C: Curve>(
    kind: ModelKind,
    c: &C,
    d: &Data,
    start: Vec3,
) -> Result<Minimum, FitError> {
    minimise(c, d, start).map_err(|f| FitError::NotConverged {
        model: kind,
        iterations: f.iterations,
    })
}

pub(crate) fn jtj_inverse<C: Curve>(c: &C, d: &Data, beta: &Vec3) -> Option<Mat3> {
    inverse_spd(&normal(c, d, beta).jtj, c.p())
}

/// τ = μγ̇ by least squares; also the τ0 = 0 refit of Bingham and Casson.
fn origin_line(kind: ModelKind, d: &Data) -> Result<(Minimum, Option<Mat3>), FitError> {
    let start = weighted_origin_slope(d.x, d.y, d.w).unwrap_or(1.0);
    let min = run(kind, &Linear0, d, [start, 0.0, 0.0])?;
    let inv = jtj_inverse(&Linear0, d, &min.beta);
    Ok((min, inv))
}

/// Start from the log–log line (ordinary least squares on ln τ, ln γ̇), then least squares
/// on stress.
fn power_law(d: &Data, kind: ModelKind) -> Result<Solved, FitError> {
    let ly: Vec<f64> = d.y.iter().map(|y| y.ln()).collect();
    let start = fit_line(d.lx, &ly).map_or([1.0, 1.0, 0.0], |l| {
        [l.intercept.exp(), l.slope.max(0.05), 0.0]
    });
    let min = run(kind, &Power, d, start)?;
    let (k, n) = (min.beta[0], min.beta[1]);
    let inv = jtj_inverse(&Power, d, &min.beta);
    Ok(match kind {
        ModelKind::HerschelBulkley => {
            Solved::new(Model::HerschelBulkley { tau0: 0.0, k, n }, inv, &min)
        }
        _ => Solved::new(Model::PowerLaw { k, n }, inv, &min),
    })
}

/// The model is linear, so a negative weighted-LS intercept puts the constrained optimum at τ0 = 0.
fn bingham(d: &Data) -> Result<Solved, FitError> {
    let kind = ModelKind::Bingham;
    let (a, b) = weighted_line(d.x, d.y, d.w).unwrap_or((0.0, 1.0));
    if a < 0.0 {
        let (min, inv) = origin_line(kind, d)?;
        let model = Model::Bingham {
            tau0: 0.0,
            mu_p: min.beta[0],
        };
        return Ok(Solved::new(model, inv, &min).tau0_at_bound(0));
    }
    let min = run(kind, &Line, d, [a, b, 0.0])?;
    // The bound is held on the minimiser's result too: rounding on extreme readings can carry
    // τ0 below zero even from a start above it.
    if min.beta[0] < 0.0 {
        let (lin, inv) = origin_line(kind, d)?;
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
    Ok(Solved::new(model, jtj_inverse(&Line, d, &min.beta), &min))
}

/// Keep the free optimum if τ0 ≥ 0; otherwise refit as a power law with τ0 held at 0.
fn herschel_bulkley(d: &Data) -> Result<Solved, FitError> {
    let (best, iterations) = hb_free_optimum(d)?;
    if best.beta[0] < 0.0 {
        let kind = ModelKind::HerschelBulkley;
        return Ok(power_law(d, kind)?.tau0_at_bound(iterations));
    }
    let model = Model::HerschelBulkley {
        tau0: best.beta[0],
        k: best.beta[1],
        n: best.beta[2],
    };
    let inv = jtj_inverse(&HerschelBulkley, d, &best.beta);
    let mut solved = Solved::new(model, inv, &best);
    solved.iterations = iterations;
    Ok(solved)
}

/// Several τ0 starts, K and n from the log–log line of τ − τ0; the lowest SSR wins. Returns it
/// with the iterations spent over all starts.
///
/// The starts are run best first (by their own SSR), and once two runs end at the same
/// optimum the rest are skipped: on well-behaved sets every start lands there, and each run
/// is most of a fit's time. Sets where the starts disagree still try every start.
fn hb_free_optimum(d: &Data) -> Result<(Minimum, usize), FitError> {
    let kind = ModelKind::HerschelBulkley;
    let mut best: Option<Minimum> = None;
    let mut last_err = FitError::NotConverged {
        model: kind,
        iterations: 0,
    };
    let mut iterations = 0;
    let mut agreed = 0;
    for start in hb_starts_best_first(d) {
        match run(kind, &HerschelBulkley, d, start) {
            Ok(m) => {
                iterations += m.iterations;
                match &best {
                    Some(b) if same_optimum(b, &m) => agreed += 1,
                    Some(b) if b.ssr <= m.ssr => {}
                    _ => best = Some(m),
                }
                if agreed >= 1 {
                    break;
                }
            }
            Err(e) => last_err = e,
        }
    }
    best.map(|b| (b, iterations)).ok_or(last_err)
}

/// The Herschel–Bulkley starts, lowest starting SSR first (non-finite ones last).
fn hb_starts_best_first(d: &Data) -> Vec<Vec3> {
    let min_tau = d.y.iter().copied().fold(f64::INFINITY, f64::min);
    let mut starts: Vec<(f64, Vec3)> = HB_TAU0_STARTS
        .iter()
        .map(|frac| hb_start(d, frac * min_tau))
        .map(|s| (ssr_at(&HerschelBulkley, d, &s), s))
        .collect();
    starts.sort_by(|a, b| a.0.partial_cmp(&b.0).unwrap_or(std::cmp::Ordering::Equal));
    starts.into_iter().map(|(_, s)| s).collect()
}

/// Two runs ended at one optimum: parameters within 1e-6 relative (their own settling is
/// about 1e-10 standard errors, so distinct optima differ by far more).
fn same_optimum(a: &Minimum, b: &Minimum) -> bool {
    (0..3).all(|i| (a.beta[i] - b.beta[i]).abs() <= 1e-6 * a.beta[i].abs().max(1e-12))
}

fn hb_start(d: &Data, tau0: f64) -> Vec3 {
    let ly: Vec<f64> = d.y.iter().map(|y| (y - tau0).ln()).collect();
    fit_line(d.lx, &ly).map_or([tau0, 1.0, 1.0], |l| {
        [tau0, l.intercept.exp(), l.slope.max(0.05)]
    })
}

/// Start from the straight line of √τ on √γ̇; fit τ = (a + b√γ̇)², then τ0 = a², μc = b².
fn casson(d: &Data) -> Result<Solved, FitError> {
    let kind = ModelKind::Casson;
    let sx: Vec<f64> = d.x.iter().map(|x| x.sqrt()).collect();
    let sy: Vec<f64> = d.y.iter().map(|y| y.sqrt()).collect();
    let (a0, b0) = fit_line(&sx, &sy).map_or((0.0, 1.0), |l| (l.intercept, l.slope));
    let min = run(kind, &CassonRoots, d, [a0, b0, 0.0])?;
    // (a, b) and (−a, −b) draw the same curve; keep b ≥ 0 so a carries the sign of √τ0.
    let sign = if min.beta[1] < 0.0 { -1.0 } else { 1.0 };
    let (a, b) = (sign * min.beta[0], sign * min.beta[1]);
    if a < 0.0 {
        let (lin, inv) = origin_line(kind, d)?;
        let model = Model::Casson {
            tau0: 0.0,
            mu_c: lin.beta[0],
        };
        return Ok(Solved::new(model, inv, &lin).tau0_at_bound(min.iterations));
    }
    // Delta method: C(τ0, μc) = D·C(a, b)·D with D = diag(2a, 2b).
    let scale = [2.0 * a, 2.0 * b, 0.0];
    let inv = jtj_inverse(&CassonRoots, d, &[a, b, 0.0])
        .map(|c| std::array::from_fn(|i| std::array::from_fn(|j| c[i][j] * scale[i] * scale[j])));
    let model = Model::Casson {
        tau0: a * a,
        mu_c: b * b,
    };
    Ok(Solved::new(model, inv, &min))
}
