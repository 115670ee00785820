//! rheoside: plant-side answers for thick, non-Newtonian products.
//!
//! Floors, from the ground up (imports only run downward):
//! `units`; then `rheology`, `site`, `journal`; then `instrument`; `session` (the hub both
//! faces talk to); the faces `cli` and `tui`. The core (`units`, `rheology`, `instrument`)
//! is pure: no terminal, no disk, no clock.

pub mod units;

pub mod rheology;

pub mod instrument;

pub mod site;

pub mod journal;

pub mod line;

pub mod session;

pub mod cli;

pub mod tui;

pub mod text;

pub mod readings;
