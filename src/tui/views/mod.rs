//! The views and the seam for new ones: a view is one file implementing [`View`] plus one
//! line in [`all`] (and one `ViewId` variant if it has keys of its own in the key map).
//! Later views (lines and restart, pumps, tanks, findings) plug in here.

mod curve;
mod curve_panel;
mod journal;
mod readings;
mod readings_draw;
mod readings_form;
mod site;

use super::ctx::Ctx;
use super::keymap::Action;
use super::strings::{caution, views as names};
use crate::journal::Payload;
use ratatui::Frame;
use ratatui::layout::Rect;

pub use curve::CurveView;
pub use journal::JournalView;
pub use readings::ReadingsView;
pub use site::SiteView;

/// Which view; the key map uses it to scope a view's own keys.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ViewId {
    Site,
    Readings,
    Curve,
    Journal,
}

impl ViewId {
    pub fn title(self) -> &'static str {
        match self {
            ViewId::Site => names::SITE,
            ViewId::Readings => names::READINGS,
            ViewId::Curve => names::CURVE,
            ViewId::Journal => names::JOURNAL,
        }
    }

    /// The one-line caution shown under the view.
    pub fn caution(self) -> &'static str {
        match self {
            ViewId::Site => caution::SITE,
            ViewId::Readings => caution::READINGS,
            ViewId::Curve => caution::CURVE,
            ViewId::Journal => caution::JOURNAL,
        }
    }
}

/// A record for the journal, with the line the Journal view shows for it.
#[derive(Debug, Clone, PartialEq)]
pub struct Draft {
    pub equipment: Option<String>,
    pub payload: Payload,
    pub summary: String,
}

/// What a view asks the app to do after handling a key.
#[derive(Debug, Clone, PartialEq)]
pub enum Effect {
    /// A line for the status bar.
    Status(String),
    PickEquipment(String),
    PickProduct(String),
    Journal(Draft),
    Show(ViewId),
}

/// One screen of the UI. Each view owns its own state (cursors, fields, results).
pub trait View {
    fn id(&self) -> ViewId;

    /// React to a key; anything outside the view's own state is returned as effects.
    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect>;

    /// The live session state changed (records applied): bring anything derived from it up
    /// to date here, so drawing stays free of computation.
    fn refresh(&mut self, _ctx: &Ctx) {}

    /// Draw from state only: no I/O, no fitting.
    fn render(&self, frame: &mut Frame, area: Rect, ctx: &Ctx);

    /// Whether a field is being typed into (the key map then has editing keys).
    fn editing(&self) -> bool {
        false
    }

    /// Why quitting now would lose something typed, if it would.
    fn unsaved_input(&self) -> Option<&'static str> {
        None
    }
}

/// Every view, in tab order. Adding a view is one line here.
pub fn all(ctx: &Ctx) -> Vec<Box<dyn View>> {
    vec![
        Box::new(SiteView::new(ctx)),
        Box::new(ReadingsView::new(ctx)),
        Box::new(CurveView::new()),
        Box::new(JournalView::default()),
    ]
}
