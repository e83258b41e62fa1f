//! Ctrl-C, SIGTERM and SIGHUP for headless runs: the first signal sets the
//! cancel flag of the computation being watched, whose worker loops then stop
//! with `Canceled`; a run with nothing watched ends at once with one line.
//!
//! The handling is installed once per process ([`install`]); each long run
//! registers its [`Progress`] for as long as the returned guard lives.
//!
//! While a run is watched and standard error is a terminal, a line on standard
//! error says how far it has got (after the first two seconds, refreshed every
//! second, erased when the run ends): "elbowroom: 37% (1 min 12 s); Ctrl-C stops
//! it". It is shown only where it cannot mix with the output: for a run whose
//! output is printed after it ends, or when standard output is not a terminal.
//!
//! With `ELBOWROOM_ANNOUNCE_WATCH=1` in the environment, the moment a run is
//! registered (so that Ctrl-C now cancels it) is announced on stderr with the
//! line [`ANNOUNCEMENT`]: tests wait for it before sending SIGINT, instead of
//! guessing with a sleep. Without the variable nothing is printed.

use super::error::CliError;
use crate::math::{MathError, MathResult, Progress};
use std::io::{IsTerminal, Write};
use std::sync::atomic::{AtomicBool, AtomicI32, Ordering};
use std::sync::{Arc, Mutex};
use std::time::{Duration, Instant};

/// The environment variable that turns the announcement on (value `1`).
pub const ANNOUNCE_ENV: &str = "ELBOWROOM_ANNOUNCE_WATCH";

/// The line printed on stderr once Ctrl-C cancels the registered run.
pub const ANNOUNCEMENT: &str = "elbowroom: watching for Ctrl-C";

static WATCHED: Mutex<Option<Arc<Progress>>> = Mutex::new(None);

/// The signal that stopped the run (0 while none has come).
static SIGNAL: AtomicI32 = AtomicI32::new(0);

/// What the run is, for the line printed when a signal ends it at once.
static RUNNING: Mutex<Option<(String, Instant)>> = Mutex::new(None);

/// How long a watched run has, after a signal cancels it, to stop by itself
/// and say how far it got, before the process ends without it.
const GRACE: Duration = Duration::from_secs(3);

fn slot() -> &'static Mutex<Option<Arc<Progress>>> {
    &WATCHED
}

/// Installs the handling of SIGINT (Ctrl-C), SIGTERM (what a batch scheduler
/// sends at its time limit) and SIGHUP (a closed terminal), once, for the run
/// of command `what`: a signal cancels the watched computation, which then
/// stops with a "canceled after …" line; when nothing is watched (or the
/// computation does not stop within [`GRACE`]), the process removes its
/// unfinished temporary files, says "`what` canceled after T s" and exits with
/// 128 + the signal. SIGXFSZ (a file-size limit reached) is ignored, so that
/// the write fails with an error the command reports, instead of killing it.
pub fn install(what: &str) {
    if let Ok(mut r) = RUNNING.lock() {
        *r = Some((what.to_string(), Instant::now()));
    }
    static ONCE: std::sync::Once = std::sync::Once::new();
    ONCE.call_once(|| {
        #[cfg(unix)]
        {
            use signal_hook::consts::{SIGHUP, SIGINT, SIGTERM, SIGXFSZ};
            // a handler that only sets a flag: the signal no longer ends the process
            let _ = signal_hook::flag::register(SIGXFSZ, Arc::new(AtomicBool::new(false)));
            if let Ok(mut signals) = signal_hook::iterator::Signals::new([SIGINT, SIGTERM, SIGHUP])
            {
                std::thread::spawn(move || {
                    for sig in signals.forever() {
                        on_signal(sig);
                    }
                });
            }
        }
        #[cfg(not(unix))]
        {
            let _ = ctrlc::set_handler(|| on_signal(2));
        }
    });
}

/// A signal came: cancel the watched run and give it [`GRACE`] to report;
/// with none watched, end at once.
fn on_signal(sig: i32) {
    let first = SIGNAL.swap(sig, Ordering::SeqCst) == 0;
    let watched = WATCHED.lock().ok().and_then(|g| g.clone());
    if let Some(p) = watched {
        p.cancel();
        if first {
            std::thread::spawn(move || {
                std::thread::sleep(GRACE);
                end_now(sig);
            });
            return;
        }
    }
    end_now(sig);
}

/// Ends the process on signal `sig`: unfinished temporary files removed, one
/// line on stderr, exit status 128 + `sig`.
fn end_now(sig: i32) -> ! {
    crate::atomic_write::remove_unfinished();
    super::cut_short::write_pending();
    let (what, since) = RUNNING
        .lock()
        .ok()
        .and_then(|r| r.clone())
        .unwrap_or_else(|| ("the command".into(), Instant::now()));
    let secs = since.elapsed().as_secs_f64();
    super::report(&format!(
        "{what} canceled after {secs:.1} s ({}); output cut short",
        signal_name(sig)
    ));
    std::process::exit(128 + sig)
}

