//! Session journal: record format, file names, torn tails, failing disks, locks, replay.
//!
//! The expectations come from the journal's written requirements (JSON Lines, one record
//! per line, fsync before "saved", torn tail set aside) and from the JSON text itself:
//! the golden line below is written out by hand, not produced by the code under test.

use chrono::{DateTime, Duration, FixedOffset, TimeZone, Utc};
use rheoside::journal::*;
use std::collections::VecDeque;
use std::path::Path;

fn stamp(secs: i64, offset_min: i32) -> Stamp {
    Stamp {
        utc: Utc.timestamp_opt(secs, 120_000_000).single().unwrap(),
        offset: FixedOffset::east_opt(offset_min * 60).unwrap(),
    }
}

/// 2026-12-01T18:25:43.12Z, local offset +01:00.
fn start() -> Stamp {
    stamp(1_796_149_543, 60)
}

fn clock() -> Box<dyn Clock> {
    Box::new(StepClock::new(start(), Duration::seconds(7)))
}

fn reading(name: &str, raw: &str, v: f64) -> Payload {
    Payload::Reading {
        name: name.into(),
        raw: raw.into(),
        value_si: v,
        dimension: "pressure".into(),
    }
}

fn new_session(dir: &Path) -> NewSession {
    NewSession {
        log_dir: dir.to_path_buf(),
        site_id: "demo-site".into(),
        site_source: "demo (bundled, invented)".into(),
        operator: "ana".into(),
    }
}

#[test]
fn golden_line_matches_the_documented_format() {
    let utc: DateTime<Utc> = "2026-12-01T18:25:43.120Z".parse().unwrap();
    let rec = Record {
        seq: 2,
        session: "3f9a0c1e".into(),
        utc,
        offset: FixedOffset::east_opt(3600).unwrap(),
        operator: "ana".into(),
        equipment: Some("P-101".into()),
        payload: reading("discharge-pressure", "6.2 bar", 620_000.0),
        version: "0.1.0".into(),
    };
    let line = r#"{"seq":2,"session":"3f9a0c1e","utc":"2026-12-01T18:25:43.120Z","offset":"+01:00","operator":"ana","equipment":"P-101","kind":"reading","name":"discharge-pressure","raw":"6.2 bar","value_si":620000.0,"dimension":"pressure","version":"0.1.0"}"#;
    assert_eq!(serde_json::to_string(&rec).unwrap(), line);
    assert_eq!(serde_json::from_str::<Record>(line).unwrap(), rec);
}

