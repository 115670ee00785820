//! What the motor reading says: shaft power from a three-phase current (or a power meter),
//! then the product's apparent viscosity and K read back from that power when the regime
//! lets power depend on viscosity.

use super::curve::Regime;
use super::error::{MixError, fraction, positive};
use super::impeller::Spread;
use super::power::{Fluid, Vessel, check_speed};
use crate::rheology::Model;
use serde::Serialize;

/// How the motor's electrical input was measured.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Electrical {
    /// Line current (one phase), line-to-line voltage and power factor.
    ThreePhase {
        current_a: f64,
        voltage_v: f64,
        power_factor: f64,
    },
    /// A power meter's reading, W (better than current at light load).
    Metered { power_w: f64 },
}

/// A motor reading with the drive's efficiencies.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct MotorReading {
    pub electrical: Electrical,
    pub motor_efficiency: f64,
    /// `None` for a direct drive (taken as 1).
    pub gearbox_efficiency: Option<f64>,
    /// Shaft power with the impeller turning in an empty tank (bearings, seals, gears), W.
    pub no_load_power_w: Option<f64>,
}

/// Electrical input, W: P = √3·V_LL·I·PF for a balanced three-phase supply (standard
/// circuit theory, e.g. IEC 60050-131 active power; the √3 joins line and phase values).
pub fn electrical_power_w(e: &Electrical) -> Result<f64, MixError> {
    match *e {
        Electrical::ThreePhase {
            current_a,
            voltage_v,
            power_factor,
        } => Ok(3f64.sqrt()
            * positive("motor voltage", voltage_v)?
            * positive("motor current", current_a)?
            * fraction("power factor", power_factor)?),
        Electrical::Metered { power_w } => positive("motor power", power_w),
    }
}

/// Power reaching the product, W: electrical × η_motor × η_gearbox − no-load power. May be
/// zero or negative when the no-load power is as large as the reading.
pub fn shaft_power_w(m: &MotorReading) -> Result<f64, MixError> {
    let p = electrical_power_w(&m.electrical)?;
    let eta_m = fraction("motor efficiency", m.motor_efficiency)?;
    let eta_g = match m.gearbox_efficiency {
        Some(e) => fraction("gearbox efficiency", e)?,
        None => 1.0,
    };
    let no_load = match m.no_load_power_w {
        Some(w) if w.is_finite() && w >= 0.0 => w,
        Some(w) => {
            return Err(MixError::NotPositive {
                what: "no-load power",
                value: w,
            });
        }
        None => 0.0,
    };
    Ok(p * eta_m * eta_g - no_load)
}

/// Why viscosity was not read back from power.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case", tag = "reason")]
pub enum Refusal {
    /// The measured power number is on the flat turbulent part of the curve, where power
    /// hardly depends on viscosity.
    Turbulent {
        power_number: f64,
        np_turbulent: f64,
    },
    /// Nothing is left for the product once the no-load power is taken off.
    NoPowerLeft { shaft_power_w: f64 },
}

/// Why K was not worked out from the apparent viscosity.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case", tag = "reason")]
pub enum KRefusal {
    /// The Casson model has no flow index n to carry over.
    NoFlowIndex,
    /// The viscometer's yield stress alone gives more viscosity than the power implies.
    YieldStressExceeds { from_yield_stress_pa_s: f64 },
}

/// Viscosity read back from measured power.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct FromPower {
    pub shaft_power_w: f64,
    pub power_number: f64,
    pub reynolds: f64,
    pub regime: Regime,
    pub effective_shear_rate_per_s: f64,
    pub apparent_viscosity_pa_s: f64,
    /// μa over the ranges of Kp and the turbulent Np; `high` is infinite when some curve in
    /// the range puts the point on its turbulent part.
    pub apparent_viscosity_range_pa_s: Spread,
    /// d ln μa / d ln P: 1 when laminar; a 10 % power error is this many times 10 % in μa.
    pub sensitivity: f64,
    /// K (Pa·sⁿ) with n from the viscometer's model, or why not.
    pub k: Result<f64, KRefusal>,
}

