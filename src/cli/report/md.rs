//! The Markdown handover: one section per session, then the cautions.

use super::md_set::set_section;
use super::seen::{compact, linked_set};
use super::{CAUTIONS, Inputs, Journal, clean, local_text, problems, reading_value, utc_text};
use crate::session::state::{Entry, Moment, SessionState};
use crate::site::Site;
use std::fmt::Write as _;

pub(crate) fn render(inputs: &Inputs) -> String {
    let site = inputs.site;
    let mut out = String::from("# Shift handover report\n\n");
    let _ = writeln!(
        out,
        "Site config: {} (`{}`), from {}.",
        clean(&site.name),
        site.id,
        clean(&site.source)
    );
    let _ = writeln!(
        out,
        "Sessions: {}, listed by start time. Times are local (with the UTC offset then in force) and UTC.",
        inputs.journals.len()
    );
    for j in &inputs.journals {
        out.push_str(&session(site, j));
    }
    if !inputs.failed.is_empty() {
        out.push_str("\n## Journals left out\n\n");
        for f in &inputs.failed {
            let _ = writeln!(out, "- {}", cell(f));
        }
    }
    out.push_str("\n## Cautions\n\n");
    for c in CAUTIONS {
        let _ = writeln!(out, "- {c}");
    }
    out
}

fn session(site: &Site, j: &Journal) -> String {
    let s = &j.state;
    let mut out = format!("\n## Session {}\n\n", cell(&s.session_id));
    out.push_str(&summary(j));
    let problems = problems(site, j);
    if !problems.is_empty() {
        out.push_str("\n### Journal problems\n\n");
        for p in problems {
            let _ = writeln!(out, "- {}", cell(&p));
        }
    }
    out.push_str(&readings(s, site));
    let _ = write!(
        out,
        "\n### Viscometer sets and flow curves ({})\n",
        s.sets.len()
    );
    if s.sets.is_empty() {
        out.push_str("\nNone recorded.\n");
    }
    for set in &s.sets {
        out.push_str(&set_section(site, set, s));
    }
    out.push_str(&results(s));
    out.push_str(&notes(s));
    out.push_str(&findings(s));
    out
}

fn summary(j: &Journal) -> String {
    let s = &j.state;
    let when = |m: Option<Moment>, none: &str| m.map_or(none.to_string(), |m| both(&m));
    let site = match (&s.site_id, &s.site_source) {
        (Some(id), Some(src)) => format!("`{}` (config: {})", cell(id), cell(src)),
        _ => "not recorded".to_string(),
    };
    let rows = [
        ("Journal", format!("`{}`", cell(&j.path))),
        ("Site", site),
        ("Operators", list(&s.operators)),
        ("Started", when(s.started, "not recorded")),
        ("Ended", when(s.ended, "not ended (no session-end record)")),
        ("Runs", cell(&super::runs::runs_text(s))),
        (
            "Records",
            format!("{} (last is record {})", s.records, s.last_seq),
        ),
        ("Equipment", list(&s.equipment)),
    ];
    let mut out = String::from("| | |\n|---|---|\n");
    for (k, v) in rows {
        let _ = writeln!(out, "| {k} | {v} |");
    }
    out
}

fn readings(s: &SessionState, site: &Site) -> String {
    let mut out = format!("\n### Readings ({})\n\n", s.readings.len());
    if s.readings.is_empty() {
        out.push_str("None recorded.\n");
        return out;
    }
    out.push_str(
        "| record | local time | UTC | operator | equipment | reading | as typed | value |\n",
    );
    out.push_str("|---:|---|---|---|---|---|---|---|\n");
    for r in &s.readings {
        let _ = writeln!(
            out,
            "| {} | {} | {} | {} | {} | {} | {} | {} |",
            r.seq,
            local_text(&r.at),
            utc_text(&r.at),
            cell(&r.operator),
            equipment(r),
            cell(&r.item.name),
            cell(&r.item.raw),
            reading_value(&r.item, site.unit_system)
        );
    }
    out
}

/// Results not shown with a set.
fn results(s: &SessionState) -> String {
    let own: Vec<_> = s
        .results
        .iter()
        .filter(|r| linked_set(r, &s.sets, &s.results).is_none())
        .collect();
    let with_sets = s.results.len() - own.len();
    let mut out = format!("\n### Results ({})\n\n", s.results.len());
    if with_sets > 0 {
        let _ = writeln!(out, "{with_sets} shown above with their viscometer sets.");
        if !own.is_empty() {
            out.push('\n');
        }
    }
    if s.results.is_empty() {
        out.push_str("None recorded.\n");
    }
    for r in own {
        let _ = writeln!(
            out,
            "- {}: **{}** `{}`",
            byline(r),
            cell(&r.item.what),
            compact(&r.item.data).replace('`', "'")
        );
    }
    out
}

fn notes(s: &SessionState) -> String {
    let mut out = format!("\n### Notes ({})\n\n", s.notes.len());
    if s.notes.is_empty() {
        out.push_str("None recorded.\n");
    }
    for n in &s.notes {
        let _ = writeln!(out, "- {}: {}", byline(n), prose(&n.item));
    }
    out
}

fn findings(s: &SessionState) -> String {
    let mut out = format!("\n### Findings ({})\n\n", s.findings.len());
    if s.findings.is_empty() {
        out.push_str("None recorded.\n");
    }
    for f in &s.findings {
        let severity = serde_json::to_value(f.item.severity)
            .ok()
            .and_then(|v| v.as_str().map(str::to_uppercase))
            .unwrap_or_default();
        let _ = writeln!(
            out,
            "- **{severity}** {}: {}",
            byline(f),
            prose(&f.item.text)
        );
    }
    out
}

/// "2026-12-01 19:25:43 +01:00 (2026-12-01 18:25:43 UTC)".
pub(crate) fn both(m: &Moment) -> String {
    format!("{} ({})", local_text(m), utc_text(m))
}

/// "record 12, 2026-… +01:00 (… UTC), J. Ferreira, P-1".
pub(crate) fn byline<T>(e: &Entry<T>) -> String {
    let mut text = format!("record {}, {}, {}", e.seq, both(&e.at), cell(&e.operator));
    if let Some(eq) = &e.equipment {
        let _ = write!(text, ", {}", cell(eq));
    }
    text
}

fn equipment<T>(e: &Entry<T>) -> String {
    e.equipment.as_deref().map_or(String::new(), cell)
}

fn list(items: &[String]) -> String {
    if items.is_empty() {
        return "none".to_string();
    }
    items.iter().map(|i| cell(i)).collect::<Vec<_>>().join(", ")
}

/// Text for a table cell or a list line: no pipes or line breaks to break the layout.
pub(crate) fn cell(text: &str) -> String {
    clean(text).replace('|', "\\|")
}

/// Free text that may have several lines, indented under its list item.
fn prose(text: &str) -> String {
    let kept = crate::text::sanitize(text, true);
    let lines: Vec<String> = kept
        .lines()
        .map(|l| l.trim_end().replace('|', "\\|"))
        .collect();
    lines.join("\n  ")
}
