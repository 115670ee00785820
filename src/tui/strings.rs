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
pub mod site {
    pub const EQUIPMENT: &str = " Sample point (equipment) ";
    pub const PRODUCTS: &str = " Product ";
    pub const NONE: &str = "(none in the site config)";
    pub const PICKED: &str = "Picked";
    pub const HOLDS: &str = "it holds, so also picked:";
    pub const NOW_PRODUCT: &str = "Now pick the product (Enter).";
    pub const SITE: &str = "Site";
    pub const NEXT_STEP: &str = "Tab goes on to Readings.";
}

/// Readings view.
pub mod readings {
    pub const TITLE: &str = " Viscometer set ";
    pub const SAMPLE_POINT: &str = "Sample point";
    pub const PRODUCT: &str = "Product";
    pub const NOT_PICKED: &str = "not picked (Site view)";
    pub const VISCOMETER: &str = "Viscometer";
    pub const TEMPERATURE: &str = "Temperature";
    /// After the unit a bare number is taken in.
    pub const UNLESS_UNIT: &str = "unless a unit is typed";
    pub const NOTES: &str = "Notes";
    pub const SPEED: &str = "Speed";
    pub const DIAL: &str = "Dial";
    pub const STORES: &str = "shear rate, stress";
    pub const NO_VISCOMETER: &str = "no viscometer in the site config";
    pub const OK_HINT: &str =
        "Fields are checked as you type. Ctrl-S or Enter on Save set journals the set.";
    pub const PARKED_HINT: &str =
        "Enter, Down or a digit goes into the form; Tab goes to the next view.";
    pub const SAVE_LINE: &str = "Save set";
    pub const SAVE_LINE_HINT: &str = "[ Save set ]  Enter journals the set";
    pub const ON_SAVE_LINE: &str = "On Save set: Enter journals the set; Up goes back to Notes.";
    pub const ON_VISCOMETER: &str =
        "Left / Right choose the viscometer; typed dials are kept when it changes.";
    pub const LEFT_FORM: &str =
        "Left the form (the field was put back as it was); Enter or a digit goes back in.";
    pub const MOVED_TO: &str = "Now at";
    pub const REFUSED_AT: &str = "the cursor is on";
    pub const FEW_READINGS: &str = "readings: fewer than the simplest model needs";
    pub const CONFIRM_FEW: &str = "Press Ctrl-S again to save it anyway, or type more dials.";
    pub const NEED_PRODUCT: &str =
        "No product picked: pick one on the Site view (Shift-Tab) first.";
    pub const NEED_VISCOMETER: &str =
        "The site config lists no viscometer, so no set can be saved.";
    pub const NEED_READING: &str = "No dial reading entered: type at least one dial value.";
    pub const DIAL_NEEDS_SPEED: &str = "a dial reading needs a speed";
    pub const NEGATIVE_DIAL: &str = "a dial reading cannot be negative; type 0 or more";
    pub const PEGGED: &str =
        "at full scale (pegged): left out of the fit; read it again at a lower speed";
    pub const LOW_SCALE: &str = "below 10 % of scale: low accuracy";
    pub const SPEED_RANGE: &str = "speed outside this instrument's";
    pub const ABOVE_FASTER: &str = "above the reading at a higher speed, row";
    pub const ROW: &str = "row";
    pub const NEGATIVE_SHORT: &str = "negative";
    pub const PEGGED_SHORT: &str = "pegged: left out";
    pub const LOW_SCALE_SHORT: &str = "low on scale";
    pub const RANGE_SHORT: &str = "outside";
    pub const ABOVE_SHORT: &str = "above row";
    pub const SAVED: &str = "Set sent to the journal; its flow curve is on the Flow curve view.";
    pub const SWITCHED: &str = "Viscometer now";
    pub const WAS: &str = "was";
    pub const ONLY_VISCOMETER: &str = "The site config lists one viscometer only.";
    pub const DIALS_TYPED_ON: &str = "dial(s) typed on";
    pub const PRESS_AGAIN_TO_SWITCH: &str = "Press the same arrow again to switch to";
    pub const KEEPING_DIALS: &str = "(typed dials and speeds are kept).";
    pub const DIALS_KEPT: &str = "typed dials kept";
    pub const SPEEDS_SET: &str = "speeds set to this instrument's usual ones";
    pub const SPEEDS_KEPT: &str = "speeds kept as typed";
    pub const SET_SUMMARY: &str = "Viscometer set";
    pub const READINGS_WORD: &str = "readings";
    pub const NO_TEMPERATURE: &str = "no temperature";
    pub const MAX_ROWS: &str = "No more rows: ten readings is the most a set holds.";
    pub const MIN_ROWS: &str = "A set keeps at least one row.";
    pub const FORM_NAME: &str = "The readings form";
}

