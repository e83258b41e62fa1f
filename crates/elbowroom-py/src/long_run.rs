//! Long computations from Python: the work runs on a thread of its own without
//! the interpreter lock, while the calling Python thread waits in steps of
//! [`POLL`], and between two steps runs Python's signal handlers
//! (`Python::check_signals`) and the caller's progress callback.
//!
//! A KeyboardInterrupt (Ctrl-C, or a notebook's interrupt) or an exception
//! raised by the callback sets the cancel flag of the computation's
//! [`Progress`]; its loops poll the flag and stop within milliseconds; the
//! waiting thread then raises the exception it got. So an interrupt is answered
//! within about `POLL` plus the computation's own reaction time.

use crate::values::math_error;
use elbowroom_math::{MathResult, Progress};
use pyo3::exceptions::PyRuntimeError;
use pyo3::prelude::*;
use std::sync::{Condvar, Mutex};
use std::time::Duration;

/// How long the waiting thread sleeps between two looks at signals and progress.
pub const POLL: Duration = Duration::from_millis(50);

/// A flag the worker raises when it is finished, and the waiter sleeps on.
#[derive(Default)]
struct Finished {
    done: Mutex<bool>,
    wake: Condvar,
}

impl Finished {
    fn set(&self) {
        if let Ok(mut d) = self.done.lock() {
            *d = true;
        }
        self.wake.notify_all();
    }

    /// Waits up to `timeout`; whether the worker has finished.
    fn wait(&self, timeout: Duration) -> bool {
        let Ok(guard) = self.done.lock() else {
            return true;
        };
        if *guard {
            return true;
        }
        match self.wake.wait_timeout(guard, timeout) {
            Ok((d, _)) => *d,
            Err(_) => true,
        }
    }
}

/// Runs `work` off the interpreter lock with a fresh [`Progress`], answering
/// signals and calling `callback(done, total)` every [`POLL`] (and once at the
/// end). A math error becomes `ValueError`; an interrupt or a failing callback
/// cancels the work and is raised once the work has stopped.
pub fn run_long<T, F>(py: Python<'_>, callback: Option<&Bound<'_, PyAny>>, work: F) -> PyResult<T>
where
    T: Send,
    F: FnOnce(&Progress) -> MathResult<T> + Send,
{
    let progress = Progress::new(0);
    let finished = Finished::default();
    let outcome = std::thread::scope(|scope| {
        let (p, f) = (&progress, &finished);
        let handle = scope.spawn(move || {
            let result = work(p);
            f.set();
            result
        });
        let mut raised: Option<PyErr> = None;
        while !py.detach(|| finished.wait(POLL)) {
            let step = py
                .check_signals()
                .and_then(|()| report(callback, &progress));
            if let Err(e) = step {
                progress.cancel();
                raised = Some(e);
                break;
            }
        }
        let joined = py.detach(move || handle.join());
        (joined, raised)
    });
    match outcome {
        (_, Some(e)) => Err(e),
        (Err(_), None) => Err(PyRuntimeError::new_err(
            "the computation stopped without an answer (an internal error)",
        )),
        (Ok(result), None) => {
            report(callback, &progress)?;
            result.map_err(math_error)
        }
    }
}

/// Calls `callback(done, total)`, if there is one.
fn report(callback: Option<&Bound<'_, PyAny>>, progress: &Progress) -> PyResult<()> {
    if let Some(cb) = callback {
        cb.call1((progress.done(), progress.total()))?;
    }
    Ok(())
}
