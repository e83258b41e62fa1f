//! Autosave and recovery: the explorer writes the open session to a recovery
//! file every little while and removes it on a clean exit; a recovery file
//! found at start-up means the last run ended abruptly, and its session can be
//! offered back.
//!
//! The autosave is state, not configuration: the functions without `_in` use
//! [`super::config_dir::state_dir`] (and take back an autosave an earlier
//! version left in [`super::config_dir::legacy_dir`]); the `_in` forms take the
//! directory explicitly.

use super::config_dir::{legacy_dir, state_dir};
use super::error::SessionError;
use super::model::Session;
use super::store;
use std::fs;
use std::path::{Path, PathBuf};

const RECOVERY_FILE: &str = "recovery.ron";
const TAKEN_FILE: &str = "recovery-taken.ron";

/// Where the autosave lives, if the platform has a state directory.
pub fn recovery_path() -> Option<PathBuf> {
    state_dir().map(|d| d.join(RECOVERY_FILE))
}

/// Writes the autosave (atomically, like any save).
pub fn write_recovery(session: &Session) -> Result<(), SessionError> {
    let dir = state_dir().ok_or(SessionError::NoConfigDir)?;
    write_recovery_in(&dir, session)
}

/// Takes the autosave left by an abrupt exit, if any (in the state directory,
/// else one an earlier version left in the old configuration directory). The
/// file is moved aside to `recovery-taken.ron` (not deleted) so that a second
/// crash cannot lose it. A damaged autosave is moved aside too and gives `None`.
pub fn take_recovery() -> Option<Session> {
    state_dir()
        .and_then(|d| take_recovery_in(&d))
        .or_else(|| take_recovery_in(&legacy_dir()?))
}

/// Removes the autosave (on a clean exit).
pub fn clear_recovery() {
    if let Some(dir) = state_dir() {
        clear_recovery_in(&dir);
    }
}

/// [`write_recovery`] in a given directory (created if needed).
pub fn write_recovery_in(dir: &Path, session: &Session) -> Result<(), SessionError> {
    fs::create_dir_all(dir).map_err(|e| SessionError::Write {
        path: dir.into(),
        reason: e.to_string(),
    })?;
    store::save(&dir.join(RECOVERY_FILE), session)
}

/// [`take_recovery`] in a given directory.
pub fn take_recovery_in(dir: &Path) -> Option<Session> {
    let path = dir.join(RECOVERY_FILE);
    if !path.is_file() {
        return None;
    }
    let loaded = store::load(&path).ok();
    let _ = fs::rename(&path, dir.join(TAKEN_FILE));
    let _ = fs::remove_file(store::backup_path(&path));
    loaded
}

/// [`clear_recovery`] in a given directory.
pub fn clear_recovery_in(dir: &Path) {
    let path = dir.join(RECOVERY_FILE);
    let _ = fs::remove_file(&path);
    let _ = fs::remove_file(store::backup_path(&path));
}
