//! The Flow curve view: the last saved set's shear stress against shear rate on log axes,
//! the fitted model with its constants ± 95 % CI, fit quality, why that model, and the
//! apparent viscosity at a shear rate the operator types. The model can be switched by hand.
//!
//! The fit runs when the set or the model changes, never while drawing.

use super::curve_panel;
use super::{Effect, SavedSet, SessionEvent, View, ViewId};
use crate::rheology::ModelKind;
use crate::session::{FlowCurve, FlowCurveInput, FlowCurveOptions, ModelPick, analyse};
use crate::tui::ctx::Ctx;
use crate::tui::keymap::Action;
use crate::tui::widgets::editing::{self, EditStep};
use crate::tui::widgets::field::{Field, FieldKind};
use crate::tui::widgets::log_axis::LogRange;
use crate::tui::widgets::log_chart::Mark;
use crate::units::Dimension;
use ratatui::Frame;
use ratatui::layout::Rect;
use std::sync::Arc;

/// The model choices in the order `m` steps through them.
const PICKS: [ModelPick; 6] = [
    ModelPick::Auto,
    ModelPick::Fixed(ModelKind::Newtonian),
    ModelPick::Fixed(ModelKind::PowerLaw),
    ModelPick::Fixed(ModelKind::Bingham),
    ModelPick::Fixed(ModelKind::HerschelBulkley),
    ModelPick::Fixed(ModelKind::Casson),
];

/// Samples along the fitted curve: more than the widest chart has columns.
const CURVE_SAMPLES: usize = 240;
/// The shear rate the apparent viscosity is first shown at, 1/s (a mid-range pipe rate;
/// common practice, no source).
const DEFAULT_RATE: &str = "100";

/// A fitted set, with everything the chart needs already worked out.
pub struct Shown {
    pub curve: FlowCurve,
    pub marks: Vec<Mark>,
    pub samples: Vec<(f64, f64)>,
    pub x: LogRange,
    pub y: LogRange,
}

pub struct CurveView {
    set: Option<Arc<SavedSet>>,
    ticket: Option<u64>,
    pick: ModelPick,
    result: Option<Result<Shown, String>>,
    rate: Field,
    apparent: Option<f64>,
    editing: bool,
}

impl Default for CurveView {
    fn default() -> Self {
        CurveView::new()
    }
}

impl CurveView {
    pub fn new() -> CurveView {
        CurveView {
            set: None,
            ticket: None,
            pick: ModelPick::Auto,
            result: None,
            rate: Field::with_text(FieldKind::Positive(Dimension::ShearRate), DEFAULT_RATE),
            apparent: None,
            editing: false,
        }
    }

    /// Show a set (a new one, or the last one of a resumed journal).
    pub fn show_set(&mut self, set: Arc<SavedSet>, ticket: Option<u64>) {
        self.set = Some(set);
        self.ticket = ticket;
        self.recompute();
    }

    fn recompute(&mut self) {
        self.result = self.set.as_ref().map(|set| fit_set(set, self.pick));
        self.update_apparent();
    }

    fn update_apparent(&mut self) {
        let fitted = self.result.as_ref().and_then(|r| r.as_ref().ok());
        self.apparent = match (fitted, self.rate.value()) {
            (Some(shown), Some(rate)) => Some(shown.curve.apparent_viscosity_at(rate)),
            _ => None,
        };
    }

    fn step_model(&mut self, step: isize) {
        let at = PICKS.iter().position(|p| *p == self.pick).unwrap_or(0) as isize;
        self.pick = PICKS[(at + step).rem_euclid(PICKS.len() as isize) as usize];
        self.recompute();
    }

    fn handle_editing(&mut self, action: Action) {
        match editing::apply(&mut self.rate, action) {
            EditStep::Typing => {}
            EditStep::Cancelled | EditStep::Accepted(_) => self.editing = false,
        }
        self.update_apparent();
    }

    pub fn result(&self) -> Option<&Result<Shown, String>> {
        self.result.as_ref()
    }
}

/// Fit a set and lay out its chart data.
fn fit_set(set: &SavedSet, pick: ModelPick) -> Result<Shown, String> {
    let opts = FlowCurveOptions {
        model: pick,
        ..FlowCurveOptions::default()
    };
    let input = FlowCurveInput::Dial {
        geometry: &set.geometry,
        readings: &set.readings,
    };
    let curve = analyse(input, &opts).map_err(|e| e.to_string())?;
    let marks: Vec<Mark> = curve
        .points
        .iter()
        .map(|p| Mark {
            x: p.shear_rate_per_s,
            y: p.shear_stress_pa,
            flagged: !p.flags.is_empty(),
        })
        .collect();
    let fallback = LogRange { lo: 0.0, hi: 1.0 };
    let x = LogRange::covering(marks.iter().map(|m| m.x)).unwrap_or(fallback);
    let y = LogRange::covering(marks.iter().map(|m| m.y)).unwrap_or(fallback);
    let samples = sample_curve(&curve, x);
    Ok(Shown {
        curve,
        marks,
        samples,
        x,
        y,
    })
}

/// The model's stress at rates spread evenly in log space across the x axis.
fn sample_curve(curve: &FlowCurve, x: LogRange) -> Vec<(f64, f64)> {
    let span = x.hi - x.lo;
    (0..CURVE_SAMPLES)
        .map(|i| {
            let exp = x.lo + span * i as f64 / (CURVE_SAMPLES - 1) as f64;
            let rate = 10f64.powf(exp);
            (rate, curve.fit.model.stress(rate))
        })
        .filter(|(_, stress)| stress.is_finite() && *stress > 0.0)
        .collect()
}

impl View for CurveView {
    fn id(&self) -> ViewId {
        ViewId::Curve
    }

    fn handle(&mut self, action: Action, _ctx: &Ctx) -> Vec<Effect> {
        if self.editing {
            self.handle_editing(action);
            return Vec::new();
        }
        match action {
            Action::NextModel | Action::Right => self.step_model(1),
            Action::PrevModel | Action::Left => self.step_model(-1),
            Action::AutoModel => {
                self.pick = ModelPick::Auto;
                self.recompute();
            }
            // A new rate is typed from scratch (Esc brings the old one back).
            Action::Activate => {
                self.rate.begin_edit();
                self.rate.clear();
                self.editing = true;
                self.update_apparent();
            }
            Action::Type(c) => {
                editing::start_with(&mut self.rate, c);
                self.editing = true;
                self.update_apparent();
            }
            _ => {}
        }
        Vec::new()
    }

    fn on_event(&mut self, event: &SessionEvent, _ctx: &Ctx) {
        match event {
            SessionEvent::SetSaved { set, ticket } => self.show_set(Arc::clone(set), *ticket),
        }
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let view = curve_panel::CurveScreen {
            set: self.set.as_deref(),
            ticket: self.ticket,
            pick: self.pick,
            result: self.result.as_ref(),
            rate: &self.rate,
            apparent: self.apparent,
            editing: self.editing,
        };
        view.draw(frame, area, ctx);
    }

    fn editing(&self) -> bool {
        self.editing
    }
}
