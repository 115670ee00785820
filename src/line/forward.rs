//! Pressure drop for a flow: laminar from the exact relation, turbulent from the model's
//! correlation, transitional as the band between the two.

use super::answer::{Correlation, LineAnswer, Note};
use super::error::LineError;
use super::friction::{
    colebrook_fanning, darby_mun_boger_blend, darby_mun_boger_turbulent, dodge_metzner,
};
use super::laminar::wall_stress_at_flow;
use super::pipe::{Fluid, Pipe, positive};
use super::regime::{Regime, critical_reynolds, turbulent_onset};
use super::turbulent::{AtWall, DM_N_FLOOR, dodge_metzner_at_wall};
use crate::rheology::Model;

/// Dodge & Metzner's data: flow index range, and the highest Re_MR (about 3.6×10⁴, from memory).
const DM_N_RANGE: (f64, f64) = (0.36, 1.0);
const DM_RE_MAX: f64 = 3.6e4;

/// Everything about one flow in one line.
pub fn pressure_drop(pipe: &Pipe, fluid: &Fluid, flow_m3_s: f64) -> Result<LineAnswer, LineError> {
    pipe.check()?;
    fluid.check()?;
    positive("flow", flow_m3_s)?;
    finite_answer(evaluate(pipe, fluid, flow_m3_s))
}

/// An answer is given only when its numbers are finite: inputs far outside plant sizes
/// (a subnormal flow, a 5 km bore) can underflow or overflow on the way (found by fuzzing).
pub(super) fn finite_answer(a: LineAnswer) -> Result<LineAnswer, LineError> {
    for (what, value) in [
        ("pressure drop", a.pressure_drop_pa),
        ("wall shear stress", a.wall_shear_stress_pa),
        ("Reynolds number", a.reynolds),
        ("friction factor", a.fanning_friction),
    ] {
        if !value.is_finite() {
            return Err(LineError::OutOfRange { what, value });
        }
    }
    Ok(a)
}

/// The laminar state at a flow: wall stress, nominal and true wall shear rate, n′, Re_MR.
struct LaminarState {
    tau_w: f64,
    nominal: f64,
    wall_rate: f64,
    n_prime: f64,
    reynolds: f64,
}

fn laminar_state(pipe: &Pipe, fluid: &Fluid, v: f64, q: f64) -> LaminarState {
    let tau_w = wall_stress_at_flow(&fluid.model, pipe.radius_m(), q);
    let nominal = 8.0 * v / pipe.inner_diameter_m;
    let wall_rate = fluid.model.rate_at_stress(tau_w);
    // Rabinowitsch–Mooney, γ̇w = (8V/D)(3n′+1)/(4n′), solved for n′ (Steffe 1996 eq 2.119).
    let n_prime = match fluid.model {
        Model::Newtonian { .. } => 1.0,
        Model::PowerLaw { n, .. } => n,
        _ => nominal / (4.0 * wall_rate - 3.0 * nominal),
    };
    LaminarState {
        tau_w,
        nominal,
        wall_rate,
        n_prime,
        reynolds: 8.0 * fluid.density_kg_m3 * v * v / tau_w,
    }
}

