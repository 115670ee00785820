//! The `fit` subcommand (being built).

use super::args::{Cli, FitArgs};
use std::process::ExitCode;

pub fn run(_cli: &Cli, _args: &FitArgs) -> anyhow::Result<ExitCode> {
    anyhow::bail!("this command is not built yet")
}
