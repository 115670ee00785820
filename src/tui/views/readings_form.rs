//! The viscometer-set form: its fields, where the focus is, how it moves, and turning the
//! typed text into a checked set.

use crate::instrument::{Geometry, STANDARD_SPEEDS_RPM};
use crate::journal::DialRow;
use crate::tui::strings::readings as s;
use crate::tui::widgets::field::{Checked, Field, FieldKind};
use crate::units::Dimension;

/// Most reading rows a set holds (fits the form at 80×24).
pub const MAX_ROWS: usize = 10;
const NOTES_MAX_CHARS: usize = 300;
/// rad/s per rpm (definition of the revolution per minute).
pub(super) const RAD_S_PER_RPM: f64 = std::f64::consts::PI / 30.0;

/// One reading row: rotor speed and dial value.
#[derive(Debug, Clone, PartialEq)]
pub struct Row {
    pub speed: Field,
    pub dial: Field,
}

impl Row {
    fn new(speed: &str) -> Row {
        Row {
            speed: Field::with_text(FieldKind::Positive(Dimension::Speed), speed),
            dial: Field::new(FieldKind::Quantity(Dimension::Dimensionless)),
        }
    }
}

/// Which part of the form has the focus.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Focus {
    Viscometer,
    Temperature,
    Speed(usize),
    Dial(usize),
    Notes,
    /// The "Save set" line: Enter on it journals the set.
    Save,
}

impl Focus {
    /// Where the focus is, in words for the status line.
    pub fn describe(self) -> String {
        match self {
            Focus::Viscometer => s::VISCOMETER.to_string(),
            Focus::Temperature => s::TEMPERATURE.to_string(),
            Focus::Speed(i) => format!("{} {} {}", s::ROW, i + 1, s::SPEED.to_lowercase()),
            Focus::Dial(i) => format!("{} {} {}", s::ROW, i + 1, s::DIAL.to_lowercase()),
            Focus::Notes => s::NOTES.to_string(),
            Focus::Save => s::SAVE_LINE.to_string(),
        }
    }
}

/// A set that passed every check, ready for the journal.
#[derive(Debug, Clone, PartialEq)]
pub struct CheckedSet {
    pub rows: Vec<DialRow>,
    pub temperature: Option<(String, f64)>,
    pub notes: Option<String>,
}

/// Why a set cannot be saved, and which field to go to.
#[derive(Debug, Clone, PartialEq)]
pub struct Refusal {
    pub focus: Focus,
    pub message: String,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Form {
    pub viscometer: usize,
    pub temperature: Field,
    pub rows: Vec<Row>,
    pub notes: Field,
    pub focus: Focus,
    /// The instrument reads at fixed speeds (the standard six-speed): Tab goes dial to dial.
    pub fixed_speeds: bool,
    /// The focused field was entered by Tab or an arrow: its text is selected and the next
    /// printable key replaces it.
    pub replace_next: bool,
}

/// The speeds a geometry is usually read at, as typed text.
fn usual_speeds(geometry: Option<&Geometry>) -> Vec<String> {
    match geometry {
        Some(Geometry::StandardSixSpeed) => {
            STANDARD_SPEEDS_RPM.iter().map(|r| r.to_string()).collect()
        }
        _ => vec![String::new(); 6],
    }
}

impl Form {
    pub fn new(viscometer: usize, geometry: Option<&Geometry>) -> Form {
        Form {
            viscometer,
            temperature: Field::new(FieldKind::Quantity(Dimension::Temperature)),
            rows: usual_speeds(geometry)
                .iter()
                .map(|sp| Row::new(sp))
                .collect(),
            notes: Field::new(FieldKind::Text(NOTES_MAX_CHARS)),
            focus: Focus::Dial(0),
            fixed_speeds: matches!(geometry, Some(Geometry::StandardSixSpeed)),
            replace_next: false,
        }
    }

    /// A fresh form for the next set: same viscometer, usual speeds, nothing else.
    pub fn reset(&mut self, geometry: Option<&Geometry>) {
        *self = Form::new(self.viscometer, geometry);
    }

