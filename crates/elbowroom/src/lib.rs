//! elbowroom: an exact explorer for Schubert calculus.
//!
//! - [`math`]: permutations, reduced words, pipe dreams, polynomials, Schubert
//!   polynomials and everything computed from them; pure and exact.
//! - [`figure`]: figures as vector scenes and their writers, shared by the
//!   canvas and the exports.
//! - [`tables`]: result tables as CSV or LaTeX, shared by `--csv`/`--latex`
//!   and the explorer's export.
//! - [`atomic_write`]: replacing a file atomically, for exports and saves.
//! - [`basis_cache`]: the basis of J_n kept in the user's cache directory.
//! - [`session`]: the inputs of an exploration, saved and reopened.
//! - [`engine`]: the shared computation thread: jobs, progress, cancellation, cache.
//! - [`cli`]: the headless commands behind `elbowroom <command>`.

pub mod atomic_write;
pub mod basis_cache;
pub mod cli;
pub mod engine;
pub mod figure;
#[cfg(feature = "gui")]
pub mod gui;
pub use elbowroom_math as math;
pub mod session;
pub mod tables;
