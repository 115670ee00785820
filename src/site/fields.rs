//! Typed reads of one table's fields: text, ids, quantities with units, numbers, flags and
//! choices. Each read reports its own mistakes and yields `None` for an absent or bad value.

use super::errors::{ErrorKind, Sink};
use super::raw::{RawTable, Value, type_name, value_text};
use super::values::{bare_allowed, id_problem, sample, toml_f64, unit_message};
use crate::units::{self, Dimension};
use toml::de::DeValue;

pub(crate) use super::values::{Need, Rule};

impl<'a> RawTable<'a, '_> {
    /// Report a problem with one of this table's values (which must be present).
    pub(crate) fn fail(&self, sink: &mut Sink, key: &str, kind: ErrorKind, message: String) {
        if let Some(v) = self.get(key) {
            let text = value_text(v, sink);
            sink.push(v.span(), kind, &self.field(key), &text, message);
        }
    }

    /// Say a required field is missing, pointing at the table header. Returns presence.
    pub(crate) fn need(&self, sink: &mut Sink, key: &str, need: Need, accepted: &str) -> bool {
        if self.has(key) {
            return true;
        }
        if need == Need::Required {
            let msg = format!("missing field '{key}' in {} — {accepted}", self.label);
            sink.push(
                self.header.clone(),
                ErrorKind::Missing,
                &self.field(key),
                "",
                msg,
            );
        }
        false
    }

    pub(crate) fn wrong_type(&self, sink: &mut Sink, key: &str, v: &Value<'_>, expected: &str) {
        let msg = format!("expected {expected}, found {}", type_name(v));
        self.fail(sink, key, ErrorKind::WrongType, msg);
    }

    /// The raw string of a field, or a "wrong type" report naming `expected`.
    pub(crate) fn string_value(
        &self,
        sink: &mut Sink,
        key: &str,
        need: Need,
        accepted: &str,
        expected: &str,
    ) -> Option<&'a str> {
        if !self.need(sink, key, need, accepted) {
            return None;
        }
        let v = self.get(key)?;
        let s = v.get_ref().as_str();
        if s.is_none() {
            self.wrong_type(sink, key, v, expected);
        }
        s
    }

    /// A quoted string, sanitised; an empty one counts as a mistake.
    pub(crate) fn text(&self, sink: &mut Sink, key: &str, need: Need) -> Option<String> {
        let expected = "a text value in quotes, e.g. \"Line 1\"";
        let s = self.string_value(sink, key, need, "give a text value in quotes", expected)?;
        let clean = crate::text::sanitize(s, false).trim().to_string();
        if clean.is_empty() {
            self.fail(sink, key, ErrorKind::BadValue, "must not be empty".into());
            return None;
        }
        Some(clean)
    }

    /// An id: letters, digits, '.', '_' and '-' only, at most [`super::values::MAX_ID_CHARS`].
    pub(crate) fn id(&self, sink: &mut Sink, key: &str, need: Need) -> Option<String> {
        let accepted = "give an id of letters, digits, '.', '_' or '-', e.g. \"P-101\"";
        let expected = "an id in quotes, e.g. \"P-101\"";
        let s = self.string_value(sink, key, need, accepted, expected)?;
        match id_problem(s) {
            None => Some(s.to_string()),
            Some(problem) => {
                self.fail(sink, key, ErrorKind::BadId, problem);
                None
            }
        }
    }

    /// The opening of every equipment table: its required `id` (which then names the table
    /// in later messages) and an optional free-text `description`.
    pub(crate) fn identity(&mut self, sink: &mut Sink) -> (Option<String>, String) {
        let id = self.id(sink, "id", Need::Required);
        if let Some(id) = &id {
            self.name_it(id);
        }
        let description = self
            .text(sink, "description", Need::Optional)
            .unwrap_or_default();
        (id, description)
    }

    /// A quantity written as a string with its unit, checked against `rule`, in SI.
    pub(crate) fn quantity(
        &self,
        sink: &mut Sink,
        key: &str,
        dim: Dimension,
        rule: Rule,
        need: Need,
    ) -> Option<f64> {
        let example = match bare_allowed(dim) {
            true => format!("give a number, e.g. {}", sample(dim)),
            false => format!("give a {} with its unit, e.g. {}", dim.name(), sample(dim)),
        };
        if !self.need(sink, key, need, &example) {
            return None;
        }
        let v = self.get(key)?;
        let si = match v.get_ref() {
            DeValue::String(s) => self.parse_quantity(sink, key, s, dim)?,
            DeValue::Integer(_) | DeValue::Float(_) if bare_allowed(dim) => {
                self.toml_number(sink, key, v)?
            }
            _ => {
                let expected = format!(
                    "a {} as text with its unit, e.g. {}",
                    dim.name(),
                    sample(dim)
                );
                self.wrong_type(sink, key, v, &expected);
                return None;
            }
        };
        self.check(sink, key, si, rule, dim)
    }

    /// A plain number (TOML number or quoted), checked against `rule`.
    pub(crate) fn number(&self, sink: &mut Sink, key: &str, rule: Rule, need: Need) -> Option<f64> {
        self.quantity(sink, key, Dimension::Dimensionless, rule, need)
    }

    fn parse_quantity(&self, sink: &mut Sink, key: &str, s: &str, dim: Dimension) -> Option<f64> {
        if !bare_allowed(dim) && s.trim().parse::<f64>().is_ok() {
            let msg = format!(
                "a bare number is ambiguous here; add the unit, e.g. '{} {}' (accepted: {})",
                s.trim(),
                dim.default_unit(),
                dim.accepted_list()
            );
            self.fail(sink, key, ErrorKind::BadValue, msg);
            return None;
        }
        match units::parse(s, dim) {
            Ok(si) => Some(si),
            Err(e) => {
                self.fail(sink, key, ErrorKind::BadValue, unit_message(&e, dim));
                None
            }
        }
    }

    fn toml_number(&self, sink: &mut Sink, key: &str, v: &Value<'_>) -> Option<f64> {
        let x = toml_f64(v.get_ref()).filter(|x| x.is_finite());
        if x.is_none() {
            self.fail(
                sink,
                key,
                ErrorKind::BadValue,
                "must be a finite number".into(),
            );
        }
        x
    }

    fn check(
        &self,
        sink: &mut Sink,
        key: &str,
        si: f64,
        rule: Rule,
        dim: Dimension,
    ) -> Option<f64> {
        if rule.allows(si) {
            return Some(si);
        }
        let mut msg = rule.explain(dim);
        if !bare_allowed(dim) {
            msg.push_str(&format!("; give a {}, e.g. {}", dim.name(), sample(dim)));
        }
        self.fail(sink, key, ErrorKind::BadValue, msg);
        None
    }

    /// `true` or `false`.
    pub(crate) fn flag(&self, sink: &mut Sink, key: &str, need: Need) -> Option<bool> {
        if !self.need(sink, key, need, "give true or false") {
            return None;
        }
        let v = self.get(key)?;
        let b = v.get_ref().as_bool();
        if b.is_none() {
            self.wrong_type(sink, key, v, "true or false (without quotes)");
        }
        b
    }

    /// One of a fixed set of names, e.g. a pump kind.
    pub(crate) fn choice<T: Copy>(
        &self,
        sink: &mut Sink,
        key: &str,
        options: &[(&str, T)],
        need: Need,
    ) -> Option<T> {
        let names: Vec<String> = options.iter().map(|(n, _)| format!("'{n}'")).collect();
        let names = names.join(", ");
        let expected = format!("a name in quotes, one of {names}");
        let s = self.string_value(sink, key, need, &format!("give one of {names}"), &expected)?;
        let found = options
            .iter()
            .find(|(n, _)| *n == s.trim())
            .map(|(_, t)| *t);
        if found.is_none() {
            self.fail(
                sink,
                key,
                ErrorKind::BadValue,
                format!("not accepted here; use one of {names}"),
            );
        }
        found
    }

    /// A list of text values, e.g. operator names; bad items are reported one by one.
    pub(crate) fn texts(&self, sink: &mut Sink, key: &str) -> Vec<String> {
        let Some(v) = self.get(key) else {
            return Vec::new();
        };
        let DeValue::Array(items) = v.get_ref() else {
            self.wrong_type(
                sink,
                key,
                v,
                "a list of names, e.g. [\"A. Name\", \"B. Name\"]",
            );
            return Vec::new();
        };
        let mut out = Vec::new();
        for item in items.iter() {
            let clean = item
                .get_ref()
                .as_str()
                .map(|s| crate::text::sanitize(s, false));
            match clean {
                Some(s) if !s.trim().is_empty() => out.push(s.trim().to_string()),
                _ => {
                    let msg = format!("expected a name in quotes, found {}", type_name(item));
                    let text = value_text(item, sink);
                    sink.push(
                        item.span(),
                        ErrorKind::WrongType,
                        &self.field(key),
                        &text,
                        msg,
                    );
                }
            }
        }
        out
    }
}
