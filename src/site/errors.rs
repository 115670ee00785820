//! Site config errors with their file positions, and the collector that gathers every one.

use std::fmt;
use std::ops::Range;

/// What sort of mistake an error reports; callers and tests can match on it.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ErrorKind {
    /// The file could not be read at all.
    Unreadable,
    /// The text is not valid TOML.
    Syntax,
    /// A key or table the schema does not know (often a typo).
    UnknownKey,
    /// A required field or table is absent.
    Missing,
    /// A value of the wrong TOML type (a number where a string belongs, …).
    WrongType,
    /// A value of the right type that is not acceptable (units, range, choice).
    BadValue,
    /// An id or product name used twice.
    Duplicate,
    /// A reference to an id that does not exist.
    Dangling,
    /// An id with characters outside `[A-Za-z0-9._-]`.
    BadId,
}

/// One problem in a site config, located at the value (or the table header) it concerns.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct SiteError {
    pub path: String,
    /// 1-based; 0 when the file could not be read.
    pub line: usize,
    /// 1-based, counted in characters; 0 when the file could not be read.
    pub column: usize,
    /// Dotted key path, e.g. `pump.curve.flow`; empty for syntax and file errors.
    pub field: String,
    /// The offending value as written (sanitised, shortened); empty when there is none.
    pub value: String,
    /// What is wrong and what is accepted.
    pub message: String,
    pub kind: ErrorKind,
}

impl fmt::Display for SiteError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        // Line 0 means no position in the file (it could not be read): say only the path.
        if self.line == 0 {
            write!(f, "{}: ", self.path)?;
        } else {
            write!(f, "{}:{}:{}: ", self.path, self.line, self.column)?;
        }
        match self.kind {
            ErrorKind::Unreadable | ErrorKind::Syntax | ErrorKind::Missing => {
                f.write_str(&self.message)
            }
            _ => write!(
                f,
                "field '{}': '{}' — {}",
                self.field, self.value, self.message
            ),
        }
    }
}

/// Every error found in one config, in file order.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct SiteErrors(pub Vec<SiteError>);

impl fmt::Display for SiteErrors {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        for (i, err) in self.0.iter().enumerate() {
            if i > 0 {
                writeln!(f)?;
            }
            write!(f, "{err}")?;
        }
        Ok(())
    }
}

impl std::error::Error for SiteErrors {}

/// Longest value quoted back in a message; a pasted blob should not flood the screen.
const MAX_VALUE_CHARS: usize = 40;

/// Quote-safe, terminal-safe, short form of a value for an error message.
pub(crate) fn shown_value(raw: &str) -> String {
    let clean = crate::text::sanitize(raw, false);
    if clean.chars().count() <= MAX_VALUE_CHARS {
        return clean;
    }
    let mut short: String = clean.chars().take(MAX_VALUE_CHARS - 1).collect();
    short.push('…');
    short
}

/// Collects errors for one file, turning byte spans into line and column.
pub(crate) struct Sink<'t> {
    path: String,
    text: &'t str,
    line_starts: Vec<usize>,
    errors: Vec<SiteError>,
}

impl<'t> Sink<'t> {
    pub(crate) fn new(text: &'t str, path: &str) -> Self {
        let mut line_starts = vec![0];
        line_starts.extend(text.match_indices('\n').map(|(i, _)| i + 1));
        Sink {
            path: crate::text::sanitize(path, false),
            text,
            line_starts,
            errors: Vec::new(),
        }
    }

    /// 1-based line and character column of a byte offset (clamped to the text).
    pub(crate) fn position(&self, offset: usize) -> (usize, usize) {
        let offset = offset.min(self.text.len());
        let line = self.line_starts.partition_point(|&s| s <= offset);
        let start = self.line_starts[line.saturating_sub(1)];
        let column = self
            .text
            .get(start..offset)
            .map_or(offset - start, |s| s.chars().count());
        (line, column + 1)
    }

    pub(crate) fn push(
        &mut self,
        span: Range<usize>,
        kind: ErrorKind,
        field: &str,
        value: &str,
        message: String,
    ) {
        let (line, column) = self.position(span.start);
        self.errors.push(SiteError {
            path: self.path.clone(),
            line,
            column,
            field: field.to_string(),
            value: shown_value(value),
            message: crate::text::sanitize(&message, false),
            kind,
        });
    }

    /// The source text under a span ("" if the span is not on character boundaries).
    pub(crate) fn slice(&self, span: Range<usize>) -> &'t str {
        self.text.get(span).unwrap_or("")
    }

    pub(crate) fn has_errors(&self) -> bool {
        !self.errors.is_empty()
    }

    /// The errors in file order (stable, so equal positions keep the order they were found).
    pub(crate) fn finish(mut self) -> Vec<SiteError> {
        self.errors.sort_by_key(|e| (e.line, e.column));
        self.errors
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn positions_are_one_based_and_count_characters() {
        let sink = Sink::new("a = 1\nµ = \"x\"\n", "f.toml");
        assert_eq!(sink.position(0), (1, 1));
        assert_eq!(sink.position(4), (1, 5));
        assert_eq!(sink.position(6), (2, 1));
        // 'µ' is two bytes; the '=' after it is still the third character.
        assert_eq!(sink.position(9), (2, 3));
        assert_eq!(sink.position(999), (3, 1));
    }

    #[test]
    fn long_or_hostile_values_are_shortened_and_cleaned() {
        assert_eq!(shown_value("\u{1b}[31mred"), "red");
        let long = "x".repeat(100);
        assert_eq!(shown_value(&long).chars().count(), MAX_VALUE_CHARS);
    }
}
