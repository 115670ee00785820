//! The `check-site` subcommand: validate a site config and print its equipment summary, or
//! every error (to stderr) and exit with the bad-input code.

use super::EXIT_BAD_INPUT;
use super::args::{CheckSiteArgs, Cli};
use std::io::Write;
use std::process::ExitCode;

pub fn run(_cli: &Cli, args: &CheckSiteArgs) -> anyhow::Result<ExitCode> {
    match crate::site::load_file(&args.file) {
        Ok(site) => {
            let mut out = std::io::stdout().lock();
            out.write_all(crate::site::summary(&site).as_bytes())?;
            out.flush()?;
            Ok(ExitCode::SUCCESS)
        }
        Err(errors) => {
            let mut err = std::io::stderr().lock();
            writeln!(err, "{errors}")?;
            let n = errors.0.len();
            let noun = if n == 1 { "error" } else { "errors" };
            writeln!(err, "rheoside: {n} {noun} in the site config")?;
            Ok(ExitCode::from(EXIT_BAD_INPUT))
        }
    }
}
