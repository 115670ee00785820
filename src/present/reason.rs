//! Why a model is shown, as a sentence an operator can read, worded from the facts the
//! choice rule returns (ranking, step-downs, candidates not compared), in the site's units.

use super::Style;
use super::param::{param_number, param_text, param_unit};
use crate::rheology::{Candidate, Choice, Estimate, Fit, FitError, ModelKind, ParamName, StepDown};
use crate::session::{FlowCurve, Why};

/// The reason for the curve shown: the rule's, or that it was picked by hand.
pub fn for_curve(curve: &FlowCurve, style: Style) -> String {
    let text = match (&curve.why, &curve.choice) {
        (Why::ByHand { rule_would }, _) => by_hand(curve.fit.model.kind(), *rule_would),
        (Why::Rule, Some(choice)) => explain(choice, style),
        (Why::Rule, None) => format!("{} fitted", curve.fit.model.kind().title()),
    };
    style.text(&with_fit_caveat(text, curve))
}

/// A poor fit undermines both the choice and the constants: say so after the reason.
fn with_fit_caveat(mut text: String, curve: &FlowCurve) -> String {
    if !curve.fit_is_poor() {
        return text;
    }
    if !text.ends_with('.') {
        text.push('.');
    }
    text.push_str(
        " The fit is poor (R² below 0.9), so neither the choice nor the constants can be relied on.",
    );
    text
}

fn by_hand(kind: ModelKind, rule_would: Option<ModelKind>) -> String {
    match rule_would {
        Some(other) if other != kind => format!(
            "{} chosen by hand; the choice rule would take {}",
            kind.title(),
            other.title()
        ),
        _ => format!("{} chosen by hand", kind.title()),
    }
}

/// "Herschel–Bulkley: lowest AICc (-12.3 vs -8.1 for Bingham); yield stress 4.20 Pa, …"
pub fn explain(choice: &Choice, style: Style) -> String {
    let chosen = &choice.best;
    let ranked = choice.ranked();
    let kind = chosen.model.kind();
    let mut out = format!("{}: ", capitalised(kind.title()));
    let lowest = ranked.first().copied().unwrap_or(chosen);
    out.push_str(&ranking(lowest, &ranked, !choice.steps.is_empty()));
    if choice.steps.is_empty() {
        let evidence = evidence(chosen, style);
        if !evidence.is_empty() {
            out.push_str("; ");
            out.push_str(&evidence);
        }
    } else {
        let whys: Vec<String> = choice.steps.iter().map(|s| why_simpler(s, style)).collect();
        out.push_str(", but ");
        out.push_str(&whys.join(", and "));
        out.push_str(&format!(", so the simpler {} model is used", kind.title()));
    }
    out.push('.');
    out.push_str(&not_compared(&choice.candidates));
    out
}

/// "lowest AICc (-12.3 vs -8.1 for Bingham)"; after a step-down, "power law had the lowest …".
fn ranking(lowest: &Fit, ranked: &[&Fit], stepped: bool) -> String {
    let a = lowest.aicc.map_or_else(String::new, fmt_aicc);
    let Some(next) = ranked.get(1) else {
        return format!("the only model that could be compared (AICc {a})");
    };
    let b = next.aicc.map_or_else(String::new, fmt_aicc);
    let versus = format!("({a} vs {b} for {})", next.model.kind().title());
    if stepped {
        format!(
            "{} had the lowest AICc {versus}",
            lowest.model.kind().title()
        )
    } else {
        format!("lowest AICc {versus}")
    }
}

/// Why the chosen family's extra parameters are needed.
fn evidence(f: &Fit, style: Style) -> String {
    let mut parts = Vec::new();
    if let Some(t) = f.estimate(ParamName::Tau0) {
        parts.push(describe(
            t,
            "yield stress",
            0.0,
            "clearly above zero",
            style,
        ));
    }
    if let Some(n) = f.estimate(ParamName::N) {
        let side = if n.value < 1.0 {
            "clearly below 1"
        } else {
            "clearly above 1"
        };
        parts.push(describe(n, "n", 1.0, side, style));
    }
    if let (ModelKind::Newtonian, Some(mu)) = (f.model.kind(), f.estimate(ParamName::Mu)) {
        parts.push(describe(mu, "viscosity", f64::NAN, "", style));
    }
    parts.join("; ")
}

