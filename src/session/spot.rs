//! Spot readings at a piece of equipment: which readings of the catalogue fit its kind, and
//! each reading checked against the site's own limits for that equipment, with the caution
//! that applies. Pure: the faces (the screens' spot-readings form, `record`) call it.

use crate::readings::{self, ReadingKind};
use crate::site::{EquipmentKind, Site};

/// The readings offered for a kind of equipment, in the order an operator takes them.
pub fn offered(kind: EquipmentKind) -> Vec<&'static ReadingKind> {
    let names: &[&str] = match kind {
        EquipmentKind::Pump => &[
            "suction-pressure",
            "discharge-pressure",
            "flow",
            "pump-speed",
            "motor-current",
            "temperature",
        ],
        EquipmentKind::Line => &[
            "line-pressure",
            "pressure-drop",
            "flow",
            "temperature",
            "rest-time",
        ],
        EquipmentKind::Tank => &[
            "agitator-speed",
            "motor-current",
            "voltage",
            "temperature",
            "liquid-level",
        ],
        EquipmentKind::Viscometer => &[],
    };
    names.iter().filter_map(|n| readings::find(n)).collect()
}

/// The kind of the equipment with this id, if the site has it.
pub fn kind_of(site: &Site, id: &str) -> Option<EquipmentKind> {
    site.equipment_ids()
        .into_iter()
        .find(|(e, _)| *e == id)
        .map(|(_, k)| k)
}

/// A site limit a reading can exceed.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum SpotLimit {
    /// The pump's maximum discharge pressure, gauge Pa.
    PumpMaximum { pa: f64 },
    /// The pump's relief valve setting, gauge Pa.
    ReliefSetting { pa: f64 },
    /// The design pressure of a line, gauge Pa: the line read on, or (`fed`) the line the
    /// pump feeds.
    LineDesign { fed: bool, pa: f64 },
    /// The motor's full-load current from its rating, voltage, power factor and efficiency, A.
    FullLoadCurrent { amps: f64 },
}

/// One reading beyond one limit.
#[derive(Debug, Clone, PartialEq)]
pub struct SpotCall {
    pub reading: &'static str,
    pub value_si: f64,
    pub limit: SpotLimit,
    /// The line's id for [`SpotLimit::LineDesign`].
    pub line_id: Option<String>,
}

/// What a reading was checked against, when it could not be.
#[derive(Debug, Clone, PartialEq)]
pub enum NotChecked {
    /// A motor current on equipment whose motor data (voltage, power factor, efficiency) the
    /// site config does not hold.
    NoMotorData,
}

/// Full-load line current of a three-phase motor: I = P / (√3 · V · pf · η), with P the
/// rated shaft output (W), V line-to-line (V), pf the power factor and η the efficiency at
/// full load (the three-phase power relation P_in = √3·V·I·pf; IEC 60034-1 rates output,
/// so P_in = P/η; from memory).
pub fn full_load_current_a(
    rating_w: f64,
    voltage_v: f64,
    power_factor: f64,
    efficiency: f64,
) -> f64 {
    rating_w / (3f64.sqrt() * voltage_v * power_factor * efficiency)
}

/// Every site limit the reading `name` (SI value) at `equipment` is above; a limit is met at
/// its value exactly. `Err` when the reading has a limit that the site data cannot give.
pub fn check(
    site: &Site,
    equipment: &str,
    name: &str,
    value_si: f64,
) -> Result<Vec<SpotCall>, NotChecked> {
    let call = |limit, line_id: Option<String>| SpotCall {
        reading: readings::find(name).map_or("reading", |k| k.name),
        value_si,
        limit,
        line_id,
    };
    let mut out = Vec::new();
    match (kind_of(site, equipment), name) {
        (Some(EquipmentKind::Pump), "discharge-pressure") => {
            let Some(pump) = site.pump(equipment) else {
                return Ok(out);
            };
            if let Some(pa) = pump.max_discharge_pressure_pa.filter(|pa| value_si > *pa) {
                out.push(call(SpotLimit::PumpMaximum { pa }, None));
            }
            if let Some(pa) = pump.relief_setting_pa.filter(|pa| value_si > *pa) {
                out.push(call(SpotLimit::ReliefSetting { pa }, None));
            }
            if let Some(line) = site
                .line(&pump.feeds)
                .filter(|l| value_si > l.design_pressure_pa)
            {
                let limit = SpotLimit::LineDesign {
                    fed: true,
                    pa: line.design_pressure_pa,
                };
                out.push(call(limit, Some(line.id.clone())));
            }
        }
        (Some(EquipmentKind::Line), "line-pressure") => {
            if let Some(line) = site
                .line(equipment)
                .filter(|l| value_si > l.design_pressure_pa)
            {
                let limit = SpotLimit::LineDesign {
                    fed: false,
                    pa: line.design_pressure_pa,
                };
                out.push(call(limit, Some(line.id.clone())));
            }
        }
        (Some(EquipmentKind::Tank), "motor-current") => {
            let Some(t) = site.tank(equipment) else {
                return Ok(out);
            };
            let amps = full_load_current_a(
                t.motor_rating_w,
                t.motor_voltage_v,
                t.motor_power_factor,
                t.motor_efficiency,
            );
            if amps.is_finite() && value_si > amps {
                out.push(call(SpotLimit::FullLoadCurrent { amps }, None));
            }
        }
        (Some(EquipmentKind::Pump), "motor-current") => return Err(NotChecked::NoMotorData),
        _ => {}
    }
    Ok(out)
}

