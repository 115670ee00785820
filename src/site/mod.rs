//! site (being built).
