//! The physical dimensions a field can hold, their SI, default and display units.

use serde::{Deserialize, Serialize};

/// What kind of quantity a field holds; decides which units it accepts.
///
/// `Stress` and `Pressure` accept the same units (both are force per area) but differ in
/// default and display units: shear stresses are small (Pa, lbf/100ft2), line pressures large.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Dimension {
    Pressure,
    Stress,
    Flow,
    Length,
    DynamicViscosity,
    KinematicViscosity,
    Speed,
    Density,
    Temperature,
    Power,
    Current,
    Voltage,
    Time,
    ShearRate,
    Torque,
    MolarEnergy,
    Fraction,
    Dimensionless,
}

/// Which units the site shows its numbers in. TOML values `"si"` / `"us-customary"`.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum UnitSystem {
    #[default]
    Si,
    UsCustomary,
}

const PRESSURE: &[&str] = &[
    "Pa",
    "kPa",
    "MPa",
    "bar",
    "mbar",
    "psi",
    "inH2O",
    "mH2O",
    "dyn/cm2",
    "lbf/100ft2",
];
const FLOW: &[&str] = &["m3/h", "m3/s", "L/s", "L/min", "gpm", "igpm", "bbl/min"];
const LENGTH: &[&str] = &["m", "cm", "mm", "in", "ft"];
const DYNAMIC_VISCOSITY: &[&str] = &["Pa.s", "mPa.s", "cP", "P"];
const KINEMATIC_VISCOSITY: &[&str] = &["cSt", "mm2/s", "m2/s"];
const SPEED: &[&str] = &["rpm", "rps", "rad/s"];
const DENSITY: &[&str] = &["kg/m3", "g/cm3", "g/mL", "lb/ft3", "lb/gal", "SG"];
const TEMPERATURE: &[&str] = &["°C", "°F", "K"];
const POWER: &[&str] = &["W", "kW", "hp"];
const CURRENT: &[&str] = &["A"];
const VOLTAGE: &[&str] = &["V", "kV"];
const TIME: &[&str] = &["s", "min", "h", "d"];
const SHEAR_RATE: &[&str] = &["1/s", "s-1"];
const TORQUE: &[&str] = &["N.m", "kN.m", "mN.m", "lbf.ft", "lbf.in", "dyn.cm"];
const MOLAR_ENERGY: &[&str] = &["J/mol", "kJ/mol", "kcal/mol"];
/// The empty spelling is a bare number.
const FRACTION: &[&str] = &["", "%"];
const DIMENSIONLESS: &[&str] = &[""];

impl Dimension {
    /// Every dimension, for help screens and tests.
    pub const ALL: [Dimension; 18] = [
        Dimension::Pressure,
        Dimension::Stress,
        Dimension::Flow,
        Dimension::Length,
        Dimension::DynamicViscosity,
        Dimension::KinematicViscosity,
        Dimension::Speed,
        Dimension::Density,
        Dimension::Temperature,
        Dimension::Power,
        Dimension::Current,
        Dimension::Voltage,
        Dimension::Time,
        Dimension::ShearRate,
        Dimension::Torque,
        Dimension::MolarEnergy,
        Dimension::Fraction,
        Dimension::Dimensionless,
    ];

