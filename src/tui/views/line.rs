//! The Line view: for the picked line and product, pressure drop against flow from the
//! product's latest curve in this session (else the site's nominal constants) at the line's
//! temperature, with its band and the regime along it; the session's spot readings of flow
//! and pressure drop on the line as measured points, and their disagreement with the curve in
//! words. "What if" keys: the product cooler by 5 °C steps, or thicker by 10 % steps.
//!
//! Everything is worked out in `refresh` (when records are applied or the picks change) and
//! after a what-if key, from the state and the site; drawing reads the cache only.

use super::line_draw;
use super::{Effect, View, ViewId};
pub use crate::session::line_shown::{
    COOLER_STEP_K, LineShown, MAX_STEPS, THICKER_STEP, plant_pairs, regime_runs, shown_for,
};
use crate::site::Site;
use crate::tui::ctx::Ctx;
use crate::tui::keymap::{Action, Binding, Key, Scope, b};
use crate::tui::strings::line as s;
use crate::tui::strings::{caution, views as names};
use ratatui::Frame;
use ratatui::layout::Rect;
use std::cell::Cell;

/// This view's id.
pub const ID: ViewId = ViewId("line");

/// The Line view's own keys (it has no text fields).
const KEYS: &[Binding] = &[
    b(Scope::View, &[Key::Char('c')], Action::NextModel, s::KEY_COOLER),
    b(Scope::View, &[Key::Char('t')], Action::AddRow, s::KEY_THICKER),
    b(Scope::View, &[Key::Char('0')], Action::AutoModel, s::KEY_RESET),
];

#[derive(Default)]
pub struct LineView {
    cooler_steps: u32,
    thicker_steps: u32,
    shown: Option<Result<LineShown, String>>,
    /// The text panel's scroll, and how far it can go as last drawn.
    scroll: u16,
    scroll_most: Cell<u16>,
    /// Rows of the text panel as last drawn: PgUp/PgDn move by this less one.
    page: Cell<u16>,
}

impl LineView {
    pub fn new(_ctx: &Ctx) -> LineView {
        LineView {
            scroll_most: Cell::new(u16::MAX),
            page: Cell::new(4),
            ..LineView::default()
        }
    }

    pub fn shown(&self) -> Option<&Result<LineShown, String>> {
        self.shown.as_ref()
    }

    /// The answer worked out, taken out of the view (for tests).
    pub fn into_shown(self) -> Option<Result<LineShown, String>> {
        self.shown
    }

    fn work_out(&mut self, ctx: &Ctx) {
        let line = line_for(&ctx.site, ctx.picks.equipment.as_deref());
        self.shown = match (line, &ctx.picks.product) {
            (Some(l), Some(p)) => Some(
                shown_for(
                    &ctx.site,
                    &ctx.session,
                    &l,
                    p,
                    self.cooler_steps,
                    self.thicker_steps,
                )
                .map_err(|e| e.to_string()),
            ),
            (None, _) => Some(Err(s::NO_LINE.to_string())),
            (_, None) => Some(Err(s::NEED_PRODUCT.to_string())),
        };
    }
}

/// The picked line, or the picked pump's line, else the first line.
pub fn line_for(site: &Site, picked: Option<&str>) -> Option<String> {
    let from_pick = picked.and_then(|id| {
        site.line(id)
            .map(|l| l.id.clone())
            .or_else(|| site.pump(id).map(|p| p.feeds.clone()))
    });
    from_pick.or_else(|| site.lines.first().map(|l| l.id.clone()))
}

impl View for LineView {
    view_identity!(ID, names::LINE, caution::LINE, KEYS);

    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect> {
        match action {
            Action::NextModel => self.cooler_steps = (self.cooler_steps + 1).min(MAX_STEPS),
            Action::AddRow => self.thicker_steps = (self.thicker_steps + 1).min(MAX_STEPS),
            Action::AutoModel | Action::Type('0') => {
                self.cooler_steps = 0;
                self.thicker_steps = 0;
            }
            Action::PageUp => {
                self.scroll = self.scroll.saturating_sub(self.page.get());
                return Vec::new();
            }
            Action::PageDown => {
                let to = self.scroll.saturating_add(self.page.get());
                self.scroll = to.min(self.scroll_most.get());
                return Vec::new();
            }
            Action::Home => {
                self.scroll = 0;
                return Vec::new();
            }
            Action::End => {
                self.scroll = self.scroll_most.get();
                return Vec::new();
            }
            _ => return Vec::new(),
        }
        self.work_out(ctx);
        Vec::new()
    }

    fn refresh(&mut self, ctx: &Ctx) {
        self.work_out(ctx);
    }

    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx) {
        line_draw::draw(
            frame,
            area,
            ctx,
            line_draw::LineScreen {
                shown: self.shown.as_ref(),
                cooler_k: COOLER_STEP_K * f64::from(self.cooler_steps),
                thicker: THICKER_STEP * f64::from(self.thicker_steps),
                scroll: self.scroll,
                scroll_most: &self.scroll_most,
                page: &self.page,
            },
        );
    }
}
