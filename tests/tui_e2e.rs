//! End to end in a pseudo-terminal: the real binary at 80×24 on the demo site, a six-speed
//! viscometer set typed as an operator would, the fitted model read off the parsed screen,
//! then the journal file checked. Also: SIGTERM flushes and restores, a bad site config
//! stops before the screen is touched, and a pipe gets a hint instead of a screen.

use crate::support;

use portable_pty::{Child, CommandBuilder};
use rheoside::instrument::{DialReading, Geometry};
use rheoside::journal::{Payload, load};
use rheoside::rheology::ParamName;
use rheoside::session::{FlowCurveInput, FlowCurveOptions, analyse};
use std::io::{Read, Write};
use std::num::NonZeroU16;
use std::path::{Path, PathBuf};
use std::sync::atomic::{AtomicBool, Ordering};
use std::sync::{Arc, Mutex};
use std::time::{Duration, Instant};

const WAIT: Duration = Duration::from_secs(30);

/// The binary running in a pty, its screen parsed as it arrives.
pub(crate) struct Session {
    child: Box<dyn Child + Send + Sync>,
    writer: Box<dyn Write + Send>,
    screen: Arc<Mutex<vt100::Parser>>,
    /// Set once the pty has closed, so everything the program wrote has been parsed.
    drained: Arc<AtomicBool>,
}

impl Session {
    pub(crate) fn start(args: &[&str]) -> Session {
        Session::start_on(args, "xterm-256color", &[])
    }

    /// The binary on a terminal of this TERM, with extra environment variables.
    fn start_on(args: &[&str], term: &str, env: &[(&str, &str)]) -> Session {
        let pty = support::pty_80x24();
        let mut cmd = CommandBuilder::new(assert_cmd::cargo::cargo_bin("rheoside"));
        cmd.args(args);
        cmd.env("TERM", term);
        cmd.env_remove("NO_COLOR");
        cmd.env_remove("RHEOSIDE_LOG_DIR");
        for (k, v) in env {
            cmd.env(k, v);
        }
        let child = pty.slave.spawn_command(cmd).expect("the binary starts");
        drop(pty.slave);
        let mut reader = pty.master.try_clone_reader().expect("a pty reader");
        let writer = pty.master.take_writer().expect("a pty writer");
        let (rows, cols) = (
            NonZeroU16::new(24).expect("24"),
            NonZeroU16::new(80).expect("80"),
        );
        let screen = Arc::new(Mutex::new(vt100::Parser::new(rows, cols, 0)));
        let sink = Arc::clone(&screen);
        let drained = Arc::new(AtomicBool::new(false));
        let done = Arc::clone(&drained);
        std::thread::spawn(move || {
            let mut buf = [0u8; 4096];
            while let Ok(n) = reader.read(&mut buf) {
                if n == 0 {
                    break;
                }
                sink.lock().expect("screen lock").process(&buf[..n]);
            }
            done.store(true, Ordering::SeqCst);
            drop(pty.master);
        });
        Session {
            child,
            writer,
            screen,
            drained,
        }
    }

    pub(crate) fn text(&self) -> String {
        self.screen.lock().expect("screen lock").screen().contents()
    }

    /// Poll the parsed screen until it holds `want` (no fixed sleeps).
    pub(crate) fn wait_for(&self, want: &str) -> String {
        self.wait_for_all(&[want])
    }

    /// Poll until every piece is on screen at once: a frame arrives in several writes, so
    /// one piece being there says nothing of the rest.
    pub(crate) fn wait_for_all(&self, want: &[&str]) -> String {
        let start = Instant::now();
        loop {
            let text = self.text();
            if want.iter().all(|w| text.contains(w)) {
                return text;
            }
            assert!(
                start.elapsed() < WAIT,
                "waited {WAIT:?} for {want:?}; screen:\n{text}"
            );
            std::thread::sleep(Duration::from_millis(20));
        }
    }

    pub(crate) fn send(&mut self, keys: &str) {
        self.writer
            .write_all(keys.as_bytes())
            .expect("typing into the pty");
        self.writer.flush().expect("flushing the pty");
    }

