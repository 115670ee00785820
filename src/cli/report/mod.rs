//! `rheoside report JOURNAL... [--format md|csv|json]`: the shift handover.
//!
//! Each journal is loaded and replayed through `session::SessionState`, so the numbers are
//! the ones the session showed. The output depends only on the journals and the site
//! config: no "generated at" stamp, sessions in start-time order, records in `seq` order,
//! so the same journals give the same bytes.

mod csv;
mod html;
mod html_charts;
mod html_more;
mod json;
mod md;
mod md_set;
mod ranked;
mod runs;
mod seen;
mod svg;

use super::args::{Cli, ReportArgs};
use super::trend::site_or_demo;
use crate::journal::{TornTail, load};
use crate::session::SessionState;
use crate::session::state::{Moment, SpotReading};
use crate::site::Site;
use crate::units::{self, Dimension, UnitSystem};
use anyhow::bail;
use chrono::SecondsFormat;
use std::io::Write;
use std::process::ExitCode;

/// Exit code when some journals could not be read: the report covers only the others.
const EXIT_INCOMPLETE: u8 = 1;

/// The fixed safety block, printed with every report (md, and a `cautions` list in JSON).
pub(crate) const CAUTIONS: [&str; 6] = [
    "Isolate and lock out before opening a line, a pump or a tank connection.",
    "Never exceed the rated pressure of the weakest part of the line (pump, hose, gasket, gauge, relief setting).",
    "Stop the agitator before sampling from a tank or reaching into it.",
    "Hot product: wear face and hand protection, and let lines and samples cool before handling them.",
    "The tool advises; it does not certify. Confirm every answer against the plant's own procedures.",
    "Local codes and licensed practice come first.",
];

/// One journal as the report sees it.
pub(crate) struct Journal {
    /// The path as given, cleaned for display.
    pub path: String,
    pub state: SessionState,
    pub torn: Option<TornTail>,
}

/// Everything a report is made from.
pub(crate) struct Inputs<'a> {
    pub site: &'a Site,
    /// In start-time order.
    pub journals: Vec<Journal>,
    /// Files that could not be read, with the reason, in the order given.
    pub failed: Vec<String>,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Format {
    Markdown,
    Csv,
    Json,
    Html,
}

pub fn run(cli: &Cli, args: &ReportArgs) -> anyhow::Result<ExitCode> {
    let format = match args.format.trim().to_ascii_lowercase().as_str() {
        "md" | "markdown" => Format::Markdown,
        "csv" => Format::Csv,
        "json" => Format::Json,
        "html" => Format::Html,
        other => bail!(
            "--format '{}': accepted values are md, csv, json or html",
            crate::text::sanitize(other, false)
        ),
    };
    let site = site_or_demo(cli)?;
    let inputs = gather(&site, args);
    if inputs.journals.is_empty() {
        bail!(
            "no journal could be read:\n  {}",
            inputs.failed.join("\n  ")
        );
    }
    for f in &inputs.failed {
        eprintln!("rheoside: left out of the report: {f}");
    }
    for j in &inputs.journals {
        if let Some(torn) = &j.torn {
            // Said here too: the CSV has no place for it.
            eprintln!("rheoside: {}: {torn}", j.path);
        }
    }
    let bytes = match format {
        Format::Markdown => md::render(&inputs).into_bytes(),
        Format::Csv => csv::render(&inputs)?,
        Format::Json => json::render(&inputs)?.into_bytes(),
        Format::Html => html::render(&inputs).into_bytes(),
    };
    std::io::stdout().lock().write_all(&bytes)?;
    Ok(if inputs.failed.is_empty() {
        ExitCode::SUCCESS
    } else {
        ExitCode::from(EXIT_INCOMPLETE)
    })
}

/// Load and replay every journal; order the sessions by start time.
fn gather<'a>(site: &'a Site, args: &ReportArgs) -> Inputs<'a> {
    let mut journals = Vec::new();
    let mut failed = Vec::new();
    for path in &args.journals {
        let shown = crate::text::sanitize(&path.display().to_string(), false);
        match load(path) {
            Ok(loaded) if loaded.records.is_empty() => {
                failed.push(format!("{shown}: the file holds no complete record"));
            }
            Ok(loaded) => journals.push(Journal {
                path: shown,
                state: SessionState::replay(site, &loaded.records),
                torn: loaded.torn,
            }),
            Err(e) => failed.push(crate::text::sanitize(&e.to_string(), false)),
        }
    }
    journals.sort_by(|a, b| {
        let key = |j: &Journal| j.state.sort_key().map(|m| m.utc);
        key(a)
            .cmp(&key(b))
            .then_with(|| a.state.session_id.cmp(&b.state.session_id))
            .then_with(|| a.path.cmp(&b.path))
    });
    Inputs {
        site,
        journals,
        failed,
    }
}

/// Problems a reader of the handover must see: a torn tail, a site mismatch, odd records.
pub(crate) fn problems(site: &Site, j: &Journal) -> Vec<String> {
    let mut out = Vec::new();
    if let Some(torn) = &j.torn {
        out.push(format!(
            "Torn tail: {torn}. The report uses the records before it."
        ));
    }
    match j.state.site_id.as_deref() {
        Some(id) if id != site.id => out.push(format!(
            "The journal was written for site '{}', but the site config in use is '{}'; \
             viscometer geometries and limits come from the config in use (give --site).",
            crate::text::sanitize(id, false),
            site.id
        )),
        Some(_) => {}
        None => out.push("The journal has no session-start record.".to_string()),
    }
    out.extend(runs::unfinished_runs(&j.state));
    if j.state.ended.is_none() {
        out.push("No session-end record: the session was not closed (still open, or stopped by a crash, a kill or a power loss).".to_string());
    }
    out.extend(
        j.state
            .problems
            .iter()
            .map(|p| crate::text::sanitize(p, false)),
    );
    out
}

/// Local wall time with its offset, to the second: `2026-12-01 19:25:43 +01:00`.
pub(crate) fn local_text(m: &Moment) -> String {
    m.local().format("%Y-%m-%d %H:%M:%S %:z").to_string()
}

/// UTC to the second: `2026-12-01 18:25:43 UTC`.
pub(crate) fn utc_text(m: &Moment) -> String {
    m.utc.format("%Y-%m-%d %H:%M:%S UTC").to_string()
}

/// Machine forms for CSV and JSON: RFC 3339 to the millisecond, UTC and local.
pub(crate) fn rfc3339(m: &Moment) -> (String, String) {
    (
        m.utc.to_rfc3339_opts(SecondsFormat::Millis, true),
        m.local().to_rfc3339_opts(SecondsFormat::Millis, false),
    )
}

/// The dimension a reading was journalled with ("pressure" → `Dimension::Pressure`).
pub(crate) fn dimension_of(name: &str) -> Option<Dimension> {
    Dimension::ALL.into_iter().find(|d| d.name() == name)
}

/// A reading's value in the site's units (its SI number if the dimension is unknown).
pub(crate) fn reading_value(r: &SpotReading, system: UnitSystem) -> String {
    match dimension_of(&r.dimension) {
        Some(dim) => units::format(r.value_si, dim, system),
        None => format!(
            "{} (unknown dimension '{}')",
            r.value_si,
            clean(&r.dimension)
        ),
    }
}

/// Journal text made safe again for output: a file may have been edited by hand.
pub(crate) fn clean(text: &str) -> String {
    crate::text::sanitize(text, false)
}