    /// Lower-case name for messages: "a {name} is expected here".
    pub fn name(self) -> &'static str {
        match self {
            Dimension::Pressure => "pressure",
            Dimension::Stress => "shear stress",
            Dimension::Flow => "flow",
            Dimension::Length => "length",
            Dimension::DynamicViscosity => "dynamic viscosity",
            Dimension::KinematicViscosity => "kinematic viscosity",
            Dimension::Speed => "speed",
            Dimension::Density => "density",
            Dimension::Temperature => "temperature",
            Dimension::Power => "power",
            Dimension::Current => "current",
            Dimension::Voltage => "voltage",
            Dimension::Time => "time",
            Dimension::ShearRate => "shear rate",
            Dimension::Torque => "torque",
            Dimension::MolarEnergy => "molar energy",
            Dimension::Fraction => "fraction",
            Dimension::Dimensionless => "dimensionless number",
        }
    }

    /// The unit values are stored in. Speed is stored as angular speed in rad/s
    /// (1 rpm = 2π/60 rad/s); a mixer's N in rev/s is `si / (2π)`.
    pub fn si_unit(self) -> &'static str {
        match self {
            Dimension::Pressure | Dimension::Stress => "Pa",
            Dimension::Flow => "m3/s",
            Dimension::Length => "m",
            Dimension::DynamicViscosity => "Pa.s",
            Dimension::KinematicViscosity => "m2/s",
            Dimension::Speed => "rad/s",
            Dimension::Density => "kg/m3",
            Dimension::Temperature => "K",
            Dimension::Power => "W",
            Dimension::Current => "A",
            Dimension::Voltage => "V",
            Dimension::Time => "s",
            Dimension::ShearRate => "1/s",
            Dimension::Torque => "N.m",
            Dimension::MolarEnergy => "J/mol",
            Dimension::Fraction | Dimension::Dimensionless => "",
        }
    }

    /// The unit a bare number means when the field names no other; "" is a bare number
    /// (a fraction 0–1, or a plain dimensionless number).
    pub fn default_unit(self) -> &'static str {
        match self {
            Dimension::Pressure => "bar",
            Dimension::Stress => "Pa",
            Dimension::Flow => "m3/h",
            Dimension::Length => "mm",
            Dimension::DynamicViscosity => "mPa.s",
            Dimension::KinematicViscosity => "cSt",
            Dimension::Speed => "rpm",
            Dimension::Density => "kg/m3",
            Dimension::Temperature => "°C",
            Dimension::Power => "kW",
            Dimension::Current => "A",
            Dimension::Voltage => "V",
            Dimension::Time => "s",
            Dimension::ShearRate => "1/s",
            Dimension::Torque => "N.m",
            Dimension::MolarEnergy => "kJ/mol",
            Dimension::Fraction | Dimension::Dimensionless => "",
        }
    }

    /// Canonical spellings, for messages and help. Each is also accepted as typed.
    pub fn accepted_units(self) -> &'static [&'static str] {
        match self {
            Dimension::Pressure | Dimension::Stress => PRESSURE,
            Dimension::Flow => FLOW,
            Dimension::Length => LENGTH,
            Dimension::DynamicViscosity => DYNAMIC_VISCOSITY,
            Dimension::KinematicViscosity => KINEMATIC_VISCOSITY,
            Dimension::Speed => SPEED,
            Dimension::Density => DENSITY,
            Dimension::Temperature => TEMPERATURE,
            Dimension::Power => POWER,
            Dimension::Current => CURRENT,
            Dimension::Voltage => VOLTAGE,
            Dimension::Time => TIME,
            Dimension::ShearRate => SHEAR_RATE,
            Dimension::Torque => TORQUE,
            Dimension::MolarEnergy => MOLAR_ENERGY,
            Dimension::Fraction => FRACTION,
            Dimension::Dimensionless => DIMENSIONLESS,
        }
    }

    /// The dimension whose rows in the unit table this one uses (Stress shares Pressure's).
    pub(crate) fn family(self) -> Dimension {
        match self {
            Dimension::Stress => Dimension::Pressure,
            other => other,
        }
    }

    /// The accepted units as one line for messages, e.g. "m, cm, mm, in, ft".
    pub fn accepted_list(self) -> String {
        let shown: Vec<&str> = self
            .accepted_units()
            .iter()
            .map(|u| match *u {
                "" => bare_phrase(self),
                "gpm" => "gpm (US gallons per minute)",
                "igpm" => "igpm (imperial gallons per minute)",
                u => u,
            })
            .collect();
        shown.join(", ")
    }
}

/// How a bare number reads in help and messages.
pub(crate) fn bare_phrase(dim: Dimension) -> &'static str {
    match dim {
        Dimension::Fraction => "a bare number 0-1",
        _ => "a bare number",
    }
}

/// The unit a quantity is shown in under each unit system.
pub fn display_unit(dim: Dimension, system: UnitSystem) -> &'static str {
    let us = system == UnitSystem::UsCustomary;
    match dim {
        Dimension::Pressure if us => "psi",
        Dimension::Pressure => "bar",
        Dimension::Stress if us => "lbf/100ft2",
        Dimension::Flow if us => "gpm",
        Dimension::Flow => "m3/h",
        Dimension::Length if us => "in",
        Dimension::DynamicViscosity if us => "cP",
        Dimension::Density if us => "lb/ft3",
        Dimension::Temperature if us => "°F",
        Dimension::Temperature => "°C",
        Dimension::Power if us => "hp",
        Dimension::Torque if us => "lbf.ft",
        Dimension::Fraction => "%",
        other => other.default_unit(),
    }
}
