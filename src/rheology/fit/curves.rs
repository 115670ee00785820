//! Each model as a curve the minimiser can move: value and gradient in its working parameters.

use crate::rheology::levenberg::Curve;
use crate::rheology::linalg::Vec3;

/// τ = μγ̇; parameters [μ]. Also the Bingham, Casson and HB shapes with τ0 held at zero
/// (the Casson one with μc for μ).
pub(crate) struct Linear0;

impl Curve for Linear0 {
    fn p(&self) -> usize {
        1
    }
    fn eval(&self, b: &Vec3, x: f64, _lx: f64) -> (f64, Vec3) {
        (b[0] * x, [x, 0.0, 0.0])
    }
}

/// τ = τ0 + μp·γ̇; parameters [τ0, μp].
pub(crate) struct Line;

impl Curve for Line {
    fn p(&self) -> usize {
        2
    }
    fn eval(&self, b: &Vec3, x: f64, _lx: f64) -> (f64, Vec3) {
        (b[0] + b[1] * x, [1.0, x, 0.0])
    }
}

/// τ = Kγ̇ⁿ; parameters [K, n]; n > 0 kept.
pub(crate) struct Power;

impl Curve for Power {
    fn p(&self) -> usize {
        2
    }
    fn eval(&self, b: &Vec3, _x: f64, lx: f64) -> (f64, Vec3) {
        let xn = (b[1] * lx).exp();
        let f = b[0] * xn;
        (f, [xn, f * lx, 0.0])
    }
    fn feasible(&self, b: &Vec3) -> bool {
        b[1] > 0.0
    }
}

/// τ = τ0 + Kγ̇ⁿ; parameters [τ0, K, n]; n > 0 kept, τ0 free (its bound is handled by a refit).
/// Jacobian row [1, γ̇ⁿ, Kγ̇ⁿ ln γ̇] (the partial derivatives of the model, derived).
pub(crate) struct HerschelBulkley;

impl Curve for HerschelBulkley {
    fn p(&self) -> usize {
        3
    }
    fn eval(&self, b: &Vec3, _x: f64, lx: f64) -> (f64, Vec3) {
        let xn = (b[2] * lx).exp();
        let kxn = b[1] * xn;
        (b[0] + kxn, [1.0, xn, kxn * lx])
    }
    fn feasible(&self, b: &Vec3) -> bool {
        b[2] > 0.0
    }
}

/// τ = (a + b√γ̇)² with a = √τ0, b = √μc: smooth at τ0 = 0, where ∂τ/∂τ0 is not.
pub(crate) struct CassonRoots;

impl Curve for CassonRoots {
    fn p(&self) -> usize {
        2
    }
    fn eval(&self, b: &Vec3, x: f64, _lx: f64) -> (f64, Vec3) {
        let s = x.sqrt();
        let root = b[0] + b[1] * s;
        (root * root, [2.0 * root, 2.0 * root * s, 0.0])
    }
}
