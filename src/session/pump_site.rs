//! A site pump on the line it feeds, with a product's flow curve: the corrected curve and
//! the duty point (centrifugal), or the delivered flow against the relief (positive
//! displacement).

use super::line::duty_pressure;
use super::pump::{BepAnswer, PumpNote, at_bep};
use crate::line::Regime;
use crate::pump::{
    DisplacementPump, Duty, G, PdDuty, PumpCurve, PumpPoint, Relief, SlipBasis, SystemCurve,
    operating_point, pd_duty,
};
use crate::rheology::Model;
use crate::site::{Line, Pump, PumpKind, Site};

/// A site pump on the line it feeds, with a product's flow curve.
pub struct SitePump<'a> {
    pub site: &'a Site,
    pub pump_id: &'a str,
    pub product: &'a str,
    pub model: Model,
    /// Shaft speed; `None` runs at the rated speed.
    pub speed_rad_s: Option<f64>,
    pub shear_rate_per_s: f64,
}

/// A centrifugal pump's answer.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct CentrifugalAnswer {
    pub bep: BepAnswer,
    pub viscosity_pa_s: f64,
    pub nu_cst: f64,
    pub water_curve: PumpCurve,
    pub curve: PumpCurve,
    pub duty: Option<Duty>,
    pub regime: Option<Regime>,
    /// (flow m³/s, head m) along the line, for a chart.
    pub system_points: Vec<(f64, f64)>,
}

/// A positive-displacement pump's answer.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct DisplacementAnswer {
    pub duty: PdDuty,
    pub viscosity_pa_s: f64,
    pub regime: Regime,
    pub density_kg_m3: f64,
}

/// Either kind.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
#[serde(tag = "kind", rename_all = "kebab-case")]
pub enum PumpAnswer {
    Centrifugal(CentrifugalAnswer),
    Displacement(DisplacementAnswer),
}

/// The answer with its notes.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct SitePumpAnswer {
    pub pump_id: String,
    pub line_id: String,
    pub answer: PumpAnswer,
    pub notes: Vec<PumpNote>,
}

/// Why a site pump cannot be answered.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum PumpSetupError {
    #[error("pump '{id}' is not in the site config; its pumps: {known}")]
    UnknownPump { id: String, known: String },
    #[error("product '{name}' is not in the site config; its products: {known}")]
    UnknownProduct { name: String, known: String },
    #[error("pump '{pump}' feeds line '{line}', which is not in the site config")]
    NoLine { pump: String, line: String },
    #[error("the water curve of pump '{0}' cannot be read as a head curve")]
    BadCurve(String),
}

/// Answer a site pump on its line.
pub fn on_site(q: &SitePump) -> Result<SitePumpAnswer, PumpSetupError> {
    let site = q.site;
    let pump = site
        .pump(q.pump_id)
        .ok_or_else(|| PumpSetupError::UnknownPump {
            id: q.pump_id.into(),
            known: site
                .pumps
                .iter()
                .map(|p| p.id.as_str())
                .collect::<Vec<_>>()
                .join(", "),
        })?;
    let product = site
        .product(q.product)
        .ok_or_else(|| PumpSetupError::UnknownProduct {
            name: q.product.into(),
            known: site
                .products
                .iter()
                .map(|p| p.name.as_str())
                .collect::<Vec<_>>()
                .join(", "),
        })?;
    let line = site
        .line(&pump.feeds)
        .ok_or_else(|| PumpSetupError::NoLine {
            pump: pump.id.clone(),
            line: pump.feeds.clone(),
        })?;
    let rho = product.density_kg_m3;
    let mu = q.model.apparent_viscosity(q.shear_rate_per_s);
    let mut notes = Vec::new();
    let non_newtonian = !matches!(q.model, Model::Newtonian { .. });
    if non_newtonian && matches!(pump.kind, PumpKind::Centrifugal { .. }) {
        notes.push(PumpNote::NonNewtonianNotStandardized {
            shear_rate_per_s: q.shear_rate_per_s,
        });
    }
    if shear_thickening(&q.model) {
        notes.push(PumpNote::ShearThickening);
    }
    let speed = q.speed_rad_s.unwrap_or(pump.rated_speed_rad_s);
    let answer = match &pump.kind {
        PumpKind::Centrifugal { curve } => {
            let water = water_curve(pump, curve)?.at_speed(speed / pump.rated_speed_rad_s);
            PumpAnswer::Centrifugal(centrifugal(
                &water, line, q, rho, mu, speed, pump, &mut notes,
            ))
        }
        PumpKind::PositiveDisplacement {
            displacement_m3_per_rev,
        } => {
            let pd = DisplacementPump {
                displacement_m3_per_rev: *displacement_m3_per_rev,
                speed_rev_s: speed / (2.0 * std::f64::consts::PI),
                volumetric_efficiency: pump.volumetric_efficiency,
                relief_pa: pump.relief_setting_pa,
                motor_rating_w: pump.motor_rating_w,
            };
            PumpAnswer::Displacement(displacement(&pd, line, q, rho, mu, &mut notes))
        }
    };
    Ok(SitePumpAnswer {
        pump_id: pump.id.clone(),
        line_id: line.id.clone(),
        answer,
        notes,
    })
}

