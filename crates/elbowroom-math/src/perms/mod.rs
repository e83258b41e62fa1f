//! Permutations and reduced words: one-line notation and Lehmer codes,
//! pattern classes, listings (rearrangements, S_n, permutations of a given
//! length), and reduced words with their counts and
//! moves. Uses only [`crate::error`] and [`crate::progress`].

pub mod arrangement;
pub mod perm;

pub mod class;
pub mod listing;
pub mod words;
