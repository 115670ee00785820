//! Flow models, least-squares fits with 95 % confidence intervals, model choice, and the
//! Arrhenius temperature shift. Pure: no terminal, disk or clock.
//!
//! Methods and sources: REFERENCE.md §1 (models, fitting) and §4 (temperature). Conventions for
//! R², RMSE, AICc and the intervals are in [`stats`].

mod choose;
mod data;
mod error;
mod fit;
mod kind;
mod levenberg;
mod linalg;
mod linear;
mod loglog;
mod model;
mod reason;
pub mod stats;
pub mod temperature;

pub use choose::{Candidate, Choice, choose};
pub use data::{MAX_PLANT_SHEAR_RATE_PER_S, MAX_PLANT_STRESS_PA, Point};
pub use error::{FitError, NoCi};
pub use fit::{Estimate, Fit, FitOptions, Weighting, fit};
pub use kind::{ModelKind, ParamName};
pub use linear::{LineFit, fit_line};
pub use loglog::{LogPowerLaw, fit_power_law_log};
pub use model::Model;
