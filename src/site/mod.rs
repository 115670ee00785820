//! Site configs (one TOML file per site): the schema, loading, and validation that reports
//! every mistake at once as `path:line:column: field 'x': 'value' — what is wrong`.
//!
//! Loading reads the TOML into tables that keep only known keys (unknown ones are errors,
//! with a "did you mean" when one is near), then validates each table into typed settings
//! (SI `f64` everywhere), then checks ids and references across tables. Nothing here
//! prints: callers get all errors and decide how to show them.

mod cross;
mod errors;
mod fields;
mod line;
mod model;
mod nominal;
mod product;
mod pump;
mod raw;
mod suggest;
mod summary;
mod tank;
mod tank_impeller;
#[cfg(test)]
mod tests;
mod values;
mod viscometer;

pub use errors::{ErrorKind, SiteError, SiteErrors};
pub use model::{
    Baffles, CurvePoint, EquipmentKind, GelBuildUp, Impeller, LimitProperty, Line, NominalCurve,
    Product, Pump, PumpKind, RibbonShape, Site, SpecLimit, Tank, TankConstants, Viscometer,
};
pub use pump::MIN_CURVE_POINTS;
pub use summary::summary;

use errors::Sink;
use fields::{Need, Rule};
use raw::RawTable;
use std::io::Read;
use std::path::Path;
use toml::de::DeTable;

/// The bundled demo site (an invented plant), used when no `--site` is given.
pub const DEMO_TOML: &str = include_str!("../../site-configs/demo.toml");
/// The path label the demo's messages carry.
pub const DEMO_LABEL: &str = "site-configs/demo.toml";
/// Larger files are refused unread: a site config is a few kilobytes.
pub const MAX_FILE_BYTES: u64 = 1024 * 1024;

const ROOT_KEYS: &[&str] = &["site", "product", "viscometer", "line", "pump", "tank"];
const SITE_KEYS: &[&str] = &[
    "id",
    "name",
    "unit_system",
    "operators",
    "atmospheric_pressure",
];

/// Accepted atmospheric pressures, Pa (absolute): from about 5500 m altitude (50 kPa) to
/// below sea level (the Dead Sea shore reads about 106.7 kPa; from memory).
const ATMOSPHERE_RANGE_PA: (f64, f64) = (50_000.0, 110_000.0);
const UNIT_SYSTEMS: [(&str, crate::units::UnitSystem); 2] = [
    ("si", crate::units::UnitSystem::Si),
    ("us-customary", crate::units::UnitSystem::UsCustomary),
];

/// Where the bundled demo came from, as every command journals it (`site_source`).
pub const DEMO_SOURCE: &str = "bundled demo site (invented plant)";

/// The bundled demo site; a test checks that it always loads.
pub fn demo() -> Result<Site, SiteErrors> {
    let mut site = load_str(DEMO_TOML, DEMO_LABEL)?;
    site.source = DEMO_SOURCE.to_string();
    Ok(site)
}

/// The one site loader every command uses: this config file, or the bundled demo when no
/// file is named. `Site::source` says which, in the words the journal records.
pub fn load_or_demo(path: Option<&Path>) -> Result<Site, SiteErrors> {
    match path {
        Some(p) => load_file(p),
        None => demo(),
    }
}

/// Read and validate a site config file. An unreadable file is one error at line 0.
pub fn load_file(path: &Path) -> Result<Site, SiteErrors> {
    let label = path.display().to_string();
    let text = read_limited(path).map_err(|why| {
        SiteErrors(vec![SiteError {
            path: crate::text::sanitize(&label, false),
            line: 0,
            column: 0,
            field: String::new(),
            value: String::new(),
            message: format!("cannot read the site config: {why}"),
            kind: ErrorKind::Unreadable,
        }])
    })?;
    load_str(&text, &label)
}

fn read_limited(path: &Path) -> Result<String, String> {
    let file = std::fs::File::open(path).map_err(|e| match e.kind() {
        std::io::ErrorKind::NotFound => "not found; check the path".to_string(),
        _ => e.to_string(),
    })?;
    let mut bytes = Vec::new();
    file.take(MAX_FILE_BYTES + 1)
        .read_to_end(&mut bytes)
        .map_err(|e| e.to_string())?;
    if bytes.len() as u64 > MAX_FILE_BYTES {
        return Err(format!(
            "larger than {} KiB; is this a site config?",
            MAX_FILE_BYTES / 1024
        ));
    }
    String::from_utf8(bytes).map_err(|_| "not UTF-8 text".to_string())
}

