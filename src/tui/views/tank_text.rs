//! The Tank view's answer in words: today's point, power and torque against the drive's
//! limits with their ranges, the motor's viscosity beside the viscometer's, the cavern
//! against the wall, the findings, the cautions and where the curve came from.

use crate::mixing::{LoadCheck, Spread};
use crate::present::Style;
use crate::session::tank::TankAnswer;
use crate::session::tank_input::Source as From;
use crate::session::tank_live::TankLive;
use crate::session::tank_words::{self, CAUTIONS};
use crate::text::sanitize;
use crate::tui::strings::tank as s;
use crate::units::{self, Dimension, UnitSystem, significant};
use std::f64::consts::PI;

/// (is a heading, text) per line, already in the screen's style.
pub fn lines(d: &TankLive, journalled: bool, style: Style) -> Vec<(bool, String)> {
    let sys = style.system;
    let say = |t: String| style.text(&sanitize(&t, false));
    let a = &d.answer;
    let mut out = vec![(true, say(format!("{}  {}", d.tank_id, d.product)))];
    out.push((false, say(point(a, sys))));
    out.extend(drive(a, sys).into_iter().map(|l| (false, say(l))));
    out.push((false, say(motor(a, sys))));
    out.push((false, say(cavern(a, sys))));
    let findings = tank_words::findings(a);
    if !findings.is_empty() {
        out.push((true, format!("{}:", s::FINDINGS)));
        out.extend(findings.into_iter().map(|f| (false, say(format!("- {f}")))));
    }
    out.push((true, format!("{}:", s::CAUTIONS)));
    out.extend(CAUTIONS.iter().map(|c| (false, say(format!("- {c}")))));
    let temp = d
        .inputs
        .temperature_k
        .map(|k| {
            format!(
                " {} {}",
                s::AT,
                units::format(k, Dimension::Temperature, sys)
            )
        })
        .unwrap_or_default();
    out.push((
        false,
        say(format!("{}{temp}: {}", s::CURVE, d.source.describe())),
    ));
    if journalled {
        out.push((false, say(s::JOURNALLED_NOTE.to_string())));
    }
    out
}

fn speed(rps: f64, sys: UnitSystem) -> String {
    units::format(rps * 2.0 * PI, Dimension::Speed, sys)
}

/// "At 30 rpm (the site's speed): laminar, Reynolds 12, power number 8.1."
fn point(a: &TankAnswer, sys: UnitSystem) -> String {
    let p = &a.operating.point;
    let from = match a.request.speed_from {
        From::Reading => s::FROM_READING,
        From::Site | From::Flag => s::FROM_SITE,
    };
    format!(
        "At {} ({from}): {}, Reynolds {}, power number {}.",
        speed(p.speed_rps, sys),
        tank_words::regime(p.regime),
        significant(p.reynolds),
        significant(p.power_number)
    )
}

fn ranged(x: &Spread, dim: Dimension, sys: UnitSystem) -> String {
    let f = |v: f64| units::format(v, dim, sys);
    format!("{} ({} to {})", f(x.value), f(x.low), f(x.high))
}

/// "73 % of its 3 kW rating: within the limit."
fn against(c: &LoadCheck, dim: Dimension, sys: UnitSystem, what: &str) -> String {
    format!(
        "{:.0} % {} {} {what}: {}.",
        100.0 * c.fraction,
        s::OF_RATING,
        units::format(c.limit, dim, sys),
        tank_words::load(c.verdict)
    )
}

/// Power and torque with their ranges, each against its limit; the power per volume.
fn drive(a: &TankAnswer, sys: UnitSystem) -> Vec<String> {
    let op = &a.operating;
    let mut out = Vec::new();
    let power = ranged(&op.power_w, Dimension::Power, sys);
    out.push(match &op.motor {
        Some(m) => format!(
            "{} {power}; {}: {}",
            s::POWER,
            s::MOTOR.to_lowercase(),
            against(m, Dimension::Power, sys, s::RATING)
        ),
        None => format!("{} {power}.", s::POWER),
    });
    let torque = ranged(&op.torque_n_m, Dimension::Torque, sys);
    out.push(match &op.gearbox {
        Some(g) => format!(
            "{} {torque}; {}: {}",
            s::TORQUE,
            s::GEARBOX.to_lowercase(),
            against(g, Dimension::Torque, sys, s::TORQUE_LIMIT)
        ),
        None => format!("{} {torque}.", s::TORQUE),
    });
    if let (Some(sp), Some(b)) = (op.specific_power_w_m3, op.specific_power_band) {
        let kw = |x: f64| significant(x / 1000.0);
        out.push(format!(
            "{} {} kW/m3 ({} to {}): {}.",
            s::PER_VOLUME,
            kw(sp.value),
            kw(sp.low),
            kw(sp.high),
            tank_words::band(b)
        ));
    }
    out
}

fn viscosity(pa_s: f64, sys: UnitSystem) -> String {
    if pa_s.is_finite() {
        units::format(pa_s, Dimension::DynamicViscosity, sys)
    } else {
        s::NO_UPPER.to_string()
    }
}

/// The motor's viscosity beside the viscometer's; a refusal is said among the findings.
fn motor(a: &TankAnswer, sys: UnitSystem) -> String {
    let Some(m) = &a.motor else {
        return s::NO_MOTOR_READING.to_string();
    };
    let shaft = format!(
        "{}: {}.",
        s::SHAFT,
        units::format(m.shaft_power_w, Dimension::Power, sys)
    );
    let Some(done) = m.done() else {
        return format!("{shaft} {}", s::REFUSED_SEE_FINDINGS);
    };
    let r = &done.apparent_viscosity_range_pa_s;
    let mut text = format!(
        "{shaft} {}: {} ({} to {}).",
        s::VISC_MOTOR,
        viscosity(done.apparent_viscosity_pa_s, sys),
        viscosity(r.low, sys),
        viscosity(r.high, sys)
    );
    if let Some(c) = &m.comparison {
        text.push_str(&format!(
            " {} {} at {} 1/s.",
            s::VISC_METER,
            viscosity(c.from_viscometer_pa_s, sys),
            significant(c.shear_rate_per_s)
        ));
        text.push(' ');
        text.push_str(tank_words::disagreement(c.agreement));
    }
    text
}

/// "Cavern 1.2 m across (1.0 to 1.4 m) in a tank of 1.8 m; reaches the wall from 45 rpm."
fn cavern(a: &TankAnswer, sys: UnitSystem) -> String {
    let Some(c) = &a.cavern else {
        return s::NO_CAVERN.to_string();
    };
    // Tank sizes in metres (or feet), not the pipe sizes' millimetres.
    let unit = match sys {
        UnitSystem::Si => "m",
        UnitSystem::UsCustomary => "ft",
    };
    let len = |m: f64| units::format_in(m, Dimension::Length, unit);
    let tank = a
        .request
        .vessel
        .tank_diameter_m
        .map(|t| format!(" {} {}", s::IN_TANK, len(t)))
        .unwrap_or_default();
    let wall = a
        .speed_to_wall_rps()
        .map(|n| format!("; {} {}", s::TO_WALL, speed(n, sys)))
        .unwrap_or_default();
    format!(
        "{} {} {} ({} to {}){tank}{wall}.",
        s::CAVERN,
        len(c.diameter_m),
        s::ACROSS,
        len(c.diameter_range_m.low),
        len(c.diameter_range_m.high)
    )
}