    /// Switch viscometer. Typed dials are always kept, and so are the speeds once a dial is
    /// typed (they were read together); otherwise speeds still at the old instrument's usual
    /// values take the new one's (cleared where it has none). True when the speeds changed,
    /// for the status line.
    pub fn set_viscometer(
        &mut self,
        index: usize,
        old: Option<&Geometry>,
        new: Option<&Geometry>,
    ) -> bool {
        self.viscometer = index;
        self.fixed_speeds = matches!(new, Some(Geometry::StandardSixSpeed));
        let typed: Vec<&str> = self.rows.iter().map(|r| r.speed.text()).collect();
        let usual_old: Vec<String> = usual_speeds(old);
        let same =
            typed.len() == usual_old.len() && typed.iter().zip(&usual_old).all(|(a, b)| a == b);
        let new_speeds = usual_speeds(new);
        if !same || new_speeds == usual_old || self.dials_typed() > 0 {
            return false;
        }
        for (row, speed) in self.rows.iter_mut().zip(new_speeds) {
            row.speed.set_text(&speed);
        }
        true
    }

    /// How many rows have a dial typed.
    pub fn dials_typed(&self) -> usize {
        self.rows.iter().filter(|r| !r.dial.is_empty()).count()
    }

    pub fn field_mut(&mut self, focus: Focus) -> Option<&mut Field> {
        match focus {
            Focus::Viscometer | Focus::Save => None,
            Focus::Temperature => Some(&mut self.temperature),
            Focus::Speed(i) => self.rows.get_mut(i).map(|r| &mut r.speed),
            Focus::Dial(i) => self.rows.get_mut(i).map(|r| &mut r.dial),
            Focus::Notes => Some(&mut self.notes),
        }
    }

    pub fn field(&self, focus: Focus) -> Option<&Field> {
        match focus {
            Focus::Viscometer | Focus::Save => None,
            Focus::Temperature => Some(&self.temperature),
            Focus::Speed(i) => self.rows.get(i).map(|r| &r.speed),
            Focus::Dial(i) => self.rows.get(i).map(|r| &r.dial),
            Focus::Notes => Some(&self.notes),
        }
    }

    /// Every focus stop in Tab order. On a fixed-speed instrument the speeds are left out,
    /// so Tab goes from dial to dial and never into a speed.
    fn order(&self) -> Vec<Focus> {
        let mut v = vec![Focus::Viscometer, Focus::Temperature];
        for i in 0..self.rows.len() {
            if !self.fixed_speeds {
                v.push(Focus::Speed(i));
            }
            v.push(Focus::Dial(i));
        }
        v.extend([Focus::Notes, Focus::Save]);
        v
    }

    /// The focus's place in Tab order (a speed reached by column keys counts as its dial).
    fn place(&self, order: &[Focus]) -> usize {
        let at = match self.focus {
            Focus::Speed(i) if self.fixed_speeds => Focus::Dial(i),
            other => other,
        };
        order.iter().position(|f| *f == at).unwrap_or(0)
    }

    /// Tab: from a dial to the next row's dial (to its speed only on an instrument without
    /// fixed speeds whose next speed is still empty), so Tab never lands in a speed that
    /// already holds a value.
    pub fn next(&mut self) {
        let rows = self.rows.len();
        if let Focus::Dial(i) | Focus::Speed(i) = self.focus {
            let from_speed = matches!(self.focus, Focus::Speed(_));
            self.focus = match (from_speed, i + 1 < rows) {
                (true, _) => Focus::Dial(i),
                (false, true) if self.fixed_speeds || !self.rows[i + 1].speed.is_empty() => {
                    Focus::Dial(i + 1)
                }
                (false, true) => Focus::Speed(i + 1),
                (false, false) => Focus::Notes,
            };
            return;
        }
        let order = self.order();
        let at = self.place(&order);
        self.focus = order[(at + 1).min(order.len() - 1)];
    }

    pub fn prev(&mut self) {
        let order = self.order();
        let at = self.place(&order);
        self.focus = order[at.saturating_sub(1)];
    }

    /// To the speed (`true`) or dial column of the same row; elsewhere nothing moves.
    pub fn go_to_column(&mut self, speed: bool) {
        self.focus = match (self.focus, speed) {
            (Focus::Dial(i), true) => Focus::Speed(i),
            (Focus::Speed(i), false) => Focus::Dial(i),
            (other, _) => other,
        };
    }

