//! The `report` subcommand (being built).

use super::args::{Cli, ReportArgs};
use std::process::ExitCode;

pub fn run(_cli: &Cli, _args: &ReportArgs) -> anyhow::Result<ExitCode> {
    anyhow::bail!("this command is not built yet")
}