    pub(crate) fn wait_exit(&mut self) -> portable_pty::ExitStatus {
        let start = Instant::now();
        loop {
            if let Some(status) = self.child.try_wait().expect("child status") {
                self.wait_drained(start);
                return status;
            }
            assert!(
                start.elapsed() < WAIT,
                "the program did not exit; screen:\n{}",
                self.text()
            );
            std::thread::sleep(Duration::from_millis(20));
        }
    }

    fn wait_drained(&self, start: Instant) {
        while !self.drained.load(Ordering::SeqCst) {
            assert!(start.elapsed() < WAIT, "the pty never closed");
            std::thread::sleep(Duration::from_millis(10));
        }
    }

    fn alternate_screen(&self) -> bool {
        self.screen
            .lock()
            .expect("screen lock")
            .screen()
            .alternate_screen()
    }
}

pub(crate) fn journal_in(dir: &Path) -> PathBuf {
    let files: Vec<PathBuf> = std::fs::read_dir(dir)
        .expect("the log folder")
        .filter_map(|e| e.ok().map(|e| e.path()))
        .filter(|p| p.extension().is_some_and(|x| x == "jsonl"))
        .collect();
    assert_eq!(
        files.len(),
        1,
        "one journal expected in {}: {files:?}",
        dir.display()
    );
    files[0].clone()
}

/// Invented readings of an HB-like sauce on the standard six-speed viscometer.
const SPEEDS: [f64; 6] = [600.0, 300.0, 200.0, 100.0, 6.0, 3.0];
const DIALS: [f64; 6] = [110.0, 76.0, 61.5, 44.0, 16.0, 14.0];

/// From the first screen: pick, type the six dials, save; returns the screen once the set
/// is on disk.
fn enter_the_set(s: &mut Session) -> String {
    s.wait_for("Sample point (equipment)");
    // Enter picks tank TK-1 (and its product), Enter again confirms the product, Tab goes
    // on to the readings form, where the first dial field is selected.
    s.send("\r");
    s.wait_for("* TK-1");
    s.send("\r\t");
    s.wait_for("Viscometer set");
    for d in ["110", "76", "61.5", "44", "16", "14"] {
        s.send(&format!("{d}\r"));
    }
    // Row 6 shows what it will store: 3 rpm x 1.7023 = 5.11 1/s, 14 x 0.511 = 7.15 Pa
    // (API RP 13D standard geometry constants).
    s.wait_for("5.11 1/s  7.15 Pa");
    // Ctrl-S (0x13) saves; a plain `s` would type into the field.
    s.send("\x13");
    // The set's own line says "saved" only once the writer thread has fsynced it, and the
    // top bar once the curve journalled after it is on disk too.
    s.wait_for("chilli-sauce  saved");
    s.wait_for("journal saved")
}

