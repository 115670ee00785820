//! The operator's terminal UI (being built).

use crate::cli::Cli;
use std::process::ExitCode;

pub fn run(_cli: &Cli) -> anyhow::Result<ExitCode> {
    anyhow::bail!("the terminal UI is not built yet")
}
