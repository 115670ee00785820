pub const NAME: &str = "Checks";
pub const CAUTION: &str =
    "Each step says its caution; isolate and lock out before opening anything.";
pub const LIST_TITLE: &str = " Guided checks ";
pub const STEPS_TITLE: &str = " Steps ";
pub const NEEDS: &str = "needs";
pub const ON: &str = "On";
pub const NOTHING_TO_CHECK: &str = "The site has nothing this check can be about";
pub const NEEDS_PUMP: &str = "This check needs a line fed by a pump; pick one on the Site view.";
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
pub const TOP_HINT: &str = "Enter to type the reading; Ctrl-K skips the step; Esc stops the check.";
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
