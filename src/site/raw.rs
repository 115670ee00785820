//! The document as read: each table keeps only its known keys (all optional here, with
//! spans); unknown keys and misplaced tables are reported on the way in.

use super::errors::{ErrorKind, Sink};
use super::suggest::closest;
use std::ops::Range;
use toml::Spanned;
use toml::de::DeValue;

pub(crate) type Value<'i> = Spanned<DeValue<'i>>;

/// One TOML table as read, before any value is checked.
pub(crate) struct RawTable<'a, 'i> {
    /// Dotted key path used in messages, e.g. `pump.curve`.
    pub(crate) path: String,
    /// How the table is named in messages, e.g. `[[pump]] 'P-101'`.
    pub(crate) label: String,
    /// Span of the table's header (or of the inline table), where "missing field" points.
    pub(crate) header: Range<usize>,
    entries: Vec<(&'static str, &'a Value<'i>)>,
}

impl<'a, 'i> RawTable<'a, 'i> {
    /// Read a table value, keeping the keys in `known` and reporting the rest.
    pub(crate) fn read(
        value: &'a Value<'i>,
        path: &str,
        label: String,
        known: &[&'static str],
        sink: &mut Sink,
    ) -> Option<Self> {
        let DeValue::Table(table) = value.get_ref() else {
            let msg = format!("expected a table here, found {}", type_name(value));
            sink.push(
                value.span(),
                ErrorKind::WrongType,
                path,
                &value_text(value, sink),
                msg,
            );
            return None;
        };
        let mut entries = Vec::new();
        for (key, val) in table.iter() {
            match known.iter().find(|k| **k == key.get_ref().as_ref()) {
                Some(k) => entries.push((*k, val)),
                None => report_unknown(key, val, path, &label, known, sink),
            }
        }
        let header = value.span();
        Some(RawTable {
            path: path.to_string(),
            label,
            header,
            entries,
        })
    }

    /// The document root: an unknown top-level table points at its key.
    pub(crate) fn root(
        value: &'a Value<'i>,
        known: &[&'static str],
        sink: &mut Sink,
    ) -> Option<Self> {
        Self::read(value, "", "the file".to_string(), known, sink)
    }

    pub(crate) fn get(&self, key: &str) -> Option<&'a Value<'i>> {
        self.entries
            .iter()
            .find(|(k, _)| *k == key)
            .map(|(_, v)| *v)
    }

    pub(crate) fn has(&self, key: &str) -> bool {
        self.get(key).is_some()
    }

    /// Full dotted name of one of this table's keys.
    pub(crate) fn field(&self, key: &str) -> String {
        if self.path.is_empty() {
            key.to_string()
        } else {
            format!("{}.{key}", self.path)
        }
    }

    /// A string value without any checking, for cross-reference passes.
    pub(crate) fn plain_str(&self, key: &str) -> Option<(&'a str, Range<usize>)> {
        let v = self.get(key)?;
        v.get_ref().as_str().map(|s| (s, v.span()))
    }

    /// A nested table, e.g. `[product.gel]`.
    pub(crate) fn table(&self, key: &str, known: &[&'static str], sink: &mut Sink) -> Option<Self> {
        let v = self.get(key)?;
        let label = if self.path.is_empty() {
            format!("[{key}]")
        } else {
            format!("[{}] of {}", self.field(key), self.label)
        };
        RawTable::read(v, &self.field(key), label, known, sink)
    }

    /// An array of tables, e.g. `[[pump]]` at the root or `curve = [{…}, …]` in a pump.
    pub(crate) fn tables(&self, key: &str, known: &[&'static str], sink: &mut Sink) -> Vec<Self> {
        let Some(v) = self.get(key) else {
            return Vec::new();
        };
        let path = self.field(key);
        let DeValue::Array(items) = v.get_ref() else {
            let msg = format!("expected a list of tables: write [[{path}]] for each entry");
            sink.push(
                v.span(),
                ErrorKind::WrongType,
                &path,
                &value_text(v, sink),
                msg,
            );
            return Vec::new();
        };
        items
            .iter()
            .filter_map(|item| RawTable::read(item, &path, format!("[[{path}]]"), known, sink))
            .collect()
    }

    /// Name the table after its id once that is known, for clearer "missing field" messages.
    pub(crate) fn name_it(&mut self, id: &str) {
        self.label = format!("[[{}]] '{}'", self.path, id);
    }
}

fn report_unknown(
    key: &Spanned<std::borrow::Cow<'_, str>>,
    val: &Value<'_>,
    path: &str,
    label: &str,
    known: &[&'static str],
    sink: &mut Sink,
) {
    let typed = key.get_ref().as_ref();
    let field = if path.is_empty() {
        typed.to_string()
    } else {
        format!("{path}.{typed}")
    };
    let hint = match closest(typed, known) {
        Some(k) => format!("did you mean '{k}'?"),
        None => format!("known keys: {}", known.join(", ")),
    };
    let what = if matches!(val.get_ref(), DeValue::Table(_) | DeValue::Array(_)) && path.is_empty()
    {
        "unknown table"
    } else {
        "unknown key"
    };
    let msg = format!("{what} in {label}; {hint}");
    sink.push(
        key.span(),
        ErrorKind::UnknownKey,
        &field,
        &value_text(val, sink),
        msg,
    );
}

/// The value as the user wrote it: a string's contents, otherwise the source text.
pub(crate) fn value_text(v: &Value<'_>, sink: &Sink) -> String {
    match v.get_ref() {
        DeValue::String(s) => s.to_string(),
        _ => sink.slice(v.span()).to_string(),
    }
}

/// TOML type of a value, for "expected …, found …" messages.
pub(crate) fn type_name(v: &Value<'_>) -> &'static str {
    match v.get_ref() {
        DeValue::String(_) => "a string",
        DeValue::Integer(_) => "an integer",
        DeValue::Float(_) => "a number",
        DeValue::Boolean(_) => "true/false",
        DeValue::Datetime(_) => "a date/time",
        DeValue::Array(_) => "a list",
        DeValue::Table(_) => "a table",
    }
}
