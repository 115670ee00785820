//! The Arrhenius shift of a flow curve to another temperature: the viscosity parameter (μ, K,
//! μp or μc) follows K(T) = K_ref·exp[(Ea/R)(1/T − 1/T_ref)], n is independent of temperature
//! (Steffe 1996, *Rheological Methods in Food Process Engineering*, §1.10), and the yield stress
//! is taken as measured because it has no general temperature law.

use crate::rheology::temperature::arrhenius_factor;
use crate::rheology::{Model, ParamName};
use crate::site::Product;

/// Temperatures closer than this are the same for the shift (a thermometer's resolution), K.
const SAME_TEMPERATURE_K: f64 = 0.05;

/// How the curve was brought to the requested temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Shift {
    /// No temperature asked for, or the curve is already at it.
    NotNeeded,
    /// Viscosity parameter multiplied by `factor` = exp[(Ea/R)(1/T − 1/T_ref)].
    Arrhenius {
        ea_j_per_mol: f64,
        from_k: f64,
        to_k: f64,
        factor: f64,
    },
    /// The temperatures differ but the product has no activation energy: not shifted.
    NoActivationEnergy { from_k: f64, to_k: f64 },
    /// A temperature was asked for but the curve's own temperature is unknown: not shifted.
    SourceTemperatureUnknown { to_k: f64 },
}

impl Shift {
    /// The factor applied to the viscosity parameter (1 when not shifted).
    pub fn factor(&self) -> f64 {
        match *self {
            Shift::Arrhenius { factor, .. } => factor,
            _ => 1.0,
        }
    }

    /// What was done, in words; `parameter` is the one scaled, `at_k` the temperature the
    /// curve is taken at when nothing was shifted.
    pub fn words(&self, parameter: ParamName, at_k: Option<f64>) -> String {
        use Shift::*;
        let c = |k: f64| k - 273.15;
        match *self {
            NotNeeded => match at_k {
                Some(t) => format!("taken at {:.1} °C", c(t)),
                None => "temperature not stated".to_string(),
            },
            Arrhenius {
                ea_j_per_mol,
                from_k,
                to_k,
                factor,
            } => format!(
                "{} shifted from {:.1} °C to {:.1} °C by ×{factor:.3} (Arrhenius, Ea {:.0} kJ/mol); \
                 n and the yield stress as measured",
                parameter.symbol(),
                c(from_k),
                c(to_k),
                ea_j_per_mol / 1000.0
            ),
            NoActivationEnergy { from_k, to_k } => format!(
                "measured at {:.1} °C, not shifted to {:.1} °C because the product has no \
                 activation energy in the site config",
                c(from_k),
                c(to_k)
            ),
            SourceTemperatureUnknown { to_k } => format!(
                "not shifted to {:.1} °C because the curve's own temperature was not recorded",
                c(to_k)
            ),
        }
    }
}

/// The shift from the curve's temperature to the requested one.
pub(crate) fn shift_for(product: Option<&Product>, from: Option<f64>, to: Option<f64>) -> Shift {
    let Some(to_k) = to else {
        return Shift::NotNeeded;
    };
    let Some(from_k) = from else {
        return Shift::SourceTemperatureUnknown { to_k };
    };
    if (from_k - to_k).abs() <= SAME_TEMPERATURE_K {
        return Shift::NotNeeded;
    }
    match product.and_then(|p| p.activation_energy_j_mol) {
        Some(ea) => Shift::Arrhenius {
            ea_j_per_mol: ea,
            from_k,
            to_k,
            factor: arrhenius_factor(ea, to_k, from_k),
        },
        None => Shift::NoActivationEnergy { from_k, to_k },
    }
}

/// The model with its viscosity parameter (μ, K, μp or μc) multiplied by `factor`.
pub fn scale_viscosity(model: Model, factor: f64) -> Model {
    match model {
        Model::Newtonian { mu } => Model::Newtonian { mu: mu * factor },
        Model::PowerLaw { k, n } => Model::PowerLaw { k: k * factor, n },
        Model::Bingham { tau0, mu_p } => Model::Bingham {
            tau0,
            mu_p: mu_p * factor,
        },
        Model::HerschelBulkley { tau0, k, n } => Model::HerschelBulkley {
            tau0,
            k: k * factor,
            n,
        },
        Model::Casson { tau0, mu_c } => Model::Casson {
            tau0,
            mu_c: mu_c * factor,
        },
    }
}
