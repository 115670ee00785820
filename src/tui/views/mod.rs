//! The views and the seam for new ones: a view is one file implementing [`View`] (its id,
//! title, caution and its own key bindings beside its code) plus one line in the `views!`
//! list below. Helper files a view splits off are declared as plain modules.

mod curve_panel;
mod findings_draw;
mod guided_draw;
mod line_draw;
mod readings_draw;
mod readings_form;
mod readings_preview;
mod restart_draw;
pub mod restart_form;
mod restart_journal;
mod tank_draw;
pub mod tank_form;
mod tank_sketch;
mod tank_text;
mod text_rows;

use super::ctx::Ctx;
use super::keymap::{Action, Binding};
use crate::journal::{Payload, Record};
use ratatui::Frame;
use ratatui::layout::Rect;

/// The keys of a view that is one form of fields owning their keys: Ctrl-S saves from
/// anywhere, Enter saves on the Save line (else goes to the next field).
pub const FORM_KEYS: &[Binding] = &[
    super::keymap::b(
        super::keymap::Scope::ViewTyping,
        &[super::keymap::Key::Ctrl('s')],
        Action::Save,
        super::strings::keys::SAVE_FORM,
    ),
    super::keymap::b(
        super::keymap::Scope::View,
        &[super::keymap::Key::Enter],
        Action::Activate,
        super::strings::keys::SAVE_OR_NEXT,
    ),
];

/// Which view: a short name, used to scope keys, switch views and in tests.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct ViewId(pub &'static str);

/// A record for the journal, with the line the Journal view shows for it.
#[derive(Debug, Clone, PartialEq)]
pub struct Draft {
    pub equipment: Option<String>,
    pub payload: Payload,
    pub summary: String,
}

impl Draft {
    /// A record about `equipment` (if any), with its Journal-view line.
    pub fn new(payload: Payload, equipment: Option<String>) -> Draft {
        Draft {
            summary: super::session_log::summarize(&payload, equipment.as_deref()),
            equipment,
            payload,
        }
    }
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

    /// The tab's name.
    fn title(&self) -> &'static str;

    /// The one-line caution shown under the view.
    fn caution(&self) -> &'static str;

    /// The view's own key bindings (the footer and the help read them too).
    fn keys(&self) -> &'static [Binding] {
        &[]
    }

    /// React to a key; anything outside the view's own state is returned as effects.
    fn handle(&mut self, action: Action, ctx: &Ctx) -> Vec<Effect>;

    /// The live session state changed (records applied): bring anything derived from it up
    /// to date here, so drawing stays free of computation.
    fn refresh(&mut self, _ctx: &Ctx) {}

    /// A record the journal numbered was just applied to the state: a view that sent it may
    /// answer (a result linked to it, as the app does for a viscometer set).
    fn answer(&mut self, _record: &Record, _ctx: &Ctx) -> Vec<Effect> {
        Vec::new()
    }

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

/// A view's fixed identity inside its `impl View`: its id, tab name, caution line and key
/// table, when all four are constants (views whose keys follow their state write `keys`).
macro_rules! view_identity {
    ($id:expr, $title:expr, $caution:expr, $keys:expr) => {
        fn id(&self) -> ViewId {
            $id
        }

        fn title(&self) -> &'static str {
            $title
        }

        fn caution(&self) -> &'static str {
            $caution
        }

        fn keys(&self) -> &'static [Binding] {
            $keys
        }
    };
}

/// Declares each view's module and builds them all in tab order.
macro_rules! views {
    ($($module:ident :: $view:ident),* $(,)?) => {
        $(pub mod $module;)*

        /// Every view, in tab order.
        pub fn all(ctx: &Ctx) -> Vec<Box<dyn View>> {
            vec![$(Box::new($module::$view::new(ctx))),*]
        }
    };
}

// Adding a view is one file plus one line here.
views! {
    site::SiteView,
    readings::ReadingsView,
    spot::SpotView,
    curve::CurveView,
    line::LineView,
    restart::RestartView,
    tank::TankView,
    guided::GuidedView,
    findings::FindingsView,
    journal::JournalView,
}