/// "yield stress 4.20 Pa, 95 % interval 3.10 to 5.30 Pa, clearly above zero".
fn describe(e: &Estimate, what: &str, null_value: f64, verdict: &str, style: Style) -> String {
    let mut s = format!("{what} {}", param_text(e.name, e.value, style));
    if let Some(ci) = e.ci95 {
        s.push_str(&format!(", 95 % interval {}", fmt_ci(e.name, ci, style)));
        if !verdict.is_empty() && !e.ci_includes(null_value) {
            s.push_str(", ");
            s.push_str(verdict);
        }
    }
    s
}

/// "the Herschel–Bulkley yield stress (95 % interval -0.31 to 0.80 Pa) includes zero".
fn why_simpler(step: &StepDown, style: Style) -> String {
    let e = &step.estimate;
    let from = step.from.title();
    let what = if e.name == ParamName::Tau0 {
        "yield stress"
    } else {
        "n"
    };
    let null = if step.null_value == 0.0 { "zero" } else { "1" };
    match (e.at_bound, e.ci95, e.no_ci) {
        (true, _, _) => format!(
            "the {from} {what} went to its bound of {}",
            param_text(e.name, 0.0, style)
        ),
        (_, Some(ci), _) => format!(
            "the {from} {what} (95 % interval {}) includes {null}",
            fmt_ci(e.name, ci, style)
        ),
        (_, None, why) => format!(
            "the {from} {what} has no confidence interval ({})",
            why.map_or("not computed", |w| w.explain())
        ),
    }
}

fn not_compared(candidates: &[Candidate]) -> String {
    let skipped: Vec<String> = candidates
        .iter()
        .filter_map(|c| c.outcome.as_ref().err().map(|e| (c.kind, e)))
        .map(|(kind, e)| format!("{} ({})", kind.title(), short_reason(e)))
        .collect();
    if skipped.is_empty() {
        String::new()
    } else {
        format!(" Not compared: {}.", skipped.join("; "))
    }
}

fn short_reason(e: &FitError) -> String {
    match e {
        FitError::TooFewForComparison { have, need, .. } => {
            format!("needs at least {need} readings for AICc, got {have}")
        }
        FitError::TooFewPoints { have, need, .. } => format!("needs {need} readings, got {have}"),
        FitError::TooFewDistinctRates { have, need, .. } => {
            format!("needs {need} different shear rates, got {have}")
        }
        FitError::NotConverged { iterations, .. } => {
            format!("did not converge in {iterations} iterations")
        }
        other => other.to_string(),
    }
}

fn capitalised(s: &str) -> String {
    let mut c = s.chars();
    c.next()
        .map_or_else(String::new, |f| f.to_uppercase().chain(c).collect())
}

/// An interval in display units: "3.10 to 5.30 Pa".
fn fmt_ci(p: ParamName, (lo, hi): (f64, f64), style: Style) -> String {
    let unit_free = |x| param_number(p, x, style);
    let unit = param_unit(p, style);
    let tail = if unit.is_empty() {
        String::new()
    } else {
        format!(" {unit}")
    };
    format!("{} to {}{tail}", unit_free(lo), unit_free(hi))
}

/// AICc to one decimal.
pub fn fmt_aicc(a: f64) -> String {
    format!("{a:.1}")
}

#[cfg(test)]
mod tests {
    use super::*;

    // Rounding to three significant figures and one decimal for AICc (ISO 80000-1 Annex B).
    #[test]
    fn intervals_read_in_site_units() {
        assert_eq!(fmt_aicc(-7.94), "-7.9");
        assert_eq!(
            fmt_ci(ParamName::Tau0, (3.1, 5.3), Style::SI),
            "3.10 to 5.30 Pa"
        );
        assert_eq!(
            fmt_ci(ParamName::Tau0, (-0.31, 0.8), Style::SI),
            "-0.310 to 0.800 Pa"
        );
        assert_eq!(
            fmt_ci(ParamName::N, (0.9996, 1.07), Style::SI),
            "1.000 to 1.070"
        );
    }
}
