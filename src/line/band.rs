//! The fit's uncertainty carried into the pressure drop: linear propagation of the parameter
//! covariance through central finite-difference gradients (the delta method, e.g. JCGM 100:2008
//! *Guide to the expression of uncertainty in measurement*, §5.1.2), scaled by the same
//! Student t factor as the parameters' 95 % intervals.

use super::error::LineError;
use super::forward::pressure_drop;
use super::pipe::{Fluid, Pipe};
use crate::rheology::Model;

/// Parameter covariance in the order of `ModelKind::param_names`, and the t factor
/// (t(0.975, dof) for a 95 % band).
#[derive(Debug, Clone, PartialEq)]
pub struct Uncertainty {
    pub covariance: Vec<Vec<f64>>,
    pub t: f64,
}

/// Relative step of the finite differences.
const STEP: f64 = 1e-5;

/// [low, high] of the total pressure drop at a flow, Pa: p ± t·√(gᵀCg), with g the gradient
/// of the pressure drop in the flow-curve parameters.
pub fn pressure_drop_band(
    pipe: &Pipe,
    fluid: &Fluid,
    flow_m3_s: f64,
    u: &Uncertainty,
) -> Result<(f64, f64), LineError> {
    let p = pressure_drop(pipe, fluid, flow_m3_s)?.pressure_drop_pa;
    let values: Vec<f64> = fluid.model.params().iter().map(|(_, v)| *v).collect();
    let mut grad = vec![0.0; values.len()];
    for (i, g) in grad.iter_mut().enumerate() {
        let var = u
            .covariance
            .get(i)
            .and_then(|r| r.get(i))
            .copied()
            .unwrap_or(0.0);
        if var <= 0.0 {
            continue;
        }
        let h = STEP * values[i].abs().max(var.sqrt());
        let at = |x: f64| -> Result<f64, LineError> {
            let model = with_value(fluid.model, i, x);
            Ok(pressure_drop(pipe, &Fluid { model, ..*fluid }, flow_m3_s)?.pressure_drop_pa)
        };
        let lo = (values[i] - h).max(0.0);
        *g = (at(values[i] + h)? - at(lo)?) / (values[i] + h - lo);
    }
    let mut var = 0.0;
    for (i, gi) in grad.iter().enumerate() {
        for (j, gj) in grad.iter().enumerate() {
            let c = u
                .covariance
                .get(i)
                .and_then(|r| r.get(j))
                .copied()
                .unwrap_or(0.0);
            var += gi * c * gj;
        }
    }
    let half = u.t * var.max(0.0).sqrt();
    Ok((p - half, p + half))
}

/// The model with parameter `index` (in `param_names` order) set to `value`.
pub(crate) fn with_value(model: Model, index: usize, value: f64) -> Model {
    let mut v = model.params().iter().map(|(_, x)| *x).collect::<Vec<f64>>();
    if let Some(slot) = v.get_mut(index) {
        *slot = value;
    }
    let at = |i: usize| v.get(i).copied().unwrap_or(0.0);
    match model {
        Model::Newtonian { .. } => Model::Newtonian { mu: at(0) },
        Model::PowerLaw { .. } => Model::PowerLaw { k: at(0), n: at(1) },
        Model::Bingham { .. } => Model::Bingham {
            tau0: at(0),
            mu_p: at(1),
        },
        Model::HerschelBulkley { .. } => Model::HerschelBulkley {
            tau0: at(0),
            k: at(1),
            n: at(2),
        },
        Model::Casson { .. } => Model::Casson {
            tau0: at(0),
            mu_c: at(1),
        },
    }
}
