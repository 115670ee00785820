//! `rheoside report --format html`: one self-contained file that parses as XML, holds every
//! chart the session calls for, refers to nothing outside itself, lets no journal text
//! through raw, and is the same bytes for the same journals.

use super::report_findings::thick_sauce_set;
use assert_cmd::Command;
use chrono::{DateTime, Duration, FixedOffset, Utc};
use rheoside::journal::*;
use std::path::{Path, PathBuf};

fn reading(text: &str) -> Payload {
    rheoside::readings::parse_reading_arg(text)
        .expect("reading parses")
        .payload()
}

/// The thick sauce, P-2 above its relief, a 10 h stop on L-2, a motor current at TK-1 and
/// a note that tries to smuggle in markup and a terminal escape.
fn journal(dir: &Path) -> PathBuf {
    let new = NewSession {
        log_dir: dir.to_path_buf(),
        site_id: "marrowdale-u4".into(),
        site_source: "bundled demo site (invented plant)".into(),
        operator: "K. Amundsen".into(),
    };
    let start = Stamp {
        utc: "2026-03-12T05:00:00Z".parse::<DateTime<Utc>>().unwrap(),
        offset: FixedOffset::east_opt(3600).unwrap(),
    };
    let clock = StepClock::new(start, Duration::seconds(60));
    let mut w = JournalWriter::create(&new, Box::new(clock)).expect("journal created");
    w.append(Some("VIS-A"), thick_sauce_set()).unwrap();
    w.append(Some("P-2"), reading("discharge-pressure=13 bar"))
        .unwrap();
    w.append(Some("L-2"), reading("rest-time=10 h")).unwrap();
    w.append(Some("TK-1"), reading("motor-current=9 A"))
        .unwrap();
    let hostile = "<script>alert(1)</script> & <a href=\"http://x\">x</a>".to_string();
    w.append(None, Payload::Note { text: hostile }).unwrap();
    w.end_session().unwrap();
    w.path().expect("file journal").to_path_buf()
}

fn html(path: &Path) -> String {
    let out = Command::cargo_bin("rheoside")
        .unwrap()
        .args(["report", "--format", "html"])
        .arg(path)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).expect("UTF-8")
}

#[test]
fn the_html_parses_and_holds_every_chart() {
    let dir = tempfile::tempdir().unwrap();
    let text = html(&journal(dir.path()));
    let opts = roxmltree::ParsingOptions {
        allow_dtd: true,
        ..roxmltree::ParsingOptions::default()
    };
    let doc = roxmltree::Document::parse_with_options(&text, opts).expect("well-formed markup");
    let titles: Vec<String> = doc
        .descendants()
        .filter(|n| n.has_tag_name("svg"))
        .filter_map(|svg| svg.children().find(|c| c.has_tag_name("title")))
        .filter_map(|t| t.text().map(str::to_string))
        .collect();
    for wanted in [
        "Set 2: chilli-sauce on VIS-A",
        "Gel build-up: line L-2",
        "Power curve: tank TK-1",
        // P-2 feeds L-2: the line's pressure drop with the pump on it.
        "Line L-2: chilli-sauce",
        // The sauce has limits on K, n and the apparent viscosity (demo site).
        "Trend of chilli-sauce: K",
    ] {
        assert!(
            titles.iter().any(|t| t.starts_with(wanted)),
            "{wanted} not in {titles:?}"
        );
    }
    // The flow curve has its points, its fitted line and its band.
    let flow = doc
        .descendants()
        .find(|n| {
            n.has_tag_name("svg")
                && n.attribute("aria-label")
                    .is_some_and(|a| a.starts_with("Set 2"))
        })
        .unwrap();
    let class = |c: &str| {
        flow.descendants()
            .filter(|n| n.attribute("class") == Some(c))
            .count()
    };
    assert_eq!(class("point"), 5);
    assert_eq!((class("line"), class("band")), (1, 1));
    // Findings come first, and print rules are there.
    let body = text.find("<body>").unwrap();
    assert!(text[body..].find("Findings (").unwrap() < text[body..].find("Session ").unwrap());
    assert!(text.contains("@media print") && text.contains("size:A4"));
    assert!(text.contains("The discharge pressure is above the pump&#39;s relief setting"));
}

#[test]
fn nothing_outside_the_file_and_no_raw_journal_text() {
    let dir = tempfile::tempdir().unwrap();
    let text = html(&journal(dir.path()));
    let opts = roxmltree::ParsingOptions {
        allow_dtd: true,
        ..roxmltree::ParsingOptions::default()
    };
    let doc = roxmltree::Document::parse_with_options(&text, opts).expect("well-formed markup");
    for node in doc.descendants().filter(|n| n.is_element()) {
        let tag = node.tag_name().name();
        assert!(
            !matches!(
                tag,
                "script" | "link" | "img" | "iframe" | "object" | "embed" | "a" | "image" | "use"
            ),
            "element <{tag}> in the report"
        );
        for a in node.attributes() {
            assert!(
                !matches!(a.name(), "href" | "src" | "srcset" | "action")
                    && !a.name().starts_with("on"),
                "attribute {} on <{tag}>",
                a.name()
            );
        }
    }
    let style = doc
        .descendants()
        .find(|n| n.has_tag_name("style"))
        .and_then(|n| n.text())
        .unwrap();
    assert!(!style.contains("url(") && !style.contains("@import"));
    // The hostile note is there as text, escaped in the file.
    assert!(
        text.contains("&lt;script&gt;alert(1)&lt;/script&gt; &amp;"),
        "the note, escaped"
    );
    assert!(!text.contains("<script") && !text.contains('\u{1b}'));
}

#[test]
fn the_same_journals_give_the_same_html_bytes() {
    let dir = tempfile::tempdir().unwrap();
    let path = journal(dir.path());
    assert_eq!(html(&path), html(&path));
}
