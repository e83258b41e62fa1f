//! The limits of the project in one place: what each one bounds and why it
//! has its value. A computation a user can start estimates what it will
//! produce or hold before it starts and is refused, in one line naming the
//! estimate and the limit, when the estimate is over.
//!
//! The limits defined elsewhere in `math`, beside the computation they
//! guard, are re-exported here, so that this module lists every limit of the
//! mathematics. Outside `math`: the engine's `DREAM_LIMIT` (200 000 dreams
//! listed in the explorer), the `dreams --bumpless` listing cap
//! `cli::cmd_dreams::BUMPLESS_LIMIT` (200 000), and the piece sizes `merge`
//! reads (`cli::cmd_merge::MERGE_FILE_LIMIT`, and `cli::survey_piece::MAX_FORM_TEXT` for
//! one normal form of a survey piece).

pub use crate::explain::formula::{EXPLAIN_MAX_N, WORD_FORMULA_WORK_LIMIT};
pub use crate::explain::rules::TABLEAUX_LISTED;
pub use crate::forest::expansion::{FOREST_MONOMIAL_LIMIT, FOREST_STEP_LIMIT};
pub use crate::forest::indexed::{FOREST_MAX_LEN, FOREST_MAX_NODES};
pub use crate::forest::polynomial::FOREST_LABELING_LIMIT;
pub use crate::forest::quotient::FOREST_BASIS_MAX_N;
pub use crate::hessenberg::class::CLASS_TERM_LIMIT;
pub use crate::hessenberg::divsym::PAIR_LIMIT;
pub use crate::hessenberg::function::{COMPLEMENT_TERM_BOUND, HESSENBERG_MAX_N};
pub use crate::hessenberg::rows::{CLASS_HELD_LIMIT, CLASS_TABLE_LIMIT};
pub use crate::hessenberg::sweep::SWEEP_MAX_N;
pub use crate::hessenberg::table::TABLE_MAX_N;
pub use crate::perms::perm::MAX_N;
pub use crate::perms::words::{LAYER_LIMIT, RANK_LIMIT};
pub use crate::permutohedra::drawing::MAX_DRAWN_N;
pub use crate::permutohedra::permutohedron::POLYNOMIAL_MAX_N;
pub use crate::permutohedra::remixed::REMIXED_TABLE_WORK_LIMIT;
pub use crate::poly::mono::{MAX_EXP, MAX_VARS};
pub use crate::poly::parse::MAX_NESTING;
pub use crate::poly::polynomial::TERM_LIMIT;
pub use crate::quotient::forest_route::MAX_FOREST_ROUTE_N;
pub use crate::quotient::groebner::{MAX_CONSTRUCTION_BYTES, MAX_ELIMINATION_N, MAX_QUOTIENT_N};
pub use crate::quotient::survey::FULL_LISTING_MAX_N;
pub use crate::quotient::survey::HELD_SURVEY_MAX_N;
pub use crate::schubert::expansion::{EXPANSION_MONOMIAL_LIMIT, VECTOR_TERM_LIMIT};
pub use crate::schubert::product::{PRODUCT_TERM_LIMIT, TRANSITION_NODE_LIMIT};

/// The most characters a typed polynomial may have (on the command line, in
/// the explorer, in a session file). Linux passes at most 128 KiB in one
/// argument; 200 000 characters is above that and far above anything typed,
/// and reading that much takes well under a second.
pub const TYPED_TEXT_LIMIT: usize = 200_000;

/// The most characters of notes the explorer's notes panel edits: typing stays
/// within one frame (a text edit lays its whole text out again on each change;
/// 200 000 characters took 120–200 ms a frame in a release build; 19 805
/// characters, typed into at 150 ms a key under Xvfb: UI build median 0.71 ms,
/// max 1.93 ms over 272 frames). Longer notes read from a file are kept as they
/// are and shown as an excerpt, not edited.
pub const NOTES_TEXT_LIMIT: usize = 20_000;

/// The most terms a typed polynomial may expand to while it is read (a power
/// of a sum, a product of sums). 200 000 terms of big rationals take tens of
/// megabytes and a few seconds to build; `(x1 + x2 + x3 + x4)^100` (176 851
/// terms) is at the edge, `(x1 + ... + x6)^40` far over.
pub const TYPED_TERM_LIMIT: u128 = 200_000;

/// The most decimal digits a coefficient of a typed polynomial may reach by a
/// power (`123456789^255` has 2 064 digits; a 10 000-digit number to the 255th
/// would have 2.5 million).
pub const TYPED_DIGIT_LIMIT: u64 = 100_000;

/// The most coefficient products reading one typed polynomial may take, all
/// its multiplications and powers together (a power's whole squaring chain is
/// estimated before its first product), so the work of reading is bounded by
/// this and the length of the text. A product of big rationals into the sum
/// takes about 1 µs in a release build and 8 µs in the test build:
/// `(x1 + ⋯ + x8)^12` (50 388 terms, about 2.2·10^6 products) is read in
/// about 3 s (release); `(x1 + x2 + x3 + x4)^100` is refused at once.
pub const TYPED_PRODUCT_LIMIT: u128 = 4_000_000;

