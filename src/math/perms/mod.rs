//! Permutations and reduced words: one-line notation and Lehmer codes,
//! pattern classes, listings of S_n, and reduced words with their counts and
//! moves. Uses only [`crate::math::error`] and [`crate::math::progress`].

pub mod class;
pub mod perm;
pub mod words;
