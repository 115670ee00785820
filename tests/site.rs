//! `rheoside check-site` over the bundled demo and over tests/invalid-sites/ (one file per
//! kind of mistake), plus properties of the loader on garbage input.
//!
//! Expected positions were counted by hand in each file (line/column of the value, or of
//! the table header for a missing field), not copied from the program's output.

use assert_cmd::Command;
use proptest::prelude::*;
use rheoside::site::{self, ErrorKind};

/// (file, every expected stderr line before the count line).
const CASES: &[(&str, &[&str])] = &[
    (
        "syntax-error.toml",
        &["10:10: TOML syntax error: string values must be quoted, expected literal string"],
    ),
    (
        "unknown-key.toml",
        &[
            "13:1: field 'line.fitings_length': '4 m' — unknown key in [[line]]; \
           did you mean 'fittings_length'?",
        ],
    ),
    (
        "missing-field.toml",
        &["7:1: missing field 'design_pressure' in [[line]] 'L-1' — \
           give a pressure with its unit, e.g. '6 bar'"],
    ),
    (
        "wrong-dimension.toml",
        &[
            "12:19: field 'line.design_pressure': '6 kg/m3' — that is a density, but a pressure \
           is expected here; accepted: Pa, kPa, MPa, bar, mbar, psi, inH2O, mH2O, dyn/cm2, \
           lbf/100ft2",
        ],
    ),
    (
        "not-a-number.toml",
        &[
            "10:10: field 'line.length': 'long' — not a number; give a length with its unit, \
           e.g. '150 mm'",
        ],
    ),
    (
        "restart-settings.toml",
        &[
            "13:19: field 'line.gel_cold_factor': '0.5' — must be between 1 and 100",
            "14:17: field 'line.back_pressure': '-1 bar' — must not be negative; give a \
           pressure, e.g. '6 bar'",
        ],
    ),
    (
        "out-of-range.toml",
        &[
            "9:18: field 'line.inner_diameter': '-50 mm' — must be between 0.002 and 3 m; \
           give a length, e.g. '150 mm'",
        ],
    ),
    (
        "duplicate-id.toml",
        &[
            "15:6: field 'line.id': 'L-1' — already used by the [[line]] at line 8; equipment \
           ids must be unique across viscometers, lines, pumps and tanks",
        ],
    ),
    (
        "dangling-reference.toml",
        &["17:9: field 'pump.feeds': 'L-9' — no [[line]] has this id; known: L-1"],
    ),
    (
        "bad-id.toml",
        &[
            "8:6: field 'line.id': 'L 1' — ids may use only letters A-Z a-z, digits 0-9, '.', \
           '_' and '-' (found ' ')",
        ],
    ),
    (
        "wrong-type.toml",
        &[
            "10:10: field 'line.length': '20' — expected a length as text with its unit, \
           e.g. '150 mm', found an integer",
        ],
    ),
    (
        "curve-not-increasing.toml",
        &[
            "23:12: field 'pump.curve.flow': '8 m3/h' — water curve flow must strictly increase \
           from point to point (the point before has 10.0 m3/h)",
        ],
    ),
    ("several-errors.toml", SEVERAL),
];

/// Fourteen mistakes of different kinds in one file, all reported in one run, in file order.
const SEVERAL: &[&str] = &[
    "5:15: field 'site.unit_system': 'metric' — not accepted here; use one of 'si', \
     'us-customary'",
    "14:13: field 'product.gel.long_rest': '40 Pa' — must be at least the initial static \
     yield stress: gel builds up at rest",
    "21:14: field 'viscometer.cup_radius': '14 mm' — must be larger than bob_radius: the \
     product fills the gap between them",
    "31:19: field 'line.design_pressure': '6 kg' — unknown unit 'kg' for a pressure; \
     accepted: Pa, kPa, MPa, bar, mbar, psi, inH2O, mH2O, dyn/cm2, lbf/100ft2",
    "34:6: field 'pump.id': 'L-1' — already used by the [[line]] at line 27; equipment ids \
     must be unique across viscometers, lines, pumps and tanks",
    "38:16: field 'pump.displacement': '0.4 L' — not a volume per revolution; give the volume \
     per revolution, e.g. '0.35 L/rev' (L, m3 or gal per rev)",
    "41:1: missing field 'diameter' in [[tank]] — give a length with its unit, e.g. '150 mm'",
    "42:6: field 'tank.id': 'TK/1' — ids may use only letters A-Z a-z, digits 0-9, '.', '_' \
     and '-' (found '/')",
    "43:11: field 'tank.product': 'test-paste' — no [[product]] has this name; known: \
     test-sauce",
    "44:1: field 'tank.diamter': '2 m' — unknown key in [[tank]]; did you mean 'diameter'?",
    "46:11: field 'tank.baffled': 'yes' — expected true or false (without quotes), found a \
     string",
    "47:12: field 'tank.impeller': 'paddle' — not accepted here; use one of 'rushton-turbine', \
     'pitched-blade-turbine', 'propeller', 'anchor', 'helical-ribbon', 'hydrofoil'",
    "52:20: field 'tank.motor_efficiency': '1.2' — must be above 0 and at most 1 (e.g. 0.85 \
     or '85 %')",
    "54:3: field 'pumps': '[[pumps]]' — unknown table in the file; did you mean 'pump'?",
];

fn check_site(path: &str) -> std::process::Output {
    let mut cmd = Command::cargo_bin("rheoside").expect("binary builds");
    cmd.current_dir(env!("CARGO_MANIFEST_DIR"))
        .args(["check-site", path])
        .env_remove("RHEOSIDE_LOG_DIR");
    cmd.output().expect("runs")
}