#[test]
fn an_operator_enters_a_set_sees_its_fit_and_quits() {
    let logs = tempfile::tempdir().expect("a temp dir");
    let log_dir = logs.path().to_str().expect("a UTF-8 path");
    let mut s = Session::start(&["--log-dir", log_dir, "--operator", "e2e"]);
    enter_the_set(&mut s);

    // The constants on screen are the ones the engine fits to the same readings...
    let readings: Vec<DialReading> = SPEEDS
        .iter()
        .zip(DIALS)
        .map(|(&r, d)| DialReading::new(r, d))
        .collect();
    let input = FlowCurveInput::Dial {
        geometry: &Geometry::StandardSixSpeed,
        readings: &readings,
    };
    let curve = analyse(input, &FlowCurveOptions::default()).expect("the set fits");
    assert_eq!(curve.fit.model.kind().title(), "Herschel–Bulkley");
    let mut want = vec!["Herschel–Bulkley (auto)".to_string()];
    for e in &curve.fit.estimates {
        want.push(format!("{} {}", e.name.symbol(), e.name.label()));
        let shown = rheoside::present::estimate(e, rheoside::present::Style::SI);
        want.push(format!("   {shown}"));
    }
    let want: Vec<&str> = want.iter().map(String::as_str).collect();
    s.wait_for_all(&want);
    // ...and near the law the dials were made from: τ = 5 + 0.8·γ̇^0.6 Pa at the standard
    // geometry's Newtonian rates (1.7023 s⁻¹ per rpm, 0.511 Pa per degree; API RP 13D),
    // rounded to the dial. The fit uses the n-corrected rates, so allow 10 %.
    let by = |sym: &str| {
        curve
            .fit
            .estimates
            .iter()
            .find(|e| e.name.symbol() == sym)
            .map(|e| e.value)
    };
    assert!((by("τ0").unwrap_or(0.0) - 5.0).abs() < 0.5);
    assert!((by("K").unwrap_or(0.0) - 0.8).abs() < 0.08);
    assert!((by("n").unwrap_or(0.0) - 0.6).abs() < 0.06);

    // The save left the form, so `q` is a key again.
    s.send("q");
    let status = s.wait_exit();
    assert!(
        status.success(),
        "exit status {status:?}; screen:\n{}",
        s.text()
    );
    assert!(!s.alternate_screen(), "the terminal was given back");

    let journal = load(&journal_in(logs.path())).expect("the journal reads back");
    assert!(journal.torn.is_none());
    let set = journal
        .records
        .iter()
        .find_map(|r| match &r.payload {
            Payload::ViscometerSet { rows, product, .. } => Some((r, rows, product)),
            _ => None,
        })
        .expect("a viscometer set in the journal");
    assert_eq!(set.0.operator, "e2e");
    assert_eq!(set.0.equipment.as_deref(), Some("TK-1"));
    assert_eq!(set.2, "chilli-sauce");
    let rows: Vec<(String, f64)> = set.1.iter().map(|r| (r.rpm_raw.clone(), r.dial)).collect();
    let want: Vec<(String, f64)> = SPEEDS.iter().map(|r| r.to_string()).zip(DIALS).collect();
    assert_eq!(rows, want);
    // The answer shown is journalled after the set, linked to it, in the `fit --json` shape.
    let result = journal
        .records
        .iter()
        .find(|r| matches!(&r.payload, Payload::Result { from, .. } if from == &[set.0.seq]))
        .expect("a result linked to the set");
    let Payload::Result {
        what,
        data,
        result_kind,
        ..
    } = &result.payload
    else {
        panic!("expected the flow-curve result after the set, got {result:?}");
    };
    assert_eq!(*result_kind, Some(rheoside::journal::ResultKind::FlowCurve));
    assert!(what.starts_with("flow-curve"), "{what}");
    assert_eq!(data["model"], "herschel-bulkley");
    let k = data["params"]["k_pa_sn"].as_f64().expect("K in the result");
    assert!((k - curve.fit.model.param(ParamName::K).expect("K")).abs() < 1e-12);
    assert!(matches!(
        journal.records.last().map(|r| &r.payload),
        Some(Payload::SessionEnd)
    ));
}

/// Letters are text on the form (issue 8): after a saved set, a note with every letter a-z
/// typed into Notes saves nothing, opens nothing and leaves the model as it was.
#[test]
fn every_letter_typed_on_the_readings_form_is_text() {
    let logs = tempfile::tempdir().expect("a temp dir");
    let log_dir = logs.path().to_str().expect("a UTF-8 path");
    let mut s = Session::start(&["--log-dir", log_dir, "--operator", "e2e"]);
    enter_the_set(&mut s);
    s.wait_for("Herschel–Bulkley (auto)");
    // Back to Readings (Shift-Tab twice, past Spot); Enter goes into the form at the first
    // dial and six Downs reach Notes.
    s.send("\x1b[Z\x1b[Z");
    s.wait_for("Viscometer set");
    s.send("\r");
    s.send(&"\x1b[B".repeat(6));
    let note = "sampled: the quick brown fox jumps over the lazy dog";
    s.send(note);
    s.wait_for(note);
    // Accept the note (Enter goes on to the Save set line), leave the form (Esc), and look
    // at the Flow curve view: still the automatic choice.
    s.send("\r\x1b");
    s.wait_for("Enter, Down or a digit goes into the form");
    s.send("\t\t");
    s.wait_for_all(&["Herschel–Bulkley (auto)", "m model"]);
    s.send("q");
    // The note is unsaved input on the form: quitting asks first.
    s.wait_for("The readings form has input that is not saved");
    s.send("y");
    assert!(s.wait_exit().success());
    let journal = load(&journal_in(logs.path())).expect("the journal reads back");
    let kinds: Vec<&str> = journal.records.iter().map(|r| r.payload.kind()).collect();
    assert_eq!(
        kinds,
        ["session-start", "viscometer-set", "result", "session-end"],
        "one set, its curve, no note, no model choice"
    );
}

