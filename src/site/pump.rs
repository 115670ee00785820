//! `[[pump]]` tables: kind, the line fed, rated speed, pressure limits, and the water curve
//! (centrifugal) or displacement per revolution (positive displacement).

use super::errors::{ErrorKind, Sink};
use super::fields::{Need, Rule};
use super::model::{CurvePoint, Pump, PumpKind};
use super::raw::RawTable;
use crate::units::{self, Dimension};

pub(crate) const PUMP_KEYS: &[&str] = &[
    "id",
    "description",
    "kind",
    "feeds",
    "rated_speed",
    "max_discharge_pressure",
    "relief_setting",
    "displacement",
    "curve",
    "volumetric_efficiency",
    "motor_rating",
];
const POINT_KEYS: &[&str] = &["flow", "head", "efficiency"];

/// Fewest water-curve points that pin down a head curve's shape (a quadratic).
pub const MIN_CURVE_POINTS: usize = 3;

#[derive(Debug, Clone, Copy, PartialEq)]
enum Kind {
    Centrifugal,
    Displacement,
}

const KINDS: [(&str, Kind); 2] = [
    ("centrifugal", Kind::Centrifugal),
    ("positive-displacement", Kind::Displacement),
];

pub(crate) fn build(mut t: RawTable, sink: &mut Sink) -> Option<Pump> {
    let (id, description) = t.identity(sink);
    let kind = t.choice(sink, "kind", &KINDS, Need::Required);
    let feeds = t.id(sink, "feeds", Need::Required);
    let speed = t.quantity(
        sink,
        "rated_speed",
        Dimension::Speed,
        Rule::Positive,
        Need::Required,
    );
    let (max_discharge, relief) = pressure_limits(&t, sink);
    let (volumetric, motor) = extras(&t, kind, sink);
    let kind = match kind? {
        Kind::Centrifugal => centrifugal(&t, sink),
        Kind::Displacement => displacement(&t, sink),
    };
    Some(Pump {
        id: id?,
        description,
        kind: kind?,
        feeds: feeds?,
        rated_speed_rad_s: speed?,
        max_discharge_pressure_pa: max_discharge,
        relief_setting_pa: relief,
        volumetric_efficiency: volumetric,
        motor_rating_w: motor,
    })
}

/// Volumetric efficiency (positive displacement only) and motor rating, both optional.
fn extras(t: &RawTable, kind: Option<Kind>, sink: &mut Sink) -> (Option<f64>, Option<f64>) {
    let volumetric = t.quantity(
        sink,
        "volumetric_efficiency",
        Dimension::Fraction,
        Rule::UnitInterval,
        Need::Optional,
    );
    if kind == Some(Kind::Centrifugal) && t.has("volumetric_efficiency") {
        let msg = "used only with kind 'positive-displacement'; remove it".into();
        t.fail(sink, "volumetric_efficiency", ErrorKind::BadValue, msg);
    }
    let motor = t.quantity(
        sink,
        "motor_rating",
        Dimension::Power,
        Rule::Positive,
        Need::Optional,
    );
    (volumetric, motor)
}

/// At least one of the casing/discharge limit and the relief setting (gauge) must be known.
fn pressure_limits(t: &RawTable, sink: &mut Sink) -> (Option<f64>, Option<f64>) {
    let p = |key, sink: &mut Sink| {
        t.quantity(
            sink,
            key,
            Dimension::Pressure,
            Rule::Positive,
            Need::Optional,
        )
    };
    let limits = (p("max_discharge_pressure", sink), p("relief_setting", sink));
    if !t.has("max_discharge_pressure") && !t.has("relief_setting") {
        let accepted = "give max_discharge_pressure, relief_setting or both (gauge), \
                        e.g. '10 bar'";
        t.need(sink, "max_discharge_pressure", Need::Required, accepted);
    }
    limits
}

