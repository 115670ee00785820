//! Why a restart question cannot be answered: each message says what is wrong and what is
//! accepted.

/// Bad restart input.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum RestartError {
    #[error("{what} {value}: must be a finite number above zero")]
    NotPositive { what: &'static str, value: f64 },
    #[error("{what} {value}: must be a finite number, zero or above")]
    Negative { what: &'static str, value: f64 },
    #[error(
        "gel reading {index}: rest time {value} s is negative; give the time the product stood \
         still before the reading (0 or more)"
    )]
    NegativeRestTime { index: usize, value: f64 },
    #[error("gel reading {index}: stress {value} Pa must be a finite number, zero or above")]
    BadGelStress { index: usize, value: f64 },
    #[error(
        "the long-rest gel stress ({final_pa} Pa) is below the initial one ({initial_pa} Pa); \
         gel builds up at rest, so give a final value at least the initial"
    )]
    FinalBelowInitial { initial_pa: f64, final_pa: f64 },
    #[error(
        "{have} gel reading(s) at different rest times; give at least 2 (3 or more to fit the \
         time constant), e.g. after 10 s, 10 min and 30 min at rest"
    )]
    TooFewReadings { have: usize },
    #[error(
        "the gel readings fall with rest time; a build-up at rest needs readings that stay \
         level or rise (check the order and the units of the readings)"
    )]
    GelFalls,
    #[error(
        "the gel readings do not follow a first-order build-up (the fit did not settle); check \
         the readings, or give the build-up constants directly"
    )]
    FitFailed,
    #[error(
        "the pump's limit is not known; give the pressure it can give (a relief setting, its \
         shut-off pressure or the motor's limit), gauge, above zero"
    )]
    NoLimit,
    #[error("margin {value}: give a fraction from 0 to under 1 (e.g. 0.1 or '10 %')")]
    BadMargin { value: f64 },
}

/// Require a finite value above zero.
pub(crate) fn positive(what: &'static str, value: f64) -> Result<f64, RestartError> {
    if value.is_finite() && value > 0.0 {
        Ok(value)
    } else {
        Err(RestartError::NotPositive { what, value })
    }
}

/// Require a finite value at or above zero.
pub(crate) fn non_negative(what: &'static str, value: f64) -> Result<f64, RestartError> {
    if value.is_finite() && value >= 0.0 {
        Ok(value)
    } else {
        Err(RestartError::Negative { what, value })
    }
}
