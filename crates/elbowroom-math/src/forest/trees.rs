//! a_w = DS_n(S_w) by trees: for F of degree n − 1, DS_n(P_F) = 0 unless F is
//! one binary tree T on the leaves 1..n, and then DS_n(P_T) = (n−1)!/Π_v h_v,
//! the number of increasing labelings of T (Nadeau–Tewari 2024, the
//! permutahedral class; stated there as a parking procedure, here as the
//! equivalent formula, checked against the class method for n ≤ 9). Hence
//! a_w = Σ_T c_{w,T}·(n−1)!/Π_v h_v, a sum of nonnegative integers.

use crate::error::{MathError, MathResult};
use crate::forest::expansion::forest_expansion;
use crate::forest::indexed::Forest;
use crate::forest::schubert::check_schubert_size;
use crate::perms::perm::Perm;
use crate::progress::Progress;
use crate::schubert::polynomial::schubert;
use num_bigint::{BigInt, BigUint};

/// One tree of a_w: its code, c_{w,T} and its number of increasing labelings.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct TreeTerm {
    /// The code of T (without trailing zeros).
    pub code: Vec<usize>,
    /// c_{w,T}, the coefficient of P_T in S_w.
    pub coefficient: BigInt,
    /// (n − 1)!/Π_v h_v.
    pub labelings: BigUint,
}

/// The trees of a_w for w in S_n with ℓ(w) = n − 1, in decreasing
/// lexicographic order of code; Σ coefficient·labelings = a_w = DS_n(S_w).
///
/// ```
/// use elbowroom_math::forest::trees::a_w_by_trees;
/// use elbowroom_math::{Perm, Progress};
/// // w = 1432 in S_4: S_w = P_(1,2) + P_(0,2,1); only (1,2) is a tree on 1..4:
/// // (1((2 3)4)) with h_v = 3, 2, 1 has 3!/(3·2·1) = 1 labeling, so a_1432 = 1
/// let t = a_w_by_trees(&Perm::parse("1432").unwrap(), &Progress::default()).unwrap();
/// assert_eq!(t.len(), 1);
/// assert_eq!(t[0].code, vec![1, 2]);
/// ```
pub fn a_w_by_trees(w: &Perm, progress: &Progress) -> MathResult<Vec<TreeTerm>> {
    let n = w.n();
    if w.length() + 1 != n {
        return Err(MathError::InvalidInput(format!(
            "a_w by trees needs ℓ(w) = n − 1; {w} has length {} and n = {n}",
            w.length()
        )));
    }
    check_schubert_size(w)?;
    let terms = forest_expansion(&schubert(w), Some(n), progress)?;
    let mut out = Vec::new();
    for (code, coefficient) in terms {
        let f = Forest::from_code(&code)?;
        if !f.is_tree_on(n) {
            continue;
        }
        out.push(TreeTerm {
            code,
            coefficient,
            labelings: f.increasing_labelings(),
        });
    }
    Ok(out)
}

/// a_w as Σ_T c_{w,T}·labelings(T).
pub fn a_w_sum(terms: &[TreeTerm]) -> BigInt {
    terms
        .iter()
        .map(|t| &t.coefficient * BigInt::from(t.labelings.clone()))
        .sum()
}
