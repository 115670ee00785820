//! The validated site: typed settings, every quantity an SI `f64`.

use crate::instrument::Geometry;
use crate::units::UnitSystem;
use serde::Serialize;

/// One plant site as described by its config file.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Site {
    pub id: String,
    pub name: String,
    pub unit_system: UnitSystem,
    pub operators: Vec<String>,
    /// Atmospheric pressure at the site, Pa absolute (`atmospheric_pressure`, default the
    /// standard atmosphere 101.325 kPa): subtracted from "psia"/"bara" gauge readings.
    pub atmospheric_pressure_pa: f64,
    pub products: Vec<Product>,
    pub viscometers: Vec<Viscometer>,
    pub lines: Vec<Line>,
    pub pumps: Vec<Pump>,
    pub tanks: Vec<Tank>,
    /// Where the config came from (a path, or `demo`), for messages.
    pub source: String,
}

/// A product the site handles, with its spec limits.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Product {
    /// An id-like name (`[A-Za-z0-9._-]`), unique on the site.
    pub name: String,
    pub description: String,
    pub density_kg_m3: f64,
    pub reference_temperature_k: f64,
    pub activation_energy_j_mol: Option<f64>,
    pub gel: Option<GelBuildUp>,
    pub limits: Vec<SpecLimit>,
    /// Nominal flow curve at the reference temperature, when the site gives one.
    pub nominal: Option<NominalCurve>,
}

/// A product's nominal flow curve at its reference temperature, SI (Pa, Pa·s, Pa·sⁿ). The
/// same five models as the fit; the session turns it into a `rheology::Model`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case", tag = "model")]
pub enum NominalCurve {
    Newtonian { mu_pa_s: f64 },
    PowerLaw { k_pa_sn: f64, n: f64 },
    Bingham { tau0_pa: f64, mu_p_pa_s: f64 },
    HerschelBulkley { tau0_pa: f64, k_pa_sn: f64, n: f64 },
    Casson { tau0_pa: f64, mu_c_pa_s: f64 },
}

/// Static yield stress rebuilding at rest, τy(t) = τ∞ − (τ∞ − τ0)·e^(−t/t_r)
/// (first-order structure kinetics at rest, Barnes 1997, J. Non-Newt. Fluid Mech. 70:1,
/// with the yield stress taken as linear in the structure; from memory).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct GelBuildUp {
    /// τ0: static yield stress just after the product stops, Pa.
    pub initial_pa: f64,
    /// τ∞: static yield stress after a long rest, Pa (≥ τ0).
    pub long_rest_pa: f64,
    /// t_r: rebuild time constant, s.
    pub rebuild_time_s: f64,
}

/// What a spec limit constrains.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum LimitProperty {
    /// K, Pa·sⁿ.
    ConsistencyIndex,
    /// n, dimensionless.
    FlowIndex,
    /// τ0, Pa.
    YieldStress,
    /// μa = τ/γ̇ at the stated shear rate, Pa·s.
    ApparentViscosity { shear_rate_per_s: f64 },
}

/// A min and/or max on one property, SI (at least one bound is present).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct SpecLimit {
    pub property: LimitProperty,
    pub min: Option<f64>,
    pub max: Option<f64>,
}

impl SpecLimit {
    /// Whether `value` (SI) lies within the limit, bounds included.
    pub fn allows(&self, value: f64) -> bool {
        self.min.is_none_or(|lo| value >= lo) && self.max.is_none_or(|hi| value <= hi)
    }
}

/// A rotational viscometer the site uses.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Viscometer {
    pub id: String,
    pub geometry: Geometry,
    pub description: String,
    /// The speeds the instrument runs at, rpm (lowest, highest): fixed at 3 to 600 for the
    /// standard six-speed; for other geometries from `min_speed` / `max_speed` when given.
    pub speed_range_rpm: Option<(f64, f64)>,
}

