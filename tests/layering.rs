//! The module layering, checked by reading `src/`: a module may import only the floors
//! below it (DEVELOPERS.md, "Module map"). Fails naming the file, the line and the import.

use std::collections::BTreeSet;
use std::path::{Path, PathBuf};

/// The floors, bottom first. A module may use its own floor's other modules only where the
/// floor says so (`peers`), and every floor below.
const FLOORS: &[(&[&str], bool)] = &[
    (&["units", "text"], false),
    (
        &[
            "rheology",
            "instrument",
            "line",
            "pump",
            "mixing",
            "diagnose",
        ],
        true,
    ),
    (&["site", "journal", "readings"], true),
    (&["session"], false),
    (&["present"], false),
    (&["cli", "tui"], false),
];

/// What `module` may import, or `None` if it is not on any floor.
fn allowed(module: &str) -> Option<BTreeSet<&'static str>> {
    let at = FLOORS.iter().position(|(mods, _)| mods.contains(&module))?;
    let mut ok: BTreeSet<&'static str> = FLOORS[..at]
        .iter()
        .flat_map(|(mods, _)| mods.iter().copied())
        .collect();
    if FLOORS[at].1 {
        ok.extend(FLOORS[at].0.iter().copied());
    }
    Some(ok)
}

/// Every `crate::NAME` a source text names, with its line number (comments included: a
/// doc link across floors is a dependency of the reader, too).
fn crate_paths(text: &str) -> Vec<(usize, String)> {
    let mut out = Vec::new();
    for (i, line) in text.lines().enumerate() {
        let mut rest = line;
        while let Some(at) = rest.find("crate::") {
            let after = &rest[at + "crate::".len()..];
            let name: String = after
                .chars()
                .take_while(|c| c.is_ascii_alphanumeric() || *c == '_')
                .collect();
            let whole_word = at == 0 || !rest[..at].ends_with(|c: char| c.is_alphanumeric());
            if whole_word && !name.is_empty() {
                out.push((i + 1, name));
            }
            rest = after;
        }
    }
    out
}

/// Imports across the allowed table in one module's file, as "file:line: a imports b".
fn violations(module: &str, file: &Path, text: &str) -> Vec<String> {
    let Some(ok) = allowed(module) else {
        return vec![format!(
            "{}: module '{module}' is on no floor",
            file.display()
        )];
    };
    crate_paths(text)
        .into_iter()
        .filter(|(_, used)| used != module && !ok.contains(used.as_str()))
        .map(|(line, used)| format!("{}:{line}: {module} imports {used}", file.display()))
        .collect()
}

fn rust_files(dir: &Path, out: &mut Vec<PathBuf>) {
    let Ok(entries) = std::fs::read_dir(dir) else {
        return;
    };
    for e in entries.flatten() {
        let path = e.path();
        if path.is_dir() {
            rust_files(&path, out);
        } else if path.extension().is_some_and(|x| x == "rs") {
            out.push(path);
        }
    }
}

#[test]
fn every_module_imports_only_the_floors_below_it() {
    let src = Path::new(env!("CARGO_MANIFEST_DIR")).join("src");
    let mut files = Vec::new();
    rust_files(&src, &mut files);
    files.sort();
    let mut bad = Vec::new();
    for file in &files {
        let rel = file.strip_prefix(&src).expect("under src");
        let first = rel.components().next().expect("a path");
        let module = first.as_os_str().to_string_lossy();
        let module = module.trim_end_matches(".rs");
        if matches!(module, "lib" | "main") {
            continue;
        }
        let text = std::fs::read_to_string(file).expect("a readable source file");
        bad.extend(violations(module, rel, &text));
    }
    assert!(files.len() > 50, "read {} files only", files.len());
    assert!(
        bad.is_empty(),
        "imports across the layering:\n{}",
        bad.join("\n")
    );
}

#[test]
fn the_checker_catches_an_engine_module_reaching_up() {
    // A deliberate violation: the engine reading the site config and the screens.
    let text =
        "use crate::units::Dimension;\nuse crate::site::Site;\nfn f() { crate::tui::run(); }";
    let got = violations("rheology", Path::new("rheology/x.rs"), text);
    assert_eq!(
        got,
        [
            "rheology/x.rs:2: rheology imports site",
            "rheology/x.rs:3: rheology imports tui"
        ]
    );
    // The faces never use each other; storage may use the engine.
    assert_eq!(
        violations("cli", Path::new("cli/a.rs"), "crate::tui::x").len(),
        1
    );
    assert!(
        violations(
            "site",
            Path::new("site/a.rs"),
            "crate::instrument::Geometry"
        )
        .is_empty()
    );
}