/// Spot readings view.
pub mod spot {
    pub const TITLE: &str = "Spot readings at";
    pub const PICK_EQUIPMENT: &str =
        "Pick a pump, a line or a tank on the Site view first: its readings are offered here.";
    pub const PARKED_HINT: &str = "Enter, Down or a digit goes into the form; Ctrl-S journals the readings; Tab goes to the next view.";
    pub const LEFT_FORM: &str =
        "Left the form (the field was put back as it was); Enter or a digit goes back in.";
    pub const NEED_EQUIPMENT: &str = "No equipment picked: pick one on the Site view first.";
    pub const NOTHING_TYPED: &str = "Nothing typed: type at least one reading before Ctrl-S.";
    pub const CURSOR_ON: &str = "the cursor is on";
    pub const SENT: &str = "reading(s) sent to the journal for";
    pub const OVER_JOURNALLED: &str =
        "above a site limit, journalled as warnings with their caution.";
    pub const UNLESS_UNIT: &str = "unless a unit is typed";
    pub const FORM_NAME: &str = "The spot readings form";
}

/// Flow curve view.
pub mod curve {
    pub const CHART_TITLE: &str = " Shear stress (Pa) vs shear rate (1/s) ";
    pub const LEGEND_MEASURED: &str = "measured";
    pub const LEGEND_FLAGGED: &str = "flagged";
    pub const LEGEND_FIT: &str = "fit";
    pub const MODEL_TITLE: &str = " Model ";
    pub const NO_SET: &str = "No set yet: enter one on the Readings view and save it (Ctrl-S).";
    pub const FIT_FAILED: &str = "No fit";
    pub const AUTO: &str = "auto";
    pub const BY_HAND: &str = "by hand";
    pub const R2: &str = "R²";
    pub const RMSE: &str = "RMSE";
    pub const WHY: &str = "Why";
    pub const NO_CI: &str = "no CI";
    pub const APPARENT: &str = "Apparent viscosity at";
    pub const POINTS_TITLE: &str = " Points ";
    pub const COL_RPM: &str = "rpm";
    pub const COL_DIAL: &str = "dial";
    pub const COL_RATE: &str = "rate 1/s";
    pub const COL_STRESS: &str = "stress";
    pub const COL_FLAGS: &str = "flags";
    pub const WARNINGS: &str = " Warnings ";
    pub const SET: &str = "Set";
    pub const SENDING: &str = "sending";
    pub const RATE_INVALID: &str = "shear rate";
    pub const PM_IS_95: &str = "(± is the 95 % interval)";
    pub const LIMITS_TITLE: &str = "Spec limits,";
    pub const RELATIONS_TITLE: &str = " Field relations (API RP 13D) ";
    pub const RELATIONS_FROM: &str = "From the 600 and 300 rpm dials, as fit reports them.";
    pub const NO_PEGGED: &str =
        "No reading of this set is pegged: every dial is below full scale, so all are in the fit.";
    pub const PEGGED_KEPT: &str = "Pegged readings are now kept in the fit (journalled); their stress is only a lower bound, so the curve above them is not to be relied on. i leaves them out again.";
    pub const PEGGED_LEFT_OUT: &str = "Pegged readings are left out of the fit again (journalled).";
    pub const NO_RELATIONS: &str = "No field relations: they need the standard six-speed instrument with 600 and 300 rpm read (not pegged).";
    pub const LIMITS_AT: &str = "at";
    pub const LIMITS_AS_MEASURED: &str = "as measured";
    pub const NO_LIMITS: &str = "No spec limits for this product in the site config.";
    pub const OUT: &str = "OUT";
    pub const IN: &str = "in";
    pub const IS: &str = "is";
    pub const AT: &str = "at";
}

