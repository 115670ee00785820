//! Why a line answer could not be given; each message says what is accepted.

/// Bad input to the line engine.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum LineError {
    #[error("the {what} must be a finite number above zero (got {value})")]
    NotPositive { what: &'static str, value: f64 },
    #[error("the {what} must be a finite number (got {value})")]
    NotFinite { what: &'static str, value: f64 },
    #[error(
        "the roughness must be zero or more and under 5 % of the inner diameter (got {value} m)"
    )]
    BadRoughness { value: f64 },
    #[error(
        "the flow curve's {what} must be a finite number above zero (got {value}); \
         a yield stress needs a viscosity or K and n beside it"
    )]
    BadModel { what: &'static str, value: f64 },
    #[error(
        "no flow in this line gives a pressure drop of {target_pa} Pa: it stays above it \
         even at {flow_m3_s} m3/s"
    )]
    NoRoot { target_pa: f64, flow_m3_s: f64 },
    #[error(
        "these inputs are beyond what can be computed in double precision (the {what} came out \
         as {value}); check the units of the flow, the bore, the length and the flow curve"
    )]
    OutOfRange { what: &'static str, value: f64 },
    #[error("a system curve needs two or more points, got {got}")]
    TooFewPoints { got: usize },
    #[error("back-calculation needs {need}, got {got}")]
    TooFewPairs { need: &'static str, got: usize },
    #[error(
        "pair {index}: the friction pressure drop ({friction_pa:.0} Pa after taking off the \
         static head) must be above zero and the flow above zero"
    )]
    BadPair { index: usize, friction_pa: f64 },
    #[error(
        "pairs {pairs} are not laminar (generalized Reynolds number {reynolds} above the \
         critical {critical}); the back-calculation holds only in laminar flow: use pairs at \
         lower flow, or a wider line"
    )]
    NotLaminar {
        pairs: String,
        reynolds: String,
        critical: String,
    },
    #[error("the pairs do not give a flow curve: {0}")]
    Fit(#[from] crate::rheology::FitError),
    #[error(
        "the wall stress does not rise with flow across these pairs (log-log slope n' = \
         {n_prime:.3}); check the pressure readings and that the flows differ"
    )]
    NoSlope { n_prime: f64 },
}
