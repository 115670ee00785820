//! Checks on a set of readings and on the curve fitted to it, as data both faces show:
//! readings left out (pegged dial), reversed readings, a poor fit, implausible constants.
//!
//! Each check is an enum value with its numbers; [`Concern::code`] is the stable key for JSON
//! and journals, [`Concern::explain`] the plain sentence with what to check. The thresholds are
//! items here, each with its source.

use crate::rheology::ParamName;

/// R² below which a fit is called poor (common practice, no source).
pub const POOR_R_SQUARED: f64 = 0.9;
/// Viscosity of water at 20 °C, Pa·s: about 1.002 mPa·s (IAPWS 2008 formulation, from memory).
/// A plastic or Casson viscosity below it is implausible for the thick products this tool is for.
pub const WATER_VISCOSITY_PA_S: f64 = 1.0e-3;
/// Flow behaviour indices outside this range are implausible for plant products
/// (common practice, no source; published n for pastes, gels and slurries lie within it).
pub const PLAUSIBLE_N: (f64, f64) = (0.1, 2.0);
/// Longest run of residuals of one sign (in shear-rate order) accepted before the curve is
/// called systematically off (common practice, no source).
pub const LONGEST_RUN: usize = 5;
/// A slower reading counts as reversed only when it reads more than this fraction above the
/// faster one, so the scatter of a flat stretch is not called reversed (common practice, no
/// source).
pub const REVERSED_MARGIN: f64 = 0.02;
/// One-sided level of the runs test for too few runs (Wald & Wolfowitz 1940).
pub const RUNS_TEST_LEVEL: f64 = 0.05;

/// Whether readings at or above full scale take part in the fit.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum OffScale {
    /// Left out and listed (the default): a pegged dial only says "at least this much".
    #[default]
    LeaveOut,
    /// Kept in the fit, flagged (`--include-off-scale`).
    Include,
}

/// Why a reading took no part in the fit.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum LeftOutWhy {
    /// The dial was at or above full scale: the spring was pegged.
    Pegged,
}

/// A reading left out of the fit, with its row (from 1, in the order given).
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct LeftOut {
    pub row: usize,
    pub rpm: f64,
    pub dial: f64,
    pub full_scale_dial: f64,
    pub why: LeftOutWhy,
}

impl LeftOut {
    pub fn explain(&self) -> String {
        format!(
            "reading {} ({} rpm, dial {}) is at or above full scale ({}): the dial was pegged, \
             so it was left out of the fit; read it again at a lower speed or with a stiffer \
             spring, or keep it (--include-off-scale, or i on the Flow curve view)",
            self.row, self.rpm, self.dial, self.full_scale_dial
        )
    }
}

/// Something about a curve the operator must know before using its constants.
#[derive(Debug, Clone, PartialEq)]
pub enum Concern {
    /// The reading at the lower speed (or rate) reads higher than one at a higher speed.
    /// Rows from 1 in the order given; `x` are the speeds (rpm) or rates (1/s), `y` the dial
    /// values or stresses (Pa), slower first.
    Reversed {
        slower_row: usize,
        faster_row: usize,
        x: (f64, f64),
        y: (f64, f64),
        unit: XUnit,
    },
    /// R² below [`POOR_R_SQUARED`] but not below zero.
    PoorFit { r_squared: f64 },
    /// R² below zero: the curve fits worse than the mean stress.
    WorseThanFlat,
    /// Residuals (in shear-rate order) fall in too few runs of one sign.
    ResidualPattern {
        runs: usize,
        longest: usize,
        points: usize,
    },
    /// A fitted constant outside what a plant product can have.
    Implausible {
        param: ParamName,
        value: f64,
        why: Implausibility,
    },
}

/// What the x of a reversed pair is measured in.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum XUnit {
    Rpm,
    PerSecond,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Implausibility {
    /// Below the viscosity of water.
    BelowWater,
    /// A flow index outside [`PLAUSIBLE_N`].
    FlowIndexOutside,
}

impl Concern {
    /// Stable key for JSON and journals.
    pub fn code(&self) -> &'static str {
        match self {
            Concern::Reversed { .. } => "reversed-reading",
            Concern::PoorFit { .. } => "poor-fit",
            Concern::WorseThanFlat => "worse-than-flat-line",
            Concern::ResidualPattern { .. } => "residual-pattern",
            Concern::Implausible { .. } => "implausible-constant",
        }
    }

    /// The plain sentence, with what to check.
    pub fn explain(&self) -> String {
        match self {
            Concern::Reversed {
                slower_row,
                faster_row,
                x,
                y,
                unit,
            } => reversed_text(*slower_row, *faster_row, *x, *y, *unit),
            Concern::PoorFit { r_squared } => format!(
                "poor fit: R² {r_squared:.3} is below {POOR_R_SQUARED} (common practice): the \
                 curve does not follow these readings; read the set again or try another model \
                 before using its constants"
            ),
            Concern::WorseThanFlat => "poor fit: the curve is worse than a flat line (R² below \
                 0): it follows these readings less well than their mean stress; do not use \
                 its constants"
                .to_string(),
            Concern::ResidualPattern {
                runs,
                longest,
                points,
            } => format!(
                "the curve misses the readings systematically: in shear-rate order the {points} \
                 residuals fall in {runs} runs of one sign (longest {longest}); another model \
                 may fit, or the sample changed during the set"
            ),
            Concern::Implausible { param, value, why } => implausible_text(*param, *value, *why),
        }
    }
}

fn reversed_text(slow: usize, fast: usize, x: (f64, f64), y: (f64, f64), unit: XUnit) -> String {
    let (xs, what) = match unit {
        XUnit::Rpm => (
            format!("{} rpm reads {} against {} at {} rpm", x.0, y.0, y.1, x.1),
            "dial",
        ),
        XUnit::PerSecond => (
            format!(
                "{} 1/s reads {} Pa against {} Pa at {} 1/s",
                x.0, y.0, y.1, x.1
            ),
            "stress",
        ),
    };
    format!(
        "readings {slow} and {fast} are reversed ({xs}): a higher {what} at a lower speed; \
         check thixotropy and the time between readings, settling, wall slip, or a misread dial"
    )
}

fn implausible_text(param: ParamName, value: f64, why: Implausibility) -> String {
    match why {
        Implausibility::BelowWater => format!(
            "the fitted {} {value:.3e} Pa·s is below the viscosity of water (about 1 mPa·s): \
             implausible for a thick product; check the units, the geometry and the readings",
            param.label()
        ),
        Implausibility::FlowIndexOutside => format!(
            "the fitted flow behaviour index n = {value:.3} is outside {} to {}: implausible for \
             a plant product; check the readings for slip, settling or a stray value",
            PLAUSIBLE_N.0, PLAUSIBLE_N.1
        ),
    }
}

pub use super::assess::{assess_fit, reversed_pairs, runs_p_value};
