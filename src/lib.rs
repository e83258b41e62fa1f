//! elbowroom: an exact explorer for Schubert calculus.
//!
//! - [`math`]: permutations, reduced words, pipe dreams, polynomials, Schubert
//!   polynomials and everything computed from them; pure and exact.
//! - [`cli`]: the headless commands behind `elbowroom <command>`.

pub mod cli;
pub mod math;
