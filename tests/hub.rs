//! The session hub's promises (issue: one hub under both faces): the same journalled set
//! shows the same numbers in the same units on the Flow curve view, in `fit` and in
//! `report`; saving a set fits it once; a model picked by hand survives replay, resume and
//! the report; options of the screens are refused by the subcommands.

use crate::support;
use crate::support::{press, type_text};
use assert_cmd::Command;
use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use rheoside::journal::{Payload, Record};
use rheoside::present::{self, Style};
use rheoside::session::{FlowCurveInput, FlowCurveOptions, analyse};
use rheoside::site::Site;
use rheoside::tui::app::App;
use rheoside::tui::startup;
use rheoside::tui::theme::{ColourMode, Glyphs, Theme};
use rheoside::units::UnitSystem;
use std::io::Write as _;
use std::path::{Path, PathBuf};

/// Six invented dial readings of a sauce-like product on the standard six-speed geometry.
const SPEEDS: [f64; 6] = [600.0, 300.0, 200.0, 100.0, 6.0, 3.0];
const DIALS: [&str; 6] = ["110", "76", "61.5", "44", "16", "14"];

/// The bundled demo site switched to US customary units (an invented plant).
fn us_site_text() -> String {
    rheoside::site::DEMO_TOML.replace("unit_system = \"si\"", "unit_system = \"us-customary\"")
}

fn us_site() -> Site {
    rheoside::site::load_str(&us_site_text(), "us.toml").expect("the US variant loads")
}

fn write(dir: &Path, name: &str, text: &str) -> PathBuf {
    let path = dir.join(name);
    std::fs::write(&path, text).expect("a temp file");
    path
}

fn app_on(site: Site) -> App {
    let now = chrono::DateTime::parse_from_rfc3339("2026-12-01T08:00:00+01:00").expect("time");
    let theme = Theme::new(ColourMode::Plain, Glyphs::Unicode);
    startup::app_for(site, "ana", theme, now, "logs/test.jsonl")
}

/// Pick TK-1 and its product, type the six dials, save: the records the journal numbers.
fn save_set(app: &mut App) -> Vec<Record> {
    save_dials(app, &DIALS)
}

fn save_dials(app: &mut App, dials: &[&str]) -> Vec<Record> {
    press(app, KeyCode::Enter);
    press(app, KeyCode::Enter);
    press(app, KeyCode::Tab);
    for d in dials {
        type_text(app, d);
        press(app, KeyCode::Enter);
    }
    // Ctrl-S saves from anywhere in the form (a plain `s` would type).
    app.on_key(&KeyEvent::new(KeyCode::Char('s'), KeyModifiers::CONTROL));
    support::journal_answers(app, true)
}

fn screen(app: &App) -> String {
    let mut t = Terminal::new(TestBackend::new(100, 40)).expect("a test terminal");
    t.draw(|f| rheoside::tui::render::draw(app, f))
        .expect("drawing into memory");
    support::screen_text(t.backend().buffer())
}

/// A journal file holding these records, as the writer would have left it.
fn journal_file(dir: &Path, records: &[Record]) -> PathBuf {
    let path = dir.join("marrowdale-u4_20261201T070000Z_test.jsonl");
    let mut f = std::fs::File::create(&path).expect("a journal file");
    for r in records {
        let line = serde_json::to_string(r).expect("a record encodes");
        writeln!(f, "{line}").expect("written");
    }
    path
}

fn start_record(site: &Site) -> Record {
    Record {
        seq: 1,
        session: "test-session".into(),
        utc: chrono::DateTime::parse_from_rfc3339("2026-12-01T07:00:00Z")
            .expect("time")
            .to_utc(),
        offset: chrono::FixedOffset::east_opt(3600).expect("offset"),
        operator: "ana".into(),
        equipment: None,
        payload: Payload::SessionStart {
            site_id: site.id.clone(),
            site_source: site.source.clone(),
        },
        version: env!("CARGO_PKG_VERSION").into(),
    }
}

