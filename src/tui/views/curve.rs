//! The Flow curve view: the session's newest set, shear stress against shear rate on log
//! axes, the model shown with its constants ± 95 % interval, fit quality, why that model,
//! and the apparent viscosity at a shear rate the operator types.
//!
//! Everything comes from the live session state: the set and its curve (fitted once when
//! the set was applied), the model picked by hand and the shear rate chosen (both journalled
//! as `choice` records, so a replay shows the same). The view keeps only what it derives
//! for drawing (the chart's points and samples) and the rate being typed.

use super::curve_panel;
use super::{Draft, Effect, View, ViewId};
use crate::journal::Payload;
use crate::present::Style;
use crate::rheology::ModelKind;
use crate::session::state::{Entry, ViscometerSet};
use crate::session::trend::{LimitCheck, checks_at_reference, spec_rate};
use crate::session::{FlowCurve, ModelPick};
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b, h};
use crate::tui::strings::{caution, curve as s, keys, views as names};
use crate::tui::session_log::summarize;
use crate::tui::widgets::editing::{self, EditStep};
use crate::tui::widgets::field::{Field, FieldKind};
use crate::tui::widgets::log_axis::LogRange;
use crate::tui::widgets::log_chart::Mark;
use crate::units::Dimension;
use ratatui::Frame;
use ratatui::layout::Rect;

/// This view's id.
pub const ID: ViewId = ViewId("curve");

/// The Flow curve view's own keys.
const KEYS: &[Binding] = &[
    b(Scope::View, &[Key::Char('m')], Action::NextModel, keys::NEXT_MODEL),
    h(Scope::View, &[Key::Char('M')], Action::PrevModel, keys::PREV_MODEL),
    h(Scope::View, &[Key::Char('A')], Action::AutoModel, keys::AUTO_MODEL),
    b(Scope::View, &[Key::Char('r'), Key::Enter], Action::Activate, keys::SET_RATE),
    h(Scope::View, &[Key::Digit], Action::Type('0'), keys::TYPE_RATE),
    b(
        Scope::View,
        &[Key::Char('f')],
        Action::ToggleRelations,
        keys::FIELD_RELATIONS,
    ),
    h(
        Scope::View,
        &[Key::Char('i')],
        Action::TogglePegged,
        keys::PEGGED,
    ),
];

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
/// The shear rate the apparent viscosity is first shown at when the product has no limit at
/// a rate of its own, 1/s (a mid-range pipe rate; common practice, no source).
const DEFAULT_RATE: &str = "100";

/// The chart of one set's shown curve, worked out when the state changes.
pub struct Shown {
    /// The set's record number and the model pick this chart is of.
    pub seq: u64,
    pub pick: ModelPick,
    pub marks: Vec<Mark>,
    pub samples: Vec<(f64, f64)>,
    pub x: LogRange,
    pub y: LogRange,
    /// The stress axis's unit (the site's); marks and samples are in it.
    pub y_unit: String,
    /// The product's spec limits checked on the shown curve, as `report` checks them.
    pub limits: Option<Limits>,
}

/// A set's product limits checked, for the limits panel.
pub struct Limits {
    pub product: String,
    pub checks: Vec<LimitCheck>,
    /// The reference temperature the curve was shifted to, K; `None`: as measured.
    pub shifted_to_k: Option<f64>,
}

/// The set's product limits on its shown curve (`None` without a product in the config).
fn limits_of(set: &ViscometerSet, curve: &FlowCurve, ctx: &Ctx) -> Option<Limits> {
    let product = ctx.site.product(&set.product)?;
    let (checks, shifted_to_k) =
        checks_at_reference(product, &curve.fit.model, set.temperature_k);
    Some(Limits {
        product: product.name.clone(),
        checks,
        shifted_to_k,
    })
}

pub struct CurveView {
    chart: Option<Shown>,
    rate: Field,
    editing: bool,
    /// The model panel shows the API RP 13D field relations instead of the model.
    relations: bool,
}

