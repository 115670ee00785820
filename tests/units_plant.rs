//! Readings as typed on a plant floor: gauge and absolute pressure marks, vacuum, US and
//! imperial gallons, durations in hours and minutes, temperatures near absolute zero.

use rheoside::readings::{ReadingError, parse_reading_arg, parse_reading_arg_at};
use rheoside::units::{
    self, Dimension, PressureBasis, STANDARD_ATMOSPHERE_PA, UnitError, UnitSystem,
    parse_gauge_pressure,
};

/// psi = lbf/in² = 6894.757 293 168 Pa (NIST SP 811, 2008, App. B.8, from the exact lbf, in).
const PSI: f64 = 6_894.757_293_168;

fn close(a: f64, b: f64) -> bool {
    (a - b).abs() <= 1e-9 * b.abs().max(1.0)
}

// Source: "g" marks gauge, "a" absolute; gauge = absolute − atmospheric (definition of gauge
// pressure); standard atmosphere 101 325 Pa (NIST SP 811, App. B.8).
#[test]
fn psig_and_barg_are_gauge_and_psia_bara_subtract_the_atmosphere() {
    let g = parse_gauge_pressure("90 psig", STANDARD_ATMOSPHERE_PA).unwrap();
    assert!(close(g.gauge_pa, 90.0 * PSI) && g.basis == PressureBasis::Gauge);
    let g = parse_gauge_pressure("6.2 barg", STANDARD_ATMOSPHERE_PA).unwrap();
    assert!(close(g.gauge_pa, 620_000.0));
    let g = parse_gauge_pressure("450 kPa(g)", STANDARD_ATMOSPHERE_PA).unwrap();
    assert!(close(g.gauge_pa, 450_000.0));
    // 105 psia = 723 949.5 Pa absolute; minus 101 325 Pa = 622 624.5 Pa gauge.
    let g = parse_gauge_pressure("105 psia", STANDARD_ATMOSPHERE_PA).unwrap();
    assert!(close(g.gauge_pa, 105.0 * PSI - 101_325.0), "{g:?}");
    assert!(matches!(g.basis, PressureBasis::Absolute { .. }));
    // At a site whose atmosphere is 95 kPa: 7.2 bara = 720 000 − 95 000 = 625 000 Pa gauge.
    let g = parse_gauge_pressure("7.2 bara", 95_000.0).unwrap();
    assert!(close(g.gauge_pa, 625_000.0));
    // A plain unit is the field's own (gauge) basis.
    let g = parse_gauge_pressure("6.2 bar", STANDARD_ATMOSPHERE_PA).unwrap();
    assert_eq!(g.basis, PressureBasis::AsField);
}

// Source: a gauge pressure cannot be below −1 atmosphere (absolute zero pressure).
#[test]
fn minus_three_bar_gauge_is_refused_and_a_deep_vacuum_is_not() {
    let err = parse_gauge_pressure("-3 bar", STANDARD_ATMOSPHERE_PA).unwrap_err();
    assert!(matches!(err, UnitError::BelowVacuum { .. }), "{err}");
    assert!(err.to_string().contains("below vacuum"), "{err}");
    let err = parse_reading_arg("discharge-pressure=-3 bar").unwrap_err();
    assert!(matches!(err, ReadingError::Value { .. }), "{err}");
    assert!(
        err.to_string()
            .starts_with("discharge-pressure: '-3 bar' is below vacuum")
    );
    // −1.00 bar = −100 kPa is above −101.325 kPa: a suction under deep vacuum.
    assert!(close(
        parse_reading_arg("suction=-1 bar").unwrap().value_si,
        -100_000.0
    ));
    assert!(parse_reading_arg("suction=-1.02 bar").is_err());
    assert!(matches!(
        parse_gauge_pressure("-2 psia", STANDARD_ATMOSPHERE_PA),
        Err(UnitError::NegativeAbsolute { .. })
    ));
    // A difference is not a gauge reading: marks stay refused there.
    let err = parse_reading_arg("pressure-drop=3 psig")
        .unwrap_err()
        .to_string();
    assert!(err.contains("marks gauge or absolute pressure"), "{err}");
}

