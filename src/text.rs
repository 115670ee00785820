//! Cleaning untrusted text (operator notes, names from a config) before it is shown or journalled.

/// Remove control characters and terminal escape sequences, keep printable text.
///
/// An ESC starts a sequence: CSI (`ESC [` … final byte 0x40–0x7E), OSC (`ESC ]` … BEL or
/// `ESC \`), or a two-character escape; the whole sequence is dropped, not just the ESC, so
/// no fragment like `[31m` reaches the screen. Tabs become spaces; newlines become spaces
/// unless `keep_newlines`.
pub fn sanitize(input: &str, keep_newlines: bool) -> String {
    let mut out = String::with_capacity(input.len());
    let mut chars = input.chars().peekable();
    while let Some(c) = chars.next() {
        match c {
            '\u{1b}' => skip_escape(&mut chars),
            '\u{9b}' => skip_csi_body(&mut chars),
            '\n' if keep_newlines => out.push('\n'),
            '\t' | '\n' | '\r' => out.push(' '),
            c if c.is_control() => {}
            c if is_bidi_control(c) => {}
            c => out.push(c),
        }
    }
    out
}

/// The first control or format character in `s` (character position from 1, the character),
/// if any. Format characters (Unicode category Cf: zero-width, bidirectional and invisible
/// marks) change what a value looks like without showing, so a typed value holding one is
/// refused rather than cleaned: "1\u{7f}2 bar" must not become "12 bar".
pub fn first_hidden_char(s: &str) -> Option<(usize, char)> {
    s.chars()
        .enumerate()
        .find(|(_, c)| c.is_control() || is_format_char(*c))
        .map(|(i, c)| (i + 1, c))
}

/// Unicode general category Cf (Unicode 15 character database, DerivedGeneralCategory.txt).
fn is_format_char(c: char) -> bool {
    matches!(c,
        '\u{ad}' | '\u{600}'..='\u{605}' | '\u{61c}' | '\u{6dd}' | '\u{70f}' | '\u{890}'..='\u{891}'
        | '\u{8e2}' | '\u{180e}' | '\u{200b}'..='\u{200f}' | '\u{202a}'..='\u{202e}'
        | '\u{2060}'..='\u{2064}' | '\u{2066}'..='\u{206f}' | '\u{feff}' | '\u{fff9}'..='\u{fffb}'
        | '\u{110bd}' | '\u{110cd}' | '\u{13430}'..='\u{1343f}' | '\u{1bca0}'..='\u{1bca3}'
        | '\u{1d173}'..='\u{1d17a}' | '\u{e0001}' | '\u{e0020}'..='\u{e007f}')
}

/// Bidirectional overrides can make a note display differently from what it says.
fn is_bidi_control(c: char) -> bool {
    matches!(c, '\u{202a}'..='\u{202e}' | '\u{2066}'..='\u{2069}')
}

fn skip_escape(chars: &mut std::iter::Peekable<std::str::Chars<'_>>) {
    match chars.next() {
        Some('[') => skip_csi_body(chars),
        Some(']') | Some('P') | Some('X') | Some('^') | Some('_') => skip_string_body(chars),
        _ => {}
    }
}

fn skip_csi_body(chars: &mut std::iter::Peekable<std::str::Chars<'_>>) {
    for c in chars.by_ref() {
        if ('\u{40}'..='\u{7e}').contains(&c) {
            break;
        }
    }
}

/// OSC/DCS-style strings end at BEL or ST (`ESC \`).
fn skip_string_body(chars: &mut std::iter::Peekable<std::str::Chars<'_>>) {
    while let Some(c) = chars.next() {
        if c == '\u{7}' {
            break;
        }
        if c == '\u{1b}' {
            if chars.peek() == Some(&'\\') {
                chars.next();
            }
            break;
        }
    }
}

#[cfg(test)]
mod tests {
    use super::sanitize;

    #[test]
    fn strips_colour_and_title_sequences() {
        assert_eq!(sanitize("\u{1b}[31mred\u{1b}[0m", false), "red");
        assert_eq!(sanitize("a\u{1b}]0;pwned\u{7}b", false), "ab");
        assert_eq!(sanitize("x\u{1b}]2;t\u{1b}\\y", false), "xy");
    }

    #[test]
    fn keeps_text_and_folds_whitespace() {
        assert_eq!(sanitize("pump P-2\tok\r\nnext", false), "pump P-2 ok  next");
        assert_eq!(sanitize("l1\nl2", true), "l1\nl2");
        assert_eq!(sanitize("bell\u{7}\u{0}", false), "bell");
        assert_eq!(sanitize("Grüße 25 °C", false), "Grüße 25 °C");
    }

    #[test]
    fn drops_bidi_overrides() {
        assert_eq!(sanitize("a\u{202e}b", false), "ab");
    }
}
