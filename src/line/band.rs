//! The fit's uncertainty carried into the pressure drop: linear propagation of the parameter
//! covariance through central finite-difference gradients (the delta method, e.g. JCGM 100:2008
//! *Guide to the expression of uncertainty in measurement*, §5.1.2; `rheology::band`), scaled
//! by the same Student t factor as the parameters' 95 % intervals.

use super::error::LineError;
use super::forward::pressure_drop;
use super::pipe::{Fluid, Pipe};
use crate::rheology::band::propagated_sd;

/// Parameter covariance in the order of `ModelKind::param_names`, and the t factor
/// (t(0.975, dof) for a 95 % band).
#[derive(Debug, Clone, PartialEq)]
pub struct Uncertainty {
    pub covariance: Vec<Vec<f64>>,
    pub t: f64,
}

/// [low, high] of the total pressure drop at a flow, Pa: p ± t·√(gᵀCg), with g the gradient
/// of the pressure drop in the flow-curve parameters.
pub fn pressure_drop_band(
    pipe: &Pipe,
    fluid: &Fluid,
    flow_m3_s: f64,
    u: &Uncertainty,
) -> Result<(f64, f64), LineError> {
    let p = pressure_drop(pipe, fluid, flow_m3_s)?.pressure_drop_pa;
    let sd = propagated_sd(fluid.model, &u.covariance, |model| {
        Ok::<f64, LineError>(
            pressure_drop(pipe, &Fluid { model, ..*fluid }, flow_m3_s)?.pressure_drop_pa,
        )
    })?;
    let half = u.t * sd;
    Ok((p - half, p + half))
}