impl CurveView {
    pub fn new(_ctx: &Ctx) -> CurveView {
        CurveView {
            chart: None,
            rate: Field::with_text(FieldKind::Positive(Dimension::ShearRate), DEFAULT_RATE),
            editing: false,
            relations: false,
        }
    }

    /// The chart drawn, for tests.
    pub fn chart(&self) -> Option<&Shown> {
        self.chart.as_ref()
    }

    /// The shear rate the apparent viscosity is read at: the one being typed, else the one
    /// chosen for the set, else the field's text.
    fn rate_now(&self, set: &ViscometerSet) -> Option<f64> {
        if self.editing {
            return self.rate.value();
        }
        set.shear_rate_per_s.or(self.rate.value())
    }

    fn handle_editing(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match editing::apply(&mut self.rate, action) {
            EditStep::Typing => Vec::new(),
            EditStep::Cancelled => {
                self.editing = false;
                Vec::new()
            }
            EditStep::Accepted(_) => {
                self.editing = false;
                let Some(entry) = ctx.session.latest_set() else {
                    return Vec::new();
                };
                match self.rate.value() {
                    Some(rate) => vec![choice(entry, entry.item.pick, Some(rate))],
                    None => Vec::new(),
                }
            }
        }
    }

    fn step_model(&self, ctx: &Ctx, step: isize) -> Vec<Effect> {
        let Some(entry) = ctx.session.latest_set() else {
            return Vec::new();
        };
        let at = PICKS
            .iter()
            .position(|p| *p == entry.item.pick)
            .unwrap_or(0) as isize;
        let next = PICKS[(at + step).rem_euclid(PICKS.len() as isize) as usize];
        vec![choice(entry, next, self.rate_now(&entry.item))]
    }
}

impl CurveView {
    /// Keep pegged readings in the fit, or leave them out again: a journalled choice, so the
    /// report and a resume show the same curve.
    fn toggle_pegged(&self, ctx: &Ctx) -> Vec<Effect> {
        let Some(entry) = ctx.session.latest_set() else {
            return Vec::new();
        };
        let pegged = entry
            .item
            .curve
            .as_ref()
            .map_or(0, |c| c.left_out.len());
        if pegged == 0 && !entry.item.include_off_scale {
            return vec![Effect::Status(s::NO_PEGGED.to_string())];
        }
        let include = !entry.item.include_off_scale;
        let rate = self.rate_now(&entry.item);
        let status = if include { s::PEGGED_KEPT } else { s::PEGGED_LEFT_OUT };
        vec![
            choice_with(entry, entry.item.pick, rate, include),
            Effect::Status(status.to_string()),
        ]
    }

    fn toggle_relations(&mut self, ctx: &Ctx) -> Vec<Effect> {
        let has = ctx
            .session
            .latest_set()
            .and_then(|e| e.item.shown().as_ref().ok())
            .is_some_and(|c| c.api_rp13d.is_some());
        if !has {
            self.relations = false;
            return vec![Effect::Status(s::NO_RELATIONS.to_string())];
        }
        self.relations = !self.relations;
        Vec::new()
    }
}

/// A `choice` record: what is to be shown for the set (pegged readings as they are).
fn choice(entry: &Entry<ViscometerSet>, pick: ModelPick, rate: Option<f64>) -> Effect {
    choice_with(entry, pick, rate, entry.item.include_off_scale)
}

fn choice_with(
    entry: &Entry<ViscometerSet>,
    pick: ModelPick,
    rate: Option<f64>,
    include_off_scale: bool,
) -> Effect {
    let payload = Payload::Choice {
        set: entry.seq,
        model: pick.name().to_string(),
        shear_rate_per_s: rate,
        include_off_scale,
    };
    Effect::Journal(Draft {
        summary: summarize(&payload, entry.equipment.as_deref()),
        equipment: entry.equipment.clone(),
        payload,
    })
}

