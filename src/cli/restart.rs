//! `rheoside restart`: will the line restart after a stop, and the longest safe stop.

use super::args::Cli;
use super::gel_csv;
use crate::line::restart::{GelFit, GelFitOptions, PlugLine, fit_gel};
use crate::present::restart_json;
use crate::session::duration::parse_duration;
use crate::session::restart::{self, GelSource, LimitSource, RestartInput};
use crate::session::restart_words;
use crate::units::{self, Dimension, UnitSystem};
use anyhow::{Result, bail};
use clap::Args;
use std::path::PathBuf;
use std::process::ExitCode;

#[derive(Debug, Args)]
pub struct RestartArgs {
    /// Line inner diameter (bare number: m; or "62.7 mm").
    #[arg(long)]
    pub diameter: Option<String>,
    /// Line length including fittings (bare number: m).
    #[arg(long)]
    pub length: Option<String>,
    /// One gel (static yield) stress, taken for any stop (bare number: Pa).
    #[arg(long)]
    pub gel_stress: Option<String>,
    /// Gel stress just after stopping (bare number: Pa); with --gel-final, --gel-time-constant.
    #[arg(long)]
    pub gel_initial: Option<String>,
    /// Gel stress after a long rest (bare number: Pa).
    #[arg(long)]
    pub gel_final: Option<String>,
    /// Build-up time constant, e.g. "25 min".
    #[arg(long)]
    pub gel_time_constant: Option<String>,
    /// CSV of rested-gel readings: 'rest_time,gel_stress' or 'rest_time,dial' (3 rpm peak).
    #[arg(long, value_name = "FILE.csv")]
    pub gel_readings: Option<PathBuf>,
    /// What the pump can give, gauge (bare number: Pa; or "12 bar").
    #[arg(long)]
    pub available_pressure: Option<String>,
    /// Static head to lift, ρ·g·Δz (bare number: Pa).
    #[arg(long)]
    pub static_pressure: Option<String>,
    /// Pressure held at the outlet, gauge (bare number: Pa).
    #[arg(long)]
    pub back_pressure: Option<String>,
    /// Design pressure of the line's weakest part, gauge (bare number: Pa).
    #[arg(long)]
    pub design_pressure: Option<String>,
    /// How long the line has stood, e.g. "62 h", "1 h 30 min", "90 min".
    #[arg(long, value_name = "DURATION", allow_hyphen_values = true)]
    pub stopped_for: Option<String>,
    /// Margin kept below the usable pressure (0-1 or "10 %"; default 10 %).
    #[arg(long)]
    pub margin: Option<String>,
    /// Line id from the site config (with --pump and --product).
    #[arg(long, value_name = "ID")]
    pub line: Option<String>,
    /// Pump id from the site config.
    #[arg(long, value_name = "ID")]
    pub pump: Option<String>,
    /// Product name from the site config.
    #[arg(long)]
    pub product: Option<String>,
    /// One JSON object on stdout, SI units.
    #[arg(long)]
    pub json: bool,
}

pub fn run(cli: &Cli, args: &RestartArgs) -> Result<ExitCode> {
    let stopped_for_s = args
        .stopped_for
        .as_deref()
        .map(parse_duration)
        .transpose()?;
    let (input, system) = match &args.line {
        Some(_) => site_input(cli, args, stopped_for_s)?,
        None => (flag_input(args, stopped_for_s)?, UnitSystem::Si),
    };
    let answer = restart::analyse(input)?;
    let text = if args.json {
        serde_json::to_string_pretty(&restart_json::json(&answer, system))? + "\n"
    } else {
        let mut lines = vec![restart_json::gel_line(&answer.input.gel, system)];
        lines.extend(restart_words::lines(&answer, system));
        lines.join("\n") + "\n"
    };
    emit(&text)?;
    Ok(ExitCode::SUCCESS)
}

fn quantity(flag: &str, text: Option<&str>, dim: Dimension, unit: &str) -> Result<Option<f64>> {
    text.map(|t| {
        units::parse_with_default(t, dim, unit).map_err(|e| anyhow::anyhow!("{flag}: {e}"))
    })
    .transpose()
}