fn shear_thickening(model: &Model) -> bool {
    matches!(model, Model::PowerLaw { n, .. } | Model::HerschelBulkley { n, .. } if *n > 1.0)
}

fn water_curve(
    pump: &Pump,
    curve: &[crate::site::CurvePoint],
) -> Result<PumpCurve, PumpSetupError> {
    let points = curve
        .iter()
        .map(|c| PumpPoint {
            flow_m3_s: c.flow_m3_s,
            head_m: c.head_m,
            efficiency: c.efficiency,
        })
        .collect();
    PumpCurve::new(points).ok_or_else(|| PumpSetupError::BadCurve(pump.id.clone()))
}

#[allow(clippy::too_many_arguments)]
fn centrifugal(
    water: &PumpCurve,
    line: &Line,
    q: &SitePump,
    rho: f64,
    mu: f64,
    speed: f64,
    pump: &Pump,
    notes: &mut Vec<PumpNote>,
) -> CentrifugalAnswer {
    let nu_cst = mu / rho * 1e6;
    let rpm = speed * 60.0 / (2.0 * std::f64::consts::PI);
    let bep = at_bep(nu_cst, water.bep(), rpm, Some(rho));
    notes.extend(bep.notes.iter().copied());
    let curve = water.corrected(&bep.correction);
    let system = |flow: f64| duty_pressure(line, &q.model, rho, flow).0 / (rho * G);
    let duty = operating_point(
        &curve,
        &SystemCurve::Function(&system),
        rho,
        pump.motor_rating_w,
    );
    let duty = duty.map_err(|why| notes.push(PumpNote::NoDuty(why))).ok();
    let regime = duty.and_then(|d| duty_pressure(line, &q.model, rho, d.flow_m3_s).1);
    if regime.is_some_and(|r| r != Regime::Laminar) {
        notes.push(PumpNote::NotLaminar);
    }
    if duty.is_some_and(|d| d.motor_margin_w.is_some_and(|m| m < 0.0)) {
        notes.push(PumpNote::MotorOverloaded);
    }
    let top = curve.flow_range().1;
    let system_points = (0..=30)
        .map(|i| top * i as f64 / 30.0)
        .map(|f| (f, system(f)))
        .collect();
    CentrifugalAnswer {
        bep,
        viscosity_pa_s: mu,
        nu_cst,
        water_curve: water.clone(),
        curve,
        duty,
        regime,
        system_points,
    }
}

fn displacement(
    pd: &DisplacementPump,
    line: &Line,
    q: &SitePump,
    rho: f64,
    mu: f64,
    notes: &mut Vec<PumpNote>,
) -> DisplacementAnswer {
    let system = |flow: f64| duty_pressure(line, &q.model, rho, flow).0;
    let duty = pd_duty(pd, &system, mu);
    if duty.basis != SlipBasis::Measured {
        notes.push(PumpNote::SlipEstimated);
    }
    if matches!(duty.relief, Relief::Opens { .. }) {
        notes.push(PumpNote::ReliefOpens);
    }
    if duty.pressure_speed_exponent > 1.0 {
        notes.push(PumpNote::PressureRisesFasterThanSpeed {
            exponent: duty.pressure_speed_exponent,
        });
    }
    if duty.motor_margin_w.is_some_and(|m| m < 0.0) {
        notes.push(PumpNote::MotorOverloaded);
    }
    notes.push(PumpNote::MechanicalLossesIgnored);
    let regime = duty_pressure(line, &q.model, rho, duty.flow_m3_s)
        .1
        .unwrap_or(Regime::Laminar);
    if regime != Regime::Laminar {
        notes.push(PumpNote::NotLaminar);
    }
    DisplacementAnswer {
        duty,
        viscosity_pa_s: mu,
        regime,
        density_kg_m3: rho,
    }
}
