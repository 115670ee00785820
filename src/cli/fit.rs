//! `rheoside fit FILE.csv`: flow curve from viscometer readings, as a table or as JSON.

use super::args::{Cli, FitArgs};
use super::fit_csv::{self, Readings};
use super::fit_output;
use crate::instrument::Geometry;
use crate::present::Style;
use crate::rheology::Weighting;
use crate::session::checks::OffScale;
use crate::session::temperature::{TemperatureSeries, analyse_by_temperature};
use crate::session::{self, FlowCurveInput, FlowCurveOptions, ModelPick};
use crate::site::Site;
use crate::units::UnitSystem;
use anyhow::{Context, Result, bail};
use std::process::ExitCode;

pub fn run(cli: &Cli, args: &FitArgs) -> Result<ExitCode> {
    if let Some(code) = super::fit_pipe::run_if_pipe(cli, args)? {
        return Ok(code);
    }
    let opts = options(args)?;
    let site = load_site(cli, args)?;
    let data = fit_csv::read(&args.file)?;
    let geometry = match &data.readings {
        Readings::Dial(_) => Some(geometry(args, site.as_ref())?),
        Readings::Direct(_) => None,
    };
    let input = match (&data.readings, &geometry) {
        (Readings::Dial(readings), Some(geometry)) => FlowCurveInput::Dial { geometry, readings },
        (Readings::Direct(points), _) => FlowCurveInput::Direct { points },
        (Readings::Dial(_), None) => bail!("internal: dial readings without a geometry"),
    };
    let system = site
        .as_ref()
        .map_or(UnitSystem::Si, |s: &Site| s.unit_system);
    let temps = data.temperatures_k.as_deref();
    if let (Some(temps), None) = (temps, fit_output::single_temperature(temps)) {
        let series =
            analyse_by_temperature(input, temps, &opts).context("cannot fit these readings")?;
        print_series(&series, &opts, system, args.json)?;
        return Ok(ExitCode::SUCCESS);
    }
    let curve = session::analyse(input, &opts).context("cannot fit these readings")?;
    let temperature = fit_output::single_temperature(temps);
    if args.json {
        let value = fit_output::json(&curve, &opts, temperature);
        println!("{}", serde_json::to_string_pretty(&value)?);
    } else {
        print!(
            "{}",
            fit_output::table(&curve, Style::new(system, false), temperature)
        );
    }
    Ok(ExitCode::SUCCESS)
}

/// Readings at several temperatures: the first temperature's curve leads (so the contract
/// keys describe one real curve), then every temperature and the activation energy.
fn print_series(
    series: &TemperatureSeries,
    opts: &FlowCurveOptions,
    system: UnitSystem,
    json: bool,
) -> Result<()> {
    let Some(first) = series.curves.first() else {
        bail!("no readings");
    };
    if json {
        let mut value = fit_output::json(&first.curve, opts, Some(first.temperature_k));
        fit_output::add_series_json(&mut value, series);
        println!("{}", serde_json::to_string_pretty(&value)?);
    } else {
        print!(
            "{}",
            fit_output::table(
                &first.curve,
                Style::new(system, false),
                Some(first.temperature_k),
            )
        );
        print!(
            "{}",
            fit_output::series_table(series, Style::new(system, false))
        );
    }
    Ok(())
}

pub(super) fn options(args: &FitArgs) -> Result<FlowCurveOptions> {
    let model: ModelPick = args
        .model
        .parse()
        .map_err(|e: String| anyhow::anyhow!("--model '{}': {e}", args.model))?;
    let weighting = match args.weight.as_deref() {
        None | Some("none") => Weighting::Unweighted,
        Some("relative") => Weighting::Relative,
        Some("log") => Weighting::Log,
        Some(other) => bail!(
            "--weight '{}': accepted values are 'none', 'relative' or 'log'",
            crate::text::sanitize(other, false)
        ),
    };
    Ok(FlowCurveOptions {
        model,
        rate_correction: !args.no_rate_correction,
        weighting,
        off_scale: if args.include_off_scale {
            OffScale::Include
        } else {
            OffScale::LeaveOut
        },
    })
}

/// The site given, or the bundled demo site when a viscometer is named without one (as
/// `--site`'s help promises); no site at all for a plain `--geometry` fit.
fn load_site(cli: &Cli, args: &FitArgs) -> Result<Option<Site>> {
    match (&cli.site, &args.viscometer) {
        (None, None) => Ok(None),
        (path, _) => crate::site::load_or_demo(path.as_deref())
            .map(Some)
            .map_err(|errors| anyhow::anyhow!("the site config has errors:\n{errors}")),
    }
}

fn geometry(args: &FitArgs, site: Option<&Site>) -> Result<Geometry> {
    match (&args.geometry, &args.viscometer, site) {
        (Some(name), None, _) => {
            Geometry::from_name(name).map_err(|e| anyhow::anyhow!("--geometry: {e}"))
        }
        (None, Some(id), Some(site)) => {
            site.viscometer(id)
                .map(|v| v.geometry.clone())
                .ok_or_else(|| {
                    let ids: Vec<&str> = site.viscometers.iter().map(|v| v.id.as_str()).collect();
                    anyhow::anyhow!(
                        "--viscometer '{id}' is not in the site config; its viscometers: {}",
                        ids.join(", ")
                    )
                })
        }
        (None, Some(_), None) => bail!("--viscometer needs a site config to look it up in"),
        (Some(_), Some(_), _) => bail!("give either --geometry or --viscometer, not both"),
        (None, None, _) => bail!(
            "rpm/dial readings need a geometry: --geometry standard-six-speed, or --site FILE --viscometer ID"
        ),
    }
}
