//! Pipe flow of a product with a known flow curve: pressure drop for a flow and flow for a
//! pressure drop in every regime, the line's system curve with its uncertainty band, and the
//! flow curve back-calculated from plant (pressure drop, flow) pairs. Pure: numbers in,
//! facts out (regimes, correlations and notes as data; words are built at the edge).
//!
//! Conventions: SI throughout; f is the Fanning friction factor (Darcy = 4f); the Reynolds
//! number is the generalized one of Metzner & Reed (1955, AIChE J 1:434), Re = 8ρV²/τw with τw
//! the laminar wall stress at that flow, which reduces to ρVD/μ for a Newtonian product.

mod answer;
mod backcalc;
mod band;
mod compare;
mod curve;
mod error;
mod forward;
mod friction;
mod integral;
mod inverse;
mod laminar;
mod pipe;
mod regime;
pub mod restart;
mod solve;
mod turbulent;

pub use answer::{Correlation, LineAnswer, Note};
pub use backcalc::{BackCalc, PlantPair, PlantPoint, SinglePair, back_calculate, single_pair};
pub use band::{Uncertainty, pressure_drop_band};
pub use compare::{AGREE_WITHIN, Comparison, Disagreement, compare_with_curve};
pub use curve::{CurvePoint, system_curve};
pub use error::LineError;
pub use forward::pressure_drop;
pub use friction::{
    colebrook_fanning, darby_mun_boger_blend, darby_mun_boger_turbulent, dodge_metzner,
};
pub use integral::general_flow;
pub use inverse::{FlowAnswer, flow_for_pressure};
pub use laminar::{flow_at_wall_stress, wall_stress_at_flow};
pub use pipe::{Fluid, GRAVITY, Pipe};
pub use regime::{CriticalRule, Regime, critical_reynolds, hanks_critical, ryan_johnson};
