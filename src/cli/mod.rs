//! The command line: parses arguments and hands each subcommand to its own file.
//! No subcommand opens the terminal UI.

mod args;
mod check_site;
mod fit;
mod fit_csv;
mod fit_extra;
mod fit_output;
mod record;
mod report;
pub mod rheology_args;
mod trend;

pub use args::{Cli, Command};

use clap::Parser;
use std::process::ExitCode;

/// Exit code for bad input (a wrong field, an unreadable file): the message goes to stderr.
pub const EXIT_BAD_INPUT: u8 = 2;

/// Entry point for the binary.
pub fn main() -> ExitCode {
    let cli = Cli::parse();
    let outcome = match &cli.command {
        None => crate::tui::run(&cli),
        Some(Command::Fit(a)) => fit::run(&cli, a),
        Some(Command::CheckSite(a)) => check_site::run(&cli, a),
        Some(Command::Record(a)) => record::run(&cli, a),
        Some(Command::Report(a)) => report::run(&cli, a),
        Some(Command::Trend(a)) => trend::run(&cli, a),
    };
    match outcome {
        Ok(code) => code,
        Err(err) => {
            // Best effort: after a terminal hang-up stderr may be gone, and eprintln! panics.
            use std::io::Write as _;
            let _ = writeln!(std::io::stderr(), "rheoside: {err:#}");
            ExitCode::from(EXIT_BAD_INPUT)
        }
    }
}
