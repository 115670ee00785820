//! Session file names, session ids and the default operator name.

use super::error::JournalError;
use chrono::{DateTime, Utc};
use std::collections::hash_map::RandomState;
use std::hash::{BuildHasher, Hasher};

/// Longest site id kept in a file name; the full id is inside the file.
const MAX_STEM: usize = 64;

/// The site id made safe for a file name: only `[A-Za-z0-9._-]`, no leading dot.
///
/// Anything that could climb out of the log folder (`/`, `\`, `..`) or hide the file is
/// refused rather than rewritten, so a typo cannot land a journal somewhere unexpected;
/// other characters (spaces, accents) become `-`.
pub fn site_file_stem(site_id: &str) -> Result<String, JournalError> {
    let bad = |reason| JournalError::BadName {
        id: site_id.to_string(),
        reason,
    };
    let id = site_id.trim();
    if id.is_empty() {
        return Err(bad("it is empty"));
    }
    if id.contains(['/', '\\', '\0']) || id.contains("..") {
        return Err(bad("it contains a path separator or '..'"));
    }
    if id.starts_with('.') {
        return Err(bad("it starts with '.'"));
    }
    let stem: String = id
        .chars()
        .map(|c| match c {
            'A'..='Z' | 'a'..='z' | '0'..='9' | '.' | '_' | '-' => c,
            _ => '-',
        })
        .take(MAX_STEM)
        .collect();
    Ok(stem)
}

/// `<site>_<YYYYMMDDTHHMMSSZ>_<session id>.jsonl`, e.g. `demo-site_20261201T182543Z_3f9a0c1e.jsonl`.
pub fn session_file_name(
    site_id: &str,
    started: DateTime<Utc>,
    session_id: &str,
) -> Result<String, JournalError> {
    let stem = site_file_stem(site_id)?;
    let id = site_file_stem(session_id)?;
    Ok(format!(
        "{stem}_{}_{id}.jsonl",
        started.format("%Y%m%dT%H%M%SZ")
    ))
}

/// A fresh 8-hex-digit session id.
///
/// `RandomState` is seeded from the OS per process; mixing in the pid and the time keeps
/// two sessions started in the same second apart. The file is created with `create_new`,
/// so even a clash could never overwrite a journal.
pub fn new_session_id(now: DateTime<Utc>) -> String {
    let mut h = RandomState::new().build_hasher();
    h.write_u32(std::process::id());
    h.write_i64(now.timestamp_nanos_opt().unwrap_or_default());
    format!("{:08x}", h.finish() as u32)
}

/// The operator when none is given: `$USER`, else `$LOGNAME`, else `unknown`.
pub fn os_user() -> String {
    ["USER", "LOGNAME"]
        .iter()
        .filter_map(|k| std::env::var(k).ok())
        .chain(passwd_name())
        .map(|v| super::clean::line(&v))
        .find(|v| !v.is_empty())
        .unwrap_or_else(|| "unknown".to_string())
}

/// The account name for this process's uid from /etc/passwd: services, cron jobs and
/// `su` shells often run without USER or LOGNAME set.
fn passwd_name() -> Option<String> {
    let uid = rustix::process::getuid().as_raw().to_string();
    let passwd = std::fs::read_to_string("/etc/passwd").ok()?;
    user_for_uid(&passwd, &uid)
}

fn user_for_uid(passwd: &str, uid: &str) -> Option<String> {
    passwd.lines().find_map(|line| {
        let mut fields = line.split(':');
        let name = fields.next()?;
        let id = fields.nth(1)?;
        (id == uid && !name.is_empty()).then(|| name.to_string())
    })
}

#[cfg(test)]
mod passwd_tests {
    use super::user_for_uid;

    #[test]
    fn finds_the_name_for_a_uid() {
        // Format from passwd(5): name:password:UID:GID:GECOS:directory:shell.
        let passwd = "root:x:0:0:root:/root:/bin/bash\nana:x:1001:1001:Ana:/home/ana:/bin/sh\n";
        assert_eq!(user_for_uid(passwd, "1001").as_deref(), Some("ana"));
        assert_eq!(user_for_uid(passwd, "0").as_deref(), Some("root"));
        assert_eq!(user_for_uid(passwd, "42"), None);
        assert_eq!(user_for_uid("garbage", "0"), None);
    }
}
