//! The catalogue and `NAME=VALUE UNIT` parsing, against unit definitions.

use super::*;

#[test]
fn names_values_and_units_parse_to_si() {
    // 1 bar = 100 000 Pa exactly (NIST SP 811, 2008, Appendix B).
    let r = parse_reading_arg("discharge-pressure=6.2 bar").unwrap();
    assert_eq!(
        (r.kind.name, r.raw.as_str()),
        ("discharge-pressure", "6.2 bar")
    );
    assert!((r.value_si - 620_000.0).abs() < 1e-6);
    // 1 rpm = 2π/60 rad/s, by definition of the revolution.
    let r = parse_reading_arg("agitator_speed = 60 rpm").unwrap();
    assert!((r.value_si - std::f64::consts::TAU).abs() < 1e-12);
    // T/K = t/°C + 273.15 (SI Brochure, 9th ed., 2.3.1).
    let r = parse_reading_arg("Temp=25 C").unwrap();
    assert_eq!(r.kind.name, "temperature");
    assert!((r.value_si - 298.15).abs() < 1e-9);
    // A bare number is the dimension's default unit: bar for pressure.
    let r = parse_reading_arg("suction=-0.3").unwrap();
    assert!((r.value_si + 30_000.0).abs() < 1e-6);
}

#[test]
fn unknown_name_lists_what_is_accepted() {
    let err = parse_reading_arg("pressure=3 bar").unwrap_err();
    let msg = err.to_string();
    assert!(matches!(err, ReadingError::UnknownName { .. }));
    assert!(
        msg.contains("'pressure'") && msg.contains("discharge-pressure, line-pressure"),
        "{msg}"
    );
    for k in CATALOGUE {
        assert!(msg.contains(k.name), "{msg} misses {}", k.name);
    }
}

#[test]
fn bad_value_gives_the_units_message() {
    let err = parse_reading_arg("flow=12 bar").unwrap_err();
    assert!(
        matches!(err, ReadingError::Value { name: "flow", .. }),
        "{err}"
    );
    assert!(
        err.to_string().starts_with("flow: '12 bar' is a pressure"),
        "{err}"
    );
    let err = parse_reading_arg("density=").unwrap_err();
    assert!(matches!(err, ReadingError::Value { .. }), "{err}");
}

#[test]
fn shape_and_sign_are_checked() {
    assert!(matches!(
        parse_reading_arg("flow 12"),
        Err(ReadingError::Shape { .. })
    ));
    let err = parse_reading_arg("motor-current=-3 A").unwrap_err();
    assert_eq!(
        err.to_string(),
        "motor-current: '-3 A' is negative; a current reading must be zero or more"
    );
    assert!(parse_reading_arg("density=0").is_err());
    assert!(parse_reading_arg("rest-time=0 s").is_ok());
}

#[test]
fn catalogue_names_and_aliases_are_unique_and_file_safe() {
    let mut seen = std::collections::HashSet::new();
    for k in CATALOGUE {
        for n in std::iter::once(&k.name).chain(k.aliases) {
            assert!(seen.insert(*n), "{n} twice");
            assert!(n.chars().all(|c| c.is_ascii_lowercase() || c == '-'), "{n}");
        }
        assert!(!k.help.is_empty());
    }
}

// Regressions from fuzzing: "1<DEL>2 bar" was cleaned to "12 bar" and saved.
#[test]
fn control_and_format_characters_in_a_value_are_refused() {
    for text in [
        "discharge=1\u{7f}2 bar",
        "flow=3\u{1b}[0m0 m3/h",
        "flow=12\u{200b}5 m3/h",
        "flow=12\u{202e}5 m3/h",
    ] {
        let err = parse_reading_arg(text).unwrap_err();
        assert!(
            matches!(err, ReadingError::HiddenCharacter { .. }),
            "{text:?}: {err}"
        );
        assert!(
            err.to_string()
                .contains("invisible control or format character")
        );
    }
    assert_eq!(parse_reading_arg("flow=12 m3/h").unwrap().raw, "12 m3/h");
}

#[test]
fn a_misspelt_name_gets_the_nearest_one() {
    let err = parse_reading_arg("dischrage=6 bar")
        .unwrap_err()
        .to_string();
    assert!(err.contains("did you mean 'discharge-pressure'?"), "{err}");
}
