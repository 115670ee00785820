//! The whole integration suite as one test binary, so the crate is linked once for it.
//! Each file beside this one is a module; `cargo test --test all NAME` runs one of them.

#[path = "support/tui.rs"]
mod support;

mod cli_fit;
mod cli_mix;
mod cli_restart;
mod fit_truth;
mod fuzz_regressions;
mod help_examples;
mod hub;
mod instrument;
mod journal;
mod journal_crash;
mod journal_runs;
mod layering;
mod line;
mod line_cli;
mod line_props;
mod line_source;
mod mixing;
mod mixing_props;
mod mixing_refs;
mod pump;
mod report;
mod report_findings;
mod report_html;
mod restart;
mod rheology;
mod rheology_choice;
mod rheology_errors;
mod rheology_props;
mod rheology_temperature;
mod session_tank;
mod site;
mod site_tank;
mod trend;
mod trend_sets;
mod tui_e2e;
mod tui_findings;
mod tui_form;
mod tui_guided;
mod tui_guided_e2e;
mod tui_keys;
mod tui_line;
mod tui_render;
mod tui_restart;
mod tui_spot;
mod tui_tank;
mod units;
mod units_plant;
