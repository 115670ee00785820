//! instrument (being built).
