//! The unit parser: never panics; a value it accepts is finite; a decimal comma is never
//! read as a thousands separator ("12,5 bar" is never 1 250 000 Pa).
#![no_main]
use libfuzzer_sys::fuzz_target;
use rheoside::units::{self, Dimension};

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    for dim in Dimension::ALL {
        if let Ok(v) = units::parse(text, dim) {
            assert!(v.is_finite(), "{text:?} as {dim:?} gave {v}");
        }
    }
    if let Ok(v) = units::parse("12,5 bar", Dimension::Pressure) {
        assert!((v - 1.25e6).abs() < 1.0, "12,5 bar read as {v} Pa");
    }
});