/// A pipeline.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Line {
    pub id: String,
    pub description: String,
    pub inner_diameter_m: f64,
    pub length_m: f64,
    pub roughness_m: f64,
    /// Outlet height minus inlet height, m (negative when the line runs downhill).
    pub elevation_change_m: f64,
    /// Equivalent length of the fittings (bends, valves, tees), m.
    pub fittings_length_m: f64,
    /// Maximum allowable working pressure of the weakest part, gauge, Pa.
    pub design_pressure_pa: f64,
    /// Pressure held at the outlet (a filler head, a pressurised tank), gauge, Pa.
    pub back_pressure_pa: f64,
    /// Fraction kept below the usable pressure when judging a restart (default 10 %,
    /// common practice, no source).
    pub restart_margin: f64,
    /// The coldest the line is expected to get (a winter night, a stop outdoors), K.
    pub coldest_temperature_k: Option<f64>,
    /// Gel (static yield) stress at the coldest temperature over that at the product's
    /// reference temperature (empirical, from site tests; ≥ 1).
    pub gel_cold_factor: Option<f64>,
}

impl Line {
    /// Straight length plus the fittings' equivalent length, m.
    pub fn total_length_m(&self) -> f64 {
        self.length_m + self.fittings_length_m
    }
}

/// One point of a pump's water (manufacturer's) curve at rated speed.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CurvePoint {
    pub flow_m3_s: f64,
    pub head_m: f64,
    /// 0–1; 0 is allowed only at zero flow.
    pub efficiency: f64,
}

/// How a pump moves product, with what that kind needs.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum PumpKind {
    /// Water curve: at least 3 points, flow strictly increasing.
    Centrifugal {
        curve: Vec<CurvePoint>,
    },
    PositiveDisplacement {
        displacement_m3_per_rev: f64,
    },
}

/// A pump feeding one line.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Pump {
    pub id: String,
    pub description: String,
    pub kind: PumpKind,
    /// Id of the line this pump feeds.
    pub feeds: String,
    pub rated_speed_rad_s: f64,
    pub max_discharge_pressure_pa: Option<f64>,
    pub relief_setting_pa: Option<f64>,
    /// Measured delivered over displaced volume (positive displacement), 0–1.
    pub volumetric_efficiency: Option<f64>,
    /// Motor nameplate rating, W.
    pub motor_rating_w: Option<f64>,
}

impl Pump {
    /// The lower of the discharge limit and the relief setting (at least one is set), Pa.
    pub fn pressure_limit_pa(&self) -> f64 {
        match (self.max_discharge_pressure_pa, self.relief_setting_pa) {
            (Some(a), Some(b)) => a.min(b),
            (Some(a), None) | (None, Some(a)) => a,
            (None, None) => f64::INFINITY,
        }
    }

    /// The water curve; empty for a positive-displacement pump.
    pub fn curve(&self) -> &[CurvePoint] {
        match &self.kind {
            PumpKind::Centrifugal { curve } => curve,
            PumpKind::PositiveDisplacement { .. } => &[],
        }
    }
}

/// Impeller types the mixing calculations know.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Impeller {
    RushtonTurbine,
    PitchedBladeTurbine,
    Propeller,
    Anchor,
    HelicalRibbon,
    Hydrofoil,
}

impl Impeller {
    /// Every impeller with its config spelling.
    pub const NAMES: [(&'static str, Impeller); 6] = [
        ("rushton-turbine", Impeller::RushtonTurbine),
        ("pitched-blade-turbine", Impeller::PitchedBladeTurbine),
        ("propeller", Impeller::Propeller),
        ("anchor", Impeller::Anchor),
        ("helical-ribbon", Impeller::HelicalRibbon),
        ("hydrofoil", Impeller::Hydrofoil),
    ];

    /// The config spelling, e.g. `pitched-blade-turbine`.
    pub fn name(self) -> &'static str {
        Self::NAMES
            .iter()
            .find(|(_, i)| *i == self)
            .map_or("", |(n, _)| n)
    }
}

