//! The one-screen equipment summary `check-site` prints (80 columns, 24 lines at most),
//! numbers in the site's unit system.

use super::model::{
    Baffles, Impeller, LimitProperty, Line, Product, Pump, PumpKind, Site, Tank, Viscometer,
};
use crate::instrument::Geometry;
use crate::units::{self, Dimension, UnitSystem};

/// Widest line the summary prints.
pub const SUMMARY_COLUMNS: usize = 80;
/// Most lines the summary prints.
pub const SUMMARY_LINES: usize = 24;
/// Widest id column; longer ids are shortened in the summary only.
const ID_COLUMN: usize = 12;
/// Room for a row's text after the indent and the widest id column.
const ROW_ROOM: usize = SUMMARY_COLUMNS - ID_COLUMN - 4;
/// Most cautions listed before "… and N more".
const MAX_CAUTIONS: usize = 2;

struct Section {
    title: &'static str,
    rows: Vec<(String, String)>,
}

/// The `check-site` summary: every item on one line when it fits the screen, otherwise one
/// line of ids per kind. Always ends with the advisory note.
pub fn summary(site: &Site) -> String {
    let sys = site.unit_system;
    let sections = [
        Section {
            title: "Products",
            rows: site
                .products
                .iter()
                .map(|p| (p.name.clone(), product(p, sys)))
                .collect(),
        },
        Section {
            title: "Viscometers",
            rows: site
                .viscometers
                .iter()
                .map(|v| (v.id.clone(), viscometer(v)))
                .collect(),
        },
        Section {
            title: "Lines",
            rows: site
                .lines
                .iter()
                .map(|l| (l.id.clone(), line(l, sys)))
                .collect(),
        },
        Section {
            title: "Pumps",
            rows: site
                .pumps
                .iter()
                .map(|p| (p.id.clone(), pump(p, sys)))
                .collect(),
        },
        Section {
            title: "Tanks",
            rows: site
                .tanks
                .iter()
                .map(|t| (t.id.clone(), tank(t, sys)))
                .collect(),
        },
    ];
    let mut head = header(site);
    let tail = footer(site);
    let detailed: Vec<String> = sections.iter().flat_map(detailed_rows).collect();
    if head.len() + detailed.len() + tail.len() <= SUMMARY_LINES {
        head.extend(detailed);
    } else {
        head.extend(sections.iter().map(compact_row));
    }
    head.extend(tail);
    let fitted: Vec<String> = head.iter().map(|l| fit(l, SUMMARY_COLUMNS)).collect();
    fitted.join("\n") + "\n"
}

fn header(site: &Site) -> Vec<String> {
    let system = match site.unit_system {
        UnitSystem::Si => "SI",
        UnitSystem::UsCustomary => "US customary",
    };
    let mut second = format!("Units {system}.");
    if !site.operators.is_empty() {
        second.push_str(&format!(" Operators: {}", site.operators.join(", ")));
    }
    vec![
        format!("{}: valid site config", site.source),
        format!("Site {}: {}", site.id, site.name),
        second,
    ]
}

fn detailed_rows(s: &Section) -> Vec<String> {
    if s.rows.is_empty() {
        return Vec::new();
    }
    let mut out = vec![format!("{} ({})", s.title, s.rows.len())];
    let longest = s
        .rows
        .iter()
        .map(|(id, _)| id.chars().count())
        .max()
        .unwrap_or(0);
    let w = longest.min(ID_COLUMN);
    out.extend(
        s.rows
            .iter()
            .map(|(id, text)| format!("  {:<w$}  {text}", fit(id, w))),
    );
    out
}

fn compact_row(s: &Section) -> String {
    let ids: Vec<&str> = s.rows.iter().map(|(id, _)| id.as_str()).collect();
    format!("{} ({}): {}", s.title, ids.len(), ids.join(", "))
}

/// Pressure cautions, then the standing advice. Cautions come first: they may need action.
fn footer(site: &Site) -> Vec<String> {
    let cautions = pressure_cautions(site);
    let mut out: Vec<String> = cautions.iter().take(MAX_CAUTIONS).cloned().collect();
    if cautions.len() > MAX_CAUTIONS {
        out.push(format!(
            "  ... and {} more pressure cautions",
            cautions.len() - MAX_CAUTIONS
        ));
    }
    out.push("Advice only, not a certificate. Isolate and lock out before opening a line.".into());
    out
}

/// A pump whose pressure limit is above its line's design pressure can overpressure the line.
pub(crate) fn pressure_cautions(site: &Site) -> Vec<String> {
    let sys = site.unit_system;
    site.pumps
        .iter()
        .filter_map(|p| {
            let l = site.line(&p.feeds)?;
            (p.pressure_limit_pa() > l.design_pressure_pa).then(|| {
                format!(
                    "CAUTION: {} may reach {}, above line {} design {}: protect the line.",
                    p.id,
                    pressure(p.pressure_limit_pa(), sys),
                    l.id,
                    pressure(l.design_pressure_pa, sys)
                )
            })
        })
        .collect()
}

fn product(p: &Product, sys: UnitSystem) -> String {
    let mut s = format!(
        "{}, {}",
        units::format(p.density_kg_m3, Dimension::Density, sys),
        units::format(p.reference_temperature_k, Dimension::Temperature, sys)
    );
    if let Some(g) = &p.gel {
        let time = units::format_in(g.rebuild_time_s, Dimension::Time, "min");
        let gel = joined(
            &stress(g.initial_pa, sys),
            " -> ",
            &stress(g.long_rest_pa, sys),
        );
        s.push_str(&format!("; gel {gel}, t_r {time}"));
    }
    if p.limits.is_empty() {
        return s;
    }
    // Say as much about the limits as the row has room for.
    let names: Vec<&str> = p.limits.iter().map(|l| limit_name(&l.property)).collect();
    let named = format!("{s}; limits {}", names.join(" "));
    let counted = format!("{s}; {} limits", p.limits.len());
    [named, counted]
        .into_iter()
        .find(|row| row.chars().count() <= ROW_ROOM)
        .unwrap_or(s)
}

