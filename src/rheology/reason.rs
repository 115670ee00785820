//! The model-choice reason as a sentence an operator can read, and number formatting for it.

use super::choose::{Candidate, StepDown};
use super::error::FitError;
use super::fit::{Estimate, Fit};
use super::kind::{ModelKind, ParamName};

/// "Herschel–Bulkley: lowest AICc (−12.3 vs −8.1 for Bingham); yield stress 4.2 Pa, …"
pub(crate) fn explain(
    chosen: &Fit,
    ranked: &[&Fit],
    steps: &[StepDown],
    candidates: &[Candidate],
) -> String {
    let kind = chosen.model.kind();
    let mut out = format!("{}: ", capitalised(kind.title()));
    let lowest = ranked.first().copied().unwrap_or(chosen);
    out.push_str(&ranking(lowest, ranked, !steps.is_empty()));
    if steps.is_empty() {
        let evidence = evidence(chosen);
        if !evidence.is_empty() {
            out.push_str("; ");
            out.push_str(&evidence);
        }
    } else {
        let whys: Vec<String> = steps.iter().map(why_simpler).collect();
        out.push_str(", but ");
        out.push_str(&whys.join(", and "));
        out.push_str(&format!(", so the simpler {} model is used", kind.title()));
    }
    out.push('.');
    out.push_str(&not_compared(candidates));
    out
}

/// "lowest AICc (−12.3 vs −8.1 for Bingham)"; after a step-down, "power law had the lowest …".
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
fn evidence(f: &Fit) -> String {
    let mut parts = Vec::new();
    if let Some(t) = f.estimate(ParamName::Tau0) {
        parts.push(describe(t, "yield stress", 0.0, "clearly above zero"));
    }
    if let Some(n) = f.estimate(ParamName::N) {
        let side = if n.value < 1.0 {
            "clearly below 1"
        } else {
            "clearly above 1"
        };
        parts.push(describe(n, "n", 1.0, side));
    }
    if let (ModelKind::Newtonian, Some(mu)) = (f.model.kind(), f.estimate(ParamName::Mu)) {
        parts.push(describe(mu, "viscosity", f64::NAN, ""));
    }
    parts.join("; ")
}

/// "yield stress 4.2 Pa, 95 % CI 3.1–5.3 Pa, clearly above zero".
fn describe(e: &Estimate, what: &str, null_value: f64, verdict: &str) -> String {
    let unit = unit_suffix(e.name);
    let mut s = format!("{what} {}{unit}", fmt_value(e.name, e.value));
    if let Some(ci) = e.ci95 {
        s.push_str(&format!(", 95 % CI {}", fmt_ci(e.name, ci, &unit)));
        if !verdict.is_empty() && !e.ci_includes(null_value) {
            s.push_str(", ");
            s.push_str(verdict);
        }
    }
    s
}

/// "the Herschel–Bulkley yield stress (95 % CI −0.31 to 0.80 Pa) includes zero".
fn why_simpler(step: &StepDown) -> String {
    let e = &step.estimate;
    let from = step.from.title();
    let unit = unit_suffix(e.name);
    let what = if e.name == ParamName::Tau0 {
        "yield stress"
    } else {
        "n"
    };
    let null = if step.null_value == 0.0 { "zero" } else { "1" };
    match (e.at_bound, e.ci95, e.no_ci) {
        (true, _, _) => format!("the {from} {what} went to its bound of 0{unit}"),
        (_, Some(ci), _) => format!(
            "the {from} {what} (95 % CI {}) includes {null}",
            fmt_ci(e.name, ci, &unit)
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

/// n to three decimals (so an interval ending at 0.9996 does not print as "1.00"); others 3 s.f.
fn fmt_value(p: ParamName, x: f64) -> String {
    if p == ParamName::N {
        minus(format!("{x:.3}"))
    } else {
        fmt_num(x)
    }
}

fn unit_suffix(p: ParamName) -> String {
    match p.unit() {
        "" => String::new(),
        u => format!(" {u}"),
    }
}

fn capitalised(s: &str) -> String {
    let mut c = s.chars();
    c.next()
        .map_or_else(String::new, |f| f.to_uppercase().chain(c).collect())
}

/// An interval: "3.1–5.3 Pa", or "−0.31 to 0.80 Pa" when a dash would read as a minus.
pub(crate) fn fmt_ci(p: ParamName, (lo, hi): (f64, f64), unit: &str) -> String {
    let (a, b) = (fmt_value(p, lo), fmt_value(p, hi));
    if lo < 0.0 {
        format!("{a} to {b}{unit}")
    } else {
        format!("{a}–{b}{unit}")
    }
}

/// AICc to one decimal, with a true minus sign.
pub(crate) fn fmt_aicc(a: f64) -> String {
    minus(format!("{a:.1}"))
}

/// Three significant figures, plain notation from 1e-4 to 1e6, a true minus sign.
pub(crate) fn fmt_num(x: f64) -> String {
    if x == 0.0 || !x.is_finite() {
        return if x == 0.0 { "0".into() } else { format!("{x}") };
    }
    let mag = x.abs().log10().floor() as i32;
    let s = if !(-4..6).contains(&mag) {
        format!("{x:.2e}")
    } else {
        let decimals = (2 - mag).max(0) as usize;
        format!("{x:.decimals$}")
    };
    minus(s)
}

fn minus(s: String) -> String {
    s.replace('-', "−")
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: rounding to three significant figures (ISO 80000-1 Annex B rounding rule).
    #[test]
    fn numbers_read_well() {
        assert_eq!(fmt_num(-12.34), "−12.3");
        assert_eq!(fmt_num(103.4), "103");
        assert_eq!(fmt_num(0.04437), "0.0444");
        assert_eq!(fmt_num(4.2), "4.20");
        assert_eq!(fmt_num(0.0), "0");
        assert_eq!(fmt_num(2.5e-6), "2.50e−6");
        assert_eq!(fmt_aicc(-7.94), "−7.9");
        assert_eq!(fmt_ci(ParamName::Tau0, (3.1, 5.3), " Pa"), "3.10–5.30 Pa");
        assert_eq!(
            fmt_ci(ParamName::Tau0, (-0.31, 0.8), " Pa"),
            "−0.310 to 0.800 Pa"
        );
        assert_eq!(fmt_ci(ParamName::N, (0.9996, 1.07), ""), "1.000–1.070");
    }
}
