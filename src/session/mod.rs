//! The hub between the engine and the faces: site + readings in, results out.
//!
//! Both the CLI and the TUI call only this layer for answers, so a number printed by
//! `rheoside fit` and a number drawn on screen come from the same code path. Later
//! capabilities (lines and restart, pumps, tanks, findings) add one file each here.

pub mod api_rp13d;
mod assess;
pub mod checks;
mod curve_checks;
pub mod duration;
pub mod findings;
pub mod findings_equipment;
mod findings_line;
mod findings_tank;
pub mod flow_curve;
pub mod guided;
pub mod line;
pub mod line_plant;
pub mod line_pump;
pub mod line_shown;
pub mod line_words;
pub mod off_scale;
mod points;
pub mod pump;
mod pump_site;
pub mod pump_words;
pub mod restart;
pub mod restart_chart;
mod restart_notes;
mod restart_site;
pub mod restart_words;
pub mod rheology_shift;
pub mod rheology_source;
pub mod spot;
pub mod state;
mod state_fit;
pub mod tank;
pub mod tank_input;
pub mod tank_json;
pub mod tank_live;
mod tank_motor;
mod tank_readings;
pub mod tank_words;
pub mod temperature;
pub mod trend;
pub mod trend_property;

pub use flow_curve::{
    FlowCurve, FlowCurveError, FlowCurveInput, FlowCurveOptions, ModelPick, PointOut, Why, analyse,
    curves_fitted_on_this_thread,
};
pub use state::{Entry, Moment, SessionState, SetError};
