//! Crash and concurrency: `rheoside record` killed with SIGKILL at random moments, and
//! several writers at once. The claim under test is the journal's own contract: a number
//! printed on stdout is a record that reached the disk, and no line is ever mixed or cut
//! in the middle of the file.

use rheoside::journal::{Payload, load};
use std::collections::BTreeSet;
use std::io::{BufRead, BufReader, Read, Write};
use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};

fn bin() -> PathBuf {
    assert_cmd::cargo::cargo_bin("rheoside")
}

/// An equipment id of the bundled demo site, read from the library so the test follows it.
fn equipment() -> String {
    let site = rheoside::site::demo().expect("the demo site loads");
    let ids = site.equipment_ids();
    ids.first()
        .expect("the demo site has equipment")
        .0
        .to_string()
}

fn record_cmd(dir: &Path, session: Option<&Path>, tag: &str, n: usize) -> Command {
    let mut cmd = Command::new(bin());
    cmd.env_remove("RHEOSIDE_LOG_DIR")
        .current_dir(dir)
        .args([
            "record",
            "--operator",
            "crash-test",
            "--equipment",
            &equipment(),
        ])
        .args(["--log-dir", dir.to_str().unwrap()]);
    if let Some(s) = session {
        cmd.arg("--session").arg(s);
    }
    for k in 0..n {
        cmd.arg("--reading").arg(format!("flow={tag}.{k:03} m3/h"));
    }
    cmd.stdout(Stdio::piped()).stderr(Stdio::piped());
    cmd
}

fn printed_seqs(stdout: &[u8]) -> Vec<u64> {
    let text = std::str::from_utf8(stdout).unwrap();
    text.lines().map(|l| l.trim().parse().unwrap()).collect()
}

fn journals_in(dir: &Path) -> Vec<PathBuf> {
    let mut v: Vec<PathBuf> = std::fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|x| x == "jsonl"))
        .collect();
    v.sort();
    v
}

/// Start a session with one reading, run to completion; returns the file.
fn start_session(dir: &Path) -> PathBuf {
    let out = record_cmd(dir, None, "0", 1).output().unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    assert_eq!(
        printed_seqs(&out.stdout),
        [2],
        "session-start is 1, the reading 2"
    );
    let files = journals_in(dir);
    assert_eq!(files.len(), 1);
    let stderr = String::from_utf8_lossy(&out.stderr);
    assert!(
        stderr.contains(files[0].to_str().unwrap()),
        "path on stderr: {stderr}"
    );
    files[0].clone()
}

/// xorshift64*: enough randomness for kill times; the seed is printed to replay a failure.
struct Rng(u64);

impl Rng {
    fn from_time() -> Self {
        let nanos = std::time::SystemTime::now()
            .duration_since(std::time::UNIX_EPOCH)
            .unwrap()
            .subsec_nanos();
        let seed = u64::from(nanos) | 1;
        eprintln!("kill-time seed: {seed}");
        Rng(seed)
    }
    fn below(&mut self, n: u64) -> u64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        self.0.wrapping_mul(0x2545_f491_4f6c_dd1d) % n
    }
}

/// When to kill a child: at a random moment from its start (so start-up and the torn-tail
/// repair get hit too), or a random moment after its first saved record.
#[derive(Debug, Clone, Copy)]
enum KillAt {
    FromStart(Duration),
    AfterFirstRecord(Duration),
}

/// Kill the child at `at` (SIGKILL on Unix); its stdout up to then, and whether it was
/// still running.
fn kill_at(mut child: Child, at: KillAt) -> (bool, Vec<u8>) {
    let mut stdout = BufReader::new(child.stdout.take().unwrap());
    let mut seen = Vec::new();
    let wait = match at {
        KillAt::FromStart(d) => d,
        KillAt::AfterFirstRecord(d) => {
            stdout.read_until(b'\n', &mut seen).unwrap();
            d
        }
    };
    std::thread::sleep(wait);
    let killed = child.try_wait().unwrap().is_none();
    if killed {
        child.kill().unwrap();
    }
    stdout.read_to_end(&mut seen).unwrap();
    child.wait().unwrap();
    (killed, seen)
}

fn append_raw(path: &Path, bytes: &[u8]) {
    let mut f = std::fs::OpenOptions::new().append(true).open(path).unwrap();
    f.write_all(bytes).unwrap();
}