    /// Down a line, keeping the column inside the table.
    pub fn down(&mut self) {
        let last = self.rows.len().saturating_sub(1);
        self.focus = match self.focus {
            Focus::Viscometer => Focus::Temperature,
            Focus::Temperature => Focus::Dial(0),
            Focus::Speed(i) if i < last => Focus::Speed(i + 1),
            Focus::Dial(i) if i < last => Focus::Dial(i + 1),
            Focus::Speed(_) | Focus::Dial(_) => Focus::Notes,
            Focus::Notes | Focus::Save => Focus::Save,
        };
    }

    pub fn up(&mut self) {
        let last = self.rows.len().saturating_sub(1);
        self.focus = match self.focus {
            Focus::Viscometer | Focus::Temperature => Focus::Viscometer,
            Focus::Speed(0) | Focus::Dial(0) => Focus::Temperature,
            Focus::Speed(i) => Focus::Speed(i - 1),
            Focus::Dial(i) => Focus::Dial(i - 1),
            Focus::Notes => Focus::Dial(last),
            Focus::Save => Focus::Notes,
        };
    }

    pub fn add_row(&mut self) -> Result<(), &'static str> {
        if self.rows.len() >= MAX_ROWS {
            return Err(s::MAX_ROWS);
        }
        let at = match self.focus {
            Focus::Speed(i) | Focus::Dial(i) => i + 1,
            _ => self.rows.len(),
        };
        self.rows.insert(at, Row::new(""));
        self.focus = Focus::Speed(at);
        Ok(())
    }

    pub fn remove_row(&mut self) -> Result<(), &'static str> {
        let (Focus::Speed(i) | Focus::Dial(i)) = self.focus else {
            return Ok(());
        };
        if self.rows.len() <= 1 {
            return Err(s::MIN_ROWS);
        }
        self.rows.remove(i);
        let i = i.min(self.rows.len() - 1);
        self.focus = match self.focus {
            Focus::Speed(_) => Focus::Speed(i),
            _ => Focus::Dial(i),
        };
        Ok(())
    }

    /// Anything typed that a quit would lose (the prefilled speeds do not count).
    pub fn has_input(&self) -> bool {
        !self.temperature.is_empty()
            || !self.notes.is_empty()
            || self.rows.iter().any(|r| !r.dial.is_empty())
    }

    /// Check the whole form; the first problem found is reported with where it is.
    pub fn check(&self) -> Result<CheckedSet, Refusal> {
        let refuse = |focus, message: String| Refusal { focus, message };
        let temperature = match self.temperature.checked() {
            Checked::Value(k) => Some((self.temperature.text().trim().to_string(), *k)),
            Checked::Invalid(m) => {
                return Err(refuse(
                    Focus::Temperature,
                    format!("{}: {m}", s::TEMPERATURE),
                ));
            }
            _ => None,
        };
        let mut rows = Vec::new();
        for (i, row) in self.rows.iter().enumerate() {
            if let Some(r) = check_row(i, row)? {
                rows.push(r);
            }
        }
        if rows.is_empty() {
            return Err(refuse(Focus::Dial(0), s::NEED_READING.to_string()));
        }
        let notes = (!self.notes.is_empty()).then(|| self.notes.text().trim().to_string());
        Ok(CheckedSet {
            rows,
            temperature,
            notes,
        })
    }
}

/// One row: `None` when it has no dial reading (an unused speed).
fn check_row(i: usize, row: &Row) -> Result<Option<DialRow>, Refusal> {
    let at = |focus, what: &str, msg: &str| Refusal {
        focus,
        message: format!("{} {} {what}: {msg}", s::ROW, i + 1),
    };
    let dial = match row.dial.checked() {
        Checked::Empty | Checked::Text => return Ok(None),
        Checked::Invalid(m) => return Err(at(Focus::Dial(i), s::DIAL, m)),
        Checked::Value(d) if *d < 0.0 => return Err(at(Focus::Dial(i), s::DIAL, s::NEGATIVE_DIAL)),
        Checked::Value(d) => *d,
    };
    let rad_s = match row.speed.checked() {
        Checked::Value(v) => *v,
        Checked::Invalid(m) => return Err(at(Focus::Speed(i), s::SPEED, m)),
        _ => return Err(at(Focus::Speed(i), s::SPEED, s::DIAL_NEEDS_SPEED)),
    };
    Ok(Some(DialRow {
        rpm_raw: row.speed.text().trim().to_string(),
        rpm: rad_s / RAD_S_PER_RPM,
        dial_raw: row.dial.text().trim().to_string(),
        dial,
    }))
}