/// TERM=dumb implies ASCII: plain borders, tau0 and Pa.s^n spelt out, nothing above 0x7f.
#[test]
fn a_dumb_terminal_gets_an_ascii_screen() {
    let logs = tempfile::tempdir().expect("a temp dir");
    let log_dir = logs.path().to_str().expect("a UTF-8 path");
    let mut s = Session::start_on(&["--log-dir", log_dir, "--operator", "e2e"], "dumb", &[]);
    s.wait_for("Sample point (equipment)");
    s.send("\r");
    s.wait_for("* TK-1");
    s.send("\r\t");
    s.wait_for("Viscometer set");
    for d in ["110", "76", "61.5", "44", "16", "14"] {
        s.send(&format!("{d}\r"));
    }
    s.wait_for("5.11 1/s  7.15 Pa");
    s.send("\x13");
    s.wait_for("chilli-sauce  saved");
    let text = s.wait_for_all(&["tau0 yield stress", "Pa.s^n", "R^2", "journal saved"]);
    let bad: Vec<char> = text.chars().filter(|c| !c.is_ascii()).collect();
    assert!(bad.is_empty(), "not ASCII under TERM=dumb: {bad:?}\n{text}");
    assert!(text.contains("+ Model "), "{text}");
    s.send("q");
    assert!(s.wait_exit().success());
}

/// A signal from outside (a closed SSH session, a service stop) still flushes the journal
/// and gives the terminal back.
fn stopped_by(signal: &str) {
    let logs = tempfile::tempdir().expect("a temp dir");
    let log_dir = logs.path().to_str().expect("a UTF-8 path");
    let mut s = Session::start(&["--log-dir", log_dir, "--operator", "e2e"]);
    s.wait_for("Sample point (equipment)");
    s.send("nline L-1 warm to the touch\r");
    s.wait_for("Note sent to the journal");
    assert!(s.alternate_screen());
    let pid = s.child.process_id().expect("a pid");
    let killed = std::process::Command::new("kill")
        .args([signal, &pid.to_string()])
        .status();
    assert!(killed.is_ok_and(|k| k.success()));
    s.wait_exit();
    assert!(!s.alternate_screen(), "the terminal was given back");
    let journal = load(&journal_in(logs.path())).expect("the journal reads back");
    let kinds: Vec<&str> = journal.records.iter().map(|r| r.payload.kind()).collect();
    assert_eq!(kinds, ["session-start", "note", "session-end"]);
}

// Fault drill: a panic inside the loop (F12 with RHEOSIDE_FAULT_DRILL=panic) gives the
// terminal back (main screen, not the alternate one) and what was already saved stays on
// disk; the run has no end record, so a resume reports that it did not end cleanly.
#[test]
fn a_panic_gives_the_terminal_back_and_keeps_what_was_saved() {
    let logs = tempfile::tempdir().expect("a temp dir");
    let log_dir = logs.path().to_str().expect("a UTF-8 path");
    let args = ["--log-dir", log_dir, "--operator", "e2e"];
    let mut s = Session::start_on(
        &args,
        "xterm-256color",
        &[("RHEOSIDE_FAULT_DRILL", "panic")],
    );
    s.wait_for("Sample point (equipment)");
    s.send("nline L-1 warm to the touch\r");
    s.wait_for("journal saved");
    assert!(s.alternate_screen());
    s.send("\x1b[24~"); // F12
    let status = s.wait_exit();
    assert!(!status.success(), "a panic is not a clean exit");
    assert!(!s.alternate_screen(), "the terminal was given back");
    let journal = load(&journal_in(logs.path())).expect("the journal reads back");
    let kinds: Vec<&str> = journal.records.iter().map(|r| r.payload.kind()).collect();
    assert_eq!(kinds, ["session-start", "note"]);
}

