//! The handover's readings as CSV for a spreadsheet: one row per spot reading and one per
//! viscometer dial row, sessions in start-time order, records in `seq` order.
//!
//! Columns (a contract: add at the end, never rename): session, seq, utc, local_time,
//! operator, equipment, name, raw, value_si, unit, viscometer, product, rpm, row.
//! A dial row has name `dial`, raw the dial as typed, value_si the dial value (unit
//! `dial`, the instrument's own scale), and its speed in `rpm`. A text cell that a
//! spreadsheet would run as a formula (`=`, `+`, `@`, or `-` before a non-number) gets a
//! leading `'`.

use super::{Inputs, dimension_of, rfc3339};
use crate::session::state::{Entry, SessionState};

pub(crate) const HEADER: [&str; 14] = [
    "session",
    "seq",
    "utc",
    "local_time",
    "operator",
    "equipment",
    "name",
    "raw",
    "value_si",
    "unit",
    "viscometer",
    "product",
    "rpm",
    "row",
];

pub(crate) fn render(inputs: &Inputs) -> anyhow::Result<Vec<u8>> {
    let mut w = csv::Writer::from_writer(Vec::new());
    w.write_record(HEADER)?;
    for j in &inputs.journals {
        for row in rows(&j.state) {
            w.write_record(&row)?;
        }
    }
    w.into_inner()
        .map_err(|e| anyhow::anyhow!("cannot write the CSV: {e}"))
}

/// Every row of one session, in `seq` order (a set's dial rows in their own order).
fn rows(s: &SessionState) -> Vec<Vec<String>> {
    let mut out: Vec<(u64, Vec<String>)> = Vec::new();
    for r in &s.readings {
        let unit = dimension_of(&r.item.dimension).map_or("", |d| d.si_unit());
        let mut row = envelope(s, r);
        row.extend([
            clean(&r.item.name),
            clean(&r.item.raw),
            r.item.value_si.to_string(),
            unit.to_string(),
        ]);
        row.extend(["", "", "", ""].map(String::from));
        out.push((r.seq, row));
    }
    for set in &s.sets {
        for (i, d) in set.item.rows.iter().enumerate() {
            let mut row = envelope(s, set);
            row.extend([
                "dial".to_string(),
                clean(&d.dial_raw),
                d.dial.to_string(),
                "dial".to_string(),
                clean(&set.item.viscometer),
                clean(&set.item.product),
                d.rpm.to_string(),
                (i + 1).to_string(),
            ]);
            out.push((set.seq, row));
        }
    }
    // Stable: a set's rows keep their order under the one seq they share.
    out.sort_by_key(|(seq, _)| *seq);
    out.into_iter().map(|(_, row)| row).collect()
}

fn envelope<T>(s: &SessionState, e: &Entry<T>) -> Vec<String> {
    let (utc, local) = rfc3339(&e.at);
    vec![
        clean(&s.session_id),
        e.seq.to_string(),
        utc,
        local,
        clean(&e.operator),
        e.equipment.as_deref().map_or(String::new(), clean),
    ]
}

/// Journal text for a cell: cleaned, and never read as a formula.
fn clean(text: &str) -> String {
    let t = super::clean(text);
    let mut chars = t.chars();
    let risky = match chars.next() {
        Some('=' | '+' | '@') => true,
        Some('-') => !chars.next().is_some_and(|c| c.is_ascii_digit() || c == '.'),
        _ => false,
    };
    if risky { format!("'{t}") } else { t }
}
