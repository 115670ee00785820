//! The latest spot readings journalled at a tank: agitator speed, motor current or power,
//! supply voltage and liquid level.

use super::state::{Entry, SessionState, SpotReading};
use crate::site::Site;
use std::f64::consts::PI;

/// The latest spot readings recorded at one tank, SI except speed (rev/s).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct TankReadings {
    pub speed_rps: Option<f64>,
    pub motor_current_a: Option<f64>,
    pub motor_power_w: Option<f64>,
    pub voltage_v: Option<f64>,
    pub liquid_height_m: Option<f64>,
}

impl TankReadings {
    /// The newest of each reading journalled against `tank_id`.
    pub fn latest(readings: &[Entry<SpotReading>], tank_id: &str) -> TankReadings {
        let last = |name: &str| {
            readings
                .iter()
                .rev()
                .find(|e| e.equipment.as_deref() == Some(tank_id) && e.item.name == name)
                .map(|e| e.item.value_si)
        };
        TankReadings {
            speed_rps: last("agitator-speed").map(|w| w / (2.0 * PI)),
            motor_current_a: last("motor-current"),
            motor_power_w: last("motor-power"),
            voltage_v: last("voltage"),
            liquid_height_m: last("liquid-level"),
        }
    }
}

/// The tank's latest spot readings in a session journal.
pub fn readings_from_journal(
    site: &Site,
    path: &std::path::Path,
    tank_id: &str,
) -> Result<TankReadings, crate::journal::JournalError> {
    let loaded = crate::journal::load(path)?;
    let state = SessionState::replay(site, &loaded.records);
    Ok(TankReadings::latest(&state.readings, tank_id))
}
