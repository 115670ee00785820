//! A one-line text field that knows what it holds: a quantity of some dimension (checked on
//! every keystroke, with the SI value it will store) or free text (cleaned of control
//! characters as it is typed).

use crate::units::{self, Dimension, UnitError};
use ratatui::buffer::Buffer;
use ratatui::layout::{Position, Rect};
use ratatui::style::Style;
use ratatui::text::Span;

/// What the field accepts.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum FieldKind {
    /// A quantity; a bare number is in the dimension's default unit.
    Quantity(Dimension),
    /// A positive quantity (speeds, shear rates).
    Positive(Dimension),
    /// Free text up to this many characters.
    Text(usize),
}

/// The field's content as checked after the last keystroke.
#[derive(Debug, Clone, PartialEq)]
pub enum Checked {
    Empty,
    /// SI value.
    Value(f64),
    Text,
    /// What is wrong, in words.
    Invalid(String),
}

/// Longest quantity anyone types ("-12.345e-3 lbf/100ft2" is 21).
const QUANTITY_MAX_CHARS: usize = 32;

/// A text field with a cursor and its check result.
#[derive(Debug, Clone, PartialEq)]
pub struct Field {
    kind: FieldKind,
    text: String,
    /// Cursor position in characters.
    cursor: usize,
    /// Content when editing began, for a cancel.
    before_edit: String,
    checked: Checked,
}

impl Field {
    pub fn new(kind: FieldKind) -> Field {
        Field::with_text(kind, "")
    }

    pub fn with_text(kind: FieldKind, text: &str) -> Field {
        let mut field = Field {
            kind,
            text: String::new(),
            cursor: 0,
            before_edit: String::new(),
            checked: Checked::Empty,
        };
        field.set_text(text);
        field
    }

    pub fn text(&self) -> &str {
        &self.text
    }

    pub fn kind(&self) -> FieldKind {
        self.kind
    }

    pub fn checked(&self) -> &Checked {
        &self.checked
    }

    /// The SI value, when the content is a valid quantity.
    pub fn value(&self) -> Option<f64> {
        match self.checked {
            Checked::Value(v) => Some(v),
            _ => None,
        }
    }

    pub fn error(&self) -> Option<&str> {
        match &self.checked {
            Checked::Invalid(msg) => Some(msg),
            _ => None,
        }
    }

    pub fn is_empty(&self) -> bool {
        self.text.trim().is_empty()
    }

    /// Replace the content (cleaned) and put the cursor at its end.
    pub fn set_text(&mut self, text: &str) {
        self.text = crate::text::sanitize(text, false)
            .chars()
            .take(self.max_chars())
            .collect();
        self.cursor = self.text.chars().count();
        self.recheck();
    }

    /// Remember the content so a cancel can bring it back.
    pub fn begin_edit(&mut self) {
        self.before_edit = self.text.clone();
        self.cursor = self.text.chars().count();
    }

    /// Undo every change since `begin_edit`.
    pub fn cancel_edit(&mut self) {
        let before = std::mem::take(&mut self.before_edit);
        self.set_text(&before);
    }

    /// Whether the content changed since `begin_edit`.
    pub fn changed_since_edit(&self) -> bool {
        self.text != self.before_edit
    }

    fn max_chars(&self) -> usize {
        match self.kind {
            FieldKind::Text(n) => n,
            FieldKind::Quantity(_) | FieldKind::Positive(_) => QUANTITY_MAX_CHARS,
        }
    }

    /// Whether a typed character may go in: quantities take what numbers and unit
    /// spellings are made of; text takes anything printable.
    fn accepts(&self, c: char) -> bool {
        if c.is_control() {
            return false;
        }
        match self.kind {
            FieldKind::Text(_) => !crate::text::sanitize(&c.to_string(), false).is_empty(),
            FieldKind::Quantity(_) | FieldKind::Positive(_) => {
                c.is_alphanumeric() || " .,-+/%°²³·µμ()".contains(c)
            }
        }
    }

    /// Insert at the cursor. Returns false when the character was refused.
    pub fn insert(&mut self, c: char) -> bool {
        if !self.accepts(c) || self.text.chars().count() >= self.max_chars() {
            return false;
        }
        let at = self.byte_at(self.cursor);
        self.text.insert(at, c);
        self.cursor += 1;
        self.recheck();
        true
    }

    pub fn delete_back(&mut self) {
        if self.cursor == 0 {
            return;
        }
        self.cursor -= 1;
        let at = self.byte_at(self.cursor);
        self.text.remove(at);
        self.recheck();
    }

    pub fn delete_forward(&mut self) {
        if self.cursor < self.text.chars().count() {
            let at = self.byte_at(self.cursor);
            self.text.remove(at);
            self.recheck();
        }
    }

    pub fn clear(&mut self) {
        self.set_text("");
    }

    pub fn left(&mut self) {
        self.cursor = self.cursor.saturating_sub(1);
    }

    pub fn right(&mut self) {
        self.cursor = (self.cursor + 1).min(self.text.chars().count());
    }

    pub fn home(&mut self) {
        self.cursor = 0;
    }

    pub fn end(&mut self) {
        self.cursor = self.text.chars().count();
    }

    fn byte_at(&self, chars: usize) -> usize {
        self.text
            .char_indices()
            .nth(chars)
            .map_or(self.text.len(), |(i, _)| i)
    }

    fn recheck(&mut self) {
        self.checked = check(self.kind, &self.text);
    }

