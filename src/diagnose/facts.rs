//! The facts the rules read: plain data, SI throughout, filled by `session::findings` from a
//! replayed journal and the site. Every field a rule needs is here, so a rule's test builds
//! the smallest input by hand.

use super::Measured;
use crate::units::Dimension;

/// Everything known about a session, as the rules read it.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Facts {
    pub sets: Vec<SetFacts>,
    pub plant: Vec<PlantFacts>,
    pub restarts: Vec<RestartFacts>,
    pub regimes: Vec<RegimeFacts>,
    pub pumps: Vec<PumpFacts>,
    pub tanks: Vec<TankFacts>,
}

/// One dial reading as typed, with its row (from 1).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Dial {
    pub row: usize,
    pub rpm: f64,
    pub dial: f64,
}

/// One viscometer set and the curve fitted to it.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct SetFacts {
    /// "set 4, chilli-sauce on VIS-A".
    pub subject: String,
    /// Every row as typed, pegged ones included.
    pub dials: Vec<Dial>,
    /// The dial's full scale, when the geometry is known.
    pub full_scale_dial: Option<f64>,
    /// Rows (slower, faster) where the slower reads higher.
    pub reversed: Vec<(usize, usize)>,
    /// `None` when the set could not be fitted.
    pub fit: Option<FitFacts>,
    pub temperature_k: Option<f64>,
    /// The product's reference temperature, when the product is on the site.
    pub reference_k: Option<f64>,
    /// Whether the constants were shifted to the reference temperature before the limits.
    pub shifted_to_reference: bool,
    pub limits: Vec<LimitFacts>,
    pub trend: Vec<TrendFacts>,
}

/// How well the curve follows its readings.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FitFacts {
    pub r_squared: f64,
    /// (runs, longest run, points) when the residuals fall in too few runs of one sign.
    pub residual_pattern: Option<(usize, usize, usize)>,
    /// The model's yield stress with its interval, when the model has one.
    pub yield_stress_pa: Option<Measured>,
}

/// One spec limit of the product, and the set's value against it.
#[derive(Debug, Clone, PartialEq)]
pub struct LimitFacts {
    /// "consistency index K", "apparent viscosity at 50 1/s".
    pub property: String,
    pub dimension: Dimension,
    pub value: Measured,
    pub min: Option<f64>,
    pub max: Option<f64>,
}

/// One property of the product in this set beside the same property in earlier sets.
#[derive(Debug, Clone, PartialEq)]
pub struct TrendFacts {
    pub property: String,
    pub dimension: Dimension,
    pub value: f64,
    /// Earlier values, oldest first.
    pub earlier: Vec<f64>,
}

/// What the plant measured against what the viscometer's curve predicts for it.
#[derive(Debug, Clone, PartialEq)]
pub struct PlantFacts {
    /// "line L-1", "tank TK-1".
    pub subject: String,
    pub signal: PlantSignal,
    pub measured: f64,
    pub predicted: Measured,
    pub dimension: Dimension,
    /// Ratios measured/predicted taken as agreement (low, high), from the engine that made
    /// the prediction.
    pub agree: (f64, f64),
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PlantSignal {
    LinePressureDrop,
    MotorPower,
}

/// A restart of a line after a stop.
#[derive(Debug, Clone, PartialEq)]
pub struct RestartFacts {
    /// "line L-2 with pump P-2".
    pub subject: String,
    /// Pressure needed to break the gel, with its band, Pa.
    pub needed_pa: Measured,
    /// The lower of what the pump gives and the line is rated for, Pa.
    pub usable_pa: f64,
    /// The share of the usable pressure kept in hand (0.10 = 10 %).
    pub margin: f64,
    /// The stop planned or recorded, s.
    pub stop_s: Option<f64>,
    /// The longest stop that still restarts within the margin, s; `None` when any stop does.
    pub longest_safe_stop_s: Option<Measured>,
    /// "now", or "at the coldest (5 °C)".
    pub when: String,
}

/// Where a line's flow sits against the laminar–turbulent transition.
#[derive(Debug, Clone, PartialEq)]
pub struct RegimeFacts {
    pub subject: String,
    pub flow_m3_s: f64,
    pub reynolds: f64,
    pub critical_reynolds: f64,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PumpType {
    Centrifugal,
    PositiveDisplacement,
}

/// A pump, its limits and what was read or worked out at it.
#[derive(Debug, Clone, PartialEq)]
pub struct PumpFacts {
    pub subject: String,
    pub kind: PumpType,
    /// Discharge pressure read at the pump (gauge, Pa), with the gauge's error as interval.
    pub discharge_pa: Option<Measured>,
    pub max_discharge_pa: Option<f64>,
    pub relief_pa: Option<f64>,
    /// Flow read or worked out at the duty, m³/s.
    pub flow_m3_s: Option<f64>,
    /// The best-efficiency flow at the pump's speed (centrifugal only), m³/s.
    pub bep_flow_m3_s: Option<f64>,
    /// The flow behaviour index n of the product pumped, with its interval.
    pub flow_index: Option<Measured>,
}

/// An agitated tank: the drive's demand against its ratings, the motor, the cavern.
#[derive(Debug, Clone, PartialEq)]
pub struct TankFacts {
    pub subject: String,
    /// Motor shaft power the impeller needs (through the gearbox), with its range, W.
    pub motor_demand_w: Option<Measured>,
    pub motor_rating_w: Option<f64>,
    /// Torque on the impeller shaft, with its range, N·m.
    pub torque_n_m: Option<Measured>,
    pub gearbox_limit_n_m: Option<f64>,
    /// Motor current read, with the meter's error as interval, A.
    pub current_a: Option<Measured>,
    /// Full-load current worked out from the nameplate, A.
    pub full_load_current_a: Option<f64>,
    /// Cavern diameter with its range, m.
    pub cavern_m: Option<Measured>,
    pub tank_diameter_m: f64,
    /// Share of the liquid inside the cavern, when known.
    pub moving_fraction: Option<f64>,
}
