//! Pump notes in words for both faces.

use super::pump::PumpNote;
use crate::pump::{HiWarning, NoDuty};

/// One note in words.
pub fn note(n: &PumpNote) -> String {
    match *n {
        PumpNote::NoCorrectionNeeded => "B ≤ 1: no viscosity correction is needed (ANSI/HI 9.6.7)".into(),
        PumpNote::Hi(HiWarning::BeyondB40) => "B above 40: outside ANSI/HI 9.6.7; the corrected curve is highly uncertain".into(),
        PumpNote::Hi(HiWarning::ViscosityOutsideTests) => "the viscosity lies outside the test data behind ANSI/HI 9.6.7 (about 1–3000 cSt)".into(),
        PumpNote::Hi(HiWarning::FlowOutsideTests) => "the BEP flow lies outside the test data behind ANSI/HI 9.6.7 (about 3–260 m3/h)".into(),
        PumpNote::Hi(HiWarning::HeadOutsideTests) => "the BEP head lies outside the test data behind ANSI/HI 9.6.7 (about 6–130 m per stage)".into(),
        PumpNote::NonNewtonianNotStandardized { shear_rate_per_s } => format!("non-Newtonian product: its apparent viscosity at {shear_rate_per_s:.0} 1/s stands in for the viscosity; this use of ANSI/HI 9.6.7 is not standardized"),
        PumpNote::DensityAssumedWater => "no density given: the power is for water (1000 kg/m3)".into(),
        PumpNote::ShearThickening => "the product thickens with shear: the pressure can climb fast with speed; check the relief valve".into(),
        PumpNote::PressureRisesFasterThanSpeed { exponent } => format!("the discharge pressure rises faster than the speed (as speed^{exponent:.2}): check the relief valve"),
        PumpNote::ReliefOpens => "the discharge pressure reaches the relief setting: the relief opens and the line gets less; never raise the relief setting to force flow".into(),
        PumpNote::MotorOverloaded => "the power drawn exceeds the motor's rating".into(),
        PumpNote::SlipEstimated => "slip estimated from viscosity (common practice, no source); a measured volumetric efficiency is better".into(),
        PumpNote::NotLaminar => "the flow at the duty point is not laminar: the line loss comes from the turbulent correlation (the middle of the band when transitional)".into(),
        PumpNote::NoDuty(NoDuty::PumpBelowSystem) => "no duty point: the pump's head is below what the line needs even at low flow".into(),
        PumpNote::NoDuty(NoDuty::BeyondCurve) => "no duty point on the curve: the pump would run out past the end of its curve".into(),
        PumpNote::NoDuty(NoDuty::SystemUndefined) => "no duty point: the system curve gave no value in the pump's range".into(),
        PumpNote::MechanicalLossesIgnored => "shaft power counts no mechanical losses: the motor needs more".into(),
    }
}

/// The cautions that go with any pump answer.
pub const CAUTIONS: [&str; 3] = [
    "never exceed the rated pressure of the weakest part of the line",
    "never raise a relief setting to force flow; isolate and lock out before opening the line",
    "this tool advises; it does not certify: local codes and licensed practice come first",
];