/// Whether the tank wall carries baffles (unbaffled tanks draw much less power).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Baffles {
    Baffled,
    Unbaffled,
}

/// An agitated tank.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Tank {
    pub id: String,
    pub description: String,
    /// Name of the product held.
    pub product: String,
    pub diameter_m: f64,
    pub liquid_height_m: f64,
    pub baffles: Baffles,
    pub impeller: Impeller,
    pub impeller_diameter_m: f64,
    /// Agitator shaft speed, when fixed.
    pub impeller_speed_rad_s: Option<f64>,
    pub motor_rating_w: f64,
    pub motor_voltage_v: f64,
    pub motor_power_factor: f64,
    pub motor_efficiency: f64,
    pub gearbox_efficiency: Option<f64>,
    /// `None` for a direct drive with no gearbox.
    pub gearbox_torque_limit_n_m: Option<f64>,
    /// Shaft power with the impeller turning in an empty tank (bearings, seals, gears), W.
    pub no_load_power_w: Option<f64>,
    /// The site's own impeller constants, replacing the published ones.
    pub constants: TankConstants,
    /// A helical ribbon's shape, for its Kp by correlation.
    pub ribbon: Option<RibbonShape>,
}

/// Impeller constants a site knows for its own impeller (each optional).
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct TankConstants {
    /// Metzner–Otto ks: effective shear rate = ks × speed in rev/s.
    pub ks: Option<f64>,
    /// Laminar Kp = power number × Reynolds number.
    pub kp: Option<f64>,
    /// Turbulent power number in this tank.
    pub np_turbulent: Option<f64>,
}

/// A helical ribbon's shape, SI.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct RibbonShape {
    pub height_m: f64,
    pub pitch_m: f64,
    pub width_m: f64,
    pub blades: u32,
}

/// The kinds of equipment that carry ids (one id space across all of them).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum EquipmentKind {
    Viscometer,
    Line,
    Pump,
    Tank,
}

impl EquipmentKind {
    pub fn name(self) -> &'static str {
        match self {
            EquipmentKind::Viscometer => "viscometer",
            EquipmentKind::Line => "line",
            EquipmentKind::Pump => "pump",
            EquipmentKind::Tank => "tank",
        }
    }
}

impl Site {
    pub fn product(&self, name: &str) -> Option<&Product> {
        self.products.iter().find(|p| p.name == name)
    }

    pub fn viscometer(&self, id: &str) -> Option<&Viscometer> {
        self.viscometers.iter().find(|v| v.id == id)
    }

    pub fn line(&self, id: &str) -> Option<&Line> {
        self.lines.iter().find(|l| l.id == id)
    }

    pub fn pump(&self, id: &str) -> Option<&Pump> {
        self.pumps.iter().find(|p| p.id == id)
    }

    pub fn tank(&self, id: &str) -> Option<&Tank> {
        self.tanks.iter().find(|t| t.id == id)
    }

    /// Every equipment id with its kind, in config order (viscometers, lines, pumps, tanks).
    pub fn equipment_ids(&self) -> Vec<(&str, EquipmentKind)> {
        let v = self
            .viscometers
            .iter()
            .map(|x| (x.id.as_str(), EquipmentKind::Viscometer));
        let l = self
            .lines
            .iter()
            .map(|x| (x.id.as_str(), EquipmentKind::Line));
        let p = self
            .pumps
            .iter()
            .map(|x| (x.id.as_str(), EquipmentKind::Pump));
        let t = self
            .tanks
            .iter()
            .map(|x| (x.id.as_str(), EquipmentKind::Tank));
        v.chain(l).chain(p).chain(t).collect()
    }

    pub fn has_equipment(&self, id: &str) -> bool {
        self.equipment_ids().iter().any(|(e, _)| *e == id)
    }

    /// The pumps feeding a line.
    pub fn pumps_feeding(&self, line_id: &str) -> Vec<&Pump> {
        self.pumps.iter().filter(|p| p.feeds == line_id).collect()
    }
}
