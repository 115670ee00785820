//! Tank facts for the findings: the drive's demand against its ratings, the motor current
//! against full-load current, the cavern against the wall and the motor's viscosity beside
//! the viscometer's, worked out through `session::tank` with the session's readings.

use super::findings::{latest_curve, read, touched};
use super::rheology_source::nominal_model;
use super::state::SessionState;
use super::tank::{TankAnswer, analyse};
use super::tank_input::{TankFlags, request, site_tank};
use super::tank_readings::TankReadings;
use crate::diagnose::{Measured, PlantFacts, PlantSignal, TankFacts};
use crate::mixing::{AGREEMENT_FACTOR, Spread};
use crate::site::{Site, Tank};
use crate::units::Dimension;

/// Facts for every tank the session names, and the motor-against-viscometer comparisons.
pub fn tanks(state: &SessionState, site: &Site) -> (Vec<TankFacts>, Vec<PlantFacts>) {
    let mut facts = Vec::new();
    let mut plant = Vec::new();
    for tank in site
        .tanks
        .iter()
        .filter(|t| touched(state, &[t.id.as_str()]))
    {
        if let Some((f, p)) = tank_facts(state, site, tank) {
            facts.push(f);
            plant.extend(p);
        }
    }
    (facts, plant)
}

fn spread(s: Spread) -> Measured {
    Measured::within(s.value, (s.low, s.high))
}

/// Full-load current of a three-phase motor from its nameplate: I = P/(√3·V·pf·η)
/// (the three-phase power relation P_in = √3·V·I·pf, with P_out = η·P_in).
fn full_load_current_a(t: &Tank) -> Option<f64> {
    let i = t.motor_rating_w
        / (3f64.sqrt() * t.motor_voltage_v * t.motor_power_factor * t.motor_efficiency);
    (i.is_finite() && i > 0.0).then_some(i)
}

/// The tank answer for every tank the session names; the report draws its power curve.
pub fn tank_answers<'s>(state: &SessionState, site: &'s Site) -> Vec<(&'s Tank, TankAnswer)> {
    site.tanks
        .iter()
        .filter(|t| touched(state, &[t.id.as_str()]))
        .filter_map(|t| Some((t, tank_answer(state, site, t)?)))
        .collect()
}

fn tank_answer(state: &SessionState, site: &Site, t: &Tank) -> Option<TankAnswer> {
    let readings = TankReadings::latest(&state.readings, &t.id);
    let on_site = site_tank(site, &t.id, None).ok()?;
    let model = match latest_curve(state, &t.product) {
        Some(c) => c.fit.model,
        None => nominal_model(site.product(&t.product)?.nominal?),
    };
    let req = request(Some(on_site), &readings, &TankFlags::default(), model).ok()?;
    analyse(&req).ok()
}

fn tank_facts(
    state: &SessionState,
    site: &Site,
    t: &Tank,
) -> Option<(TankFacts, Option<PlantFacts>)> {
    let readings = TankReadings::latest(&state.readings, &t.id);
    let answer = tank_answer(state, site, t)?;
    let subject = format!("tank {}", t.id);
    let op = &answer.operating;
    let facts = TankFacts {
        subject: subject.clone(),
        motor_demand_w: op.motor.map(|m| spread(m.demand)),
        motor_rating_w: op.motor.map(|m| m.limit),
        torque_n_m: op.gearbox.map(|g| spread(g.demand)),
        gearbox_limit_n_m: op.gearbox.map(|g| g.limit),
        current_a: readings.motor_current_a.map(read),
        full_load_current_a: full_load_current_a(t),
        cavern_m: answer.cavern.map(|c| spread(c.diameter_range_m)),
        tank_diameter_m: t.diameter_m,
        moving_fraction: answer.cavern.and_then(|c| c.moving_volume_fraction),
    };
    let plant = answer.motor.and_then(|m| m.comparison).map(|c| PlantFacts {
        subject: format!("{subject} (viscosity from the motor's power)"),
        signal: PlantSignal::MotorPower,
        measured: c.from_power_pa_s,
        predicted: Measured::exact(c.from_viscometer_pa_s),
        dimension: Dimension::DynamicViscosity,
        agree: (1.0 / AGREEMENT_FACTOR, AGREEMENT_FACTOR),
    });
    Some((facts, plant))
}
