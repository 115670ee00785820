//! Before the terminal is touched: load the site, open (or resume) the journal, build the
//! app. After it is given back: one line on where the journal is.

use super::EXIT_BAD_INPUT;
use super::app::App;
use super::ctx::{Ctx, Picks, SessionClock};
use super::options::TuiOptions;
use super::session_log::SessionLog;
use super::strings::{self, exit, status};
use super::theme::{ColourMode, Glyphs, Theme};
use crate::journal::{JournalWriter, NewSession, SystemClock};
use crate::session::SessionState;
use crate::site::Site;
use anyhow::{Context as _, bail};
use chrono::{DateTime, FixedOffset};
use std::path::PathBuf;
use std::process::ExitCode;

/// Where journals go when neither `--log-dir` nor `RHEOSIDE_LOG_DIR` says.
const DEFAULT_LOG_DIR: &str = "logs";

/// Everything the loop needs.
pub struct Start {
    pub app: App,
    pub writer: JournalWriter,
}

/// An app on a site with an empty journal: for tests, benches and `prepare`.
pub fn app_for(
    site: Site,
    operator: &str,
    theme: Theme,
    now: DateTime<FixedOffset>,
    journal_path: &str,
) -> App {
    let ctx = Ctx {
        site,
        operator: operator.to_string(),
        picks: Picks::default(),
        session: SessionState::default(),
        log: SessionLog::default(),
        clock: SessionClock { started: now, now },
        theme,
        journal_path: journal_path.to_string(),
    };
    App::new(ctx, status::WELCOME)
}

/// Load and open everything; `Ok(Err(code))` when the site config has errors (already
/// printed, all of them, to stderr).
pub fn prepare(cli: &TuiOptions) -> anyhow::Result<Result<Start, ExitCode>> {
    let (site, source) = match load_site(cli) {
        Ok(s) => s,
        Err(code) => return Ok(Err(code)),
    };
    let operator = cli.operator.clone().unwrap_or_else(crate::journal::os_user);
    let glyphs = Glyphs::detect(cli.ascii);
    let theme = Theme::new(ColourMode::detect(), glyphs);
    let now = chrono::Local::now().fixed_offset();
    let Some(resume) = &cli.resume else {
        let new = NewSession {
            log_dir: cli
                .log_dir
                .clone()
                .unwrap_or_else(|| PathBuf::from(DEFAULT_LOG_DIR)),
            site_id: site.id.clone(),
            site_source: source,
            operator: operator.clone(),
        };
        let mut writer = JournalWriter::create(&new, Box::new(SystemClock))?;
        let path = writer
            .path()
            .map(|p| p.display().to_string())
            .unwrap_or_default();
        let mut app = app_for(site, writer.operator(), theme, now, &path);
        app.apply_saved(&writer.take_numbered());
        return Ok(Ok(Start { app, writer }));
    };
    // The site is checked on a read-only load first: a journal of another site is refused
    // before resuming writes anything to it (the resume record, a torn tail set aside).
    let peek = crate::journal::load(resume)
        .with_context(|| format!("cannot resume {}", resume.display()))?;
    if let Some(id) = peek.site_id()
        && id != site.id
    {
        bail!(
            "{} was written for site '{}', but site '{}' is loaded; pass that site's config with --site",
            resume.display(),
            crate::text::sanitize(id, false),
            site.id
        );
    }
    let mut resumed = JournalWriter::resume(resume, &operator, Box::new(SystemClock))
        .with_context(|| format!("cannot resume {}", resume.display()))?;
    let loaded = resumed.loaded;
    let path = resume.display().to_string();
    let mut app = app_for(site, resumed.writer.operator(), theme, now, &path);
    app.resume_from(&loaded.records);
    // Anything the journal wrote on resuming (after the loaded records) joins the state.
    app.apply_saved(&resumed.writer.take_numbered());
    if let Some(torn) = &loaded.torn {
        app.set_status(format!("{}: {torn}", strings::journal::TORN));
    }
    Ok(Ok(Start {
        app,
        writer: resumed.writer,
    }))
}

fn load_site(cli: &TuiOptions) -> Result<(Site, String), ExitCode> {
    let loaded = crate::site::load_or_demo(cli.site.as_deref()).map(|s| {
        let source = s.source.clone();
        (s, source)
    });
    loaded.map_err(|errors| {
        eprintln!("{errors}");
        eprintln!("rheoside: the site config has errors; the screen UI was not started");
        ExitCode::from(EXIT_BAD_INPUT)
    })
}

/// After the terminal is back: where the journal is, or what could not be saved.
pub fn farewell(app: &App, signalled: bool) -> ExitCode {
    // After a hang-up the terminal is gone and writing to it fails; `println!` would panic
    // then, so the parting lines are best effort.
    use std::io::Write as _;
    let unsaved = app.ctx.unsaved();
    if unsaved > 0 {
        let _ = writeln!(
            std::io::stderr(),
            "{} ({unsaved}): {}",
            exit::UNSAVED,
            app.ctx.journal_path
        );
        return ExitCode::FAILURE;
    }
    if signalled {
        let _ = writeln!(std::io::stderr(), "{}", status::SIGNAL);
    }
    let saved = app.ctx.log.saved_through();
    let _ = writeln!(
        std::io::stdout(),
        "{} {} ({saved} {})",
        exit::SAVED_TO,
        app.ctx.journal_path,
        exit::RECORDS
    );
    ExitCode::SUCCESS
}
