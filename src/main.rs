//! The `rheoside` binary: parses the command line and hands the work to one face — the
//! screens when no subcommand is given, else the subcommand. The two faces never call each
//! other.

use clap::Parser;
use rheoside::cli::{Cli, EXIT_BAD_INPUT};
use rheoside::tui::TuiOptions;
use std::process::ExitCode;

fn main() -> ExitCode {
    let cli = Cli::parse();
    let outcome = match &cli.command {
        None => rheoside::tui::run(&screen_options(&cli)),
        Some(command) => {
            quiet_on_closed_pipe();
            rheoside::cli::run(&cli, command)
        }
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

/// A subcommand piped into `head` (or any reader that stops early) ends quietly, as other
/// command-line tools do, instead of panicking on the failed write: the default SIGPIPE
/// action, which Rust's runtime turns off. Only for subcommands, which save before they
/// print; the screens never write to a pipe.
fn quiet_on_closed_pipe() {
    #[cfg(unix)]
    // SAFETY: restoring a signal's default disposition at start-up, before any thread exists.
    unsafe {
        libc::signal(libc::SIGPIPE, libc::SIG_DFL);
    }
}

fn screen_options(cli: &Cli) -> TuiOptions {
    TuiOptions {
        site: cli.site.clone(),
        resume: cli.resume.clone(),
        log_dir: cli.log_dir.clone(),
        operator: cli.operator.clone(),
        ascii: cli.ascii,
    }
}