#[test]
fn every_invalid_site_reports_exact_positions_and_exits_2() {
    for (file, lines) in CASES {
        let path = format!("tests/invalid-sites/{file}");
        let out = check_site(&path);
        assert_eq!(out.status.code(), Some(2), "{file}");
        assert!(out.stdout.is_empty(), "{file}: nothing on stdout");
        let mut expected: Vec<String> = lines.iter().map(|l| format!("{path}:{l}")).collect();
        let noun = if lines.len() == 1 { "error" } else { "errors" };
        expected.push(format!(
            "rheoside: {} {noun} in the site config",
            lines.len()
        ));
        let stderr = String::from_utf8(out.stderr).expect("UTF-8");
        assert_eq!(stderr.lines().collect::<Vec<_>>(), expected, "{file}");
    }
}

#[test]
fn every_file_in_invalid_sites_has_a_case() {
    let dir = concat!(env!("CARGO_MANIFEST_DIR"), "/tests/invalid-sites");
    let mut files: Vec<String> = std::fs::read_dir(dir)
        .expect("folder exists")
        .map(|e| e.expect("entry").file_name().to_string_lossy().into_owned())
        .collect();
    files.sort();
    let mut cased: Vec<String> = CASES.iter().map(|(f, _)| f.to_string()).collect();
    cased.sort();
    assert_eq!(files, cased);
}

#[test]
fn several_errors_are_of_distinct_kinds() {
    let text = include_str!("invalid-sites/several-errors.toml");
    let errs = site::load_str(text, "x.toml").expect_err("invalid").0;
    let kinds = [
        ErrorKind::UnknownKey,
        ErrorKind::Missing,
        ErrorKind::WrongType,
        ErrorKind::BadValue,
        ErrorKind::Duplicate,
        ErrorKind::Dangling,
        ErrorKind::BadId,
    ];
    for k in kinds {
        assert!(
            errs.iter().any(|e| e.kind == k),
            "{k:?} missing from {errs:#?}"
        );
    }
}

#[test]
fn demo_passes_and_fits_one_screen() {
    let out = check_site("site-configs/demo.toml");
    assert_eq!(out.status.code(), Some(0));
    assert!(out.stderr.is_empty());
    let stdout = String::from_utf8(out.stdout).expect("UTF-8");
    let lines: Vec<&str> = stdout.lines().collect();
    assert!(lines.len() <= 24, "{} lines:\n{stdout}", lines.len());
    for l in &lines {
        assert!(l.chars().count() <= 80, "too wide: {l:?}");
        assert!(!l.ends_with('~'), "cut short: {l:?}");
    }
    // Every piece of equipment is listed by id.
    for id in ["VIS-A", "VIS-B", "L-1", "L-2", "P-1", "P-2", "TK-1", "TK-2"] {
        assert!(lines.iter().any(|l| l.trim_start().starts_with(id)), "{id}");
    }
    assert!(
        stdout.contains("Isolate and lock out"),
        "carries the safety note"
    );
}

#[test]
fn unreadable_file_is_one_error_without_a_position() {
    let out = check_site("tests/invalid-sites/no-such-file.toml");
    assert_eq!(out.status.code(), Some(2));
    let stderr = String::from_utf8(out.stderr).expect("UTF-8");
    let first = stderr.lines().next().unwrap_or_default();
    // Regression: a missing file showed a ':0:0' position it does not have.
    let want = "tests/invalid-sites/no-such-file.toml: cannot read the site config: not found";
    assert!(first.starts_with(want), "{first}");
}

/// Keys whose value, when garbled, can only make that one line wrong (nothing else in the
/// demo is checked against them).
const SELF_CONTAINED_KEYS: &[&str] = &[
    "density",
    "design_pressure",
    "motor_rating",
    "rated_speed",
    "motor_voltage",
];

proptest! {
    #[test]
    fn garbage_never_panics_and_positions_stay_in_the_text(text in "\\PC{0,400}") {
        if let Err(errs) = site::load_str(&text, "g.toml") {
            prop_assert!(!errs.0.is_empty(), "a refusal always says why");
            let lines = text.split('\n').count();
            for e in errs.0 {
                prop_assert!(e.line >= 1 && e.line <= lines, "{e}");
                prop_assert!(e.column >= 1, "{e}");
            }
        }
    }

    #[test]
    fn a_damaged_demo_never_panics(cut in 0usize..6000, insert in "[\\[\\]{}=\"'#.,a-z0-9 \\n]{0,8}") {
        let demo = site::DEMO_TOML;
        let at = demo.char_indices().map(|(i, _)| i).nth(cut % demo.chars().count()).unwrap_or(0);
        let text = format!("{}{insert}{}", &demo[..at], &demo[at..]);
        if let Err(errs) = site::load_str(&text, "d.toml") {
            prop_assert!(!errs.0.is_empty(), "a refusal always says why");
        }
    }

    #[test]
    fn a_garbled_value_is_reported_on_its_own_line(
        which in 0usize..1000,
        value in "[a-zA-Z0-9 %./-]{0,12}",
    ) {
        let demo = site::DEMO_TOML;
        let targets: Vec<usize> = demo
            .lines()
            .enumerate()
            .filter(|(_, l)| SELF_CONTAINED_KEYS.iter().any(|k| l.starts_with(&format!("{k} ="))))
            .map(|(i, _)| i)
            .collect();
        let target = targets[which % targets.len()];
        let text: Vec<String> = demo
            .lines()
            .enumerate()
            .map(|(i, l)| match (i == target, l.split_once('=')) {
                (true, Some((key, _))) => format!("{key}= \"{value}\""),
                _ => l.to_string(),
            })
            .collect();
        if let Err(errs) = site::load_str(&text.join("\n"), "v.toml") {
            for e in errs.0 {
                prop_assert_eq!(e.line, target + 1, "{}", e);
            }
        }
    }
}
