//! The Restart view's form: the line and pump pickers, rested-gel readings (rest time and
//! gel stress per row), how long the line has stood, and a Save line; where the focus is,
//! how it moves, and the typed text checked into readings.

use crate::tui::strings::restart as s;
use crate::tui::widgets::field::{Checked, Field, FieldKind};
use crate::units::Dimension;

/// Reading rows on the form (the usual three rests and room for two more).
pub const GEL_ROWS: usize = 5;
/// The rests the usual rested-gel procedure reads at (common practice, no source).
const USUAL_RESTS: [&str; 3] = ["10 s", "10 min", "30 min"];

/// Which part of the form has the focus.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Focus {
    Line,
    Pump,
    Rest(usize),
    Gel(usize),
    Stop,
    Save,
}

impl Focus {
    /// Whether the focus is on a text field (which then owns every printable key).
    pub fn is_field(self) -> bool {
        matches!(self, Focus::Rest(_) | Focus::Gel(_) | Focus::Stop)
    }
}

#[derive(Debug, Clone, PartialEq)]
pub struct GelRow {
    pub rest: Field,
    pub gel: Field,
}

/// A value as typed and in SI.
#[derive(Debug, Clone, PartialEq)]
pub struct Typed {
    pub raw: String,
    pub si: f64,
}

/// One reading that passed the checks.
#[derive(Debug, Clone, PartialEq)]
pub struct CheckedGel {
    pub rest: Typed,
    pub gel: Typed,
}

/// The form's content, checked.
#[derive(Debug, Clone, PartialEq)]
pub struct CheckedForm {
    pub readings: Vec<CheckedGel>,
    pub stop: Option<Typed>,
}

/// Why the form cannot be saved, and where to go.
#[derive(Debug, Clone, PartialEq)]
pub struct Refusal {
    pub focus: Focus,
    pub message: String,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Form {
    pub rows: Vec<GelRow>,
    pub stop: Field,
    pub focus: Focus,
}

impl Default for Form {
    fn default() -> Self {
        Form::new()
    }
}

impl Form {
    pub fn new() -> Form {
        let rows = (0..GEL_ROWS)
            .map(|i| GelRow {
                rest: Field::with_text(
                    FieldKind::Quantity(Dimension::Time),
                    USUAL_RESTS.get(i).copied().unwrap_or(""),
                ),
                gel: Field::new(FieldKind::Quantity(Dimension::Stress)),
            })
            .collect();
        Form {
            rows,
            stop: Field::new(FieldKind::Quantity(Dimension::Time)),
            // Not on a field: Tab still walks the views until the operator moves in.
            focus: Focus::Line,
        }
    }

    pub fn field(&self, focus: Focus) -> Option<&Field> {
        match focus {
            Focus::Rest(i) => self.rows.get(i).map(|r| &r.rest),
            Focus::Gel(i) => self.rows.get(i).map(|r| &r.gel),
            Focus::Stop => Some(&self.stop),
            Focus::Line | Focus::Pump | Focus::Save => None,
        }
    }

    pub fn field_mut(&mut self, focus: Focus) -> Option<&mut Field> {
        match focus {
            Focus::Rest(i) => self.rows.get_mut(i).map(|r| &mut r.rest),
            Focus::Gel(i) => self.rows.get_mut(i).map(|r| &mut r.gel),
            Focus::Stop => Some(&mut self.stop),
            Focus::Line | Focus::Pump | Focus::Save => None,
        }
    }

    /// Every focus stop in reading order (Tab order).
    fn order(&self) -> Vec<Focus> {
        let mut v = vec![Focus::Line, Focus::Pump];
        for i in 0..self.rows.len() {
            v.extend([Focus::Rest(i), Focus::Gel(i)]);
        }
        v.extend([Focus::Stop, Focus::Save]);
        v
    }

    /// Move the focus, remembering the new field's text so Esc can bring it back.
    fn go(&mut self, to: Focus) {
        self.focus = to;
        if let Some(f) = self.field_mut(to) {
            f.begin_edit();
        }
    }

    pub fn focus_on(&mut self, to: Focus) {
        self.go(to);
    }

    pub fn next(&mut self) {
        let order = self.order();
        let at = order.iter().position(|f| *f == self.focus).unwrap_or(0);
        self.go(order[(at + 1).min(order.len() - 1)]);
    }

    pub fn prev(&mut self) {
        let order = self.order();
        let at = order.iter().position(|f| *f == self.focus).unwrap_or(0);
        self.go(order[at.saturating_sub(1)]);
    }

    /// Down a line, keeping the column inside the table.
    pub fn down(&mut self) {
        let last = self.rows.len().saturating_sub(1);
        let to = match self.focus {
            Focus::Line => Focus::Pump,
            Focus::Pump => Focus::Gel(0),
            Focus::Rest(i) if i < last => Focus::Rest(i + 1),
            Focus::Gel(i) if i < last => Focus::Gel(i + 1),
            Focus::Rest(_) | Focus::Gel(_) => Focus::Stop,
            Focus::Stop | Focus::Save => Focus::Save,
        };
        self.go(to);
    }

    pub fn up(&mut self) {
        let last = self.rows.len().saturating_sub(1);
        let to = match self.focus {
            Focus::Line | Focus::Pump => Focus::Line,
            Focus::Rest(0) | Focus::Gel(0) => Focus::Pump,
            Focus::Rest(i) => Focus::Rest(i - 1),
            Focus::Gel(i) => Focus::Gel(i - 1),
            Focus::Stop => Focus::Gel(last),
            Focus::Save => Focus::Stop,
        };
        self.go(to);
    }

