//! Arrhenius temperature shift of the consistency index K (or a viscosity μ), and the
//! activation energy fitted from the same product read at several temperatures.
//!
//! Arrhenius (Steffe 1996, *Rheological Methods in Food Process Engineering*, 2nd ed.,
//! ch. 1): K(T) = K_ref·exp[(Ea/R)(1/T − 1/T_ref)], T in kelvin; n is taken as
//! independent of temperature. The yield stress has no general law and is not shifted here.

use super::error::FitError;
use super::linear::fit_line;
use super::stats::t975;

/// Molar gas constant R, J/(mol·K) (CODATA 2018, exact since the 2019 SI redefinition).
pub const GAS_CONSTANT: f64 = 8.314462618;

/// K(T)/K(T_ref) = exp[(Ea/R)(1/T − 1/T_ref)]: above 1 when T is colder than T_ref.
/// Temperatures must be absolute (K) and above zero.
pub fn arrhenius_factor(ea_j_per_mol: f64, t_k: f64, t_ref_k: f64) -> f64 {
    ((ea_j_per_mol / GAS_CONSTANT) * (1.0 / t_k - 1.0 / t_ref_k)).exp()
}

/// A value read at T, brought to T_ref: value / arrhenius_factor(Ea, T, T_ref).
pub fn shift_to_reference(value: f64, ea_j_per_mol: f64, t_k: f64, t_ref_k: f64) -> f64 {
    value / arrhenius_factor(ea_j_per_mol, t_k, t_ref_k)
}

/// The activation energy fitted from (T, K) pairs.
#[derive(Debug, Clone, PartialEq)]
pub struct ActivationFit {
    pub ea_j_per_mol: f64,
    /// 95 % interval on Ea; `None` with exactly two temperatures (no scatter left to size it).
    pub ci95: Option<(f64, f64)>,
    /// K (or μ) at the reference temperature, from the fitted line.
    pub value_at_ref: f64,
    pub std_error_j_per_mol: Option<f64>,
    /// Number of (T, value) samples used.
    pub samples: usize,
}

/// Fit ln K = ln K_ref + (Ea/R)(1/T − 1/T_ref) by ordinary least squares; needs two or more
/// different temperatures. CI: slope ± t(0.975, m − 2)·SE(slope), times R.
pub fn fit_activation_energy(
    samples: &[(f64, f64)],
    t_ref_k: f64,
) -> Result<ActivationFit, FitError> {
    check_samples(samples, t_ref_k)?;
    let x: Vec<f64> = samples
        .iter()
        .map(|(t, _)| 1.0 / t - 1.0 / t_ref_k)
        .collect();
    let y: Vec<f64> = samples.iter().map(|(_, v)| v.ln()).collect();
    let line = fit_line(&x, &y).ok_or(FitError::TooFewTemperatures { have: 1 })?;
    let se = line.se_slope().map(|s| s * GAS_CONSTANT);
    let ea = line.slope * GAS_CONSTANT;
    let ci95 = t975(line.dof())
        .zip(se)
        .map(|(t, se)| (ea - t * se, ea + t * se));
    Ok(ActivationFit {
        ea_j_per_mol: ea,
        ci95,
        value_at_ref: line.intercept.exp(),
        std_error_j_per_mol: se,
        samples: samples.len(),
    })
}

fn check_samples(samples: &[(f64, f64)], t_ref_k: f64) -> Result<(), FitError> {
    if !(t_ref_k.is_finite() && t_ref_k > 0.0) {
        return Err(FitError::BadReferenceTemperature { value: t_ref_k });
    }
    for (i, &(t, v)) in samples.iter().enumerate() {
        if !(t.is_finite() && t > 0.0) {
            return Err(FitError::BadTemperature {
                index: i + 1,
                value: t,
            });
        }
        if !(v.is_finite() && v > 0.0) {
            return Err(FitError::BadTemperatureValue {
                index: i + 1,
                value: v,
            });
        }
    }
    let mut temps: Vec<f64> = samples.iter().map(|s| s.0).collect();
    temps.sort_by(f64::total_cmp);
    temps.dedup();
    if temps.len() < 2 {
        return Err(FitError::TooFewTemperatures { have: temps.len() });
    }
    Ok(())
}
