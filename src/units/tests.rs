//! Unit tests: the table's consistency, number scanning, normalisation, significant
//! figures, echo of typed text, the fixed facts other modules rely on (default and display
//! units), and display in each unit system.

use super::dimension::Dimension;
use super::parse::{comma_suggestion, echo, normalize, split_number};
use super::table::{TABLE, find};
use super::{UnitSystem, display_unit, format, format_in, parse, parse_with_default, significant};

#[test]
fn every_alias_is_stored_normalised() {
    for row in TABLE {
        assert_eq!(normalize(row.alias), row.alias, "alias {:?}", row.alias);
    }
}

#[test]
fn no_spelling_means_two_units() {
    for (i, a) in TABLE.iter().enumerate() {
        for b in &TABLE[i + 1..] {
            if a.alias.is_empty() {
                continue; // the bare number is per dimension by design
            }
            assert_ne!(a.alias, b.alias, "{:?} is in the table twice", a.alias);
        }
    }
}

#[test]
fn every_named_unit_is_in_the_table() {
    for dim in Dimension::ALL {
        let mut named = dim.accepted_units().to_vec();
        named.extend([dim.si_unit(), dim.default_unit()]);
        named.extend([UnitSystem::Si, UnitSystem::UsCustomary].map(|s| display_unit(dim, s)));
        for unit in named {
            assert!(
                find(&normalize(unit), dim).is_some(),
                "{unit:?} for {dim:?}"
            );
        }
        assert!(
            dim.accepted_units().contains(&dim.default_unit()),
            "{dim:?} default"
        );
    }
}

#[test]
fn si_unit_rows_are_identity() {
    for dim in Dimension::ALL {
        let row = find(&normalize(dim.si_unit()), dim).expect("si unit row");
        assert_eq!((row.factor, row.offset), (1.0, 0.0), "{dim:?}");
    }
}

#[test]
fn number_scanning() {
    let cases = [
        ("12.5psi", Some(("12.5", "psi"))),
        ("+3 bar", Some(("3", " bar"))),
        ("-.5C", Some(("-.5", "C"))),
        ("\u{2212}4 C", Some(("-4", " C"))),
        ("1.2e3 Pa", Some(("1.2e3", " Pa"))),
        ("1.2E-3Pa", Some(("1.2E-3", "Pa"))),
        ("5e", Some(("5", "e"))),
        ("5.", Some(("5.", ""))),
        ("100 1/s", Some(("100", " 1/s"))),
        (".", None),
        ("-", None),
        ("+-5", None),
        ("bar", None),
    ];
    for (text, want) in cases {
        let got = split_number(text);
        let got = got.as_ref().map(|(n, r)| (n.as_str(), *r));
        assert_eq!(got, want, "{text:?}");
    }
}

#[test]
fn normalisation_of_typed_units() {
    let cases = [
        ("Pa·s", "pa.s"),
        ("Pa s", "pas"),
        ("m³/h", "m3/h"),
        ("m^3/h", "m3/h"),
        ("°C", "c"),
        ("º F", "f"),
        ("℃", "c"),
        ("s⁻¹", "s-1"),
        ("lb-ft", "lb.ft"),
        ("N*m", "n.m"),
        ("lbf/100 ft²", "lbf/100ft2"),
    ];
    for (typed, want) in cases {
        assert_eq!(normalize(typed), want, "{typed:?}");
    }
}

#[test]
fn significant_figures() {
    let cases = [
        (6.2, "6.20"),
        (62.0, "62.0"),
        (620.0, "620"),
        (1013.25, "1013"),
        (0.062, "0.0620"),
        (0.001, "0.00100"),
        (999.96, "1000"),
        (12_345.0, "1.23e4"),
        (0.000_631, "6.31e-4"),
        (-3.0, "-3.00"),
        (0.0, "0"),
        (-0.0, "0"),
    ];
    for (value, want) in cases {
        assert_eq!(significant(value), want, "{value}");
    }
}

#[test]
fn comma_suggestions() {
    assert_eq!(comma_suggestion("1,5 bar"), "1.5 bar");
    assert_eq!(comma_suggestion("1,000 Pa"), "1.000 Pa' or '1000 Pa");
    assert_eq!(comma_suggestion("1,000,000 Pa"), "1000000 Pa");
}

#[test]
fn echo_strips_controls_and_cuts_long_text() {
    assert_eq!(echo(" 12\u{1b}[31m bar\u{202e} "), "12[31m bar");
    let long = "9".repeat(100);
    let shown = echo(&long);
    assert_eq!(shown.chars().count(), 41);
    assert!(shown.ends_with('…'));
}