fn side_files(path: &Path) -> Vec<Vec<u8>> {
    let name = path.file_name().unwrap().to_str().unwrap().to_string();
    let dir = path.parent().unwrap();
    let mut out = Vec::new();
    for e in std::fs::read_dir(dir).unwrap() {
        let p = e.unwrap().path();
        if p.file_name()
            .unwrap()
            .to_str()
            .unwrap()
            .starts_with(&format!("{name}.torn-"))
        {
            let mut bytes = Vec::new();
            std::fs::File::open(&p)
                .unwrap()
                .read_to_end(&mut bytes)
                .unwrap();
            out.push(bytes);
        }
    }
    out
}

#[test]
fn killed_at_random_moments_it_never_loses_a_record_it_reported() {
    let started = Instant::now();
    let dir = tempfile::tempdir().unwrap();
    let path = start_session(dir.path());
    // A debug build takes tens of milliseconds to start; scale the kill times to it.
    let startup = started.elapsed();
    let mut rng = Rng::from_time();
    let mut reported = BTreeSet::from([2u64]);
    let (mut kills, mut fragments) = (0, Vec::new());
    for round in 1..=40u32 {
        let clean_end = load(&path).unwrap().torn.is_none();
        if round % 8 == 4 && clean_end {
            // What a power cut mid-write leaves: the start of a line, never reported saved.
            let fragment = format!("{{\"seq\":999,\"session\":\"cut-{round}\",\"ut");
            append_raw(&path, fragment.as_bytes());
            fragments.push(fragment.into_bytes());
        }
        let mut cmd = record_cmd(dir.path(), Some(&path), &round.to_string(), 150);
        let child = cmd.stderr(Stdio::null()).spawn().unwrap();
        let at = match round % 2 {
            0 => KillAt::AfterFirstRecord(Duration::from_millis(rng.below(40))),
            _ => KillAt::FromStart(startup.mul_f64(0.5) + Duration::from_millis(rng.below(60))),
        };
        let (killed, stdout) = kill_at(child, at);
        kills += u32::from(killed);
        let seqs = printed_seqs(&stdout);
        assert!(
            seqs.windows(2).all(|w| w[1] == w[0] + 1),
            "in order: {seqs:?}"
        );
        reported.extend(seqs);

        let loaded = load(&path).unwrap_or_else(|e| panic!("round {round}: {e}"));
        let in_file: BTreeSet<u64> = loaded.records.iter().map(|r| r.seq).collect();
        let lost: Vec<_> = reported.difference(&in_file).collect();
        assert!(
            lost.is_empty(),
            "round {round}: printed but not in the journal: {lost:?}"
        );
        // Each run opens with a session-resumed record and, if it got that far, ends with a
        // session-end record; everything between is a reading.
        for r in &loaded.records[1..] {
            assert!(
                matches!(
                    r.payload,
                    Payload::Reading { .. } | Payload::SessionEnd | Payload::SessionResumed { .. }
                ),
                "{r:?}"
            );
        }
    }
    // One clean run recovers whatever tail is left; then nothing is torn.
    let out = record_cmd(dir.path(), Some(&path), "99", 1)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let loaded = load(&path).unwrap();
    assert_eq!(loaded.torn, None);
    let side = side_files(&path);
    let distinct: BTreeSet<&Vec<u8>> = side.iter().collect();
    assert_eq!(
        distinct.len(),
        side.len(),
        "a repair cut short reuses its side file"
    );
    for f in &fragments {
        assert!(
            side.contains(f),
            "injected fragment {:?} was set aside",
            String::from_utf8_lossy(f)
        );
    }
    eprintln!(
        "40 rounds: {kills} killed mid-run, {} records, {} side files, {:?}",
        loaded.records.len(),
        side.len(),
        started.elapsed()
    );
    assert!(
        kills >= 10,
        "most rounds should be cut short, only {kills} were"
    );
    assert!(
        reported.len() > 40,
        "the children should get some records saved"
    );
}

#[test]
fn two_writers_on_separate_files_in_one_folder_do_not_mix() {
    let dir = tempfile::tempdir().unwrap();
    let a = record_cmd(dir.path(), None, "1", 120).spawn().unwrap();
    let b = record_cmd(dir.path(), None, "2", 120).spawn().unwrap();
    let outs = [a.wait_with_output().unwrap(), b.wait_with_output().unwrap()];
    for out in &outs {
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
        assert_eq!(printed_seqs(&out.stdout), (2..=121).collect::<Vec<_>>());
    }
    let files = journals_in(dir.path());
    assert_eq!(files.len(), 2, "{files:?}");
    for f in files {
        let loaded = load(&f).unwrap();
        // Start, 120 readings, end: a one-shot `record` run closes its session.
        assert_eq!((loaded.records.len(), loaded.torn), (122, None));
        assert!(matches!(loaded.records[121].payload, Payload::SessionEnd));
        let tags: BTreeSet<String> = readings_of(&loaded.records).map(reading_tag).collect();
        assert_eq!(tags.len(), 1, "one writer per file: {tags:?}");
    }
}

