//! `[[line]]` tables: bore, length, roughness, elevation, fittings and design pressure.

use super::errors::{ErrorKind, Sink};
use super::fields::{Need, Rule};
use super::model::Line;
use super::raw::RawTable;
use crate::units::Dimension;

pub(crate) const LINE_KEYS: &[&str] = &[
    "id",
    "description",
    "inner_diameter",
    "length",
    "roughness",
    "elevation_change",
    "fittings_length",
    "design_pressure",
    "back_pressure",
    "restart_margin",
    "coldest_temperature",
    "gel_cold_factor",
];

/// Restart margin when the line gives none (common practice, no source).
pub const DEFAULT_RESTART_MARGIN: f64 = 0.10;
/// Largest gel cold factor accepted: beyond this the product is another material.
const MAX_GEL_COLD_FACTOR: f64 = 100.0;
/// Plant pipe bores, m: 2 mm tube to a 3 m main (common practice, no source). An inner
/// diameter of 5e-324 m passed before.
const BORE_M: (f64, f64) = (2e-3, 3.0);
/// Line lengths, m: 10 cm to 100 km (common practice, no source).
const LINE_LENGTH_M: (f64, f64) = (0.1, 1e5);

/// Largest relative roughness ε/D accepted; the friction-factor charts stop at 0.05.
const MAX_RELATIVE_ROUGHNESS: f64 = 0.05;

/// A bad optional value is reported and left at its default: any report fails the load.
pub(crate) fn build(mut t: RawTable, sink: &mut Sink) -> Option<Line> {
    let (id, description) = t.identity(sink);
    let len =
        |key, rule, need, sink: &mut Sink| t.quantity(sink, key, Dimension::Length, rule, need);
    let diameter = len(
        "inner_diameter",
        Rule::Within(BORE_M.0, BORE_M.1),
        Need::Required,
        sink,
    );
    let length = len(
        "length",
        Rule::Within(LINE_LENGTH_M.0, LINE_LENGTH_M.1),
        Need::Required,
        sink,
    );
    let roughness = len("roughness", Rule::NonNegative, Need::Required, sink);
    let elevation = len("elevation_change", Rule::Any, Need::Optional, sink);
    let fittings = len("fittings_length", Rule::NonNegative, Need::Optional, sink);
    let design = t.quantity(
        sink,
        "design_pressure",
        Dimension::Pressure,
        Rule::Positive,
        Need::Required,
    );
    let roughness = roughness.filter(|r| {
        let ok = diameter.is_none_or(|d| *r <= MAX_RELATIVE_ROUGHNESS * d);
        if !ok {
            let msg = "must be under 5 % of the inner diameter; pipe roughness is small, e.g. \
                       '0.045 mm' for commercial steel";
            t.fail(sink, "roughness", ErrorKind::BadValue, msg.into());
        }
        ok
    });
    let elevation = elevation.filter(|z| {
        let ok = length.is_none_or(|l| z.abs() <= l);
        if !ok {
            let msg = "a rise or fall larger than the line's length is impossible; \
                       give outlet height minus inlet height";
            t.fail(sink, "elevation_change", ErrorKind::BadValue, msg.into());
        }
        ok
    });
    let restart = restart_settings(&t, sink);
    Some(Line {
        id: id?,
        description,
        inner_diameter_m: diameter?,
        length_m: length?,
        roughness_m: roughness?,
        elevation_change_m: elevation.unwrap_or(0.0),
        fittings_length_m: fittings.unwrap_or(0.0),
        design_pressure_pa: design?,
        back_pressure_pa: restart.back_pressure_pa,
        restart_margin: restart.margin,
        coldest_temperature_k: restart.coldest_k,
        gel_cold_factor: restart.cold_factor,
    })
}

/// The restart settings, each optional; a bad one is reported and left at its default.
struct RestartSettings {
    back_pressure_pa: f64,
    margin: f64,
    coldest_k: Option<f64>,
    cold_factor: Option<f64>,
}

fn restart_settings(t: &RawTable, sink: &mut Sink) -> RestartSettings {
    let back = t.quantity(
        sink,
        "back_pressure",
        Dimension::Pressure,
        Rule::NonNegative,
        Need::Optional,
    );
    let margin = t.quantity(
        sink,
        "restart_margin",
        Dimension::Fraction,
        Rule::Within(0.0, 0.9),
        Need::Optional,
    );
    let coldest = t.quantity(
        sink,
        "coldest_temperature",
        Dimension::Temperature,
        Rule::Positive,
        Need::Optional,
    );
    let factor = t.number(
        sink,
        "gel_cold_factor",
        Rule::Within(1.0, MAX_GEL_COLD_FACTOR),
        Need::Optional,
    );
    RestartSettings {
        back_pressure_pa: back.unwrap_or(0.0),
        margin: margin.unwrap_or(DEFAULT_RESTART_MARGIN),
        coldest_k: coldest,
        cold_factor: factor,
    }
}
