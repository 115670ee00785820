//! The line's system curve: pressure drop against flow over a range, with its band.

use super::answer::LineAnswer;
use super::band::{Uncertainty, pressure_drop_band};
use super::error::LineError;
use super::forward::pressure_drop;
use super::pipe::{Fluid, Pipe, positive};

/// One point of the system curve.
#[derive(Debug, Clone, PartialEq)]
pub struct CurvePoint {
    pub answer: LineAnswer,
    /// The fit's 95 % band on the total pressure drop, when the covariance is known, Pa.
    pub band_pa: Option<(f64, f64)>,
}

/// `points` (two or more) evenly spaced flows from `from_m3_s` to `to_m3_s`, both above zero.
pub fn system_curve(
    pipe: &Pipe,
    fluid: &Fluid,
    uncertainty: Option<&Uncertainty>,
    from_m3_s: f64,
    to_m3_s: f64,
    points: usize,
) -> Result<Vec<CurvePoint>, LineError> {
    positive("lowest flow of the curve", from_m3_s)?;
    positive("highest flow of the curve", to_m3_s)?;
    if points < 2 {
        return Err(LineError::TooFewPoints { got: points });
    }
    let step = (to_m3_s - from_m3_s) / (points - 1) as f64;
    (0..points)
        .map(|i| {
            let q = from_m3_s + step * i as f64;
            let answer = pressure_drop(pipe, fluid, q)?;
            let band_pa = match uncertainty {
                Some(u) => Some(pressure_drop_band(pipe, fluid, q, u)?),
                None => None,
            };
            Ok(CurvePoint { answer, band_pa })
        })
        .collect()
}
