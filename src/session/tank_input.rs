//! What a tank calculation starts from: the site's tank and product, the latest spot readings
//! at the tank (agitator speed, motor current or power, voltage, level), and values typed as
//! flags, merged in that order (a flag beats a reading, a reading beats the site).

pub use super::tank_readings::{TankReadings, readings_from_journal};
use crate::mixing::{
    Baffling, Drive, Fluid, ImpellerKind, MixError, MotorReading, Overrides, RibbonGeometry, Vessel,
};
use crate::rheology::Model;
use crate::site::{Baffles, Impeller, Site, Tank};
use std::f64::consts::PI;

/// Values typed for one calculation; each replaces the site's or a reading's.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct TankFlags {
    pub impeller: Option<ImpellerKind>,
    pub impeller_diameter_m: Option<f64>,
    pub speed_rps: Option<f64>,
    pub density_kg_m3: Option<f64>,
    pub tank_diameter_m: Option<f64>,
    pub liquid_height_m: Option<f64>,
    pub baffling: Option<Baffling>,
    pub overrides: Overrides,
    pub motor_current_a: Option<f64>,
    pub motor_power_w: Option<f64>,
    pub voltage_v: Option<f64>,
    pub power_factor: Option<f64>,
    pub motor_efficiency: Option<f64>,
    pub gearbox_efficiency: Option<f64>,
    pub no_load_power_w: Option<f64>,
}

/// Everything the engine needs for one tank at one speed.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TankRequest {
    pub vessel: Vessel,
    pub drive: Drive,
    pub fluid: Fluid,
    pub speed_rps: f64,
    pub motor: Option<MotorReading>,
    /// Where the speed came from, for the output.
    pub speed_from: Source,
}

/// Where a value came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Source {
    Flag,
    Reading,
    Site,
}

/// Why a request could not be put together.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum TankInputError {
    #[error("tank '{id}' is not in the site config; its tanks: {known}")]
    UnknownTank { id: String, known: String },
    #[error("product '{name}' is not in the site config; its products: {known}")]
    UnknownProduct { name: String, known: String },
    #[error("no {what} was given; {hint}")]
    Missing {
        what: &'static str,
        hint: &'static str,
    },
    #[error("a motor reading needs {missing} as well (give them, or use --site with --tank)")]
    MotorIncomplete { missing: String },
    #[error("{0}")]
    Mix(#[from] MixError),
}

/// The engine's impeller for the site's.
pub fn impeller_kind(i: Impeller) -> ImpellerKind {
    match i {
        Impeller::RushtonTurbine => ImpellerKind::RushtonTurbine,
        Impeller::PitchedBladeTurbine => ImpellerKind::PitchedBladeTurbine,
        Impeller::Propeller => ImpellerKind::Propeller,
        Impeller::Anchor => ImpellerKind::Anchor,
        Impeller::HelicalRibbon => ImpellerKind::HelicalRibbon,
        Impeller::Hydrofoil => ImpellerKind::Hydrofoil,
    }
}

/// The site tank and the product it is taken to hold (`product` names another one).
pub fn site_tank<'s>(
    site: &'s Site,
    tank_id: &str,
    product: Option<&str>,
) -> Result<(&'s Tank, f64), TankInputError> {
    let tank = site
        .tank(tank_id.trim())
        .ok_or_else(|| TankInputError::UnknownTank {
            id: crate::text::sanitize(tank_id, false),
            known: join(site.tanks.iter().map(|t| t.id.as_str())),
        })?;
    let name = product.map_or(tank.product.as_str(), str::trim);
    let found = site
        .product(name)
        .ok_or_else(|| TankInputError::UnknownProduct {
            name: crate::text::sanitize(name, false),
            known: join(site.products.iter().map(|p| p.name.as_str())),
        })?;
    Ok((tank, found.density_kg_m3))
}

fn join<'a>(names: impl Iterator<Item = &'a str>) -> String {
    let all: Vec<&str> = names.collect();
    if all.is_empty() {
        "none".into()
    } else {
        all.join(", ")
    }
}

