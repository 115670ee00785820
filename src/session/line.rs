//! Line answers for the faces: a site line (or a pipe typed in) plus a resolved flow curve
//! become engine inputs; out come the pressure drop at a flow, the flow at a pressure, the
//! system curve with its band and regimes, and the plant readings compared with the
//! prediction, each with the cautions that go with it.
//!
//! The band: the fit's covariance (shifted with the curve to the line's temperature) carried
//! linearly into the pressure drop (`line::pressure_drop_band`), joined with the laminar and
//! turbulent estimates when the flow is transitional.

use super::line_words::{Caution, cautions};
use super::rheology_source::Resolved;
use crate::line::{
    self, BackCalc, Comparison, CurvePoint, FlowAnswer, Fluid, LineAnswer, LineError, Pipe,
    PlantPair, PlantPoint, Uncertainty,
};
use crate::rheology::stats::t975;
use crate::site::Site;

/// Everything a line answer needs, resolved.
#[derive(Debug, Clone)]
pub struct LineCase {
    pub pipe: Pipe,
    pub fluid: Fluid,
    /// The fit's covariance at the line's temperature, when the curve came from a fit.
    pub uncertainty: Option<Uncertainty>,
    /// The site line's id and design pressure (weakest part, gauge), when from a site.
    pub line_id: Option<String>,
    pub design_pressure_pa: Option<f64>,
    pub temperature_k: Option<f64>,
    pub source: Resolved,
}

/// Why a case could not be built.
#[derive(Debug, thiserror::Error)]
pub enum LineCaseError {
    #[error("line '{given}' is not in the site config; the site's lines: {known}")]
    UnknownLine { given: String, known: String },
    #[error(
        "no density: give --density RHO (kg/m3, or with a unit), or --product P for a product \
         in the site config"
    )]
    NoDensity,
    #[error("{0}")]
    Line(#[from] LineError),
}

/// The case for a site line; the density is the product's unless one is given.
pub fn site_case(
    site: &Site,
    line_id: &str,
    source: Resolved,
    density: Option<f64>,
) -> Result<LineCase, LineCaseError> {
    let Some(l) = site.line(line_id) else {
        let known: Vec<&str> = site.lines.iter().map(|l| l.id.as_str()).collect();
        return Err(LineCaseError::UnknownLine {
            given: line_id.to_string(),
            known: if known.is_empty() {
                "none".into()
            } else {
                known.join(", ")
            },
        });
    };
    let mut case = pipe_case(pipe_of(l), source, density)?;
    case.line_id = Some(l.id.clone());
    case.design_pressure_pa = Some(l.design_pressure_pa);
    Ok(case)
}

/// A site line as the engine's pipe.
pub fn pipe_of(l: &crate::site::Line) -> Pipe {
    Pipe {
        inner_diameter_m: l.inner_diameter_m,
        length_m: l.length_m,
        fittings_length_m: l.fittings_length_m,
        roughness_m: l.roughness_m,
        elevation_change_m: l.elevation_change_m,
    }
}

/// What a pump must give at a flow on a site line (gauge, Pa) and the regime there: friction
/// and static head by the line module in every regime (the middle of the band when
/// transitional), plus the back-pressure held at the outlet. At no flow a yield-stress
/// product still needs its plug broken, 4·τ0·L/D (the force balance on the plug).
pub fn duty_pressure(
    l: &crate::site::Line,
    model: &crate::rheology::Model,
    density_kg_m3: f64,
    flow_m3_s: f64,
) -> (f64, Option<line::Regime>) {
    let pipe = pipe_of(l);
    let fluid = Fluid {
        model: *model,
        density_kg_m3,
    };
    let fixed = density_kg_m3 * crate::pump::G * l.elevation_change_m + l.back_pressure_pa;
    if flow_m3_s <= 0.0 {
        let plug = 4.0 * model.yield_stress() * l.total_length_m() / l.inner_diameter_m;
        return (plug + fixed, None);
    }
    match line::pressure_drop(&pipe, &fluid, flow_m3_s) {
        Ok(a) => (a.pressure_drop_pa + l.back_pressure_pa, Some(a.regime)),
        Err(_) => (f64::NAN, None),
    }
}

/// The case for a pipe typed in; the density is the given one, else the product's.
pub fn pipe_case(
    pipe: Pipe,
    source: Resolved,
    density: Option<f64>,
) -> Result<LineCase, LineCaseError> {
    let density = density
        .or(source.product.as_ref().map(|p| p.density_kg_m3))
        .ok_or(LineCaseError::NoDensity)?;
    let fluid = Fluid {
        model: source.model,
        density_kg_m3: density,
    };
    pipe.check()?;
    fluid.check()?;
    Ok(LineCase {
        pipe,
        fluid,
        uncertainty: uncertainty(&source),
        line_id: None,
        design_pressure_pa: None,
        temperature_k: source.applies_at_k.or(source.measured_at_k),
        source,
    })
}

