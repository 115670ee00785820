//! Why a tank calculation could not be done: each message says what is wrong and what is
//! accepted.

use super::impeller::ImpellerKind;

/// Input the mixing engine refuses.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum MixError {
    #[error("the {what} must be a finite number above zero, got {value}")]
    NotPositive { what: &'static str, value: f64 },
    #[error(
        "these inputs are beyond what can be computed in double precision (the {what} came out \
         as {value}); check the units of the speed, the impeller and the flow curve"
    )]
    OutOfRange { what: &'static str, value: f64 },

    #[error("the {what} must be above 0 and at most 1 (e.g. 0.85), got {value}")]
    NotAFraction { what: &'static str, value: f64 },

    #[error(
        "the impeller ({impeller_m} m) must be smaller than the tank ({tank_m} m); \
         check that both are diameters, not radii, and in the same unit"
    )]
    ImpellerNotInsideTank { impeller_m: f64, tank_m: f64 },

    #[error("a helical ribbon needs at least one blade; give the number of blades (1, 2, …)")]
    RibbonBlades,

    #[error(
        "ribbon geometry was given for a {} impeller; it applies to a helical-ribbon only",
        .impeller.name()
    )]
    RibbonGeometryOnOther { impeller: ImpellerKind },

    #[error(
        "the agitator speed must be above zero, got {value} rev/s; at rest there is no power \
         curve to read"
    )]
    SpeedNotPositive { value: f64 },

    #[error(
        "at zero speed a product with a yield stress ({tau0} Pa) has no finite apparent \
         viscosity, so no power or cavern can be worked out; give the running speed (the \
         starting torque is a separate question)"
    )]
    ZeroSpeedWithYieldStress { tau0: f64 },

    #[error(
        "the turbulent power number {np_turbulent} is not below the laminar curve's value \
         Kp/Re = {np_laminar_end} at the end of the laminar range; with these constants the \
         power curve would rise with Reynolds number. Check --kp and --np-turbulent"
    )]
    CurveRises {
        np_turbulent: f64,
        np_laminar_end: f64,
    },

    #[error(
        "Kp = {kp} is larger than the turbulent power number {np_turbulent} times the start of \
         the turbulent range (Re = {re_turbulent}); the power curve would fall faster than \
         the laminar line. Check --kp and --np-turbulent"
    )]
    CurveTooSteep {
        kp: f64,
        np_turbulent: f64,
        re_turbulent: f64,
    },
}

/// Check that `value` is finite and above zero.
pub(crate) fn positive(what: &'static str, value: f64) -> Result<f64, MixError> {
    if value.is_finite() && value > 0.0 {
        Ok(value)
    } else {
        Err(MixError::NotPositive { what, value })
    }
}

/// Check that `value` is in (0, 1].
pub(crate) fn fraction(what: &'static str, value: f64) -> Result<f64, MixError> {
    if value.is_finite() && value > 0.0 && value <= 1.0 {
        Ok(value)
    } else {
        Err(MixError::NotAFraction { what, value })
    }
}
