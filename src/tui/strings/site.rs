pub const EQUIPMENT: &str = " Sample point (equipment) ";
pub const PRODUCTS: &str = " Product ";
pub const NONE: &str = "(none in the site config)";
pub const PICKED: &str = "Picked";
pub const HOLDS: &str = "it holds, so also picked:";
pub const NOW_PRODUCT: &str = "Now pick the product (Enter).";
pub const SITE: &str = "Site";
pub const NEXT_STEP: &str = "Tab goes on to Readings.";
