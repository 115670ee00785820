//! The pump on a line, for the Line view and the report's chart: the pump that feeds the line, answered on it with the same
//! curve the line uses (session::pump — ANSI/HI 9.6.7 for a centrifugal pump, delivered flow
//! and slip for a positive-displacement one, duty points through session::line), as points
//! for the chart and lines of words.

use crate::pump::{G, Relief};
use crate::rheology::Model;
use crate::session::pump::{
    DEFAULT_PUMP_SHEAR_RATE, PumpAnswer, PumpNote, SitePump, SitePumpAnswer, on_site,
};
use crate::session::pump_words;
use crate::site::Site;
use crate::units::{self, Dimension, UnitSystem};

/// The pump on the line, ready to draw: (flow m³/s, pressure Pa) throughout.
#[derive(Debug, Clone, PartialEq)]
pub struct PumpShown {
    pub answer: SitePumpAnswer,
    pub density_kg_m3: f64,
    /// The corrected curve as pressure rise against flow (centrifugal only).
    pub curve: Vec<(f64, f64)>,
    /// The operating point, when there is one.
    pub duty: Option<(f64, f64)>,
    /// The relief setting (positive displacement), Pa.
    pub relief_pa: Option<f64>,
}

/// Points along the corrected curve for the chart.
const CURVE_POINTS: usize = 40;

/// The first pump feeding `line_id`, on it with `model`; `None` when no pump feeds it.
pub fn pump_on_line(
    site: &Site,
    line_id: &str,
    product: &str,
    model: Model,
) -> Option<Result<PumpShown, String>> {
    let pump = site.pumps_feeding(line_id).into_iter().next()?;
    let density = site.product(product).map(|p| p.density_kg_m3)?;
    let q = SitePump {
        site,
        pump_id: &pump.id,
        product,
        model,
        speed_rad_s: None,
        shear_rate_per_s: DEFAULT_PUMP_SHEAR_RATE,
    };
    Some(
        on_site(&q)
            .map(|answer| shown(answer, density, pump.relief_setting_pa))
            .map_err(|e| e.to_string()),
    )
}

fn shown(answer: SitePumpAnswer, rho: f64, relief: Option<f64>) -> PumpShown {
    let (curve, duty, relief_pa) = match &answer.answer {
        PumpAnswer::Centrifugal(c) => {
            let (lo, hi) = c.curve.flow_range();
            let points = (0..=CURVE_POINTS)
                .map(|i| lo + (hi - lo) * i as f64 / CURVE_POINTS as f64)
                .filter_map(|q| c.curve.at(q).map(|(h, _)| (q, rho * G * h)))
                .collect();
            (points, c.duty.map(|d| (d.flow_m3_s, d.pressure_pa)), None)
        }
        PumpAnswer::Displacement(d) => (
            Vec::new(),
            Some((d.duty.flow_m3_s, d.duty.pressure_pa)),
            relief,
        ),
    };
    PumpShown {
        answer,
        density_kg_m3: rho,
        curve,
        duty,
        relief_pa,
    }
}

/// The pump in words: what it gives on this line against its limits, and its notes apart.
pub fn words(p: &PumpShown, sys: UnitSystem) -> (Vec<String>, Vec<String>) {
    let flow = |q: f64| units::format(q, Dimension::Flow, sys);
    let bar = |pa: f64| units::format(pa, Dimension::Pressure, sys);
    let power = |w: f64| units::format(w, Dimension::Power, sys);
    let id = &p.answer.pump_id;
    let mut out = Vec::new();
    match &p.answer.answer {
        PumpAnswer::Centrifugal(c) => {
            let bep = &c.bep;
            out.push(format!(
                "Pump {id} (centrifugal), corrected for {:.0} cSt: B {:.2}, C_Q {:.3}, C_H {:.3}, \
                 C_eta {:.3}.",
                c.nu_cst,
                bep.correction.b,
                bep.correction.c_q,
                bep.correction.c_h_bep,
                bep.correction.c_eta
            ));
            out.push(match &c.duty {
                Some(d) => format!(
                    "Duty point: {} at {} ({:.1} m head), {} drawn{}.",
                    flow(d.flow_m3_s),
                    bar(d.pressure_pa),
                    d.head_m,
                    power(d.power_w),
                    margin(d.motor_margin_w, sys)
                ),
                None => no_duty(&p.answer.notes),
            });
        }
        PumpAnswer::Displacement(d) => {
            let duty = &d.duty;
            out.push(format!(
                "Pump {id} (positive displacement): delivers {} ({:.0} % volumetric \
                 efficiency) at {}, {} drawn{}.",
                flow(duty.flow_m3_s),
                100.0 * duty.volumetric_efficiency,
                bar(duty.pressure_pa),
                power(duty.power_w),
                margin(duty.motor_margin_w, sys)
            ));
            out.push(match (duty.relief, p.relief_pa) {
                (Relief::Below { margin_pa }, Some(r)) => {
                    format!("Relief at {}: {} below it.", bar(r), bar(margin_pa))
                }
                (Relief::Opens { excess_pa }, Some(r)) => format!(
                    "Relief at {}: the line needs {} more, so the relief opens.",
                    bar(r),
                    bar(excess_pa)
                ),
                _ => "No relief setting in the site config: nothing caps the pressure.".into(),
            });
        }
    }
    let notes = p
        .answer
        .notes
        .iter()
        // A missing duty point is said above, in its place.
        .filter(|n| !matches!(n, PumpNote::NoDuty(_)))
        .map(|n| format!("Pump: {}.", pump_words::note(n)))
        .collect();
    (out, notes)
}

/// Why there is no duty point, from the notes.
fn no_duty(notes: &[PumpNote]) -> String {
    let why = notes.iter().find_map(|n| match n {
        PumpNote::NoDuty(_) => Some(pump_words::note(n)),
        _ => None,
    });
    match why {
        Some(w) => format!("Pump: {w}."),
        None => "No duty point on this line.".into(),
    }
}

fn margin(m: Option<f64>, sys: UnitSystem) -> String {
    match m {
        Some(w) if w >= 0.0 => format!(
            ", {} left on the motor",
            units::format(w, Dimension::Power, sys)
        ),
        Some(w) => format!(
            ", {} over the motor's rating",
            units::format(-w, Dimension::Power, sys)
        ),
        None => String::new(),
    }
}
