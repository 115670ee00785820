//! One way to show a number: every quantity, interval, parameter, verdict and reason that a
//! person reads, worded once for both faces (the screens, `fit`, `report`, `trend`).
//!
//! The engine and the session return facts (values in SI, intervals, which model and why,
//! limits in or out); this layer turns them into text in the site's unit system, with
//! sensible significant figures, temperatures in °C or °F, one minus sign ('-'), and an
//! ASCII spelling of every symbol when asked (`--ascii`, `TERM=dumb`). Pure: no terminal,
//! no disk, no clock.

pub mod findings;
mod glyph;
pub mod json;
pub mod limits;
mod number;
mod param;
pub mod reason;
pub mod relations;
pub mod restart_json;
pub mod spot;

pub use glyph::ascii_fold;
pub use number::{interval, quantity, r_squared, range, value_pm};
pub use param::{estimate, param_text, param_unit, symbol};

use crate::units::UnitSystem;

/// How text is shown: the site's unit system and whether only ASCII may be printed.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct Style {
    pub system: UnitSystem,
    pub ascii: bool,
}

impl Style {
    /// SI units, Unicode symbols (the JSON outputs' `reason` text, tests).
    pub const SI: Style = Style {
        system: UnitSystem::Si,
        ascii: false,
    };

    pub fn new(system: UnitSystem, ascii: bool) -> Style {
        Style { system, ascii }
    }

    /// Any text as this style prints it: folded to ASCII when asked, else unchanged.
    pub fn text(&self, s: &str) -> String {
        if self.ascii {
            ascii_fold(s)
        } else {
            s.to_string()
        }
    }
}
