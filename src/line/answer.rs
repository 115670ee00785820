//! What a line answer holds: every quantity reported, the correlation used and notes as data.

use super::regime::{CriticalRule, Regime};

/// The friction law behind the friction factor reported.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Correlation {
    /// The exact laminar relation of the flow model.
    Laminar,
    /// Colebrook (1939) with the line's roughness.
    Colebrook,
    /// Dodge & Metzner (1959), smooth pipe.
    DodgeMetzner,
    /// Darby, Mun & Boger (1992), all-regime blend.
    DarbyMunBoger,
}

/// Something the reader of an answer must know, as data.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(rename_all = "kebab-case", tag = "note")]
pub enum Note {
    /// Dodge–Metzner is a smooth-pipe correlation: the line's roughness was not used.
    SmoothPipeAssumed,
    /// Dodge–Metzner used with n′ outside its data (0.36–1).
    FlowIndexOutsideData { n_prime: f64 },
    /// Dodge–Metzner used above the Reynolds numbers of its data (about 3.6×10⁴, from memory).
    ReynoldsBeyondData { reynolds: f64, limit: f64 },
    /// Between laminar and turbulent: the pressure drop is given as the band between the
    /// laminar and turbulent estimates, and the larger is reported.
    TransitionalBand { low_pa: f64, high_pa: f64 },
    /// The turbulent correlation gave less friction than laminar flow would; laminar used.
    TurbulentBelowLaminar,
    /// The pressure does not overcome the static head plus the yield stress's hold on the
    /// wall (4Lτ0/D): the product stands in the line.
    NoFlow {
        static_pressure_pa: f64,
        yield_pressure_pa: f64,
    },
}

/// Pipe-flow answer at one flow. Pressures are differences along the line, Pa.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct LineAnswer {
    pub flow_m3_s: f64,
    pub velocity_m_s: f64,
    /// τw = fρV²/2 (laminar: from the exact relation), Pa.
    pub wall_shear_stress_pa: f64,
    /// The product's shear rate at the wall stress, 1/s.
    pub wall_shear_rate_per_s: f64,
    /// 8V/D, 1/s.
    pub nominal_shear_rate_per_s: f64,
    /// Generalized (Metzner–Reed) Reynolds number, 8ρV²/τw at the laminar wall stress.
    pub reynolds: f64,
    pub critical_reynolds: f64,
    pub critical_rule: CriticalRule,
    pub regime: Regime,
    /// Local flow index n′ = d ln τw / d ln(8V/D) of the laminar pipe flow curve.
    pub n_prime: f64,
    pub fanning_friction: f64,
    pub correlation: Correlation,
    /// The exact laminar friction factor at this flow (16/Re).
    pub laminar_friction: f64,
    /// The turbulent correlation's friction factor at this flow (evaluated outside laminar).
    pub turbulent_friction: Option<f64>,
    /// 2fρV²(L + L_fittings)/D, Pa.
    pub friction_pressure_drop_pa: f64,
    /// ρgΔz, Pa.
    pub static_pressure_pa: f64,
    /// Friction plus static head, Pa.
    pub pressure_drop_pa: f64,
    /// [low, high] of the laminar and turbulent estimates of the total, when transitional.
    pub transition_range_pa: Option<(f64, f64)>,
    pub notes: Vec<Note>,
}