/// Restart view.
pub mod restart {
    pub const FORM_TITLE: &str = " Gel readings ";
    pub const LINE: &str = "Line";
    pub const PUMP: &str = "Pump";
    pub const PRODUCT: &str = "Product";
    pub const NO_LINE: &str = "no line in the site config";
    pub const NO_PUMP: &str = "no pump feeds it";
    pub const NOT_PICKED: &str = "not picked (Site view)";
    pub const REST: &str = "rest time";
    pub const GEL: &str = "gel stress";
    pub const STOPPED: &str = "Stopped";
    pub const LONG_REST: &str = "blank: long rest";
    pub const SAVE: &str = "[ Save readings ]";
    pub const HINT: &str = "Type rest time and gel stress (10 s, 10 min, 30 min; Pa unless a \
         unit is typed). Enter or Tab: next; Ctrl-S saves; Esc leaves the fields.";
    pub const CHART_TITLE: &str = " Gel stress vs rest ";
    pub const ANSWER_TITLE: &str = " Will it restart? ";
    pub const SCROLL: &str = "PgUp/PgDn";
    pub const NO_ANSWER: &str = "No answer yet: enter three or more rested-gel readings on \
         the left and save them; the answer is worked out from what the journal holds.";
    pub const WAITING: &str = "Readings sent; the answer follows once the journal has them.";
    pub const LEGEND_READ: &str = "read";
    pub const LEGEND_FIT: &str = "fit";
    pub const LEGEND_BAND: &str = "95 %";
    pub const LIMIT: &str = "pump limit";
    pub const ALLOWED: &str = "less margin";
    pub const NOW: &str = "Now";
    pub const COLDEST: &str = "coldest";
    pub const AT: &str = "At";
    pub const NEXT: &str = "What to do next";
    pub const ASSUMED: &str = "What was assumed";
    pub const CAUTIONS: &str = "Cautions";
    pub const NEED_PRODUCT: &str = "No product picked: pick one on the Site view first.";
    pub const NEED_PUMP: &str = "No pump feeds this line in the site config: nothing to judge.";
    pub const NEED_READINGS: &str =
        "Type at least two rested-gel readings (rest time and gel stress), three or more to fit.";
    pub const BOTH_NEEDED: &str = "needs both a rest time and a gel stress";
    pub const NEGATIVE: &str = "cannot be negative";
    pub const ROW: &str = "row";
    pub const CANNOT_ANSWER: &str = "Not saved";
    pub const SENT: &str = "Gel readings sent to the journal; the answer follows once saved.";
    pub const ANSWER_FOR: &str = "Answer for";
    pub const JOURNALLED: &str = "journalled";
    pub const AT_COLDEST: &str = "coldest";
    pub const AFTER_STOP: &str = "After a stop of";
    pub const AFTER_LONG_REST: &str = "After a long rest (the gel fully built; no stop typed):";
    pub const RESTARTS: &str = "will restart";
    pub const STUCK: &str = "will not restart";
    pub const DO_NOT_FORCE: &str = "do not force it";
    pub const FORM_NAME: &str = "The restart readings form";
}

/// Line view.
pub mod line {
    pub const CHART_TITLE: &str = " Pressure drop vs flow ";
    pub const PANEL_TITLE: &str = " Line answer ";
    pub const NO_LINE: &str = "No line in the site config.";
    pub const NEED_PRODUCT: &str = "No product picked: pick a line and a product on the Site view.";
    pub const KEY_COOLER: &str = "5 K cooler";
    pub const KEY_THICKER: &str = "10 % thicker";
    pub const KEY_RESET: &str = "as measured";
    pub const WHAT_IF: &str = "What if";
    pub const COOLER: &str = "cooler";
    pub const THICKER: &str = "thicker";
    pub const AS_MEASURED: &str = "as measured (c: cooler, t: thicker)";
    pub const AT: &str = "at";
    pub const AT_TOP: &str = "At";
    pub const REGIMES: &str = "Regime";
    pub const UP_TO: &str = "to";
    pub const NO_PAIRS: &str =
        "No plant readings yet: flow and pressure-drop spot readings on this line show here.";
    pub const PLANT: &str = "Plant";
    pub const LEGEND_CURVE: &str = "curve";
    pub const LEGEND_BAND: &str = "band";
    pub const LEGEND_PLANT: &str = "plant";
    pub const DESIGN: &str = "design";
    pub const CAUTIONS: &str = "Cautions";
    pub const SOURCE: &str = "Curve";
    pub const SCROLL: &str = "PgUp/PgDn";
    pub const LEGEND_PUMP: &str = "pump";
    pub const LEGEND_DUTY: &str = "duty";
    pub const RELIEF: &str = "relief";
    pub const NO_PUMP: &str = "No pump feeds this line in the site config.";
    pub const NO_PUMP_ANSWER: &str = "No pump answer";
}