    /// The SI value as text ("62.8 rad/s"), or "" when there is none.
    pub fn si_text(&self) -> String {
        match (self.kind, &self.checked) {
            (FieldKind::Quantity(dim) | FieldKind::Positive(dim), Checked::Value(v)) => {
                units::format_in(*v, dim, dim.si_unit())
            }
            _ => String::new(),
        }
    }

    /// Draw the content, scrolled so the cursor is visible; returns where the cursor goes
    /// when the field is being edited.
    pub fn render(
        &self,
        area: Rect,
        buf: &mut Buffer,
        style: Style,
        editing: bool,
    ) -> Option<Position> {
        if area.is_empty() {
            return None;
        }
        let width = usize::from(area.width);
        let before: String = self.text.chars().take(self.cursor).collect();
        let cursor_col = Span::raw(before.as_str()).width();
        // Keep one column spare for the cursor after the last character.
        let skip_cols = if editing {
            (cursor_col + 1).saturating_sub(width)
        } else {
            0
        };
        let shown = skip_columns(&self.text, skip_cols);
        buf.set_style(area, style);
        buf.set_stringn(area.x, area.y, shown, width, style);
        if !editing {
            return None;
        }
        let col = u16::try_from(cursor_col.saturating_sub(skip_cols)).unwrap_or(u16::MAX);
        Some(Position::new(
            area.x.saturating_add(col.min(area.width - 1)),
            area.y,
        ))
    }
}

/// The text with its first `cols` display columns dropped.
fn skip_columns(text: &str, cols: usize) -> &str {
    let mut used = 0;
    for (i, c) in text.char_indices() {
        if used >= cols {
            return &text[i..];
        }
        used += Span::raw(c.to_string()).width();
    }
    ""
}

/// Check a field's content for its kind.
pub fn check(kind: FieldKind, text: &str) -> Checked {
    if text.trim().is_empty() {
        return Checked::Empty;
    }
    let result: Result<f64, UnitError> = match kind {
        FieldKind::Text(_) => return Checked::Text,
        FieldKind::Quantity(dim) => units::parse(text, dim),
        FieldKind::Positive(dim) => units::parse_positive(text, dim),
    };
    match result {
        Ok(v) => Checked::Value(v),
        Err(e) => Checked::Invalid(e.to_string()),
    }
}

/// Draw a form's field in `area` (clipped to `line`) with `style`, put the cursor in it when
/// `editing`, and mark a field whose content is wrong with "!" just after it: the same in
/// every form.
pub fn draw_in_form(
    frame: &mut ratatui::Frame,
    (area, line): (Rect, Rect),
    field: &Field,
    style: Style,
    editing: bool,
    error_style: Style,
) {
    if let Some(pos) = field.render(area, frame.buffer_mut(), style, editing) {
        frame.set_cursor_position(pos);
    }
    if field.error().is_some() {
        let mark = Rect {
            x: area.right(),
            width: 1,
            ..area
        }
        .intersection(line);
        frame.render_widget(
            ratatui::widgets::Paragraph::new("!").style(error_style),
            mark,
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn typed(kind: FieldKind, keys: &str) -> Field {
        let mut f = Field::new(kind);
        for c in keys.chars() {
            f.insert(c);
        }
        f
    }

    #[test]
    fn speed_is_checked_as_typed_and_stored_in_si() {
        let f = typed(FieldKind::Positive(Dimension::Speed), "600");
        // 600 rpm = 600 · 2π/60 rad/s = 62.83 rad/s (definition of the rpm).
        let v = f.value().unwrap_or(f64::NAN);
        assert!((v - 62.831_853).abs() < 1e-5, "{v}");
        assert_eq!(f.si_text(), "62.8 rad/s");
    }

    #[test]
    fn a_wrong_unit_says_what_is_wrong_in_words() {
        let f = typed(FieldKind::Positive(Dimension::Speed), "600 psi");
        let msg = f.error().unwrap_or("");
        assert!(msg.contains("speed"), "{msg}");
        assert!(msg.contains("rpm"), "{msg}");
        assert_eq!(f.si_text(), "");
    }

    #[test]
    fn control_characters_never_enter() {
        let mut f = typed(FieldKind::Text(40), "ok");
        assert!(!f.insert('\u{1b}'));
        assert!(!f.insert('\u{7}'));
        f.set_text("a\u{1b}[31mb");
        assert_eq!(f.text(), "ab");
    }

    #[test]
    fn editing_moves_by_characters_not_bytes() {
        let mut f = typed(FieldKind::Text(40), "25 °C");
        f.left();
        f.left();
        f.delete_back();
        assert_eq!(f.text(), "25°C");
        f.home();
        f.delete_forward();
        assert_eq!(f.text(), "5°C");
    }

    #[test]
    fn cancel_brings_back_the_old_content() {
        let mut f = Field::with_text(FieldKind::Quantity(Dimension::Temperature), "45");
        f.begin_edit();
        f.insert('x');
        assert!(f.error().is_some());
        f.cancel_edit();
        assert_eq!(f.text(), "45");
        // 45 °C = 318.15 K (definition of the Celsius scale).
        assert!((f.value().unwrap_or(0.0) - 318.15).abs() < 1e-9);
    }

    #[test]
    fn long_text_scrolls_to_keep_the_cursor_in_view() {
        let f = typed(FieldKind::Text(100), "abcdefghijklmnop");
        let area = Rect::new(0, 0, 5, 1);
        let mut buf = Buffer::empty(area);
        let pos = f.render(area, &mut buf, Style::new(), true);
        assert_eq!(pos, Some(Position::new(4, 0)));
        assert_eq!(buf, Buffer::with_lines(["mnop "]));
    }
}
