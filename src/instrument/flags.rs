//! Per-reading warnings: dial out of its accurate range, unsheared gap, limited slope.

use super::convert::Converted;
use super::geometry::Geometry;

/// Fraction of full scale below which a dial reading is taken as inaccurate
/// (common practice, no source).
pub const LOW_SCALE_FRACTION: f64 = 0.10;

/// Something the operator should know about one converted reading.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum ReadingFlag {
    /// Below 10 % of full scale.
    LowScale,
    /// At or above 100 % of full scale: the dial is pegged.
    OffScale,
    /// Stress at the cup below the yield stress: part of the gap is not sheared.
    GapNotFullySheared,
    /// The local slope n′ fell outside its sane range and was limited.
    SlopeClamped,
    /// Fewer than two different speeds with a reading above 0: n′ taken as 1.
    SlopeNotMeasured,
}

impl ReadingFlag {
    /// Short stable code, as used in journals and `--json` output.
    pub fn code(self) -> &'static str {
        match self {
            ReadingFlag::LowScale => "low-scale",
            ReadingFlag::OffScale => "off-scale",
            ReadingFlag::GapNotFullySheared => "gap-not-fully-sheared",
            ReadingFlag::SlopeClamped => "slope-clamped",
            ReadingFlag::SlopeNotMeasured => "slope-not-measured",
        }
    }

    /// One plain sentence: what it means and what to do.
    pub fn explain(self) -> &'static str {
        match self {
            ReadingFlag::LowScale => {
                "below 10 % of full scale: low accuracy; use a softer spring or a larger bob"
            }
            ReadingFlag::OffScale => {
                "at or above full scale (pegged): the reading only says 'at least this much'; \
                 use a lower speed, a stiffer spring or a smaller bob"
            }
            ReadingFlag::GapNotFullySheared => {
                "stress at the cup is below the yield stress, so part of the gap does not \
                 shear and the shear rate is overstated; use a narrower gap or a higher speed"
            }
            ReadingFlag::SlopeClamped => {
                "the slope of log stress against log speed was outside 0.05 to 2 and was \
                 limited; check for a slipping, settling or drying sample and read again"
            }
            ReadingFlag::SlopeNotMeasured => {
                "fewer than two different speeds: the slope was taken as 1, so the shear \
                 rate is the Newtonian one; read at two or more speeds to correct it"
            }
        }
    }
}

/// Dial range flags for one reading (common practice, no source: aim for 10–90 %).
pub(crate) fn scale_flags(dial: f64, full_scale: f64) -> Vec<ReadingFlag> {
    let mut flags = Vec::new();
    if dial < LOW_SCALE_FRACTION * full_scale {
        flags.push(ReadingFlag::LowScale);
    }
    // At full scale the needle is pegged: it cannot show whether the stress is higher.
    if dial >= full_scale {
        flags.push(ReadingFlag::OffScale);
    }
    flags
}

/// Flag readings where the cup-side stress τc = κ²·τb is below the yield stress τ0.
///
/// Apply after a fit has given τ0 (Pa). The stress falls as 1/r² across the gap
/// (τc = τb·(Rb/Rc)², a torque balance on the fluid shell;
/// Steffe 1996, §3.3), so below τ0 the outer fluid stays still and the gap formula overstates
/// the rate. A spindle in a large container is never flagged: its rate 2Ω/n′ already holds
/// when the far fluid does not move, since Ω = ½∫γ̇(τ)/τ dτ from 0 to τb counts the still
/// fluid as γ̇ = 0 (Krieger's infinite-medium relation). A non-finite or non-positive τ0
/// flags nothing.
pub fn flag_unsheared_gap(geometry: &Geometry, converted: &mut [Converted], yield_stress_pa: f64) {
    let Some(s) = geometry.radius_ratio() else {
        return;
    };
    if !(yield_stress_pa.is_finite() && yield_stress_pa > 0.0) {
        return;
    }
    let kappa_sq = 1.0 / (s * s);
    for row in converted.iter_mut() {
        let cup_stress = kappa_sq * row.shear_stress_pa;
        if cup_stress < yield_stress_pa && !row.flags.contains(&ReadingFlag::GapNotFullySheared) {
            row.flags.push(ReadingFlag::GapNotFullySheared);
        }
    }
}