/// Journal view.
pub mod journal {
    pub const TITLE: &str = " Session journal ";
    pub const FILE: &str = "file";
    pub const EMPTY: &str = "Nothing recorded yet.";
    pub const RECORD_TITLE: &str = " Record (Up/Down scroll, Esc or Enter closes) ";
    pub const NOT_NUMBERED: &str = "Not yet numbered by the journal: it is still being written.";
    pub const OPENED: &str = "The selected record in full; Up/Down scroll it, Esc closes it.";
    pub const SAVED: &str = "saved";
    pub const SENDING: &str = "sending";
    pub const UNSAVED: &str = "UNSAVED";
    pub const REFUSED: &str = "REFUSED";
    pub const SESSION_START: &str = "Session started";
    pub const SESSION_END: &str = "Session ended";
    pub const READING: &str = "Reading";
    pub const RESULT: &str = "Result";
    pub const CHOICE: &str = "Shown for set";
    pub const FINDING: &str = "Finding";
    pub const RESUMED: &str = "Resumed session";
    pub const TORN: &str = "A cut-off last line was set aside";
}

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
pub mod findings {
    pub const NAME: &str = "Findings";
    pub const CAUTION: &str =
        "Findings advise, never certify; isolate and lock out before opening a line.";
    pub const TITLE: &str = " Findings, worst first ";
    pub const DETAIL_TITLE: &str = " Finding ";
    pub const EMPTY: &str = "No findings for this session yet. They appear here as readings, \
        sets and answers are journalled; a guided check (Checks view) asks for what is needed.";
    pub const OPEN_HINT: &str = "Enter opens the selected finding; Up/Down choose.";
    pub const HOW_SURE: &str = "How sure";
    pub const NUMBERS: &str = "The numbers (95 % range where known)";
    pub const NO_NUMBERS: &str = "No numbers behind this one.";
    pub const NEXT_CHECKS: &str = "Check next";
    pub const CAUTION_HEAD: &str = "Caution";
    pub const CERTAIN: &str = "certain: the whole range lies beyond the limit";
    pub const LIKELY: &str = "likely: the value lies beyond the limit, part of its range does not (or its error is unknown)";
    pub const POSSIBLE: &str =
        "possible: the value lies inside the limit, part of its range beyond it";
    pub const OPEN: &str = "open the finding";
    pub const BACK: &str = "back to the list";
    pub const INFO: &str = "INFO";
}

