//! `rheoside report`: the handover from journals written here through the journal API
//! with a fixed clock, and replay (load + replay = the state built live, record by record).
//!
//! Expectations come from the report's written requirements (sections, CSV columns, JSON
//! keys, byte-identical reruns, torn tails reported) and from outside facts named beside
//! each check (unit definitions, the API viscometer relation, offset arithmetic).

use assert_cmd::Command;
use chrono::{DateTime, Duration, FixedOffset, Utc};
use rheoside::journal::*;
use rheoside::site::Site;
use std::path::{Path, PathBuf};

#[path = "report/replay.rs"]
mod replay;

const SITE: &str = "marrowdale-u4";
const STEP_S: i64 = 90;

fn demo() -> Site {
    rheoside::site::demo().expect("the demo site loads")
}

/// 2026-03-10T05:00:00Z; the plant's clock reads +01:00.
fn start() -> Stamp {
    Stamp {
        utc: "2026-03-10T05:00:00Z".parse::<DateTime<Utc>>().unwrap(),
        offset: FixedOffset::east_opt(3600).unwrap(),
    }
}

fn writer(dir: &Path, operator: &str) -> JournalWriter {
    let new = NewSession {
        log_dir: dir.to_path_buf(),
        site_id: SITE.into(),
        site_source: "bundled demo site (invented plant)".into(),
        operator: operator.into(),
    };
    let clock = StepClock::new(start(), Duration::seconds(STEP_S));
    JournalWriter::create(&new, Box::new(clock)).expect("journal created")
}

fn reading(text: &str) -> Payload {
    rheoside::readings::parse_reading_arg(text)
        .expect("reading parses")
        .payload()
}

/// A Newtonian product on the standard viscometer: dial = 0.1 × rpm (θ300 = 30).
fn newtonian_set() -> Payload {
    let rows = [(600.0, 60.0), (300.0, 30.0), (200.0, 20.5), (100.0, 10.0)];
    Payload::ViscometerSet {
        viscometer: "VIS-A".into(),
        product: "chalk-slurry".into(),
        temperature_raw: Some("20 C".into()),
        temperature_k: Some(293.15),
        rows: rows
            .iter()
            .map(|&(rpm, dial)| DialRow {
                rpm_raw: format!("{rpm}"),
                rpm,
                dial_raw: format!("{dial}"),
                dial,
            })
            .collect(),
    }
}

/// The known journal: start, two readings, a set, a saved result that disagrees with the
/// set, a note, a handover, a finding, the end.
fn known_journal(dir: &Path) -> PathBuf {
    let mut w = writer(dir, "J. Ferreira");
    w.append(Some("P-1"), reading("discharge-pressure=6.2 bar"))
        .unwrap();
    w.append(Some("TK-1"), reading("temperature=24 C")).unwrap();
    let set_seq = w.append(Some("VIS-A"), newtonian_set()).unwrap();
    let seen = serde_json::json!({ "model": "power-law", "params": { "k_pa_sn": 1.5, "n": 0.5 }, "set_seq": set_seq });
    w.append(
        None,
        Payload::Result {
            what: "flow-curve".into(),
            result_kind: None,
            from: Vec::new(),
            data: seen,
        },
    )
    .unwrap();
    w.append(
        Some("P-1"),
        Payload::Note {
            text: "seal weeping\nchecked at 06:30".into(),
        },
    )
    .unwrap();
    w.set_operator("K. Amundsen");
    let finding = Payload::Finding {
        severity: Severity::Caution,
        text: "relief valve not tagged".into(),
    };
    w.append(Some("P-1"), finding).unwrap();
    w.end_session().unwrap();
    w.path().expect("file journal").to_path_buf()
}

fn report(args: &[&str]) -> std::process::Output {
    Command::cargo_bin("rheoside")
        .unwrap()
        .arg("report")
        .args(args)
        .output()
        .unwrap()
}

