//! The catalogue of readings an operator can record (being built).
