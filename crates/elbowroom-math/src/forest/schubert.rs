//! Schubert polynomials in the forest basis: S_w = Σ_F c_{w,F} P_F, with
//! c_{w,F} ≥ 0 (Nadeau–Spink–Tewari 2024; checked here on all of S_7), and
//! the permutations whose Schubert polynomial is a single forest polynomial.

use crate::error::{MathError, MathResult};
use crate::forest::expansion::{ForestTerms, forest_expansion};
use crate::limits::SCHUBERT_TERM_LIMIT;
use crate::perms::perm::Perm;
use crate::pipes::dream::term_bound;
use crate::progress::Progress;
use crate::schubert::polynomial::schubert;
use num_bigint::BigInt;
use num_traits::One;

/// The forest expansion of S_w, sized by the terms of S_w (every forest of
/// the expansion shows its code as a monomial of S_w, both sides being
/// positive, so S_w's term bound also bounds the expansion).
///
/// ```
/// use elbowroom_math::forest::schubert::schubert_forest_expansion;
/// use elbowroom_math::{Perm, Progress};
/// // S_2413 = P_(1,2) + P_(2,1) (Nadeau–Tewari, an example checked by hand)
/// let w = Perm::parse("2413").unwrap();
/// let e = schubert_forest_expansion(&w, &Progress::default()).unwrap();
/// let codes: Vec<Vec<usize>> = e.iter().map(|(c, _)| c.clone()).collect();
/// assert_eq!(codes, vec![vec![2, 1], vec![1, 2]]);
/// ```
pub fn schubert_forest_expansion(w: &Perm, progress: &Progress) -> MathResult<ForestTerms<BigInt>> {
    check_schubert_size(w)?;
    forest_expansion(&schubert(w), None, progress)
}

/// Refuses w when S_w may have more than [`SCHUBERT_TERM_LIMIT`] terms.
pub fn check_schubert_size(w: &Perm) -> MathResult<()> {
    let bound = term_bound(w);
    if bound > SCHUBERT_TERM_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "S_{w} may have up to {bound} terms; at most {SCHUBERT_TERM_LIMIT} are accepted"
        )));
    }
    Ok(())
}

/// Whether an expansion is one forest polynomial with coefficient 1.
pub fn is_single(terms: &ForestTerms<BigInt>) -> bool {
    matches!(terms.as_slice(), [(_, c)] if c.is_one())
}
