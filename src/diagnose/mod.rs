//! From numbers to "what to check next": rules that read a session's facts (readings, fits,
//! line, restart, pump and tank answers, the site's limits) and give ranked findings.
//!
//! Pure: [`Facts`] in, [`Finding`]s out. `session::findings` fills the facts from a replayed
//! journal and the site; the faces show the findings through `present::findings`. Each rule
//! is one small function in `rules/`, with its thresholds as items beside it and its source
//! (or "common practice, no source") in the doc comment.

mod facts;
mod finding;
mod rank;
mod rules;

pub use facts::*;
pub use finding::{Caution, Finding, Measured, Number, Severity, Sure};
pub use rank::{order, rank};

/// Every rule, in the order used to break ties in the ranking.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Rule {
    LineWillNotRestart,
    StopTooLong,
    DischargeOverLimit,
    MotorOverRating,
    TorqueOverLimit,
    CurrentOverFullLoad,
    OutOfSpec,
    ThinRestartMargin,
    PlantDisagrees,
    ShearThickeningOnDisplacement,
    FarFromBestEfficiency,
    NearTransition,
    StagnantProduct,
    FarFromTrend,
    OffScale,
    Pegged,
    SpeedOrder,
    PoorFit,
    ResidualPattern,
    YieldMayBeZero,
    FarFromReferenceTemperature,
    LowOnScale,
}

impl Rule {
    pub const ALL: [Rule; 22] = [
        Rule::LineWillNotRestart,
        Rule::StopTooLong,
        Rule::DischargeOverLimit,
        Rule::MotorOverRating,
        Rule::TorqueOverLimit,
        Rule::CurrentOverFullLoad,
        Rule::OutOfSpec,
        Rule::ThinRestartMargin,
        Rule::PlantDisagrees,
        Rule::ShearThickeningOnDisplacement,
        Rule::FarFromBestEfficiency,
        Rule::NearTransition,
        Rule::StagnantProduct,
        Rule::FarFromTrend,
        Rule::OffScale,
        Rule::Pegged,
        Rule::SpeedOrder,
        Rule::PoorFit,
        Rule::ResidualPattern,
        Rule::YieldMayBeZero,
        Rule::FarFromReferenceTemperature,
        Rule::LowOnScale,
    ];

    /// The stable id for JSON, CSV and journals.
    pub fn id(self) -> &'static str {
        match self {
            Rule::LineWillNotRestart => "line-will-not-restart",
            Rule::StopTooLong => "stop-too-long",
            Rule::DischargeOverLimit => "discharge-over-limit",
            Rule::MotorOverRating => "motor-over-rating",
            Rule::TorqueOverLimit => "torque-over-limit",
            Rule::CurrentOverFullLoad => "current-over-full-load",
            Rule::OutOfSpec => "out-of-spec",
            Rule::ThinRestartMargin => "thin-restart-margin",
            Rule::PlantDisagrees => "plant-disagrees",
            Rule::ShearThickeningOnDisplacement => "shear-thickening-on-displacement-pump",
            Rule::FarFromBestEfficiency => "far-from-best-efficiency",
            Rule::NearTransition => "near-transition",
            Rule::StagnantProduct => "stagnant-product",
            Rule::FarFromTrend => "far-from-trend",
            Rule::OffScale => "off-scale",
            Rule::Pegged => "pegged",
            Rule::SpeedOrder => "out-of-speed-order",
            Rule::PoorFit => "poor-fit",
            Rule::ResidualPattern => "residual-pattern",
            Rule::YieldMayBeZero => "yield-stress-may-be-zero",
            Rule::FarFromReferenceTemperature => "far-from-reference-temperature",
            Rule::LowOnScale => "low-on-scale",
        }
    }
}

/// Every finding the facts support, ranked (see [`rank`]).
pub fn diagnose(facts: &Facts) -> Vec<Finding> {
    let mut out = Vec::new();
    for s in &facts.sets {
        out.extend(rules::readings::check(s));
        out.extend(rules::fit::check(s));
        out.extend(rules::product::check(s));
    }
    out.extend(facts.plant.iter().filter_map(rules::plant::check));
    for r in &facts.restarts {
        out.extend(rules::restart::check(r));
    }
    out.extend(facts.regimes.iter().filter_map(rules::regime::check));
    for p in &facts.pumps {
        out.extend(rules::pump::check(p));
    }
    for t in &facts.tanks {
        out.extend(rules::tank::check(t));
    }
    rank(&mut out);
    out
}
