//! The command line's subcommands, each in its own file. `main` parses the arguments and
//! hands either the screens (no subcommand) or this module the work; nothing here knows the
//! terminal UI.

mod args;
mod check_site;
mod examples;
mod fit;
mod fit_csv;
mod fit_extra;
mod fit_output;
mod fit_pipe;
mod fit_pipe_output;
mod gel_csv;
mod line;
pub mod line_args;
mod line_print;
mod mix;
mod pump;
mod pump_output;
mod record;
mod report;
mod restart;
mod restart_json;
pub mod rheology_args;
mod trend;

pub use args::{Cli, Command};

use std::process::ExitCode;

/// Exit code for bad input (a wrong field, an unreadable file): the message goes to stderr.
pub const EXIT_BAD_INPUT: u8 = 2;

/// Run one subcommand. Options that act only on the screens are refused here with a
/// word on where they belong, rather than ignored.
pub fn run(cli: &Cli, command: &Command) -> anyhow::Result<ExitCode> {
    refuse_screen_options(cli, command)?;
    match command {
        Command::Fit(a) => fit::run(cli, a),
        Command::CheckSite(a) => check_site::run(cli, a),
        Command::Record(a) => record::run(cli, a),
        Command::Report(a) => report::run(cli, a),
        Command::Trend(a) => trend::run(cli, a),
        Command::Mix(a) => mix::run(cli, a),
        Command::Restart(a) => restart::run(cli, a),
        Command::Pump(a) => pump::run(cli, a),
        Command::Line(a) => line::run(cli, a),
    }
}

fn refuse_screen_options(cli: &Cli, command: &Command) -> anyhow::Result<()> {
    let given: Vec<&str> = [(cli.resume.is_some(), "--resume"), (cli.ascii, "--ascii")]
        .into_iter()
        .filter_map(|(on, name)| on.then_some(name))
        .collect();
    if given.is_empty() {
        return Ok(());
    }
    anyhow::bail!(
        "{} only acts on the screens (rheoside with no subcommand); '{}' does not take it",
        given.join(" and "),
        command.name()
    )
}
