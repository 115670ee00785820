//! units (being built).
