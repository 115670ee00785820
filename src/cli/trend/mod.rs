//! `rheoside trend --product P [--since 30d]`: a product's fitted constants over past
//! sessions against its spec limits, as a table and an ASCII chart.
//!
//! The clock is read once, here; everything after takes that `now`.

use super::args::{Cli, TrendArgs};
mod chart;
mod print;
mod scan;

use crate::session::trend::{TrendBuilder, find_product, parse_since};
use crate::session::trend_property::{limited_properties, parse_property};
use crate::site::Site;
use std::process::ExitCode;

pub fn run(cli: &Cli, args: &TrendArgs) -> anyhow::Result<ExitCode> {
    let site = site_or_demo(cli)?;
    let product = find_product(&site, &args.product)?;
    let window = parse_since(&args.since)?;
    let properties = match &args.property {
        Some(text) => parse_property(text, product)?,
        None => limited_properties(product),
    };
    let now = chrono::Utc::now();
    let dir = args.log_dir(cli);
    let mut builder = TrendBuilder::new(&site, product, now, window);
    let scan = scan::scan_dir(&dir, &product.name, &mut builder)?;
    let trend = builder.finish();
    let system = site.unit_system;
    let mut out = print::heading(&site, product, &trend, &args.since);
    out.push_str(&print::table(&trend, system));
    if !trend.points.is_empty() {
        for property in properties {
            out.push_str(&chart::chart(&trend, product, system, property));
        }
    }
    out.push_str(&print::footer(&trend, &scan));
    print!("{out}");
    Ok(ExitCode::SUCCESS)
}

/// The site from `--site`, else the bundled demo (an invented plant).
pub(super) fn site_or_demo(cli: &Cli) -> anyhow::Result<Site> {
    crate::site::load_or_demo(cli.site.as_deref())
        .map_err(|errors| anyhow::anyhow!("the site config has errors:\n{errors}"))
}
