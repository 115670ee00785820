//! Flow models, least-squares fits with 95 % confidence intervals, model choice, and the
//! Arrhenius temperature shift. Pure: no terminal, disk or clock.
//!
//! Methods and sources are named where each is defined (models in `model`, the fit in `fit`,
//! the choice rule in `choose`, the temperature shift in `temperature`). Conventions for
//! R², RMSE, AICc and the intervals are in [`stats`].

pub mod band;
mod choose;
mod data;
mod error;
mod fit;
mod kind;
pub(crate) mod levenberg;
pub(crate) mod linalg;
mod linear;
mod loglog;
mod model;
pub mod stats;
pub mod temperature;

pub use choose::{Candidate, Choice, StepDown, choose};
pub use data::{MAX_PLANT_SHEAR_RATE_PER_S, MAX_PLANT_STRESS_PA, Point};
pub use error::{FitError, NoCi};
pub use fit::{Estimate, Fit, FitOptions, Weighting, fit};
pub use kind::{ModelKind, ParamName};
pub use linear::{LineFit, fit_line};
pub use loglog::{LogPowerLaw, fit_power_law_log};
pub use model::Model;