/// The caution for a reading beyond a limit: what to do before anything else.
pub fn caution(limit: &SpotLimit) -> &'static str {
    match limit {
        SpotLimit::PumpMaximum { .. } | SpotLimit::ReliefSetting { .. } => {
            "Stop the pump before the pressure rises further, then look for a closed valve or a \
             blockage downstream. Never exceed the rated pressure of the weakest part."
        }
        SpotLimit::LineDesign { .. } => {
            "Lower the pressure (stop the pump feeding it) and find the cause. Isolate and lock \
             out before opening the line. Never exceed the rated pressure of the weakest part."
        }
        SpotLimit::FullLoadCurrent { .. } => {
            "The motor is overloaded: reduce the load (slow the agitator, thin or lower the \
             batch) or stop it before it overheats, and have the drive checked."
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn demo() -> Site {
        crate::site::demo().expect("the demo site")
    }

    #[test]
    fn full_load_current_by_the_three_phase_power_relation() {
        // 7.5 kW at 400 V, pf 0.85, efficiency 0.9: 7500 / (1.7320508 * 400 * 0.85 * 0.9)
        // = 7500 / 530.02 = 14.15 A (worked by hand from P = sqrt(3) V I pf eta).
        let i = full_load_current_a(7500.0, 400.0, 0.85, 0.9);
        assert!((i - 14.150).abs() < 0.005, "{i}");
    }

    #[test]
    fn a_discharge_above_the_pumps_maximum_is_called_out() {
        let site = demo();
        // P-1: maximum discharge 8 bar (demo site); 8.5 bar gauge is above it, 8 bar is not.
        let calls = check(&site, "P-1", "discharge-pressure", 8.5e5).expect("checked");
        assert!(
            calls
                .iter()
                .any(|c| matches!(c.limit, SpotLimit::PumpMaximum { pa } if pa == 8e5))
        );
        let at = check(&site, "P-1", "discharge-pressure", 8e5).expect("checked");
        assert!(
            !at.iter()
                .any(|c| matches!(c.limit, SpotLimit::PumpMaximum { .. }))
        );
    }

    #[test]
    fn a_lobe_pump_above_its_relief_setting_is_called_out() {
        let site = demo();
        // P-2: relief 12 bar, maximum 14 bar (demo site): 12.5 bar is above the relief only.
        let calls = check(&site, "P-2", "discharge-pressure", 12.5e5).expect("checked");
        assert!(
            calls
                .iter()
                .any(|c| matches!(c.limit, SpotLimit::ReliefSetting { .. }))
        );
        assert!(
            !calls
                .iter()
                .any(|c| matches!(c.limit, SpotLimit::PumpMaximum { .. }))
        );
    }

    #[test]
    fn a_line_pressure_above_design_is_called_out() {
        let site = demo();
        let line = site.line("L-1").expect("L-1");
        let over = line.design_pressure_pa * 1.01;
        let calls = check(&site, "L-1", "line-pressure", over).expect("checked");
        assert_eq!(calls.len(), 1);
        assert!(
            check(&site, "L-1", "line-pressure", line.design_pressure_pa)
                .expect("checked")
                .is_empty()
        );
    }

    #[test]
    fn a_tank_motor_current_is_checked_against_its_full_load_current() {
        let site = demo();
        let t = site.tank("TK-1").expect("TK-1");
        let fl = full_load_current_a(
            t.motor_rating_w,
            t.motor_voltage_v,
            t.motor_power_factor,
            t.motor_efficiency,
        );
        assert!(
            check(&site, "TK-1", "motor-current", fl * 0.99)
                .expect("checked")
                .is_empty()
        );
        let calls = check(&site, "TK-1", "motor-current", fl * 1.1).expect("checked");
        assert!(
            matches!(calls[0].limit, SpotLimit::FullLoadCurrent { amps } if (amps - fl).abs() < 1e-9)
        );
        // A pump's motor has no voltage, power factor or efficiency in the site config.
        assert_eq!(
            check(&site, "P-1", "motor-current", 5.0),
            Err(NotChecked::NoMotorData)
        );
    }

    #[test]
    fn each_kind_is_offered_its_own_readings() {
        let names = |k| offered(k).iter().map(|r| r.name).collect::<Vec<_>>();
        assert!(names(EquipmentKind::Pump).contains(&"discharge-pressure"));
        assert!(names(EquipmentKind::Line).contains(&"line-pressure"));
        assert!(names(EquipmentKind::Tank).contains(&"liquid-level"));
        assert_eq!(offered(EquipmentKind::Pump).len(), 6);
    }
}
