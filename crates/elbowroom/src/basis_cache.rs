//! The basis of J_n kept between runs: built once per n and stored in the user's cache
//! directory, so that `quotient`, `reduce`, `survey`, `figure paths` and the window's
//! engine find it there instead of building it again.
//!
//! - Where: `$ELBOWROOM_CACHE_DIR` when set and not empty, else the platform's cache
//!   directory (`$XDG_CACHE_HOME/elbowroom`, by default `~/.cache/elbowroom`, on Linux),
//!   one file `quotient-basis-n{N}.bin` per n.
//! - What: the bytes of [`math::quotient::basis_bytes`]: a header with the layout's and the
//!   math crate's versions, n, the payload's length and its 64-bit FNV-1a checksum.
//! - Loading trusts nothing: a file of another version, another n, a wrong length or
//!   checksum, or a payload that is not shaped like the basis of J_n is ignored (and then
//!   rebuilt and replaced); a file that passes is then certified as in
//!   [`math::quotient::certificate`] (the generators of J_n reduce to zero, checked by one
//!   random combination per degree) before any command uses it.
//! - Writing is atomic: the bytes go to a uniquely named temporary file in the same
//!   directory, which is flushed and renamed over the old file, so two processes writing
//!   at once leave one whole file. A directory that cannot be created or written is not an
//!   error: the basis is then simply not kept.
//! - `ELBOWROOM_NO_CACHE=1` (or [`disable`], behind the commands' `--no-cache`) neither
//!   reads nor writes the cache.

use crate::math;
use math::error::{MathError, MathResult};
use math::progress::Progress;
use math::quotient::basis_bytes::{from_bytes, to_bytes};
use math::quotient::groebner::{MAX_QUOTIENT_N, QuasiGroebner};
use math::quotient::normal_form::{built_basis, groebner_basis_with, share_basis};
use math::quotient::reduction::Reduction;
use std::io::Write;
use std::path::{Path, PathBuf};
use std::sync::Arc;
use std::sync::atomic::{AtomicBool, Ordering};

/// The environment variable naming the cache directory (tests and users may set it).
pub const ENV_DIR: &str = "ELBOWROOM_CACHE_DIR";

/// The environment variable that turns the cache off when set to a non-empty value.
pub const ENV_OFF: &str = "ELBOWROOM_NO_CACHE";

/// No cache file is read beyond this size (the file at n = 11 is about 60 MB).
pub const MAX_FILE_BYTES: u64 = 2 << 30;

static DISABLED: AtomicBool = AtomicBool::new(false);

/// Turns the cache off for the rest of this process (the commands' `--no-cache`).
pub fn disable() {
    DISABLED.store(true, Ordering::Relaxed);
}

/// The cache directory in use, or `None` when the cache is off or no directory is known.
pub fn cache_dir() -> Option<PathBuf> {
    if DISABLED.load(Ordering::Relaxed) || std::env::var_os(ENV_OFF).is_some_and(|v| !v.is_empty())
    {
        return None;
    }
    match std::env::var_os(ENV_DIR) {
        Some(dir) if !dir.is_empty() => Some(PathBuf::from(dir)),
        _ => {
            directories::ProjectDirs::from("", "", "elbowroom").map(|p| p.cache_dir().to_path_buf())
        }
    }
}

/// The file that holds the basis of J_n in `dir`.
pub fn file_for(dir: &Path, n: usize) -> PathBuf {
    dir.join(format!("quotient-basis-n{n}.bin"))
}

/// What reading the cache found.
#[derive(Debug)]
pub enum Loaded {
    /// No file (or it could not be read).
    Missing,
    /// A file that was not trusted, and why.
    Rejected(String),
    /// A checked and certified basis.
    Found(QuasiGroebner),
}

/// Reads the basis of J_n from `dir`, checking it (see the module doc). Only a cancel is
/// an error; every other failure is a [`Loaded`] case.
pub fn load(dir: &Path, n: usize, progress: &Progress) -> MathResult<Loaded> {
    let path = file_for(dir, n);
    let Ok(meta) = std::fs::metadata(&path) else {
        return Ok(Loaded::Missing);
    };
    if meta.len() > MAX_FILE_BYTES {
        return Ok(Loaded::Rejected(format!(
            "{} bytes, more than {MAX_FILE_BYTES}",
            meta.len()
        )));
    }
    let Ok(bytes) = std::fs::read(&path) else {
        return Ok(Loaded::Missing);
    };
    let q = match from_bytes(&bytes) {
        Ok(q) => q,
        Err(e) => return Ok(Loaded::Rejected(e.to_string())),
    };
    if q.n() != n {
        return Ok(Loaded::Rejected(format!("it holds n = {}, not {n}", q.n())));
    }
    match q.certify(progress) {
        Ok(()) => Ok(Loaded::Found(q)),
        Err(MathError::Canceled) => Err(MathError::Canceled),
        Err(e) => Ok(Loaded::Rejected(e.to_string())),
    }
}

/// Writes the basis to `dir` atomically (a unique temporary file renamed over the old one);
/// returns the file written.
pub fn store(dir: &Path, q: &QuasiGroebner) -> std::io::Result<PathBuf> {
    std::fs::create_dir_all(dir)?;
    let path = file_for(dir, q.n());
    let mut temp = tempfile::Builder::new()
        .prefix(".quotient-basis-")
        .suffix(".partial")
        .tempfile_in(dir)?;
    temp.write_all(&to_bytes(q))?;
    temp.as_file().sync_all()?;
    temp.persist(&path).map_err(|e| e.error)?;
    Ok(path)
}

/// The basis of J_n for every command and the window: the one this process holds, else
/// the cache's (checked and certified), else a fresh one, which is then stored (a failed
/// store is ignored). Cancellable through `progress`.
pub fn basis_with(n: usize, progress: &Progress) -> MathResult<Arc<QuasiGroebner>> {
    if n == 0 || n > MAX_QUOTIENT_N {
        // the math crate's one-line refusal
        return groebner_basis_with(n, progress);
    }
    if let Some(q) = built_basis(n) {
        return Ok(q);
    }
    let dir = cache_dir();
    if let Some(dir) = &dir
        && let Loaded::Found(q) = load(dir, n, progress)?
    {
        return Ok(share_basis(q));
    }
    let q = groebner_basis_with(n, progress)?;
    if let Some(dir) = &dir {
        let _ = store(dir, &q);
    }
    Ok(q)
}

/// The way of reducing modulo J_n for every command and the window: the Gröbner basis of
/// [`basis_with`] (held, cached or built). Cancellable through `progress`.
pub fn reducer_with(n: usize, progress: &Progress) -> MathResult<Arc<dyn Reduction>> {
    let q: Arc<dyn Reduction> = basis_with(n, progress)?;
    Ok(q)
}
