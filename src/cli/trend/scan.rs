//! Reading the log folder for `trend`: one file at a time, line by line, parsing only the
//! lines that can matter (the session start and this product's viscometer sets).

use crate::journal::{Payload, Record};
use crate::session::trend::TrendBuilder;
use anyhow::Context;
use std::fs::File;
use std::io::{BufRead, BufReader};
use std::path::{Path, PathBuf};

/// What the scan met besides the sessions it handed to the builder.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct ScanCounts {
    /// Session files read (of any site).
    pub journals: usize,
    /// Files that are not session journals (other names, or no session-start first line).
    pub not_journal: usize,
    /// Lines that are not text, or looked like a set of this product but could not be read
    /// (a cut-off last line, or damage); skipped.
    pub bad_lines: usize,
    /// Files that could not be opened or read, with the reason.
    pub unreadable: Vec<String>,
}

/// Scan every `*.jsonl` file directly in `dir`, in name order.
pub fn scan_dir(
    dir: &Path,
    product: &str,
    builder: &mut TrendBuilder<'_>,
) -> anyhow::Result<ScanCounts> {
    let entries = std::fs::read_dir(dir).with_context(|| {
        format!(
            "cannot read the log folder {}; give the folder with --log-dir or RHEOSIDE_LOG_DIR",
            dir.display()
        )
    })?;
    let mut paths: Vec<PathBuf> = entries
        .filter_map(Result::ok)
        .map(|e| e.path())
        .filter(|p| p.is_file())
        .collect();
    paths.sort();
    let mut counts = ScanCounts::default();
    for path in paths {
        if path.extension().is_none_or(|e| e != "jsonl") {
            counts.not_journal += 1;
            continue;
        }
        if let Err(e) = scan_file(&path, product, builder, &mut counts) {
            counts.unreadable.push(format!("{}: {e}", path.display()));
        }
    }
    Ok(counts)
}

/// One file: the first line must be a session start; then keep this product's sets.
fn scan_file(
    path: &Path,
    product: &str,
    builder: &mut TrendBuilder<'_>,
    counts: &mut ScanCounts,
) -> std::io::Result<()> {
    let mut reader = BufReader::with_capacity(1 << 16, File::open(path)?);
    let mut line = Vec::with_capacity(1024);
    reader.read_until(b'\n', &mut line)?;
    let start = match serde_json::from_slice::<Record>(&line) {
        Ok(r) if matches!(r.payload, Payload::SessionStart { .. }) => r,
        _ => {
            counts.not_journal += 1;
            return Ok(());
        }
    };
    counts.journals += 1;
    let mut kept = vec![start];
    if !builder.site_matches(&kept[0]) {
        // Another site's journal: the builder counts it; the rest of the file cannot matter.
        builder.add(&kept);
        return Ok(());
    }
    loop {
        line.clear();
        if reader.read_until(b'\n', &mut line)? == 0 {
            break;
        }
        match may_be_set_of(&line, product) {
            Some(false) => {}
            Some(true) => match serde_json::from_slice::<Record>(&line) {
                Ok(r) => kept.push(r),
                Err(_) => counts.bad_lines += 1,
            },
            None => counts.bad_lines += 1,
        }
    }
    builder.add(&kept);
    Ok(())
}

/// Cheap test before parsing: a viscometer set of this product names both in its text.
/// A false positive (a note quoting them) is parsed and then ignored by the builder.
/// `None`: the line is not UTF-8 text, so it is no record at all.
fn may_be_set_of(line: &[u8], product: &str) -> Option<bool> {
    let text = std::str::from_utf8(line).ok()?;
    Some(text.contains("viscometer-set") && text.contains(product))
}
