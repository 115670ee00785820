//! ANSI/HI 9.6.7-2010, *Effects of Liquid Viscosity on Rotodynamic (Centrifugal and Vertical)
//! Pump Performance*: correction factors for Newtonian liquids in mainly radial pumps.
//!
//! B = 16.5·ν^0.5·H^0.0625/(Q^0.375·N^0.25) with ν in cSt, H in m per stage and Q in m³/h at
//! the water best-efficiency point (BEP), N in rpm (26.6 with US gpm and ft);
//! C_Q = 2.71^(−0.165·(log B)^3.15), C_H = 1 − (1 − C_Q)·(Q_W/Q_BEP,W)^0.75 (C_Q at the BEP),
//! C_η = B^(−0.0547·B^0.69). No correction for B ≤ 1; applied for 1 < B < 40 and "highly
//! uncertain" beyond. Test range of the data behind it about 1–3000 cSt, 13–1140 US gpm
//! (3–260 m³/h), 20–430 ft (6–130 m) per stage. Constants confirmed from secondary sources
//! only; confirm against the standard's own text.

/// The constant in B for ν in cSt, H in m, Q in m³/h and N in rpm.
pub const B_CONSTANT_SI: f64 = 16.5;
/// The same for Q in US gpm and H in ft.
pub const B_CONSTANT_US: f64 = 26.6;
/// Beyond this B the correction is highly uncertain.
pub const B_UPPER: f64 = 40.0;
/// Viscosity range of the test data, cSt.
pub const TEST_VISCOSITY_CST: (f64, f64) = (1.0, 3000.0);
/// BEP flow range of the test data, m³/h (13–1140 US gpm).
pub const TEST_FLOW_M3_H: (f64, f64) = (2.95, 259.0);
/// BEP head range of the test data, m per stage (20–430 ft).
pub const TEST_HEAD_M: (f64, f64) = (6.1, 131.0);

/// Where the correction stands for this duty.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum HiWarning {
    /// B > 40: outside the standard's range; the factors are highly uncertain.
    BeyondB40,
    /// The viscosity lies outside the test data.
    ViscosityOutsideTests,
    /// The BEP flow lies outside the test data.
    FlowOutsideTests,
    /// The BEP head per stage lies outside the test data.
    HeadOutsideTests,
}

/// The correction factors for one duty.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Correction {
    pub b: f64,
    pub c_q: f64,
    /// C_H at the BEP (equal to C_Q).
    pub c_h_bep: f64,
    pub c_eta: f64,
    /// True when B ≤ 1 and every factor is 1.
    pub none_needed: bool,
    pub warnings: Vec<HiWarning>,
}

/// B from ν (cSt), the water BEP flow (m³/h) and head per stage (m), and speed (rpm).
pub fn b_parameter(nu_cst: f64, q_bep_m3_h: f64, h_bep_m: f64, speed_rpm: f64) -> f64 {
    B_CONSTANT_SI * nu_cst.sqrt() * h_bep_m.powf(0.0625)
        / (q_bep_m3_h.powf(0.375) * speed_rpm.powf(0.25))
}

/// C_Q = 2.71^(−0.165·(log10 B)^3.15); 1 for B ≤ 1.
pub fn c_q(b: f64) -> f64 {
    if b <= 1.0 {
        return 1.0;
    }
    2.71f64.powf(-0.165 * b.log10().powf(3.15))
}

/// C_η = B^(−0.0547·B^0.69); 1 for B ≤ 1.
pub fn c_eta(b: f64) -> f64 {
    if b <= 1.0 {
        return 1.0;
    }
    b.powf(-0.0547 * b.powf(0.69))
}

/// C_H away from the BEP: 1 − (1 − C_H,BEP)·(Q_W/Q_BEP,W)^0.75; 1 at shut-off.
pub fn c_h(c_h_bep: f64, flow_ratio: f64) -> f64 {
    1.0 - (1.0 - c_h_bep) * flow_ratio.max(0.0).powf(0.75)
}

/// The factors and warnings for ν (cSt) at a water BEP (m³/h, m per stage) and speed (rpm).
pub fn correction(nu_cst: f64, q_bep_m3_h: f64, h_bep_m: f64, speed_rpm: f64) -> Correction {
    let b = b_parameter(nu_cst, q_bep_m3_h, h_bep_m, speed_rpm);
    let cq = c_q(b);
    let mut warnings = Vec::new();
    if b > B_UPPER {
        warnings.push(HiWarning::BeyondB40);
    }
    let outside = |v: f64, (lo, hi): (f64, f64)| v < lo || v > hi;
    if outside(nu_cst, TEST_VISCOSITY_CST) {
        warnings.push(HiWarning::ViscosityOutsideTests);
    }
    if outside(q_bep_m3_h, TEST_FLOW_M3_H) {
        warnings.push(HiWarning::FlowOutsideTests);
    }
    if outside(h_bep_m, TEST_HEAD_M) {
        warnings.push(HiWarning::HeadOutsideTests);
    }
    Correction {
        b,
        c_q: cq,
        c_h_bep: cq,
        c_eta: c_eta(b),
        none_needed: b <= 1.0,
        warnings,
    }
}
