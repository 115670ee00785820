//! Terminal input, reduced to what the app reacts to: key presses and resizes.

use ratatui::crossterm::event::{self, Event};
use std::io;
use std::time::Duration;

/// Something from the terminal the app must react to.
#[derive(Debug, Clone, PartialEq)]
pub enum Input {
    Key(event::KeyEvent),
    /// The size changed; redraw. A 0×0 size (a dropped SSH session) is not drawn.
    Resize,
}

/// Wait up to `timeout` for input; `None` when nothing came. Mouse, focus and paste
/// events are not enabled, and any that arrive anyway are dropped.
pub fn next(timeout: Duration) -> io::Result<Option<Input>> {
    if !event::poll(timeout)? {
        return Ok(None);
    }
    Ok(match event::read()? {
        Event::Key(k) => Some(Input::Key(k)),
        Event::Resize(..) => Some(Input::Resize),
        _ => None,
    })
}
