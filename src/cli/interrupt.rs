//! Ctrl-C for long headless runs: the first interrupt sets the cancel flag of the
//! computation being watched, whose worker loops then stop with `Canceled`.
//!
//! The handler is installed once per process; each long run registers its
//! [`Progress`] for as long as the returned guard lives.

use crate::math::Progress;
use std::sync::{Arc, Mutex, OnceLock};

static WATCHED: OnceLock<Mutex<Option<Arc<Progress>>>> = OnceLock::new();

fn slot() -> &'static Mutex<Option<Arc<Progress>>> {
    WATCHED.get_or_init(|| {
        // if another handler is already installed, Ctrl-C keeps its default behaviour
        let _ = ctrlc::set_handler(|| {
            if let Some(m) = WATCHED.get()
                && let Ok(guard) = m.lock()
                && let Some(p) = guard.as_ref()
            {
                p.cancel();
            }
        });
        Mutex::new(None)
    })
}

/// Keeps a computation registered with the Ctrl-C handler while it lives.
pub struct Watch;

impl Drop for Watch {
    fn drop(&mut self) {
        if let Ok(mut g) = slot().lock() {
            *g = None;
        }
    }
}

/// Routes Ctrl-C to `progress.cancel()` until the returned guard is dropped.
pub fn watch(progress: Arc<Progress>) -> Watch {
    if let Ok(mut g) = slot().lock() {
        *g = Some(progress);
    }
    Watch
}
