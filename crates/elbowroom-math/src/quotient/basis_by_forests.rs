//! The reduced Gröbner basis of J_n read off normal forms computed through forests.
//!
//! For a corner c (a minimal non-standard monomial) the reduced basis element is
//! G_c = c − NF(c): c − NF(c) lies in J_n, its tail is made of standard monomials, and
//! the reduced basis has exactly one element led by c (Aval–Bergeron–Bergeron 2004), which
//! is congruent to 0, so its tail is −NF(c) by the uniqueness of normal forms. NF(c) comes
//! from [`crate::quotient::forest_route`] (no linear algebra), one corner at a time on
//! rayon's pool. Every tail is checked to lie below its corner, and the
//! finished basis is certified like any other ([`crate::quotient::certificate`]): one
//! random combination of the generators of each degree must reduce to zero modulo p.
//! The elimination construction of [`QuasiGroebner::compute_by_elimination`] stays as an
//! independent second method; the tests compare the two.

use crate::error::{MathError, MathResult};
use crate::poly::compositions::monomials_of_degree;
use crate::progress::Progress;
use crate::quotient::forest_route::ForestReducer;
use crate::quotient::groebner::{GroebnerElement, QuasiGroebner};
use crate::quotient::standard::is_corner;
use rayon::prelude::*;

/// The reduced basis of J_n through forests (1 ≤ n ≤ [`crate::quotient::forest_route::MAX_FOREST_ROUTE_N`]),
/// counting one unit per corner of degree < n on `progress`, then the certificate's.
pub(crate) fn basis_by_forests(n: usize, progress: &Progress) -> MathResult<QuasiGroebner> {
    let r = ForestReducer::new(n)?;
    let corners: Vec<_> = (1..=n as u32)
        .flat_map(|d| monomials_of_degree(n, d))
        .filter(|m| is_corner(&m.exps(n)))
        .collect();
    let below_n = corners.iter().filter(|c| (c.degree() as usize) < n).count();
    progress.set_total(progress.done() + below_n as u64 + n as u64 - 1);
    let basis = r.basis();
    let mut elements: Vec<GroebnerElement> = corners
        .par_iter()
        .map(|&c| {
            progress.check()?;
            if c.degree() as usize >= n {
                // degree n: no standard monomial remains, G_c = c
                return Ok(GroebnerElement {
                    corner: c,
                    tail: Vec::new(),
                });
            }
            let nf = r
                .reduce_small([(c, 1i128)], &|| progress.check())?
                .ok_or_else(|| {
                    MathError::OutOfRange(format!(
                        "the normal form of the corner {c:?} outgrew 128 bits"
                    ))
                })?;
            let mut tail = Vec::with_capacity(nf.len());
            for (pos, v) in nf {
                let m = basis[pos as usize];
                if m.degree() != c.degree() || m >= c {
                    return Err(MathError::InvalidInput(format!(
                        "internal: the normal form of the corner {c:?} has the term {m:?}, not below it"
                    )));
                }
                let Some(a) = v.checked_neg() else {
                    return Err(MathError::OutOfRange(format!(
                        "a coefficient of the basis element led by {c:?} outgrew 128 bits"
                    )));
                };
                tail.push((m, a));
            }
            progress.advance(1);
            Ok(GroebnerElement { corner: c, tail })
        })
        .collect::<MathResult<_>>()?;
    elements.sort_by_key(|e| std::cmp::Reverse(e.corner));
    let g = QuasiGroebner::from_parts(n, elements, basis.to_vec(), vec![0; n + 1]);
    g.certify(progress)?;
    Ok(g)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_same_basis_as_by_elimination() {
        // the elimination construction uses no forest: an independent second method
        for n in 1..=7 {
            let a = QuasiGroebner::compute(n, None).unwrap();
            let b = QuasiGroebner::compute_by_elimination(n, None).unwrap();
            assert_eq!(a.elements(), b.elements(), "n = {n}");
            assert_eq!(a.basis(), b.basis(), "n = {n}");
        }
    }
}
