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
                let mut result = work(&p).map(Arc::new);
                // a job canceled before it ended delivers no result, even one
                // that was finished when the cancel came: the view that canceled
                // it shows "canceled" (with retry), never a result it stopped
                // waiting for, and the cache holds only results no one canceled
                if p.is_canceled() {
                    result = Err(MathError::Canceled);
                }
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
    use crate::engine::requests::Terms;
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

    /// Cancel, then retry: the canceled job's result (finished as the cancel
    /// came) is neither shown nor cached; the retry computes once, and what is
    /// shown is the retry's result, the same one on every later frame, with no
    /// job started again.
    #[test]
    fn after_cancel_and_retry_the_retry_result_is_shown_once_and_never_restarted() {
        use std::sync::atomic::AtomicUsize;
        let engine = Engine::quiet();
        let key = JobKey::Schubert(Perm::parse("1432").unwrap());
        let mut slot = Slot::default();
        // a computation that ends with a result just after the cancel reaches it
        let stale = |p: &Progress| -> MathResult<Output> {
            while !p.is_canceled() {
                std::thread::sleep(Duration::from_millis(1));
            }
            Ok(Output::Text("stale".into()))
        };
        assert!(matches!(
            slot.fetch_with(&engine, key.clone(), stale),
            Fetch::Running(..)
        ));
        slot.cancel();
        let mut seen = String::new();
        assert!(wait_until(|| match slot.fetch(&engine, key.clone()) {
            Fetch::Running(..) => false,
            Fetch::Ready(out) => {
                seen = out.text().unwrap_or("").to_string();
                true
            }
            Fetch::Failed(e) => {
                seen = e.to_string();
                true
            }
        }));
        assert_eq!(seen, MathError::Canceled.to_string());
        assert!(engine.cached(&key).is_none());
        // retry: one new job, whose result is shown
        let starts = Arc::new(AtomicUsize::new(0));
        let counted = starts.clone();
        let fresh = move |_: &Progress| -> MathResult<Output> {
            counted.fetch_add(1, Ordering::SeqCst);
            Ok(Output::Text("fresh".into()))
        };
        slot.retry();
        let mut first: Option<Arc<Output>> = None;
        let mut fresh = Some(fresh);
        assert!(wait_until(|| {
            let fetch = match fresh.take() {
                Some(work) => slot.fetch_with(&engine, key.clone(), work),
                None => slot.fetch(&engine, key.clone()),
            };
            match fetch {
                Fetch::Ready(out) => {
                    first = Some(out.clone());
                    true
                }
                _ => false,
            }
        }));
        let first = first.unwrap();
        assert_eq!(first.text(), Some("fresh"));
        // later frames: the same result, nothing running, nothing started again
        for _ in 0..50 {
            match slot.fetch(&engine, key.clone()) {
                Fetch::Ready(out) => assert!(Arc::ptr_eq(out, &first)),
                _ => panic!("the finished result went away"),
            }
            assert!(!slot.is_running());
        }
        assert!(wait_until(|| engine.running().is_empty()));
        assert_eq!(starts.load(Ordering::SeqCst), 1);
        assert!(engine.cached(&key).is_some_and(|c| Arc::ptr_eq(&c, &first)));
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

    /// A Hessenberg table that takes seconds: n = 11, h = (3, 4, ..., 11, 11, 11),
    /// |h| = Σ (h(i) − i) = 19, 1 073 227 rows.
    fn slow_table() -> JobKey {
        JobKey::Hessenberg(vec![3, 4, 5, 6, 7, 8, 9, 10, 11, 11, 11])
    }

    fn wait_for_result(job: &Job) -> MathResult<Arc<Output>> {
        let mut result = None;
        assert!(wait_until(|| {
            result = job.poll();
            result.is_some()
        }));
        result.unwrap_or(Err(MathError::InvalidInput("no result".into())))
    }

    #[test]
    fn a_cancel_stops_the_hessenberg_class_computation() {
        let engine = Engine::quiet();
        let job = engine.start(slow_table());
        // the class Q_h is being multiplied out factor by factor
        assert!(wait_until(|| job.progress().done() > 0));
        let asked = Instant::now();
        job.cancel();
        let result = wait_for_result(&job);
        eprintln!("the table stopped {:?} after the cancel", asked.elapsed());
        assert!(matches!(result, Err(MathError::Canceled)));
        assert!(wait_until(|| engine.running().is_empty()));
    }

    #[test]
    fn a_cancel_stops_reading_a_huge_power() {
        // (x1 + ... + x8)^12 has C(19, 7) = 50 388 terms (stars and bars); reading it
        // takes about 2.2·10^6 coefficient products, seconds in the test build
        let engine = Engine::quiet();
        let text = "(x1+x2+x3+x4+x5+x6+x7+x8)^12".to_string();
        let job = engine.start(JobKey::Typed(text, 8));
        // the job is running (it is listed from its start): cancel it at once, since
        // the reading takes seconds, whatever point it has reached it has not finished
        assert!(wait_until(|| !engine.running().is_empty()));
        let asked = Instant::now();
        job.cancel();
        let result = wait_for_result(&job);
        eprintln!("reading stopped {:?} after the cancel", asked.elapsed());
        assert!(matches!(result, Err(MathError::Canceled)), "{result:?}");
    }

    #[test]
    fn reading_a_huge_power_reports_its_progress() {
        // (x1 + ... + x8)^12: C(19, 7) = 50 388 terms (stars and bars); the reading
        // multiplies by repeated squaring and reports the coefficient products done
        let engine = Engine::quiet();
        let text = "(x1+x2+x3+x4+x5+x6+x7+x8)^12".to_string();
        let job = engine.start(JobKey::Typed(text, 8));
        let p = job.progress_arc();
        // the bar leaves 0 before the reading ends, and moves on
        assert!(wait_until(|| p.fraction() > 0.0 || job.poll().is_some()));
        let first = p.done();
        assert!(p.total() > 0 && first > 0, "{} of {}", first, p.total());
        let mut later = first;
        assert!(wait_until(|| {
            later = p.done();
            later > first
        }));
        assert!(later <= p.total(), "{later} of {}", p.total());
        // and a cancel still stops it at once
        let asked = Instant::now();
        job.cancel();
        let result = wait_for_result(&job);
        let stopped = asked.elapsed();
        eprintln!(
            "reading: {first}, then {later} of {} products; stopped {stopped:?} after the cancel",
            p.total()
        );
        assert!(matches!(result, Err(MathError::Canceled)), "{result:?}");
        assert!(stopped < Duration::from_millis(500), "{stopped:?}");
    }

    #[test]
    fn a_second_request_of_a_slot_cancels_the_first_table() {
        let engine = Engine::quiet();
        let mut slot = Slot::default();
        slot.fetch(&engine, slow_table());
        let first = slot.progress().unwrap();
        // h = (2, 3, 4, 4): the six permutations of length 3 in S_4 (OEIS A008302)
        let small = JobKey::Hessenberg(vec![2, 3, 4, 4]);
        assert!(wait_until(|| matches!(
            slot.fetch(&engine, small.clone()),
            Fetch::Ready(out) if out.hessenberg().is_some_and(|t| t.entries.len() == 6)
        )));
        assert!(first.is_canceled());
        // the first job's thread has ended: nothing runs any more
        assert!(wait_until(|| engine.running().is_empty()));
    }

    #[test]
    fn a_fast_batch_job_finishes_while_a_slow_one_runs() {
        let engine = Engine::quiet();
        let slow = engine.start(slow_table());
        assert!(wait_until(|| slow.progress().done() > 0));
        // the survey of S_5 is batch work too; it must not wait for the table's pool
        let survey = engine.start(JobKey::Survey(5));
        let out = wait_for_result(&survey);
        let Ok(out) = out else {
            panic!("the survey failed: {out:?}");
        };
        let Output::Survey(entries) = out.as_ref() else {
            panic!("not a survey");
        };
        assert_eq!(entries.len(), 120);
        // the slow table is still computing (it was never asked to stop)
        assert!(slow.poll().is_none());
        assert!(!slow.progress().is_canceled());
    }

    #[test]
    fn products_and_expansions_are_the_commands_values() -> MathResult<()> {
        let engine = Engine::quiet();
        let p = |s: &str| Perm::parse(s);
        // S_132 · S_132 = (x1 + x2)^2 = S_231 + S_1423 (Monk's rule; by hand:
        // S_231 = x1 x2, S_1423 = x1^2 + x1 x2 + x2^2)
        let job = engine.start(JobKey::Product(p("132")?, p("132")?, None));
        let out = wait_for_result(&job)?;
        let terms: Vec<String> = out
            .terms()
            .map(|t| t.terms.iter().map(|(w, c)| format!("{c} {w}")).collect())
            .unwrap_or_default();
        assert_eq!(terms, ["1 1423", "1 231"]);
        // in H*(Fl_3) S_1423 lies in I_3
        let job = engine.start(JobKey::Product(p("132")?, p("132")?, Some(3)));
        let out = wait_for_result(&job)?;
        assert_eq!(out.terms().map(|t| t.terms.len()), Some(1));
        // x2 = S_132 − S_21 (S_132 = x1 + x2, S_21 = x1; Macdonald's table): a negative term
        let job = engine.start(JobKey::Expansion("x2".into(), 3, true));
        let out = wait_for_result(&job)?;
        let t = out.terms().cloned().unwrap_or(Terms { terms: vec![] });
        assert!(t.has_negative());
        let terms: Vec<String> = t.terms.iter().map(|(w, c)| format!("{c} {w}")).collect();
        assert_eq!(terms, ["1 132", "-1 21"]);
        Ok(())
    }
}
