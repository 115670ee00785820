//! Why a fit, a model choice or a temperature shift could not be done, in words an operator reads.

use super::kind::ModelKind;

/// Everything that can stop a fit. Each message says what is wrong and what is needed.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum FitError {
    #[error("no readings were given: a flow curve needs shear rate and shear stress pairs")]
    NoPoints,
    #[error(
        "reading {index}: {field} is not a number (NaN or infinite); enter a finite value in {unit}"
    )]
    NotFinite {
        index: usize,
        field: &'static str,
        unit: &'static str,
    },
    #[error(
        "reading {index}: shear rate must be greater than zero, got {value} 1/s; \
         a reading at rest or with a negative rate says nothing about the flow curve"
    )]
    NonPositiveRate { index: usize, value: f64 },
    #[error(
        "reading {index}: shear stress must be greater than zero, got {value} Pa; \
         check the dial zero and the units"
    )]
    NonPositiveStress { index: usize, value: f64 },
    #[error(
        "the {} model needs at least {need} readings because it has {need} parameters ({}); got {have}",
        .model.title(), param_list(*.model)
    )]
    TooFewPoints {
        model: ModelKind,
        have: usize,
        need: usize,
    },
    #[error(
        "the {} model needs readings at {need} or more different shear rates to separate its \
         {need} parameters ({}); got {have} distinct rate(s)",
        .model.title(), param_list(*.model)
    )]
    TooFewDistinctRates {
        model: ModelKind,
        have: usize,
        need: usize,
    },
    #[error(
        "the {} model needs at least {need} readings to be compared by AICc \
         (readings − parameters − 1 must be above zero); got {have}",
        .model.title()
    )]
    TooFewForComparison {
        model: ModelKind,
        have: usize,
        need: usize,
    },
    #[error(
        "the {} fit did not converge after {iterations} iterations; \
         check the readings for a stray value or try another model",
        .model.title()
    )]
    NotConverged { model: ModelKind, iterations: usize },
    #[error("the {} fit gives a result with no physical meaning: {detail}", .model.title())]
    NotPhysical { model: ModelKind, detail: String },
    #[error(
        "the {} fit's quality figures (R², RMSE) are not finite numbers, so the fit cannot be \
         judged; check the readings' units and look for a stray value",
        .model.title()
    )]
    QualityNotFinite { model: ModelKind },
    #[error(
        "reading {index}: {field} {value:e} {unit} is beyond what a plant measures (at most \
         {limit:e} {unit}); check the units and the reading"
    )]
    BeyondPlantRange {
        index: usize,
        field: &'static str,
        value: f64,
        limit: f64,
        unit: &'static str,
    },
    #[error("no model could be compared: {detail}")]
    NoComparableModel { detail: String },
    #[error(
        "unknown model '{given}'; accepted: newtonian, power-law, bingham, herschel-bulkley, casson"
    )]
    UnknownModel { given: String },
    #[error(
        "an activation energy needs the same product read at 2 or more different temperatures; \
         got {have}"
    )]
    TooFewTemperatures { have: usize },
    #[error(
        "the reference temperature must be a finite absolute temperature above 0 K, got {value} K"
    )]
    BadReferenceTemperature { value: f64 },
    #[error(
        "sample {index}: temperature must be a finite absolute temperature above 0 K, got {value} K"
    )]
    BadTemperature { index: usize, value: f64 },
    #[error(
        "sample {index}: the consistency index or viscosity must be finite and above zero, got {value}"
    )]
    BadTemperatureValue { index: usize, value: f64 },
}

/// Why an estimate carries no confidence interval.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize, serde::Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum NoCi {
    /// The parameter sits on its bound (τ0 = 0) and was held there, not estimated.
    AtBound,
    /// As many parameters as readings: the curve passes through every point and the scatter is unknown.
    NoDegreesOfFreedom,
    /// The readings cannot separate this parameter from the others (JᵀJ is singular).
    Singular,
}

impl NoCi {
    /// The reason in a few words, for a table cell or a tooltip.
    pub fn explain(self) -> &'static str {
        match self {
            NoCi::AtBound => "held at its bound of zero, not estimated",
            NoCi::NoDegreesOfFreedom => {
                "as many parameters as readings: no scatter left to size the interval"
            }
            NoCi::Singular => "the readings cannot separate this parameter from the others",
        }
    }
}

impl std::fmt::Display for NoCi {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.explain())
    }
}

fn param_list(model: ModelKind) -> String {
    let names: Vec<&str> = model.param_names().iter().map(|p| p.label()).collect();
    names.join(", ")
}
