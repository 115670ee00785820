//! The hub between the engine and the faces: site + readings in, results out.
//!
//! Both the CLI and the TUI call only this layer for answers, so a number printed by
//! `rheoside fit` and a number drawn on screen come from the same code path. Later
//! capabilities (lines and restart, pumps, tanks, findings) add one file each here.

pub mod api_rp13d;
mod assess;
pub mod checks;
mod curve_checks;
pub mod flow_curve;
pub mod json;
pub mod off_scale;
mod points;
pub mod state;
pub mod temperature;
pub mod trend;
pub mod trend_property;

pub use flow_curve::{
    FlowCurve, FlowCurveError, FlowCurveInput, FlowCurveOptions, ModelPick, PointOut, analyse,
};
pub use state::{Entry, Moment, SessionState, SetError};
