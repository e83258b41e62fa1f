//! Schubert polynomials.
//!
//! The fast method is Lascoux–Schützenberger transition
//! ([`crate::schubert::transition`]), memoized. The reference method applies divided differences to
//! S_{w0} = x_1^{n-1} x_2^{n-2} ... x_{n-1}.

use crate::perms::perm::Perm;
use crate::poly::mono::Mono;
use crate::poly::polynomial::{IntPoly, PolyBuilder};
use crate::schubert::transition::{partners, pivot, trim_fixed_points};
use num_bigint::BigInt;
use num_traits::One;
use std::collections::HashMap;
use std::sync::Arc;

/// A memo of Schubert polynomials, keyed by permutation (reduced to its support).
#[derive(Default)]
pub struct SchubertTable {
    memo: HashMap<Vec<u8>, Arc<IntPoly>>,
}

impl SchubertTable {
    /// An empty table.
    pub fn new() -> Self {
        Self::default()
    }

    /// The number of polynomials remembered.
    pub fn len(&self) -> usize {
        self.memo.len()
    }

    /// Whether nothing is remembered yet.
    pub fn is_empty(&self) -> bool {
        self.memo.is_empty()
    }

    /// S_w in n variables x_1..x_n (n = the size of w), by transition.
    ///
    /// ```
    /// use elbowroom_math::{Perm, schubert::polynomial::SchubertTable};
    /// let mut table = SchubertTable::new();
    /// // S_{1432} = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3 (Macdonald's table for S_4)
    /// let s = table.get(&Perm::parse("1432").unwrap());
    /// assert_eq!(s.to_text(), "x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3");
    /// ```
    pub fn get(&mut self, w: &Perm) -> Arc<IntPoly> {
        let n = w.n();
        let core = w.restrict(w.support_size()).unwrap_or_else(|| w.clone());
        let poly = self.get_core(&core.one_line().iter().map(|&v| v as u8).collect::<Vec<_>>());
        if poly.nvars() == n {
            poly
        } else {
            Arc::new(IntPoly::from_terms(n, poly.terms().iter().cloned()))
        }
    }

    fn get_core(&mut self, w: &[u8]) -> Arc<IntPoly> {
        if let Some(p) = self.memo.get(w) {
            return p.clone();
        }
        let n = w.len();
        let Some((r, s)) = pivot(w) else {
            let one = Arc::new(IntPoly::one(n));
            self.memo.insert(w.to_vec(), one.clone());
            return one;
        };
        let mut v = w.to_vec();
        v.swap(r, s);
        let mut acc = PolyBuilder::new(n);
        // monomials do not depend on the number of variables, so the memoized
        // polynomials of smaller support are used as they are, without copies
        let sv = self.get_core(trim_fixed_points(&v));
        let x_r = Mono::var_index(r);
        for (m, c) in sv.terms() {
            acc.add_term(Mono(m.0 + x_r.0), c);
        }
        for q in partners(&v, r) {
            let mut u = v.clone();
            u.swap(q, r);
            acc.add_poly(&self.get_core(trim_fixed_points(&u)));
        }
        let result = Arc::new(acc.build());
        self.memo.insert(w.to_vec(), result.clone());
        result
    }
}

/// S_w by transition (a fresh memo each call; keep a [`SchubertTable`] for many calls).
pub fn schubert(w: &Perm) -> IntPoly {
    let mut t = SchubertTable::new();
    (*t.get(w)).clone()
}

/// S_w by divided differences from S_{w0}: a reference method for tests.
pub fn schubert_by_divided_differences(w: &Perm) -> IntPoly {
    let n = w.n();
    let exps: Vec<u32> = (0..n).map(|i| (n - 1 - i) as u32).collect();
    let top = Mono::from_exps(&exps).unwrap_or(Mono::ONE);
    let mut poly = IntPoly::monomial(n, top, BigInt::one());
    // climb from w to w0 by ascents: w0 = w s_{i1} ... s_{ik}; then S_w = ∂_{i1} ... ∂_{ik} S_{w0}
    let mut v = w.clone();
    let mut steps = Vec::new();
    while let Some(i) = (1..n).find(|&i| v.at(i) < v.at(i + 1)) {
        steps.push(i);
        v = match v.times_s(i) {
            Ok(p) => p,
            Err(_) => break,
        };
    }
    for &i in steps.iter().rev() {
        poly = poly.divided_difference(i);
    }
    poly
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn transition_agrees_with_divided_differences_s5() {
        let mut t = SchubertTable::new();
        for w in Perm::all(5) {
            assert_eq!(*t.get(&w), schubert_by_divided_differences(&w), "w = {w}");
        }
    }
}
