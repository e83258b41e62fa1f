//! Hessenberg class tables: the coefficients a^h_w = DS_h(S_w) for the w in S_n
//! with ℓ(w) = |h|, in listing order (lexicographic in one-line notation), and
//! the largest n a table is computed for.
//!
//! a^h_w is the coefficient of the Schubert class σ_{w0 w} in the class of the
//! regular semisimple Hessenberg variety of h. The table the program uses is read
//! off that class ([`crate::hessenberg::rows`]); the reference methods by DS_h
//! (transition on values, and Schubert polynomials term by term) are built with
//! the `reference` feature, for the tests and the benchmarks.

use crate::hessenberg::function::HessenbergFn;
use crate::perms::perm::Perm;
use num_bigint::BigInt;
use num_traits::{Signed, Zero};

/// The largest n a table is computed for (n = 13 takes about a minute and 2.3 GB of memory
/// on two cores; each step up costs about five times more).
pub const TABLE_MAX_N: usize = 14;

/// One entry a^h_w of a table.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct TableEntry {
    /// The position of w in the full listing (0-based).
    pub index: usize,
    /// The permutation w.
    pub perm: Perm,
    /// a^h_w = DS_h(S_w).
    pub value: BigInt,
}

/// The coefficients a^h_w for the selected w of length |h| (all of them unless sharded).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct HessenbergTable {
    /// The Hessenberg function.
    pub h: HessenbergFn,
    /// The entries, in listing order.
    pub entries: Vec<TableEntry>,
    /// How many permutations the full listing has.
    pub listed: usize,
}

impl HessenbergTable {
    /// Σ_w a^h_w over the entries present.
    pub fn total(&self) -> BigInt {
        self.entries.iter().map(|e| &e.value).sum()
    }

    /// The number of nonzero entries.
    pub fn nonzero(&self) -> usize {
        self.entries.iter().filter(|e| !e.value.is_zero()).count()
    }

    /// The largest entry (0 for an empty table).
    pub fn max(&self) -> BigInt {
        self.entries
            .iter()
            .map(|e| e.value.clone())
            .max()
            .unwrap_or_else(BigInt::zero)
    }

    /// The entries with a negative value (none, by the positivity of Hessenberg classes).
    pub fn negative(&self) -> Vec<&TableEntry> {
        self.entries
            .iter()
            .filter(|e| e.value.is_negative())
            .collect()
    }
}