#[test]
fn bare_numbers_take_the_default_unit() {
    assert_eq!(parse("6.2", Dimension::Pressure).unwrap(), 6.2e5);
    assert_eq!(parse("6.2", Dimension::Stress).unwrap(), 6.2);
    assert_eq!(parse("50", Dimension::Length).unwrap(), 0.05);
    assert_eq!(parse("20", Dimension::Temperature).unwrap(), 293.15);
    assert_eq!(parse("1200", Dimension::DynamicViscosity).unwrap(), 1.2);
    assert_eq!(parse("36", Dimension::Flow).unwrap(), 0.01);
    assert_eq!(parse("0.85", Dimension::Fraction).unwrap(), 0.85);
    assert_eq!(parse("3.5", Dimension::Dimensionless).unwrap(), 3.5);
    assert_eq!(
        parse_with_default("2", Dimension::Length, "in").unwrap(),
        0.0508
    );
    assert_eq!(
        parse_with_default("2 m", Dimension::Length, "in").unwrap(),
        2.0
    );
}

#[test]
fn dimension_facts_other_modules_rely_on() {
    assert_eq!(Dimension::Pressure.name(), "pressure");
    assert_eq!(Dimension::Flow.name(), "flow");
    let si = [
        (Dimension::Pressure, "Pa"),
        (Dimension::Flow, "m3/s"),
        (Dimension::Temperature, "K"),
        (Dimension::Speed, "rad/s"),
        (Dimension::Stress, "Pa"),
    ];
    for (dim, unit) in si {
        assert_eq!(dim.si_unit(), unit);
    }
    let defaults = [
        (Dimension::Pressure, "bar"),
        (Dimension::Length, "mm"),
        (Dimension::Speed, "rpm"),
        (Dimension::Temperature, "°C"),
        (Dimension::DynamicViscosity, "mPa.s"),
        (Dimension::Flow, "m3/h"),
        (Dimension::Stress, "Pa"),
        (Dimension::Time, "s"),
    ];
    for (dim, unit) in defaults {
        assert_eq!(dim.default_unit(), unit);
    }
    let shown = [
        (Dimension::Pressure, "bar", "psi"),
        (Dimension::Flow, "m3/h", "gpm"),
        (Dimension::Length, "mm", "in"),
        (Dimension::Temperature, "°C", "°F"),
        (Dimension::DynamicViscosity, "mPa.s", "cP"),
        (Dimension::Density, "kg/m3", "lb/ft3"),
        (Dimension::Stress, "Pa", "lbf/100ft2"),
        (Dimension::Power, "kW", "hp"),
        (Dimension::Torque, "N.m", "lbf.ft"),
    ];
    for (dim, si, us) in shown {
        assert_eq!(display_unit(dim, UnitSystem::Si), si, "{dim:?}");
        assert_eq!(display_unit(dim, UnitSystem::UsCustomary), us, "{dim:?}");
    }
}

#[test]
fn unit_system_reads_from_toml() {
    #[derive(serde::Deserialize)]
    struct Site {
        units: UnitSystem,
    }
    let us: Site = toml::from_str("units = \"us-customary\"").unwrap();
    assert_eq!(us.units, UnitSystem::UsCustomary);
    let si: Site = toml::from_str("units = \"si\"").unwrap();
    assert_eq!(si.units, UnitSystem::Si);
    assert_eq!(UnitSystem::default(), UnitSystem::Si);
    assert!(toml::from_str::<Site>("units = \"imperial\"").is_err());
}

#[test]
fn display_in_each_system() {
    let cases = [
        (6.2e5, Dimension::Pressure, UnitSystem::Si, "6.20 bar"),
        (
            6.2e5,
            Dimension::Pressure,
            UnitSystem::UsCustomary,
            "89.9 psi",
        ), // 6.2e5/6894.757 = 89.92
        (293.15, Dimension::Temperature, UnitSystem::Si, "20.0 °C"),
        (
            293.15,
            Dimension::Temperature,
            UnitSystem::UsCustomary,
            "68.0 °F",
        ), // 20 × 1.8 + 32
        (
            100.0 / 3600.0,
            Dimension::Flow,
            UnitSystem::UsCustomary,
            "440 gpm",
        ),
        (
            0.478_802_59,
            Dimension::Stress,
            UnitSystem::UsCustomary,
            "1.00 lbf/100ft2",
        ),
        (12.0, Dimension::Stress, UnitSystem::Si, "12.0 Pa"),
        (
            1.2,
            Dimension::DynamicViscosity,
            UnitSystem::Si,
            "1200 mPa.s",
        ),
        (
            std::f64::consts::TAU * 10.0,
            Dimension::Speed,
            UnitSystem::Si,
            "600 rpm",
        ),
        (0.85, Dimension::Fraction, UnitSystem::Si, "85.0 %"),
        (1.5, Dimension::Dimensionless, UnitSystem::Si, "1.50"),
        (-0.0, Dimension::Pressure, UnitSystem::Si, "0 bar"),
        (f64::NAN, Dimension::Pressure, UnitSystem::Si, "—"),
        (
            f64::INFINITY,
            Dimension::Length,
            UnitSystem::UsCustomary,
            "—",
        ),
    ];
    for (si, dim, system, want) in cases {
        assert_eq!(format(si, dim, system), want, "{si} {dim:?} {system:?}");
    }
    assert_eq!(
        format_in(1.0, Dimension::Length, "furlong"),
        "1.00 m",
        "unknown unit falls back to SI"
    );
    assert_eq!(format_in(1e5, Dimension::Pressure, "PSI"), "14.5 PSI");
}