/// The constants of the set as the presentation layer words them on a US-customary site:
/// the lines every face must show.
fn expected_lines() -> Vec<String> {
    let readings: Vec<rheoside::instrument::DialReading> = SPEEDS
        .iter()
        .zip(DIALS)
        .map(|(&r, d)| rheoside::instrument::DialReading::new(r, d.parse().expect("a dial")))
        .collect();
    let input = FlowCurveInput::Dial {
        geometry: &rheoside::instrument::Geometry::StandardSixSpeed,
        readings: &readings,
    };
    let curve = analyse(input, &FlowCurveOptions::default()).expect("the set fits");
    let style = Style::new(UnitSystem::UsCustomary, false);
    curve
        .fit
        .estimates
        .iter()
        .map(|e| present::estimate(e, style))
        .collect()
}

/// The view, `fit` and `report` on one US-customary set.
struct ThreeFaces {
    view: String,
    fit: String,
    report: String,
}

fn three_faces() -> ThreeFaces {
    let dir = tempfile::tempdir().expect("a temp dir");
    let site_path = write(dir.path(), "us.toml", &us_site_text());
    let mut app = app_on(us_site());
    let start = start_record(&app.ctx.site);
    app.apply_saved(std::slice::from_ref(&start));
    let mut records = vec![start];
    records.extend(save_set(&mut app));
    let view = screen(&app);

    let csv: String = std::iter::once("rpm,dial".to_string())
        .chain(SPEEDS.iter().zip(DIALS).map(|(r, d)| format!("{r},{d}")))
        .collect::<Vec<_>>()
        .join("\n");
    let csv_path = write(dir.path(), "set.csv", &csv);
    let site_arg = site_path.to_str().expect("UTF-8");
    let fit = Command::cargo_bin("rheoside")
        .expect("the binary")
        .args(["fit", csv_path.to_str().expect("UTF-8")])
        .args(["--site", site_arg, "--viscometer", "VIS-A"])
        .output()
        .expect("fit runs");
    assert!(
        fit.status.success(),
        "{}",
        String::from_utf8_lossy(&fit.stderr)
    );

    let journal = journal_file(dir.path(), &records);
    let report = Command::cargo_bin("rheoside")
        .expect("the binary")
        .args([
            "report",
            journal.to_str().expect("UTF-8"),
            "--site",
            site_arg,
        ])
        .output()
        .expect("report runs");
    assert!(
        report.status.success(),
        "{}",
        String::from_utf8_lossy(&report.stderr)
    );
    ThreeFaces {
        view,
        fit: String::from_utf8_lossy(&fit.stdout).into_owned(),
        report: String::from_utf8_lossy(&report.stdout).into_owned(),
    }
}

fn both_show(a: &str, b: &str, what: &str) {
    for line in expected_lines() {
        assert!(
            a.contains(&line),
            "{what}: {line:?} missing from the first:\n{a}"
        );
        assert!(
            b.contains(&line),
            "{what}: {line:?} missing from the second:\n{b}"
        );
    }
    // Stress in lbf/100ft², never Pa, on a US-customary site (the unit of τ0 and of K).
    assert!(
        a.contains("lbf/100ft2") && b.contains("lbf/100ft2"),
        "{what}"
    );
}

#[test]
fn the_flow_curve_view_and_fit_show_the_same_numbers_on_a_us_site() {
    let f = three_faces();
    both_show(&f.view, &f.fit, "view and fit");
}

#[test]
fn fit_and_the_report_show_the_same_numbers_on_a_us_site() {
    let f = three_faces();
    both_show(&f.fit, &f.report, "fit and report");
}

#[test]
fn the_flow_curve_view_and_the_report_show_the_same_numbers_on_a_us_site() {
    let f = three_faces();
    both_show(&f.view, &f.report, "view and report");
    // The reason is worded in the site's units as well (it once said Pa on every site).
    let why = f
        .report
        .lines()
        .find(|l| l.contains("Why:"))
        .unwrap_or_default();
    assert!(!why.contains(" Pa,") && !why.contains(" Pa "), "{why}");
}

