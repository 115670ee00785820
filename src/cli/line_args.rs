//! Flags of `rheoside line`: the pipe (typed, or a site line), the flow or the pressure, and
//! the product's flow curve (shared rheology source flags).

use super::rheology_args::RheologySourceArgs;
use crate::units::{self, Dimension};
use anyhow::{Result, bail};
use clap::Args;

/// Pressure drop in a line for a flow, or the flow for a pressure drop.
#[derive(Debug, Clone, Args)]
pub struct LineArgs {
    /// Volumetric flow (bare number: m3/s; or with a unit, e.g. "12 m3/h", "50 gpm").
    #[arg(long, allow_hyphen_values = true, value_name = "Q")]
    pub flow: Option<String>,
    /// Answer the inverse: the flow for this total pressure drop (bare number: Pa; or
    /// "1.8 bar").
    #[arg(
        long = "flow-for-pressure",
        allow_hyphen_values = true,
        value_name = "P",
        conflicts_with = "flow"
    )]
    pub flow_for_pressure: Option<String>,
    /// Line id from the site config (bore, lengths, roughness, rise and design pressure).
    #[arg(long, value_name = "ID")]
    pub line: Option<String>,
    /// Inner diameter (bare number: m; or "72.9 mm").
    #[arg(long, allow_hyphen_values = true, value_name = "D")]
    pub diameter: Option<String>,
    /// Straight length (bare number: m).
    #[arg(long, allow_hyphen_values = true, value_name = "L")]
    pub length: Option<String>,
    /// Product density (bare number: kg/m3); default: the product's from the site config.
    #[arg(long, allow_hyphen_values = true, value_name = "RHO")]
    pub density: Option<String>,
    /// Outlet height minus inlet height (bare number: m; negative downhill).
    #[arg(long, value_name = "H", allow_hyphen_values = true)]
    pub elevation: Option<String>,
    /// Absolute wall roughness (bare number: m; e.g. "0.045 mm"); used for Newtonian products.
    #[arg(long, allow_hyphen_values = true, value_name = "E")]
    pub roughness: Option<String>,
    /// Equivalent length of bends and valves (bare number: m).
    #[arg(long = "fittings-length", allow_hyphen_values = true, value_name = "L")]
    pub fittings_length: Option<String>,
    #[command(flatten)]
    pub source: RheologySourceArgs,
    /// One JSON object on stdout, SI units.
    #[arg(long)]
    pub json: bool,
}

impl LineArgs {
    /// True when any of the pipe's own dimensions was typed.
    pub fn has_pipe_flags(&self) -> bool {
        self.diameter.is_some()
            || self.length.is_some()
            || self.elevation.is_some()
            || self.roughness.is_some()
            || self.fittings_length.is_some()
    }
}

/// A quantity typed as a flag: bare numbers in `default_unit`; must be above zero.
pub fn positive(flag: &str, text: &str, dim: Dimension, default_unit: &str) -> Result<f64> {
    match units::parse_with_default(text, dim, default_unit) {
        Ok(v) if v.is_finite() && v > 0.0 => Ok(v),
        Ok(v) => bail!("{flag} '{text}' ({v} {default_unit}): must be above zero"),
        Err(e) => bail!("{flag}: {e}"),
    }
}

/// A quantity typed as a flag that may be zero (or negative when `signed`).
pub fn any(
    flag: &str,
    text: &str,
    dim: Dimension,
    default_unit: &str,
    signed: bool,
) -> Result<f64> {
    match units::parse_with_default(text, dim, default_unit) {
        Ok(v) if v.is_finite() && (signed || v >= 0.0) => Ok(v),
        Ok(v) => bail!("{flag} '{text}' ({v} {default_unit}): must not be negative"),
        Err(e) => bail!("{flag}: {e}"),
    }
}
