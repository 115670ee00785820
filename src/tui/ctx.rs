//! What every view may read: the site, who is working, what was picked, the live session
//! state (every record the journal has numbered, applied as it comes back from the writer
//! thread), the journal link's state, the clock (as last told), the theme and the
//! presentation style. Views change it only by returning effects, which the app applies.

use super::session_log::SessionLog;
use super::theme::{Glyphs, Theme};
use crate::present::Style;
use crate::session::SessionState;
use crate::site::{EquipmentKind, Site};
use chrono::{DateTime, FixedOffset};

/// The sample point and product new readings are filed under.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct Picks {
    pub equipment: Option<String>,
    pub product: Option<String>,
}

/// The session clock: when it began and the time at the last tick.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct SessionClock {
    pub started: DateTime<FixedOffset>,
    pub now: DateTime<FixedOffset>,
}

impl SessionClock {
    /// "0:12:31": how long the session has run.
    pub fn elapsed_text(&self) -> String {
        let secs = (self.now - self.started).num_seconds().max(0);
        format!("{}:{:02}:{:02}", secs / 3600, secs / 60 % 60, secs % 60)
    }
}

pub struct Ctx {
    pub site: Site,
    pub operator: String,
    pub picks: Picks,
    /// The session as the journal holds it; every view derives what it shows from this.
    pub session: SessionState,
    /// What is in flight to the journal and how far the disk has got.
    pub log: SessionLog,
    pub clock: SessionClock,
    pub theme: Theme,
    /// The journal file, for the Journal view's title.
    pub journal_path: String,
}

impl Ctx {
    /// How numbers and symbols are shown: the site's units, ASCII when the theme is.
    pub fn style(&self) -> Style {
        Style::new(self.site.unit_system, self.theme.glyphs == Glyphs::Ascii)
    }

    /// Records sent but not known to be on disk.
    pub fn unsaved(&self) -> usize {
        self.log.unsaved(&self.session)
    }

    /// Sample points: everything on the site but the viscometers themselves.
    pub fn sample_points(&self) -> Vec<(&str, EquipmentKind, &str)> {
        let s = &self.site;
        let lines = s
            .lines
            .iter()
            .map(|x| (x.id.as_str(), EquipmentKind::Line, x.description.as_str()));
        let pumps = s
            .pumps
            .iter()
            .map(|x| (x.id.as_str(), EquipmentKind::Pump, x.description.as_str()));
        let tanks = s
            .tanks
            .iter()
            .map(|x| (x.id.as_str(), EquipmentKind::Tank, x.description.as_str()));
        tanks.chain(lines).chain(pumps).collect()
    }
}

#[cfg(test)]
mod tests {
    use super::SessionClock;
    use chrono::DateTime;

    #[test]
    fn elapsed_time_reads_as_hours_minutes_seconds() {
        let t = |s| DateTime::parse_from_rfc3339(s).unwrap_or_default();
        let c = SessionClock {
            started: t("2026-12-01T06:00:00+01:00"),
            now: t("2026-12-01T07:12:31+01:00"),
        };
        assert_eq!(c.elapsed_text(), "1:12:31");
        let backwards = SessionClock {
            started: c.now,
            now: c.started,
        };
        assert_eq!(backwards.elapsed_text(), "0:00:00");
    }
}
