//! The restart question for the faces: a line, what the pump can give and the gel build-up
//! in; the answer now and at the line's coldest, with its band, what was assumed, what to do
//! next and the cautions out (as data: [`super::restart_words`] says it in words).

use crate::line::restart::{
    GelCurve, GelFit, GelFitKind, IntervalBasis, MaxStop, PlugLine, RestartCheck, RestartError,
    StopBand, allowed_gel_stress, check_restart, gel_band, longest_safe_stop,
    longest_safe_stop_band,
};

pub use super::restart_site::{GelSource, RestartSetupError, from_site, lookup, pump_limit};

/// Where the pump's limit came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum LimitSource {
    /// Typed by the operator.
    Given,
    /// A positive-displacement pump's relief setting.
    Relief,
    /// The pump's maximum discharge (casing) pressure.
    CasingLimit,
    /// What the motor's rated torque allows through the displacement (no mechanical losses).
    MotorTorque,
    /// A centrifugal pump's shut-off head at its speed (the ANSI/HI head factor is 1 there).
    ShutOffHead,
}

/// The line at its coldest expected temperature.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct ColdCase {
    pub temperature_k: f64,
    /// Gel stress multiplier from the site; `None` leaves the gel unchanged (with a caution).
    pub gel_factor: Option<f64>,
    /// K (or μ) at the coldest over K at the reference temperature, by Arrhenius.
    pub consistency_factor: Option<f64>,
}

/// Everything the answer is built from.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct RestartInput {
    pub line: PlugLine,
    /// Whether the length includes the fittings' equivalent length.
    pub fittings_included: bool,
    pub available_pa: f64,
    pub limit_source: LimitSource,
    pub design_pa: Option<f64>,
    pub stopped_for_s: Option<f64>,
    pub margin: f64,
    pub margin_is_default: bool,
    pub gel: GelFit,
    /// True when the gel is one stress taken for any stop.
    pub single_gel_stress: bool,
    pub cold: Option<ColdCase>,
}

/// One temperature's answer.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct RestartCase {
    /// The rest judged: the stop given, or a long rest when none was.
    pub rest_s: f64,
    pub gel_stress_pa: f64,
    pub gel_band_pa: Option<(f64, f64)>,
    pub check: RestartCheck,
    pub pressure_band_pa: Option<(f64, f64)>,
    pub allowed_gel_pa: f64,
    pub max_stop: MaxStop,
    pub max_stop_band: Option<StopBand>,
}

/// What the answer rests on.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(tag = "kind", rename_all = "kebab-case")]
pub enum Assumption {
    PlugForceBalance,
    FittingsIncluded,
    LongRestNoStopGiven,
    SingleGelStress,
    GelLinearInStructure,
    TimeConstantAssumed { time_constant_s: f64 },
    TimeConstantFromSite { time_constant_s: f64 },
    ReadingErrorAssumed { relative_sd: f64 },
    StillBuilding { longest_rest_s: f64 },
    BeyondLongestReading { longest_rest_s: f64 },
    GelGivenNoInterval,
    Margin { fraction: f64, default: bool },
    ColdGelFactor { factor: f64 },
    ColdConsistency { factor: f64 },
    MotorNoLosses,
    ShutOffUncorrected,
    LinearPropagation,
}

/// A caution where the answer could lead to action.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Caution {
    NeverRaiseRelief,
    WeakestPart,
    IsolateBeforeOpening,
    BlockedInHeated,
    HotProduct,
    ColdRaisesGel,
    AdvisesOnly,
}

/// What to do next.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum NextStep {
    WarmTheLine,
    FlushBeforeLongStops,
    RestartInSections,
    LowerStaticHead,
    KeepStopsShort,
    TakeMoreReadings,
}

/// The whole answer.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct RestartAnswer {
    pub input: RestartInput,
    pub now: RestartCase,
    pub cold: Option<RestartCase>,
    pub assumptions: Vec<Assumption>,
    pub cautions: Vec<Caution>,
    pub next_steps: Vec<NextStep>,
}

/// A long rest, in time constants: e^(−20) of the build-up is left.
const LONG_REST_TIME_CONSTANTS: f64 = 20.0;

/// Answer the restart question.
pub fn analyse(input: RestartInput) -> Result<RestartAnswer, RestartError> {
    let now = case(&input, &input.gel)?;
    let cold = match input.cold {
        Some(c) => Some(case(
            &input,
            &input.gel.scaled(c.gel_factor.unwrap_or(1.0)),
        )?),
        None => None,
    };
    let assumptions = super::restart_notes::assumptions(&input);
    let cautions = super::restart_notes::cautions(&input);
    let next_steps = super::restart_notes::next_steps(&input, &now, cold.as_ref());
    Ok(RestartAnswer {
        input,
        now,
        cold,
        assumptions,
        cautions,
        next_steps,
    })
}

fn case(input: &RestartInput, gel: &GelFit) -> Result<RestartCase, RestartError> {
    let rest_s = input
        .stopped_for_s
        .unwrap_or(LONG_REST_TIME_CONSTANTS * gel.curve.time_constant_s);
    let gel_stress_pa = gel.curve.stress_at(rest_s);
    let check = check_restart(
        &input.line,
        gel_stress_pa,
        input.available_pa,
        input.design_pa,
    )?;
    let allowed_gel_pa = allowed_gel_stress(&input.line, check.usable_pa(), input.margin)?;
    let gel_band_pa = gel_band(gel, rest_s);
    let wall = input.line.wall_factor();
    let fixed = input.line.static_pa + input.line.back_pressure_pa;
    Ok(RestartCase {
        rest_s,
        gel_stress_pa,
        gel_band_pa,
        check,
        pressure_band_pa: gel_band_pa.map(|(lo, hi)| (lo * wall + fixed, hi * wall + fixed)),
        allowed_gel_pa,
        max_stop: longest_safe_stop(&gel.curve, allowed_gel_pa),
        max_stop_band: longest_safe_stop_band(gel, allowed_gel_pa),
    })
}

/// One point of gel strength against rest time, for a chart.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct GelPoint {
    pub rest_s: f64,
    pub stress_pa: f64,
    pub band_pa: Option<(f64, f64)>,
}

/// Gel strength from 0 to `until_s` in `n` even steps (n ≥ 2), with its band.
pub fn gel_points(gel: &GelFit, until_s: f64, n: usize) -> Vec<GelPoint> {
    let n = n.max(2);
    (0..n)
        .map(|i| {
            let rest_s = until_s * i as f64 / (n - 1) as f64;
            GelPoint {
                rest_s,
                stress_pa: gel.curve.stress_at(rest_s),
                band_pa: gel_band(gel, rest_s),
            }
        })
        .collect()
}

/// The gel stress at which the pump's limit (less the margin) is reached: the line on a
/// gel-strength chart.
pub fn limit_gel_stress(answer: &RestartAnswer) -> f64 {
    answer.now.allowed_gel_pa
}

/// A build-up from flags: one stress for any stop, or the three constants.
pub fn gel_from_constants(
    initial_pa: f64,
    final_pa: f64,
    time_constant_s: f64,
) -> Result<GelFit, RestartError> {
    Ok(GelFit::given(GelCurve::new(
        initial_pa,
        final_pa,
        time_constant_s,
    )?))
}

/// Whether the fit left no interval because of too few readings.
pub fn fit_without_interval(gel: &GelFit) -> bool {
    matches!(gel.basis, IntervalBasis::None)
        && matches!(
            gel.kind,
            GelFitKind::TwoReadingsTimeConstantAssumed | GelFitKind::TwoReadingsTimeConstantGiven
        )
}
