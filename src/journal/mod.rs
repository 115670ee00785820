//! journal (being built).
