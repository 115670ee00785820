//! `rheoside mix`: the flags, the journal's readings and the site's tank into one request,
//! the session's answer out as a table or as the contract JSON.

pub mod args;
mod flags;
mod text;

use super::args::Cli;
use crate::mixing::BackCalc;
use crate::session::rheology_source::Resolved;
use crate::session::tank::{self, TankAnswer};
use crate::session::tank_input::{self, TankReadings};
use crate::session::tank_json::tank_json;
use crate::session::tank_words;
use crate::site::Site;
use anyhow::{Context, Result, bail};
use args::MixArgs;
use serde_json::json;
use std::process::ExitCode;

pub fn run(cli: &Cli, args: &MixArgs) -> Result<ExitCode> {
    let mut flags = flags::tank_flags(args)?;
    let site = load_site(cli, args)?;
    let tank_id = args.tank.as_deref();
    let product = args.source.product.as_deref();
    let site_tank = match (&site, tank_id) {
        (Some(s), Some(id)) => Some(tank_input::site_tank(s, id, product)?),
        (None, Some(_)) => bail!("--tank needs a site config to look the tank up in"),
        (None, None) if product.is_some() || args.source.journal.is_some() => {
            bail!("--product and --journal need a site config (and usually --tank ID)")
        }
        _ => None,
    };
    let resolved = resolve(
        args,
        site.as_ref(),
        site_tank.map(|(t, _)| t.product.as_str()),
    )?;
    if site_tank.is_none() && flags.density_kg_m3.is_none() {
        flags.density_kg_m3 = resolved.product.as_ref().map(|p| p.density_kg_m3);
    }
    let readings = match (&site, tank_id, &args.source.journal) {
        (Some(s), Some(id), Some(path)) => tank_input::readings_from_journal(s, path, id)?,
        _ => TankReadings::default(),
    };
    let request = tank_input::request(site_tank, &readings, &flags, resolved.model)?;
    let answer = tank::analyse(&request).context("cannot work out this tank")?;
    print(site.as_ref(), &answer, &resolved, args.json)?;
    Ok(refused_exit(&answer))
}

fn print(
    site: Option<&Site>,
    answer: &TankAnswer,
    resolved: &Resolved,
    as_json: bool,
) -> Result<()> {
    if as_json {
        let mut value = tank_json(answer);
        value["rheology_source"] = json!(resolved.describe());
        println!("{}", serde_json::to_string_pretty(&value)?);
    } else {
        let system = site.map_or(crate::units::UnitSystem::Si, |s| s.unit_system);
        println!("Flow curve: {}", resolved.describe());
        print!("{}", text::table(answer, system));
    }
    Ok(())
}

/// The flow curve: with a site through the shared resolver (the tank's product unless
/// --product names another); without one, the flags alone.
fn resolve(args: &MixArgs, site: Option<&Site>, tank_product: Option<&str>) -> Result<Resolved> {
    let mut request = args.source.request()?;
    if request.product.is_none() {
        request.product = tank_product.map(str::to_string);
    }
    let demo;
    let site = match site {
        Some(s) => s,
        None => {
            demo = crate::site::demo().map_err(|e| anyhow::anyhow!("the demo site: {e}"))?;
            &demo
        }
    };
    Ok(crate::session::rheology_source::resolve(site, &request)?)
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

/// The site given, or the bundled demo site when a tank, product or journal is named without
/// one (as `--site`'s help promises); none for a tank described wholly by flags.
fn load_site(cli: &Cli, args: &MixArgs) -> Result<Option<Site>> {
    let names_site_things =
        args.tank.is_some() || args.source.product.is_some() || args.source.journal.is_some();
    if cli.site.is_none() && !names_site_things {
        return Ok(None);
    }
    crate::site::load_or_demo(cli.site.as_deref())
        .map(Some)
        .map_err(|errors| anyhow::anyhow!("the site config has errors:\n{errors}"))
}
