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
pub const OVER_JOURNALLED: &str = "above a site limit, journalled as warnings with their caution.";
pub const UNLESS_UNIT: &str = "unless a unit is typed";
pub const FORM_NAME: &str = "The spot readings form";
