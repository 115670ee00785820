//! `rheoside mix`: the flags and the site's tank into one request, the session's answer out
//! as a table or as the contract JSON.

pub mod args;
mod flags;
mod text;

use super::args::Cli;
use crate::mixing::BackCalc;
use crate::session::tank::{self, TankAnswer};
use crate::session::tank_input::{self, TankReadings};
use crate::session::tank_json::tank_json;
use crate::session::tank_words;
use anyhow::{Context, Result, bail};
use args::MixArgs;
use std::process::ExitCode;

pub fn run(cli: &Cli, args: &MixArgs) -> Result<ExitCode> {
    let flags = flags::tank_flags(args)?;
    let Some(model) = args.rheology.model()? else {
        bail!(
            "no flow curve for the product: give one of --mu M | --k K --n N | \
             --tau0 T --mu-p M | --tau0 T --k K --n N | --tau0 T --mu-c M"
        );
    };
    let site = load_site(cli, args)?;
    let site_tank = match (&site, &args.tank) {
        (Some(s), Some(id)) => Some(tank_input::site_tank(s, id, args.product.as_deref())?),
        (None, Some(_)) => bail!("--tank needs --site FILE to look the tank up"),
        (_, None) if args.product.is_some() => bail!("--product goes with --site and --tank"),
        (_, None) => None,
    };
    let readings = TankReadings::default();
    let request = tank_input::request(site_tank, &readings, &flags, model)?;
    let answer = tank::analyse(&request).context("cannot work out this tank")?;
    let system = site
        .as_ref()
        .map_or(crate::units::UnitSystem::Si, |s| s.unit_system);
    if args.json {
        println!("{}", serde_json::to_string_pretty(&tank_json(&answer))?);
    } else {
        print!("{}", text::table(&answer, system));
    }
    Ok(refused_exit(&answer))
}

/// A motor reading that could not give a viscosity is refused input: exit 2 after the
/// answer, with the reason on stderr.
fn refused_exit(answer: &TankAnswer) -> ExitCode {
    match answer.motor.map(|m| m.back) {
        Some(BackCalc::Refused(r)) => {
            use std::io::Write as _;
            let _ = writeln!(std::io::stderr(), "rheoside: {}", tank_words::refusal(&r));
            ExitCode::from(super::EXIT_BAD_INPUT)
        }
        _ => ExitCode::SUCCESS,
    }
}

fn load_site(cli: &Cli, args: &MixArgs) -> Result<Option<crate::site::Site>> {
    match (&cli.site, &args.tank) {
        (Some(path), _) => crate::site::load_file(path)
            .map(Some)
            .map_err(|errors| anyhow::anyhow!("the site config has errors:\n{errors}")),
        (None, _) => Ok(None),
    }
}
