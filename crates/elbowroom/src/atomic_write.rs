//! Replacing a file atomically, for figure and table exports and for session
//! saves: the bytes go to a temporary file `.NAME.SUFFIX` in the same
//! directory, which is flushed to disk and then renamed over `NAME`; the
//! directory entry is then flushed too (best effort). A crash or a full disk
//! leaves the old file or the new one, never half of one, and a failed write
//! removes its temporary file.
//!
//! The two steps are separate ([`write_temp`], [`replace`]) so that a caller
//! can act between them: the session store keeps a `.bak` copy of the old
//! file there, and its tests stop there to see what a crash leaves behind.

use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

/// Why a file could not be written.
#[derive(Debug, thiserror::Error)]
pub enum WriteFailure {
    /// The path ends in no file name (`/`, `..`).
    #[error("the path names no file")]
    NoFileName,
    /// What the operating system said.
    #[error("{0}")]
    Io(#[from] std::io::Error),
}

/// The temporary file a write of `path` goes through: `.NAME.SUFFIX` beside it.
pub fn temp_path(path: &Path, suffix: &str) -> Result<PathBuf, WriteFailure> {
    let name = path.file_name().ok_or(WriteFailure::NoFileName)?;
    let mut temp = std::ffi::OsString::from(".");
    temp.push(name);
    temp.push(".");
    temp.push(suffix);
    Ok(path.with_file_name(temp))
}

/// Writes `bytes` to `path` atomically through `.NAME.SUFFIX`.
pub fn write(path: &Path, suffix: &str, bytes: &[u8]) -> Result<(), WriteFailure> {
    let temp = write_temp(path, suffix, bytes)?;
    replace(&temp, path)
}

/// The first step: writes `bytes` to the temporary file of `path` and flushes
/// it to disk; returns that file. On failure the temporary file is removed.
pub fn write_temp(path: &Path, suffix: &str, bytes: &[u8]) -> Result<PathBuf, WriteFailure> {
    let temp = temp_path(path, suffix)?;
    let result = (|| -> std::io::Result<()> {
        let mut file = fs::File::create(&temp)?;
        file.write_all(bytes)?;
        file.sync_all()
    })();
    if let Err(e) = result {
        let _ = fs::remove_file(&temp);
        return Err(e.into());
    }
    Ok(temp)
}

/// The second step: renames `temp` over `path` and flushes the directory
/// entry. On failure `temp` is removed and `path` is as it was.
pub fn replace(temp: &Path, path: &Path) -> Result<(), WriteFailure> {
    if let Err(e) = fs::rename(temp, path) {
        let _ = fs::remove_file(temp);
        return Err(e.into());
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

#[cfg(test)]
mod tests {
    use super::*;

    fn scratch(name: &str) -> PathBuf {
        let dir =
            std::env::temp_dir().join(format!("elbowroom-atomic-{name}-{}", std::process::id()));
        let _ = fs::remove_dir_all(&dir);
        let made = fs::create_dir_all(&dir);
        assert!(made.is_ok(), "{made:?}");
        dir
    }

    #[test]
    fn a_write_replaces_the_file_and_leaves_no_temporary() -> Result<(), WriteFailure> {
        let dir = scratch("replace");
        let path = dir.join("f.txt");
        fs::write(&path, "old")?;
        write(&path, "writing", b"new")?;
        assert_eq!(fs::read_to_string(&path)?, "new");
        assert!(!temp_path(&path, "writing")?.exists());
        assert_eq!(
            temp_path(&path, "saving")?.file_name(),
            Some(std::ffi::OsStr::new(".f.txt.saving"))
        );
        let _ = fs::remove_dir_all(&dir);
        Ok(())
    }

    #[test]
    fn failures_say_why() {
        let e = write(Path::new("/"), "writing", b"x").map(|_| ());
        assert_eq!(
            e.map_err(|e| e.to_string()),
            Err("the path names no file".into())
        );
        let dir = scratch("missing");
        let e = write(&dir.join("no-dir").join("f.txt"), "writing", b"x");
        assert!(matches!(e, Err(WriteFailure::Io(_))));
        let _ = fs::remove_dir_all(&dir);
    }
}
