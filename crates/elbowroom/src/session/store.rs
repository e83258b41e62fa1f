//! Saving and opening session files.
//!
//! Saving is atomic ([`crate::atomic_write`]): the text goes to a temporary
//! file `.NAME.saving` in the same directory, which is flushed to disk and then
//! renamed over the target, so a crash or a full disk leaves either the old
//! file or the new one, never half of one. Between the two steps the previous
//! version of the file is copied beside it as `NAME.bak`.
//! Loading never writes: a damaged or newer file stays as it was.

use super::error::SessionError;
use super::format;
use super::model::Session;
use super::validate;
use crate::atomic_write;
use crate::math::limits::FILE_SIZE_LIMIT;
use std::fs;
use std::path::{Path, PathBuf};

/// The suffix of the temporary file a save writes first (`.NAME.saving`).
const TEMP_SUFFIX: &str = "saving";

/// Opens a session file: reads it, migrates older versions, and validates it.
///
/// Errors say what was wrong: the line and column of a syntax error or a
/// field of the wrong type, a refused newer version, or the field that makes
/// the session impossible.
pub fn load(path: &Path) -> Result<Session, SessionError> {
    load_with_version(path).map(|(session, _)| session)
}

/// Reads a session from file text; `path` is used in messages only.
pub fn load_str(text: &str, path: &Path) -> Result<Session, SessionError> {
    load_str_with_version(text, path).map(|(session, _)| session)
}

/// [`load`], also returning the format version the file was written in.
pub fn load_with_version(path: &Path) -> Result<(Session, u32), SessionError> {
    let text = read_bounded(path).map_err(|reason| SessionError::Read {
        path: path.into(),
        reason,
    })?;
    load_str_with_version(&text, path)
}

/// Reads a text file of at most [`FILE_SIZE_LIMIT`] bytes. A path that is
/// not a regular file (a directory, `/dev/zero`, a pipe) or a larger file is
/// refused before anything is read, and at most one byte past the limit is
/// ever read, so a file that grows while it is read is refused too. The
/// error is the reason, in one line.
pub fn read_bounded(path: &Path) -> Result<String, String> {
    use std::io::Read;
    let meta = fs::metadata(path).map_err(|e| e.to_string())?;
    if !meta.is_file() {
        return Err(if meta.is_dir() {
            "it is a directory, not a file".into()
        } else {
            "it is not a regular file (a device, a pipe or a socket)".into()
        });
    }
    let too_large = |size: u64| {
        format!(
            "it is {size} bytes; files of at most {FILE_SIZE_LIMIT} bytes ({} MB) are read",
            FILE_SIZE_LIMIT / (1024 * 1024)
        )
    };
    if meta.len() > FILE_SIZE_LIMIT {
        return Err(too_large(meta.len()));
    }
    let file = fs::File::open(path).map_err(|e| e.to_string())?;
    let mut bytes = Vec::with_capacity(usize::try_from(meta.len()).unwrap_or(0));
    file.take(FILE_SIZE_LIMIT + 1)
        .read_to_end(&mut bytes)
        .map_err(|e| e.to_string())?;
    if bytes.len() as u64 > FILE_SIZE_LIMIT {
        return Err(too_large(bytes.len() as u64));
    }
    String::from_utf8(bytes).map_err(|e| {
        format!(
            "it is not UTF-8 text (byte {} is not part of a character); a session file is RON text",
            e.utf8_error().valid_up_to() + 1
        )
    })
}

fn load_str_with_version(text: &str, path: &Path) -> Result<(Session, u32), SessionError> {
    let (session, version) = format::decode_with_version(text, path)?;
    validate::check(&session).map_err(|reason| SessionError::Invalid {
        path: path.into(),
        reason,
    })?;
    Ok((session, version))
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
    atomic_write::temp_path(path, TEMP_SUFFIX).unwrap_or_else(|_| path.with_file_name("..saving"))
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
    atomic_write::write_temp(path, TEMP_SUFFIX, text.as_bytes()).map_err(|e| write_failed(path, e))
}

fn finish(path: &Path, temp: &Path) -> Result<(), SessionError> {
    if path.is_file() {
        // a copy, not a rename, so that `path` exists at every moment
        if let Err(e) = fs::copy(path, backup_path(path)) {
            let _ = fs::remove_file(temp);
            return Err(write_failed(path, format!("cannot keep a backup: {e}")));
        }
    }
    atomic_write::replace(temp, path).map_err(|e| write_failed(path, e))
}
