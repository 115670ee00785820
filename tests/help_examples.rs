//! Every subcommand's `--help` ends with an example, and every example runs as written from
//! the project folder on the bundled demo site (issue: "each subcommand's --help ends with an
//! example"). A help text that drifts from the program fails here.

use assert_cmd::Command;

const SUBCOMMANDS: [&str; 9] = [
    "fit",
    "check-site",
    "record",
    "report",
    "trend",
    "mix",
    "line",
    "restart",
    "pump",
];

fn help(sub: &str) -> String {
    let out = Command::cargo_bin("rheoside")
        .unwrap()
        .args([sub, "--help"])
        .output()
        .unwrap();
    assert!(out.status.success(), "{sub} --help");
    String::from_utf8(out.stdout).unwrap()
}

/// The example command: the help's last lines from the one starting "  rheoside ", joined
/// where a line ends in a backslash (a shell's continuation).
fn example(sub: &str) -> String {
    let text = help(sub);
    let lines: Vec<&str> = text.trim_end().lines().collect();
    let start = lines.iter().rposition(|l| l.starts_with("  rheoside "));
    let Some(start) = start else {
        panic!("{sub} --help does not end with an example:\n{text}");
    };
    let tail = &lines[start..];
    let continued = tail[..tail.len() - 1].iter().all(|l| l.ends_with('\\'));
    assert!(
        continued,
        "{sub} --help has text after its example:\n{text}"
    );
    tail.iter()
        .map(|l| l.trim().trim_end_matches('\\').trim())
        .collect::<Vec<_>>()
        .join(" ")
}

/// Split a command line as a POSIX shell would for words and double quotes (all we use).
fn words(line: &str) -> Vec<String> {
    let (mut out, mut word, mut quoted) = (Vec::new(), String::new(), false);
    for c in line.chars() {
        match c {
            '"' => quoted = !quoted,
            ' ' if !quoted => {
                if !word.is_empty() {
                    out.push(std::mem::take(&mut word));
                }
            }
            _ => word.push(c),
        }
    }
    if !word.is_empty() {
        out.push(word);
    }
    out
}

fn run(line: &str, logs: &std::path::Path) -> std::process::Output {
    let argv = words(line);
    assert_eq!(argv[0], "rheoside");
    Command::cargo_bin("rheoside")
        .unwrap()
        .args(&argv[1..])
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .env("RHEOSIDE_LOG_DIR", logs)
        .env("NO_COLOR", "1")
        .output()
        .unwrap()
}

#[test]
fn every_subcommand_help_ends_with_an_example_that_runs() {
    let logs = tempfile::tempdir().unwrap();
    for sub in SUBCOMMANDS {
        let mut line = example(sub);
        if sub == "report" {
            // The report example reads the journal the record example wrote just before.
            let journal = std::fs::read_dir(logs.path())
                .unwrap()
                .filter_map(|e| e.ok().map(|e| e.path()))
                .find(|p| p.extension().is_some_and(|x| x == "jsonl"))
                .expect("the record example wrote a journal");
            line = line.replace("logs/<journal>.jsonl", journal.to_str().unwrap());
        }
        let out = run(&line, logs.path());
        assert!(
            out.status.success(),
            "{line}\nexit {:?}\n{}",
            out.status.code(),
            String::from_utf8_lossy(&out.stderr)
        );
        assert!(!out.stdout.is_empty(), "{line} printed nothing");
    }
}

// "Each subcommand lists only its own options": the journal folder and the operator belong
// to the commands that write or read journals, not to the calculators.
#[test]
fn calculators_do_not_offer_journal_options() {
    for sub in ["fit", "check-site", "mix", "line", "restart", "pump"] {
        let text = help(sub);
        for option in ["--log-dir", "--operator", "--resume", "--ascii"] {
            assert!(!text.contains(option), "{sub} --help offers {option}");
        }
    }
    assert!(help("record").contains("--log-dir") && help("record").contains("--operator"));
    assert!(help("trend").contains("--log-dir"));
}