fn gel_source(args: &RestartArgs) -> Result<Option<GelSource>> {
    let stress = |flag, t: &Option<String>| quantity(flag, t.as_deref(), Dimension::Stress, "Pa");
    let one = stress("--gel-stress", &args.gel_stress)?;
    let initial = stress("--gel-initial", &args.gel_initial)?;
    let last = stress("--gel-final", &args.gel_final)?;
    let tr = args
        .gel_time_constant
        .as_deref()
        .map(parse_duration)
        .transpose()?;
    let file = args
        .gel_readings
        .as_deref()
        .map(gel_csv::read)
        .transpose()?;
    Ok(Some(match (one, initial, last, tr, file) {
        (Some(s), None, None, None, None) => GelSource::Stress(s),
        (None, Some(a), Some(b), Some(t), None) => GelSource::Constants(a, b, t),
        (None, None, None, None, Some(rows)) => GelSource::Readings(rows, None),
        (None, None, None, Some(t), Some(rows)) => GelSource::Readings(rows, Some(t)),
        (None, None, None, None, None) => return Ok(None),
        _ => bail!(
            "give the gel one way: --gel-stress T | --gel-initial T --gel-final T \
             --gel-time-constant T | --gel-readings FILE.csv"
        ),
    }))
}

fn margin(args: &RestartArgs) -> Result<Option<f64>> {
    quantity("--margin", args.margin.as_deref(), Dimension::Fraction, "")
}

fn flag_input(args: &RestartArgs, stopped_for_s: Option<f64>) -> Result<RestartInput> {
    let len = |flag, t: &Option<String>| quantity(flag, t.as_deref(), Dimension::Length, "m");
    let pressure =
        |flag, t: &Option<String>| quantity(flag, t.as_deref(), Dimension::Pressure, "Pa");
    let (Some(d), Some(l)) = (
        len("--diameter", &args.diameter)?,
        len("--length", &args.length)?,
    ) else {
        bail!("give --diameter and --length (or --line, --pump and --product with a site)");
    };
    let Some(available_pa) = pressure("--available-pressure", &args.available_pressure)? else {
        bail!(
            "the pump's limit is not known: give --available-pressure P (its relief setting, \
             shut-off pressure or motor limit, gauge)"
        );
    };
    let line = PlugLine::new(
        d,
        l,
        pressure("--static-pressure", &args.static_pressure)?.unwrap_or(0.0),
        pressure("--back-pressure", &args.back_pressure)?.unwrap_or(0.0),
    )?;
    let source = gel_source(args)?.ok_or_else(|| {
        anyhow::anyhow!(
            "give the gel: --gel-stress T | --gel-initial T --gel-final T --gel-time-constant T \
             | --gel-readings FILE.csv"
        )
    })?;
    let single = matches!(source, GelSource::Stress(_));
    let m = margin(args)?;
    Ok(RestartInput {
        line,
        fittings_included: false,
        available_pa,
        limit_source: LimitSource::Given,
        design_pa: pressure("--design-pressure", &args.design_pressure)?,
        stopped_for_s,
        margin: m.unwrap_or(crate::line::restart::DEFAULT_MARGIN),
        margin_is_default: m.is_none(),
        gel: flag_gel(source)?,
        single_gel_stress: single,
        cold: None,
    })
}

fn flag_gel(source: GelSource) -> Result<GelFit> {
    Ok(match source {
        GelSource::Stress(s) => restart::gel_from_constants(s, s, 1.0)?,
        GelSource::Constants(a, b, t) => restart::gel_from_constants(a, b, t)?,
        GelSource::Readings(rows, tr) => {
            let opts = GelFitOptions {
                time_constant_s: tr,
                ..GelFitOptions::default()
            };
            fit_gel(&rows, &opts)?
        }
        GelSource::Product => bail!("a product's gel needs --site, --line, --pump and --product"),
    })
}

fn site_input(
    cli: &Cli,
    args: &RestartArgs,
    stopped_for_s: Option<f64>,
) -> Result<(RestartInput, UnitSystem)> {
    let site = super::trend::site_or_demo(cli)?;
    let (Some(line), Some(pump), Some(product)) = (&args.line, &args.pump, &args.product) else {
        bail!("with --line, also give --pump ID and --product NAME from the site config");
    };
    let source = gel_source(args)?.unwrap_or(GelSource::Product);
    let mut input = restart::from_site(&site, (line, pump, product), source, stopped_for_s)?;
    if let Some(p) = quantity(
        "--available-pressure",
        args.available_pressure.as_deref(),
        Dimension::Pressure,
        "Pa",
    )? {
        input.available_pa = p;
        input.limit_source = LimitSource::Given;
    }
    if let Some(m) = margin(args)? {
        input.margin = m;
        input.margin_is_default = false;
    }
    Ok((input, site.unit_system))
}

/// Write to stdout; a reader that went away (`| head`) is not an error.
pub(super) fn emit(text: &str) -> Result<()> {
    use std::io::Write as _;
    match std::io::stdout().lock().write_all(text.as_bytes()) {
        Err(e) if e.kind() != std::io::ErrorKind::BrokenPipe => Err(e.into()),
        _ => Ok(()),
    }
}
