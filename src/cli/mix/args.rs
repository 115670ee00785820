//! `rheoside mix` arguments: a tank from the site (`--tank`) or typed in full, the product's
//! flow curve, and an optional motor reading.

use crate::cli::rheology_args::RheologySourceArgs;
use clap::Args;

/// Power, torque and caverns for an agitated tank; the viscosity a motor reading implies.
///
/// Bare numbers are SI (m, kg/m3, A, V, W); a speed needs its unit ('30 rpm', '0.5 rps').
/// A flag beats the tank's latest journalled reading, which beats the site config.
/// Exit 2 on bad input, and when a motor reading cannot give a viscosity (the answer is
/// still printed, with the reason).
#[derive(Debug, Args)]
pub struct MixArgs {
    /// Tank id from the site config (--site, or the bundled demo site).
    #[arg(long, value_name = "ID")]
    pub tank: Option<String>,
    /// rushton-turbine, pitched-blade-turbine, propeller, hydrofoil, anchor or helical-ribbon.
    #[arg(long, value_name = "TYPE")]
    pub impeller: Option<String>,
    /// Impeller diameter (bare number: m).
    #[arg(long = "impeller-diameter", value_name = "LENGTH")]
    pub impeller_diameter: Option<String>,
    /// Agitator speed with its unit, e.g. '30 rpm'.
    #[arg(long, value_name = "SPEED", allow_hyphen_values = true)]
    pub speed: Option<String>,
    /// Product density (bare number: kg/m3).
    #[arg(long, value_name = "DENSITY")]
    pub density: Option<String>,
    /// The flow curve: flags, `--journal FILE` (also the tank's latest spot readings), or the
    /// product's nominal constants; `--product` names another product than the tank's.
    #[command(flatten)]
    pub source: RheologySourceArgs,
    /// Tank diameter (bare number: m).
    #[arg(long = "tank-diameter", value_name = "LENGTH")]
    pub tank_diameter: Option<String>,
    /// Liquid height above the tank bottom (bare number: m).
    #[arg(long = "liquid-height", value_name = "LENGTH")]
    pub liquid_height: Option<String>,
    /// baffled or unbaffled (default: the site's, else baffled for turbines and propellers).
    #[arg(long, value_name = "WALL")]
    pub baffles: Option<String>,
    /// Metzner–Otto ks of this impeller, replacing the published value.
    #[arg(long, value_name = "X")]
    pub ks: Option<f64>,
    /// Laminar Kp = Np·Re of this impeller, replacing the published value.
    #[arg(long, value_name = "X")]
    pub kp: Option<f64>,
    /// Turbulent power number of this impeller in this tank.
    #[arg(long = "np-turbulent", value_name = "X")]
    pub np_turbulent: Option<f64>,
    /// Motor line current, one phase (bare number: A).
    #[arg(long = "motor-current", value_name = "CURRENT")]
    pub motor_current: Option<String>,
    /// Electrical power from a power meter, instead of current (bare number: W).
    #[arg(long = "motor-power", value_name = "POWER")]
    pub motor_power: Option<String>,
    /// Supply voltage, line to line (bare number: V).
    #[arg(long, value_name = "VOLTAGE")]
    pub voltage: Option<String>,
    /// Motor power factor, 0-1 or a percentage.
    #[arg(long = "power-factor", value_name = "FRACTION")]
    pub power_factor: Option<String>,
    /// Motor efficiency, 0-1 or a percentage.
    #[arg(long = "motor-efficiency", value_name = "FRACTION")]
    pub motor_efficiency: Option<String>,
    /// Gearbox efficiency, 0-1 or a percentage (default 1: direct drive).
    #[arg(long = "gearbox-efficiency", value_name = "FRACTION")]
    pub gearbox_efficiency: Option<String>,
    /// Shaft power with the impeller turning in an empty tank (bare number: W).
    #[arg(long = "no-load-power", value_name = "POWER")]
    pub no_load_power: Option<String>,
    /// One JSON object on stdout, SI units.
    #[arg(long)]
    pub json: bool,
}
