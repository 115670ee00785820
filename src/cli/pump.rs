//! `rheoside pump`: the ANSI/HI 9.6.7 correction at a best-efficiency point, or a site pump on
//! its line with a product's flow curve.

use super::args::Cli;
use super::rheology_args::RheologySourceArgs;
use crate::pump::PumpPoint;
use crate::session::pump::{self as sp, BepAnswer, SitePump};
use crate::session::pump_words;
use crate::units::{self, Dimension, UnitSystem};
use anyhow::{Result, bail};
use clap::Args;
use serde_json::{Value, json};
use std::process::ExitCode;

#[derive(Debug, Args)]
pub struct PumpArgs {
    /// Kinematic viscosity (bare number: cSt).
    #[arg(long)]
    pub viscosity_cst: Option<String>,
    /// Water best-efficiency flow (bare number: m3/s; or "20 m3/h").
    #[arg(long)]
    pub bep_flow: Option<String>,
    /// Water best-efficiency head per stage (bare number: m).
    #[arg(long)]
    pub bep_head: Option<String>,
    /// Shaft speed (bare number: rpm).
    #[arg(long)]
    pub speed: Option<String>,
    /// Water best efficiency (0-1 or "65 %").
    #[arg(long)]
    pub bep_efficiency: Option<String>,
    /// Product density (bare number: kg/m3); default water for the power.
    #[arg(long)]
    pub density: Option<String>,
    /// Pump id from the site config (with --product and a flow curve).
    #[arg(long, value_name = "ID")]
    pub pump: Option<String>,
    /// Shear rate for a non-Newtonian product's apparent viscosity (default 1000 1/s).
    #[arg(long)]
    pub shear_rate: Option<String>,
    /// The product and its flow curve: flags, --journal, or the site's nominal constants.
    #[command(flatten)]
    pub source: RheologySourceArgs,
    /// One JSON object on stdout, SI units.
    #[arg(long)]
    pub json: bool,
}

fn q(flag: &str, text: Option<&str>, dim: Dimension, unit: &str) -> Result<Option<f64>> {
    let v = text
        .map(|t| {
            units::parse_with_default(t, dim, unit).map_err(|e| anyhow::anyhow!("{flag}: {e}"))
        })
        .transpose()?;
    match v {
        Some(x) if !(x.is_finite() && x > 0.0) => bail!("{flag}: must be above zero"),
        other => Ok(other),
    }
}

pub fn run(cli: &Cli, args: &PumpArgs) -> Result<ExitCode> {
    if args.pump.is_some() {
        return site(cli, args);
    }
    let need = |flag: &str, v: Option<f64>| {
        v.ok_or_else(|| anyhow::anyhow!(
        "give {flag}; the BEP correction needs --viscosity-cst, --bep-flow, --bep-head, --speed \
         and --bep-efficiency (or --pump ID --product NAME with a site)"
    ))
    };
    let nu = need(
        "--viscosity-cst",
        q(
            "--viscosity-cst",
            args.viscosity_cst.as_deref(),
            Dimension::KinematicViscosity,
            "cSt",
        )?,
    )?;
    let flow = need(
        "--bep-flow",
        q(
            "--bep-flow",
            args.bep_flow.as_deref(),
            Dimension::Flow,
            "m3/s",
        )?,
    )?;
    let head = need(
        "--bep-head",
        q(
            "--bep-head",
            args.bep_head.as_deref(),
            Dimension::Length,
            "m",
        )?,
    )?;
    let speed = need(
        "--speed",
        q("--speed", args.speed.as_deref(), Dimension::Speed, "rpm")?,
    )?;
    let eff = need(
        "--bep-efficiency",
        q(
            "--bep-efficiency",
            args.bep_efficiency.as_deref(),
            Dimension::Fraction,
            "",
        )?,
    )?;
    if eff > 1.0 {
        bail!("--bep-efficiency: give 0-1 or a percentage up to 100 %");
    }
    let rho = q(
        "--density",
        args.density.as_deref(),
        Dimension::Density,
        "kg/m3",
    )?;
    let rpm = speed * 60.0 / (2.0 * std::f64::consts::PI);
    let bep = PumpPoint {
        flow_m3_s: flow,
        head_m: head,
        efficiency: eff,
    };
    let answer = sp::at_bep(nu * 1e6, bep, rpm, rho);
    if args.json {
        super::restart::emit(&(serde_json::to_string_pretty(&bep_json(&answer))? + "\n"))?;
    } else {
        super::restart::emit(&bep_text(&answer, UnitSystem::Si))?;
    }
    Ok(ExitCode::SUCCESS)
}

pub(super) fn bep_json(a: &BepAnswer) -> Value {
    json!({
        "b_parameter": a.correction.b,
        "c_q": a.correction.c_q,
        "c_h": a.correction.c_h_bep,
        "c_eta": a.correction.c_eta,
        "flow_m3_s": a.flow_m3_s,
        "head_m": a.head_m,
        "efficiency": a.efficiency,
        "power_w": a.power_w,
        "density_kg_m3": a.density_kg_m3,
        "notes": a.notes.iter().map(pump_words::note).collect::<Vec<_>>(),
    })
}

pub(super) fn bep_text(a: &BepAnswer, system: UnitSystem) -> String {
    let c = &a.correction;
    let mut out = format!(
        "ANSI/HI 9.6.7 at the BEP: B = {:.2}; C_Q = {:.3}, C_H = {:.3}, C_eta = {:.3}\n\
         Viscous BEP: {} at {}, efficiency {:.1} %, power {}\n",
        c.b,
        c.c_q,
        c.c_h_bep,
        c.c_eta,
        units::format(a.flow_m3_s, Dimension::Flow, system),
        units::format_in(a.head_m, Dimension::Length, "m"),
        a.efficiency * 100.0,
        units::format(a.power_w, Dimension::Power, system),
    );
    for n in &a.notes {
        out.push_str(&format!("  - {}\n", pump_words::note(n)));
    }
    out
}

fn site(cli: &Cli, args: &PumpArgs) -> Result<ExitCode> {
    let site = super::trend::site_or_demo(cli)?;
    let (Some(pump_id), Some(product)) = (&args.pump, &args.source.product) else {
        bail!("with --pump, also give --product NAME from the site config");
    };
    let resolved = args.source.resolve(&site)?;
    let model = resolved.model;
    let shear = q(
        "--shear-rate",
        args.shear_rate.as_deref(),
        Dimension::ShearRate,
        "1/s",
    )?;
    let speed = q("--speed", args.speed.as_deref(), Dimension::Speed, "rpm")?;
    let query = SitePump {
        site: &site,
        pump_id,
        product,
        model,
        speed_rad_s: speed,
        shear_rate_per_s: shear.unwrap_or(sp::DEFAULT_PUMP_SHEAR_RATE),
    };
    let answer = sp::on_site(&query)?;
    let text = if args.json {
        let mut v = super::pump_output::json(&answer);
        v["rheology"] = json!(resolved.describe());
        serde_json::to_string_pretty(&v)? + "\n"
    } else {
        let body = super::pump_output::text(&answer, site.unit_system);
        format!("Flow curve: {}\n{body}", resolved.describe())
    };
    super::restart::emit(&text)?;
    Ok(ExitCode::SUCCESS)
}
