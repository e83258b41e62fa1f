//! The recently opened sessions, most recent first, kept in
//! `recent.ron` in the configuration directory (at most [`MAX_RECENT`]),
//! written atomically ([`crate::atomic_write`]).
//!
//! The functions without `_in` use [`super::config_dir::config_dir`]; the `_in`
//! forms take the directory explicitly.

use super::config_dir::config_dir;
use super::error::SessionError;
use crate::atomic_write;
use std::fs;
use std::path::{Path, PathBuf};

/// How many recent sessions are remembered.
pub const MAX_RECENT: usize = 12;

const RECENT_FILE: &str = "recent.ron";

/// The recent sessions, most recent first; empty if none are recorded or the
/// list cannot be read. Files that no longer exist are left out.
pub fn load() -> Vec<PathBuf> {
    config_dir().map(|d| load_in(&d)).unwrap_or_default()
}

/// Records `path` as the most recent session.
pub fn push(path: &Path) -> Result<(), SessionError> {
    let dir = config_dir().ok_or(SessionError::NoConfigDir)?;
    push_in(&dir, path)
}

/// [`load`] in a given directory.
pub fn load_in(dir: &Path) -> Vec<PathBuf> {
    let Ok(text) = super::store::read_bounded(&dir.join(RECENT_FILE)) else {
        return Vec::new();
    };
    let reader =
        ron::Options::default().with_recursion_limit(crate::math::limits::RON_NESTING_LIMIT);
    let Ok(list) = reader.from_str::<Vec<PathBuf>>(&text) else {
        return Vec::new();
    };
    list.into_iter().filter(|p| p.is_file()).collect()
}

/// [`push`] in a given directory (created if needed).
pub fn push_in(dir: &Path, path: &Path) -> Result<(), SessionError> {
    let failed = |reason: String| SessionError::Write {
        path: dir.join(RECENT_FILE),
        reason,
    };
    let path = fs::canonicalize(path).unwrap_or_else(|_| path.to_path_buf());
    let mut list = load_in(dir);
    list.retain(|p| p != &path);
    list.insert(0, path);
    list.truncate(MAX_RECENT);
    let text = ron::ser::to_string_pretty(&list, ron::ser::PrettyConfig::new())
        .map_err(|e| failed(e.to_string()))?;
    fs::create_dir_all(dir).map_err(|e| failed(e.to_string()))?;
    let target = dir.join(RECENT_FILE);
    atomic_write::write(&target, "saving", format!("{text}\n").as_bytes())
        .map_err(|e| failed(e.to_string()))
}
