//! Free text (notes, names, descriptions) after cleaning never carries an escape sequence or
//! another control character to a terminal, a report or a CSV cell.
#![no_main]
use libfuzzer_sys::fuzz_target;

fuzz_target!(|data: &[u8]| {
    let text = String::from_utf8_lossy(data);
    for keep_newlines in [false, true] {
        let clean = rheoside::text::sanitize(&text, keep_newlines);
        assert!(
            !clean
                .chars()
                .any(|c| c.is_control() && !(keep_newlines && c == '\n')),
            "{clean:?}"
        );
    }
});
