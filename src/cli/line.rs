//! `rheoside line`: pressure drop in a line for a flow (or the flow for a pressure drop),
//! for a pipe typed in or a line from the site config. Parse, call the session, print.

use super::args::Cli;
use super::line_args::{LineArgs, any, positive};
use super::line_print;
use crate::line::Pipe;
use crate::session::line::{self as session_line, LineCase};
use crate::site::Site;
use crate::units::Dimension;
use anyhow::{Result, bail};
use std::process::ExitCode;

pub fn run(cli: &Cli, args: &LineArgs) -> Result<ExitCode> {
    let site = load_site(cli)?;
    let case = case(&site, args)?;
    match (&args.flow, &args.flow_for_pressure) {
        (Some(q), None) => {
            let q = positive("--flow", q, Dimension::Flow, "m3/s")?;
            let at = session_line::at_flow(&case, q)?;
            line_print::at_flow(&case, &at, site.unit_system, args.json)?;
        }
        (None, Some(p)) => {
            let p = any("--flow-for-pressure", p, Dimension::Pressure, "Pa", true)?;
            let at = session_line::at_pressure(&case, p)?;
            line_print::at_pressure(&case, &at, p, site.unit_system, args.json)?;
        }
        _ => bail!("give --flow Q (the pressure drop at that flow) or --flow-for-pressure P"),
    }
    Ok(ExitCode::SUCCESS)
}

/// The site given with --site, or the bundled demo site.
pub(crate) fn load_site(cli: &Cli) -> Result<Site> {
    let loaded = match &cli.site {
        Some(path) => crate::site::load_file(path),
        None => crate::site::demo(),
    };
    loaded.map_err(|errors| anyhow::anyhow!("the site config has errors:\n{errors}"))
}

fn case(site: &Site, args: &LineArgs) -> Result<LineCase> {
    let source = args.source.resolve(site)?;
    let density = match &args.density {
        Some(d) => Some(positive("--density", d, Dimension::Density, "kg/m3")?),
        None => None,
    };
    match &args.line {
        Some(id) => {
            if args.has_pipe_flags() {
                bail!(
                    "--line {id} takes the pipe from the site config; leave out --diameter, \
                     --length, --elevation, --roughness and --fittings-length"
                );
            }
            Ok(session_line::site_case(site, id, source, density)?)
        }
        None => Ok(session_line::pipe_case(pipe(args)?, source, density)?),
    }
}

/// The pipe typed as flags; --diameter and --length are required.
fn pipe(args: &LineArgs) -> Result<Pipe> {
    let (Some(d), Some(l)) = (&args.diameter, &args.length) else {
        bail!(
            "give the pipe as --diameter D --length L, or --line ID for a line in the site config"
        );
    };
    let opt = |flag: &str, v: &Option<String>, signed: bool| -> Result<f64> {
        v.as_deref()
            .map_or(Ok(0.0), |t| any(flag, t, Dimension::Length, "m", signed))
    };
    Ok(Pipe {
        inner_diameter_m: positive("--diameter", d, Dimension::Length, "m")?,
        length_m: positive("--length", l, Dimension::Length, "m")?,
        fittings_length_m: opt("--fittings-length", &args.fittings_length, false)?,
        roughness_m: opt("--roughness", &args.roughness, false)?,
        elevation_change_m: opt("--elevation", &args.elevation, true)?,
    })
}
