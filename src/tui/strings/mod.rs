//! Every word the terminal UI shows, in one place, so wording is reviewed (and could be
//! translated) without reading drawing code. Names from the config and operator text are
//! not here: they are cleaned before they are drawn.

/// Printed instead of drawing when stdout is not a terminal.
pub const NOT_A_TERMINAL: &str = "rheoside: stdout is not a terminal, so the screens are not started; run it in a terminal, or use a subcommand (rheoside --help lists them)";

pub const APP_NAME: &str = "rheoside";

/// Top bar.
pub mod top {
    pub const OPERATOR: &str = "op";
    /// Before the session's running time.
    pub const UP: &str = "up";
    pub const JOURNAL_SAVED: &str = "journal saved";
    pub const JOURNAL_EMPTY: &str = "journal empty";
    pub const JOURNAL_UNSAVED: &str = "unsaved";
    pub const JOURNAL_ERROR: &str = "JOURNAL ERROR";
    pub const JOURNAL_CLOSED: &str = "journal closed";
}

/// Names of the views, as the tab row shows them.
pub mod views {
    pub const SITE: &str = "Site";
    pub const READINGS: &str = "Readings";
    pub const SPOT: &str = "Spot";
    pub const CURVE: &str = "Flow curve";
    pub const JOURNAL: &str = "Journal";
    pub const RESTART: &str = "Restart";
    pub const LINE: &str = "Line";
    pub const TANK: &str = "Tank";
}

/// One line per view: what to watch out for before acting on what it shows.
pub mod caution {
    pub const SITE: &str =
        "Sample only where it is safe to reach; the tool advises, it does not certify.";
    pub const READINGS: &str =
        "Stop the agitator before sampling; hot product: wear face and hand protection.";
    pub const SPOT: &str = "Read gauges only where it is safe to stand; advice, not a certificate.";
    pub const CURVE: &str =
        "Check the fit against the points before acting on it; advice, not a certificate.";
    pub const JOURNAL: &str =
        "Only records marked saved are on disk; hand the journal file over at shift end.";
    pub const RESTART: &str =
        "Never raise a relief setting to force a restart; isolate and lock out first.";
    pub const LINE: &str =
        "Never exceed the rated pressure of the weakest part; lock out before opening.";
    pub const TANK: &str =
        "Stop and lock out the agitator before sampling or looking in; hot product.";
}

/// Labels of the key map (footer and help).
pub mod keys {
    pub const INTERRUPT: &str = "quit now (asks if input is unsaved)";
    pub const HELP: &str = "help";
    pub const QUIT: &str = "quit";
    pub const NEXT_VIEW: &str = "next view";
    pub const PREV_VIEW: &str = "previous view";
    pub const ADD_NOTE: &str = "note";
    pub const UP: &str = "move up";
    pub const DOWN: &str = "move down";
    pub const LEFT: &str = "move left / previous choice";
    pub const RIGHT: &str = "move right / next choice";
    pub const PAGE_UP: &str = "page up";
    pub const PAGE_DOWN: &str = "page down";
    pub const HOME: &str = "to the top";
    pub const END: &str = "to the bottom";
    pub const PICK: &str = "pick";
    pub const EDIT_FIELD: &str = "into the form";
    pub const TYPE_VALUE: &str = "type a new value into the selected field";
    pub const SAVE_SET: &str = "save set";
    pub const SAVE_READINGS: &str = "save readings";
    pub const OPEN_RECORD: &str = "open the record in full";
    pub const CLOSE_RECORD: &str = "close the record";
    pub const TO_SPEED: &str = "to the speed column of this row";
    pub const TO_DIAL: &str = "to the dial column of this row";
    pub const ADD_ROW: &str = "add a reading row";
    pub const REMOVE_ROW: &str = "remove the selected reading row";
    pub const NEXT_MODEL: &str = "model";
    pub const PREV_MODEL: &str = "previous model";
    pub const AUTO_MODEL: &str = "let the tool choose the model";
    pub const SET_RATE: &str = "new shear rate";
    pub const FIELD_RELATIONS: &str = "field relations / model";
    pub const PEGGED: &str = "keep / leave out pegged readings";
    pub const TYPE_RATE: &str = "type a shear rate for the apparent viscosity";
    pub const ACCEPT: &str = "accept";
    pub const ACCEPT_NEXT: &str = "next field";
    pub const ACCEPT_PREV: &str = "accept, previous field";
    pub const ACCEPT_UP: &str = "accept, field above";
    pub const ACCEPT_DOWN: &str = "accept, field below";
    pub const CANCEL_EDIT: &str = "leave, put back";
    pub const DELETE_BACK: &str = "delete before the cursor";
    pub const DELETE_FORWARD: &str = "delete at the cursor";
    pub const CURSOR_LEFT: &str = "cursor left";
    pub const CURSOR_RIGHT: &str = "cursor right";
    pub const CURSOR_HOME: &str = "cursor to start";
    pub const CURSOR_END: &str = "cursor to end";
    pub const CLEAR_FIELD: &str = "clear the field";
    pub const CLOSE: &str = "close";
    pub const SAVE_NOTE: &str = "save the note";
    pub const CANCEL_NOTE: &str = "cancel";
    pub const YES_QUIT: &str = "yes, quit";
    pub const NO_STAY: &str = "no, stay";
    pub const SAVE_FORM: &str = "save";
    pub const SAVE_OR_NEXT: &str = "save (on Save) / next";
}

