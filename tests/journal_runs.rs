//! The journal tells the truth about how each run of a session ended: a `record` run closes
//! its session, a killed run leaves no end record, and the resume that follows journals
//! which it was, so the handover report can say "the previous run did not end".

use rheoside::journal::{Payload, PreviousEnd, load};
use std::io::{BufRead, BufReader};
use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};

fn bin() -> PathBuf {
    assert_cmd::cargo::cargo_bin("rheoside")
}

fn record(dir: &Path, session: Option<&Path>, n: usize) -> Command {
    let mut cmd = Command::new(bin());
    cmd.env_remove("RHEOSIDE_LOG_DIR")
        .current_dir(dir)
        .args(["record", "--operator", "runs-test", "--equipment", "VIS-A"])
        .args(["--log-dir", dir.to_str().unwrap()]);
    if let Some(s) = session {
        cmd.arg("--session").arg(s);
    }
    for k in 0..n {
        cmd.arg("--reading").arg(format!("flow={k} m3/h"));
    }
    cmd
}

fn journal_in(dir: &Path) -> PathBuf {
    let mut files: Vec<PathBuf> = std::fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|x| x == "jsonl"))
        .collect();
    assert_eq!(files.len(), 1, "{files:?}");
    files.remove(0)
}

fn report(dir: &Path, path: &Path) -> String {
    let out = Command::new(bin())
        .current_dir(dir)
        .arg("report")
        .arg(path)
        .output()
        .unwrap();
    String::from_utf8(out.stdout).unwrap()
}

#[test]
fn a_one_shot_record_session_is_closed_not_a_crash() {
    let dir = tempfile::tempdir().unwrap();
    let out = record(dir.path(), None, 2).output().unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    // Only the readings' numbers are printed; the end record is not one of them.
    assert_eq!(String::from_utf8_lossy(&out.stdout), "2\n3\n");
    let path = journal_in(dir.path());
    let loaded = load(&path).unwrap();
    assert_eq!(loaded.records.last().unwrap().payload, Payload::SessionEnd);
    let md = report(dir.path(), &path);
    assert!(!md.contains("crash"), "{md}");
    assert!(md.contains("| Runs | 1 |"), "{md}");
    // A second `record` on the same session: resumed after a clean end, closed again.
    let out = record(dir.path(), Some(&path), 1).output().unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let kinds: Vec<&str> = load(&path)
        .unwrap()
        .records
        .iter()
        .map(|r| r.payload.kind())
        .collect::<Vec<_>>()
        .into_iter()
        .collect();
    assert_eq!(
        kinds,
        [
            "session-start",
            "reading",
            "reading",
            "session-end",
            "session-resumed",
            "reading",
            "session-end"
        ]
    );
    let md = report(dir.path(), &path);
    assert!(
        md.contains("resumed at record 5") && md.contains("after a clean end"),
        "{md}"
    );
    assert!(!md.contains("did not end"), "{md}");
}

/// Start a long `record` run and SIGKILL it after its first saved record; `true` when it
/// was still running (so it left no end record).
fn kill_mid_run(dir: &Path) -> bool {
    let mut child = record(dir, None, 3000)
        .stdout(Stdio::piped())
        .stderr(Stdio::null())
        .spawn()
        .unwrap();
    let mut first = String::new();
    BufReader::new(child.stdout.take().unwrap())
        .read_line(&mut first)
        .unwrap();
    let running = child.try_wait().unwrap().is_none();
    child.kill().unwrap();
    child.wait().unwrap();
    running
}

#[test]
fn kill_and_resume_shows_the_run_that_did_not_end_in_the_report() {
    let dir = tempfile::tempdir().unwrap();
    let mut attempts = 0;
    while !kill_mid_run(dir.path()) {
        // The run finished before the kill landed: start again in a fresh folder.
        attempts += 1;
        assert!(attempts < 5, "the run always finished before the kill");
        for f in std::fs::read_dir(dir.path()).unwrap() {
            std::fs::remove_file(f.unwrap().path()).unwrap();
        }
    }
    let path = journal_in(dir.path());
    let before = load(&path).unwrap();
    assert_ne!(before.records.last().unwrap().payload, Payload::SessionEnd);
    let md = report(dir.path(), &path);
    assert!(md.contains("No session-end record"), "{md}");

    let out = record(dir.path(), Some(&path), 1).output().unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let after = load(&path).unwrap();
    let resumed = after
        .records
        .iter()
        .find(|r| matches!(r.payload, Payload::SessionResumed { .. }))
        .expect("a session-resumed record");
    assert_eq!(
        resumed.payload,
        Payload::SessionResumed {
            previous_end: PreviousEnd::NoEndRecord
        }
    );
    let md = report(dir.path(), &path);
    let line = format!("Record {}", resumed.seq);
    assert!(md.contains(&line), "{md}");
    assert!(
        md.contains(
            "the previous run did not end (no session-end record: a crash, a kill or a power loss)"
        ),
        "{md}"
    );
    // The resumed run closed cleanly, so the session as a whole is closed.
    assert!(
        !md.contains("No session-end record: the session was not closed"),
        "{md}"
    );
    let json = Command::new(bin())
        .current_dir(dir.path())
        .args(["report", "--format", "json"])
        .arg(&path)
        .output()
        .unwrap();
    let v: serde_json::Value = serde_json::from_slice(&json.stdout).unwrap();
    assert_eq!(
        v["sessions"][0]["resumptions"][0]["previous_end"],
        "no-end-record"
    );
}