#[test]
fn sigterm_flushes_the_journal_and_restores_the_terminal() {
    stopped_by("-TERM");
}

#[test]
fn sighup_flushes_the_journal_and_restores_the_terminal() {
    stopped_by("-HUP");
}

#[test]
fn a_resumed_session_shows_its_last_set_and_appends_to_the_same_file() {
    let logs = tempfile::tempdir().expect("a temp dir");
    let log_dir = logs.path().to_str().expect("a UTF-8 path");
    let mut first = Session::start(&["--log-dir", log_dir, "--operator", "night"]);
    enter_the_set(&mut first);
    first.send("q");
    assert!(first.wait_exit().success());
    let path = journal_in(logs.path());
    let path_text = path.to_str().expect("a UTF-8 path");
    let mut s = Session::start(&[
        "--resume",
        path_text,
        "--log-dir",
        log_dir,
        "--operator",
        "day",
    ]);
    // Four records of the first run, then the session-resumed record written on resume.
    s.wait_for_all(&["Herschel–Bulkley (auto)", "Session resumed with 5 records"]);
    s.send("nhandover: sauce thickening\r");
    s.wait_for("Note sent to the journal");
    s.wait_for("journal saved");
    s.send("q");
    assert!(s.wait_exit().success());
    assert_eq!(journal_in(logs.path()), path, "no second file");
    let journal = load(&path).expect("the journal reads back");
    let who: Vec<(&str, &str)> = journal
        .records
        .iter()
        .map(|r| (r.payload.kind(), r.operator.as_str()))
        .collect();
    assert_eq!(
        who,
        [
            ("session-start", "night"),
            ("viscometer-set", "night"),
            ("result", "night"),
            ("session-end", "night"),
            ("session-resumed", "day"),
            ("note", "day"),
            ("session-end", "day"),
        ]
    );
    let sessions: std::collections::BTreeSet<&str> =
        journal.records.iter().map(|r| r.session.as_str()).collect();
    assert_eq!(sessions.len(), 1);
}

#[test]
fn a_bad_site_config_is_reported_before_the_screen_is_touched() {
    let dir = tempfile::tempdir().expect("a temp dir");
    let site = dir.path().join("bad.toml");
    std::fs::write(&site, "[site]\nid = \"x\"\nnmae = \"typo\"\n").expect("writing the config");
    let log_dir = dir.path().to_str().expect("a UTF-8 path");
    let mut s = Session::start(&[
        "--site",
        site.to_str().expect("a UTF-8 path"),
        "--log-dir",
        log_dir,
    ]);
    let status = s.wait_exit();
    assert_eq!(status.exit_code(), 2);
    let text = s.wait_for("bad.toml");
    assert!(text.contains("nmae"), "{text}");
    assert!(!s.alternate_screen());
}

#[test]
fn without_a_terminal_it_points_to_the_subcommands() {
    let out = assert_cmd::Command::cargo_bin("rheoside")
        .expect("the binary")
        .env_remove("RHEOSIDE_LOG_DIR")
        .output()
        .expect("it runs");
    // Not a terminal: a hint on stderr and exit 2, as for any other wrong place to run.
    assert_eq!(out.status.code(), Some(2));
    let text = String::from_utf8_lossy(&out.stderr);
    assert!(text.contains("rheoside --help"), "{text}");
    assert_eq!(text.lines().count(), 1);
    assert!(out.stdout.is_empty());
}

