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
pub const NEED_PRODUCT: &str = "No product picked: pick one on the Site view (Shift-Tab) first.";
pub const NEED_VISCOMETER: &str = "The site config lists no viscometer, so no set can be saved.";
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
