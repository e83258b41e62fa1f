//! Replacing a file atomically, for figure and table exports, `--out` and
//! session saves: the bytes go to a temporary file with a unique name
//! `.NAME.XXXXXX.SUFFIX` in the same directory (made by the `tempfile` crate,
//! so two writers never share one), which is flushed to disk and then renamed
//! over `NAME`; the directory entry is then flushed too (best effort). A crash
//! or a full disk leaves the old file or the new one, never half of one, and a
//! failed write removes its temporary file.
//!
//! When two writers replace the same file at once, the later rename wins; the
//! writer whose file was replaced at once is told so ([`WriteFailure::Replaced`])
//! instead of reporting a write that is no longer there.
//!
//! The two steps are separate ([`write_temp`], [`replace`]) so that a caller
//! can act between them: the session store keeps a `.bak` copy of the old
//! file there, and its tests stop there to see what a crash leaves behind.
//! [`Staged`] is the streaming form, for output written as it is produced.
//!
//! Temporary files being written are listed ([`remove_unfinished`]) so that a
//! process ended by a signal can remove them before it exits.

use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};
use std::sync::Mutex;

/// Why a file could not be written.
#[derive(Debug, thiserror::Error)]
pub enum WriteFailure {
    /// The path ends in no file name (`/`, `..`).
    #[error("the path names no file")]
    NoFileName,
    /// Another writer renamed its file over the same name right after this one:
    /// the file now holds the other writer's bytes.
    #[error("another program replaced it at the same moment; the file holds that program's output")]
    Replaced,
    /// What the operating system said.
    #[error("{0}")]
    Io(#[from] std::io::Error),
}

/// The temporary files being written now, removed by [`remove_unfinished`].
static UNFINISHED: Mutex<Vec<PathBuf>> = Mutex::new(Vec::new());

fn note_unfinished(path: &Path) {
    if let Ok(mut list) = UNFINISHED.lock() {
        list.push(path.to_path_buf());
    }
}

fn note_finished(path: &Path) {
    if let Ok(mut list) = UNFINISHED.lock() {
        list.retain(|p| p != path);
    }
}

/// Removes every temporary file still being written (for a process about to
/// exit on a signal, which runs no destructors).
pub fn remove_unfinished() {
    if let Ok(mut list) = UNFINISHED.lock() {
        for p in list.drain(..) {
            let _ = fs::remove_file(p);
        }
    }
}

/// The fixed part of the temporary names of a write of `path`:
/// `.NAME.` (each write adds a unique part and `.SUFFIX`).
pub fn temp_path(path: &Path, suffix: &str) -> Result<PathBuf, WriteFailure> {
    let name = path.file_name().ok_or(WriteFailure::NoFileName)?;
    let mut temp = std::ffi::OsString::from(".");
    temp.push(name);
    temp.push(".");
    temp.push(suffix);
    Ok(path.with_file_name(temp))
}

/// A new temporary file beside `path` with a unique name.
fn create_temp(path: &Path, suffix: &str) -> Result<tempfile::NamedTempFile, WriteFailure> {
    let name = path.file_name().ok_or(WriteFailure::NoFileName)?;
    let dir = match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p,
        _ => Path::new("."),
    };
    let mut prefix = std::ffi::OsString::from(".");
    prefix.push(name);
    prefix.push(".");
    let file = tempfile::Builder::new()
        .prefix(&prefix)
        .suffix(&format!(".{suffix}"))
        .tempfile_in(dir)?;
    Ok(file)
}

/// Writes `bytes` to `path` atomically through a unique temporary file.
pub fn write(path: &Path, suffix: &str, bytes: &[u8]) -> Result<(), WriteFailure> {
    let temp = write_temp(path, suffix, bytes)?;
    replace(&temp, path)
}

/// The first step: writes `bytes` to a new temporary file beside `path` and
/// flushes it to disk; returns that file. On failure the temporary file is removed.
pub fn write_temp(path: &Path, suffix: &str, bytes: &[u8]) -> Result<PathBuf, WriteFailure> {
    let mut file = create_temp(path, suffix)?;
    note_unfinished(file.path());
    let result = file
        .write_all(bytes)
        .and_then(|()| file.as_file().sync_all());
    note_finished(file.path());
    result?;
    // kept on disk for the second step (the rename), which may also not come
    let kept = file.into_temp_path().keep().map_err(|e| e.error)?;
    Ok(kept)
}

/// The second step: renames `temp` over `path` and flushes the directory
/// entry. On failure `temp` is removed and `path` is as it was. When another
/// writer's rename replaced this one at once, says so ([`WriteFailure::Replaced`]).
pub fn replace(temp: &Path, path: &Path) -> Result<(), WriteFailure> {
    let ours = identity(temp);
    if let Err(e) = fs::rename(temp, path) {
        let _ = fs::remove_file(temp);
        return Err(e.into());
    }
    sync_parent(path);
    if ours.is_some() && identity(path) != ours {
        return Err(WriteFailure::Replaced);
    }
    Ok(())
}

