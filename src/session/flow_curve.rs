//! Viscometer readings (or rate/stress points) to a fitted flow curve with its evidence.

use super::api_rp13d::{ApiRp13d, field_relations};
use super::checks::{Concern, LeftOut, OffScale};
use super::off_scale::select;
use super::points::{describe_points, flag_warnings};
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
    /// Whether pegged readings (dial at or above full scale) take part.
    pub off_scale: OffScale,
}

impl Default for FlowCurveOptions {
    fn default() -> Self {
        FlowCurveOptions {
            model: ModelPick::Auto,
            rate_correction: true,
            weighting: Weighting::Unweighted,
            off_scale: OffScale::LeaveOut,
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
    /// The reading's row as given (from 1); rows left out of the fit are skipped.
    pub row: usize,
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
    /// Readings that took no part in the fit (pegged dial), with their rows.
    pub left_out: Vec<LeftOut>,
    /// Reversed readings, a poor fit, implausible constants: as data, also in `warnings`.
    pub concerns: Vec<Concern>,
    /// The API RP 13D field relations, for the standard six-speed geometry with θ600 and θ300.
    pub api_rp13d: Option<ApiRp13d>,
}

impl FlowCurve {
    /// R² below 0.9 or worse than a flat line: the choice and constants are not to be relied on.
    pub fn fit_is_poor(&self) -> bool {
        self.concerns
            .iter()
            .any(|c| matches!(c, Concern::PoorFit { .. } | Concern::WorseThanFlat))
    }

    /// Apparent viscosity τ/γ̇ of the shown model at a shear rate, Pa·s.
    pub fn apparent_viscosity_at(&self, rate_per_s: f64) -> f64 {
        self.fit.model.apparent_viscosity(rate_per_s)
    }
}

#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum FlowCurveError {
    // Transparent: the message is the inner one, said once (not again as its source).
    #[error(transparent)]
    Reading(#[from] InstrumentError),
    #[error(transparent)]
    Fit(#[from] FitError),
    #[error(
        "every reading ({count}) is at or above full scale, so none is left to fit; read \
         again at lower speeds or with a stiffer spring, or give --include-off-scale"
    )]
    AllOffScale { count: usize },
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
    let selection = select(input, opts.off_scale);
    let input = match input {
        FlowCurveInput::Dial { .. } if selection.kept.is_empty() => {
            let count = selection.left_out.len();
            return match count {
                0 => Err(InstrumentError::NoReadings.into()),
                _ => Err(FlowCurveError::AllOffScale { count }),
            };
        }
        FlowCurveInput::Dial { geometry, .. } => FlowCurveInput::Dial {
            geometry,
            readings: &selection.kept,
        },
        direct => direct,
    };
    let mut curve = fit_selected(input, opts, &selection.rows)?;
    super::curve_checks::apply(&mut curve, &selection.rows, input);
    curve
        .warnings
        .splice(0..0, selection.left_out.iter().map(|l| l.explain()));
    if let FlowCurveInput::Dial { geometry, readings } = input {
        curve.api_rp13d = field_relations(geometry, readings);
    }
    curve.left_out = selection.left_out;
    Ok(curve)
}

/// The fit of the readings kept, with the instrument's flags and warnings.
fn fit_selected(
    input: FlowCurveInput<'_>,
    opts: &FlowCurveOptions,
    row_numbers: &[usize],
) -> Result<FlowCurve, FlowCurveError> {
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
        warnings.extend(flag_warnings(rows, row_numbers));
    }
    let points = describe_points(input, converted.as_deref(), &points);
    Ok(FlowCurve {
        fit,
        choice,
        why,
        points,
        warnings,
        left_out: Vec::new(),
        concerns: Vec::new(),
        api_rp13d: None,
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
