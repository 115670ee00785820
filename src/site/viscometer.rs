//! `[[viscometer]]` tables: the standard six-speed instrument, or coaxial cylinders and
//! spindles built from their dimensions.

use super::errors::{ErrorKind, Sink};
use super::fields::{Need, Rule};
use super::model::Viscometer;
use super::raw::RawTable;
use crate::instrument::{Coaxial, Geometry, Spindle};
use crate::units::Dimension;

pub(crate) const VISCOMETER_KEYS: &[&str] = &[
    "id",
    "description",
    "geometry",
    "bob_radius",
    "cup_radius",
    "bob_length",
    "radius",
    "length",
    "torque_per_dial",
    "full_scale_torque",
    "full_scale_dial",
    "end_effect_factor",
    "min_speed",
    "max_speed",
];

/// The standard six-speed instrument runs from 3 to 600 rpm (API RP 13D field viscometer,
/// from memory).
pub const STANDARD_SPEED_RANGE_RPM: (f64, f64) = (3.0, 600.0);

/// rad/s per rpm (definition of the revolution per minute).
const RAD_S_PER_RPM: f64 = std::f64::consts::PI / 30.0;

/// Accepted end-effect factors (effective / geometric length); end effects only add torque.
const END_EFFECT_RANGE: (f64, f64) = (1.0, 2.0);

#[derive(Debug, Clone, Copy, PartialEq)]
enum Kind {
    Standard,
    Coaxial,
    Spindle,
}

const KINDS: [(&str, Kind); 3] = [
    ("standard-six-speed", Kind::Standard),
    ("coaxial", Kind::Coaxial),
    ("spindle", Kind::Spindle),
];

/// Keys that belong to one geometry only, with the geometry that uses them.
const ONLY_FOR: [(&str, Kind); 5] = [
    ("bob_radius", Kind::Coaxial),
    ("cup_radius", Kind::Coaxial),
    ("bob_length", Kind::Coaxial),
    ("radius", Kind::Spindle),
    ("length", Kind::Spindle),
];

/// Keys every geometry but the standard one needs (its spring and scale are fixed).
const SPRING_KEYS: [&str; 4] = [
    "torque_per_dial",
    "full_scale_torque",
    "full_scale_dial",
    "end_effect_factor",
];

pub(crate) fn build(mut t: RawTable, sink: &mut Sink) -> Option<Viscometer> {
    let (id, description) = t.identity(sink);
    let kind = t.choice(sink, "geometry", &KINDS, Need::Required);
    let kind = kind?;
    let geometry = match kind {
        Kind::Standard => standard(&t, sink),
        Kind::Coaxial => coaxial(&t, sink),
        Kind::Spindle => spindle(&t, sink),
    };
    let speed_range_rpm = match kind {
        Kind::Standard => Some(STANDARD_SPEED_RANGE_RPM),
        Kind::Coaxial | Kind::Spindle => speed_range(&t, sink),
    };
    Some(Viscometer {
        id: id?,
        geometry: geometry?,
        description,
        speed_range_rpm,
    })
}

/// `min_speed` and `max_speed` of a coaxial or spindle instrument, rpm, when both are given
/// and the lowest is below the highest.
fn speed_range(t: &RawTable, sink: &mut Sink) -> Option<(f64, f64)> {
    let speed = |key, sink: &mut Sink| {
        t.quantity(sink, key, Dimension::Speed, Rule::Positive, Need::Optional)
    };
    let lo = speed("min_speed", sink);
    let hi = speed("max_speed", sink);
    match (lo, hi, t.has("min_speed"), t.has("max_speed")) {
        (Some(lo), Some(hi), _, _) if lo < hi => Some((lo / RAD_S_PER_RPM, hi / RAD_S_PER_RPM)),
        (Some(_), Some(_), _, _) => {
            let msg = "must be above min_speed".to_string();
            t.fail(sink, "max_speed", ErrorKind::BadValue, msg);
            None
        }
        (_, _, true, false) | (_, _, false, true) => {
            let missing = if t.has("min_speed") {
                "max_speed"
            } else {
                "min_speed"
            };
            let present = if t.has("min_speed") {
                "min_speed"
            } else {
                "max_speed"
            };
            let msg = format!("given without {missing}; give both, or neither");
            t.fail(sink, present, ErrorKind::BadValue, msg);
            None
        }
        _ => None,
    }
}

