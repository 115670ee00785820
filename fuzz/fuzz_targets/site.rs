//! The site loader on arbitrary text: an error list or a site, never a panic; a site it
//! accepts has finite, positive line bores.
#![no_main]
use libfuzzer_sys::fuzz_target;

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if let Ok(site) = rheoside::site::load_str(text, "fuzz.toml") {
        for line in &site.lines {
            assert!(line.inner_diameter_m.is_finite() && line.inner_diameter_m > 0.0);
        }
    }
});
