//! A handle on one running computation: its progress, a way to cancel it, and
//! the channel its result arrives on. Dropping the handle cancels the work.

use super::requests::{JobKey, Output};
use crate::math::{MathError, MathResult, Progress};
use std::sync::Arc;
use std::sync::mpsc::{Receiver, TryRecvError};
use std::time::Instant;

/// One computation in flight.
pub struct Job {
    key: JobKey,
    progress: Arc<Progress>,
    rx: Receiver<MathResult<Arc<Output>>>,
    started: Instant,
}

impl Job {
    pub(crate) fn new(
        key: JobKey,
        progress: Arc<Progress>,
        rx: Receiver<MathResult<Arc<Output>>>,
    ) -> Self {
        Job {
            key,
            progress,
            rx,
            started: Instant::now(),
        }
    }

    /// The inputs this job computes from.
    pub fn key(&self) -> &JobKey {
        &self.key
    }

    /// Its progress counters.
    pub fn progress(&self) -> &Progress {
        &self.progress
    }

    /// A shared handle on its progress counters.
    pub fn progress_arc(&self) -> Arc<Progress> {
        self.progress.clone()
    }

    /// Seconds since it started.
    pub fn elapsed(&self) -> f32 {
        self.started.elapsed().as_secs_f32()
    }

    /// Asks the computation to stop; its result will be `Canceled`.
    pub fn cancel(&self) {
        self.progress.cancel();
    }

    /// The result, once it has arrived (never blocks).
    pub fn poll(&self) -> Option<MathResult<Arc<Output>>> {
        match self.rx.try_recv() {
            Ok(result) => Some(result),
            Err(TryRecvError::Empty) => None,
            Err(TryRecvError::Disconnected) => Some(Err(MathError::InvalidInput(
                "the computation stopped without a result".into(),
            ))),
        }
    }
}

impl Drop for Job {
    fn drop(&mut self) {
        self.progress.cancel();
    }
}
