//! Viscometer readings (or rate/stress points) to a fitted flow curve with its evidence.

use crate::instrument::{self, Converted, DialReading, Geometry, InstrumentError};
use crate::rheology::{self, Choice, Fit, FitError, FitOptions, ModelKind, Point, Weighting};

/// Which model the operator wants: the best by the choice rule, or one by hand.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum ModelPick {
    #[default]
    Auto,
    Fixed(ModelKind),
}

impl ModelPick {
    /// As typed and journalled: `auto`, or the model's machine name.
    pub fn name(self) -> &'static str {
        match self {
            ModelPick::Auto => "auto",
            ModelPick::Fixed(kind) => kind.name(),
        }
    }
}

impl std::str::FromStr for ModelPick {
    type Err = String;
    fn from_str(s: &str) -> Result<Self, Self::Err> {
        if s.eq_ignore_ascii_case("auto") {
            return Ok(ModelPick::Auto);
        }
        s.parse::<ModelKind>()
            .map(ModelPick::Fixed)
            .map_err(|e| format!("{e} (or 'auto' to let the tool choose)"))
    }
}

/// How to turn readings into a curve.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct FlowCurveOptions {
    pub model: ModelPick,
    /// Use the n-corrected bob shear rate (true) or the Newtonian one (false).
    pub rate_correction: bool,
    pub weighting: Weighting,
}

impl Default for FlowCurveOptions {
    fn default() -> Self {
        FlowCurveOptions {
            model: ModelPick::Auto,
            rate_correction: true,
            weighting: Weighting::Unweighted,
        }
    }
}

/// Readings as taken: dial and speed on a known geometry, or shear rate and stress in SI.
#[derive(Debug, Clone, Copy)]
pub enum FlowCurveInput<'a> {
    Dial {
        geometry: &'a Geometry,
        readings: &'a [DialReading],
    },
    Direct {
        points: &'a [Point],
    },
}

/// One measured point as it went into the fit, with its flags.
#[derive(Debug, Clone, PartialEq)]
pub struct PointOut {
    pub rpm: Option<f64>,
    pub dial: Option<f64>,
    pub newtonian_shear_rate_per_s: f64,
    pub shear_rate_per_s: f64,
    pub shear_stress_pa: f64,
    pub flags: Vec<String>,
}

/// Why the model shown is the one shown: the facts; `present::reason` words them.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Why {
    /// The choice rule took it (the steps are in [`FlowCurve::choice`]).
    Rule,
    /// Picked by hand; what the rule would have taken, when it could compare.
    ByHand { rule_would: Option<ModelKind> },
}

/// The fitted curve with everything needed to judge it.
#[derive(Debug, Clone)]
pub struct FlowCurve {
    /// The model shown: chosen by the rule, or picked by hand.
    pub fit: Fit,
    /// Every candidate and the rule's steps; `None` when too few points for a comparison.
    pub choice: Option<Choice>,
    /// Why this model is shown.
    pub why: Why,
    pub points: Vec<PointOut>,
    pub warnings: Vec<String>,
}

impl FlowCurve {
    /// Apparent viscosity τ/γ̇ of the shown model at a shear rate, Pa·s.
    pub fn apparent_viscosity_at(&self, rate_per_s: f64) -> f64 {
        self.fit.model.apparent_viscosity(rate_per_s)
    }
}

