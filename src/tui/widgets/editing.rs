//! The editing keys applied to a field, the same in every form: typing, deleting, moving
//! the cursor, and the ways of leaving the field.

use super::field::Field;
use crate::tui::keymap::Action;

/// How an edit ended, or that it goes on.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum EditStep {
    /// Still typing.
    Typing,
    /// Keep the text and leave the field; go where the key says.
    Accepted(Leave),
    /// Text put back as it was.
    Cancelled,
}

/// Where the focus goes after an accepted edit.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Leave {
    /// Enter: to the field below, typing stops.
    Below,
    /// Tab: to the next field, typing goes on there.
    Next,
    /// Shift-Tab: to the previous field, typing goes on there.
    Prev,
    Up,
    Down,
}

/// Apply one editing action to the field being typed into.
pub fn apply(field: &mut Field, action: Action) -> EditStep {
    match action {
        Action::Type(c) => {
            field.insert(c);
        }
        Action::DeleteBack => field.delete_back(),
        Action::DeleteForward => field.delete_forward(),
        Action::Left => field.left(),
        Action::Right => field.right(),
        Action::Home => field.home(),
        Action::End => field.end(),
        Action::ClearField => field.clear(),
        Action::Accept => return EditStep::Accepted(Leave::Below),
        Action::AcceptNext => return EditStep::Accepted(Leave::Next),
        Action::AcceptPrev => return EditStep::Accepted(Leave::Prev),
        Action::AcceptUp => return EditStep::Accepted(Leave::Up),
        Action::AcceptDown => return EditStep::Accepted(Leave::Down),
        Action::Cancel => {
            field.cancel_edit();
            return EditStep::Cancelled;
        }
        _ => {}
    }
    EditStep::Typing
}

/// Start typing a fresh value: the first key replaces what was there (as in a spreadsheet);
/// a cancel brings the old text back.
pub fn start_with(field: &mut Field, first: char) {
    field.begin_edit();
    field.clear();
    field.insert(first);
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::tui::widgets::field::FieldKind;
    use crate::units::Dimension;

    #[test]
    fn typing_over_a_value_can_be_undone() {
        let mut f = Field::with_text(FieldKind::Quantity(Dimension::Dimensionless), "52");
        start_with(&mut f, '4');
        assert_eq!(apply(&mut f, Action::Type('0')), EditStep::Typing);
        assert_eq!(f.text(), "40");
        assert_eq!(apply(&mut f, Action::Cancel), EditStep::Cancelled);
        assert_eq!(f.text(), "52");
    }

    #[test]
    fn each_leaving_key_says_where_to_go() {
        let mut f = Field::new(FieldKind::Text(10));
        assert_eq!(
            apply(&mut f, Action::Accept),
            EditStep::Accepted(Leave::Below)
        );
        assert_eq!(
            apply(&mut f, Action::AcceptNext),
            EditStep::Accepted(Leave::Next)
        );
        assert_eq!(
            apply(&mut f, Action::AcceptPrev),
            EditStep::Accepted(Leave::Prev)
        );
        // Keys that mean nothing while typing leave the text alone.
        f.set_text("ab");
        assert_eq!(apply(&mut f, Action::Save), EditStep::Typing);
        assert_eq!(f.text(), "ab");
    }
}