/// The fit's covariance with the viscosity parameter's row and column scaled by the shift.
fn uncertainty(source: &Resolved) -> Option<Uncertainty> {
    let fit = source.fit.as_ref()?;
    let mut c = fit.covariance.clone()?;
    let t = t975(fit.dof)?;
    let names = source.model.kind().param_names();
    let a = source.shift.factor();
    for (i, row) in c.iter_mut().enumerate() {
        for (j, v) in row.iter_mut().enumerate() {
            let si = if names.get(i) == Some(&source.shifted_parameter) {
                a
            } else {
                1.0
            };
            let sj = if names.get(j) == Some(&source.shifted_parameter) {
                a
            } else {
                1.0
            };
            *v *= si * sj;
        }
    }
    Some(Uncertainty { covariance: c, t })
}

/// The pressure drop at one flow, with its band and cautions.
#[derive(Debug, Clone)]
pub struct AtFlow {
    pub answer: LineAnswer,
    /// [low, high] Pa: the fit's band joined with the transitional range.
    pub band_pa: Option<(f64, f64)>,
    /// The fit's band alone.
    pub fit_band_pa: Option<(f64, f64)>,
    pub cautions: Vec<Caution>,
}

pub fn at_flow(case: &LineCase, flow_m3_s: f64) -> Result<AtFlow, LineError> {
    let answer = line::pressure_drop(&case.pipe, &case.fluid, flow_m3_s)?;
    let fit_band_pa = match &case.uncertainty {
        Some(u) => Some(line::pressure_drop_band(
            &case.pipe,
            &case.fluid,
            flow_m3_s,
            u,
        )?),
        None => None,
    };
    let band_pa = join(fit_band_pa, answer.transition_range_pa);
    let cautions = cautions(case, Some(&answer), band_pa);
    Ok(AtFlow {
        answer,
        band_pa,
        fit_band_pa,
        cautions,
    })
}

fn join(a: Option<(f64, f64)>, b: Option<(f64, f64)>) -> Option<(f64, f64)> {
    match (a, b) {
        (Some(a), Some(b)) => Some((a.0.min(b.0), a.1.max(b.1))),
        (a, b) => a.or(b),
    }
}

/// The flow at a total pressure drop, with the cautions.
#[derive(Debug, Clone)]
pub struct AtPressure {
    pub flow: FlowAnswer,
    pub cautions: Vec<Caution>,
}

pub fn at_pressure(case: &LineCase, pressure_drop_pa: f64) -> Result<AtPressure, LineError> {
    let flow = line::flow_for_pressure(&case.pipe, &case.fluid, pressure_drop_pa)?;
    let mut cautions = cautions(case, flow.answer.as_ref(), None);
    if flow.answer.is_none() {
        cautions.push(Caution::WillNotMove);
    }
    if case
        .design_pressure_pa
        .is_some_and(|d| pressure_drop_pa > d)
    {
        cautions.push(Caution::AboveDesignPressure);
    }
    Ok(AtPressure { flow, cautions })
}

/// The system curve over a flow range (for the line view and the pump answer).
pub fn system_curve(
    case: &LineCase,
    from_m3_s: f64,
    to_m3_s: f64,
    points: usize,
) -> Result<Vec<CurvePoint>, LineError> {
    let mut curve = line::system_curve(
        &case.pipe,
        &case.fluid,
        case.uncertainty.as_ref(),
        from_m3_s,
        to_m3_s,
        points,
    )?;
    for p in &mut curve {
        p.band_pa = join(p.band_pa, p.answer.transition_range_pa);
    }
    Ok(curve)
}

/// Plant (pressure drop, flow) readings against the prediction on this line.
#[derive(Debug, Clone)]
pub struct PlantCheck {
    pub points: Vec<PlantPoint>,
    /// n′, K′ and the Rabinowitsch–Mooney points, from two or more pairs.
    pub back: Option<BackCalc>,
    pub comparison: Comparison,
    /// The disagreement in words, with the likely causes.
    pub words: String,
}

/// One pair is reduced with the predicted n′ at its flow; two or more by their own slope.
pub fn plant_check(case: &LineCase, pairs: &[PlantPair]) -> Result<PlantCheck, LineError> {
    let rho = case.fluid.density_kg_m3;
    let (points, back) = match pairs {
        [one] => {
            let n = line::pressure_drop(&case.pipe, &case.fluid, one.flow_m3_s)?.n_prime;
            let single = line::single_pair(&case.pipe, rho, *one, Some(n))?;
            (vec![single.point], None)
        }
        _ => {
            let back = line::back_calculate(&case.pipe, rho, pairs)?;
            (back.points.clone(), Some(back))
        }
    };
    let comparison = line::compare_with_curve(&case.pipe, &case.fluid.model, &points);
    let words = super::line_words::disagreement(&comparison);
    Ok(PlantCheck {
        points,
        back,
        comparison,
        words,
    })
}