/// The shear rate of the product's apparent-viscosity limit, when it has one.
fn limit_rate(product: &crate::site::Product) -> Option<f64> {
    product.limits.iter().find_map(|l| match l.property {
        crate::site::LimitProperty::ApparentViscosity { .. } => Some(spec_rate(product)),
        _ => None,
    })
}

/// Lay out a curve's chart data, stresses in the site's stress unit.
fn chart_of(seq: u64, pick: ModelPick, curve: &FlowCurve, style: Style) -> Shown {
    let y_unit = crate::units::display_unit(Dimension::Stress, style.system);
    let to_unit = |pa: f64| crate::units::from_si(pa, y_unit, Dimension::Stress).unwrap_or(pa);
    let marks: Vec<Mark> = curve
        .points
        .iter()
        .map(|p| Mark {
            x: p.shear_rate_per_s,
            y: to_unit(p.shear_stress_pa),
            flagged: !p.flags.is_empty(),
        })
        .collect();
    let fallback = LogRange { lo: 0.0, hi: 1.0 };
    let x = LogRange::covering(marks.iter().map(|m| m.x)).unwrap_or(fallback);
    let y = LogRange::covering(marks.iter().map(|m| m.y)).unwrap_or(fallback);
    let samples = sample_curve(curve, x)
        .into_iter()
        .map(|(rate, pa)| (rate, to_unit(pa)))
        .collect();
    Shown {
        seq,
        pick,
        marks,
        samples,
        x,
        y,
        y_unit: style.text(y_unit),
        limits: None,
    }
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
    view_identity!(ID, names::CURVE, caution::CURVE, KEYS);


    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        if self.editing {
            return self.handle_editing(action, ctx);
        }
        match action {
            Action::NextModel | Action::Right => self.step_model(ctx, 1),
            Action::PrevModel | Action::Left => self.step_model(ctx, -1),
            Action::TogglePegged => self.toggle_pegged(ctx),
            Action::AutoModel => match ctx.session.latest_set() {
                Some(e) => vec![choice(e, ModelPick::Auto, self.rate_now(&e.item))],
                None => Vec::new(),
            },
            Action::ToggleRelations => self.toggle_relations(ctx),
            // A new rate is typed from scratch (Esc brings the old one back).
            Action::Activate => {
                self.rate.begin_edit();
                self.rate.clear();
                self.editing = true;
                Vec::new()
            }
            Action::Type(c) => {
                editing::start_with(&mut self.rate, c);
                self.editing = true;
                Vec::new()
            }
            _ => Vec::new(),
        }
    }

    fn refresh(&mut self, ctx: &Ctx) {
        let Some(entry) = ctx.session.latest_set() else {
            self.chart = None;
            return;
        };
        let pick = entry.item.pick;
        if self
            .chart
            .as_ref()
            .is_some_and(|c| c.seq == entry.seq && c.pick == pick)
        {
            return;
        }
        let new_set = self.chart.as_ref().is_none_or(|c| c.seq != entry.seq);
        self.chart = entry.item.shown().as_ref().ok().map(|curve| Shown {
            limits: limits_of(&entry.item, curve, ctx),
            ..chart_of(entry.seq, pick, curve, ctx.style())
        });
        // The rate chosen for the set; for a new set without one, the rate of the product's
        // apparent-viscosity limit (as `report` and `trend` use), else what the field held.
        let spec = ctx.site.product(&entry.item.product).and_then(limit_rate);
        let rate = entry
            .item
            .shear_rate_per_s
            .or(spec.filter(|_| new_set));
        if let Some(rate) = rate {
            self.rate = Field::with_text(
                FieldKind::Positive(Dimension::ShearRate),
                &crate::units::significant(rate),
            );
        }
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        let entry = ctx.session.latest_set();
        let view = curve_panel::CurveScreen {
            entry,
            chart: self.chart.as_ref(),
            rate: &self.rate,
            apparent_at: entry.and_then(|e| self.rate_now(&e.item)),
            editing: self.editing,
            relations: self.relations,
        };
        view.draw(frame, area, ctx);
    }

    fn editing(&self) -> bool {
        self.editing
    }
}
