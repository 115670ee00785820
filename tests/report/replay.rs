//! Replay: a session journalled through the real writer, loaded back and replayed, gives
//! the same state as applying each record live as it was saved (proptest).

use super::{SITE, STEP_S, demo, start, writer};
use chrono::Duration;
use proptest::prelude::*;
use rheoside::journal::*;
use rheoside::session::SessionState;

#[derive(Debug, Clone)]
enum Op {
    Reading(usize, f64),
    Set(usize, Vec<(f64, f64)>),
    Result(String, i64),
    Note(String),
    Finding(usize, String),
    Handover(String),
}

fn clean_text() -> impl Strategy<Value = String> {
    "[A-Za-z0-9][A-Za-z0-9 .,°·/-]{0,14}[A-Za-z0-9]"
}

fn op() -> impl Strategy<Value = Op> {
    prop_oneof![
        4 => (0..4usize, -1.0e6..1.0e6f64).prop_map(|(i, v)| Op::Reading(i, v)),
        2 => (0..3usize, prop::collection::vec((0.1..700.0f64, 0.0..320.0f64), 1..7))
            .prop_map(|(i, rows)| Op::Set(i, rows)),
        1 => (clean_text(), any::<i64>()).prop_map(|(w, n)| Op::Result(w, n)),
        1 => "[A-Za-z][A-Za-z0-9 \n]{0,20}[a-z]".prop_map(Op::Note),
        1 => (0..4usize, clean_text()).prop_map(|(s, t)| Op::Finding(s, t)),
        1 => clean_text().prop_map(Op::Handover),
    ]
}

fn payload(op: &Op) -> Option<(Option<String>, Payload)> {
    const NAMES: [(&str, &str); 4] = [
        ("discharge-pressure", "pressure"),
        ("flow", "flow"),
        ("temperature", "temperature"),
        ("density", "density"),
    ];
    const VISC: [&str; 3] = ["VIS-A", "VIS-B", "VIS-GONE"];
    const SEVERITY: [Severity; 4] = [
        Severity::Info,
        Severity::Caution,
        Severity::Warning,
        Severity::Danger,
    ];
    Some(match op {
        Op::Reading(i, v) => (
            Some("P-1".into()),
            Payload::Reading {
                name: NAMES[*i].0.into(),
                raw: format!("{v}"),
                value_si: *v,
                dimension: NAMES[*i].1.into(),
            },
        ),
        Op::Set(i, rows) => (
            Some(VISC[*i].into()),
            Payload::ViscometerSet {
                viscometer: VISC[*i].into(),
                product: "chilli-sauce".into(),
                temperature_raw: None,
                temperature_k: None,
                rows: rows
                    .iter()
                    .map(|&(rpm, dial)| DialRow {
                        rpm_raw: format!("{rpm}"),
                        rpm,
                        dial_raw: format!("{dial}"),
                        dial,
                    })
                    .collect(),
            },
        ),
        Op::Result(what, n) => (
            None,
            Payload::Result {
                what: what.clone(),
                result_kind: None,
                from: Vec::new(),
                data: serde_json::json!({ "n": n }),
            },
        ),
        Op::Note(text) => (None, Payload::Note { text: text.clone() }),
        Op::Finding(s, text) => (
            None,
            Payload::Finding {
                severity: SEVERITY[*s],
                text: text.clone(),
            },
        ),
        Op::Handover(_) => return None,
    })
}

/// The record the writer saves for `payload` as number `seq`, built from what the caller
/// knows live (the writer's session and operator, the fixed clock's step).
fn live_record(w: &JournalWriter, seq: u64, equipment: Option<String>, payload: Payload) -> Record {
    Record {
        seq,
        session: w.session_id().to_string(),
        utc: start().utc + Duration::seconds(STEP_S * (seq as i64 - 1)),
        offset: start().offset,
        operator: w.operator().to_string(),
        equipment,
        payload,
        version: env!("CARGO_PKG_VERSION").to_string(),
    }
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 48, ..ProptestConfig::default() })]

    /// Journalled through the real writer, loaded back and replayed, a session gives the
    /// same state as applying each record live as it was saved.
    #[test]
    fn replay_equals_the_state_built_live(ops in prop::collection::vec(op(), 0..24), end in any::<bool>()) {
        let site = demo();
        let dir = tempfile::tempdir().unwrap();
        let mut w = writer(dir.path(), "J. Ferreira");
        let first = live_record(&w, 1, None, Payload::SessionStart {
            site_id: SITE.into(),
            site_source: "bundled demo site (invented plant)".into(),
        });
        let mut live = SessionState::default();
        live.apply(&site, &first);
        let mut live_records = vec![first];
        let mut save = |w: &mut JournalWriter, equipment: Option<String>, p: Payload| {
            let seq = w.append(equipment.as_deref(), p.clone()).unwrap();
            let r = live_record(w, seq, equipment, p);
            live.apply(&site, &r);
            live_records.push(r);
        };
        for o in &ops {
            match (o, payload(o)) {
                (Op::Handover(name), _) => w.set_operator(name),
                (_, Some((equipment, p))) => save(&mut w, equipment, p),
                (_, None) => {}
            }
        }
        if end {
            save(&mut w, None, Payload::SessionEnd);
        }
        let loaded = load(w.path().unwrap()).unwrap();
        prop_assert!(loaded.torn.is_none());
        prop_assert_eq!(&loaded.records, &live_records);
        let replayed = SessionState::replay(&site, &loaded.records);
        prop_assert_eq!(replayed, live);
    }
}
