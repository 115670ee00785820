//! Bracketed root-finding for monotone functions: grow a bracket, then bisect.

/// Relative width at which bisection stops.
const REL_TOL: f64 = 1e-13;

/// The x in [lo, hi] where an increasing `g` crosses zero, by bisection (geometric midpoint
/// when both ends are above zero, so wide brackets converge in few steps).
pub(crate) fn bisect(mut lo: f64, mut hi: f64, g: impl Fn(f64) -> f64) -> f64 {
    for _ in 0..300 {
        let mid = if lo > 0.0 {
            (lo * hi).sqrt()
        } else {
            0.5 * (lo + hi)
        };
        if g(mid) < 0.0 {
            lo = mid;
        } else {
            hi = mid;
        }
        if hi - lo <= REL_TOL * hi.abs() {
            break;
        }
    }
    0.5 * (lo + hi)
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