/// Validate config text; `path_label` names it in messages. All errors come back at once.
pub fn load_str(text: &str, path_label: &str) -> Result<Site, SiteErrors> {
    let mut sink = Sink::new(text, path_label);
    let (doc, syntax) = DeTable::parse_recoverable(text);
    if !syntax.is_empty() {
        // What follows a syntax error may be half-read; report only what is certain.
        for e in syntax {
            let span = e.span().unwrap_or(0..0);
            let msg = format!("TOML syntax error: {}", e.message().trim());
            sink.push(span, ErrorKind::Syntax, "", "", msg);
        }
        return Err(SiteErrors(sink.finish()));
    }
    let root_value = toml::Spanned::new(0..0, toml::de::DeValue::Table(doc.into_inner()));
    let site = build(&root_value, &mut sink, path_label);
    match site {
        Some(site) if !sink.has_errors() => Ok(site),
        Some(_) | None if sink.has_errors() => Err(SiteErrors(sink.finish())),
        // Every refusal should have said why; never fail with an empty list.
        _ => {
            let msg = "the config could not be read, and no specific field was found at                        fault; please report this with the file"
                .into();
            sink.push(0..0, ErrorKind::Unreadable, "", "", msg);
            Err(SiteErrors(sink.finish()))
        }
    }
}

fn build(root_value: &raw::Value<'_>, sink: &mut Sink, path_label: &str) -> Option<Site> {
    let root = RawTable::root(root_value, ROOT_KEYS, sink)?;
    let header = root.table("site", SITE_KEYS, sink);
    if header.is_none() && !root.has("site") {
        let msg = "missing table [site] — give the site's id, name and unit_system".into();
        sink.push(0..0, ErrorKind::Missing, "site", "", msg);
    }
    let tables = cross::Tables {
        products: root.tables("product", product::PRODUCT_KEYS, sink),
        viscometers: root.tables("viscometer", viscometer::VISCOMETER_KEYS, sink),
        lines: root.tables("line", line::LINE_KEYS, sink),
        pumps: root.tables("pump", pump::PUMP_KEYS, sink),
        tanks: root.tables("tank", &tank::keys(), sink),
    };
    cross::check(&tables, sink);
    let header = header.map(|h| site_header(h, sink));
    let products = all(tables.products, sink, product::build);
    let viscometers = all(tables.viscometers, sink, viscometer::build);
    let lines = all(tables.lines, sink, line::build);
    let pumps = all(tables.pumps, sink, pump::build);
    let tanks = all(tables.tanks, sink, tank::build);
    let (id, name, unit_system, operators, atmospheric_pressure_pa) = header.flatten()?;
    Some(Site {
        id,
        name,
        unit_system,
        operators,
        atmospheric_pressure_pa,
        products: products?,
        viscometers: viscometers?,
        lines: lines?,
        pumps: pumps?,
        tanks: tanks?,
        source: crate::text::sanitize(path_label, false),
    })
}

type Header = (String, String, crate::units::UnitSystem, Vec<String>, f64);

fn site_header(t: RawTable, sink: &mut Sink) -> Option<Header> {
    let id = t.id(sink, "id", Need::Required);
    let name = t.text(sink, "name", Need::Required);
    let system = t.choice(sink, "unit_system", &UNIT_SYSTEMS, Need::Required);
    let operators = t.texts(sink, "operators");
    let (lo, hi) = ATMOSPHERE_RANGE_PA;
    let atmosphere = t.quantity(
        sink,
        "atmospheric_pressure",
        crate::units::Dimension::Pressure,
        Rule::Within(lo, hi),
        Need::Optional,
    );
    let atmosphere = atmosphere.unwrap_or(crate::units::STANDARD_ATMOSPHERE_PA);
    Some((id?, name?, system?, operators, atmosphere))
}

/// Build every table of one kind; `None` if any failed (each failure is already reported).
fn all<'a, 'i, T>(
    tables: Vec<RawTable<'a, 'i>>,
    sink: &mut Sink,
    build: fn(RawTable<'a, 'i>, &mut Sink) -> Option<T>,
) -> Option<Vec<T>> {
    let built: Vec<Option<T>> = tables.into_iter().map(|t| build(t, sink)).collect();
    built.into_iter().collect()
}
