//! Checks across tables: unique ids and product names, and references that resolve.

use super::errors::{ErrorKind, Sink};
use super::raw::RawTable;
use std::ops::Range;

/// How many known names a "no such …" message lists before it stops.
const MAX_LISTED: usize = 8;

/// Every table of the file, as read.
pub(crate) struct Tables<'a, 'i> {
    pub(crate) products: Vec<RawTable<'a, 'i>>,
    pub(crate) viscometers: Vec<RawTable<'a, 'i>>,
    pub(crate) lines: Vec<RawTable<'a, 'i>>,
    pub(crate) pumps: Vec<RawTable<'a, 'i>>,
    pub(crate) tanks: Vec<RawTable<'a, 'i>>,
}

/// One name as written, with where it is and which kind of table holds it.
struct Named<'a> {
    text: &'a str,
    span: Range<usize>,
    field: String,
    table: String,
}

pub(crate) fn check(t: &Tables, sink: &mut Sink) {
    let products = names(&t.products, "name");
    unique(&products, "product names must be unique", sink);
    let mut equipment = names(&t.viscometers, "id");
    equipment.extend(names(&t.lines, "id"));
    equipment.extend(names(&t.pumps, "id"));
    equipment.extend(names(&t.tanks, "id"));
    equipment.sort_by_key(|n| n.span.start);
    let rule = "equipment ids must be unique across viscometers, lines, pumps and tanks";
    unique(&equipment, rule, sink);
    resolve(
        &names(&t.pumps, "feeds"),
        &names(&t.lines, "id"),
        "[[line]] has this id",
        sink,
    );
    resolve(
        &names(&t.tanks, "product"),
        &products,
        "[[product]] has this name",
        sink,
    );
}

fn names<'a>(tables: &[RawTable<'a, '_>], key: &str) -> Vec<Named<'a>> {
    tables
        .iter()
        .filter_map(|t| {
            let (text, span) = t.plain_str(key)?;
            let table = format!("[[{}]]", t.path);
            Some(Named {
                text,
                span,
                field: t.field(key),
                table,
            })
        })
        .collect()
}

/// Report every repeat of an earlier name, pointing at the repeat.
fn unique(all: &[Named], rule: &str, sink: &mut Sink) {
    for (i, later) in all.iter().enumerate() {
        let Some(first) = all[..i].iter().find(|n| n.text == later.text) else {
            continue;
        };
        let (line, _) = sink.position(first.span.start);
        let msg = format!("already used by the {} at line {line}; {rule}", first.table);
        sink.push(
            later.span.clone(),
            ErrorKind::Duplicate,
            &later.field,
            later.text,
            msg,
        );
    }
}

/// Report every reference that names none of `targets` ("no {what}; known: …").
fn resolve(refs: &[Named], targets: &[Named], what: &str, sink: &mut Sink) {
    for r in refs
        .iter()
        .filter(|r| !targets.iter().any(|t| t.text == r.text))
    {
        let known: Vec<&str> = targets.iter().map(|t| t.text).take(MAX_LISTED).collect();
        let more = if targets.len() > MAX_LISTED {
            ", …"
        } else {
            ""
        };
        let listed = if known.is_empty() {
            "there are none in the file".to_string()
        } else {
            format!("known: {}{more}", known.join(", "))
        };
        let msg = format!("no {what}; {listed}");
        sink.push(r.span.clone(), ErrorKind::Dangling, &r.field, r.text, msg);
    }
}
