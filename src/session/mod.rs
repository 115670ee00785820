//! session (being built).