/// The most monomials DS_h(f) may have: DS_h(f) is symmetric of degree
/// deg f − dim, so it has at most C(deg f − dim + n − 1, n − 1) monomials
/// (x1^30 in 6 variables: 142 506 monomials, under a second; x1^100 in 6
/// variables would have 75 287 520). The answer is printed whole, so this
/// also bounds the output (a few megabytes).
pub const DIVSYM_TERM_LIMIT: u128 = 200_000;

/// The most terms of f times the terms of Q_h that DS_h(f) may go through
/// (each is one bialternant step). Estimated before Q_h is expanded, as
/// terms(f) · min(2^k, C(k + n − 1, n − 1)) for the k factors of Q_h.
pub const DIVSYM_PRODUCT_LIMIT: u128 = 20_000_000;

/// The most work the table of mixed Eulerian numbers may take, counted as
/// compositions times monomials of degree n − 1 in n variables
/// (C(2n − 3, n − 2) · C(2n − 2, n − 1)): each composition folds a dense
/// vector over those monomials. n = 10 is 1.2·10^9 (seconds); n = 11 is
/// 1.7·10^10 (minutes), n = 16 would be 1.2·10^16.
pub const EULERIAN_WORK_LIMIT: u128 = 2_000_000_000;

/// The most terms S_w may be expected to have, estimated as the smaller of
/// S_w(1, ..., 1) (its number of pipe dreams, a bound on its terms) and the
/// number of exponent vectors of degree ℓ(w) under the staircase
/// (a_i <= n − i). Two million terms with their memo take well under a
/// gigabyte and a few seconds.
pub const SCHUBERT_TERM_LIMIT: u128 = 2_000_000;

/// The most digits the numbers of a volume computation may be expected to
/// have: (n − 1) times the digits of the largest entry of λ over a common
/// denominator. The dynamic programme does O(n^4) operations on numbers of
/// about that size; at n = 16, 1 965 digits took 6 s in the debug build and
/// 10-digit fractions (now about 2 100 digits over their common denominator)
/// had taken 4.5 s before λ was scaled to integers. 1 500 keeps a volume
/// within a few seconds.
pub const VOLUME_DIGIT_LIMIT: u64 = 1_500;

/// The most rows of a Hessenberg table collected whole, as the Python module
/// returns it (a dictionary from permutations to integers, about 300 bytes a
/// row in Python): the default h of n = 15 (11 333 950 rows, about 3.5 GB) is
/// accepted, that of n = 16 (43 874 857 rows) is refused; the command line
/// streams its rows and is not bound by this.
pub const COLLECTED_ROWS_LIMIT: u128 = 12_000_000;

/// The most bumpless pipe dreams listed at once (they are found all together
/// as a closure under droop moves, so all are held in memory): the same
/// value as the `dreams --bumpless` listing and the explorer.
pub const BUMPLESS_LISTING_LIMIT: u64 = 200_000;

/// The largest `--index` a figure walks to in an enumeration (of pipe dreams
/// or reduced words): each step is a move, so a million take about a second.
pub const FIGURE_INDEX_LIMIT: usize = 1_000_000;

/// The most pixels one PNG figure may have (width times height): 64 million
/// RGBA pixels are 256 MB for the rasterizer.
pub const FIGURE_PIXEL_LIMIT: u64 = 64_000_000;

/// The largest file any command or the explorer reads (a session file, a
/// JSON piece for `merge`): 64 MB, far above any real session or piece.
pub const FILE_SIZE_LIMIT: u64 = 64 * 1024 * 1024;

/// How deep the brackets of a session file may nest. A session nests four
/// deep; a file nested deeper is refused before it can exhaust the stack.
pub const RON_NESTING_LIMIT: usize = 32;

/// The most entries of a session's history and of its pins.
pub const SESSION_LIST_LIMIT: usize = 100_000;

/// The most characters of a typed input quoted in a message: longer inputs
/// are quoted as an excerpt around the place of the problem.
pub const QUOTE_LIMIT: usize = 60;

/// C(a, b), saturating at `u128::MAX` (for estimates only).
pub fn binomial(a: u64, b: u64) -> u128 {
    if b > a {
        return 0;
    }
    let b = b.min(a - b);
    let mut acc: u128 = 1;
    for k in 1..=u128::from(b) {
        // acc · (a − b + k) / k stays exact: acc is C(a − b + k − 1, k − 1)
        let Some(next) = acc.checked_mul(u128::from(a - b) + k) else {
            return u128::MAX;
        };
        acc = next / k;
    }
    acc
}

/// The number of monomials of degree `d` in `n` variables, C(d + n − 1, n − 1)
/// (saturating; 0 variables have only the monomial 1 of degree 0).
pub fn monomials_of_degree(d: u64, n: u64) -> u128 {
    if n == 0 {
        return u128::from(d == 0);
    }
    binomial(d + n - 1, n - 1)
}

/// The number of monomials of degree at most `d` in `n` variables, C(d + n, n).
pub fn monomials_up_to_degree(d: u64, n: u64) -> u128 {
    binomial(d + n, n)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn binomials_and_monomial_counts() {
        assert_eq!(binomial(5, 2), 10);
        assert_eq!(binomial(29, 14), 77_558_760);
        assert_eq!(binomial(3, 5), 0);
        assert_eq!(binomial(10_000, 5_000), u128::MAX);
        // (x1 + x2 + x3 + x4)^100 has C(103, 3) = 176 851 terms
        assert_eq!(monomials_of_degree(100, 4), 176_851);
        assert_eq!(monomials_up_to_degree(2, 2), 6);
    }
}
