//! Dense linear algebra for at most three parameters: scaled Cholesky solve and SPD inverse.
//!
//! Every matrix is first scaled to a unit diagonal (A → SAS, S = diag(1/√Aᵢᵢ)); this removes
//! the spread of parameter units (Pa against a dimensionless n) before the factorisation.

#![allow(clippy::needless_range_loop)] // index loops read like the textbook formulas

pub(crate) type Vec3 = [f64; 3];
pub(crate) type Mat3 = [[f64; 3]; 3];

/// Pivots below this (on the unit-diagonal matrix) mean the parameters cannot be separated.
const PIVOT_FLOOR: f64 = 1e-14;

/// Lower-triangular factor of the unit-diagonal form, with the scale factors used.
struct Factor {
    l: Mat3,
    scale: Vec3,
    p: usize,
}

fn factor(a: &Mat3, p: usize) -> Option<Factor> {
    let mut scale = [0.0; 3];
    for i in 0..p {
        if !(a[i][i].is_finite() && a[i][i] > 0.0) {
            return None;
        }
        scale[i] = 1.0 / a[i][i].sqrt();
    }
    let mut l = [[0.0; 3]; 3];
    for j in 0..p {
        let mut d = a[j][j] * scale[j] * scale[j];
        for k in 0..j {
            d -= l[j][k] * l[j][k];
        }
        if d.is_nan() || d <= PIVOT_FLOOR {
            return None;
        }
        l[j][j] = d.sqrt();
        for i in (j + 1)..p {
            let mut s = a[i][j] * scale[i] * scale[j];
            for k in 0..j {
                s -= l[i][k] * l[j][k];
            }
            l[i][j] = s / l[j][j];
        }
    }
    Some(Factor { l, scale, p })
}

impl Factor {
    /// Solve (SAS) y = b for y.
    fn solve_scaled(&self, b: &Vec3) -> Vec3 {
        let (l, p) = (&self.l, self.p);
        let mut y = [0.0; 3];
        for i in 0..p {
            let s: f64 = (0..i).map(|k| l[i][k] * y[k]).sum();
            y[i] = (b[i] - s) / l[i][i];
        }
        for i in (0..p).rev() {
            let s: f64 = ((i + 1)..p).map(|k| l[k][i] * y[k]).sum();
            y[i] = (y[i] - s) / l[i][i];
        }
        y
    }
}

/// Solve A x = b for symmetric positive definite A (the leading p×p block); `None` if singular.
pub(crate) fn solve_spd(a: &Mat3, b: &Vec3, p: usize) -> Option<Vec3> {
    let f = factor(a, p)?;
    let mut sb = [0.0; 3];
    for i in 0..p {
        sb[i] = b[i] * f.scale[i];
    }
    let y = f.solve_scaled(&sb);
    let mut x = [0.0; 3];
    for i in 0..p {
        x[i] = y[i] * f.scale[i];
    }
    Some(x)
}

/// Inverse of a symmetric positive definite A (leading p×p block); `None` if singular.
pub(crate) fn inverse_spd(a: &Mat3, p: usize) -> Option<Mat3> {
    let f = factor(a, p)?;
    let mut inv = [[0.0; 3]; 3];
    for j in 0..p {
        let mut e = [0.0; 3];
        e[j] = 1.0;
        let col = f.solve_scaled(&e);
        for i in 0..p {
            inv[i][j] = col[i] * f.scale[i] * f.scale[j];
        }
    }
    Some(inv)
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: a hand-checked 3×3 SPD system; x = (1, −2, 3) substituted back by hand.
    #[test]
    fn solves_and_inverts_a_known_system() {
        let a = [[4.0, 2.0, 0.6], [2.0, 5.0, 1.0], [0.6, 1.0, 3.0]];
        let b = [4.0 - 4.0 + 1.8, 2.0 - 10.0 + 3.0, 0.6 - 2.0 + 9.0];
        let x = solve_spd(&a, &b, 3).unwrap();
        for (got, want) in x.iter().zip([1.0, -2.0, 3.0]) {
            assert!((got - want).abs() < 1e-12, "{got} vs {want}");
        }
        let inv = inverse_spd(&a, 3).unwrap();
        for i in 0..3 {
            for j in 0..3 {
                let s: f64 = (0..3).map(|k| a[i][k] * inv[k][j]).sum();
                let want = if i == j { 1.0 } else { 0.0 };
                assert!((s - want).abs() < 1e-12);
            }
        }
    }

    // Source: a rank-one matrix has no inverse (linear algebra definition).
    #[test]
    fn singular_matrix_is_refused() {
        let a = [[1.0, 2.0, 0.0], [2.0, 4.0, 0.0], [0.0, 0.0, 0.0]];
        assert!(inverse_spd(&a, 2).is_none());
        assert!(solve_spd(&a, &[1.0, 2.0, 0.0], 2).is_none());
    }
}
