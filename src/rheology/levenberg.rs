//! Levenberg–Marquardt least squares for up to three parameters, with tight stopping rules.
//!
//! Method: Marquardt (1963), *J. SIAM* 11:431, with Marquardt's diagonal scaling and the damping
//! update of Nielsen (Madsen, Nielsen & Tingleff 2004, *Methods for non-linear least squares
//! problems*, §3.2; both from memory). It stops when the reduction Gauss–Newton still predicts,
//! gᵀ(JᵀJ)⁻¹g, is below 1e-20 of the SSR (parameters then sit about 1e-10 standard errors from
//! the optimum), or when the scaled step falls below 1e-12 of the parameters.

#![allow(clippy::needless_range_loop)] // index loops read like the textbook formulas

use super::linalg::{Mat3, Vec3, solve_spd};

/// Relative size of the scaled step below which the parameters have settled.
const XTOL: f64 = 1e-12;
/// Gauss–Newton predicted reduction, relative to SSR, below which we are at the optimum.
const DECREMENT_TOL: f64 = 1e-20;
/// Each pass (accepted or rejected step) counts one.
pub(crate) const MAX_ITERATIONS: usize = 2000;

/// A curve f(x; β) with its gradient ∂f/∂β, in the parameters the minimiser moves.
/// `lx` is ln x, passed in so power laws need one `exp` per point, not a `powf`.
pub(crate) trait Curve {
    fn p(&self) -> usize;
    fn eval(&self, beta: &Vec3, x: f64, lx: f64) -> (f64, Vec3);
    /// Steps into an infeasible region (say n ≤ 0) are refused like an uphill step.
    fn feasible(&self, _beta: &Vec3) -> bool {
        true
    }
}

/// Readings x (with ln x), y, and weights wᵢ = 1/σᵢ: the objective is Σ(wᵢ(yᵢ − f(xᵢ)))².
#[derive(Debug, Clone, Copy)]
pub(crate) struct Data<'a> {
    pub x: &'a [f64],
    pub lx: &'a [f64],
    pub y: &'a [f64],
    pub w: &'a [f64],
}

impl Data<'_> {
    fn rows(&self) -> impl Iterator<Item = (f64, f64, f64, f64)> + '_ {
        (0..self.x.len()).map(|i| (self.x[i], self.lx[i], self.y[i], self.w[i]))
    }
}

/// Where the minimiser stopped.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Minimum {
    pub beta: Vec3,
    pub ssr: f64,
    pub iterations: usize,
}

/// The minimiser gave up after this many passes (0: the start could not be evaluated).
#[derive(Debug, Clone, Copy)]
pub(crate) struct Failed {
    pub iterations: usize,
}

/// Normal equations JᵀJ, g = Jᵀr and SSR at β.
pub(crate) struct Normal {
    pub jtj: Mat3,
    pub jtr: Vec3,
    pub ssr: f64,
}

pub(crate) fn normal<C: Curve>(c: &C, d: &Data, beta: &Vec3) -> Normal {
    let p = c.p();
    let mut n = Normal {
        jtj: [[0.0; 3]; 3],
        jtr: [0.0; 3],
        ssr: 0.0,
    };
    for (x, lx, y, w) in d.rows() {
        let (f, g) = c.eval(beta, x, lx);
        let r = w * (y - f);
        n.ssr += r * r;
        for i in 0..p {
            let ji = w * g[i];
            n.jtr[i] += ji * r;
            for j in 0..=i {
                n.jtj[i][j] += ji * w * g[j];
            }
        }
    }
    for i in 0..p {
        for j in 0..i {
            n.jtj[j][i] = n.jtj[i][j];
        }
    }
    n
}

/// The weighted SSR at β.
pub(crate) fn ssr_at<C: Curve>(c: &C, d: &Data, beta: &Vec3) -> f64 {
    d.rows()
        .map(|(x, lx, y, w)| (w * (y - c.eval(beta, x, lx).0)).powi(2))
        .sum()
}

/// Minimise the weighted SSR from `start`.
pub(crate) fn minimise<C: Curve>(c: &C, d: &Data, start: Vec3) -> Result<Minimum, Failed> {
    let mut s = State {
        beta: start,
        n: normal(c, d, &start),
        lambda: 1e-3,
        nu: 2.0,
    };
    if !c.feasible(&start) || !s.n.ssr.is_finite() {
        return Err(Failed { iterations: 0 });
    }
    let floor = rounding_floor(d);
    for iteration in 1..=MAX_ITERATIONS {
        let settled = s.n.ssr <= floor || at_optimum(&s.n, c.p());
        match if settled { Pass::Settled } else { s.pass(c, d) } {
            Pass::Settled => {
                return Ok(Minimum {
                    beta: s.beta,
                    ssr: s.n.ssr,
                    iterations: iteration,
                });
            }
            Pass::GaveUp => {
                return Err(Failed {
                    iterations: iteration,
                });
            }
            Pass::Moved => {}
        }
    }
    Err(Failed {
        iterations: MAX_ITERATIONS,
    })
}

/// What one damped step did.
enum Pass {
    Moved,
    Settled,
    GaveUp,
}

struct State {
    beta: Vec3,
    n: Normal,
    lambda: f64,
    nu: f64,
}