    /// Anything typed that a quit would lose (the prefilled rest times do not count).
    pub fn has_input(&self) -> bool {
        !self.stop.is_empty() || self.rows.iter().any(|r| !r.gel.is_empty())
    }

    /// A fresh form after a save, the focus on the Save line.
    pub fn reset(&mut self) {
        *self = Form::new();
        self.focus = Focus::Save;
    }

    /// Check the whole form; the first problem found is reported with where it is.
    pub fn check(&self) -> Result<CheckedForm, Refusal> {
        let mut readings = Vec::new();
        for (i, row) in self.rows.iter().enumerate() {
            if let Some(r) = check_row(i, row)? {
                readings.push(r);
            }
        }
        if readings.len() < 2 {
            return Err(Refusal {
                focus: Focus::Gel(readings.len().min(GEL_ROWS - 1)),
                message: s::NEED_READINGS.to_string(),
            });
        }
        let stop = match typed(&self.stop) {
            Ok(v) => v,
            Err(m) => {
                return Err(Refusal {
                    focus: Focus::Stop,
                    message: format!("{}: {m}", s::STOPPED),
                });
            }
        };
        Ok(CheckedForm { readings, stop })
    }
}

/// A field's value, `None` when empty; the problem in words when it is not a value.
fn typed(field: &Field) -> Result<Option<Typed>, String> {
    match field.checked() {
        Checked::Empty => Ok(None),
        Checked::Value(v) if *v < 0.0 => Err(s::NEGATIVE.to_string()),
        Checked::Value(v) => Ok(Some(Typed {
            raw: field.text().trim().to_string(),
            si: *v,
        })),
        Checked::Invalid(m) => Err(m.clone()),
        Checked::Text => Err(s::NEGATIVE.to_string()),
    }
}

/// One row: `None` when it has no gel stress (a usual rest time left unread).
fn check_row(i: usize, row: &GelRow) -> Result<Option<CheckedGel>, Refusal> {
    let at = |focus, what: &str, msg: &str| Refusal {
        focus,
        message: format!("{} {} {what}: {msg}", s::ROW, i + 1),
    };
    let gel = typed(&row.gel).map_err(|m| at(Focus::Gel(i), s::GEL, &m))?;
    let rest = typed(&row.rest).map_err(|m| at(Focus::Rest(i), s::REST, &m))?;
    match (rest, gel) {
        (_, None) => Ok(None),
        (Some(rest), Some(gel)) => Ok(Some(CheckedGel { rest, gel })),
        (None, Some(_)) => Err(at(Focus::Rest(i), s::REST, s::BOTH_NEEDED)),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn typed_in(form: &mut Form, focus: Focus, text: &str) {
        if let Some(f) = form.field_mut(focus) {
            f.set_text(text);
        }
    }

    #[test]
    fn three_readings_check_into_si() {
        let mut f = Form::new();
        typed_in(&mut f, Focus::Gel(0), "150");
        typed_in(&mut f, Focus::Gel(1), "260 Pa");
        typed_in(&mut f, Focus::Gel(2), "0.38 kPa");
        typed_in(&mut f, Focus::Stop, "62 h");
        let c = f.check().unwrap();
        assert_eq!(c.readings.len(), 3);
        // 10 min = 600 s, 30 min = 1800 s; 0.38 kPa = 380 Pa; 62 h = 223 200 s (definitions).
        let rests: Vec<f64> = c.readings.iter().map(|r| r.rest.si).collect();
        assert_eq!(rests, [10.0, 600.0, 1800.0]);
        assert!((c.readings[2].gel.si - 380.0).abs() < 1e-9);
        assert_eq!(c.readings[1].gel.raw, "260 Pa");
        assert!((c.stop.map_or(0.0, |s| s.si) - 223_200.0).abs() < 1e-6);
    }

    #[test]
    fn what_is_wrong_is_said_with_where() {
        let mut f = Form::new();
        typed_in(&mut f, Focus::Gel(0), "150");
        let r = f.check().unwrap_err();
        assert_eq!(r.message, s::NEED_READINGS);
        typed_in(&mut f, Focus::Gel(1), "2 bar/s");
        let r = f.check().unwrap_err();
        assert_eq!(r.focus, Focus::Gel(1));
        assert!(r.message.starts_with("row 2 gel stress:"), "{}", r.message);
        typed_in(&mut f, Focus::Gel(1), "200");
        typed_in(&mut f, Focus::Rest(1), "-3 min");
        let r = f.check().unwrap_err();
        assert_eq!(r.focus, Focus::Rest(1));
        assert!(r.message.contains("negative"), "{}", r.message);
        typed_in(&mut f, Focus::Rest(1), "");
        assert_eq!(
            f.check().unwrap_err().message,
            "row 2 rest time: needs both a rest time and a gel stress"
        );
    }

    #[test]
    fn the_focus_walks_the_form_in_reading_order() {
        let mut f = Form::new();
        f.focus_on(Focus::Pump);
        f.down();
        assert_eq!(f.focus, Focus::Gel(0));
        f.prev();
        assert_eq!(f.focus, Focus::Rest(0));
        for _ in 0..(2 * GEL_ROWS) {
            f.next();
        }
        assert_eq!(f.focus, Focus::Stop);
        f.next();
        f.next();
        assert_eq!(f.focus, Focus::Save);
        f.up();
        assert_eq!(f.focus, Focus::Stop);
        assert!(!f.has_input());
    }
}