#[test]
fn saving_a_set_fits_it_once() {
    let mut app = support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/t.jsonl");
    let before = rheoside::session::curves_fitted_on_this_thread();
    let records = save_set(&mut app);
    let fitted = rheoside::session::curves_fitted_on_this_thread() - before;
    assert_eq!(fitted, 1, "the set was fitted {fitted} times");
    // ...and what was journalled names the set it was computed from.
    let set_seq = records
        .iter()
        .find(|r| matches!(r.payload, Payload::ViscometerSet { .. }))
        .map(|r| r.seq)
        .expect("a set record");
    assert!(records.iter().any(|r| matches!(
        &r.payload,
        Payload::Result { from, result_kind: Some(_), .. } if from == &[set_seq]
    )));
    assert!(screen(&app).contains("Herschel–Bulkley (auto)"));
}

#[test]
fn a_model_picked_by_hand_survives_replay_resume_and_the_report() {
    let dir = tempfile::tempdir().expect("a temp dir");
    let mut app = support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/t.jsonl");
    let start = app.ctx.session.log.clone();
    let mut records = start;
    records.extend(save_set(&mut app));
    press(&mut app, KeyCode::Char('m'));
    records.extend(support::journal_answers(&mut app, true));
    assert!(screen(&app).contains("Newtonian (by hand)"));

    // Resume: a fresh app replays the file and shows the same.
    let mut again = support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/t.jsonl");
    again.ctx.session = Default::default();
    again.resume_from(&records);
    assert!(
        screen(&again).contains("Newtonian (by hand)"),
        "{}",
        screen(&again)
    );

    // The report recomputes and shows the by-hand model, and what was seen at the time.
    let journal = journal_file(dir.path(), &records);
    let out = Command::cargo_bin("rheoside")
        .expect("the binary")
        .args(["report", journal.to_str().expect("UTF-8")])
        .output()
        .expect("report runs");
    let md = String::from_utf8_lossy(&out.stdout);
    assert!(md.contains("**Newtonian**"), "{md}");
    assert!(md.contains("Newtonian chosen by hand"), "{md}");
}

// Issue: a pegged dial is left out by default, "with a key to include it", the same rule in
// the screens, `fit` and the report. The 600 rpm dial at 300 is at full scale on the
// six-speed geometry (VIS-A). `i` keeps it (a journalled choice); the curve shown must be the
// one `analyse` gives with OffScale::Include (what `fit --include-off-scale` runs), and a
// replay of the journal must show the same; `i` again leaves it out.
#[test]
fn a_pegged_dial_kept_by_hand_agrees_with_the_command_line_and_survives_replay() {
    use rheoside::session::SessionState;
    use rheoside::session::checks::OffScale;
    let pegged = ["300", "76", "61.5", "44", "16", "14"];
    let mut app = support::demo_app(ColourMode::Plain, Glyphs::Unicode, "ana", "logs/t.jsonl");
    let mut records = app.ctx.session.log.clone();
    records.extend(save_dials(&mut app, &pegged));
    let left_out = |app: &App| {
        let set = app.ctx.session.latest_set().expect("a set");
        set.item.shown().as_ref().expect("a curve").left_out.len()
    };
    assert_eq!(left_out(&app), 1, "the pegged dial is left out by default");

    press(&mut app, KeyCode::Char('i'));
    records.extend(support::journal_answers(&mut app, true));
    assert!(records.iter().any(|r| matches!(
        r.payload,
        Payload::Choice {
            include_off_scale: true,
            ..
        }
    )));
    assert_eq!(left_out(&app), 0, "kept after i");

    let readings: Vec<rheoside::instrument::DialReading> = SPEEDS
        .iter()
        .zip(pegged)
        .map(|(&rpm, d)| rheoside::instrument::DialReading::new(rpm, d.parse().expect("a dial")))
        .collect();
    let opts = FlowCurveOptions {
        off_scale: OffScale::Include,
        ..FlowCurveOptions::default()
    };
    let input = FlowCurveInput::Dial {
        geometry: &rheoside::instrument::Geometry::StandardSixSpeed,
        readings: &readings,
    };
    let cli = analyse(input, &opts).expect("the command line's fit");
    let shown = |state: &SessionState| {
        let set = state.latest_set().expect("a set");
        set.item.shown().as_ref().expect("a curve").fit.model
    };
    assert_eq!(shown(&app.ctx.session), cli.fit.model);

    let site = rheoside::site::demo().expect("the demo site");
    let replayed = SessionState::replay(&site, &records);
    assert_eq!(
        shown(&replayed),
        cli.fit.model,
        "a replay keeps the dial too"
    );

    press(&mut app, KeyCode::Char('i'));
    support::journal_answers(&mut app, true);
    assert_eq!(left_out(&app), 1, "i again leaves it out");
}

