//! A view's standing request: the view says every frame what it needs; the slot
//! answers from the cache, keeps polling the running job, or — when the inputs
//! changed — cancels the stale job and starts the new one.

use super::job::Job;
use super::requests::{JobKey, Output};
use super::worker::Engine;
use crate::math::{MathError, MathResult, Progress};
use std::sync::Arc;

/// What a view can draw this frame.
pub enum Fetch<'a> {
    /// The result is here.
    Ready(&'a Arc<Output>),
    /// Still computing: fraction done (0 when unknown) and seconds elapsed.
    Running(f32, f32),
    /// The computation failed or was canceled.
    Failed(&'a MathError),
}

#[derive(Default)]
enum State {
    #[default]
    Empty,
    Running(Job),
    Done(Arc<Output>),
    Failed(MathError),
}

/// One view's request, holding at most one job.
#[derive(Default)]
pub struct Slot {
    key: Option<JobKey>,
    state: State,
    latest: Option<Arc<Output>>,
}

impl Slot {
    /// The answer for `key`, starting [`crate::engine::requests::compute`] if needed.
    pub fn fetch(&mut self, engine: &Engine, key: JobKey) -> Fetch<'_> {
        if self.key.as_ref() != Some(&key) {
            self.begin(engine, key, |engine, key| engine.start(key));
        }
        self.poll()
    }

    /// Like [`Slot::fetch`], with an explicit computation (for tests and one-off work).
    pub fn fetch_with(
        &mut self,
        engine: &Engine,
        key: JobKey,
        work: impl FnOnce(&Progress) -> MathResult<Output> + Send + 'static,
    ) -> Fetch<'_> {
        if self.key.as_ref() != Some(&key) {
            self.begin(engine, key, move |engine, key| engine.start_with(key, work));
        }
        self.poll()
    }

    fn begin(&mut self, engine: &Engine, key: JobKey, start: impl FnOnce(&Engine, JobKey) -> Job) {
        // dropping the old state cancels a stale job
        self.state = match engine.cached(&key) {
            Some(out) => State::Done(out),
            None => State::Running(start(engine, key.clone())),
        };
        self.key = Some(key);
    }

    fn poll(&mut self) -> Fetch<'_> {
        if let State::Running(job) = &self.state {
            match job.poll() {
                Some(Ok(out)) => self.state = State::Done(out),
                Some(Err(e)) => self.state = State::Failed(e),
                None => {}
            }
        }
        match &self.state {
            State::Done(out) => {
                if !self.latest.as_ref().is_some_and(|l| Arc::ptr_eq(l, out)) {
                    self.latest = Some(out.clone());
                }
                Fetch::Ready(out)
            }
            State::Running(job) => Fetch::Running(job.progress().fraction(), job.elapsed()),
            State::Failed(e) => Fetch::Failed(e),
            State::Empty => Fetch::Running(0.0, 0.0),
        }
    }

    /// Whether a job is running.
    pub fn is_running(&self) -> bool {
        matches!(self.state, State::Running(_))
    }

    /// The running job's progress record, if any.
    pub fn progress(&self) -> Option<Arc<Progress>> {
        match &self.state {
            State::Running(job) => Some(job.progress_arc()),
            _ => None,
        }
    }

    /// Asks the running job to stop (the slot then reports `Canceled`).
    pub fn cancel(&self) {
        if let State::Running(job) = &self.state {
            job.cancel();
        }
    }

    /// Lets go of the request: a running job is dropped, which cancels it (a
    /// view calls this when it no longer asks for what the slot holds).
    pub fn clear(&mut self) {
        self.state = State::Empty;
        self.key = None;
    }

    /// The inputs of the request held, if any.
    pub fn key(&self) -> Option<&JobKey> {
        self.key.as_ref()
    }

    /// Forgets a failure so that the next fetch starts again.
    pub fn retry(&mut self) {
        if matches!(self.state, State::Failed(_)) {
            self.state = State::Empty;
            self.key = None;
        }
    }

    /// The most recent result this slot received (possibly for older inputs).
    pub fn latest(&self) -> Option<&Arc<Output>> {
        self.latest.as_ref()
    }
}
