//! Saving and opening session files.
//!
//! Saving is atomic: the text goes to a temporary file in the same directory,
//! which is flushed to disk and then renamed over the target, so a crash or a
//! full disk leaves either the old file or the new one, never half of one.
//! The previous version of the file is kept beside it as `NAME.bak`.
//! Loading never writes: a damaged or newer file stays as it was.

use super::error::SessionError;
use super::format;
use super::model::Session;
use super::validate;
use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

/// Opens a session file: reads it, migrates older versions, and validates it.
///
/// Errors say what was wrong: the line and column of a syntax error or a
/// field of the wrong type, a refused newer version, or the field that makes
/// the session impossible.
pub fn load(path: &Path) -> Result<Session, SessionError> {
    let text = fs::read_to_string(path).map_err(|e| SessionError::Read {
        path: path.into(),
        reason: e.to_string(),
    })?;
    load_str(&text, path)
}

/// Reads a session from file text; `path` is used in messages only.
pub fn load_str(text: &str, path: &Path) -> Result<Session, SessionError> {
    let session = format::decode(text, path)?;
    validate::check(&session).map_err(|reason| SessionError::Invalid {
        path: path.into(),
        reason,
    })?;
    Ok(session)
}

/// Saves a session atomically, keeping the previous file as `NAME.bak`.
pub fn save(path: &Path, session: &Session) -> Result<(), SessionError> {
    let temp = write_temp(path, session)?;
    finish(path, &temp)
}

/// The backup kept beside `path` when it is overwritten: `NAME.bak`.
pub fn backup_path(path: &Path) -> PathBuf {
    let mut name = path
        .file_name()
        .map(|s| s.to_os_string())
        .unwrap_or_default();
    name.push(".bak");
    path.with_file_name(name)
}

/// The temporary file a save of `path` writes first: `.NAME.saving`.
pub fn temp_path(path: &Path) -> PathBuf {
    let mut name = std::ffi::OsString::from(".");
    name.push(path.file_name().unwrap_or_default());
    name.push(".saving");
    path.with_file_name(name)
}

/// Performs a save up to, but not including, the rename: the state a crash
/// between the two steps leaves behind. Returns the temporary file written.
/// Exists so tests can check that such a crash leaves the old file intact.
#[doc(hidden)]
pub fn save_stopping_before_rename(
    path: &Path,
    session: &Session,
) -> Result<PathBuf, SessionError> {
    write_temp(path, session)
}

fn write_failed(path: &Path, reason: impl std::fmt::Display) -> SessionError {
    SessionError::Write {
        path: path.into(),
        reason: reason.to_string(),
    }
}

fn write_temp(path: &Path, session: &Session) -> Result<PathBuf, SessionError> {
    if path.file_name().is_none() {
        return Err(write_failed(path, "the path names no file"));
    }
    validate::check(session).map_err(|reason| write_failed(path, reason))?;
    let text = format::encode(session).map_err(|e| write_failed(path, e))?;
    let temp = temp_path(path);
    let result = (|| -> std::io::Result<()> {
        let mut file = fs::File::create(&temp)?;
        file.write_all(text.as_bytes())?;
        file.sync_all()
    })();
    if let Err(e) = result {
        let _ = fs::remove_file(&temp);
        return Err(write_failed(path, e));
    }
    Ok(temp)
}

fn finish(path: &Path, temp: &Path) -> Result<(), SessionError> {
    if path.is_file() {
        // a copy, not a rename, so that `path` exists at every moment
        if let Err(e) = fs::copy(path, backup_path(path)) {
            let _ = fs::remove_file(temp);
            return Err(write_failed(path, format!("cannot keep a backup: {e}")));
        }
    }
    if let Err(e) = fs::rename(temp, path) {
        let _ = fs::remove_file(temp);
        return Err(write_failed(path, e));
    }
    sync_parent(path);
    Ok(())
}

/// Flushes the directory entry of a renamed file (best effort; only Unix
/// lets a directory be opened for this).
fn sync_parent(path: &Path) {
    #[cfg(unix)]
    {
        let dir = match path.parent() {
            Some(p) if !p.as_os_str().is_empty() => p,
            _ => Path::new("."),
        };
        if let Ok(d) = fs::File::open(dir) {
            let _ = d.sync_all();
        }
    }
    #[cfg(not(unix))]
    let _ = path;
}
