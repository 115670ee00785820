//! The gel build-up curve τ(t) = τ∞ − (τ∞ − τi)·e^(−t/tr): strength after a rest, its
//! sensitivity to the three constants, and the rest time at which it reaches a stress.

use super::error::{RestartError, non_negative, positive};

/// Static (gel) yield stress rebuilding at rest, first-order kinetics (Barnes 1997,
/// *J. Non-Newt. Fluid Mech.* 70:1, structure equation dλ/dt = a(1 − λ) at rest; the
/// exponential in stress holds if the yield stress is linear in the structure parameter).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct GelCurve {
    /// τi: gel stress just after the product stops, Pa.
    pub initial_pa: f64,
    /// τ∞: gel stress after a long rest, Pa (≥ τi).
    pub long_rest_pa: f64,
    /// tr: rebuild time constant, s.
    pub time_constant_s: f64,
}

/// When a rising gel reaches a given stress.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Reach {
    /// Already there at the moment of stopping.
    AtOnce,
    /// After this rest, s.
    After(f64),
    /// Never: the long-rest value stays below it.
    Never,
}

impl GelCurve {
    /// Checked constants: τi ≥ 0, τ∞ ≥ τi, tr > 0, all finite.
    pub fn new(
        initial_pa: f64,
        long_rest_pa: f64,
        time_constant_s: f64,
    ) -> Result<Self, RestartError> {
        let initial_pa = non_negative("initial gel stress (Pa)", initial_pa)?;
        let long_rest_pa = non_negative("long-rest gel stress (Pa)", long_rest_pa)?;
        let time_constant_s = positive("gel time constant (s)", time_constant_s)?;
        if long_rest_pa < initial_pa {
            return Err(RestartError::FinalBelowInitial {
                initial_pa,
                final_pa: long_rest_pa,
            });
        }
        Ok(GelCurve {
            initial_pa,
            long_rest_pa,
            time_constant_s,
        })
    }

    /// A gel that does not change with rest: one stress at every rest time.
    pub fn constant(stress_pa: f64) -> Result<Self, RestartError> {
        GelCurve::new(stress_pa, stress_pa, 1.0)
    }

    /// τ(t), Pa; a negative rest is taken as zero.
    pub fn stress_at(&self, rest_s: f64) -> f64 {
        let e = (-rest_s.max(0.0) / self.time_constant_s).exp();
        self.long_rest_pa - (self.long_rest_pa - self.initial_pa) * e
    }

    /// ∂τ/∂(τi, τ∞, tr) at a rest time, for propagating the fit's covariance.
    pub fn gradient_at(&self, rest_s: f64) -> [f64; 3] {
        let t = rest_s.max(0.0);
        let tr = self.time_constant_s;
        let e = (-t / tr).exp();
        let d_tr = -(self.long_rest_pa - self.initial_pa) * e * t / (tr * tr);
        [e, 1.0 - e, d_tr]
    }

    /// The same build-up with both stresses multiplied (a colder line, an empirical factor).
    pub fn scaled(&self, factor: f64) -> GelCurve {
        GelCurve {
            initial_pa: self.initial_pa * factor,
            long_rest_pa: self.long_rest_pa * factor,
            time_constant_s: self.time_constant_s,
        }
    }

    /// The rest at which τ(t) reaches `stress_pa`: t = −tr·ln[(τ∞ − τ)/(τ∞ − τi)].
    pub fn rest_to_reach(&self, stress_pa: f64) -> Reach {
        if stress_pa <= self.initial_pa {
            return Reach::AtOnce;
        }
        if stress_pa >= self.long_rest_pa {
            return Reach::Never;
        }
        let ratio = (self.long_rest_pa - stress_pa) / (self.long_rest_pa - self.initial_pa);
        Reach::After(-self.time_constant_s * ratio.ln())
    }
}
