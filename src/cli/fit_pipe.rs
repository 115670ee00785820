//! `rheoside fit FILE.csv` for plant readings: a `flow,pressure_drop` CSV (cells may carry
//! units, e.g. `12 m3/h,1.8 bar`; bare numbers are m3/s and Pa) on a line given as
//! `--diameter D --length L` or `--site S --line ID`. The wall stresses are fitted like
//! viscometer readings; `--product` adds the comparison with the product's curve.

use super::args::{Cli, FitArgs};
use super::line_args::{any, positive};
use crate::line::{Pipe, PlantPair};
use crate::session::rheology_source::{SourceRequest, resolve};
use crate::site::Site;
use crate::units::{self, Dimension};
use anyhow::{Context, Result, bail};
use clap::Args;
use std::process::ExitCode;

/// The line the plant pairs were read on (for a `flow,pressure_drop` CSV).
#[derive(Debug, Clone, Default, Args)]
pub struct PipeFitArgs {
    /// Inner diameter of the line between the taps, for a flow,pressure_drop CSV (bare: m).
    #[arg(long, allow_hyphen_values = true, value_name = "D")]
    pub diameter: Option<String>,
    /// Length between the pressure taps (bare: m).
    #[arg(long, allow_hyphen_values = true, value_name = "L")]
    pub length: Option<String>,
    /// Rise between the taps, outlet minus inlet (bare: m); taken off as static head.
    #[arg(long, allow_hyphen_values = true, value_name = "H")]
    pub elevation: Option<String>,
    /// A line from the site config instead of --diameter/--length.
    #[arg(long, value_name = "ID")]
    pub line: Option<String>,
    /// Product density (bare: kg/m3), needed to check the pairs are laminar.
    #[arg(long, allow_hyphen_values = true, value_name = "RHO")]
    pub density: Option<String>,
    /// Product from the site config: its density, and its curve to compare with (the latest
    /// fitted set in --journal, else its nominal constants).
    #[arg(long, value_name = "NAME")]
    pub product: Option<String>,
    /// Session journal holding the product's viscometer set to compare with.
    #[arg(long, value_name = "FILE")]
    pub journal: Option<std::path::PathBuf>,
}

impl PipeFitArgs {
    fn given(&self) -> bool {
        self.diameter.is_some() || self.length.is_some() || self.line.is_some()
    }
}

/// `Some(exit code)` when the CSV is a `flow,pressure_drop` file (and it was handled).
pub fn run_if_pipe(cli: &Cli, args: &FitArgs) -> Result<Option<ExitCode>> {
    let text = std::fs::read_to_string(&args.file)
        .with_context(|| format!("cannot read '{}'", args.file.display()))?;
    if !is_pipe_header(&text) {
        if args.pipe.given() {
            bail!(
                "--diameter, --length and --line are for a 'flow,pressure_drop' CSV; '{}' has \
                 another header",
                args.file.display()
            );
        }
        return Ok(None);
    }
    let pairs = parse(&text).with_context(|| format!("in '{}'", args.file.display()))?;
    let site = super::line::load_site(cli)?;
    let (pipe, density) = pipe_and_density(&site, &args.pipe)?;
    let opts = super::fit::options(args)?;
    let compare = comparison_curve(&site, &args.pipe)?;
    super::fit_pipe_output::print(&super::fit_pipe_output::Job {
        pipe,
        density,
        pairs: &pairs,
        opts: &opts,
        compare: compare.as_ref(),
        system: site.unit_system,
        json: args.json,
    })?;
    Ok(Some(ExitCode::SUCCESS))
}

fn is_pipe_header(text: &str) -> bool {
    let header = text
        .lines()
        .find(|l| !l.trim().is_empty() && !l.trim_start().starts_with('#'))
        .unwrap_or("");
    let cols: Vec<String> = header
        .split(',')
        .map(|c| c.trim().to_ascii_lowercase())
        .collect();
    cols.iter().any(|c| c == "flow") && cols.iter().any(|c| c == "pressure_drop")
}

/// The pairs, in SI.
pub fn parse(text: &str) -> Result<Vec<PlantPair>> {
    let (mut reader, headers) = super::fit_csv::reader_with_headers(text)?;
    if let Some(bad) = headers
        .iter()
        .find(|h| !matches!(h.as_str(), "flow" | "pressure_drop"))
    {
        bail!("unknown column '{bad}'; a plant CSV has the header 'flow,pressure_drop'");
    }
    let col = |name: &str| headers.iter().position(|h| h == name).unwrap_or(0);
    let (fc, pc) = (col("flow"), col("pressure_drop"));
    let mut pairs = Vec::new();
    for (i, record) in reader.records().enumerate() {
        let line = i + 2;
        let record = record.with_context(|| format!("line {line}: not a valid CSV row"))?;
        let cell = |c: usize, dim: Dimension, unit: &str| {
            let raw = record.get(c).unwrap_or("");
            units::parse_with_default(raw, dim, unit)
                .map_err(|e| anyhow::anyhow!("line {line}, column '{}': {e}", headers[c]))
        };
        pairs.push(PlantPair {
            flow_m3_s: cell(fc, Dimension::Flow, "m3/s")?,
            pressure_drop_pa: cell(pc, Dimension::Pressure, "Pa")?,
        });
    }
    if pairs.is_empty() {
        bail!("no readings after the header");
    }
    Ok(pairs)
}

fn pipe_and_density(site: &Site, a: &PipeFitArgs) -> Result<(Pipe, f64)> {
    let pipe = match (&a.line, &a.diameter, &a.length) {
        (Some(id), None, None) => {
            let Some(l) = site.line(id) else {
                let known: Vec<&str> = site.lines.iter().map(|l| l.id.as_str()).collect();
                bail!(
                    "--line '{id}' is not in the site config; its lines: {}",
                    known.join(", ")
                );
            };
            Pipe {
                inner_diameter_m: l.inner_diameter_m,
                length_m: l.length_m,
                fittings_length_m: l.fittings_length_m,
                roughness_m: l.roughness_m,
                elevation_change_m: l.elevation_change_m,
            }
        }
        (None, Some(d), Some(l)) => Pipe {
            elevation_change_m: match &a.elevation {
                Some(h) => any("--elevation", h, Dimension::Length, "m", true)?,
                None => 0.0,
            },
            ..Pipe::straight(
                positive("--diameter", d, Dimension::Length, "m")?,
                positive("--length", l, Dimension::Length, "m")?,
            )
        },
        _ => bail!(
            "a flow,pressure_drop CSV needs the line: --diameter D --length L, or --site S \
             --line ID (not both)"
        ),
    };
    let product = match &a.product {
        Some(name) => Some(
            site.product(name)
                .ok_or_else(|| anyhow::anyhow!("--product '{name}' is not in the site config"))?,
        ),
        None => None,
    };
    let density = match (&a.density, product) {
        (Some(d), _) => positive("--density", d, Dimension::Density, "kg/m3")?,
        (None, Some(p)) => p.density_kg_m3,
        (None, None) => bail!(
            "give --density RHO or --product P: the density is needed to check that the pairs \
             are laminar"
        ),
    };
    Ok((pipe, density))
}

/// The product's curve to compare with, when --product names one that resolves.
fn comparison_curve(
    site: &Site,
    a: &PipeFitArgs,
) -> Result<Option<crate::session::rheology_source::Resolved>> {
    if a.product.is_none() && a.journal.is_none() {
        return Ok(None);
    }
    let req = SourceRequest {
        product: a.product.clone(),
        journal: a.journal.clone(),
        ..Default::default()
    };
    Ok(Some(resolve(site, &req)?))
}
