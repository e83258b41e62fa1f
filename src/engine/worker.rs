//! The engine: starts each job on a background thread, hands back a [`Job`]
//! handle at once, keeps finished results in the [`Cache`] and a list of what
//! is running (for the status line), and wakes the window when a result lands.

use super::cache::Cache;
use super::job::Job;
use super::requests::{self, JobKey, Output};
use crate::math::{MathError, MathResult, Progress};
use std::sync::atomic::{AtomicU64, Ordering};
use std::sync::mpsc;
use std::sync::{Arc, Mutex};
use std::time::Instant;

/// A job listed in the status line.
#[derive(Clone)]
pub struct RunningJob {
    /// A serial number.
    pub id: u64,
    /// What it computes, in words.
    pub label: String,
    /// Its counters and cancel flag.
    pub progress: Arc<Progress>,
    /// When it started.
    pub started: Instant,
}

/// The shared computation service.
pub struct Engine {
    cache: Arc<Cache>,
    running: Arc<Mutex<Vec<RunningJob>>>,
    repaint: Arc<dyn Fn() + Send + Sync>,
    next_id: AtomicU64,
}

impl Engine {
    /// An engine that calls `repaint` whenever a result is ready.
    pub fn new(repaint: Arc<dyn Fn() + Send + Sync>) -> Self {
        Engine {
            cache: Arc::new(Cache::new(512)),
            running: Arc::new(Mutex::new(Vec::new())),
            repaint,
            next_id: AtomicU64::new(1),
        }
    }

    /// An engine that wakes nobody (tests, headless use).
    pub fn quiet() -> Self {
        Engine::new(Arc::new(|| {}))
    }

    /// The cache of finished results.
    pub fn cache(&self) -> &Cache {
        &self.cache
    }

    /// A finished result for `key`, if there is one.
    pub fn cached(&self, key: &JobKey) -> Option<Arc<Output>> {
        self.cache.get(key)
    }

    /// Starts computing `key` (see [`requests::compute`]). Every job has a
    /// thread of its own, and a batch job a rayon pool of its own (one thread
    /// fewer than the machine has cores), so no job waits for another: a slow
    /// table and a fast survey share the cores by the system's scheduler.
    pub fn start(&self, key: JobKey) -> Job {
        let k = key.clone();
        if key.is_batch() {
            self.start_with(key, move |p| match batch_pool() {
                Some(pool) => pool.install(|| requests::compute(&k, p)),
                None => requests::compute(&k, p),
            })
        } else {
            self.start_with(key, move |p| requests::compute(&k, p))
        }
    }

    /// Starts `work` on a background thread and files its result under `key`.
    pub fn start_with(
        &self,
        key: JobKey,
        work: impl FnOnce(&Progress) -> MathResult<Output> + Send + 'static,
    ) -> Job {
        let progress = Arc::new(Progress::new(0));
        let (tx, rx) = mpsc::channel();
        let id = self.next_id.fetch_add(1, Ordering::Relaxed);
        let entry = RunningJob {
            id,
            label: key.label(),
            progress: progress.clone(),
            started: Instant::now(),
        };
        lock(&self.running).push(entry);
        let cache = self.cache.clone();
        let running = self.running.clone();
        let repaint = self.repaint.clone();
        let p = progress.clone();
        let k = key.clone();
        let spawned = std::thread::Builder::new()
            .name(format!("elbowroom-job-{id}"))
            .spawn(move || {
                let result = work(&p).map(Arc::new);
                if let Ok(out) = &result {
                    cache.insert(k, out.clone());
                }
                lock(&running).retain(|r| r.id != id);
                let _ = tx.send(result);
                repaint();
            });
        if let Err(e) = spawned {
            lock(&self.running).retain(|r| r.id != id);
            let (tx, rx) = mpsc::channel();
            let _ = tx.send(Err(MathError::InvalidInput(format!(
                "could not start a worker thread: {e}"
            ))));
            return Job::new(key, progress, rx);
        }
        Job::new(key, progress, rx)
    }