impl State {
    /// Try one damped step; accept it if it lowers the SSR, else raise the damping.
    fn pass<C: Curve>(&mut self, c: &C, d: &Data) -> Pass {
        let p = c.p();
        let Some(step) = damped_step(&self.n, p, self.lambda) else {
            return self.reject();
        };
        let small = step_small(&self.n, &self.beta, &step, p);
        let trial: Vec3 = std::array::from_fn(|i| self.beta[i] + step[i]);
        let trial_ssr = if c.feasible(&trial) {
            ssr_at(c, d, &trial)
        } else {
            f64::NAN
        };
        if trial_ssr < self.n.ssr {
            let rho = (self.n.ssr - trial_ssr) / predicted(&self.n, &step, p, self.lambda);
            self.beta = trial;
            self.n = normal(c, d, &trial);
            // Nielsen's update: shrink the damping more the better the model predicted.
            self.lambda =
                (self.lambda * (1.0 - (2.0 * rho - 1.0).powi(3)).max(1.0 / 3.0)).max(1e-15);
            self.nu = 2.0;
            return if small { Pass::Settled } else { Pass::Moved };
        }
        // An uphill step this small means no better point is representable: we are there.
        if small { Pass::Settled } else { self.reject() }
    }

    fn reject(&mut self) -> Pass {
        self.lambda *= self.nu;
        self.nu *= 2.0;
        if self.lambda > 1e30 {
            Pass::GaveUp
        } else {
            Pass::Moved
        }
    }
}

/// Residuals this small are rounding noise on the readings: the data are fitted exactly.
fn rounding_floor(d: &Data) -> f64 {
    let sum_sq: f64 = d.y.iter().zip(d.w).map(|(y, w)| (y * w).powi(2)).sum();
    (16.0 * f64::EPSILON).powi(2) * sum_sq
}

/// Solve (JᵀJ + λ·diag JᵀJ) δ = g.
fn damped_step(n: &Normal, p: usize, lambda: f64) -> Option<Vec3> {
    let mut a = n.jtj;
    for j in 0..p {
        a[j][j] += lambda * n.jtj[j][j].max(f64::MIN_POSITIVE);
    }
    solve_spd(&a, &n.jtr, p)
}

/// SSR reduction the linear model predicts for δ: δᵀ(g + λ·diag(JᵀJ)·δ).
fn predicted(n: &Normal, step: &Vec3, p: usize, lambda: f64) -> f64 {
    (0..p)
        .map(|j| step[j] * (n.jtr[j] + lambda * n.jtj[j][j] * step[j]))
        .sum()
}

/// gᵀ(JᵀJ)⁻¹g ≤ DECREMENT_TOL·SSR: even a full Gauss–Newton step would gain nothing.
fn at_optimum(n: &Normal, p: usize) -> bool {
    solve_spd(&n.jtj, &n.jtr, p).is_some_and(|gn| {
        let decrement: f64 = (0..p).map(|j| gn[j] * n.jtr[j]).sum();
        decrement <= DECREMENT_TOL * n.ssr
    })
}

/// ‖Dδ‖ ≤ XTOL·‖Dβ‖ with D = √diag(JᵀJ), so the test is blind to parameter units.
fn step_small(n: &Normal, beta: &Vec3, step: &Vec3, p: usize) -> bool {
    let (mut ds, mut db) = (0.0, 0.0);
    for j in 0..p {
        ds += n.jtj[j][j] * step[j] * step[j];
        db += n.jtj[j][j] * beta[j] * beta[j];
    }
    ds.sqrt() <= XTOL * (db.sqrt() + XTOL)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// y = exp(b·x); parameters [b].
    struct Exp;
    impl Curve for Exp {
        fn p(&self) -> usize {
            1
        }
        fn eval(&self, b: &Vec3, x: f64, _lx: f64) -> (f64, Vec3) {
            let f = (b[0] * x).exp();
            (f, [x * f, 0.0, 0.0])
        }
    }

    fn data<'a>(x: &'a [f64], lx: &'a [f64], y: &'a [f64], w: &'a [f64]) -> Data<'a> {
        Data { x, lx, y, w }
    }

    // Source: exact data y = e^(0.7x) have their least-squares optimum at b = 0.7.
    #[test]
    fn finds_the_exact_optimum_from_far_away() {
        let x: [f64; 5] = [0.0, 0.5, 1.0, 2.0, 3.0];
        let y: Vec<f64> = x.iter().map(|v| (0.7 * v).exp()).collect();
        let (lx, w) = ([0.0; 5], [1.0; 5]);
        let m = minimise(&Exp, &data(&x, &lx, &y, &w), [-2.0, 0.0, 0.0]).unwrap();
        assert!((m.beta[0] - 0.7).abs() < 1e-12, "{:?}", m.beta);
    }

    // Source: a start whose SSR is not a number cannot be improved on; it must be refused.
    #[test]
    fn a_start_that_cannot_be_evaluated_fails() {
        let x = [1.0, 2.0];
        let (lx, y, w) = ([0.0; 2], [1.0, 2.0], [1.0; 2]);
        let failed = minimise(&Exp, &data(&x, &lx, &y, &w), [f64::NAN, 0.0, 0.0]).unwrap_err();
        assert_eq!(failed.iterations, 0);
    }
}
