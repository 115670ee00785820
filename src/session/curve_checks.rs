//! Runs the checks of [`super::checks`] on a fitted curve: flags reversed readings on their
//! points, adds the concerns and their sentences to the warnings.

use super::checks::{Concern, XUnit, assess_fit, reversed_pairs};
use super::flow_curve::{FlowCurve, FlowCurveInput};

/// The flag code put on both readings of a reversed pair.
pub const REVERSED_FLAG: &str = "reversed";

/// Add the concerns to `curve`; `rows` gives each point's row as the operator typed it.
pub(crate) fn apply(curve: &mut FlowCurve, rows: &[usize], input: FlowCurveInput<'_>) {
    let (xy, unit): (Vec<(f64, f64)>, XUnit) = match input {
        FlowCurveInput::Dial { readings, .. } => (
            readings.iter().map(|r| (r.rpm, r.dial)).collect(),
            XUnit::Rpm,
        ),
        FlowCurveInput::Direct { points } => (
            points
                .iter()
                .map(|p| (p.shear_rate, p.shear_stress))
                .collect(),
            XUnit::PerSecond,
        ),
    };
    let row = |i: usize| rows.get(i).copied().unwrap_or(i + 1);
    for (i, p) in curve.points.iter_mut().enumerate() {
        p.row = row(i);
    }
    let mut concerns = Vec::new();
    for (slow, fast) in reversed_pairs(&xy) {
        for i in [slow, fast] {
            if let Some(p) = curve.points.get_mut(i)
                && !p.flags.iter().any(|f| f == REVERSED_FLAG)
            {
                p.flags.push(REVERSED_FLAG.to_string());
            }
        }
        concerns.push(Concern::Reversed {
            slower_row: row(slow),
            faster_row: row(fast),
            x: (xy[slow].0, xy[fast].0),
            y: (xy[slow].1, xy[fast].1),
            unit,
        });
    }
    let rates: Vec<f64> = curve.points.iter().map(|p| p.shear_rate_per_s).collect();
    concerns.extend(assess_fit(&curve.fit, &rates));
    curve.warnings.extend(concerns.iter().map(Concern::explain));
    curve.concerns = concerns;
}
