//! The product's flow curve from plant (pressure drop, flow) pairs on a known line: the pairs
//! reduced by `line::back_calculate` (τw, 8V/D, n′, K′, Rabinowitsch–Mooney), then fitted like
//! viscometer readings through [`super::analyse`], so the same fitting code, model choice and
//! intervals apply.

use super::flow_curve::{FlowCurve, FlowCurveError, FlowCurveInput, FlowCurveOptions, analyse};
use crate::line::{self, BackCalc, LineError, Pipe, PlantPair, SinglePair};

/// Two or more pairs reduced and fitted.
#[derive(Debug, Clone)]
pub struct PlantFit {
    pub back: BackCalc,
    pub curve: FlowCurve,
}

/// Why the plant pairs gave no curve.
#[derive(Debug, thiserror::Error)]
pub enum PlantFitError {
    #[error("{0}")]
    Line(#[from] LineError),
    #[error("cannot fit the wall stresses: {0}")]
    Curve(#[from] FlowCurveError),
}

pub fn plant_fit(
    pipe: &Pipe,
    density: f64,
    pairs: &[PlantPair],
    opts: &FlowCurveOptions,
) -> Result<PlantFit, PlantFitError> {
    let back = line::back_calculate(pipe, density, pairs)?;
    let points = back.fit_points();
    // Direct points: the rates are already the true wall rates, so no correction applies.
    let curve = analyse(FlowCurveInput::Direct { points: &points }, opts)?;
    Ok(PlantFit { back, curve })
}

/// One pair: the apparent viscosity at the wall and, with n from a viscometer curve, K.
pub fn plant_single(
    pipe: &Pipe,
    density: f64,
    pair: PlantPair,
    n_from_viscometer: Option<f64>,
) -> Result<SinglePair, LineError> {
    line::single_pair(pipe, density, pair, n_from_viscometer)
}
