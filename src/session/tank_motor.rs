//! The motor reading for a tank: a power meter's reading or the line current, with the
//! voltage from a reading or the nameplate, and the nameplate's power factor and
//! efficiencies unless typed.

use super::tank_input::{TankFlags, TankInputError, TankReadings};
use crate::mixing::{Electrical, MotorReading};
use crate::site::Tank;

/// The motor reading, `None` when neither a current nor a power was given or recorded.
pub(crate) fn motor(
    tank: Option<&Tank>,
    readings: &TankReadings,
    flags: &TankFlags,
) -> Result<Option<MotorReading>, TankInputError> {
    let current = flags.motor_current_a.or(readings.motor_current_a);
    let power = flags.motor_power_w.or(readings.motor_power_w);
    let voltage = flags
        .voltage_v
        .or(readings.voltage_v)
        .or(tank.map(|t| t.motor_voltage_v));
    let pf = flags.power_factor.or(tank.map(|t| t.motor_power_factor));
    let Some(electrical) = electrical(current, power, voltage, pf)? else {
        return Ok(None);
    };
    let efficiency = flags
        .motor_efficiency
        .or(tank.map(|t| t.motor_efficiency))
        .ok_or_else(|| TankInputError::MotorIncomplete {
            missing: "--motor-efficiency".into(),
        })?;
    Ok(Some(MotorReading {
        electrical,
        motor_efficiency: efficiency,
        gearbox_efficiency: flags
            .gearbox_efficiency
            .or(tank.and_then(|t| t.gearbox_efficiency)),
        no_load_power_w: flags
            .no_load_power_w
            .or(tank.and_then(|t| t.no_load_power_w)),
    }))
}

/// A metered power wins over current × voltage × power factor (it needs no power factor,
/// which is poor at light load).
fn electrical(
    current: Option<f64>,
    power: Option<f64>,
    voltage: Option<f64>,
    power_factor: Option<f64>,
) -> Result<Option<Electrical>, TankInputError> {
    match (power, current, voltage, power_factor) {
        (Some(power_w), ..) => Ok(Some(Electrical::Metered { power_w })),
        (None, None, ..) => Ok(None),
        (None, Some(current_a), Some(voltage_v), Some(power_factor)) => {
            Ok(Some(Electrical::ThreePhase {
                current_a,
                voltage_v,
                power_factor,
            }))
        }
        (None, Some(_), v, pf) => {
            let lacking: Vec<&str> = [(v, "--voltage"), (pf, "--power-factor")]
                .into_iter()
                .filter(|(x, _)| x.is_none())
                .map(|(_, f)| f)
                .collect();
            Err(TankInputError::MotorIncomplete {
                missing: lacking.join(" and "),
            })
        }
    }
}
