//! The per-user directory where elbowroom keeps its recent-sessions list and
//! its autosave: `$XDG_CONFIG_HOME/elbowroom`, else `~/.config/elbowroom`
//! (`%APPDATA%\elbowroom` on Windows).

use std::path::PathBuf;

/// The configuration directory, if the environment names one (it may not exist yet).
pub fn config_dir() -> Option<PathBuf> {
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