/// The back-calculation's outcome.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum BackCalc {
    Done(FromPower),
    Refused(Refusal),
}

/// Read μa back from shaft power: Np = P/(ρN³D⁵), Re from the power curve (laminar: Re =
/// Kp/Np, so μa = P/(Kp·N²·D³); Metzner & Otto 1957), μa = ρND²/Re at γ̇ = ks·N, then K
/// from μa with n from `fluid.model`. Refused on the turbulent part of the curve.
pub fn viscosity_from_power(
    vessel: &Vessel,
    fluid: &Fluid,
    speed_rps: f64,
    shaft_power_w: f64,
) -> Result<BackCalc, MixError> {
    let shape = vessel.power_curve()?.nominal();
    let n = check_speed(speed_rps, &fluid.model)?;
    let rho = positive("density", fluid.density_kg_m3)?;
    let d = vessel.impeller_diameter_m;
    if shaft_power_w.is_nan() || shaft_power_w <= 0.0 {
        return Ok(BackCalc::Refused(Refusal::NoPowerLeft { shaft_power_w }));
    }
    let np = shaft_power_w / (rho * n.powi(3) * d.powi(5));
    let Some((re, regime)) = shape.reynolds_at(np) else {
        let np_turbulent = shape.np_turbulent;
        return Ok(BackCalc::Refused(Refusal::Turbulent {
            power_number: np,
            np_turbulent,
        }));
    };
    let rate = shape.ks * n;
    let mu = rho * n * d * d / re;
    let range = viscosity_range(vessel, np, rho * n * d * d, mu)?;
    Ok(BackCalc::Done(FromPower {
        shaft_power_w,
        power_number: np,
        reynolds: re,
        regime,
        effective_shear_rate_per_s: rate,
        apparent_viscosity_pa_s: mu,
        apparent_viscosity_range_pa_s: range,
        sensitivity: shape.viscosity_sensitivity(regime),
        k: k_from_viscosity(&fluid.model, mu, rate),
    }))
}

/// μa = ρND²/Re on every corner curve; a corner where `np` is turbulent has no bound.
fn viscosity_range(vessel: &Vessel, np: f64, rho_n_d2: f64, mu: f64) -> Result<Spread, MixError> {
    let mut low = mu;
    let mut high = mu;
    for shape in vessel.power_curve()?.corners() {
        let v = match shape.reynolds_at(np) {
            Some((re, _)) => rho_n_d2 / re,
            None => f64::INFINITY,
        };
        low = low.min(v);
        high = high.max(v);
    }
    Ok(Spread::new(low, mu, high))
}

/// K from an apparent viscosity at `rate`, keeping the model's n and yield stress:
/// μa = τ0/γ̇ + K·γ̇^(n−1), so K = (μa − τ0/γ̇)/γ̇^(n−1) (n = 1 for Newtonian and Bingham,
/// where K is the viscosity or the plastic viscosity).
pub fn k_from_viscosity(model: &Model, mu_a: f64, rate: f64) -> Result<f64, KRefusal> {
    let (tau0, n) = match *model {
        Model::Newtonian { .. } => (0.0, 1.0),
        Model::PowerLaw { n, .. } => (0.0, n),
        Model::Bingham { tau0, .. } => (tau0, 1.0),
        Model::HerschelBulkley { tau0, n, .. } => (tau0, n),
        Model::Casson { .. } => return Err(KRefusal::NoFlowIndex),
    };
    let from_yield = tau0.max(0.0) / rate;
    let rest = mu_a - from_yield;
    if rest > 0.0 {
        Ok(rest / rate.powf(n - 1.0))
    } else {
        Err(KRefusal::YieldStressExceeds {
            from_yield_stress_pa_s: from_yield,
        })
    }
}