/// A dropped SSH session or a killed tmux closes the terminal under the program: it must
/// notice, journal its session end and exit, not spin on the dead terminal. Driven through
/// tmux because `tmux kill-server` hangs up the terminal the way an operator's dropped
/// session does (a bare pty close is also sent a SIGHUP that can mask the bug). `.ci/run`
/// installs tmux.
#[test]
fn terminal_hang_up_ends_the_session_cleanly() {
    if std::process::Command::new("tmux")
        .arg("-V")
        .output()
        .is_err()
    {
        eprintln!("tmux not installed: hang-up test not run (.ci/run installs it)");
        return;
    }
    let logs = tempfile::tempdir().expect("a temp dir");
    let socket = format!("rheoside-hangup-{}", std::process::id());
    let tmux = |args: &[&str]| {
        std::process::Command::new("tmux")
            .args(["-L", &socket, "-f", "/dev/null"])
            .args(args)
            .output()
            .expect("tmux runs")
    };
    let bin = assert_cmd::cargo::cargo_bin("rheoside");
    let command = format!(
        "{} --log-dir {} --operator night",
        bin.display(),
        logs.path().display()
    );
    tmux(&["new-session", "-d", "-x", "80", "-y", "24", &command]);
    let start = Instant::now();
    while !String::from_utf8_lossy(&tmux(&["capture-pane", "-p"]).stdout).contains("Sample point") {
        assert!(start.elapsed() < WAIT, "the first screen never came");
        std::thread::sleep(Duration::from_millis(50));
    }
    tmux(&["kill-server"]);
    let start = Instant::now();
    loop {
        let loaded = load(&journal_in(logs.path())).expect("the journal loads");
        if loaded.records.last().map(|r| &r.payload) == Some(&Payload::SessionEnd) {
            break;
        }
        assert!(
            start.elapsed() < Duration::from_secs(10),
            "no session end journalled after the terminal hung up"
        );
        std::thread::sleep(Duration::from_millis(50));
    }
}

/// The headline case on the demo site, in the screens: the paste line L-2 and its lobe pump
/// P-2 after a weekend stop. Three rested-gel readings (invented, made from the demo paste's
/// own build-up τ = 520 − 400·e^(−t/2 h) Pa) are typed on the Restart view and saved with
/// Ctrl-S; the answer is read off the screen, then found in `rheoside report`.
#[test]
fn the_pump_will_not_start_after_a_stop_end_to_end() {
    let logs = tempfile::tempdir().expect("a temp dir");
    let log_dir = logs.path().to_str().expect("a UTF-8 path");
    let mut s = Session::start(&["--log-dir", log_dir, "--operator", "e2e"]);
    s.wait_for("Sample point (equipment)");
    // Down three times to L-2 (tanks come first, then lines), Enter picks it; Down, Enter
    // picks filler-paste.
    s.send("\x1b[B\x1b[B\x1b[B\r");
    s.wait_for("* L-2");
    s.send("\x1b[B\r");
    s.wait_for("* filler-paste");
    // Tab through Readings, Spot, Flow curve and Line to Restart.
    s.send("\t\t\t\t\t");
    s.wait_for_all(&["< L-2 >", "< P-2 >", "Gel readings"]);
    // Down twice into the first gel stress; Tab, Tab to the next row's gel stress.
    s.send("\x1b[B\x1b[B");
    s.send("120.555\t\t151.982\t\t208.480\t");
    // Down to row 5, down to the stop; 62 h is a weekend; Ctrl-S saves.
    s.send("\x1b[B\x1b[B62 h");
    s.wait_for("62 h");
    s.send("\x13");
    // The answer worked out from the journalled readings: the gel after 62 h is the long-rest
    // 520 Pa, and 4·520 Pa·38 m/0.0627 m + 1480·9.80665·2 Pa + 0.2 bar = 13.1 bar, above the
    // 12 bar relief (force balance on the plug; demo site values).
    let screen = s.wait_for_all(&[
        "will not restart: needs 13.1 bar",
        "Answer for L-2 journalled: will not restart",
    ]);
    assert!(screen.contains("After a stop of 62 h"), "{screen}");
    s.wait_for("journal saved");
    s.send("q");
    assert!(s.wait_exit().success(), "screen:\n{}", s.text());

    let path = journal_in(logs.path());
    let out = assert_cmd::Command::cargo_bin("rheoside")
        .expect("the binary")
        .args(["report", path.to_str().expect("a UTF-8 path")])
        .output()
        .expect("the report runs");
    assert!(out.status.success(), "{out:?}");
    let report = String::from_utf8_lossy(&out.stdout);
    assert!(
        report.contains("restart L-2 by P-2 (filler-paste)"),
        "{report}"
    );
    assert!(
        report.contains("will not restart: needs 13.1 bar"),
        "{report}"
    );
    assert!(report.contains("yield-stress"), "{report}");
}
