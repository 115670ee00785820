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
pub const LIKELY: &str =
    "likely: the value lies beyond the limit, part of its range does not (or its error is unknown)";
pub const POSSIBLE: &str = "possible: the value lies inside the limit, part of its range beyond it";
pub const OPEN: &str = "open the finding";
pub const BACK: &str = "back to the list";
pub const INFO: &str = "INFO";