fn refused(args: &[&str], says: &str) {
    let out = Command::cargo_bin("rheoside")
        .expect("the binary")
        .args(args)
        .env_remove("RHEOSIDE_LOG_DIR")
        .output()
        .expect("it runs");
    assert_eq!(out.status.code(), Some(2), "{args:?}");
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains(says), "{args:?}: {err}");
}

#[test]
fn options_of_the_screens_are_refused_by_the_subcommands() {
    let dir = tempfile::tempdir().expect("a temp dir");
    let logs = dir.path().to_str().expect("UTF-8");
    let rec = ["record", "--equipment", "P-1", "--reading", "flow=3 m3/h"];
    let mut before_cmd = vec!["--ascii", "--log-dir", logs];
    before_cmd.extend(rec);
    refused(&before_cmd, "--ascii only acts on the screens");
    let mut resume = vec!["--resume", "x.jsonl", "--log-dir", logs];
    resume.extend(rec);
    refused(&resume, "'record' does not take it");
    // Given after the subcommand, the parser itself says the option is not one of record's.
    let mut after = vec!["--log-dir", logs];
    after.extend(rec);
    after.push("--ascii");
    refused(&after, "--ascii");
    refused(&["fit", "x.csv", "--resume", "y.jsonl"], "--resume");
    assert_eq!(
        std::fs::read_dir(dir.path())
            .map(|d| d.count())
            .unwrap_or(0),
        0,
        "nothing was journalled"
    );
}

// A journal of another site is refused on resume before anything is written to it (the
// resume record used to be appended first, then the site compared).
#[test]
fn resuming_another_sites_journal_is_refused_and_leaves_the_file_as_it_was() {
    use rheoside::journal::{JournalWriter, NewSession, Payload as P};
    let dir = tempfile::tempdir().expect("a temp dir");
    let new = NewSession {
        log_dir: dir.path().to_path_buf(),
        site_id: "marrowdale-u4".into(),
        site_source: "bundled demo site (invented plant)".into(),
        operator: "ana".into(),
    };
    let mut w =
        JournalWriter::create(&new, Box::new(rheoside::journal::SystemClock)).expect("a journal");
    w.append(
        None,
        P::Note {
            text: "before".into(),
        },
    )
    .expect("saved");
    let path = w.path().expect("a file").to_path_buf();
    drop(w);
    let before = std::fs::read(&path).expect("readable");
    let other = rheoside::site::DEMO_TOML.replace("id = \"marrowdale-u4\"", "id = \"other-site\"");
    assert_ne!(
        other,
        rheoside::site::DEMO_TOML,
        "the demo's site id moved; update this test"
    );
    let site = write(dir.path(), "other.toml", &other);
    let opts = rheoside::tui::TuiOptions {
        site: Some(site),
        resume: Some(path.clone()),
        log_dir: None,
        operator: Some("bo".into()),
        ascii: false,
    };
    let refused = startup::prepare(&opts);
    let message = match refused {
        Err(e) => format!("{e:#}"),
        Ok(_) => panic!("resuming another site's journal was accepted"),
    };
    assert!(
        message.contains("was written for site 'marrowdale-u4'"),
        "{message}"
    );
    assert_eq!(
        std::fs::read(&path).expect("readable"),
        before,
        "the journal was changed"
    );
}
