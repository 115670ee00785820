//! Agitated tanks: Metzner–Otto power at a speed for any flow model, the viscosity a motor
//! reading implies, the drive's limits, and caverns in yield-stress products.
//!
//! Pure: no terminal, disk or clock; imports only `rheology` and its own files. Facts come
//! back as numbers, ranges and enums; the words are built by the faces (via `session`).
//! Conventions: SI; agitator speed N in rev/s; D the impeller and T the tank diameter.

mod cavern;
mod compare;
mod curve;
mod error;
mod impeller;
mod limits;
mod motor;
mod power;
mod ribbon;
mod sweep;

pub use cavern::{
    Cavern, CavernFinding, ELSON_HEIGHT_RATIO, MAX_SEARCH_RPS, WallSpeed, cavern, elson_diameter_m,
};
pub use compare::{AGREEMENT_FACTOR, Agreement, Comparison, compare};
pub use curve::{
    Baffling, Constant, ConstantSource, Overrides, PowerCurve, RIEGER_SCATTER, Regime, Shape,
};
pub use error::MixError;
pub use impeller::{
    ANCHOR, HELICAL_RIBBON, HYDROFOIL, ImpellerConstants, ImpellerKind, PITCHED_BLADE_TURBINE,
    PROPELLER, RUSHTON_TURBINE, Spread,
};
pub use limits::{LoadCheck, LoadVerdict, NEAR_LIMIT_FRACTION, SpecificPowerBand};
pub use motor::{
    BackCalc, Electrical, FromPower, KRefusal, MotorReading, Refusal, electrical_power_w,
    k_from_viscosity, shaft_power_w, viscosity_from_power,
};
pub use power::{Drive, Fluid, Operating, Point, Vessel, operate, point_on};
pub use ribbon::{RibbonGeometry, kp_rieger};
pub use sweep::{log_spaced, power_number_curve, speed_sweep};
