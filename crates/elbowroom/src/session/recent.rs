//! The recently opened sessions, most recent first, kept in
//! `recent.ron` in the configuration directory (at most [`MAX_RECENT`]),
//! written atomically ([`crate::atomic_write`]).
//!
//! The functions without `_in` use [`super::config_dir::config_dir`], and read
//! the list an earlier version left in [`super::config_dir::legacy_dir`] while
//! the configuration directory has none (the next push writes it over to the
//! new place); the `_in` forms take the directories explicitly.

use super::config_dir::{config_dir, legacy_dir};
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
    config_dir()
        .map(|d| load_or_legacy_in(&d, legacy_dir().as_deref()))
        .unwrap_or_default()
}

/// Records `path` as the most recent session.
pub fn push(path: &Path) -> Result<(), SessionError> {
    let dir = config_dir().ok_or(SessionError::NoConfigDir)?;
    push_or_legacy_in(&dir, legacy_dir().as_deref(), path)
}

/// The list in `dir`, or, when `dir` holds no list, the one in `legacy`.
pub fn load_or_legacy_in(dir: &Path, legacy: Option<&Path>) -> Vec<PathBuf> {
    match legacy {
        Some(old) if !dir.join(RECENT_FILE).exists() => load_in(old),
        _ => load_in(dir),
    }
}

/// [`push_in`] onto the list [`load_or_legacy_in`] reads: the first push
/// after an upgrade carries the old list over to `dir`.
pub fn push_or_legacy_in(
    dir: &Path,
    legacy: Option<&Path>,
    path: &Path,
) -> Result<(), SessionError> {
    let list = load_or_legacy_in(dir, legacy);
    push_onto(dir, list, path)
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
    push_onto(dir, load_in(dir), path)
}

/// Writes `list` with `path` in front into `dir`.
fn push_onto(dir: &Path, mut list: Vec<PathBuf>, path: &Path) -> Result<(), SessionError> {
    let failed = |reason: String| SessionError::Write {
        path: dir.join(RECENT_FILE),
        reason,
    };
    let path = fs::canonicalize(path).unwrap_or_else(|_| path.to_path_buf());
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
