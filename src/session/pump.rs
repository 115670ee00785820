//! Pump answers for the faces: the ANSI/HI 9.6.7 correction at a best-efficiency point, and a
//! site pump on its line with a product — the corrected curve and the duty point (centrifugal)
//! or the delivered flow against the relief (positive displacement).

use crate::pump::{Correction, G, HiWarning, NoDuty, PumpPoint, correction};

pub use super::pump_site::{
    CentrifugalAnswer, DisplacementAnswer, PumpAnswer, PumpSetupError, SitePump, SitePumpAnswer,
    on_site,
};

/// Shear rate at which a non-Newtonian product's apparent viscosity stands in for ν when no
/// other is given, 1/s (pumps shear at 10³–10⁵ s⁻¹: common practice, no source).
pub const DEFAULT_PUMP_SHEAR_RATE: f64 = 1000.0;
/// Density assumed for the power at a BEP when none is given (water), kg/m³.
pub const WATER_DENSITY: f64 = 1000.0;

/// A note that goes with a pump answer.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(tag = "kind", rename_all = "kebab-case")]
pub enum PumpNote {
    NoCorrectionNeeded,
    Hi(HiWarning),
    NonNewtonianNotStandardized {
        shear_rate_per_s: f64,
    },
    DensityAssumedWater,
    ShearThickening,
    PressureRisesFasterThanSpeed {
        exponent: f64,
    },
    ReliefOpens,
    MotorOverloaded,
    SlipEstimated,
    /// The duty point is transitional or turbulent (the line module handles every regime).
    NotLaminar,
    NoDuty(NoDuty),
    MechanicalLossesIgnored,
}

/// The correction at one water BEP.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct BepAnswer {
    pub correction: Correction,
    pub flow_m3_s: f64,
    pub head_m: f64,
    pub efficiency: f64,
    pub power_w: f64,
    pub density_kg_m3: f64,
    pub notes: Vec<PumpNote>,
}

/// ν in cSt, the water BEP (m³/s, m, 0–1), speed in rpm, density (kg/m³) if known.
pub fn at_bep(nu_cst: f64, bep: PumpPoint, speed_rpm: f64, density: Option<f64>) -> BepAnswer {
    let c = correction(nu_cst, bep.flow_m3_s * 3600.0, bep.head_m, speed_rpm);
    let rho = density.unwrap_or(WATER_DENSITY);
    let (q, h, eta) = (
        bep.flow_m3_s * c.c_q,
        bep.head_m * c.c_h_bep,
        bep.efficiency * c.c_eta,
    );
    let mut notes = hi_notes(&c);
    if density.is_none() {
        notes.push(PumpNote::DensityAssumedWater);
    }
    BepAnswer {
        flow_m3_s: q,
        head_m: h,
        efficiency: eta,
        power_w: rho * G * q * h / eta,
        density_kg_m3: rho,
        correction: c,
        notes,
    }
}

fn hi_notes(c: &Correction) -> Vec<PumpNote> {
    let mut notes: Vec<PumpNote> = c.warnings.iter().map(|w| PumpNote::Hi(*w)).collect();
    if c.none_needed {
        notes.insert(0, PumpNote::NoCorrectionNeeded);
    }
    notes
}
