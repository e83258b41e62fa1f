//! elbowroom: an exact explorer for Schubert calculus.
//!
//! - [`math`]: permutations, reduced words, pipe dreams, polynomials, Schubert
//!   polynomials and everything computed from them; pure and exact.
//! - [`figure`]: figures as vector scenes, shared by the canvas and the exports.
//! - [`session`]: the inputs of an exploration, saved and reopened.
//! - [`engine`]: the shared computation thread: jobs, progress, cancellation, cache.
//! - [`cli`]: the headless commands behind `elbowroom <command>`.

pub mod cli;
pub mod engine;
pub mod figure;
#[cfg(feature = "gui")]
pub mod gui;
pub mod math;
pub mod session;