#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum FlowCurveError {
    #[error("{0}")]
    Reading(#[from] InstrumentError),
    #[error("{0}")]
    Fit(#[from] FitError),
}

thread_local! {
    static CURVES_FITTED: std::cell::Cell<u64> = const { std::cell::Cell::new(0) };
}

/// How many times [`analyse`] has run on this thread: lets a test show that saving a set
/// fits it once.
pub fn curves_fitted_on_this_thread() -> u64 {
    CURVES_FITTED.with(|c| c.get())
}

/// Convert, fit and explain. The one function both faces call for a flow curve.
pub fn analyse(
    input: FlowCurveInput<'_>,
    opts: &FlowCurveOptions,
) -> Result<FlowCurve, FlowCurveError> {
    CURVES_FITTED.with(|c| c.set(c.get() + 1));
    let mut converted = convert(input)?;
    let points = fit_points(input, converted.as_deref(), opts.rate_correction);
    let fit_opts = FitOptions {
        weighting: opts.weighting,
    };
    let (fit, choice, why) = pick_model(&points, opts.model, &fit_opts)?;
    let mut warnings = Vec::new();
    if let (FlowCurveInput::Dial { geometry, .. }, Some(rows)) = (input, converted.as_mut()) {
        instrument::flag_unsheared_gap(geometry, rows, fit.model.yield_stress());
        if !opts.rate_correction {
            warnings.push(
                "shear rates are the Newtonian (Margules) values: no correction for shear thinning"
                    .to_string(),
            );
        }
    }
    if let Some(rows) = converted.as_deref() {
        warnings.extend(flag_warnings(rows));
    }
    let points = describe_points(input, converted.as_deref(), &points);
    Ok(FlowCurve {
        fit,
        choice,
        why,
        points,
        warnings,
    })
}

fn convert(input: FlowCurveInput<'_>) -> Result<Option<Vec<Converted>>, FlowCurveError> {
    match input {
        FlowCurveInput::Dial { geometry, readings } => {
            Ok(Some(instrument::convert(geometry, readings)?))
        }
        FlowCurveInput::Direct { .. } => Ok(None),
    }
}

fn fit_points(
    input: FlowCurveInput<'_>,
    converted: Option<&[Converted]>,
    rate_correction: bool,
) -> Vec<Point> {
    match (input, converted) {
        (_, Some(rows)) => rows
            .iter()
            .map(|c| Point {
                shear_rate: if rate_correction {
                    c.shear_rate_per_s
                } else {
                    c.newtonian_shear_rate_per_s
                },
                shear_stress: c.shear_stress_pa,
            })
            .collect(),
        (FlowCurveInput::Direct { points }, None) => points.to_vec(),
        (FlowCurveInput::Dial { .. }, None) => Vec::new(),
    }
}

/// Fit the candidates and take the one the operator asked for.
fn pick_model(
    points: &[Point],
    pick: ModelPick,
    opts: &FitOptions,
) -> Result<(Fit, Option<Choice>, Why), FitError> {
    match pick {
        ModelPick::Auto => {
            let choice = rheology::choose(points, opts)?;
            Ok((choice.best.clone(), Some(choice), Why::Rule))
        }
        ModelPick::Fixed(kind) => {
            let fit = rheology::fit(kind, points, opts)?;
            let choice = rheology::choose(points, opts).ok();
            let rule_would = choice.as_ref().map(|c| c.best.model.kind());
            Ok((fit, choice, Why::ByHand { rule_would }))
        }
    }
}

fn describe_points(
    input: FlowCurveInput<'_>,
    converted: Option<&[Converted]>,
    fitted: &[Point],
) -> Vec<PointOut> {
    match (input, converted) {
        (_, Some(rows)) => rows
            .iter()
            .zip(fitted)
            .map(|(c, p)| PointOut {
                rpm: Some(c.rpm),
                dial: Some(c.dial),
                newtonian_shear_rate_per_s: c.newtonian_shear_rate_per_s,
                shear_rate_per_s: p.shear_rate,
                shear_stress_pa: c.shear_stress_pa,
                flags: c.flags.iter().map(|f| f.code().to_string()).collect(),
            })
            .collect(),
        (FlowCurveInput::Direct { points }, None) => points
            .iter()
            .map(|p| PointOut {
                rpm: None,
                dial: None,
                newtonian_shear_rate_per_s: p.shear_rate,
                shear_rate_per_s: p.shear_rate,
                shear_stress_pa: p.shear_stress,
                flags: Vec::new(),
            })
            .collect(),
        (FlowCurveInput::Dial { .. }, None) => Vec::new(),
    }
}

/// One warning per flag kind present, naming the readings (1-based rows) it applies to.
fn flag_warnings(rows: &[Converted]) -> Vec<String> {
    let mut kinds: Vec<instrument::ReadingFlag> =
        rows.iter().flat_map(|c| c.flags.iter().copied()).collect();
    kinds.sort_by_key(|f| f.code());
    kinds.dedup();
    kinds
        .into_iter()
        .map(|flag| {
            let which: Vec<String> = rows
                .iter()
                .enumerate()
                .filter(|(_, c)| c.flags.contains(&flag))
                .map(|(i, _)| (i + 1).to_string())
                .collect();
            let noun = if which.len() == 1 {
                "reading"
            } else {
                "readings"
            };
            format!("{noun} {}: {}", which.join(", "), flag.explain())
        })
        .collect()
}