/// The help overlay.
pub mod help {
    pub const TITLE: &str = " Keys ";
    pub const EVERYWHERE: &str = "Everywhere";
    pub const TOP_LEVEL: &str = "In every view";
    pub const MOVING: &str = "Moving";
    pub const EDITING: &str = "Typing in a field (or in the note box)";
    pub const NOTE_BOX: &str = "In the note box";
    pub const TYPING_TEXT: &str = "any other key types into the field";
    pub const IN_HELP: &str = "In this help";
    pub const CONFIRM: &str = "When asked before quitting";
    pub const SCROLL_HINT: &str = "Up/Down to scroll";
}

/// Terminal-too-small screen.
pub mod small {
    pub const NEEDS: &str = "The terminal is too small";
    pub const ENLARGE: &str = "Enlarge the window to at least";
    pub const OR_QUIT: &str = "or press q (or Ctrl-C) to quit.";
}

/// Asking before quitting.
pub mod confirm {
    pub const TITLE: &str = " Quit? ";
    pub const FORM_INPUT: &str = "has input that is not saved";
    pub const RECORDS_UNSAVED: &str =
        "journal record(s) not yet on disk; one more try is made on quitting";
    pub const QUESTION: &str = "Quit anyway?";
    pub const NOTHING_UNSAVED: &str = "Everything is saved now.";
}

/// The note box.
pub mod note {
    pub const TITLE: &str = " Note for the journal ";
    pub const HINT: &str = "Enter saves the note, Esc cancels; Ctrl-C quits.";
    pub const EMPTY: &str = "Empty note: nothing saved.";
    pub const SAVED: &str = "Note sent to the journal.";
    pub const SUMMARY: &str = "Note";
}

/// Site view.
pub mod site;

/// Readings view.
pub mod readings;

/// Spot readings view.
pub mod spot;

/// Flow curve view.
pub mod curve;

/// Restart view.
pub mod restart;

/// Line view.
pub mod line;

/// Journal view.
pub mod journal;

/// Messages on the status line.
pub mod status {
    pub const WELCOME: &str =
        "Pick a sample point and a product (Enter), then Tab to Readings; ? lists keys.";
    pub const WRITER_GONE: &str = "The journal writer has stopped; nothing more can be saved.";
    pub const RESUMED: &str = "Session resumed with";
    pub const RECORDS: &str = "records";
    pub const RESUMED_TAIL: &str = "new records go to the same file";
    pub const SIGNAL: &str = "rheoside: stopped by a signal; the journal was flushed.";
}

/// Printed after the terminal is given back.
pub mod exit {
    pub const SAVED_TO: &str = "rheoside: session journal";
    pub const RECORDS: &str = "records";
    pub const UNSAVED: &str = "rheoside: records could not be saved";
}

/// Findings view (its name and caution here too, beside its words).
pub mod findings;

/// Checks view: the guided checks (its name and caution here too, beside its words).
pub mod guided;

#[cfg(test)]
mod tests {
    use super::*;

    /// Lines drawn on one row of an 80-column screen must fit it whole.
    #[test]
    fn one_line_texts_fit_80_columns() {
        let lines = [
            caution::SITE,
            caution::READINGS,
            caution::CURVE,
            caution::JOURNAL,
            status::WELCOME,
            readings::OK_HINT,
            readings::NEED_PRODUCT,
            readings::SAVED,
            note::HINT,
            findings::CAUTION,
            guided::CAUTION,
            guided::TOP_HINT,
            guided::FINISHED,
        ];
        for l in lines {
            assert!(l.chars().count() <= 80, "{} chars: {l}", l.chars().count());
        }
    }
}

/// Tank view.
pub mod tank;
