//! The `record` subcommand (being built).

use super::args::{Cli, RecordArgs};
use std::process::ExitCode;

pub fn run(_cli: &Cli, _args: &RecordArgs) -> anyhow::Result<ExitCode> {
    anyhow::bail!("this command is not built yet")
}