#[test]
fn an_absolute_reading_says_in_the_record_what_was_subtracted() {
    let r = parse_reading_arg_at("discharge=7.2 bara", 95_000.0).unwrap();
    assert!(close(r.value_si, 625_000.0));
    assert_eq!(r.raw, "7.2 bara");
    let note = r
        .conversion_note()
        .expect("a note for an absolute pressure");
    assert!(
        note.contains("absolute") && note.contains("95 kPa"),
        "{note}"
    );
    assert!(
        parse_reading_arg("discharge=7.2 barg")
            .unwrap()
            .conversion_note()
            .is_none()
    );
}

#[test]
fn record_journals_the_absolute_conversion_beside_the_reading() {
    let dir = tempfile::tempdir().unwrap();
    let out = assert_cmd::Command::cargo_bin("rheoside")
        .unwrap()
        .env_remove("RHEOSIDE_LOG_DIR")
        .args([
            "record",
            "--equipment",
            "VIS-A",
            "--reading",
            "discharge=105 psia",
        ])
        .arg("--log-dir")
        .arg(dir.path())
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let path = std::fs::read_dir(dir.path())
        .unwrap()
        .next()
        .unwrap()
        .unwrap()
        .path();
    let text = std::fs::read_to_string(path).unwrap();
    assert!(text.contains("\"kind\":\"finding\""), "{text}");
    assert!(text.contains("101.325 kPa was subtracted"), "{text}");
}

// Source: the site's own atmospheric pressure is used (here 95 kPa, an invented altitude).
#[test]
fn the_site_sets_its_atmospheric_pressure() {
    let demo = include_str!("../site-configs/demo.toml");
    let text = demo.replacen(
        "unit_system = \"si\"",
        "unit_system = \"si\"\natmospheric_pressure = \"95 kPa\"",
        1,
    );
    let site = rheoside::site::load_str(&text, "t.toml").unwrap();
    assert!(close(site.atmospheric_pressure_pa, 95_000.0));
    assert!(close(
        rheoside::site::demo().unwrap().atmospheric_pressure_pa,
        101_325.0
    ));
    let bad = demo.replacen(
        "unit_system = \"si\"",
        "unit_system = \"si\"\natmospheric_pressure = \"3 bar\"",
        1,
    );
    let err = rheoside::site::load_str(&bad, "t.toml")
        .unwrap_err()
        .to_string();
    assert!(err.contains("atmospheric_pressure"), "{err}");
}

// Source: US gallon = 231 in³ = 3.785 411 784 L; imperial gallon = 4.546 09 L (NIST SP 811,
// App. B.8).
#[test]
fn gpm_is_us_gallons_and_igpm_imperial() {
    let us = units::parse("100 gpm", Dimension::Flow).unwrap();
    assert!(close(us, 100.0 * 3.785_411_784e-3 / 60.0));
    let imp = units::parse("100 igpm", Dimension::Flow).unwrap();
    assert!(close(imp, 100.0 * 4.546_09e-3 / 60.0));
    let err = units::parse("3 bar", Dimension::Flow)
        .unwrap_err()
        .to_string();
    assert!(
        err.contains("gpm (US gallons per minute)") && err.contains("igpm"),
        "{err}"
    );
}

// Regression: rest-time=62 h was shown as "2.23e5 s".
#[test]
fn durations_show_as_hours_and_minutes_and_parse_back() {
    let s = parse_reading_arg("rest-time=62 h").unwrap().value_si;
    assert_eq!(
        units::format(s, Dimension::Time, UnitSystem::Si),
        "62 h 0 min"
    );
    let back = units::parse("62 h 30 min", Dimension::Time).unwrap();
    assert!(close(back, 62.5 * 3600.0));
    assert_eq!(
        units::format(back, Dimension::Time, UnitSystem::UsCustomary),
        "62 h 30 min"
    );
    assert_eq!(
        units::format(600.0, Dimension::Time, UnitSystem::Si),
        "10 min"
    );
}

// Regression: a temperature near 0 K showed as "-460 °F", which the parser refuses.
#[test]
fn a_displayed_temperature_near_absolute_zero_parses_back() {
    for k in [0.0, 1e-6, 0.001, 0.002, 0.004, 0.1, 0.3] {
        for system in [UnitSystem::Si, UnitSystem::UsCustomary] {
            let shown = units::format(k, Dimension::Temperature, system);
            let back = units::parse(&shown, Dimension::Temperature)
                .unwrap_or_else(|e| panic!("{k} K shown as {shown}: {e}"));
            assert!(
                back >= 0.0 && (back - k).abs() < 0.6,
                "{k} K → {shown} → {back}"
            );
        }
    }
}
