//! What the screens are started with: a plain struct, so the TUI knows nothing of the command
//! line's parser, and the command line knows nothing of the TUI.

use std::path::PathBuf;

/// Options for the screens.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct TuiOptions {
    /// Site config; `None` is the bundled demo.
    pub site: Option<PathBuf>,
    /// Continue this session journal instead of starting a new one.
    pub resume: Option<PathBuf>,
    /// Folder for new session journals (default `logs/`).
    pub log_dir: Option<PathBuf>,
    /// Operator name for the journal (default: the OS user).
    pub operator: Option<String>,
    /// Plain ASCII glyphs only.
    pub ascii: bool,
}
