//! Pieces the views are drawn with: the unit-aware text field and its editing keys, the
//! log–log chart, the linear chart, and the pick list.

pub mod editing;
pub mod field;
pub mod lin_chart;
pub mod list;
pub mod log_axis;
pub mod log_chart;
