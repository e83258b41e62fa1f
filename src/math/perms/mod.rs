//! Permutations and reduced words: one-line notation and Lehmer codes,
//! pattern classes, listings (rearrangements, S_n, permutations of a given
//! length), and reduced words with their counts and
//! moves. Uses only [`crate::math::error`] and [`crate::math::progress`].

pub mod arrangement;
pub mod perm;

pub mod class;
pub mod listing;
pub mod words;