/// The part of the raw text before the dot: which writer wrote the reading.
/// The reading records only (not start, end or resumed).
fn readings_of(
    records: &[rheoside::journal::Record],
) -> impl Iterator<Item = &rheoside::journal::Record> {
    records
        .iter()
        .filter(|r| matches!(r.payload, Payload::Reading { .. }))
}

fn reading_tag(r: &rheoside::journal::Record) -> String {
    match &r.payload {
        Payload::Reading { raw, .. } => raw.split('.').next().unwrap().to_string(),
        other => panic!("{other:?}"),
    }
}

#[test]
fn a_second_writer_on_the_same_file_is_refused_and_nothing_interleaves() {
    let dir = tempfile::tempdir().unwrap();
    let path = start_session(dir.path());
    let held = rheoside::journal::JournalWriter::resume(
        &path,
        "holder",
        Box::new(rheoside::journal::SystemClock),
    )
    .unwrap();
    let before = std::fs::read(&path).unwrap();
    let out = record_cmd(dir.path(), Some(&path), "9", 3)
        .output()
        .unwrap();
    let stderr = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(1), "{stderr}");
    assert!(stderr.contains(path.to_str().unwrap()), "{stderr}");
    assert!(stderr.contains("is open in another rheoside"), "{stderr}");
    #[cfg(target_os = "linux")]
    assert!(
        stderr.contains(&format!("pid {}?", std::process::id())),
        "{stderr}"
    );
    assert!(out.stdout.is_empty());
    assert_eq!(std::fs::read(&path).unwrap(), before, "nothing written");
    drop(held);

    // Two at once on the same file: each runs whole or is refused whole.
    let a = record_cmd(dir.path(), Some(&path), "1", 80)
        .spawn()
        .unwrap();
    let b = record_cmd(dir.path(), Some(&path), "2", 80)
        .spawn()
        .unwrap();
    let outs = [a.wait_with_output().unwrap(), b.wait_with_output().unwrap()];
    let mut printed = BTreeSet::new();
    for out in &outs {
        let stderr = String::from_utf8_lossy(&out.stderr);
        match out.status.code() {
            Some(0) => assert_eq!(printed_seqs(&out.stdout).len(), 80),
            Some(1) => assert!(stderr.contains("open in another rheoside"), "{stderr}"),
            other => panic!("{other:?}: {stderr}"),
        }
        printed.extend(printed_seqs(&out.stdout));
    }
    let loaded = load(&path).unwrap();
    assert_eq!(loaded.torn, None);
    assert_eq!(readings_of(&loaded.records).count(), 1 + printed.len());
    // Each writer's readings form one unbroken run: no interleaving.
    let tags: Vec<String> = readings_of(&loaded.records)
        .skip(1)
        .map(reading_tag)
        .collect();
    let runs = 1 + tags.windows(2).filter(|w| w[0] != w[1]).count();
    assert!(
        !tags.is_empty() && runs <= 2 && tags.len().is_multiple_of(80),
        "{tags:?}"
    );
}

#[test]
fn bad_input_writes_nothing_and_exits_2() {
    let dir = tempfile::tempdir().unwrap();
    let logs = dir.path().join("logs");
    let run = |args: &[&str]| {
        let mut cmd = Command::new(bin());
        cmd.env_remove("RHEOSIDE_LOG_DIR")
            .arg("record")
            .arg("--log-dir")
            .arg(&logs);
        cmd.args(args).output().unwrap()
    };
    let eq = equipment();
    let cases: [&[&str]; 4] = [
        &["--equipment", "NO-SUCH-THING", "--reading", "flow=1"],
        &[
            "--equipment",
            &eq,
            "--reading",
            "flow=1",
            "--reading",
            "flow=12 bar",
        ],
        &["--equipment", &eq, "--reading", "pressure=1 bar"],
        &["--equipment", &eq, "--note", " \u{1b}[0m "],
    ];
    for args in cases {
        let out = run(args);
        let stderr = String::from_utf8_lossy(&out.stderr);
        assert_eq!(out.status.code(), Some(2), "{args:?}: {stderr}");
        assert!(out.stdout.is_empty() && !stderr.is_empty(), "{args:?}");
        assert!(!logs.exists(), "{args:?} wrote something");
    }
    let path = start_session(dir.path());
    let before = std::fs::read(&path).unwrap();
    let p = path.to_str().unwrap();
    let out = run(&["--session", p, "--equipment", &eq, "--reading", "flow=x"]);
    assert_eq!(out.status.code(), Some(2));
    assert_eq!(std::fs::read(&path).unwrap(), before);
}
