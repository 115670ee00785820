//! `record --reading NAME=VALUE UNIT`: never panics; an accepted value is finite and what was
//! kept as typed carries no control or escape characters.
#![no_main]
use libfuzzer_sys::fuzz_target;

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if let Ok(r) = rheoside::readings::parse_reading_arg(text) {
        assert!(r.value_si.is_finite(), "{text:?} gave {}", r.value_si);
        assert!(!r.raw.chars().any(char::is_control), "{:?} kept raw", r.raw);
    }
});
