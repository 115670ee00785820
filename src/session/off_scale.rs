//! Which readings go into a fit: a dial at or above full scale (pegged) is left out by
//! default and listed, so the fit equals the fit of the readings without it.

use super::checks::{LeftOut, LeftOutWhy, OffScale};
use super::flow_curve::FlowCurveInput;
use crate::instrument::DialReading;

/// The readings kept for the fit, the ones left out, and each kept reading's row (from 1, in
/// the order given) so flags and messages name the row the operator typed.
#[derive(Debug, Clone, PartialEq)]
pub struct Selection {
    pub kept: Vec<DialReading>,
    pub rows: Vec<usize>,
    pub left_out: Vec<LeftOut>,
}

/// Split dial readings by the off-scale rule; direct points are all kept (rows 1, 2, …).
pub fn select(input: FlowCurveInput<'_>, rule: OffScale) -> Selection {
    match input {
        FlowCurveInput::Dial { geometry, readings } => {
            let full_scale = geometry.full_scale_dial();
            let mut s = Selection {
                kept: Vec::new(),
                rows: Vec::new(),
                left_out: Vec::new(),
            };
            for (i, r) in readings.iter().enumerate() {
                // A NaN dial is kept here and refused by the conversion with its row.
                if rule == OffScale::LeaveOut && r.dial >= full_scale {
                    s.left_out.push(LeftOut {
                        row: i + 1,
                        rpm: r.rpm,
                        dial: r.dial,
                        full_scale_dial: full_scale,
                        why: LeftOutWhy::Pegged,
                    });
                } else {
                    s.kept.push(*r);
                    s.rows.push(i + 1);
                }
            }
            s
        }
        FlowCurveInput::Direct { points } => Selection {
            kept: Vec::new(),
            rows: (1..=points.len()).collect(),
            left_out: Vec::new(),
        },
    }
}
