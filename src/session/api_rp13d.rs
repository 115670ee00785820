//! The API RP 13D field relations beside a fit, for the standard six-speed geometry: plastic
//! viscosity and yield point from θ600 and θ300, pipe n and K from the same two, and the
//! annulus n and K from θ100 and θ3 when they were read.
//!
//! Relations (API RP 13D; printed in Guo & Liu 2011, *Applied Drilling Circulation Systems*,
//! eqs 2.6–2.10): PV = θ600 − θ300 (mPa·s), YP = θ300 − PV (lbf/100 ft²), n = 3.322·log(θ600/θ300),
//! Kp = 5.11·θ600/1022ⁿ (dyn·sⁿ/cm²); annulus nₐ = 0.657·log(θ100/θ3), Kₐ = 5.11·θ100/170.2^nₐ.
//! YP in Pa uses the standard's 0.4788 Pa per lbf/100 ft², which is not the 0.511 Pa per dial
//! degree of the stress conversion: the field relation treats one degree as one lbf/100 ft²,
//! so the two differ by design (about 6.7 %).

use crate::instrument::oilfield::{
    LBF_PER_100FT2_IN_PA, annulus_k_dyn_sn_cm2, annulus_n, pipe_k_dyn_sn_cm2, pipe_n,
    plastic_viscosity_mpa_s, yield_point_lbf_100ft2,
};
use crate::instrument::{DialReading, Geometry};

/// dyn·sⁿ/cm² in Pa·sⁿ (1 dyn/cm² = 0.1 Pa, exact).
const DYN_CM2_IN_PA: f64 = 0.1;

/// The field relations, SI where a unit is SI; the JSON object `api_rp13d` has these keys.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct ApiRp13d {
    pub plastic_viscosity_pa_s: f64,
    pub yield_point_lbf_100ft2: f64,
    pub yield_point_pa: f64,
    pub n: f64,
    pub k_pa_sn: f64,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub n_annulus: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub k_annulus_pa_sn: Option<f64>,
}

/// The relations, when the geometry is the standard one and θ600 and θ300 are read above 0.
/// Readings at one speed are averaged; `readings` are those kept in the fit (a pegged dial
/// gives no relation).
pub fn field_relations(geometry: &Geometry, readings: &[DialReading]) -> Option<ApiRp13d> {
    if !matches!(geometry, Geometry::StandardSixSpeed) {
        return None;
    }
    let t600 = dial_at(readings, 600.0)?;
    let t300 = dial_at(readings, 300.0)?;
    let annulus = dial_at(readings, 100.0).zip(dial_at(readings, 3.0));
    let out = ApiRp13d {
        plastic_viscosity_pa_s: plastic_viscosity_mpa_s(t600, t300) * 1e-3,
        yield_point_lbf_100ft2: yield_point_lbf_100ft2(t600, t300),
        yield_point_pa: yield_point_lbf_100ft2(t600, t300) * LBF_PER_100FT2_IN_PA,
        n: pipe_n(t600, t300),
        k_pa_sn: pipe_k_dyn_sn_cm2(t600, t300) * DYN_CM2_IN_PA,
        n_annulus: annulus.map(|(a, b)| annulus_n(a, b)),
        k_annulus_pa_sn: annulus.map(|(a, b)| annulus_k_dyn_sn_cm2(a, b) * DYN_CM2_IN_PA),
    };
    let finite = [
        out.plastic_viscosity_pa_s,
        out.yield_point_pa,
        out.n,
        out.k_pa_sn,
    ]
    .iter()
    .chain(out.n_annulus.iter())
    .chain(out.k_annulus_pa_sn.iter())
    .all(|v| v.is_finite());
    finite.then_some(out)
}

/// Mean dial at this speed (within 0.5 rpm), if above 0.
fn dial_at(readings: &[DialReading], rpm: f64) -> Option<f64> {
    let at: Vec<f64> = readings
        .iter()
        .filter(|r| (r.rpm - rpm).abs() <= 0.5)
        .map(|r| r.dial)
        .collect();
    let mean = at.iter().sum::<f64>() / at.len().max(1) as f64;
    (!at.is_empty() && mean > 0.0).then_some(mean)
}

/// The note shown beside the YP in Pa, so nobody "corrects" one conversion by the other.
pub const CONVERSION_NOTE: &str = "YP in Pa uses API RP 13D's 0.4788 Pa per lbf/100 ft²; the \
     stresses of the fit use 0.511 Pa per dial degree. They differ by design: the field \
     relation counts one degree as one lbf/100 ft².";