/// "120 Pa", "520 Pa" → "120 -> 520 Pa": one unit when both share it.
fn joined(a: &str, sep: &str, b: &str) -> String {
    match (a.rsplit_once(' '), b.rsplit_once(' ')) {
        (Some((num, ua)), Some((_, ub))) if ua == ub => format!("{num}{sep}{b}"),
        _ => format!("{a}{sep}{b}"),
    }
}

fn limit_name(p: &LimitProperty) -> &'static str {
    match p {
        LimitProperty::ConsistencyIndex => "K",
        LimitProperty::FlowIndex => "n",
        LimitProperty::YieldStress => "tau0",
        LimitProperty::ApparentViscosity { .. } => "mu_a",
    }
}

fn viscometer(v: &Viscometer) -> String {
    // Bob and cup sizes are always shown in mm: that is how they are specified.
    let mm = |m: f64| units::format_in(m, Dimension::Length, "mm");
    match &v.geometry {
        Geometry::StandardSixSpeed => "standard six-speed rotor-bob, full scale 300".into(),
        Geometry::Coaxial(c) => format!(
            "coaxial: bob r {} L {}, cup r {}, full scale {}",
            mm(c.bob_radius_m),
            mm(c.bob_length_m),
            mm(c.cup_radius_m),
            units::significant(c.full_scale_dial)
        ),
        Geometry::Spindle(s) => format!(
            "spindle: r {} L {}, full scale {}",
            mm(s.radius_m),
            mm(s.length_m),
            units::significant(s.full_scale_dial)
        ),
    }
}

/// Long lengths (lines, tanks) in m or ft rather than the small-length unit.
fn long(m: f64, sys: UnitSystem) -> String {
    let unit = match sys {
        UnitSystem::Si => "m",
        UnitSystem::UsCustomary => "ft",
    };
    units::format_in(m, Dimension::Length, unit)
}

fn line(l: &Line, sys: UnitSystem) -> String {
    format!(
        "ID {} x {} (+{} fittings), rise {}, design {}",
        units::format(l.inner_diameter_m, Dimension::Length, sys),
        long(l.length_m, sys),
        long(l.fittings_length_m, sys),
        long(l.elevation_change_m, sys),
        pressure(l.design_pressure_pa, sys)
    )
}

fn pump(p: &Pump, sys: UnitSystem) -> String {
    let speed = units::format(p.rated_speed_rad_s, Dimension::Speed, sys);
    let what = match &p.kind {
        PumpKind::Centrifugal { curve } => format!("centrifugal, {} curve points", curve.len()),
        PumpKind::PositiveDisplacement {
            displacement_m3_per_rev,
        } => {
            format!("PD, {}", displacement(*displacement_m3_per_rev, sys))
        }
    };
    let limit = match (p.max_discharge_pressure_pa, p.relief_setting_pa) {
        (_, Some(r)) => format!("relief {}", pressure(r, sys)),
        (Some(m), None) => format!("max {}", pressure(m, sys)),
        (None, None) => String::new(),
    };
    format!("{what} -> {}, {speed}, {limit}", p.feeds)
}

fn tank(t: &Tank, sys: UnitSystem) -> String {
    let baffles = match t.baffles {
        Baffles::Baffled => "baffled",
        Baffles::Unbaffled => "unbaffled",
    };
    let size = joined(
        &long(t.diameter_m, sys),
        " x ",
        &long(t.liquid_height_m, sys),
    );
    format!(
        "{}, {size} {baffles}, {} {}, {}",
        t.product,
        short_impeller(t.impeller),
        long(t.impeller_diameter_m, sys),
        units::format(t.motor_rating_w, Dimension::Power, sys),
    )
}

/// Impeller names short enough for one summary row.
fn short_impeller(i: Impeller) -> &'static str {
    match i {
        Impeller::RushtonTurbine => "rushton",
        Impeller::PitchedBladeTurbine => "pitched-blade",
        Impeller::Propeller => "propeller",
        Impeller::Anchor => "anchor",
        Impeller::HelicalRibbon => "ribbon",
        Impeller::Hydrofoil => "hydrofoil",
    }
}

fn pressure(pa: f64, sys: UnitSystem) -> String {
    units::format(pa, Dimension::Pressure, sys)
}

fn stress(pa: f64, sys: UnitSystem) -> String {
    units::format(pa, Dimension::Stress, sys)
}

/// Displacement per revolution in L/rev (SI) or US gal/rev.
fn displacement(m3: f64, sys: UnitSystem) -> String {
    match sys {
        UnitSystem::Si => format!("{} L/rev", units::significant(m3 * 1e3)),
        UnitSystem::UsCustomary => {
            format!(
                "{} gal/rev",
                units::significant(m3 / units::table::US_GALLON)
            )
        }
    }
}

/// Cut a line to `width` characters, marking the cut.
fn fit(s: &str, width: usize) -> String {
    if s.chars().count() <= width {
        return s.to_string();
    }
    let mut out: String = s.chars().take(width.saturating_sub(1)).collect();
    out.push('~');
    out
}
