//! rheoside: plant-side answers for thick, non-Newtonian products.
//!
//! Floors, from the ground up (imports only run downward; `tests/layering.rs` checks it):
//! `units` and `text`; the engine (`rheology`, `instrument`); storage (`site`, `journal`,
//! `readings`); `session` (the hub); `present` (one way to show a number); the faces `cli`
//! and `tui`, which never use each other. The base and the engine are pure: no terminal, no
//! disk, no clock.

pub mod units;

pub mod rheology;

pub mod instrument;

pub mod mixing;

pub mod site;

pub mod journal;

pub mod line;

pub mod session;

pub mod present;

pub mod cli;

pub mod tui;

pub mod text;

pub mod readings;

pub mod pump;

pub mod diagnose;
