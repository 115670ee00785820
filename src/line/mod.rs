//! Pipelines: pressure drop in every regime (elsewhere) and restart after a stop (`restart`).
pub mod restart;