fn stdout(out: &std::process::Output) -> String {
    String::from_utf8(out.stdout.clone()).expect("UTF-8 output")
}

#[test]
fn markdown_has_every_section_and_the_cautions() {
    let dir = tempfile::tempdir().unwrap();
    let path = known_journal(dir.path());
    let out = report(&[path.to_str().unwrap()]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let md = stdout(&out);
    for section in [
        "# Shift handover report",
        "## Session ",
        "### Readings (2)",
        "### Viscometer sets and flow curves (1)",
        "### Results (1)",
        "### Notes (1)",
        "### Findings noted by the operator (1)",
        "## Cautions",
    ] {
        assert!(md.contains(section), "missing {section:?} in\n{md}");
    }
    // Who, and the handover: both operators in order of appearance.
    assert!(
        md.contains("| Operators | J. Ferreira, K. Amundsen |"),
        "{md}"
    );
    // 05:00:00Z at +01:00 is 06:00:00 local (offset arithmetic).
    assert!(
        md.contains("| Started | 2026-03-10 06:00:00 +01:00 (2026-03-10 05:00:00 UTC) |"),
        "{md}"
    );
    // The second record is one clock step later: 05:01:30Z.
    assert!(
        md.contains("| 2 | 2026-03-10 06:01:30 +01:00 | 2026-03-10 05:01:30 UTC |"),
        "{md}"
    );
    // 6.2 bar = 620 kPa shown back in the SI site's bar (bar = 10^5 Pa, NIST SP 811).
    assert!(
        md.contains("| discharge-pressure | 6.2 bar | 6.20 bar |"),
        "{md}"
    );
    // A Newtonian fluid on the standard viscometer reads μ (mPa·s) = θ300 (API glossary via
    // API RP 13D): θ300 = 30, so 30 mPa·s.
    assert!(md.contains("**Newtonian**"), "{md}");
    assert!(md.contains("| μ viscosity | 30.0"), "{md}");
    assert!(md.contains("value ± 95 % interval"), "{md}");
    // The saved result claimed a power law: the report says it differs.
    assert!(md.contains("Seen at the time (record 5"), "{md}");
    assert!(md.contains("**differs** from the recomputed fit"), "{md}");
    assert!(md.contains("- **CAUTION** record 7"), "{md}");
    for caution in [
        "Isolate and lock out",
        "rated pressure of the weakest part",
        "Stop the agitator",
        "Hot product",
        "does not certify",
        "Local codes and licensed practice",
    ] {
        assert!(md.contains(caution), "caution {caution:?} missing");
    }
}

#[test]
fn csv_has_the_header_and_one_row_per_reading_and_dial_row() {
    let dir = tempfile::tempdir().unwrap();
    let path = known_journal(dir.path());
    let out = report(&["--format", "csv", path.to_str().unwrap()]);
    assert!(out.status.success());
    let text = stdout(&out);
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(
        lines[0],
        "session,seq,utc,local_time,operator,equipment,name,raw,value_si,unit,viscometer,product,rpm,row,rule,severity,sure,numbers,next_checks,caution"
    );
    // 2 spot readings + 4 dial rows, then one row per ranked finding.
    let findings = lines.iter().filter(|l| l.contains(",finding,")).count();
    assert_eq!(lines.len(), 1 + 2 + 4 + findings, "{text}");
    // 6.2 bar = 620 000 Pa (bar = 10^5 Pa, NIST SP 811); 24 °C = 297.15 K.
    assert!(
        lines[1].ends_with(",P-1,discharge-pressure,6.2 bar,620000,Pa,,,,,,,,,,"),
        "{}",
        lines[1]
    );
    assert!(
        lines[1].contains(",2026-03-10T05:01:30.000Z,2026-03-10T06:01:30.000+01:00,J. Ferreira,")
    );
    assert!(
        lines[2].contains(",temperature,24 C,297.15,K,"),
        "{}",
        lines[2]
    );
    assert!(
        lines[3].ends_with(",dial,60,60,dial,VIS-A,chalk-slurry,600,1,,,,,,"),
        "{}",
        lines[3]
    );
    assert!(
        lines[6].ends_with(",dial,10,10,dial,VIS-A,chalk-slurry,100,4,,,,,,"),
        "{}",
        lines[6]
    );
}

#[test]
fn json_keeps_its_documented_keys() {
    let dir = tempfile::tempdir().unwrap();
    let path = known_journal(dir.path());
    let out = report(&["--format", "json", path.to_str().unwrap()]);
    assert!(out.status.success());
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("one JSON object");
    let keys = |v: &serde_json::Value| -> Vec<String> {
        v.as_object().expect("object").keys().cloned().collect()
    };
    assert_eq!(
        keys(&v),
        [
            "cautions",
            "findings",
            "format",
            "format_version",
            "left_out",
            "sessions",
            "site"
        ]
    );
    let s = &v["sessions"][0];
    assert_eq!(
        keys(s),
        [
            "ended",
            "equipment",
            "findings",
            "journal",
            "last_seq",
            "notes",
            "operators",
            "problems",
            "readings",
            "records",
            "results",
            "resumptions",
            "session",
            "sets",
            "site_id",
            "site_source",
            "started",
            "torn_tail"
        ]
    );
    assert_eq!(
        keys(&s["readings"][0]),
        [
            "dimension",
            "equipment",
            "local",
            "name",
            "operator",
            "raw",
            "seq",
            "unit",
            "utc",
            "value_si"
        ]
    );
    assert_eq!(
        keys(&s["sets"][0]),
        [
            "apparent_viscosity",
            "chosen_by_hand",
            "equipment",
            "fit",
            "fit_error",
            "limits",
            "local",
            "operator",
            "product",
            "rows",
            "seen",
            "seq",
            "temperature_k",
            "temperature_raw",
            "utc",
            "viscometer"
        ]
    );
    assert_eq!(s["readings"][0]["value_si"], 620000.0);
    assert_eq!(s["sets"][0]["fit"]["model"], "newtonian");
    // μ = θ300 mPa·s = 0.030 Pa·s (API RP 13D glossary), to 1 %.
    let mu = s["sets"][0]["fit"]["params"]["mu_pa_s"].as_f64().unwrap();
    assert!((mu - 0.030).abs() < 0.0003, "mu {mu}");
    assert_eq!(s["sets"][0]["seen"][0]["agreement"], "differs");
    assert_eq!(s["results"][0]["set_seq"], 4);
    assert_eq!(s["findings"][0]["severity"], "caution");
    assert_eq!(s["started"]["local"], "2026-03-10T06:00:00.000+01:00");
    assert_eq!(v["cautions"].as_array().map(Vec::len), Some(6));
}

#[test]
fn the_same_journals_give_the_same_bytes() {
    let dir = tempfile::tempdir().unwrap();
    let a = known_journal(&dir.path().join("a"));
    let b = known_journal(&dir.path().join("b"));
    for format in ["md", "csv", "json"] {
        let args = ["--format", format, b.to_str().unwrap(), a.to_str().unwrap()];
        let first = report(&args);
        let second = report(&args);
        assert!(first.status.success());
        assert_eq!(first.stdout, second.stdout, "format {format}");
    }
}

#[test]
fn several_journals_are_listed_by_start_time() {
    let dir = tempfile::tempdir().unwrap();
    let early = known_journal(&dir.path().join("early"));
    let mut late_writer = {
        let new = NewSession {
            log_dir: dir.path().join("late"),
            site_id: SITE.into(),
            site_source: "demo".into(),
            operator: "T. Oduya".into(),
        };
        let later = Stamp {
            utc: start().utc + Duration::hours(8),
            offset: start().offset,
        };
        JournalWriter::create(&new, Box::new(StepClock::new(later, Duration::seconds(60)))).unwrap()
    };
    late_writer.end_session().unwrap();
    let late = late_writer.path().unwrap().to_path_buf();
    let md = stdout(&report(&[late.to_str().unwrap(), early.to_str().unwrap()]));
    let first = md.find("J. Ferreira").expect("early session shown");
    let second = md.find("T. Oduya").expect("late session shown");
    assert!(
        first < second,
        "sessions must follow start time, not argument order"
    );
}

#[test]
fn a_torn_journal_is_reported_and_the_good_records_used() {
    let dir = tempfile::tempdir().unwrap();
    let path = known_journal(dir.path());
    let mut bytes = std::fs::read(&path).unwrap();
    bytes.extend_from_slice(br#"{"seq":9,"session":"cut off he"#);
    std::fs::write(&path, bytes).unwrap();
    let out = report(&[path.to_str().unwrap()]);
    assert!(out.status.success());
    let md = stdout(&out);
    assert!(md.contains("### Journal problems"), "{md}");
    assert!(md.contains("Torn tail: the last line"), "{md}");
    assert!(
        md.contains("### Readings (2)"),
        "the good records are still used"
    );
    assert!(String::from_utf8_lossy(&out.stderr).contains("cut off"));
}

#[test]
fn an_unknown_format_is_refused_with_the_accepted_ones() {
    let dir = tempfile::tempdir().unwrap();
    let path = known_journal(dir.path());
    let out = report(&["--format", "xml", path.to_str().unwrap()]);
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("md, csv, json or html"));
}

// Fault drill, hostile text: a journal edited by hand (not through our writer, which cleans
// notes) carries a terminal escape, a spreadsheet formula and markup in a note and in the
// operator's name. No report format may pass the escape through raw; a CSV cell that a
// spreadsheet would run as a formula starts with a quote; the HTML escapes the markup.
#[test]
fn hostile_journal_text_never_reaches_a_report_raw() {
    let dir = tempfile::tempdir().unwrap();
    let mut w = writer(dir.path(), "night");
    w.append(None, Payload::Note { text: "ok".into() }).unwrap();
    let path = w.path().expect("file journal").to_path_buf();
    drop(w);
    let mut loaded = load(&path).expect("journal reads");
    let mut note = loaded.records.pop().expect("the note");
    note.seq += 1;
    note.operator = "=cmd|' /C calc'!A0".into();
    note.payload = Payload::Note {
        text: "=HYPERLINK(\"http://x\") \u{1b}[2J\u{1b}]0;owned\u{7} <b>bold</b>".into(),
    };
    let mut read = note.clone();
    read.seq += 1;
    read.equipment = Some("@SUM(A1)\u{1b}[31m".into());
    read.payload = reading("flow=3 m3/h");
    if let Payload::Reading { raw, .. } = &mut read.payload {
        raw.push_str(" \u{1b}[2J=1+1");
    }
    let mut text = std::fs::read_to_string(&path).unwrap();
    for r in [&note, &read] {
        text.push_str(&serde_json::to_string(r).expect("encodes"));
        text.push('\n');
    }
    std::fs::write(&path, text).unwrap();
    let p = path.to_str().unwrap();
    for format in ["md", "csv", "html"] {
        let out = stdout(&report(&[p, "--format", format]));
        assert!(
            !out.contains('\u{1b}') && !out.contains('\u{7}'),
            "{format}: {out}"
        );
        assert!(out.contains("calc"), "{format} dropped the operator: {out}");
    }
    let csv = stdout(&report(&[p, "--format", "csv"]));
    for cell in csv.lines().flat_map(|l| l.split(',')) {
        let cell = cell.trim_start_matches('"');
        assert!(!cell.starts_with('='), "a formula cell: {cell}");
    }
    let html = stdout(&report(&[p, "--format", "html"]));
    assert!(!html.contains("<b>bold") && html.contains("&lt;b&gt;bold"));
}
