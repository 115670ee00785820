//! The session's tank layer: the site's tanks mapped to the engine, spot readings and flags
//! merged in order, and the answer the Tank view draws (chart, limits, cavern, findings).
//! Tanks and products are the invented demo site's (Marrowdale).

use chrono::{FixedOffset, TimeZone, Utc};
use rheoside::mixing::{ConstantSource, ImpellerKind, Regime};
use rheoside::rheology::Model;
use rheoside::session::state::{Entry, Moment, SpotReading};
use rheoside::session::tank::{self, TankFinding};
use rheoside::session::tank_input::{self, Source, TankFlags, TankReadings};
use rheoside::site::{self, Impeller};
use std::f64::consts::PI;

fn reading(seq: u64, equipment: &str, name: &str, value_si: f64) -> Entry<SpotReading> {
    Entry {
        seq,
        at: Moment {
            utc: Utc.with_ymd_and_hms(2026, 12, 1, 6, 0, seq as u32).unwrap(),
            offset: FixedOffset::east_opt(0).unwrap(),
        },
        operator: "K. Amundsen".into(),
        equipment: Some(equipment.into()),
        item: SpotReading {
            name: name.into(),
            raw: String::new(),
            value_si,
            dimension: String::new(),
        },
    }
}

#[test]
fn the_engine_spells_every_site_impeller_the_same_way() {
    for (name, imp) in Impeller::NAMES {
        assert_eq!(tank_input::impeller_kind(imp).name(), name);
        assert_eq!(
            ImpellerKind::from_name(name),
            Some(tank_input::impeller_kind(imp))
        );
    }
}

#[test]
fn the_newest_reading_at_this_tank_wins() {
    let rpm = |r: f64| r * PI / 30.0;
    let readings = vec![
        reading(2, "TK-1", "agitator-speed", rpm(20.0)),
        reading(3, "TK-1", "agitator-speed", rpm(24.0)),
        reading(4, "TK-2", "agitator-speed", rpm(90.0)),
        reading(5, "TK-1", "motor-current", 3.1),
    ];
    let r = TankReadings::latest(&readings, "TK-1");
    // 24 rpm = 0.4 rev/s.
    assert!((r.speed_rps.unwrap() - 0.4).abs() < 1e-12);
    assert_eq!(r.motor_current_a, Some(3.1));
    assert_eq!(r.voltage_v, None);
}

#[test]
fn a_flag_beats_a_reading_which_beats_the_site() {
    let s = site::demo().unwrap();
    let found = tank_input::site_tank(&s, "TK-1", None).unwrap();
    let model = Model::PowerLaw { k: 12.0, n: 0.3 };
    let none = TankReadings::default();
    let from_site = tank_input::request(Some(found), &none, &TankFlags::default(), model).unwrap();
    // The demo's TK-1 runs at 30 rpm = 0.5 rev/s.
    assert_eq!(from_site.speed_from, Source::Site);
    assert!((from_site.speed_rps - 0.5).abs() < 1e-12);
    // Density from the tank's product (chilli-sauce, 1120 kg/m³).
    assert_eq!(from_site.fluid.density_kg_m3, 1120.0);
    let read = TankReadings {
        speed_rps: Some(0.4),
        ..TankReadings::default()
    };
    let from_reading =
        tank_input::request(Some(found), &read, &TankFlags::default(), model).unwrap();
    assert_eq!(from_reading.speed_from, Source::Reading);
    let flags = TankFlags {
        speed_rps: Some(0.3),
        ..TankFlags::default()
    };
    let from_flag = tank_input::request(Some(found), &read, &flags, model).unwrap();
    assert_eq!(
        (from_flag.speed_from, from_flag.speed_rps),
        (Source::Flag, 0.3)
    );
}

#[test]
fn a_site_ribbon_gets_its_kp_from_the_rieger_correlation() {
    let text = site::DEMO_TOML.replacen(
        "impeller = \"anchor\"",
        "impeller = \"helical-ribbon\"\nribbon_height = \"1.5 m\"\nribbon_pitch = \"1.6 m\"\n\
         ribbon_width = \"170 mm\"\nribbon_blades = 2",
        1,
    );
    let s = site::load_str(&text, "t.toml").unwrap();
    let found = tank_input::site_tank(&s, "TK-1", None).unwrap();
    let model = Model::PowerLaw { k: 12.0, n: 0.3 };
    let req = tank_input::request(
        Some(found),
        &TankReadings::default(),
        &TankFlags::default(),
        model,
    )
    .unwrap();
    let curve = req.vessel.power_curve().unwrap();
    assert_eq!(curve.kp.source, ConstantSource::RiegerCorrelation);
    // Rieger et al. (1988) as in fluids.mixing.Kp_helical_ribbon_Rieger, worked here:
    // D 1.7, T 1.8 (c = 0.05), h 1.5, p 1.6, w 0.17, two blades:
    // 82.8·(1.5/1.7)·(0.05/1.7)^−0.38·(1.6/1.7)^−0.35·(0.17/1.7)^0.2·2^0.78.
    let want = 82.8
        * (1.5f64 / 1.7)
        * (0.05f64 / 1.7).powf(-0.38)
        * (1.6f64 / 1.7).powf(-0.35)
        * (0.17f64 / 1.7).powf(0.2)
        * 2f64.powf(0.78);
    assert!((curve.kp.spread.value - want).abs() / want < 1e-12);
}

#[test]
fn the_answer_carries_what_the_tank_view_draws() {
    let s = site::demo().unwrap();
    let found = tank_input::site_tank(&s, "TK-2", None).unwrap();
    let model = Model::Bingham {
        tau0: 40.0,
        mu_p: 0.05,
    };
    let flags = TankFlags {
        speed_rps: Some(0.7),
        ..TankFlags::default()
    };
    let req = tank_input::request(Some(found), &TankReadings::default(), &flags, model).unwrap();
    let a = tank::analyse(&req).unwrap();
    // The chart spans the regimes and today's point, with Np falling as Re rises.
    let (first, last) = (a.chart[0], a.chart[a.chart.len() - 1]);
    assert!(first.0 < a.operating.point.reynolds && a.operating.point.reynolds < last.0);
    assert!(a.chart.windows(2).all(|w| w[1].1 <= w[0].1));
    assert_eq!(a.curve.regime(first.0), Regime::Laminar);
    assert_eq!(a.curve.regime(last.0), Regime::Turbulent);
    // Limits from the demo's nameplate: 4 kW motor, 600 N·m gearbox.
    assert_eq!(a.operating.motor.unwrap().limit, 4000.0);
    assert_eq!(a.operating.gearbox.unwrap().limit, 600.0);
    // The cavern falls short of the 2.4 m wall at this speed: a stagnant finding.
    let c = a.cavern.unwrap();
    assert!(c.diameter_m < 2.4);
    assert!(
        a.findings
            .iter()
            .any(|f| matches!(f, TankFinding::Stagnant { .. }))
    );
    assert!(a.speed_to_wall_rps().unwrap() > 0.7);
}
