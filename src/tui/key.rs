//! Keys as the key map knows them: crossterm events folded to presses of one key, with
//! the names the footer and the help show.

use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyEventKind, KeyModifiers};

/// A key as the map knows it (modifiers folded in; Alt combinations are not used).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Key {
    Char(char),
    Ctrl(char),
    /// Any of 0–9 (starts typing a value into the selected field).
    Digit,
    Enter,
    Esc,
    Tab,
    BackTab,
    Up,
    Down,
    Left,
    Right,
    /// Ctrl with the left or right arrow.
    CtrlLeft,
    CtrlRight,
    PageUp,
    PageDown,
    Home,
    End,
    Backspace,
    Delete,
}

impl Key {
    /// Only presses count: release and repeat events (kitty protocol, Windows) are dropped.
    pub fn from_event(ev: &KeyEvent) -> Option<Key> {
        if ev.kind != KeyEventKind::Press {
            return None;
        }
        let ctrl = ev.modifiers.contains(KeyModifiers::CONTROL);
        if ev.modifiers.contains(KeyModifiers::ALT) {
            return None;
        }
        Some(match ev.code {
            KeyCode::Char(c) if ctrl => Key::Ctrl(c.to_ascii_lowercase()),
            KeyCode::Char(c) => Key::Char(c),
            KeyCode::Enter => Key::Enter,
            KeyCode::Esc => Key::Esc,
            KeyCode::Tab if ev.modifiers.contains(KeyModifiers::SHIFT) => Key::BackTab,
            KeyCode::Tab => Key::Tab,
            KeyCode::BackTab => Key::BackTab,
            KeyCode::Up => Key::Up,
            KeyCode::Down => Key::Down,
            KeyCode::Left if ctrl => Key::CtrlLeft,
            KeyCode::Right if ctrl => Key::CtrlRight,
            KeyCode::Left => Key::Left,
            KeyCode::Right => Key::Right,
            KeyCode::PageUp => Key::PageUp,
            KeyCode::PageDown => Key::PageDown,
            KeyCode::Home => Key::Home,
            KeyCode::End => Key::End,
            KeyCode::Backspace => Key::Backspace,
            KeyCode::Delete => Key::Delete,
            _ => return None,
        })
    }

    /// Whether this map entry matches a pressed key.
    pub(super) fn matches(self, pressed: Key) -> bool {
        match (self, pressed) {
            (Key::Digit, Key::Char(c)) => c.is_ascii_digit(),
            (a, b) => a == b,
        }
    }

    /// The name shown in the footer and the help.
    pub fn name(self) -> String {
        match self {
            Key::Char(' ') => "Space".to_string(),
            Key::Char(c) => c.to_string(),
            Key::Ctrl(c) => format!("Ctrl-{}", c.to_ascii_uppercase()),
            Key::Digit => "0-9".to_string(),
            Key::Enter => "Enter".to_string(),
            Key::Esc => "Esc".to_string(),
            Key::Tab => "Tab".to_string(),
            Key::BackTab => "Shift-Tab".to_string(),
            Key::Up => "Up".to_string(),
            Key::Down => "Down".to_string(),
            Key::Left => "Left".to_string(),
            Key::Right => "Right".to_string(),
            Key::CtrlLeft => "Ctrl-Left".to_string(),
            Key::CtrlRight => "Ctrl-Right".to_string(),
            Key::PageUp => "PgUp".to_string(),
            Key::PageDown => "PgDn".to_string(),
            Key::Home => "Home".to_string(),
            Key::End => "End".to_string(),
            Key::Backspace => "Backspace".to_string(),
            Key::Delete => "Del".to_string(),
        }
    }
}
