//! The Tank view's form: the tank picker, today's readings (agitator speed, motor current,
//! supply voltage, product temperature) and a Save line; where the focus is, how it moves,
//! and the typed text checked into readings named as the reading catalogue names them.

use crate::tui::strings::tank as s;
use crate::tui::widgets::field::{Checked, Field, FieldKind};
use crate::units::Dimension;

/// The reading fields, top to bottom: (catalogue name, label, what the field holds).
pub const FIELDS: [(&str, &str, FieldKind); 4] = [
    (
        "agitator-speed",
        s::SPEED,
        FieldKind::Positive(Dimension::Speed),
    ),
    (
        "motor-current",
        s::CURRENT,
        FieldKind::Quantity(Dimension::Current),
    ),
    (
        "voltage",
        s::VOLTAGE,
        FieldKind::Quantity(Dimension::Voltage),
    ),
    (
        "temperature",
        s::TEMPERATURE,
        FieldKind::Quantity(Dimension::Temperature),
    ),
];

/// Which part of the form has the focus.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Focus {
    Tank,
    Field(usize),
    Save,
}

impl Focus {
    /// Whether the focus is on a text field (which then owns every printable key).
    pub fn is_field(self) -> bool {
        matches!(self, Focus::Field(_))
    }
}

/// One reading that passed the checks: its catalogue name, the text as typed, SI value.
#[derive(Debug, Clone, PartialEq)]
pub struct TypedReading {
    pub name: &'static str,
    pub raw: String,
    pub si: f64,
}

/// Why the form cannot be saved, and where to go.
#[derive(Debug, Clone, PartialEq)]
pub struct Refusal {
    pub focus: Focus,
    pub message: String,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Form {
    pub fields: Vec<Field>,
    pub focus: Focus,
}

impl Default for Form {
    fn default() -> Self {
        Form::new()
    }
}

impl Form {
    pub fn new() -> Form {
        Form {
            fields: FIELDS.iter().map(|(_, _, k)| Field::new(*k)).collect(),
            // Not on a field: Tab still walks the views until the operator moves in.
            focus: Focus::Tank,
        }
    }

    pub fn field(&self, focus: Focus) -> Option<&Field> {
        match focus {
            Focus::Field(i) => self.fields.get(i),
            Focus::Tank | Focus::Save => None,
        }
    }

    pub fn field_mut(&mut self, focus: Focus) -> Option<&mut Field> {
        match focus {
            Focus::Field(i) => self.fields.get_mut(i),
            Focus::Tank | Focus::Save => None,
        }
    }

    /// Every focus stop top to bottom (Tab order and arrow order are the same here).
    fn order(&self) -> Vec<Focus> {
        let mut v = vec![Focus::Tank];
        v.extend((0..self.fields.len()).map(Focus::Field));
        v.push(Focus::Save);
        v
    }

    /// Move the focus, remembering the new field's text so Esc can bring it back.
    pub fn focus_on(&mut self, to: Focus) {
        self.focus = to;
        if let Some(f) = self.field_mut(to) {
            f.begin_edit();
        }
    }

    pub fn next(&mut self) {
        let order = self.order();
        let at = order.iter().position(|f| *f == self.focus).unwrap_or(0);
        self.focus_on(order[(at + 1).min(order.len() - 1)]);
    }

    pub fn prev(&mut self) {
        let order = self.order();
        let at = order.iter().position(|f| *f == self.focus).unwrap_or(0);
        self.focus_on(order[at.saturating_sub(1)]);
    }

    /// Anything typed that a quit would lose.
    pub fn has_input(&self) -> bool {
        self.fields.iter().any(|f| !f.is_empty())
    }

    /// A fresh form after a save, the focus on the Save line.
    pub fn reset(&mut self) {
        *self = Form::new();
        self.focus = Focus::Save;
    }

    /// Check the whole form: the readings typed, in field order; the first problem found is
    /// reported with where it is. Blank fields are left out (the last reading or the site's
    /// value stands).
    pub fn check(&self) -> Result<Vec<TypedReading>, Refusal> {
        let mut out = Vec::new();
        for (i, (field, (name, label, _))) in self.fields.iter().zip(FIELDS).enumerate() {
            let at = |message: String| Refusal {
                focus: Focus::Field(i),
                message: format!("{label}: {message}"),
            };
            match field.checked() {
                Checked::Empty => {}
                // A temperature may be below zero; nothing else here may.
                Checked::Value(v) if *v < 0.0 && name != "temperature" => {
                    return Err(at(s::NEGATIVE.to_string()));
                }
                Checked::Value(v) => out.push(TypedReading {
                    name,
                    raw: field.text().trim().to_string(),
                    si: *v,
                }),
                Checked::Invalid(m) => return Err(at(m.clone())),
                Checked::Text => return Err(at(s::NEGATIVE.to_string())),
            }
        }
        if out.is_empty() {
            return Err(Refusal {
                focus: Focus::Field(0),
                message: s::NEED_READING.to_string(),
            });
        }
        Ok(out)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn typed_readings_check_into_si_and_blanks_are_left_out() {
        let mut f = Form::new();
        f.fields[0].set_text("30");
        f.fields[1].set_text("5.2 A");
        f.fields[3].set_text("-4");
        let c = f.check().unwrap();
        // 30 rpm = 30·2π/60 rad/s = π rad/s; −4 °C = 269.15 K (definitions).
        assert_eq!(c.len(), 3);
        assert!((c[0].si - std::f64::consts::PI).abs() < 1e-9);
        assert_eq!(c[1].raw, "5.2 A");
        assert!((c[2].si - 269.15).abs() < 1e-9);
    }

    #[test]
    fn what_is_wrong_is_said_with_where() {
        let mut f = Form::new();
        assert_eq!(f.check().unwrap_err().message, s::NEED_READING);
        f.fields[1].set_text("-2 A");
        let r = f.check().unwrap_err();
        assert_eq!(r.focus, Focus::Field(1));
        assert!(r.message.contains("negative"), "{}", r.message);
        f.fields[1].set_text("2 bar");
        let r = f.check().unwrap_err();
        assert!(r.message.starts_with("Current:"), "{}", r.message);
    }
}
