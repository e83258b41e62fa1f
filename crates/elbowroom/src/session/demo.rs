//! The demo sessions shipped in `sessions/`. The explorer opens the first one
//! when started with no file; it is also compiled into the binary, so an
//! installed copy without the repository still has it.

use super::model::Session;
use super::store;
use std::path::{Path, PathBuf};

/// File name of the demo opened by default.
pub const DEFAULT_DEMO_NAME: &str = "01-seminar-pipe-dreams.ron";

/// The text of the default demo, as compiled in.
pub const DEFAULT_DEMO_TEXT: &str = include_str!("../../../../sessions/01-seminar-pipe-dreams.ron");

/// The directory of the demo sessions in the source tree.
pub fn demo_dir() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("../../sessions")
}

/// The default demo's file, if it is present on this machine (it is in a
/// checkout of the repository).
pub fn default_demo_path() -> Option<PathBuf> {
    let local = Path::new("sessions").join(DEFAULT_DEMO_NAME);
    if local.is_file() {
        return Some(local);
    }
    let built = demo_dir().join(DEFAULT_DEMO_NAME);
    built.is_file().then_some(built)
}

/// The default demo session: read from its file when present, else the
/// compiled-in copy; the plain default session if neither reads.
pub fn default_demo() -> Session {
    if let Some(path) = default_demo_path()
        && let Ok(s) = store::load(&path)
    {
        return s;
    }
    store::load_str(DEFAULT_DEMO_TEXT, Path::new(DEFAULT_DEMO_NAME)).unwrap_or_default()
}

/// Every demo session file in `sessions/`, sorted by name.
pub fn demo_paths() -> Vec<PathBuf> {
    let Ok(entries) = std::fs::read_dir(demo_dir()) else {
        return Vec::new();
    };
    let mut v: Vec<PathBuf> = entries
        .filter_map(|e| e.ok().map(|e| e.path()))
        .filter(|p| p.extension().is_some_and(|x| x == super::format::EXTENSION))
        .collect();
    v.sort();
    v
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_compiled_in_demo_loads() {
        let s = store::load_str(DEFAULT_DEMO_TEXT, Path::new(DEFAULT_DEMO_NAME));
        assert!(s.is_ok(), "{s:?}");
        assert_eq!(s.ok().map(|s| s.current), Some(vec![1, 4, 3, 2]));
    }
}