/// Which file a path names now (device and inode on Unix), to tell whether a
/// rename was overtaken by another one.
fn identity(path: &Path) -> Option<(u64, u64)> {
    #[cfg(unix)]
    {
        use std::os::unix::fs::MetadataExt;
        fs::metadata(path).ok().map(|m| (m.dev(), m.ino()))
    }
    #[cfg(not(unix))]
    {
        let _ = path;
        None
    }
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

/// A file written as its content is produced, which appears under its name
/// only when [`Staged::commit`] is called: until then the bytes go to a unique
/// temporary file beside it, removed when the `Staged` is dropped uncommitted.
pub struct Staged {
    path: PathBuf,
    /// The temporary file (its name; removed on drop) and the buffered
    /// writer over the same open file.
    file: Option<(tempfile::NamedTempFile, std::io::BufWriter<fs::File>)>,
}

impl Staged {
    /// Starts writing `path` (through `.NAME.XXXXXX.writing`).
    pub fn create(path: &Path) -> Result<Staged, WriteFailure> {
        let temp = create_temp(path, "writing")?;
        let handle = temp.as_file().try_clone()?;
        note_unfinished(temp.path());
        Ok(Staged {
            path: path.to_path_buf(),
            file: Some((temp, std::io::BufWriter::with_capacity(1 << 16, handle))),
        })
    }

    /// The file that appears at the end.
    pub fn path(&self) -> &Path {
        &self.path
    }

    /// Flushes the bytes to disk and renames the temporary file over the
    /// path: the file is complete or absent, never cut short.
    pub fn commit(mut self) -> Result<(), WriteFailure> {
        let Some((temp, mut writer)) = self.file.take() else {
            return Ok(());
        };
        note_finished(temp.path());
        writer.flush()?;
        drop(writer);
        temp.as_file().sync_all()?;
        let kept = temp.into_temp_path().keep().map_err(|e| e.error)?;
        replace(&kept, &self.path)
    }
}

impl Write for Staged {
    fn write(&mut self, buf: &[u8]) -> std::io::Result<usize> {
        match self.file.as_mut() {
            Some((_, w)) => w.write(buf),
            None => Err(std::io::Error::other("the file is already complete")),
        }
    }

    fn flush(&mut self) -> std::io::Result<()> {
        match self.file.as_mut() {
            Some((_, w)) => w.flush(),
            None => Ok(()),
        }
    }
}

impl Drop for Staged {
    fn drop(&mut self) {
        if let Some((temp, writer)) = self.file.take() {
            // the buffered bytes are dropped unwritten; the temporary file is
            // removed by its own drop
            let _ = writer.into_parts();
            note_finished(temp.path());
        }
    }
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

    fn entries(dir: &Path) -> Vec<String> {
        let mut v: Vec<String> = fs::read_dir(dir)
            .map(|r| {
                r.filter_map(|e| e.ok())
                    .map(|e| e.file_name().to_string_lossy().to_string())
                    .collect()
            })
            .unwrap_or_default();
        v.sort();
        v
    }

    #[test]
    fn a_write_replaces_the_file_and_leaves_no_temporary() -> Result<(), WriteFailure> {
        let dir = scratch("replace");
        let path = dir.join("f.txt");
        fs::write(&path, "old")?;
        write(&path, "writing", b"new")?;
        assert_eq!(fs::read_to_string(&path)?, "new");
        assert_eq!(entries(&dir), ["f.txt"]);
        assert_eq!(
            temp_path(&path, "saving")?.file_name(),
            Some(std::ffi::OsStr::new(".f.txt.saving"))
        );
        let _ = fs::remove_dir_all(&dir);
        Ok(())
    }

    /// Two temporary files of one path have different names, so two writers
    /// never write into the same one.
    #[test]
    fn temporary_names_are_unique() -> Result<(), WriteFailure> {
        let dir = scratch("unique");
        let path = dir.join("f.svg");
        let a = write_temp(&path, "writing", b"a")?;
        let b = write_temp(&path, "writing", b"b")?;
        assert_ne!(a, b);
        assert!(
            a.file_name()
                .is_some_and(|n| n.to_string_lossy().starts_with(".f.svg."))
        );
        replace(&a, &path)?;
        replace(&b, &path)?;
        assert_eq!(fs::read_to_string(&path)?, "b");
        assert_eq!(entries(&dir), ["f.svg"]);
        let _ = fs::remove_dir_all(&dir);
        Ok(())
    }

    /// A staged file appears only when committed; dropped, it leaves nothing.
    #[test]
    fn a_staged_file_appears_whole_or_not_at_all() -> Result<(), WriteFailure> {
        let dir = scratch("staged");
        let path = dir.join("t.csv");
        let mut s = Staged::create(&path)?;
        s.write_all(b"a,b\n1,2\n")?;
        assert!(!path.exists());
        drop(s);
        assert!(entries(&dir).is_empty(), "{:?}", entries(&dir));
        let mut s = Staged::create(&path)?;
        s.write_all(b"a,b\n")?;
        s.commit()?;
        assert_eq!(fs::read_to_string(&path)?, "a,b\n");
        assert_eq!(entries(&dir), ["t.csv"]);
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
