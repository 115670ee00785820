//! `rheoside mix` as text: one line per quantity with its range, then the findings and the
//! cautions.

use crate::mixing::{Cavern, LoadCheck, Spread};
use crate::session::tank::{MotorAnswer, TankAnswer};
use crate::session::tank_words::{self, CAUTIONS};
use crate::units::{self, Dimension, UnitSystem, significant};
use std::fmt::Write as _;

pub(super) fn table(a: &TankAnswer, sys: UnitSystem) -> String {
    let mut s = String::new();
    header(&mut s, a, sys);
    point(&mut s, a, sys);
    power(&mut s, a, sys);
    if let Some(c) = &a.cavern {
        cavern(&mut s, a, c, sys);
    }
    if let Some(m) = &a.motor {
        motor(&mut s, m, sys);
    }
    list(&mut s, "Findings", &tank_words::findings(a));
    let cautions: Vec<String> = CAUTIONS.iter().map(|c| c.to_string()).collect();
    list(&mut s, "Cautions", &cautions);
    s
}

fn header(s: &mut String, a: &TankAnswer, sys: UnitSystem) {
    let v = &a.request.vessel;
    let tank = v.tank_diameter_m.map_or("tank size not given".into(), |t| {
        format!("in a {} tank", length(t, sys))
    });
    let imp = v.impeller.name();
    let d = length(v.impeller_diameter_m, sys);
    let _ = writeln!(s, "{imp} impeller, {d} across, {tank}");
}

/// Speed, shear rate, viscosity and the regime.
fn point(s: &mut String, a: &TankAnswer, sys: UnitSystem) {
    let p = &a.operating.point;
    let speed = speed(p.speed_rps, sys);
    row(
        s,
        "Speed",
        &format!("{speed} ({} rev/s)", significant(p.speed_rps)),
    );
    let ks = &a.curve.ks.spread;
    let rate = significant(p.effective_shear_rate_per_s);
    let (k, lo, hi) = (
        significant(ks.value),
        significant(ks.low),
        significant(ks.high),
    );
    row(
        s,
        "Effective shear rate",
        &format!("{rate} 1/s (ks {k}, {lo} to {hi})"),
    );
    row(
        s,
        "Apparent viscosity",
        &viscosity(p.apparent_viscosity_pa_s, sys),
    );
    let regime = tank_words::regime(p.regime);
    row(
        s,
        "Reynolds number",
        &format!("{} ({regime})", significant(p.reynolds)),
    );
    row(s, "Power number", &significant(p.power_number));
}

/// Power, torque, power per volume and the drive's limits.
fn power(s: &mut String, a: &TankAnswer, sys: UnitSystem) {
    let op = &a.operating;
    row(s, "Power", &ranged(&op.power_w, Dimension::Power, sys));
    row(
        s,
        "Shaft torque",
        &ranged(&op.torque_n_m, Dimension::Torque, sys),
    );
    if let (Some(sp), Some(b)) = (op.specific_power_w_m3, op.specific_power_band) {
        let kw = |x: f64| significant(x / 1000.0);
        let (v, lo, hi) = (kw(sp.value), kw(sp.low), kw(sp.high));
        let band = tank_words::band(b);
        row(
            s,
            "Power per volume",
            &format!("{v} kW/m3 ({lo} to {hi}): {band}"),
        );
    }
    if let Some(m) = &op.motor {
        row(s, "Motor", &limit(m, Dimension::Power, sys, "needed of a"));
    }
    if let Some(g) = &op.gearbox {
        row(s, "Gearbox", &limit(g, Dimension::Torque, sys, "of a"));
    }
}

fn speed(rps: f64, sys: UnitSystem) -> String {
    units::format(rps * 2.0 * std::f64::consts::PI, Dimension::Speed, sys)
}

fn row(s: &mut String, label: &str, value: &str) {
    let _ = writeln!(s, "  {label:<22} {value}");
}

fn list(s: &mut String, title: &str, items: &[String]) {
    if items.is_empty() {
        return;
    }
    let _ = writeln!(s, "{title}:");
    for i in items {
        let _ = writeln!(s, "  - {i}");
    }
}

fn length(m: f64, sys: UnitSystem) -> String {
    let unit = if sys == UnitSystem::UsCustomary {
        "ft"
    } else {
        "m"
    };
    units::format_in(m, Dimension::Length, unit)
}

fn viscosity(pa_s: f64, sys: UnitSystem) -> String {
    let unit = if sys == UnitSystem::UsCustomary {
        "cP"
    } else {
        "Pa.s"
    };
    units::format_in(pa_s, Dimension::DynamicViscosity, unit)
}

fn ranged(x: &Spread, dim: Dimension, sys: UnitSystem) -> String {
    let f = |v: f64| units::format(v, dim, sys);
    format!("{} ({} to {})", f(x.value), f(x.low), f(x.high))
}

fn limit(c: &LoadCheck, dim: Dimension, sys: UnitSystem, joint: &str) -> String {
    let f = |v: f64| units::format(v, dim, sys);
    format!(
        "{} {joint} {} limit ({:.0} %): {}",
        f(c.demand.value),
        f(c.limit),
        100.0 * c.fraction,
        tank_words::load(c.verdict)
    )
}

fn cavern(s: &mut String, a: &TankAnswer, c: &Cavern, sys: UnitSystem) {
    let against = a.request.vessel.tank_diameter_m.map_or(String::new(), |t| {
        format!(" against a {} tank", length(t, sys))
    });
    row(
        s,
        "Cavern (Elson)",
        &format!(
            "{} across ({} to {}), {} high{against}",
            length(c.diameter_m, sys),
            length(c.diameter_range_m.low, sys),
            length(c.diameter_range_m.high, sys),
            length(c.height_m, sys)
        ),
    );
    if let Some(n) = a.speed_to_wall_rps() {
        row(
            s,
            "Cavern at the wall",
            &format!("from about {}", speed(n, sys)),
        );
    }
}

fn motor(s: &mut String, m: &MotorAnswer, sys: UnitSystem) {
    row(
        s,
        "Shaft power (motor)",
        &units::format(m.shaft_power_w, Dimension::Power, sys),
    );
    let Some(d) = m.done() else { return };
    row(
        s,
        "Viscosity (motor)",
        &format!(
            "{} ({} to {}; {})",
            viscosity(d.apparent_viscosity_pa_s, sys),
            viscosity(d.apparent_viscosity_range_pa_s.low, sys),
            upper(d.apparent_viscosity_range_pa_s.high, sys),
            tank_words::regime(d.regime)
        ),
    );
    if let Ok(k) = d.k {
        row(
            s,
            "K (motor, n kept)",
            &format!("{} Pa.s^n", significant(k)),
        );
    }
    if let Some(c) = &m.comparison {
        row(
            s,
            "Viscosity (viscometer)",
            &format!(
                "{} at {} 1/s",
                viscosity(c.from_viscometer_pa_s, sys),
                significant(c.shear_rate_per_s)
            ),
        );
        let _ = writeln!(s, "  {}", tank_words::disagreement(c.agreement));
    }
}

/// An upper bound that may be unbounded (the curve's turbulent part allows any viscosity).
fn upper(pa_s: f64, sys: UnitSystem) -> String {
    if pa_s.is_finite() {
        viscosity(pa_s, sys)
    } else {
        "no upper bound".into()
    }
}
