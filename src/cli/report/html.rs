//! The handover as one self-contained HTML file: no external assets, no scripts, printable on
//! A4. Findings first, then each session: its flow curves as inline SVG charts (log axes,
//! points, fitted curve and its scatter band), the restart and tank charts, every reading in
//! a table, the notes, and the cautions. Markup is XHTML-compatible (every element closed,
//! attributes quoted) so a test can parse it as XML; all journal text is escaped.

use super::html_charts::{restart_charts, set_chart, tank_charts};
use super::ranked::ranked;
use super::svg::escape;
use super::{CAUTIONS, Inputs, Journal, local_text, problems, reading_value};
use crate::present::Style;
use crate::present::findings::words;
use crate::site::Site;
use std::fmt::Write as _;

const STYLE: &str = "body{font-family:sans-serif;font-size:11pt;margin:1.5em;color:#111}\
h1{font-size:18pt}h2{font-size:14pt;border-bottom:1px solid #999}h3{font-size:12pt}\
table{border-collapse:collapse;margin:0.5em 0}td,th{border:1px solid #bbb;padding:2px 6px;font-size:9pt}\
.finding{border-left:6px solid #999;padding:0.2em 0.8em;margin:0.6em 0}\
.alarm{border-color:#b30000}.caution{border-color:#e6a100}.information{border-color:#3a78b5}\
svg.chart{max-width:100%;height:auto}\
@media print{@page{size:A4;margin:15mm}body{margin:0}.finding,figure,table{page-break-inside:avoid}\
h2{page-break-before:auto;page-break-after:avoid}h3{page-break-after:avoid}}";

pub(crate) fn render(inputs: &Inputs) -> String {
    let site = inputs.site;
    let mut out =
        String::from("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n");
    let _ = writeln!(
        out,
        "<title>Shift handover report: {}</title>",
        escape(&site.name)
    );
    let _ = writeln!(out, "<style>{STYLE}</style>\n</head>\n<body>");
    let _ = writeln!(out, "<h1>Shift handover report</h1>");
    let _ = writeln!(
        out,
        "<p>Site config: {} ({}), from {}. Sessions: {}, by start time. Times are local, with the UTC offset then in force.</p>",
        escape(&site.name),
        escape(&site.id),
        escape(&site.source),
        inputs.journals.len()
    );
    out.push_str(&findings(inputs));
    for j in &inputs.journals {
        out.push_str(&session(site, j));
    }
    out.push_str(&super::html_more::trend_charts(&inputs.journals, site));
    if !inputs.failed.is_empty() {
        out.push_str("<h2>Journals left out</h2>\n<ul>\n");
        for f in &inputs.failed {
            let _ = writeln!(out, "<li>{}</li>", escape(f));
        }
        out.push_str("</ul>\n");
    }
    out.push_str("<h2>Cautions</h2>\n<ul>\n");
    for c in CAUTIONS {
        let _ = writeln!(out, "<li>{}</li>", escape(c));
    }
    out.push_str("</ul>\n</body>\n</html>\n");
    out
}

fn findings(inputs: &Inputs) -> String {
    let style = Style::new(inputs.site.unit_system, false);
    let all = ranked(inputs);
    let mut out = format!("<h2>Findings ({}), most urgent first</h2>\n", all.len());
    if all.is_empty() {
        out.push_str("<p>No rule found anything to report in these sessions.</p>\n");
    }
    for r in &all {
        let w = words(&r.finding, style);
        let _ = writeln!(
            out,
            "<div class=\"finding {}\">\n<p><strong>{}</strong> <small>(rule {}, session {})</small></p>",
            r.finding.severity.code(),
            escape(&w.headline),
            r.finding.rule.id(),
            escape(&r.session)
        );
        out.push_str("<ul>\n");
        for n in &w.numbers {
            let _ = writeln!(out, "<li>{}</li>", escape(n));
        }
        if !w.next_checks.is_empty() {
            let _ = writeln!(out, "<li>Next: {}</li>", escape(&w.next_checks.join("; ")));
        }
        let _ = writeln!(
            out,
            "<li>Caution: {}</li>\n</ul>\n</div>",
            escape(&w.caution)
        );
    }
    out
}

fn session(site: &Site, j: &Journal) -> String {
    let s = &j.state;
    let mut out = format!("<h2>Session {}</h2>\n<table>\n", escape(&s.session_id));
    let when = |m: Option<crate::session::Moment>| {
        m.map_or("not recorded".to_string(), |m| local_text(&m))
    };
    for (k, v) in [
        ("Journal", j.path.clone()),
        ("Operators", s.operators.join(", ")),
        ("Started", when(s.started)),
        ("Ended", when(s.ended)),
        ("Records", s.records.to_string()),
    ] {
        let _ = writeln!(out, "<tr><th>{k}</th><td>{}</td></tr>", escape(&v));
    }
    out.push_str("</table>\n");
    let problems = problems(site, j);
    if !problems.is_empty() {
        out.push_str("<h3>Journal problems</h3>\n<ul>\n");
        for p in problems {
            let _ = writeln!(out, "<li>{}</li>", escape(&p));
        }
        out.push_str("</ul>\n");
    }
    out.push_str(&readings(site, j));
    let _ = writeln!(out, "<h3>Flow curves ({})</h3>", s.sets.len());
    for e in &s.sets {
        out.push_str(&set_chart(e));
    }
    out.push_str(&super::html_more::line_charts(&j.state, site));
    out.push_str(&restart_charts(&j.state, site));
    out.push_str(&tank_charts(&j.state, site));
    out.push_str(&notes(j));
    out
}

fn readings(site: &Site, j: &Journal) -> String {
    let s = &j.state;
    let mut out = format!("<h3>Readings ({})</h3>\n", s.readings.len());
    if s.readings.is_empty() {
        out.push_str("<p>None recorded.</p>\n");
        return out;
    }
    out.push_str("<table>\n<tr><th>record</th><th>local time</th><th>operator</th><th>equipment</th><th>reading</th><th>as typed</th><th>value</th></tr>\n");
    for r in &s.readings {
        let _ = writeln!(
            out,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            r.seq,
            escape(&local_text(&r.at)),
            escape(&r.operator),
            escape(r.equipment.as_deref().unwrap_or("")),
            escape(&r.item.name),
            escape(&r.item.raw),
            escape(&reading_value(&r.item, site.unit_system))
        );
    }
    out.push_str("</table>\n");
    out
}

fn notes(j: &Journal) -> String {
    let s = &j.state;
    let mut out = format!("<h3>Notes ({})</h3>\n", s.notes.len());
    if s.notes.is_empty() {
        out.push_str("<p>None recorded.</p>\n");
    }
    for n in &s.notes {
        let _ = writeln!(
            out,
            "<p>Record {}, {}, {}: {}</p>",
            n.seq,
            escape(&local_text(&n.at)),
            escape(&n.operator),
            escape(&n.item)
        );
    }
    let _ = writeln!(
        out,
        "<h3>Findings noted by the operator ({})</h3>",
        s.findings.len()
    );
    for f in &s.findings {
        let _ = writeln!(out, "<p>Record {}: {}</p>", f.seq, escape(&f.item.text));
    }
    out
}