/// Merge flags, readings and the site tank (with its product's density) into a request.
pub fn request(
    site: Option<(&Tank, f64)>,
    readings: &TankReadings,
    flags: &TankFlags,
    model: Model,
) -> Result<TankRequest, TankInputError> {
    let tank = site.map(|(t, _)| t);
    let (speed_rps, speed_from) = speed(tank, readings, flags)?;
    let impeller = flags
        .impeller
        .or(tank.map(|t| impeller_kind(t.impeller)))
        .ok_or(missing(
            "impeller",
            "give --impeller, or --site with --tank",
        ))?;
    let density = flags
        .density_kg_m3
        .or(site.map(|(_, rho)| rho))
        .ok_or(missing("density", "give --density, or --site with --tank"))?;
    let vessel = vessel(impeller, tank, readings, flags)?;
    Ok(TankRequest {
        vessel,
        drive: drive(tank, flags),
        fluid: Fluid {
            density_kg_m3: density,
            model,
        },
        speed_rps,
        motor: super::tank_motor::motor(tank, readings, flags)?,
        speed_from,
    })
}

fn missing(what: &'static str, hint: &'static str) -> TankInputError {
    TankInputError::Missing { what, hint }
}

fn speed(
    tank: Option<&Tank>,
    readings: &TankReadings,
    flags: &TankFlags,
) -> Result<(f64, Source), TankInputError> {
    let site = tank
        .and_then(|t| t.impeller_speed_rad_s)
        .map(|w| w / (2.0 * PI));
    match (flags.speed_rps, readings.speed_rps, site) {
        (Some(n), _, _) => Ok((n, Source::Flag)),
        (None, Some(n), _) => Ok((n, Source::Reading)),
        (None, None, Some(n)) => Ok((n, Source::Site)),
        _ => Err(missing(
            "agitator speed",
            "give --speed (e.g. '30 rpm'), or record an agitator-speed reading",
        )),
    }
}

fn vessel(
    impeller: ImpellerKind,
    tank: Option<&Tank>,
    readings: &TankReadings,
    flags: &TankFlags,
) -> Result<Vessel, TankInputError> {
    let d = flags
        .impeller_diameter_m
        .or(tank.map(|t| t.impeller_diameter_m))
        .ok_or(missing(
            "impeller diameter",
            "give --impeller-diameter (e.g. '0.8 m')",
        ))?;
    let site_baffles = tank.map(|t| match t.baffles {
        Baffles::Baffled => Baffling::Baffled,
        Baffles::Unbaffled => Baffling::Unbaffled,
    });
    let default_baffles = match impeller.constants().np_turbulent_baffled
        == impeller.constants().np_turbulent_unbaffled
    {
        true => Baffling::Unbaffled,
        false => Baffling::Baffled,
    };
    let c = tank.map(|t| t.constants).unwrap_or_default();
    Ok(Vessel {
        impeller,
        impeller_diameter_m: d,
        baffling: flags.baffling.or(site_baffles).unwrap_or(default_baffles),
        tank_diameter_m: flags.tank_diameter_m.or(tank.map(|t| t.diameter_m)),
        liquid_height_m: flags
            .liquid_height_m
            .or(readings.liquid_height_m)
            .or(tank.map(|t| t.liquid_height_m)),
        overrides: Overrides {
            ks: flags.overrides.ks.or(c.ks),
            kp: flags.overrides.kp.or(c.kp),
            np_turbulent: flags.overrides.np_turbulent.or(c.np_turbulent),
        },
        ribbon: tank.and_then(|t| t.ribbon).map(|r| RibbonGeometry {
            height_m: r.height_m,
            pitch_m: r.pitch_m,
            width_m: r.width_m,
            blades: r.blades,
        }),
    })
}

fn drive(tank: Option<&Tank>, flags: &TankFlags) -> Drive {
    Drive {
        motor_rating_w: tank.map(|t| t.motor_rating_w),
        gearbox_efficiency: flags
            .gearbox_efficiency
            .or(tank.and_then(|t| t.gearbox_efficiency)),
        gearbox_torque_limit_n_m: tank.and_then(|t| t.gearbox_torque_limit_n_m),
    }
}
