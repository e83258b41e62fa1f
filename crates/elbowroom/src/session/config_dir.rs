//! Where elbowroom keeps its own files, in the platform's directories (the
//! `directories` crate): the recent-sessions list is configuration
//! (`$XDG_CONFIG_HOME/elbowroom`, `~/Library/Application Support/…` on macOS,
//! `%APPDATA%\…\config` on Windows); the autosave is state
//! (`$XDG_STATE_HOME/elbowroom`, else `~/.local/state/elbowroom`; the local
//! data directory where the platform has no state directory).
//!
//! Earlier versions kept both in a directory of their own making,
//! `$XDG_CONFIG_HOME/elbowroom` or `~/.config/elbowroom` (`%APPDATA%\elbowroom`
//! on Windows): [`legacy_dir`] names it, and the readers still look there when
//! the new place holds nothing.

use directories::ProjectDirs;
use std::path::PathBuf;

fn project() -> Option<ProjectDirs> {
    ProjectDirs::from("org", "elbowroom", "elbowroom")
}

/// The configuration directory (it may not exist yet), if the platform names one.
pub fn config_dir() -> Option<PathBuf> {
    project().map(|p| p.config_dir().to_path_buf())
}

/// The directory for state kept between runs, such as the autosave (it may
/// not exist yet): the platform's state directory, else its local data
/// directory.
pub fn state_dir() -> Option<PathBuf> {
    let p = project()?;
    Some(
        p.state_dir()
            .unwrap_or_else(|| p.data_local_dir())
            .to_path_buf(),
    )
}

/// The directory earlier versions used for everything:
/// `$XDG_CONFIG_HOME/elbowroom`, else `~/.config/elbowroom`
/// (`%APPDATA%\elbowroom` on Windows). Read only, as a fallback.
pub fn legacy_dir() -> Option<PathBuf> {
    let nonempty = |k: &str| {
        std::env::var_os(k)
            .filter(|v| !v.is_empty())
            .map(PathBuf::from)
    };
    if let Some(xdg) = nonempty("XDG_CONFIG_HOME") {
        return Some(xdg.join("elbowroom"));
    }
    if cfg!(windows)
        && let Some(appdata) = nonempty("APPDATA")
    {
        return Some(appdata.join("elbowroom"));
    }
    nonempty("HOME").map(|h| h.join(".config").join("elbowroom"))
}