    /// The jobs still running, oldest first.
    pub fn running(&self) -> Vec<RunningJob> {
        lock(&self.running).clone()
    }

    /// Asks every running job to stop.
    pub fn cancel_all(&self) {
        for r in lock(&self.running).iter() {
            r.progress.cancel();
        }
    }
}

/// A rayon pool for one batch job: one thread fewer than the machine has
/// cores (at least one), so that the window keeps a core while a table
/// computes. Each batch job gets its own, dropped when the job ends: with one
/// shared pool a long job held its threads and every later batch job queued
/// behind it.
fn batch_pool() -> Option<rayon::ThreadPool> {
    let cores = std::thread::available_parallelism().map_or(2, |c| c.get());
    rayon::ThreadPoolBuilder::new()
        .num_threads(cores.saturating_sub(1).max(1))
        .thread_name(|i| format!("elbowroom-batch-{i}"))
        .build()
        .ok()
}

fn lock<T>(m: &Mutex<T>) -> std::sync::MutexGuard<'_, T> {
    m.lock().unwrap_or_else(|e| e.into_inner())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::slot::{Fetch, Slot};
    use crate::math::Perm;
    use std::time::{Duration, Instant};

    fn wait_until(mut f: impl FnMut() -> bool) -> bool {
        let t = Instant::now();
        while t.elapsed() < Duration::from_secs(20) {
            if f() {
                return true;
            }
            std::thread::sleep(Duration::from_millis(2));
        }
        false
    }

    /// A computation that runs until it is canceled.
    fn endless(p: &Progress) -> MathResult<Output> {
        p.set_total(u64::MAX);
        loop {
            p.check()?;
            p.advance(1);
            std::thread::sleep(Duration::from_millis(1));
        }
    }

    #[test]
    fn a_second_request_is_a_cache_hit() {
        let engine = Engine::quiet();
        let w = Perm::parse("1432").unwrap();
        let key = JobKey::Schubert(w);
        let mut slot = Slot::default();
        assert!(wait_until(|| matches!(
            slot.fetch(&engine, key.clone()),
            Fetch::Ready(_)
        )));
        let hits = engine.cache().hits();
        let mut other = Slot::default();
        // the second slot finds the result without starting a job
        let Fetch::Ready(out) = other.fetch(&engine, key) else {
            panic!("expected a cached result");
        };
        assert_eq!(engine.cache().hits(), hits + 1);
        // S_{1432}, Macdonald's table for S_4
        assert_eq!(
            out.poly().unwrap().to_text(),
            "x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3"
        );
    }

    #[test]
    fn a_new_key_cancels_the_stale_job() {
        let engine = Engine::quiet();
        let mut slot = Slot::default();
        let stale = JobKey::Schubert(Perm::identity(3));
        slot.fetch_with(&engine, stale, endless);
        let progress = slot.progress().unwrap();
        assert_eq!(engine.running().len(), 1);
        let fresh = JobKey::Schubert(Perm::parse("213").unwrap());
        assert!(wait_until(|| matches!(
            slot.fetch(&engine, fresh.clone()),
            Fetch::Ready(_)
        )));
        assert!(progress.is_canceled());
        assert!(wait_until(|| engine.running().is_empty()));
    }

    #[test]
    fn dropping_a_job_cancels_it() {
        let engine = Engine::quiet();
        let job = engine.start_with(JobKey::Schubert(Perm::identity(2)), endless);
        let progress = engine.running()[0].progress.clone();
        assert!(wait_until(|| progress.done() > 0));
        drop(job);
        assert!(progress.is_canceled());
        assert!(wait_until(|| engine.running().is_empty()));
    }

    #[test]
    fn a_canceled_job_reports_canceled() {
        let engine = Engine::quiet();
        let job = engine.start_with(JobKey::Schubert(Perm::identity(2)), endless);
        job.cancel();
        let mut result = None;
        assert!(wait_until(|| {
            result = job.poll();
            result.is_some()
        }));
        assert!(matches!(result, Some(Err(MathError::Canceled))));
    }
}
