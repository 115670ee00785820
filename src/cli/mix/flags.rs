//! Typed flags to SI values: bare numbers are SI, a speed must carry its unit, fractions
//! take 0-1 or a percentage.

use super::args::MixArgs;
use crate::mixing::{Baffling, ImpellerKind, Overrides};
use crate::session::tank_input::TankFlags;
use crate::units::{self, Dimension};
use anyhow::{Result, anyhow, bail};
use std::f64::consts::PI;

pub(super) fn tank_flags(a: &MixArgs) -> Result<TankFlags> {
    Ok(TankFlags {
        impeller: a.impeller.as_deref().map(impeller).transpose()?,
        impeller_diameter_m: si(
            "--impeller-diameter",
            &a.impeller_diameter,
            Dimension::Length,
            "m",
        )?,
        speed_rps: a.speed.as_deref().map(speed).transpose()?,
        density_kg_m3: si("--density", &a.density, Dimension::Density, "kg/m3")?,
        tank_diameter_m: si("--tank-diameter", &a.tank_diameter, Dimension::Length, "m")?,
        liquid_height_m: si("--liquid-height", &a.liquid_height, Dimension::Length, "m")?,
        baffling: a.baffles.as_deref().map(baffling).transpose()?,
        overrides: Overrides {
            ks: a.ks,
            kp: a.kp,
            np_turbulent: a.np_turbulent,
        },
        motor_current_a: si("--motor-current", &a.motor_current, Dimension::Current, "A")?,
        motor_power_w: si("--motor-power", &a.motor_power, Dimension::Power, "W")?,
        voltage_v: si("--voltage", &a.voltage, Dimension::Voltage, "V")?,
        power_factor: fraction("--power-factor", &a.power_factor)?,
        motor_efficiency: fraction("--motor-efficiency", &a.motor_efficiency)?,
        gearbox_efficiency: fraction("--gearbox-efficiency", &a.gearbox_efficiency)?,
        no_load_power_w: si("--no-load-power", &a.no_load_power, Dimension::Power, "W")?,
    })
}

fn impeller(name: &str) -> Result<ImpellerKind> {
    ImpellerKind::from_name(name).ok_or_else(|| {
        let names: Vec<&str> = ImpellerKind::ALL.iter().map(|k| k.name()).collect();
        anyhow!(
            "--impeller '{}': not a known type; use one of {}",
            crate::text::sanitize(name, false),
            names.join(", ")
        )
    })
}

fn baffling(text: &str) -> Result<Baffling> {
    match text.trim().to_ascii_lowercase().as_str() {
        "baffled" => Ok(Baffling::Baffled),
        "unbaffled" => Ok(Baffling::Unbaffled),
        _ => bail!(
            "--baffles '{}': use baffled or unbaffled",
            crate::text::sanitize(text, false)
        ),
    }
}

/// A speed in rev/s. A bare number is refused: 30 could be rpm or rev/s.
fn speed(text: &str) -> Result<f64> {
    if text.trim().parse::<f64>().is_ok() {
        bail!(
            "--speed '{}': add the unit, e.g. '{} rpm' or '{} rps'",
            text.trim(),
            text.trim(),
            text.trim()
        );
    }
    let rad_s = units::parse(text, Dimension::Speed).map_err(|e| anyhow!("--speed: {e}"))?;
    Ok(rad_s / (2.0 * PI))
}

fn si(flag: &str, text: &Option<String>, dim: Dimension, bare: &str) -> Result<Option<f64>> {
    let Some(text) = text else { return Ok(None) };
    units::parse_with_default(text, dim, bare)
        .map(Some)
        .map_err(|e| anyhow!("{flag}: {e}"))
}

fn fraction(flag: &str, text: &Option<String>) -> Result<Option<f64>> {
    si(flag, text, Dimension::Fraction, "")
}