/// Pressure drop at a flow already checked above zero.
pub(crate) fn evaluate(pipe: &Pipe, fluid: &Fluid, q: f64) -> LineAnswer {
    let v = pipe.velocity(q);
    let lam = laminar_state(pipe, fluid, v, q);
    let d = pipe.inner_diameter_m;
    let dyn_p = 0.5 * fluid.density_kg_m3 * v * v;
    let f_lam = lam.tau_w / dyn_p;
    let (re_c, rule) = critical_reynolds(
        &fluid.model,
        fluid.density_kg_m3,
        d,
        lam.n_prime,
        lam.wall_rate,
    );
    let regime = classify(lam.reynolds, re_c);
    let mut notes = Vec::new();
    let turb =
        (regime != Regime::Laminar).then(|| turbulent(pipe, fluid, v, &lam, f_lam, &mut notes));
    let (f, correlation) = match turb {
        None => (f_lam, Correlation::Laminar),
        Some((f_t, c)) => {
            if f_t < f_lam {
                notes.push(Note::TurbulentBelowLaminar);
            }
            (f_t.max(f_lam), c)
        }
    };
    let static_pa = fluid.static_pressure(pipe);
    let total = |f: f64| 4.0 * f * dyn_p * pipe.total_length_m() / d + static_pa;
    let transition_range_pa = (regime == Regime::Transitional).then(|| {
        let (lo, hi) = (total(f_lam.min(f)), total(f));
        notes.push(Note::TransitionalBand {
            low_pa: lo,
            high_pa: hi,
        });
        (lo, hi)
    });
    let tau_w = f * dyn_p;
    LineAnswer {
        flow_m3_s: q,
        velocity_m_s: v,
        wall_shear_stress_pa: tau_w,
        wall_shear_rate_per_s: fluid.model.rate_at_stress(tau_w),
        nominal_shear_rate_per_s: lam.nominal,
        reynolds: lam.reynolds,
        critical_reynolds: re_c,
        critical_rule: rule,
        regime,
        n_prime: lam.n_prime,
        fanning_friction: f,
        correlation,
        laminar_friction: f_lam,
        turbulent_friction: turb.map(|t| t.0),
        friction_pressure_drop_pa: total(f) - static_pa,
        static_pressure_pa: static_pa,
        pressure_drop_pa: total(f),
        transition_range_pa,
        notes,
    }
}

fn classify(reynolds: f64, critical: f64) -> Regime {
    if reynolds <= critical {
        Regime::Laminar
    } else if reynolds < turbulent_onset(critical) {
        Regime::Transitional
    } else {
        Regime::Turbulent
    }
}

/// The turbulent friction factor of the product's correlation at this flow, with its notes.
fn turbulent(
    pipe: &Pipe,
    fluid: &Fluid,
    v: f64,
    lam: &LaminarState,
    f_lam: f64,
    notes: &mut Vec<Note>,
) -> (f64, Correlation) {
    let rho = fluid.density_kg_m3;
    let d = pipe.inner_diameter_m;
    match fluid.model {
        Model::Newtonian { .. } => (
            colebrook_fanning(lam.reynolds, pipe.roughness_m / d),
            Correlation::Colebrook,
        ),
        Model::Bingham { tau0, mu_p } => {
            let re_b = rho * v * d / mu_p;
            let he = rho * d * d * tau0 / (mu_p * mu_p);
            let f_t = darby_mun_boger_turbulent(re_b, he);
            (
                darby_mun_boger_blend(f_lam, f_t, re_b),
                Correlation::DarbyMunBoger,
            )
        }
        Model::PowerLaw { n, .. } => {
            let at = AtWall {
                f: dodge_metzner(lam.reynolds, n.max(DM_N_FLOOR)),
                n_prime: n,
                reynolds: lam.reynolds,
            };
            (dm_notes(at, notes), Correlation::DodgeMetzner)
        }
        Model::HerschelBulkley { .. } | Model::Casson { .. } => {
            let at = dodge_metzner_at_wall(pipe, fluid, v, lam.tau_w);
            (dm_notes(at, notes), Correlation::DodgeMetzner)
        }
    }
}

/// The Dodge–Metzner friction factor, with the notes on where it was used.
fn dm_notes(at: AtWall, notes: &mut Vec<Note>) -> f64 {
    notes.push(Note::SmoothPipeAssumed);
    if !(DM_N_RANGE.0..=DM_N_RANGE.1).contains(&at.n_prime) {
        notes.push(Note::FlowIndexOutsideData {
            n_prime: at.n_prime,
        });
    }
    if at.reynolds > DM_RE_MAX {
        notes.push(Note::ReynoldsBeyondData {
            reynolds: at.reynolds,
            limit: DM_RE_MAX,
        });
    }
    at.f
}
