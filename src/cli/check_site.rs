//! The `check_site` subcommand (being built).

use super::args::{Cli, CheckSiteArgs};
use std::process::ExitCode;

pub fn run(_cli: &Cli, _args: &CheckSiteArgs) -> anyhow::Result<ExitCode> {
    anyhow::bail!("this command is not built yet")
}
