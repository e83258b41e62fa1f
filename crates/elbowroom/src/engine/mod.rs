//! The shared computation thread: the explorer asks for results by their inputs
//! and never waits for them.
//!
//! - [`requests`]: what can be asked for ([`JobKey`]) and what comes back ([`Output`]).
//! - [`job`]: a handle on one running computation (progress, cancel, result channel).
//! - [`cache`]: finished results, shared as `Arc`s, keyed by their inputs.
//! - [`worker`]: the [`Engine`] that starts jobs on background threads and lists the running ones.
//! - [`forest_jobs`]: P_F, forest expansions and forest classes, for the forest and quotient views.
//! - [`layout`]: a Hessenberg table's summary and row order, for the view.
//! - [`slot`]: one view's standing request; a new key cancels the stale job.
//!
//! The engine knows nothing of the GUI: it is told how to wake the window by a
//! `repaint` callback.

pub mod cache;
pub mod forest_jobs;
pub mod job;
pub mod layout;
pub mod requests;
pub mod slot;
pub mod worker;

pub use cache::Cache;
pub use job::Job;
pub use requests::{BrowseKey, JobKey, Output};
pub use slot::{Fetch, Slot};
pub use worker::{Engine, RunningJob};