/// Checks view: the guided checks (its name and caution here too, beside its words).
pub mod guided {
    pub const NAME: &str = "Checks";
    pub const CAUTION: &str =
        "Each step says its caution; isolate and lock out before opening anything.";
    pub const LIST_TITLE: &str = " Guided checks ";
    pub const STEPS_TITLE: &str = " Steps ";
    pub const NEEDS: &str = "needs";
    pub const ON: &str = "On";
    pub const NOTHING_TO_CHECK: &str = "The site has nothing this check can be about";
    pub const NEEDS_PUMP: &str =
        "This check needs a line fed by a pump; pick one on the Site view.";
    pub const START_HINT: &str = "Enter starts the check: it asks for each reading in turn, and any \
        step can be skipped. It ends on the Findings view.";
    pub const LAST: &str = "Last check";
    pub const STEP: &str = "Step";
    pub const OF: &str = "of";
    pub const READ_AT: &str = "Read at";
    pub const READING: &str = "Reading";
    pub const CAUTION_HEAD: &str = "Caution";
    pub const WILL_SAVE: &str = "will save";
    pub const STEP_HINT: &str = "Enter saves the reading and goes on; Ctrl-K skips the step \
        (the answer then says what was assumed); Esc leaves the field, Esc again stops the check.";
    pub const TOP_HINT: &str =
        "Enter to type the reading; Ctrl-K skips the step; Esc stops the check.";
    pub const EMPTY_READING: &str = "Type the reading first, or press Ctrl-K to skip this step.";
    pub const SAVED: &str = "saved";
    pub const SKIPPED: &str = "skipped";
    pub const STOPPED: &str = "Check stopped; the readings already saved stay in the journal.";
    pub const FINISHED: &str =
        "Check finished: the findings are on this view; the check's note is journalled.";
    pub const START: &str = "start the check";
    pub const SAVE_READING: &str = "save, next step";
    pub const SKIP: &str = "skip the step";
    pub const STOP: &str = "stop the check";
    pub const TYPE: &str = "type the reading";
    pub const UNSAVED: &str = "The guided check's reading";
}

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
pub mod tank {
    pub const FORM_TITLE: &str = " Tank readings ";
    pub const TANK: &str = "Tank";
    pub const PRODUCT: &str = "Product";
    pub const NO_TANK: &str = "no tank in the site config";
    pub const SPEED: &str = "Speed";
    pub const CURRENT: &str = "Current";
    pub const VOLTAGE: &str = "Voltage";
    pub const TEMPERATURE: &str = "Temp";
    pub const SAVE: &str = "[ Save readings ]";
    pub const HINT: &str = "Blank: the last reading or the site's. Ctrl-S saves; Esc leaves.";
    pub const CHART_TITLE: &str = " Power number vs Reynolds (log) ";
    pub const LEGEND_CURVE: &str = "curve";
    pub const LEGEND_TODAY: &str = "today";
    pub const ANSWER_TITLE: &str = " Tank answer ";
    pub const SIDE_TITLE: &str = " Side view ";
    pub const SCROLL: &str = "PgUp/PgDn";
    pub const NEED_READING: &str = "Nothing typed: type at least one reading to save.";
    pub const NEGATIVE: &str = "cannot be negative";
    pub const CANNOT_ANSWER: &str = "Not saved";
    pub const SENT: &str = "Tank readings sent to the journal; the answer follows once saved.";
    pub const ANSWER_FOR: &str = "Answer for";
    pub const JOURNALLED: &str = "journalled";
    pub const FORM_NAME: &str = "The tank readings form";
    pub const AT: &str = "at";
    pub const FROM_READING: &str = "read today";
    pub const FROM_SITE: &str = "the site's speed";
    pub const REGIME: &str = "Regime";
    pub const POWER: &str = "Power";
    pub const TORQUE: &str = "Torque";
    pub const PER_VOLUME: &str = "Power per volume";
    pub const MOTOR: &str = "Motor";
    pub const GEARBOX: &str = "Gearbox";
    pub const OF_RATING: &str = "of its";
    pub const OF_LIMITS: &str = "of their limits";
    pub const RATING: &str = "rating";
    pub const TORQUE_LIMIT: &str = "torque limit";
    pub const NO_MOTOR_READING: &str =
        "No motor reading yet: type the motor current to see the viscosity it implies.";
    pub const SHAFT: &str = "Shaft power from the motor";
    pub const VISC_MOTOR: &str = "Viscosity from the motor";
    pub const VISC_METER: &str = "Viscometer's";
    pub const REFUSED_SEE_FINDINGS: &str = "No viscosity read back from it (why: Findings).";
    pub const CAVERN: &str = "Cavern";
    pub const ACROSS: &str = "across";
    pub const IN_TANK: &str = "in a tank of";
    pub const TO_WALL: &str = "reaches the wall from about";
    pub const NO_CAVERN: &str = "No yield stress: the whole tank moves (no cavern).";
    pub const FINDINGS: &str = "Findings";
    pub const CAUTIONS: &str = "Cautions";
    pub const CURVE: &str = "Curve";
    pub const NO_UPPER: &str = "no upper bound";
    pub const LEGEND_CAVERN: &str = "moving";
    pub const LEGEND_STILL: &str = "still";
    pub const JOURNALLED_NOTE: &str =
        "This answer is journalled as a tank result linked to the readings.";
}
