//! `[[tank]]` tables: vessel size, baffles, impeller, motor and gearbox, product held.

use super::errors::{ErrorKind, Sink};
use super::fields::{Need, Rule};
use super::model::{Baffles, Impeller, Tank};
use super::raw::RawTable;
use super::tank_impeller;
use crate::units::Dimension;

/// The required and nameplate keys; [`tank_impeller::KEYS`] adds the optional constants.
const BASE_KEYS: &[&str] = &[
    "id",
    "description",
    "product",
    "diameter",
    "liquid_height",
    "baffled",
    "impeller",
    "impeller_diameter",
    "impeller_speed",
    "motor_rating",
    "motor_voltage",
    "motor_power_factor",
    "motor_efficiency",
    "gearbox_efficiency",
    "gearbox_torque_limit",
];

/// Every key a `[[tank]]` table may hold.
pub(crate) fn keys() -> Vec<&'static str> {
    BASE_KEYS
        .iter()
        .chain(tank_impeller::KEYS)
        .copied()
        .collect()
}

pub(crate) fn build(mut t: RawTable, sink: &mut Sink) -> Option<Tank> {
    let (id, description) = t.identity(sink);
    let product = t.id(sink, "product", Need::Required);
    let (diameter, impeller_diameter) = diameters(&t, sink);
    let len = Dimension::Length;
    let height = t.quantity(sink, "liquid_height", len, Rule::Positive, Need::Required);
    let baffled = t.flag(sink, "baffled", Need::Required);
    let impeller = t.choice(sink, "impeller", &Impeller::NAMES, Need::Required);
    let speed = t.quantity(
        sink,
        "impeller_speed",
        Dimension::Speed,
        Rule::Positive,
        Need::Optional,
    );
    let motor = Motor::read(&t, sink);
    let gear_eff = fraction(&t, "gearbox_efficiency", Need::Optional, sink);
    let torque = t.quantity(
        sink,
        "gearbox_torque_limit",
        Dimension::Torque,
        Rule::Positive,
        Need::Optional,
    );
    let constants = tank_impeller::constants(&t, sink);
    let no_load = tank_impeller::no_load_power(&t, sink);
    let ribbon = tank_impeller::ribbon(&t, sink, impeller);
    Some(Tank {
        id: id?,
        description,
        product: product?,
        diameter_m: diameter?,
        liquid_height_m: height?,
        baffles: if baffled? {
            Baffles::Baffled
        } else {
            Baffles::Unbaffled
        },
        impeller: impeller?,
        impeller_diameter_m: impeller_diameter?,
        impeller_speed_rad_s: speed,
        motor_rating_w: motor.rating?,
        motor_voltage_v: motor.voltage?,
        motor_power_factor: motor.power_factor?,
        motor_efficiency: motor.efficiency?,
        gearbox_efficiency: gear_eff,
        gearbox_torque_limit_n_m: torque,
        no_load_power_w: no_load,
        constants,
        ribbon,
    })
}

/// Tank and impeller diameter; the impeller must fit inside the tank.
fn diameters(t: &RawTable, sink: &mut Sink) -> (Option<f64>, Option<f64>) {
    let len = Dimension::Length;
    let tank = t.quantity(sink, "diameter", len, Rule::Positive, Need::Required);
    let imp = t.quantity(
        sink,
        "impeller_diameter",
        len,
        Rule::Positive,
        Need::Required,
    );
    if let (Some(d_tank), Some(d_imp)) = (tank, imp)
        && d_imp >= d_tank
    {
        let msg = "must be smaller than the tank diameter".into();
        t.fail(sink, "impeller_diameter", ErrorKind::BadValue, msg);
        return (tank, None);
    }
    (tank, imp)
}

fn fraction(t: &RawTable, key: &str, need: Need, sink: &mut Sink) -> Option<f64> {
    t.quantity(sink, key, Dimension::Fraction, Rule::UnitInterval, need)
}

/// The agitator motor's nameplate.
struct Motor {
    rating: Option<f64>,
    voltage: Option<f64>,
    power_factor: Option<f64>,
    efficiency: Option<f64>,
}

impl Motor {
    fn read(t: &RawTable, sink: &mut Sink) -> Motor {
        let req = Need::Required;
        Motor {
            rating: t.quantity(sink, "motor_rating", Dimension::Power, Rule::Positive, req),
            voltage: t.quantity(
                sink,
                "motor_voltage",
                Dimension::Voltage,
                Rule::Positive,
                req,
            ),
            power_factor: fraction(t, "motor_power_factor", req, sink),
            efficiency: fraction(t, "motor_efficiency", req, sink),
        }
    }
}
