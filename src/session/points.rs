//! The points of a flow curve as shown, and one warning per instrument flag.

use super::flow_curve::{FlowCurveInput, PointOut};
use crate::instrument::{self, Converted};
use crate::rheology::Point;

pub(crate) fn describe_points(
    input: FlowCurveInput<'_>,
    converted: Option<&[Converted]>,
    fitted: &[Point],
) -> Vec<PointOut> {
    match (input, converted) {
        (_, Some(rows)) => rows
            .iter()
            .zip(fitted)
            .map(|(c, p)| PointOut {
                row: 0,
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
                row: 0,
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

/// One warning per flag kind present, naming the readings (rows as given, from 1) it applies to.
pub(crate) fn flag_warnings(rows: &[Converted], row_numbers: &[usize]) -> Vec<String> {
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
                .map(|(i, _)| row_numbers.get(i).copied().unwrap_or(i + 1).to_string())
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
