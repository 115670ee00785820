//! Pumps: the ANSI/HI 9.6.7 viscosity correction of a centrifugal pump's water curve, speed
//! scaling by the affinity laws, the operating point on a system curve with the power drawn,
//! and a positive-displacement pump's delivered flow against its relief setting. Pure.
//!
//! Sources: ANSI/HI 9.6.7-2010 (see [`hi967`]); the affinity laws; slip in positive-
//! displacement pumps falling with viscosity (common practice, no source).

mod curve;
mod displacement;
pub mod hi967;
mod operating;

pub use curve::{PumpCurve, PumpPoint};
pub use displacement::{
    DisplacementPump, MAX_SLIP, MU_REF, P_REF, PdDuty, Relief, S_REF, SlipBasis, pd_duty,
    volumetric_efficiency,
};
pub use hi967::{Correction, HiWarning, correction};
pub use operating::{Duty, G, NoDuty, SystemCurve, operating_point};
