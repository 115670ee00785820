//! rheology (being built).
