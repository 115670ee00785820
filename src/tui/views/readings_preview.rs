//! The viscometer-set form's live checks: what each row will store and what is wrong or
//! worth a word about it, as it is typed.

use super::readings_form::{Form, RAD_S_PER_RPM};
use crate::instrument::Geometry;
use crate::site::Viscometer;
use crate::tui::strings::readings as s;

/// What a typed row will give and what is wrong with it, shown as it is typed.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct RowPreview {
    /// Newtonian bob shear rate (1/s) and shear stress (Pa) the row stands for.
    pub rate_per_s: Option<f64>,
    pub stress_pa: Option<f64>,
    pub notes: Vec<RowNote>,
}

/// A check on one typed row.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum RowNote {
    NegativeDial,
    /// At or above full scale: the spring is at its stop and the reading is not valid.
    Pegged,
    /// Below 10 % of full scale (common practice, no source).
    LowScale,
    /// Outside the instrument's speeds (the standard six-speed runs 3 to 600 rpm; others
    /// from the site config when given).
    SpeedOutOfRange {
        lo_rpm: f64,
        hi_rpm: f64,
    },
    /// Higher than the reading of a row at a higher speed (1-based row).
    AboveFasterRow(usize),
}

impl RowNote {
    /// A reading the fit cannot use as typed (shown in the error colour).
    pub fn is_strong(self) -> bool {
        matches!(
            self,
            RowNote::NegativeDial | RowNote::Pegged | RowNote::SpeedOutOfRange { .. }
        )
    }

    /// A few words for the table's last column (the full words go on the message line).
    pub fn short(self) -> String {
        match self {
            RowNote::NegativeDial => s::NEGATIVE_SHORT.to_string(),
            RowNote::Pegged => s::PEGGED_SHORT.to_string(),
            RowNote::LowScale => s::LOW_SCALE_SHORT.to_string(),
            RowNote::SpeedOutOfRange { lo_rpm, hi_rpm } => {
                format!("{} {lo_rpm}-{hi_rpm} rpm", s::RANGE_SHORT)
            }
            RowNote::AboveFasterRow(row) => format!("{} {row}", s::ABOVE_SHORT),
        }
    }

    /// The check in full words.
    pub fn words(self) -> String {
        match self {
            RowNote::NegativeDial => s::NEGATIVE_DIAL.to_string(),
            RowNote::Pegged => s::PEGGED.to_string(),
            RowNote::LowScale => s::LOW_SCALE.to_string(),
            RowNote::SpeedOutOfRange { lo_rpm, hi_rpm } => {
                format!("{} {lo_rpm} to {hi_rpm} rpm", s::SPEED_RANGE)
            }
            RowNote::AboveFasterRow(row) => format!("{} {row}", s::ABOVE_FASTER),
        }
    }
}

impl Form {
    /// Each row's shear rate and stress on this instrument, with its checks.
    pub fn preview(&self, viscometer: Option<&Viscometer>) -> Vec<RowPreview> {
        let Some(v) = viscometer else {
            return vec![RowPreview::default(); self.rows.len()];
        };
        let g = &v.geometry;
        let typed: Vec<(Option<f64>, Option<f64>)> = self
            .rows
            .iter()
            .map(|r| (r.speed.value().map(|w| w / RAD_S_PER_RPM), r.dial.value()))
            .collect();
        typed
            .iter()
            .map(|&(rpm, dial)| RowPreview {
                rate_per_s: rpm.map(|n| n * g.newtonian_rate_per_rpm()),
                stress_pa: dial.map(|d| d * g.stress_per_dial_pa()),
                notes: row_notes(g, v.speed_range_rpm, rpm, dial, &typed),
            })
            .collect()
    }
}

fn row_notes(
    g: &Geometry,
    speed_range_rpm: Option<(f64, f64)>,
    rpm: Option<f64>,
    dial: Option<f64>,
    all: &[(Option<f64>, Option<f64>)],
) -> Vec<RowNote> {
    let mut notes = Vec::new();
    let full = g.full_scale_dial();
    if let Some(d) = dial {
        if d < 0.0 {
            notes.push(RowNote::NegativeDial);
        } else if d >= full {
            notes.push(RowNote::Pegged);
        } else if d < crate::instrument::LOW_SCALE_FRACTION * full {
            notes.push(RowNote::LowScale);
        }
    }
    if let (Some(n), Some((lo, hi))) = (rpm, speed_range_rpm)
        && !(lo - 1e-9..=hi + 1e-9).contains(&n)
    {
        notes.push(RowNote::SpeedOutOfRange {
            lo_rpm: lo,
            hi_rpm: hi,
        });
    }
    if let (Some(n), Some(d)) = (rpm, dial) {
        let faster_lower = all
            .iter()
            .position(|&(r, x)| matches!((r, x), (Some(r), Some(x)) if r > n && x < d));
        if let Some(i) = faster_lower {
            notes.push(RowNote::AboveFasterRow(i + 1));
        }
    }
    notes
}
