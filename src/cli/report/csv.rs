//! The handover's readings as CSV for a spreadsheet: one row per spot reading and one per
//! viscometer dial row, sessions in start-time order, records in `seq` order.
//!
//! Columns (a contract: add at the end, never rename): session, seq, utc, local_time,
//! operator, equipment, name, raw, value_si, unit, viscometer, product, rpm, row.
//! A dial row has name `dial`, raw the dial as typed, value_si the dial value (unit
//! `dial`, the instrument's own scale), and its speed in `rpm`. A text cell that a
//! After the readings, one row per ranked finding (most urgent first): name `finding`, raw
//! its headline, row its rank, and the columns added for findings (rule, severity, sure,
//! numbers, next_checks, caution), empty on reading rows. A text cell that a
//! spreadsheet would run as a formula (`=`, `+`, `@`, or `-` before a non-number) gets a
//! leading `'`.

use super::{Inputs, dimension_of, rfc3339};
use crate::session::state::{Entry, SessionState};

pub(crate) const HEADER: [&str; 20] = [
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
    "rule",
    "severity",
    "sure",
    "numbers",
    "next_checks",
    "caution",
];

/// Cells of the finding columns, empty on a reading row.
const FINDING_COLUMNS: usize = 6;

pub(crate) fn render(inputs: &Inputs) -> anyhow::Result<Vec<u8>> {
    let mut w = csv::Writer::from_writer(Vec::new());
    w.write_record(HEADER)?;
    for j in &inputs.journals {
        for mut row in rows(&j.state) {
            row.extend(std::iter::repeat_n(String::new(), FINDING_COLUMNS));
            w.write_record(&row)?;
        }
    }
    let style = crate::present::Style::new(inputs.site.unit_system, false);
    for (i, r) in super::ranked::ranked(inputs).iter().enumerate() {
        w.write_record(finding_row(i + 1, r, style))?;
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

/// One ranked finding as a row: session, then the headline as `raw`, its rank as `row`.
fn finding_row(
    rank: usize,
    r: &super::ranked::Ranked,
    style: crate::present::Style,
) -> Vec<String> {
    let f = &r.finding;
    let w = crate::present::findings::words(f, style);
    let mut row = vec![clean(&r.session)];
    row.extend(std::iter::repeat_n(String::new(), 5));
    row.extend(["finding".to_string(), clean(&w.headline)]);
    row.extend(std::iter::repeat_n(String::new(), 5));
    row.push(rank.to_string());
    row.extend([
        f.rule.id().to_string(),
        f.severity.code().to_string(),
        f.sure.code().to_string(),
        clean(&w.numbers.join("; ")),
        clean(&w.next_checks.join("; ")),
        clean(&w.caution),
    ]);
    row
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
