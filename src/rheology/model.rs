//! Flow models with numbers: shear stress at a rate, apparent viscosity, and rate at a stress.
//!
//! Citations are from memory; the forms themselves are the standard textbook ones (e.g.
//! Steffe 1996, *Rheological Methods in Food Process Engineering*, 2nd ed., ch. 1).

use super::kind::{ModelKind, ParamName};

/// A flow model with its parameters in SI (Pa, Pa·s, Pa·sⁿ).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize, serde::Deserialize)]
pub enum Model {
    /// τ = μγ̇ (Newton).
    Newtonian { mu: f64 },
    /// τ = Kγ̇ⁿ (Ostwald 1925, de Waele 1923); n < 1 shear-thinning, n > 1 shear-thickening.
    PowerLaw { k: f64, n: f64 },
    /// τ = τ0 + μp·γ̇ above the yield stress, no flow below (Bingham 1916, Bull. Bur. Stand.).
    Bingham { tau0: f64, mu_p: f64 },
    /// τ = τ0 + Kγ̇ⁿ above the yield stress (Herschel & Bulkley 1926, Kolloid-Zeitschrift).
    HerschelBulkley { tau0: f64, k: f64, n: f64 },
    /// √τ = √τ0 + √(μc·γ̇) (Casson 1959, in Mill (ed.), *Rheology of Disperse Systems*).
    Casson { tau0: f64, mu_c: f64 },
}

impl Model {
    /// The model with parameter `index` (in `param_names` order) set to `value`.
    pub fn with_param(self, index: usize, value: f64) -> Model {
        let mut v = self.params().iter().map(|(_, x)| *x).collect::<Vec<f64>>();
        if let Some(slot) = v.get_mut(index) {
            *slot = value;
        }
        let at = |i: usize| v.get(i).copied().unwrap_or(0.0);
        match self {
            Model::Newtonian { .. } => Model::Newtonian { mu: at(0) },
            Model::PowerLaw { .. } => Model::PowerLaw { k: at(0), n: at(1) },
            Model::Bingham { .. } => Model::Bingham {
                tau0: at(0),
                mu_p: at(1),
            },
            Model::HerschelBulkley { .. } => Model::HerschelBulkley {
                tau0: at(0),
                k: at(1),
                n: at(2),
            },
            Model::Casson { .. } => Model::Casson {
                tau0: at(0),
                mu_c: at(1),
            },
        }
    }

    pub fn kind(&self) -> ModelKind {
        match self {
            Model::Newtonian { .. } => ModelKind::Newtonian,
            Model::PowerLaw { .. } => ModelKind::PowerLaw,
            Model::Bingham { .. } => ModelKind::Bingham,
            Model::HerschelBulkley { .. } => ModelKind::HerschelBulkley,
            Model::Casson { .. } => ModelKind::Casson,
        }
    }

    /// Shear stress (Pa) at a shear rate (1/s). At rest (rate ≤ 0, or not a number) this is the
    /// limit as the rate falls to zero: the yield stress, or 0 for models without one.
    pub fn stress(&self, rate: f64) -> f64 {
        if rate.is_nan() || rate <= 0.0 {
            return self.yield_stress();
        }
        match *self {
            Model::Newtonian { mu } => mu * rate,
            Model::PowerLaw { k, n } => k * rate.powf(n),
            Model::Bingham { tau0, mu_p } => tau0 + mu_p * rate,
            Model::HerschelBulkley { tau0, k, n } => tau0 + k * rate.powf(n),
            Model::Casson { tau0, mu_c } => {
                let root = tau0.max(0.0).sqrt() + (mu_c * rate).max(0.0).sqrt();
                root * root
            }
        }
    }

    /// Apparent viscosity τ/γ̇ (Pa·s). At rest it is the limit as the rate falls to zero:
    /// infinite with a yield stress or n < 1, never NaN.
    pub fn apparent_viscosity(&self, rate: f64) -> f64 {
        if rate > 0.0 {
            return self.stress(rate) / rate;
        }
        if self.yield_stress() > 0.0 {
            return f64::INFINITY;
        }
        match *self {
            Model::Newtonian { mu } => mu,
            Model::Bingham { mu_p, .. } => mu_p,
            Model::Casson { mu_c, .. } => mu_c,
            Model::PowerLaw { k, n } | Model::HerschelBulkley { k, n, .. } => {
                power_law_at_rest(k, n)
            }
        }
    }

    /// Shear rate (1/s) at which the model carries a given stress (Pa); 0 at or below the yield
    /// stress (the product does not flow there).
    pub fn rate_at_stress(&self, stress: f64) -> f64 {
        let tau0 = self.yield_stress();
        if stress.is_nan() || stress <= tau0 {
            return 0.0;
        }
        let rate = match *self {
            Model::Newtonian { mu } => stress / mu,
            Model::PowerLaw { k, n } => (stress / k).powf(1.0 / n),
            Model::Bingham { mu_p, .. } => (stress - tau0) / mu_p,
            Model::HerschelBulkley { k, n, .. } => ((stress - tau0) / k).powf(1.0 / n),
            Model::Casson { mu_c, .. } => {
                let root = stress.sqrt() - tau0.sqrt();
                root * root / mu_c
            }
        };
        if rate.is_nan() { 0.0 } else { rate }
    }

    /// Yield stress τ0 (Pa); 0 for the Newtonian and power-law models.
    pub fn yield_stress(&self) -> f64 {
        match *self {
            Model::Newtonian { .. } | Model::PowerLaw { .. } => 0.0,
            Model::Bingham { tau0, .. }
            | Model::HerschelBulkley { tau0, .. }
            | Model::Casson { tau0, .. } => tau0.max(0.0),
        }
    }

    /// One parameter's value, or `None` if this model has no such parameter.
    pub fn param(&self, p: ParamName) -> Option<f64> {
        self.params()
            .into_iter()
            .find(|(name, _)| *name == p)
            .map(|(_, v)| v)
    }

    /// All parameters in the order of [`ModelKind::param_names`].
    pub fn params(&self) -> Vec<(ParamName, f64)> {
        let values = self.values();
        self.kind()
            .param_names()
            .iter()
            .copied()
            .zip(values)
            .collect()
    }

    /// Values in the order of [`ModelKind::param_names`], padded with zeros to three.
    pub(crate) fn values(&self) -> [f64; 3] {
        match *self {
            Model::Newtonian { mu } => [mu, 0.0, 0.0],
            Model::PowerLaw { k, n } => [k, n, 0.0],
            Model::Bingham { tau0, mu_p } => [tau0, mu_p, 0.0],
            Model::HerschelBulkley { tau0, k, n } => [tau0, k, n],
            Model::Casson { tau0, mu_c } => [tau0, mu_c, 0.0],
        }
    }
}

/// μa = Kγ̇^(n−1) as γ̇ → 0⁺.
fn power_law_at_rest(k: f64, n: f64) -> f64 {
    if n < 1.0 {
        f64::INFINITY
    } else if n > 1.0 {
        0.0
    } else {
        k
    }
}
