//! Flow for a pressure drop: a bracketed root-find on the monotone pressure drop against flow.

use super::answer::{LineAnswer, Note};
use super::error::LineError;
use super::forward::evaluate;
use super::laminar::flow_at_wall_stress;
use super::pipe::{Fluid, Pipe};
use super::solve::bisect;

/// The flow a pressure drop drives, with the full answer at that flow (none when it stands).
#[derive(Debug, Clone, PartialEq)]
pub struct FlowAnswer {
    pub flow_m3_s: f64,
    pub answer: Option<LineAnswer>,
    pub notes: Vec<Note>,
}

/// Flow (m³/s) through the line for a total pressure drop (friction plus static head, Pa).
///
/// The bracket: at most the laminar flow at the same wall stress, because every regime's
/// friction factor is at least the laminar one here; at least zero. The pressure drop rises
/// with flow, so bisection in log-flow finds the one answer.
pub fn flow_for_pressure(
    pipe: &Pipe,
    fluid: &Fluid,
    pressure_drop_pa: f64,
) -> Result<FlowAnswer, LineError> {
    pipe.check()?;
    fluid.check()?;
    if !pressure_drop_pa.is_finite() {
        return Err(LineError::NotFinite {
            what: "pressure drop",
            value: pressure_drop_pa,
        });
    }
    let static_pa = fluid.static_pressure(pipe);
    let d = pipe.inner_diameter_m;
    let l = pipe.total_length_m();
    let yield_pa = 4.0 * l * fluid.model.yield_stress() / d;
    let friction = pressure_drop_pa - static_pa;
    if friction <= yield_pa {
        return Ok(FlowAnswer {
            flow_m3_s: 0.0,
            answer: None,
            notes: vec![Note::NoFlow {
                static_pressure_pa: static_pa,
                yield_pressure_pa: yield_pa,
            }],
        });
    }
    let q_laminar = flow_at_wall_stress(&fluid.model, pipe.radius_m(), friction * d / (4.0 * l));
    if !(q_laminar.is_finite() && q_laminar > 0.0) {
        return Err(LineError::NoRoot {
            target_pa: pressure_drop_pa,
            flow_m3_s: q_laminar,
        });
    }
    let g = |q: f64| evaluate(pipe, fluid, q).pressure_drop_pa - pressure_drop_pa;
    let q = bisect(q_laminar * 1e-12, q_laminar * (1.0 + 1e-9), g);
    if !q.is_finite() {
        return Err(LineError::OutOfRange {
            what: "flow",
            value: q,
        });
    }
    let answer = super::forward::finite_answer(evaluate(pipe, fluid, q))?;
    Ok(FlowAnswer {
        flow_m3_s: q,
        notes: answer.notes.clone(),
        answer: Some(answer),
    })
}
