//! The journal reader on arbitrary bytes: records, a torn tail or a clear error; never a panic.
#![no_main]
use libfuzzer_sys::fuzz_target;

fuzz_target!(|data: &[u8]| {
    let _ = rheoside::journal::scan(std::path::Path::new("fuzz.jsonl"), data);
});
