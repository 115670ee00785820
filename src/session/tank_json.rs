//! A tank answer as the contract JSON (`rheoside mix --json`, and the result the Tank view
//! journals): the keys named in the issue, SI, plus ranges, verdicts, warnings and cautions.

use super::tank::TankAnswer;
use super::tank_words::{self, CAUTIONS};
use crate::mixing::{Constant, LoadCheck, Spread};
use serde_json::{Map, Value, json};

/// The whole answer. Keys that do not apply (no yield stress, no motor reading) are absent;
/// keys that apply but could not be worked out are null with the reason in `warnings`.
pub fn tank_json(a: &TankAnswer) -> Value {
    let p = &a.operating.point;
    let mut out = Map::new();
    let warnings = tank_words::findings(a);
    put(
        &mut out,
        "impeller",
        json!(a.request.vessel.impeller.name()),
    );
    put(&mut out, "speed_rps", finite(p.speed_rps));
    put(&mut out, "speed_from", json!(a.request.speed_from));
    put(
        &mut out,
        "effective_shear_rate_per_s",
        finite(p.effective_shear_rate_per_s),
    );
    put(
        &mut out,
        "apparent_viscosity_pa_s",
        finite(p.apparent_viscosity_pa_s),
    );
    put(&mut out, "reynolds", finite(p.reynolds));
    put(&mut out, "regime", json!(p.regime));
    put(&mut out, "power_number", finite(p.power_number));
    put(&mut out, "power_w", finite(p.power_w));
    put(&mut out, "power_range_w", range(&a.operating.power_w));
    put(&mut out, "torque_n_m", finite(p.torque_n_m));
    put(&mut out, "torque_range_n_m", range(&a.operating.torque_n_m));
    specific_power(a, &mut out);
    put(&mut out, "motor_load", load(a.operating.motor.as_ref()));
    put(&mut out, "gearbox_load", load(a.operating.gearbox.as_ref()));
    put(&mut out, "constants", constants(a));
    cavern(a, &mut out);
    motor(a, &mut out);
    put(&mut out, "warnings", json!(warnings));
    put(&mut out, "cautions", json!(CAUTIONS));
    Value::Object(out)
}

fn put(out: &mut Map<String, Value>, key: &str, value: Value) {
    out.insert(key.to_string(), value);
}

fn range(s: &Spread) -> Value {
    json!({ "low": finite(s.low), "high": finite(s.high) })
}

fn specific_power(a: &TankAnswer, out: &mut Map<String, Value>) {
    let op = &a.operating;
    match (op.specific_power_w_m3, op.specific_power_band) {
        (Some(s), Some(b)) => {
            put(out, "specific_power_w_m3", finite(s.value));
            put(out, "specific_power_range_w_m3", range(&s));
            put(out, "specific_power_band", json!(b));
        }
        _ => put(out, "specific_power_w_m3", Value::Null),
    }
}

fn load(check: Option<&LoadCheck>) -> Value {
    check.map_or(Value::Null, |c| {
        json!({
            "limit": finite(c.limit),
            "demand": finite(c.demand.value),
            "demand_high": finite(c.demand.high),
            "fraction": finite(c.fraction),
            "verdict": c.verdict,
        })
    })
}

fn constants(a: &TankAnswer) -> Value {
    let one = |c: &Constant| {
        json!({
            "value": finite(c.spread.value),
            "low": finite(c.spread.low),
            "high": finite(c.spread.high),
            "source": c.source,
        })
    };
    json!({
        "ks": one(&a.curve.ks),
        "kp": one(&a.curve.kp),
        "np_turbulent": one(&a.curve.np_turbulent),
        "re_laminar_below": a.curve.re_laminar_below,
        "re_turbulent_above": a.curve.re_turbulent_above,
        "baffling": a.request.vessel.baffling,
    })
}

fn cavern(a: &TankAnswer, out: &mut Map<String, Value>) {
    let Some(c) = &a.cavern else { return };
    put(out, "cavern_diameter_m", finite(c.diameter_m));
    put(out, "cavern_diameter_range_m", range(&c.diameter_range_m));
    put(out, "cavern_height_m", finite(c.height_m));
    put(
        out,
        "cavern_moving_volume_fraction",
        c.moving_volume_fraction.map_or(Value::Null, finite),
    );
    put(out, "cavern_finding", json!(c.finding));
    let wall = a.speed_to_wall_rps();
    put(
        out,
        "speed_cavern_to_wall_rps",
        wall.map_or(Value::Null, finite),
    );
}

fn motor(a: &TankAnswer, out: &mut Map<String, Value>) {
    let Some(m) = &a.motor else { return };
    put(out, "shaft_power_w", finite(m.shaft_power_w));
    let done = m.done();
    let mu = done.map_or(Value::Null, |d| finite(d.apparent_viscosity_pa_s));
    put(out, "apparent_viscosity_from_power_pa_s", mu);
    let k = done.and_then(|d| d.k.ok());
    put(out, "k_from_power_pa_sn", k.map_or(Value::Null, finite));
    if let Some(d) = done {
        put(out, "regime_from_power", json!(d.regime));
        let r = &d.apparent_viscosity_range_pa_s;
        put(out, "apparent_viscosity_from_power_range_pa_s", range(r));
        put(out, "viscosity_sensitivity", finite(d.sensitivity));
    }
    if let Some(c) = &m.comparison {
        put(
            out,
            "viscometer_comparison",
            json!({
                "shear_rate_per_s": finite(c.shear_rate_per_s),
                "from_power_pa_s": finite(c.from_power_pa_s),
                "from_viscometer_pa_s": finite(c.from_viscometer_pa_s),
                "ratio": finite(c.ratio),
                "agreement": c.agreement,
                "meaning": tank_words::disagreement(c.agreement),
            }),
        );
    }
}

/// NaN or infinity never reaches the output: JSON has no such numbers.
fn finite(x: f64) -> serde_json::Value {
    if x.is_finite() {
        serde_json::json!(x)
    } else {
        serde_json::Value::Null
    }
}