/// Every kind, with random values, is covered by the replay property below; these are
/// the floats that need serde_json's `float_roundtrip` (found by that property).
#[test]
fn awkward_floats_and_every_envelope_field_round_trip_exactly() {
    let floats = [
        0.1 + 0.2,
        3.5e-300,
        1.190_679_463_907_065_3e-193,
        -0.0,
        f64::MAX,
        5e-324,
    ];
    for (i, v) in floats.into_iter().enumerate() {
        let rec = Record {
            seq: i as u64 + 1,
            session: "abcd0123".into(),
            utc: start().utc + Duration::nanoseconds(i as i64 * 123_456_789),
            offset: FixedOffset::west_opt(5 * 3600 + 30 * 60).unwrap(),
            operator: "bo".into(),
            equipment: (i % 2 == 0).then(|| "T-3".to_string()),
            payload: Payload::Result {
                what: "fit".into(),
                result_kind: None,
                from: Vec::new(),
                data: serde_json::json!({ "k": v }),
            },
            version: "9.9.9".into(),
        };
        let text = serde_json::to_string(&rec).unwrap();
        assert!(text.contains(r#""offset":"-05:30""#), "{text}");
        assert_eq!(
            serde_json::from_str::<Record>(&text).unwrap(),
            rec,
            "{text}"
        );
    }
    let end = serde_json::to_string(&Payload::SessionEnd).unwrap();
    assert_eq!(end, r#"{"kind":"session-end"}"#);
}

#[test]
fn file_name_refuses_traversal_and_hidden_names() {
    for bad in [
        "../x", "/etc", "a/b", "", "   ", "..", ".hidden", "a\\b", "x/../y",
    ] {
        assert!(
            matches!(site_file_stem(bad), Err(JournalError::BadName { .. })),
            "{bad:?} must be refused"
        );
    }
    assert_eq!(site_file_stem("Plant 3 Süd").unwrap(), "Plant-3-S-d");
    assert_eq!(site_file_stem("demo-site_v1.2").unwrap(), "demo-site_v1.2");
    let name = session_file_name("demo-site", start().utc, "3f9a0c1e").unwrap();
    assert_eq!(name, "demo-site_20261201T182543Z_3f9a0c1e.jsonl");
}

#[test]
fn new_session_writes_start_record_and_numbers_from_one() {
    let dir = tempfile::tempdir().unwrap();
    let mut w = JournalWriter::create(&new_session(dir.path()), clock()).unwrap();
    assert_eq!(w.saved_through(), 1);
    let seq = w.append(Some("P-1"), reading("line-pressure", "2 bar", 2e5));
    assert_eq!(seq.unwrap(), 2);
    let path = w.path().unwrap().to_path_buf();
    let name = path.file_name().unwrap().to_str().unwrap();
    assert!(name.starts_with("demo-site_20261201T182543Z_"), "{name}");
    let tail = format!("_{}.jsonl", w.session_id());
    assert!(name.ends_with(&tail), "{name}");
    let loaded = load(&path).unwrap();
    assert_eq!(loaded.records.len(), 2);
    assert_eq!(loaded.site_id(), Some("demo-site"));
    assert_eq!(loaded.records[0].operator, "ana");
    assert_eq!(loaded.records[1].version, env!("CARGO_PKG_VERSION"));
    assert_eq!(loaded.records[1].utc, start().utc + Duration::seconds(7));
    assert_eq!(loaded.torn, None);
}

#[test]
fn untrusted_text_is_cleaned_and_non_finite_values_refused() {
    let dir = tempfile::tempdir().unwrap();
    let mut w = JournalWriter::create(&new_session(dir.path()), clock()).unwrap();
    w.set_operator("e\u{1b}]0;owned\u{7}ve");
    let note = "valve \u{1b}[31mshut\u{1b}[0m\u{7} ok\u{202e}";
    w.append(Some("P-\u{0}1"), Payload::Note { text: note.into() })
        .unwrap();
    let bytes = std::fs::read(w.path().unwrap()).unwrap();
    assert!(!bytes.contains(&0x1b) && !bytes.windows(2).any(|p| p == b"\\u"));
    let rec = load(w.path().unwrap()).unwrap().records.pop().unwrap();
    assert_eq!(rec.operator, "eve");
    assert_eq!(rec.equipment.as_deref(), Some("P-1"));
    let clean = Payload::Note {
        text: "valve shut ok".into(),
    };
    assert_eq!(rec.payload, clean);
    // serde_json would write NaN as null and fail to read it back.
    let err = w
        .append(None, reading("flow", "NaN", f64::NAN))
        .unwrap_err();
    assert!(matches!(err, JournalError::NotFinite { .. }), "{err}");
    let seq = w.append(None, reading("flow", "1", 1.0)).unwrap();
    assert_eq!(seq, 3, "a refused record uses no number");
}

#[test]
fn torn_tail_is_reported_by_load_and_set_aside_by_resume() {
    let dir = tempfile::tempdir().unwrap();
    let mut w = JournalWriter::create(&new_session(dir.path()), clock()).unwrap();
    for i in 0..3 {
        w.append(None, reading("flow", "1", f64::from(i))).unwrap();
    }
    let path = w.path().unwrap().to_path_buf();
    drop(w);
    let good_len = file_len(&path);
    let fragment = br#"{"seq":5,"session":"x","utc":"2026-12"#;
    append_raw(&path, fragment);

    let seen = load(&path).unwrap();
    assert_eq!(seen.records.len(), 4);
    let torn = seen.torn.unwrap();
    assert_eq!((torn.offset, torn.len), (good_len, fragment.len() as u64));
    assert_eq!(torn.side_file, None);
    let untouched = good_len + fragment.len() as u64;
    assert_eq!(file_len(&path), untouched, "load never writes");

    let mut resumed = JournalWriter::resume(&path, "bo", clock()).unwrap();
    let torn = resumed.loaded.torn.clone().unwrap();
    let side = torn.side_file.clone().unwrap();
    assert_eq!(side.to_str().unwrap(), format!("{}.torn-1", path.display()));
    assert_eq!(std::fs::read(&side).unwrap(), fragment);
    assert!(torn.to_string().contains("moved to"), "{torn}");
    // Cut back to the good part, then the session-resumed record (5): no end record before.
    let after = load(&path).unwrap();
    assert_eq!(after.records.len(), 5);
    assert!(file_len(&path) > good_len);
    assert_eq!(
        after.records[4].payload,
        Payload::SessionResumed {
            previous_end: PreviousEnd::NoEndRecord
        }
    );
    assert_eq!(resumed.loaded.records.last(), after.records.last());
    assert_eq!(resumed.writer.append(None, Payload::SessionEnd).unwrap(), 6);
    let after = load(&path).unwrap();
    assert_eq!((after.records.len(), after.torn), (6, None));
}

#[test]
fn a_repair_cut_short_reuses_its_side_file() {
    let dir = tempfile::tempdir().unwrap();
    let w = JournalWriter::create(&new_session(dir.path()), clock()).unwrap();
    let path = w.path().unwrap().to_path_buf();
    drop(w);
    append_raw(&path, b"{\"seq\":2,");
    // As if an earlier resume saved the side file and died before cutting the journal.
    let side = format!("{}.torn-1", path.display());
    std::fs::write(&side, b"{\"seq\":2,").unwrap();
    let resumed = JournalWriter::resume(&path, "bo", clock()).unwrap();
    let torn = resumed.loaded.torn.unwrap();
    assert_eq!(torn.side_file.unwrap().to_str().unwrap(), side);
    assert!(!Path::new(&format!("{}.torn-2", path.display())).exists());
}

#[test]
fn unreadable_last_line_is_torn_but_a_bad_middle_line_is_an_error() {
    let dir = tempfile::tempdir().unwrap();
    let mut w = JournalWriter::create(&new_session(dir.path()), clock()).unwrap();
    w.append(None, reading("flow", "1", 1.0)).unwrap();
    let path = w.path().unwrap().to_path_buf();
    drop(w);
    // A power cut can leave a zero-filled block where the last line should be.
    append_raw(&path, b"\0\0\0\0\n");
    let loaded = load(&path).unwrap();
    assert_eq!((loaded.records.len(), loaded.torn.unwrap().len), (2, 5));

    append_raw(&path, b"{\"more\":1}\n");
    match load(&path) {
        Err(JournalError::Corrupt { line, .. }) => assert_eq!(line, 3),
        other => panic!("expected a corrupt-line error, got {other:?}"),
    }
    assert!(JournalWriter::resume(&path, "bo", clock()).is_err());
}

fn file_len(path: &Path) -> u64 {
    std::fs::metadata(path).unwrap().len()
}

fn append_raw(path: &Path, bytes: &[u8]) {
    let mut f = std::fs::OpenOptions::new().append(true).open(path).unwrap();
    std::io::Write::write_all(&mut f, bytes).unwrap();
}

fn mem_writer(faults: &[Fault]) -> JournalWriter<MemorySink> {
    let mut sink = MemorySink::default();
    faults.iter().for_each(|f| sink.fail_next(*f));
    let from = Continuation {
        session_id: "feedbeef".into(),
        operator: "ana".into(),
        next_seq: 1,
        file_len: 0,
    };
    JournalWriter::with_sink(sink, from, clock())
}

fn seqs_in(data: &[u8]) -> Vec<u64> {
    assert!(data.is_empty() || data.ends_with(b"\n"), "half line left");
    let text = std::str::from_utf8(data).unwrap();
    text.lines()
        .map(|l| serde_json::from_str::<Record>(l).unwrap().seq)
        .collect()
}

/// (first unsaved record, failed step, records pending) of an `Unsaved` error.
fn unsaved(e: &JournalError) -> Option<(u64, Stage, usize)> {
    match e {
        JournalError::Unsaved {
            seq,
            stage,
            pending,
            ..
        } => Some((*seq, *stage, *pending)),
        _ => None,
    }
}

#[test]
fn failed_write_then_failed_sync_keeps_the_record_pending_until_a_clean_retry() {
    use Fault::*;
    let mut w = mem_writer(&[WriteFailsHalfway, SyncFails, TruncateFails]);
    let err = w.append(None, reading("flow", "1", 1.0)).unwrap_err();
    assert_eq!(unsaved(&err), Some((1, Stage::Write, 1)), "{err}");
    assert!(err.to_string().contains("NOT saved"), "{err}");
    assert_eq!((w.saved_through(), w.pending_count()), (0, 1));
    assert_eq!(w.sink().data().len(), 0, "the half line was cut back");

    // The retry of record 1 writes, then its sync fails and the cut-back fails too.
    let err = w.append(None, reading("flow", "2", 2.0)).unwrap_err();
    let first_retried = Some((1, Stage::Sync, 2));
    assert_eq!(unsaved(&err), first_retried, "{err}");
    assert_eq!(w.pending().map(|r| r.seq).collect::<Vec<_>>(), [1, 2]);
    assert_eq!(w.sink().durable_len(), 0, "nothing was ever reported saved");

    assert_eq!(w.flush_pending().unwrap(), 2);
    assert_eq!(w.pending_count(), 0);
    assert_eq!(
        seqs_in(w.sink().data()),
        [1, 2],
        "exactly one copy of each, no half line"
    );
    assert_eq!(w.sink().durable_len(), w.sink().data().len());
}

#[test]
fn log_dir_under_a_regular_file_gives_a_clear_error() {
    // Tests run as root, so a chmod-ed folder would still be writable; a path that runs
    // through a regular file cannot be created by anyone.
    let dir = tempfile::tempdir().unwrap();
    let file = dir.path().join("not-a-folder");
    std::fs::write(&file, b"x").unwrap();
    for log_dir in [file.join("logs"), file.clone()] {
        let err = JournalWriter::create(&new_session(&log_dir), clock()).unwrap_err();
        let msg = err.to_string();
        assert!(matches!(err, JournalError::CreateDir { .. }), "{msg}");
        let shown = log_dir.display().to_string();
        assert!(msg.contains(&shown) && msg.contains("--log-dir"), "{msg}");
    }
}

#[test]
fn a_second_writer_on_the_same_file_is_refused_clearly() {
    let dir = tempfile::tempdir().unwrap();
    let first = JournalWriter::create(&new_session(dir.path()), clock()).unwrap();
    let path = first.path().unwrap().to_path_buf();
    let from_thread = {
        let path = path.clone();
        std::thread::spawn(move || JournalWriter::resume(&path, "bo", clock()).map(|_| ()))
    };
    let err = from_thread.join().unwrap().unwrap_err();
    let msg = err.to_string();
    assert!(matches!(err, JournalError::Busy { .. }), "{msg}");
    assert!(msg.contains(&path.display().to_string()), "{msg}");
    assert!(msg.contains("open in another rheoside"), "{msg}");
    #[cfg(target_os = "linux")]
    assert!(msg.contains(&format!("pid {}?", std::process::id())));
    drop(first);
    let again = JournalWriter::resume(&path, "bo", clock());
    assert!(again.is_ok(), "lock released on drop");
}

mod replay {
    use super::*;
    use proptest::prelude::*;
    use serde_json::Value;
    use std::sync::Mutex;

    fn text() -> impl Strategy<Value = String> {
        "\\PC{0,16}".prop_map(|s| s.trim().to_string())
    }

    fn finite() -> impl Strategy<Value = f64> {
        any::<f64>().prop_filter("finite", |v| v.is_finite())
    }

    fn value() -> impl Strategy<Value = Value> {
        let leaf = prop_oneof![
            Just(Value::Null),
            any::<bool>().prop_map(Value::Bool),
            any::<i64>().prop_map(Value::from),
            finite().prop_map(Value::from),
            text().prop_map(Value::String),
        ];
        leaf.prop_recursive(3, 24, 4, |inner| {
            prop_oneof![
                prop::collection::vec(inner.clone(), 0..4).prop_map(Value::Array),
                prop::collection::btree_map("[a-z]{1,6}", inner, 0..4)
                    .prop_map(|m| Value::Object(m.into_iter().collect())),
            ]
        })
    }

    fn row() -> impl Strategy<Value = DialRow> {
        (text(), finite(), text(), finite()).prop_map(|(rpm_raw, rpm, dial_raw, dial)| DialRow {
            rpm_raw,
            rpm,
            dial_raw,
            dial,
        })
    }

    fn payload() -> impl Strategy<Value = Payload> {
        use Severity::*;
        let severity = prop::sample::select(vec![Info, Caution, Warning, Danger]);
        prop_oneof![
            (text(), text(), finite()).prop_map(|(n, raw, v)| reading(&n, &raw, v)),
            (
                text(),
                text(),
                prop::option::of((text(), finite())),
                prop::collection::vec(row(), 0..5)
            )
                .prop_map(|(viscometer, product, t, rows)| Payload::ViscometerSet {
                    viscometer,
                    product,
                    temperature_raw: t.as_ref().map(|t| t.0.clone()),
                    temperature_k: t.map(|t| t.1),
                    rows,
                }),
            (text(), value()).prop_map(|(what, data)| Payload::Result {
                what,
                result_kind: None,
                from: Vec::new(),
                data,
            }),
            text().prop_map(|text| Payload::Note { text }),
            (severity, text()).prop_map(|(severity, text)| Payload::Finding { severity, text }),
            Just(Payload::SessionEnd),
        ]
    }

    fn entry() -> impl Strategy<Value = (Option<String>, Payload, i64, i32)> {
        let equipment = prop::option::of("[A-Z]{1,2}-[0-9]{1,3}");
        (
            equipment,
            payload(),
            0i64..4_000_000_000,
            -14 * 60..=14 * 60i32,
        )
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(128))]
        #[test]
        fn written_then_loaded_gives_identical_records(entries in prop::collection::vec(entry(), 1..12)) {
            let stamps: Mutex<VecDeque<Stamp>> =
                Mutex::new(entries.iter().map(|e| stamp(e.2, e.3)).collect());
            let clock = move || stamps.lock().unwrap().pop_front().unwrap();
            let from = Continuation { session_id: "0badcafe".into(), operator: "ana".into(), next_seq: 1, file_len: 0 };
            let mut w = JournalWriter::with_sink(MemorySink::default(), from, Box::new(clock));
            let mut expected = Vec::new();
            for (i, (equipment, payload, secs, off)) in entries.into_iter().enumerate() {
                w.append(equipment.as_deref(), payload.clone()).unwrap();
                let s = stamp(secs, off);
                expected.push(Record {
                    seq: i as u64 + 1,
                    session: "0badcafe".into(),
                    utc: s.utc,
                    offset: s.offset,
                    operator: "ana".into(),
                    equipment,
                    payload,
                    version: env!("CARGO_PKG_VERSION").into(),
                });
            }
            let dir = tempfile::tempdir().unwrap();
            let path = dir.path().join("s.jsonl");
            std::fs::write(&path, w.sink().data()).unwrap();
            let loaded = load(&path).unwrap();
            prop_assert_eq!(loaded.torn, None);
            prop_assert_eq!(loaded.records, expected);
        }
    }
}