/// The name of a signal as a user knows it.
pub fn signal_name(sig: i32) -> &'static str {
    match sig {
        1 => "SIGHUP",
        2 => "SIGINT, Ctrl-C",
        15 => "SIGTERM",
        _ => "a signal",
    }
}

/// The exit status of a run canceled by a signal: 128 + the signal (130 for
/// Ctrl-C, 143 for SIGTERM, 129 for SIGHUP); 130 when no signal is known.
pub fn canceled_status() -> u8 {
    match SIGNAL.load(Ordering::SeqCst) {
        s @ 1..=64 => 128 + s as u8,
        _ => 130,
    }
}

/// Keeps a computation registered with the Ctrl-C handler while it lives (and
/// its progress line, if one is shown).
pub struct Watch {
    ticker: Option<Ticker>,
}

impl Drop for Watch {
    fn drop(&mut self) {
        if let Ok(mut g) = slot().lock() {
            *g = None;
        }
        if let Some(t) = self.ticker.take() {
            t.stop();
        }
    }
}

/// Routes Ctrl-C to `progress.cancel()` until the returned guard is dropped; for
/// a run that writes its output while it is watched (the progress line is shown
/// only when standard output is not a terminal).
pub fn watch(progress: Arc<Progress>) -> Watch {
    watch_with(progress, !std::io::stdout().is_terminal())
}

/// [`watch`] for a run whose output is printed after the guard is dropped: the
/// progress line may be shown whatever standard output is.
pub fn watch_before_output(progress: Arc<Progress>) -> Watch {
    watch_with(progress, true)
}

fn watch_with(progress: Arc<Progress>, line_allowed: bool) -> Watch {
    if let Ok(mut g) = slot().lock() {
        *g = Some(progress.clone());
    }
    if std::env::var(ANNOUNCE_ENV).is_ok_and(|v| v == "1") {
        let _ = writeln!(std::io::stderr(), "{ANNOUNCEMENT}");
    }
    let ticker = (line_allowed && std::io::stderr().is_terminal()).then(|| Ticker::start(progress));
    Watch { ticker }
}

/// The thread that keeps the progress line up to date.
struct Ticker {
    stop: Arc<AtomicBool>,
    thread: std::thread::JoinHandle<()>,
}

/// How long a run goes before its progress line appears.
const LINE_AFTER: Duration = Duration::from_secs(2);

impl Ticker {
    fn start(progress: Arc<Progress>) -> Ticker {
        let stop = Arc::new(AtomicBool::new(false));
        let flag = stop.clone();
        let thread = std::thread::spawn(move || {
            let start = Instant::now();
            let mut shown = false;
            let mut last = Instant::now();
            while !flag.load(Ordering::Relaxed) {
                std::thread::sleep(Duration::from_millis(50));
                let elapsed = start.elapsed();
                if elapsed < LINE_AFTER || (shown && last.elapsed() < Duration::from_secs(1)) {
                    continue;
                }
                let line = progress_line(progress.done(), progress.total(), elapsed);
                let mut err = std::io::stderr().lock();
                let _ = write!(err, "\r\x1b[K{line}");
                let _ = err.flush();
                shown = true;
                last = Instant::now();
            }
            if shown {
                let mut err = std::io::stderr().lock();
                let _ = write!(err, "\r\x1b[K");
                let _ = err.flush();
            }
        });
        Ticker { stop, thread }
    }

    /// Stops the thread and erases its line.
    fn stop(self) {
        self.stop.store(true, Ordering::Relaxed);
        let _ = self.thread.join();
    }
}

/// The progress line: the share done when the total is known, else the count.
fn progress_line(done: u64, total: u64, elapsed: Duration) -> String {
    let secs = elapsed.as_secs();
    let time = if secs < 60 {
        format!("{secs} s")
    } else if secs < 3600 {
        format!("{} min {} s", secs / 60, secs % 60)
    } else {
        format!("{} h {} min", secs / 3600, secs / 60 % 60)
    };
    let share = if total > 0 {
        format!(
            "{}%",
            (u128::from(done.min(total)) * 100 / u128::from(total))
        )
    } else {
        format!("{done} done")
    };
    format!("elbowroom: {share} ({time}); Ctrl-C stops it")
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
    let watching = watch_before_output(progress.clone());
    let result = compute(&progress);
    drop(watching);
    match result {
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
    if e.is_canceled() {
        canceled(what, unit, progress, rows, row)
    } else {
        e
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_progress_line_gives_the_share_and_the_time() {
        let line = progress_line(37, 100, Duration::from_secs(72));
        assert_eq!(line, "elbowroom: 37% (1 min 12 s); Ctrl-C stops it");
        // no total known: the count; past the total: 100%
        assert_eq!(
            progress_line(5, 0, Duration::from_secs(3)),
            "elbowroom: 5 done (3 s); Ctrl-C stops it"
        );
        assert!(
            progress_line(7, 5, Duration::from_secs(3725))
                .starts_with("elbowroom: 100% (1 h 2 min)")
        );
    }
}