fn standard(t: &RawTable, sink: &mut Sink) -> Option<Geometry> {
    refuse_others(t, Kind::Standard, sink);
    for key in ["min_speed", "max_speed"].iter().filter(|k| t.has(k)) {
        let msg = "not used with geometry 'standard-six-speed' (it runs at 3 to 600 rpm)";
        t.fail(sink, key, ErrorKind::BadValue, msg.into());
    }
    for key in SPRING_KEYS.iter().filter(|k| t.has(k)) {
        let msg = "not used with geometry 'standard-six-speed' (its rotor, bob and spring are \
                   fixed); use geometry 'coaxial' for other dimensions";
        t.fail(sink, key, ErrorKind::BadValue, msg.into());
    }
    Some(Geometry::StandardSixSpeed)
}

fn coaxial(t: &RawTable, sink: &mut Sink) -> Option<Geometry> {
    refuse_others(t, Kind::Coaxial, sink);
    let bob = length(t, "bob_radius", sink);
    let cup = length(t, "cup_radius", sink);
    let bob_length = length(t, "bob_length", sink);
    let spring = spring(t, sink);
    let (bob, cup) = (bob?, cup?);
    if cup <= bob {
        let msg = "must be larger than bob_radius: the product fills the gap between them";
        t.fail(sink, "cup_radius", ErrorKind::BadValue, msg.into());
        return None;
    }
    let (torque, full_scale, factor) = spring?;
    Some(Geometry::Coaxial(Coaxial {
        bob_radius_m: bob,
        cup_radius_m: cup,
        bob_length_m: bob_length?,
        torque_per_dial_n_m: torque,
        full_scale_dial: full_scale,
        end_effect_factor: factor,
    }))
}

fn spindle(t: &RawTable, sink: &mut Sink) -> Option<Geometry> {
    refuse_others(t, Kind::Spindle, sink);
    let radius = length(t, "radius", sink);
    let len = length(t, "length", sink);
    let (torque, full_scale, factor) = spring(t, sink)?;
    Some(Geometry::Spindle(Spindle {
        radius_m: radius?,
        length_m: len?,
        torque_per_dial_n_m: torque,
        full_scale_dial: full_scale,
        end_effect_factor: factor,
    }))
}

/// Dimensions a bench viscometer's bob, cup or spindle can have, m: 0.5 mm to 0.5 m
/// (common practice, no source). Outside it the number is a typo or a wrong unit
/// (a radius of 1e-200 m passed before and every fit then blamed the readings).
const VISCOMETER_SIZE_M: (f64, f64) = (5e-4, 0.5);

fn length(t: &RawTable, key: &str, sink: &mut Sink) -> Option<f64> {
    let (lo, hi) = VISCOMETER_SIZE_M;
    t.quantity(
        sink,
        key,
        Dimension::Length,
        Rule::Within(lo, hi),
        Need::Required,
    )
}

/// Torque per dial unit, full-scale dial and end-effect factor. The torque may be given per
/// dial unit or at full scale (as spring data sheets usually state it), not both.
fn spring(t: &RawTable, sink: &mut Sink) -> Option<(f64, f64, f64)> {
    let full_scale = t.number(sink, "full_scale_dial", Rule::Positive, Need::Required);
    let (lo, hi) = END_EFFECT_RANGE;
    let factor = t.number(
        sink,
        "end_effect_factor",
        Rule::Within(lo, hi),
        Need::Optional,
    );
    let torque = |key, sink: &mut Sink| {
        t.quantity(sink, key, Dimension::Torque, Rule::Positive, Need::Optional)
    };
    let torque = match (t.has("torque_per_dial"), t.has("full_scale_torque")) {
        (true, true) => {
            let msg = "give either torque_per_dial or full_scale_torque, not both".into();
            t.fail(sink, "full_scale_torque", ErrorKind::BadValue, msg);
            None
        }
        (true, false) => torque("torque_per_dial", sink),
        (false, true) => torque("full_scale_torque", sink)
            .zip(full_scale)
            .map(|(t, f)| t / f),
        (false, false) => {
            let accepted =
                "give the spring's full-scale torque, e.g. '0.7 mN.m' (or torque_per_dial)";
            t.need(sink, "full_scale_torque", Need::Required, accepted);
            None
        }
    };
    Some((torque?, full_scale?, factor.unwrap_or(1.0)))
}

/// Dimension keys of another geometry are mistakes, not silently ignored extras.
fn refuse_others(t: &RawTable, kind: Kind, sink: &mut Sink) {
    for (key, owner) in ONLY_FOR.iter().filter(|(k, o)| *o != kind && t.has(k)) {
        let name = KINDS
            .iter()
            .find(|(_, k)| k == owner)
            .map_or("", |(n, _)| n);
        let msg = format!("used only with geometry '{name}'; remove it or change the geometry");
        t.fail(sink, key, ErrorKind::BadValue, msg);
    }
}
