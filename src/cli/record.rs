//! The `record` subcommand: headless append of readings and a note, for scripts and handhelds.
//!
//! Everything is checked before anything is written (exit 2, nothing written). Then one
//! record per reading, then the note, then a session-end record: each `record` run is one
//! complete run of the session, so a report never calls it a crash. Each record's sequence
//! number is printed on stdout only after its fsync has returned, so a script can trust
//! every number it saw.

use super::args::{Cli, RecordArgs};
use crate::journal::{
    JournalError, JournalWriter, NewSession, Payload, Resumed, Severity, SystemClock, os_user,
};
use crate::readings::parse_reading_arg_at;
use crate::site::Site;
use anyhow::bail;
use std::io::Write;
use std::path::Path;
use std::process::ExitCode;

/// The journal could not be opened or a record could not be saved: worth retrying
/// once the disk or the other writer is sorted out (bad input is exit 2).
const EXIT_NOT_SAVED: u8 = 1;

/// A checked request: everything needed to write, nothing written yet.
struct Plan {
    site: Site,
    site_source: String,
    equipment: String,
    operator: String,
    payloads: Vec<Payload>,
}

pub fn run(cli: &Cli, args: &RecordArgs) -> anyhow::Result<ExitCode> {
    let plan = check(cli, args)?;
    let mut writer = match open(cli, args, &plan) {
        Ok(w) => w,
        Err(Opening::Refused(e)) => return Err(e),
        Err(Opening::Journal(e)) => {
            eprintln!("rheoside: {e}; nothing was written");
            return Ok(ExitCode::from(EXIT_NOT_SAVED));
        }
    };
    let mut printed = writer.saved_through();
    let mut out = std::io::stdout().lock();
    for (i, payload) in plan.payloads.iter().enumerate() {
        let result = writer
            .append(Some(&plan.equipment), payload.clone())
            .or_else(|_| writer.flush_pending());
        for seq in printed + 1..=writer.saved_through() {
            writeln!(out, "{seq}").and_then(|()| out.flush())?;
        }
        printed = writer.saved_through();
        if let Err(e) = result {
            let unsaved = writer.pending_count() + plan.payloads.len() - i - 1;
            return Ok(not_saved(&e, unsaved));
        }
    }
    // Its number is not printed: scripts count the records they asked for.
    if let Err(e) = writer.end_session() {
        eprintln!(
            "rheoside: {e}; the readings are saved, but the session-end record is not, so a \
             report will show this run as not closed"
        );
    }
    Ok(ExitCode::SUCCESS)
}

/// Validate the site, the equipment id, every reading and the note.
fn check(cli: &Cli, args: &RecordArgs) -> anyhow::Result<Plan> {
    let (site, site_source) = load_site(cli.site.as_deref())?;
    let equipment = args.equipment.trim().to_string();
    if !site.has_equipment(&equipment) {
        bail!(unknown_equipment(&site, &equipment));
    }
    let mut payloads = Vec::new();
    let mut errors = Vec::new();
    for text in &args.readings {
        match parse_reading_arg_at(text, site.atmospheric_pressure_pa) {
            Ok(r) => {
                payloads.push(r.payload());
                if let Some(text) = r.conversion_note() {
                    // Said in the journal beside the reading, not only on the terminal.
                    payloads.push(Payload::Finding {
                        severity: Severity::Info,
                        text,
                    });
                }
            }
            Err(e) => errors.push(format!("--reading: {e}")),
        }
    }
    if let Some(note) = &args.note {
        let text = crate::text::sanitize(note, true).trim().to_string();
        if text.is_empty() {
            errors.push("--note is empty; give the note's text, or leave --note out".into());
        }
        payloads.push(Payload::Note { text });
    }
    if args.readings.is_empty() && args.note.is_none() {
        errors.push("nothing to record: give at least one --reading NAME=VALUE or a --note".into());
    }
    if !errors.is_empty() {
        bail!("nothing was written:\n  {}", errors.join("\n  "));
    }
    let operator = match args.operator(cli) {
        Some(o) => crate::text::sanitize(o, false),
        None => os_user(),
    };
    Ok(Plan {
        site,
        site_source,
        equipment,
        operator,
        payloads,
    })
}

fn load_site(path: Option<&Path>) -> anyhow::Result<(Site, String)> {
    let site = crate::site::load_or_demo(path).map_err(|e| anyhow::anyhow!("{e}"))?;
    let source = site.source.clone();
    Ok((site, source))
}

fn unknown_equipment(site: &Site, id: &str) -> String {
    let known: Vec<String> = site
        .equipment_ids()
        .iter()
        .map(|(id, kind)| format!("{id} ({})", kind.name()))
        .collect();
    format!(
        "equipment '{}' is not in site '{}'; known: {}",
        crate::text::sanitize(id, false),
        site.id,
        known.join(", ")
    )
}

/// Why no writer: a request to fix (exit 2) or a journal problem (exit 1).
enum Opening {
    Refused(anyhow::Error),
    Journal(JournalError),
}

fn open(cli: &Cli, args: &RecordArgs, plan: &Plan) -> Result<JournalWriter, Opening> {
    let clock = Box::new(SystemClock);
    let Some(path) = &args.session else {
        let new = NewSession {
            log_dir: args.log_dir(cli),
            site_id: plan.site.id.clone(),
            site_source: plan.site_source.clone(),
            operator: plan.operator.clone(),
        };
        let writer = JournalWriter::create(&new, clock).map_err(classify)?;
        if let Some(p) = writer.path() {
            eprintln!("rheoside: new session file {}", p.display());
        }
        return Ok(writer);
    };
    // The site is checked on a read-only look first: resuming writes a record.
    let peek = crate::journal::load(path).map_err(classify)?;
    if let Some(id) = peek.site_id()
        && id != plan.site.id
    {
        return Err(Opening::Refused(anyhow::anyhow!(
            "session file {} belongs to site '{}', not '{}'; give the matching --site, \
             or leave out --session to start a new session; nothing was written",
            path.display(),
            crate::text::sanitize(id, false),
            plan.site.id
        )));
    }
    let Resumed { writer, loaded } =
        JournalWriter::resume(path, &plan.operator, clock).map_err(classify)?;
    if let Some(torn) = &loaded.torn {
        eprintln!("rheoside: {}: {torn}", path.display());
    }
    Ok(writer)
}

fn classify(e: JournalError) -> Opening {
    match e {
        JournalError::Busy { .. }
        | JournalError::CreateDir { .. }
        | JournalError::Recover { .. }
        | JournalError::Unsaved { .. } => Opening::Journal(e),
        other => Opening::Refused(anyhow::Error::new(other).context("nothing was written")),
    }
}

/// Say plainly what did not reach the disk; the process is about to exit, so it is lost.
fn not_saved(e: &JournalError, unsaved: usize) -> ExitCode {
    eprintln!("rheoside: {e}");
    eprintln!(
        "rheoside: {unsaved} record(s) of this command were NOT saved (only the numbers \
         printed on stdout were); run it again for the rest"
    );
    ExitCode::from(EXIT_NOT_SAVED)
}
