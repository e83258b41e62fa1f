//! Progress and cancellation shared between a long computation and its watcher.
//!
//! A plain record of atomics: the computation adds to `done` and polls
//! `is_canceled`; the watcher (the engine, the GUI, a Ctrl-C handler) reads
//! `done`/`total` and may call `cancel`. The mathematics never spawns threads
//! itself except through rayon inside batch jobs.

use crate::error::{MathError, MathResult};
use std::sync::atomic::{AtomicBool, AtomicU64, Ordering};

/// Counters and a cancel flag for one computation.
#[derive(Debug, Default)]
pub struct Progress {
    done: AtomicU64,
    total: AtomicU64,
    cancel: AtomicBool,
}

impl Progress {
    /// A fresh record with `total` units of work expected.
    pub fn new(total: u64) -> Self {
        let p = Progress::default();
        p.set_total(total);
        p
    }

    /// Sets the amount of work expected.
    pub fn set_total(&self, total: u64) {
        self.total.store(total, Ordering::Relaxed);
    }

    /// Starts a new phase of the same computation: nothing done yet of
    /// `total` units (so a bar does not carry the count of the phase before).
    pub fn restart(&self, total: u64) {
        self.done.store(0, Ordering::Relaxed);
        self.total.store(total, Ordering::Relaxed);
    }

    /// Raises the amount of work expected to at least `total` (a computation
    /// that learns its size as it goes).
    pub fn raise_total(&self, total: u64) {
        self.total.fetch_max(total, Ordering::Relaxed);
    }

    /// Records `k` more units done.
    pub fn advance(&self, k: u64) {
        self.done.fetch_add(k, Ordering::Relaxed);
    }

    /// Units done so far.
    pub fn done(&self) -> u64 {
        self.done.load(Ordering::Relaxed)
    }

    /// Units expected in all.
    pub fn total(&self) -> u64 {
        self.total.load(Ordering::Relaxed)
    }

    /// The fraction done, in [0, 1] (for drawing a bar only).
    pub fn fraction(&self) -> f32 {
        let t = self.total();
        if t == 0 {
            0.0
        } else {
            (self.done() as f64 / t as f64).min(1.0) as f32
        }
    }

    /// Asks the computation to stop.
    pub fn cancel(&self) {
        self.cancel.store(true, Ordering::Relaxed);
    }

    /// Whether a stop was asked for.
    pub fn is_canceled(&self) -> bool {
        self.cancel.load(Ordering::Relaxed)
    }

    /// `Err(Canceled)` once a stop was asked for; call it in worker loops.
    pub fn check(&self) -> MathResult<()> {
        if self.is_canceled() {
            Err(MathError::Canceled)
        } else {
            Ok(())
        }
    }
}
