//! Bracketed root-finding for monotone functions: grow a bracket, then Brent's method.

/// Relative width at which the search stops.
const REL_TOL: f64 = 1e-13;
/// Most function evaluations in one search (bisection alone needs about 45 on a bracket of
/// a factor two, and 1 100 from 1e-300 to 1e300).
const MAX_STEPS: usize = 300;

/// The x in [lo, hi] where an increasing `g` crosses zero (g(lo) < 0 ≤ g(hi)).
///
/// Brent's method (Brent 1973, *Algorithms for Minimization without Derivatives*, ch. 4;
/// written from memory of its published ALGOL `zero`): inverse quadratic or secant steps
/// while they shrink the bracket fast enough, a bisection step otherwise, so it never does
/// worse than bisection and usually needs a handful of evaluations where bisection took 45.
/// The bisection step is the geometric midpoint when both ends are above zero and far
/// apart, so brackets spanning decades still shrink in few steps.
pub(crate) fn bisect(lo: f64, hi: f64, g: impl Fn(f64) -> f64) -> f64 {
    let (mut a, mut b) = (lo, hi);
    let (mut fa, mut fb) = (g(a), g(b));
    if fa >= 0.0 {
        return a;
    }
    if fb.is_nan() || fb < 0.0 {
        return 0.5 * (a + b);
    }
    let (mut c, mut fc) = (a, fa);
    let mut d = b - a;
    let mut e = d;
    for _ in 0..MAX_STEPS {
        if fb.signum() == fc.signum() && fb != 0.0 {
            (c, fc) = (a, fa);
            d = b - a;
            e = d;
        }
        if fc.abs() < fb.abs() {
            (a, fa, b, fb, c, fc) = (b, fb, c, fc, b, fb);
        }
        let tol = 0.5 * REL_TOL * b.abs().max(f64::MIN_POSITIVE);
        let half = 0.5 * (c - b);
        if half.abs() <= tol || fb == 0.0 {
            return b;
        }
        let wide = b > 0.0 && c > 0.0 && (b / c).max(c / b) > 4.0;
        if e.abs() >= tol && fa.abs() > fb.abs() && !wide {
            let (p, q) = interpolation(a, fa, b, fb, c, fc);
            let (p, q) = if p > 0.0 { (p, -q) } else { (-p, q) };
            if 2.0 * p < (3.0 * half * q - (tol * q).abs()).min((e * q).abs()) {
                e = d;
                d = p / q;
            } else {
                d = half;
                e = d;
            }
        } else if wide {
            d = (b * c).sqrt() - b;
            e = d;
        } else {
            d = half;
            e = d;
        }
        (a, fa) = (b, fb);
        b += if d.abs() > tol { d } else { tol.copysign(half) };
        fb = g(b);
        if fb.is_nan() {
            return b;
        }
    }
    b
}

/// Brent's step as p/q: inverse quadratic through the three points, or the secant when two
/// of them coincide (`a` is then `c`).
fn interpolation(a: f64, fa: f64, b: f64, fb: f64, c: f64, fc: f64) -> (f64, f64) {
    let s = fb / fa;
    let half = 0.5 * (c - b);
    if a == c {
        return (2.0 * half * s, 1.0 - s);
    }
    let (q, r) = (fa / fc, fb / fc);
    let p = s * (2.0 * half * q * (q - r) - (b - a) * (r - 1.0));
    (p, (q - 1.0) * (r - 1.0) * (s - 1.0))
}

/// Double `hi` from `start` until an increasing `g` is at or above zero there; `None` if it
/// never is within 400 doublings (about 10¹²⁰ times the start).
pub(crate) fn grow(start: f64, g: impl Fn(f64) -> f64) -> Option<f64> {
    let mut hi = start;
    for _ in 0..400 {
        if g(hi) >= 0.0 {
            return Some(hi);
        }
        hi *= 2.0;
        if !hi.is_finite() {
            return None;
        }
    }
    None
}
