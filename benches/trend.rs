//! Times the pure trend (records → per-session constants) over generated sessions.
//!
//! `cargo bench --bench trend` runs the divan benchmarks. With `-- --write-year DIR [DAYS]`
//! it instead writes DAYS (default 365) days of invented journals into DIR and exits; the
//! whole-process measurement in `benches/trend_year.sh` uses that.

mod support;

use chrono::Duration;
use divan::Bencher;
use rheoside::journal::Record;
use rheoside::session::trend::{find_product, trend};
use rheoside::site::Site;
use std::path::PathBuf;
use std::process::ExitCode;

fn main() -> ExitCode {
    let args: Vec<String> = std::env::args().collect();
    match args.iter().position(|a| a == "--write-year") {
        Some(i) => write_year(&args[i + 1..]),
        None => {
            divan::main();
            ExitCode::SUCCESS
        }
    }
}

fn demo() -> Site {
    match rheoside::site::demo() {
        Ok(site) => site,
        Err(e) => panic!("the demo site does not load: {e}"),
    }
}

fn write_year(rest: &[String]) -> ExitCode {
    let Some(dir) = rest.first().map(PathBuf::from) else {
        eprintln!("--write-year DIR [DAYS]");
        return ExitCode::from(2);
    };
    let days = rest.get(1).and_then(|d| d.parse().ok()).unwrap_or(365);
    match support::write_days(&demo(), &dir, days) {
        Ok((files, records, bytes)) => {
            println!(
                "{files} files, {records} records, {bytes} bytes in {}",
                dir.display()
            );
            ExitCode::SUCCESS
        }
        Err(e) => {
            eprintln!("cannot write the journals: {e}");
            ExitCode::from(1)
        }
    }
}

/// The pure trend over `days` days of whole sessions (every record, not only the sets).
#[divan::bench(args = [30, 91, 182, 365], sample_count = 10, sample_size = 1)]
fn trend_over_days(bencher: Bencher, days: u32) {
    let site = demo();
    let sessions: Vec<Vec<Record>> = support::sessions(&site, days).collect();
    let Ok(product) = find_product(&site, "chilli-sauce") else {
        panic!("the demo site has no chilli-sauce");
    };
    let now = support::year_end(days);
    bencher.bench(|| {
        trend(
            &site,
            product,
            sessions.iter().map(Vec::as_slice),
            now,
            Duration::days(400),
        )
    });
}
