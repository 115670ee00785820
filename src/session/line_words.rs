//! Words for line answers: the cautions that go with them, the engine's notes, and the plant
//! readings' disagreement with the prediction and its likely causes.

use super::line::LineCase;
use crate::line::{Comparison, Correlation, CriticalRule, Disagreement, LineAnswer, Note};
use crate::units::{self, Dimension, UnitSystem};

/// Above this the product is hot enough to scald, K (60 °C; common practice, no source).
const HOT_PRODUCT_K: f64 = 333.15;

/// A caution that goes with an answer that could lead to action.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Caution {
    /// Always: isolate and lock out before opening the line.
    LockOut,
    /// Always: never exceed the rated pressure of the weakest part.
    WeakestPart,
    /// The predicted pressure (or its band's top) reaches the line's design pressure.
    AboveDesignPressure,
    BandReachesDesignPressure,
    /// The product will not move at this pressure.
    WillNotMove,
    HotProduct,
    /// Always: the tool advises; it does not certify.
    AdviceOnly,
}

impl Caution {
    pub fn words(self) -> &'static str {
        match self {
            Caution::LockOut => "Isolate and lock out the line before opening it.",
            Caution::WeakestPart => {
                "Never exceed the rated pressure of the weakest part of the line (pipe, \
                 gaskets, hoses, valves, instruments)."
            }
            Caution::AboveDesignPressure => {
                "The pressure is above the line's design pressure: do not run at this flow."
            }
            Caution::BandReachesDesignPressure => {
                "The top of the band reaches the line's design pressure: do not rely on the \
                 middle value."
            }
            Caution::WillNotMove => {
                "The product will not move at this pressure. Never raise a relief setting to \
                 force it; look at the restart answer instead."
            }
            Caution::HotProduct => "Hot product: it scalds; wear the protection the task needs.",
            Caution::AdviceOnly => {
                "Advice only, not a certificate: local codes and licensed practice come first."
            }
        }
    }
}

/// The cautions for a case and (when there is one) its answer.
pub fn cautions(
    case: &LineCase,
    answer: Option<&LineAnswer>,
    band_pa: Option<(f64, f64)>,
) -> Vec<Caution> {
    let mut out = vec![Caution::LockOut, Caution::WeakestPart];
    if let (Some(design), Some(a)) = (case.design_pressure_pa, answer) {
        if a.pressure_drop_pa >= design {
            out.push(Caution::AboveDesignPressure);
        } else if band_pa.is_some_and(|b| b.1 >= design) {
            out.push(Caution::BandReachesDesignPressure);
        }
    }
    if case.temperature_k.is_some_and(|t| t >= HOT_PRODUCT_K) {
        out.push(Caution::HotProduct);
    }
    out.push(Caution::AdviceOnly);
    out
}

/// A pressure with its band, e.g. "1.80 bar (1.60 to 2.10)".
pub fn pressure_with_band(p: f64, band: Option<(f64, f64)>, system: UnitSystem) -> String {
    let show = |v: f64| units::format(v, Dimension::Pressure, system);
    match band {
        Some((lo, hi)) => {
            let unit = show(p);
            let strip = |v: f64| {
                let s = show(v);
                s.rsplit_once(' ').map_or(s.clone(), |(n, _)| n.to_string())
            };
            format!("{unit} ({} to {})", strip(lo), strip(hi))
        }
        None => show(p),
    }
}

/// One engine note in words.
pub fn note(n: &Note) -> String {
    match *n {
        Note::SmoothPipeAssumed => {
            "Dodge–Metzner is a smooth-pipe correlation: the line's roughness is not used."
                .to_string()
        }
        Note::FlowIndexOutsideData { n_prime } => format!(
            "Dodge–Metzner used with n′ = {n_prime:.2}, outside its data (0.36 to 1): an \
             extrapolation."
        ),
        Note::ReynoldsBeyondData { reynolds, limit } => format!(
            "Dodge–Metzner used at Re = {reynolds:.0}, beyond its data (about {limit:.0}): an \
             extrapolation."
        ),
        Note::TransitionalBand { .. } => {
            "Transitional flow: the answer is the band between the laminar and turbulent \
             estimates; the higher one is shown."
                .to_string()
        }
        Note::TurbulentBelowLaminar => {
            "The turbulent correlation gave less friction than laminar flow; the laminar value \
             is used."
                .to_string()
        }
        Note::NoFlow {
            static_pressure_pa,
            yield_pressure_pa,
        } => format!(
            "No flow: the pressure does not overcome the static head ({:.0} Pa) plus the yield \
             stress's hold on the wall ({:.0} Pa).",
            static_pressure_pa, yield_pressure_pa
        ),
    }
}

/// The friction law used, in words.
pub fn correlation(c: Correlation) -> &'static str {
    match c {
        Correlation::Laminar => "exact laminar relation",
        Correlation::Colebrook => "Colebrook, with the line's roughness",
        Correlation::DodgeMetzner => "Dodge–Metzner, smooth pipe",
        Correlation::DarbyMunBoger => "Darby–Mun–Boger, all-regime blend",
    }
}

/// The critical Reynolds number's rule, in words.
pub fn critical_rule(rule: &CriticalRule) -> String {
    match *rule {
        CriticalRule::Newtonian => "the Newtonian value".into(),
        CriticalRule::RyanJohnson { n } => format!("Ryan–Johnson at n = {n:.2}"),
        CriticalRule::Hanks { hedstrom, .. } => format!("Hanks at He = {hedstrom:.3e}"),
        CriticalRule::YieldStressLocal {
            n_prime,
            tangent_hedstrom,
            ryan_johnson,
            hanks,
        } => format!(
            "the larger of Ryan–Johnson at the local n′ = {n_prime:.2} ({ryan_johnson:.0}) and              Hanks for the tangent Bingham plastic at He = {tangent_hedstrom:.3e} ({hanks:.0});              our choice for this model"
        ),
    }
}

/// The plant's disagreement with the prediction and what could cause it.
pub fn disagreement(c: &Comparison) -> String {
    let pct = (c.mean_ratio - 1.0) * 100.0;
    match c.direction {
        Disagreement::Agree => format!(
            "The plant readings agree with the curve (wall stress {pct:+.0} % on average, \
             within ±15 %)."
        ),
        Disagreement::PlantLower => {
            let slip = if c.ratio_at_lowest_flow < c.ratio_at_highest_flow {
                " The gap is widest at the lowest flow, which is how wall slip shows."
            } else {
                ""
            };
            format!(
                "The line needs less pressure than the curve predicts (wall stress {pct:+.0} % \
                 on average). Likely causes: wall slip (a slip layer at the wall), a pressure \
                 sensor reading low, a flow meter reading high, the product warmer or thinner \
                 than the curve.{slip}"
            )
        }
        Disagreement::PlantHigher => format!(
            "The line needs more pressure than the curve predicts (wall stress {pct:+.0} % on \
             average). Likely causes: a partly blocked line or deposits on the wall, the \
             product colder or thicker than the curve, entrained air, a pressure sensor fault \
             or a flow meter reading low."
        ),
        Disagreement::Mixed => format!(
            "The plant readings scatter about the curve (some above, some below; {pct:+.0} % \
             on average). Likely causes: a pressure sensor fault, entrained air, or readings \
             taken before the flow settled; take the pairs again at steady flow."
        ),
    }
}
