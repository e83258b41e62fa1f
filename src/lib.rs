//! elbowroom: an exact explorer for Schubert calculus.
//!
//! - [`math`]: permutations, reduced words, pipe dreams, polynomials, Schubert
//!   polynomials and everything computed from them; pure and exact.
//! - [`figure`]: figures as vector scenes, shared by the canvas and the exports.
//! - [`session`]: the inputs of an exploration, saved and reopened.
//! - [`cli`]: the headless commands behind `elbowroom <command>`.

pub mod cli;
pub mod figure;
pub mod math;
pub mod session;