fn centrifugal(t: &RawTable, sink: &mut Sink) -> Option<PumpKind> {
    if t.has("displacement") {
        let msg = "used only with kind 'positive-displacement'; remove it".into();
        t.fail(sink, "displacement", ErrorKind::BadValue, msg);
    }
    let accepted = "give the water curve as a list of points, \
                    e.g. curve = [{ flow = '0 m3/h', head = '32 m', efficiency = 0 }, …]";
    if !t.need(sink, "curve", Need::Required, accepted) {
        return None;
    }
    let points = t.tables("curve", POINT_KEYS, sink);
    let read: Vec<Option<CurvePoint>> = points.iter().map(|p| point(p, sink)).collect();
    if points.len() < MIN_CURVE_POINTS {
        let msg = format!(
            "has {} point(s); a water curve needs at least {MIN_CURVE_POINTS}, flow increasing",
            points.len()
        );
        t.fail(sink, "curve", ErrorKind::BadValue, msg);
        return None;
    }
    check_increasing(&points, &read, sink);
    let curve = read.into_iter().collect::<Option<Vec<_>>>()?;
    Some(PumpKind::Centrifugal { curve })
}

fn point(p: &RawTable, sink: &mut Sink) -> Option<CurvePoint> {
    let flow = p.quantity(
        sink,
        "flow",
        Dimension::Flow,
        Rule::NonNegative,
        Need::Required,
    );
    let head = p.quantity(
        sink,
        "head",
        Dimension::Length,
        Rule::NonNegative,
        Need::Required,
    );
    let eff = p.quantity(
        sink,
        "efficiency",
        Dimension::Fraction,
        Rule::Within(0.0, 1.0),
        Need::Required,
    );
    if let (Some(q), Some(0.0)) = (flow, eff)
        && q > 0.0
    {
        let msg = "must be above 0 except at zero flow (e.g. 0.72 or '72 %')".into();
        p.fail(sink, "efficiency", ErrorKind::BadValue, msg);
    }
    Some(CurvePoint {
        flow_m3_s: flow?,
        head_m: head?,
        efficiency: eff?,
    })
}

/// Each point's flow must exceed the one before; the error points at the offending flow.
fn check_increasing(points: &[RawTable], read: &[Option<CurvePoint>], sink: &mut Sink) {
    let mut last: Option<f64> = None;
    for (raw, got) in points.iter().zip(read) {
        let Some(q) = got.map(|c| c.flow_m3_s) else {
            continue;
        };
        if let Some(prev) = last
            && q <= prev
        {
            let shown = units::format(prev, Dimension::Flow, units::UnitSystem::Si);
            let msg = format!(
                "water curve flow must strictly increase from point to point \
                 (the point before has {shown})"
            );
            raw.fail(sink, "flow", ErrorKind::BadValue, msg);
        }
        last = Some(q);
    }
}

fn displacement(t: &RawTable, sink: &mut Sink) -> Option<PumpKind> {
    if t.has("curve") {
        let msg = "a positive-displacement pump has no head curve; remove it".into();
        t.fail(sink, "curve", ErrorKind::BadValue, msg);
    }
    let accepted = "give the volume per revolution, e.g. '0.35 L/rev' (L, m3 or gal per rev)";
    let text = t.string_value(sink, "displacement", Need::Required, accepted, accepted)?;
    match per_revolution(text) {
        Some(v) if v > 0.0 => Some(PumpKind::PositiveDisplacement {
            displacement_m3_per_rev: v,
        }),
        Some(_) => {
            t.fail(
                sink,
                "displacement",
                ErrorKind::BadValue,
                "must be greater than zero".into(),
            );
            None
        }
        None => {
            let msg = format!("not a volume per revolution; {accepted}");
            t.fail(sink, "displacement", ErrorKind::BadValue, msg);
            None
        }
    }
}

/// "0.35 L/rev" → m³ per revolution. There is no volume dimension, so the volume is read as
/// the same number per second (or per minute, for gallons) through the flow units.
pub(super) fn per_revolution(text: &str) -> Option<f64> {
    let trimmed = text.trim();
    let cut = trimmed.len().checked_sub(4)?;
    let (volume, suffix) = (trimmed.get(..cut)?, trimmed.get(cut..)?);
    if !suffix.eq_ignore_ascii_case("/rev") {
        return None;
    }
    let per_second = units::parse(&format!("{volume}/s"), Dimension::Flow);
    let per_minute = units::parse(&format!("{volume}/min"), Dimension::Flow).map(|q| q * 60.0);
    per_second.or(per_minute).ok()
}
