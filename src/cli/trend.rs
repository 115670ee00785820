//! The `trend` subcommand (being built).

use super::args::{Cli, TrendArgs};
use std::process::ExitCode;

pub fn run(_cli: &Cli, _args: &TrendArgs) -> anyhow::Result<ExitCode> {
    anyhow::bail!("this command is not built yet")
}
