//! Ctrl-C for long headless runs: the first interrupt sets the cancel flag of the
//! computation being watched, whose worker loops then stop with `Canceled`.
//!
//! The handler is installed once per process; each long run registers its
//! [`Progress`] for as long as the returned guard lives.
//!
//! With `ELBOWROOM_ANNOUNCE_WATCH=1` in the environment, the moment a run is
//! registered (so that Ctrl-C now cancels it) is announced on stderr with the
//! line [`ANNOUNCEMENT`]: tests wait for it before sending SIGINT, instead of
//! guessing with a sleep. Without the variable nothing is printed.

use super::error::CliError;
use crate::math::{MathError, MathResult, Progress};
use std::sync::{Arc, Mutex, OnceLock};

/// The environment variable that turns the announcement on (value `1`).
pub const ANNOUNCE_ENV: &str = "ELBOWROOM_ANNOUNCE_WATCH";

/// The line printed on stderr once Ctrl-C cancels the registered run.
pub const ANNOUNCEMENT: &str = "elbowroom: watching for Ctrl-C";

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
    if std::env::var(ANNOUNCE_ENV).is_ok_and(|v| v == "1") {
        eprintln!("{ANNOUNCEMENT}");
    }
    Watch
}

/// Runs a long computation with Ctrl-C routed to its [`Progress`] (created with
/// `total` items). A cancel becomes [`CliError::Canceled`] saying how far it got:
/// "`what` canceled after X of Y `unit`; no output written".
pub fn run_interruptible<T>(
    what: &str,
    unit: &str,
    total: u64,
    compute: impl FnOnce(&Progress) -> MathResult<T>,
) -> Result<T, CliError> {
    let progress = Arc::new(Progress::new(total));
    let _watch = watch(progress.clone());
    match compute(&progress) {
        Ok(v) => Ok(v),
        Err(MathError::Canceled) => Err(CliError::Canceled(format!(
            "{what} canceled after {} of {} {unit}; no output written",
            progress.done(),
            progress.total()
        ))),
        Err(e) => Err(e.into()),
    }
}

/// The error of a streamed run stopped by Ctrl-C: "`what` canceled after X of Y
/// `unit`", then "; no output written" or "; output cut short after R `rows`".
pub fn canceled(what: &str, unit: &str, progress: &Progress, rows: u64, row: &str) -> CliError {
    let tail = if rows == 0 {
        "no output written".to_string()
    } else {
        format!("output cut short after {rows} {row}")
    };
    CliError::Canceled(format!(
        "{what} canceled after {} of {} {unit}; {tail}",
        progress.done(),
        progress.total()
    ))
}

/// A streamed run's error: a cancel becomes [`canceled`]'s message, anything else
/// passes through.
pub fn or_canceled(
    e: CliError,
    what: &str,
    unit: &str,
    progress: &Progress,
    rows: u64,
    row: &str,
) -> CliError {
    match e {
        CliError::Canceled(_) => canceled(what, unit, progress, rows, row),
        other => other,
    }
}
