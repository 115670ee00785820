//! A restart question set on the site: the line's bore, length, rise and back-pressure, the
//! pump's limit, the product's density and gel build-up, and the line's coldest temperature.

use super::restart::{ColdCase, LimitSource, RestartInput};
use crate::line::restart::{
    DEFAULT_MARGIN, GelFit, GelFitOptions, GelReading, PlugLine, RestartError, fit_gel,
};
use crate::pump::G;
use crate::rheology::temperature::arrhenius_factor;
use crate::site::{Line, Product, Pump, PumpKind, Site};

/// Where the gel build-up comes from.
#[derive(Debug, Clone, PartialEq)]
pub enum GelSource {
    /// Rested-gel readings to fit, with a time constant to use if there are only two (else
    /// the site product's, else the longer rest time).
    Readings(Vec<GelReading>, Option<f64>),
    /// (τi, τ∞, tr) given directly.
    Constants(f64, f64, f64),
    /// One gel stress taken for any stop.
    Stress(f64),
    /// The product's `gel` table in the site config.
    Product,
}

/// Why the site cannot pose the question.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum RestartSetupError {
    #[error("line '{id}' is not in the site config; its lines: {known}")]
    UnknownLine { id: String, known: String },
    #[error("pump '{id}' is not in the site config; its pumps: {known}")]
    UnknownPump { id: String, known: String },
    #[error("product '{name}' is not in the site config; its products: {known}")]
    UnknownProduct { name: String, known: String },
    #[error("pump '{pump}' feeds line '{feeds}', not '{line}'; pumps on '{line}': {known}")]
    PumpFeedsAnother {
        pump: String,
        feeds: String,
        line: String,
        known: String,
    },
    #[error(
        "product '{name}' has no gel build-up in the site config; give gel readings \
         (--gel-readings FILE.csv), the constants (--gel-initial, --gel-final, \
         --gel-time-constant) or one --gel-stress"
    )]
    NoGel { name: String },
    #[error("{0}")]
    Restart(#[from] RestartError),
}

fn known<'a>(ids: impl Iterator<Item = &'a str>) -> String {
    let list: Vec<&str> = ids.collect();
    if list.is_empty() {
        "none".into()
    } else {
        list.join(", ")
    }
}

/// Find the line, pump and product on the site.
pub fn lookup<'a>(
    site: &'a Site,
    line_id: &str,
    pump_id: &str,
    product: &str,
) -> Result<(&'a Line, &'a Pump, &'a Product), RestartSetupError> {
    let line = site
        .line(line_id)
        .ok_or_else(|| RestartSetupError::UnknownLine {
            id: line_id.into(),
            known: known(site.lines.iter().map(|l| l.id.as_str())),
        })?;
    let pump = site
        .pump(pump_id)
        .ok_or_else(|| RestartSetupError::UnknownPump {
            id: pump_id.into(),
            known: known(site.pumps.iter().map(|p| p.id.as_str())),
        })?;
    if pump.feeds != line.id {
        return Err(RestartSetupError::PumpFeedsAnother {
            pump: pump.id.clone(),
            feeds: pump.feeds.clone(),
            line: line.id.clone(),
            known: known(site.pumps_feeding(&line.id).iter().map(|p| p.id.as_str())),
        });
    }
    let product = site
        .product(product)
        .ok_or_else(|| RestartSetupError::UnknownProduct {
            name: product.into(),
            known: known(site.products.iter().map(|p| p.name.as_str())),
        })?;
    Ok((line, pump, product))
}

/// The restart input for a line, its pump and a product on the site.
pub fn from_site(
    site: &Site,
    (line_id, pump_id, product): (&str, &str, &str),
    gel: GelSource,
    stopped_for_s: Option<f64>,
) -> Result<RestartInput, RestartSetupError> {
    let (line, pump, product) = lookup(site, line_id, pump_id, product)?;
    let rho = product.density_kg_m3;
    let plug = PlugLine::new(
        line.inner_diameter_m,
        line.total_length_m(),
        rho * G * line.elevation_change_m,
        line.back_pressure_pa,
    )?;
    let (available_pa, limit_source) = pump_limit(pump, rho);
    let single = matches!(gel, GelSource::Stress(_));
    let gel = gel_fit(gel, product)?;
    Ok(RestartInput {
        line: plug,
        fittings_included: line.fittings_length_m > 0.0,
        available_pa,
        limit_source,
        design_pa: Some(line.design_pressure_pa),
        stopped_for_s,
        margin: line.restart_margin,
        margin_is_default: (line.restart_margin - DEFAULT_MARGIN).abs() < 1e-12,
        gel,
        single_gel_stress: single,
        cold: cold_case(line, product),
    })
}

/// The most the pump can give at the discharge, and what sets it.
pub fn pump_limit(pump: &Pump, density: f64) -> (f64, LimitSource) {
    let casing = pump
        .max_discharge_pressure_pa
        .map(|p| (p, LimitSource::CasingLimit));
    let relief = pump.relief_setting_pa.map(|p| (p, LimitSource::Relief));
    let own = match &pump.kind {
        PumpKind::PositiveDisplacement {
            displacement_m3_per_rev,
        } => {
            // T = P/ω at rated speed; ΔP = 2π·T/V_d (no mechanical losses).
            pump.motor_rating_w.map(|w| {
                let torque = w / pump.rated_speed_rad_s;
                (
                    2.0 * std::f64::consts::PI * torque / displacement_m3_per_rev,
                    LimitSource::MotorTorque,
                )
            })
        }
        PumpKind::Centrifugal { curve } => {
            let shut_off = curve.first().map_or(0.0, |p| p.head_m);
            Some((density * G * shut_off, LimitSource::ShutOffHead))
        }
    };
    [relief, casing, own]
        .into_iter()
        .flatten()
        .min_by(|a, b| a.0.total_cmp(&b.0))
        .unwrap_or((f64::NAN, LimitSource::Given))
}

fn gel_fit(source: GelSource, product: &Product) -> Result<GelFit, RestartSetupError> {
    let site_tr = product.gel.map(|g| g.rebuild_time_s);
    Ok(match source {
        GelSource::Readings(readings, given_tr) => {
            let opts = GelFitOptions {
                time_constant_s: given_tr.or(site_tr),
                ..GelFitOptions::default()
            };
            fit_gel(&readings, &opts)?
        }
        GelSource::Constants(a, b, tr) => super::restart::gel_from_constants(a, b, tr)?,
        GelSource::Stress(s) => super::restart::gel_from_constants(s, s, 1.0)?,
        GelSource::Product => {
            let g = product.gel.ok_or_else(|| RestartSetupError::NoGel {
                name: product.name.clone(),
            })?;
            super::restart::gel_from_constants(g.initial_pa, g.long_rest_pa, g.rebuild_time_s)?
        }
    })
}

fn cold_case(line: &Line, product: &Product) -> Option<ColdCase> {
    let t = line.coldest_temperature_k?;
    let consistency_factor = product
        .activation_energy_j_mol
        .map(|ea| arrhenius_factor(ea, t, product.reference_temperature_k));
    Some(ColdCase {
        temperature_k: t,
        gel_factor: line.gel_cold_factor,
        consistency_factor,
    })
}
