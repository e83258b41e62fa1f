//! Normal forms modulo J_n on the standard monomials without the Gröbner basis, through
//! the forest basis of the quotient.
//!
//! # Why it works
//! Reversing the variables, ω: x_i ↦ x_{n+1−i}, maps J_n onto itself (it sends M_α to
//! M_{rev α}) and the standard monomials x^e (e_1 + ⋯ + e_i ≤ i − 1) onto the monomials
//! x^c with c_i + ⋯ + c_n ≤ n − i: the codes of the forests supported in [n]. So those x^c
//! are a basis of Q[x]/J_n, and f ≡ Σ_e b_e x^e exactly when ω f ≡ Σ_e b_e x^{rev e}.
//!
//! In the other direction, Nadeau–Tewari (Adv. Math. 2024) give the class of any g in
//! the basis of forest polynomials P_F, F supported in [n] ([`crate::forest::quotient`]),
//! and P_F = x^{c(F)} + (monomials larger in lex order), so the class of a monomial x^c,
//! c a code supported in [n], is P_c plus forests of larger codes. The change of basis is
//! unitriangular: to write the class of g on the x^c, take the smallest code c in its
//! forest class, record its coefficient b_c, subtract b_c times the class of x^c, and go
//! on; every step removes c and adds only larger codes.
//!
//! # The class of a monomial
//! The trimming operator T_i sends a monomial to one signed monomial or to 0, so the
//! forest class of x^c is a walk over the canonical trimming sequences
//! ([`crate::forest::expansion`]) that carries one monomial and a sign, and every
//! coefficient is ±1. Each class is computed once per reducer and kept.
//!
//! Used to build the Gröbner basis ([`crate::quotient::basis_by_forests`]) and by
//! `--by-forests`; the tests compare it with division by the Gröbner basis on every
//! monomial of degree < n up to n = 7 and on whole surveys.

use crate::error::{MathError, MathResult};
use crate::forest::indexed::insert_code;
use crate::poly::mono::Mono;
use crate::progress::Progress;
use crate::quotient::groebner::QuasiGroebner;
use num_bigint::BigInt;
use num_traits::ToPrimitive;
use rustc_hash::FxHashMap;
use std::cmp::Reverse;
use std::collections::BinaryHeap;
use std::sync::{Arc, RwLock};

/// The largest n for which normal forms are computed through forests.
pub const MAX_FOREST_ROUTE_N: usize = 12;

/// A forest class on codes supported in [n]: (code as a monomial, ±1), codes increasing.
type Class = Arc<[(Mono, i8)]>;

/// Normal forms modulo J_n on the standard monomials, computed through forests.
pub struct ForestReducer {
    n: usize,
    basis: Vec<Mono>,
    index: FxHashMap<Mono, u32>,
    classes: RwLock<FxHashMap<Mono, Class>>,
}

/// x^e with the first n exponents reversed.
pub fn reverse_mono(m: Mono, n: usize) -> Mono {
    let mut out = Mono::ONE;
    for i in 0..n {
        let e = m.exp(i);
        if e > 0 {
            out = out.with_exp(n - 1 - i, e);
        }
    }
    out
}

impl ForestReducer {
    /// A reducer for Q[x_1..x_n]/J_n, 1 ≤ n ≤ [`MAX_FOREST_ROUTE_N`].
    pub fn new(n: usize) -> MathResult<ForestReducer> {
        if n == 0 || n > MAX_FOREST_ROUTE_N {
            return Err(MathError::OutOfRange(format!(
                "normal forms through forests are computed for 1 <= n <= {MAX_FOREST_ROUTE_N}, not n = {n}"
            )));
        }
        let basis = QuasiGroebner::standard_basis(n);
        let index = basis
            .iter()
            .enumerate()
            .map(|(i, &m)| (m, i as u32))
            .collect();
        Ok(ForestReducer {
            n,
            basis,
            index,
            classes: RwLock::new(FxHashMap::default()),
        })
    }

    /// The number of variables.
    pub fn n(&self) -> usize {
        self.n
    }

    /// The standard monomials, in the order of the positions used by [`Self::reduce_small`].
    pub fn basis(&self) -> &[Mono] {
        &self.basis
    }

    /// The normal form of Σ c·m as (basis position, coefficient), sorted by position, zeros
    /// dropped; `None` when a coefficient would outgrow `i128`. Polls `check`.
    pub fn reduce_small(
        &self,
        terms: impl IntoIterator<Item = (Mono, i128)>,
        check: &dyn Fn() -> MathResult<()>,
    ) -> MathResult<Option<Vec<(u32, i128)>>> {
        self.reduce_exact(terms, check)
    }

    /// The normal form of Σ c_m m as (basis position, coefficient) pairs, nonzero only, in
    /// basis order: checked `i128`, redone over `BigInt` on an overflow. Monomials in
    /// variables beyond x_n are an error; those of degree >= n lie in J_n.
    pub fn normal_form_with(
        &self,
        terms: &[(Mono, BigInt)],
        progress: &Progress,
    ) -> MathResult<Vec<(usize, BigInt)>> {
        let check = || progress.check();
        let small: Option<Vec<(Mono, i128)>> = terms
            .iter()
            .map(|(m, c)| c.to_i128().map(|c| (*m, c)))
            .collect();
        if let Some(small) = small
            && let Some(out) = self.reduce_exact(small, &check)?
        {
            return Ok(out
                .into_iter()
                .map(|(i, x)| (i as usize, BigInt::from(x)))
                .collect());
        }
        let big = self
            .reduce_exact(terms.iter().cloned(), &check)?
            .ok_or_else(|| MathError::InvalidInput("internal: big integers overflowed".into()))?;
        Ok(big.into_iter().map(|(i, x)| (i as usize, x)).collect())
    }

    fn reduce_exact<T: Exact>(
        &self,
        terms: impl IntoIterator<Item = (Mono, T)>,
        check: &dyn Fn() -> MathResult<()>,
    ) -> MathResult<Option<Vec<(u32, T)>>> {
        let n = self.n;
        let mut pending = Pending::<T>::default();
        for (m, c) in terms {
            if (n..crate::poly::mono::MAX_VARS).any(|i| m.exp(i) > 0) {
                return Err(MathError::OutOfRange(format!(
                    "the monomial {m:?} uses a variable beyond x{n}"
                )));
            }
            if c.is_zero() || m.degree() as usize >= n {
                continue;
            }
            let r = reverse_mono(m, n);
            let class = if self.index.contains_key(&m) {
                self.class_of_code(r)?
            } else {
                Arc::from(monomial_class(r, n).into_boxed_slice())
            };
            if !add_scaled(&mut pending, &class, &c) {
                return Ok(None);
            }
        }
        let mut out = Vec::new();
        while let Some((c, v)) = pending.pop_smallest() {
            if v.is_zero() {
                continue;
            }
            // one load of the cancel flag a code (a new class can be a long walk)
            check()?;
            let e = reverse_mono(c, n);
            let Some(&pos) = self.index.get(&e) else {
                return Err(MathError::InvalidInput(format!(
                    "internal: the forest class has the code {c:?}, not supported in [{n}]"
                )));
            };
            let class = self.class_of_code(c)?;
            // the class of x^c is P_c plus larger codes: subtract v times the rest
            let Some(neg) = v.negated() else {
                return Ok(None);
            };
            if !add_scaled(&mut pending, &class[1..], &neg) {
                return Ok(None);
            }
            out.push((pos, v));
        }
        out.sort_unstable_by_key(|t| t.0);
        Ok(Some(out))
    }

    /// The forest class of x^c for a code c supported in [n], kept once computed (shared
    /// by the threads that reduce with this reducer: read under a read lock).
    fn class_of_code(&self, c: Mono) -> MathResult<Class> {
        let poisoned =
            || MathError::InvalidInput("internal: a reducer's memory was poisoned".into());
        if let Some(k) = self.classes.read().map_err(|_| poisoned())?.get(&c) {
            return Ok(k.clone());
        }
        let class: Class = Arc::from(monomial_class(c, self.n).into_boxed_slice());
        match class.first() {
            Some(&(first, 1)) if first == c => {}
            _ => {
                return Err(MathError::InvalidInput(format!(
                    "internal: the forest class of x^{c:?} does not start with P_c"
                )));
            }
        }
        self.classes
            .write()
            .map_err(|_| poisoned())?
            .insert(c, class.clone());
        Ok(class)
    }
}

/// Exact integers for the change of basis: checked `i128` or `BigInt`.
trait Exact: Clone {
    fn zero() -> Self;
    fn is_zero(&self) -> bool;
    /// self += k (sign > 0) or self −= k; false on an overflow.
    fn add_signed(&mut self, k: &Self, sign: i8) -> bool;
    /// −self, `None` on an overflow.
    fn negated(&self) -> Option<Self>;
}

impl Exact for i128 {
    fn zero() -> Self {
        0
    }
    fn is_zero(&self) -> bool {
        *self == 0
    }
    fn add_signed(&mut self, k: &Self, sign: i8) -> bool {
        let r = if sign > 0 {
            self.checked_add(*k)
        } else {
            self.checked_sub(*k)
        };
        r.map(|x| *self = x).is_some()
    }
    fn negated(&self) -> Option<Self> {
        self.checked_neg()
    }
}

impl Exact for BigInt {
    fn zero() -> Self {
        num_traits::Zero::zero()
    }
    fn is_zero(&self) -> bool {
        num_traits::Zero::is_zero(self)
    }
    fn add_signed(&mut self, k: &Self, sign: i8) -> bool {
        if sign > 0 {
            *self += k;
        } else {
            *self -= k;
        }
        true
    }
    fn negated(&self) -> Option<Self> {
        Some(-self.clone())
    }
}

/// The coefficients still to be taken, by code: a hash map of the values and a heap of
/// the codes, smallest first (a code is pushed when it enters the map).
struct Pending<T> {
    values: FxHashMap<Mono, T>,
    order: BinaryHeap<Reverse<Mono>>,
}

impl<T> Default for Pending<T> {
    fn default() -> Self {
        Pending {
            values: FxHashMap::default(),
            order: BinaryHeap::new(),
        }
    }
}

impl<T: Exact> Pending<T> {
    /// The smallest code still held, with its value (possibly zero), removed.
    fn pop_smallest(&mut self) -> Option<(Mono, T)> {
        let Reverse(c) = self.order.pop()?;
        let v = self.values.remove(&c)?;
        Some((c, v))
    }
}

/// pending += k·class; false on an overflow.
fn add_scaled<T: Exact>(pending: &mut Pending<T>, class: &[(Mono, i8)], k: &T) -> bool {
    for &(c, s) in class {
        let slot = pending.values.entry(c).or_insert_with(|| {
            pending.order.push(Reverse(c));
            T::zero()
        });
        if !slot.add_signed(k, s) {
            return false;
        }
    }
    true
}

/// The class of x^e modulo J_n in the forest basis: (code, ±1) over the forests supported
/// in [n], codes increasing. A walk over the canonical trimming sequences carrying one
/// monomial: T_i x^e is x^{e without e_{i+1}}/x_i when e_{i+1} = 0 < e_i, minus
/// x^{e without e_i}/x_i when e_i = 0 < e_{i+1}, and 0 otherwise.
pub fn monomial_class(e: Mono, n: usize) -> Vec<(Mono, i8)> {
    let mut out = Vec::new();
    let exps: Vec<u32> = e.exps(crate::poly::mono::MAX_VARS);
    let degree: u32 = exps.iter().sum();
    if degree as usize >= n.max(1) {
        return out;
    }
    let mut seq = Vec::new();
    walk(&exps, degree, 1, n, &mut seq, &mut out);
    out.sort_unstable_by_key(|t| t.0);
    out
}

fn walk(
    e: &[u32],
    degree: u32,
    sign: i8,
    n: usize,
    seq: &mut Vec<usize>,
    out: &mut Vec<(Mono, i8)>,
) {
    if degree == 0 {
        let mut code = Vec::new();
        for &i in seq.iter().rev() {
            code = insert_code(&code, i);
        }
        let exps: Vec<u32> = code.iter().map(|&c| c as u32).collect();
        if let Some(m) = Mono::from_exps(&exps) {
            out.push((m, sign));
        }
        return;
    }
    let depth = seq.len();
    let lo = seq.last().map_or(1, |&i| i.saturating_sub(1).max(1));
    let used = e.iter().rposition(|&x| x > 0).map_or(0, |p| p + 1);
    // after this trim the rest must stand on n − depth − 1 leaves, with degree below that
    let room = n.saturating_sub(depth + 1);
    if degree as usize > room {
        return;
    }
    let hi = used.min(room);
    for i in lo..=hi {
        let (a, b) = (e[i - 1], e.get(i).copied().unwrap_or(0));
        let (drop, s) = if b == 0 && a > 0 {
            (i, sign)
        } else if a == 0 && b > 0 {
            (i - 1, -sign)
        } else {
            continue;
        };
        let mut f: Vec<u32> = Vec::with_capacity(e.len());
        f.extend_from_slice(&e[..drop]);
        f.extend_from_slice(&e[(drop + 1).min(e.len())..]);
        f[i - 1] -= 1;
        seq.push(i);
        walk(&f, degree - 1, s, n, seq, out);
        seq.pop();
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::forest::quotient::forest_normal_form;
    use crate::poly::polynomial::IntPoly;
    use crate::quotient::standard::is_standard;

    #[test]
    fn monomial_classes_agree_with_the_polynomial_walk() {
        // every monomial of degree < n in x_1..x_n, n <= 5: the walk on one monomial gives
        // the forest class of forest_normal_form (Nadeau–Tewari's expansion)
        for n in 1..=5usize {
            for d in 0..n as u32 {
                for m in crate::poly::compositions::monomials_of_degree(n, d) {
                    let exps = m.exps(n);
                    let f = IntPoly::from_terms(n, [(m, BigInt::from(1))]);
                    let want: Vec<(Mono, i8)> = {
                        let mut v: Vec<(Mono, i8)> = forest_normal_form(&f, n, &Progress::new(0))
                            .unwrap()
                            .into_iter()
                            .map(|(code, c)| {
                                let e: Vec<u32> = code.iter().map(|&x| x as u32).collect();
                                (Mono::from_exps(&e).unwrap(), i8::try_from(c).unwrap())
                            })
                            .collect();
                        v.sort_unstable_by_key(|t| t.0);
                        v
                    };
                    assert_eq!(monomial_class(m, n), want, "x^{exps:?}, n = {n}");
                }
            }
        }
    }

    #[test]
    fn normal_forms_agree_with_division_by_the_groebner_basis() {
        // every monomial of degree < n in x_1..x_n, n <= 7: the same coefficients on the
        // same standard monomials as division by the lex Gröbner basis of J_n
        for n in 1..=7usize {
            let q = crate::quotient::normal_form::groebner_basis(n).unwrap();
            let r = ForestReducer::new(n).unwrap();
            assert_eq!(r.basis(), q.basis(), "n = {n}");
            for d in 0..n as u32 {
                for m in crate::poly::compositions::monomials_of_degree(n, d) {
                    let want = q.monomial_normal_form(m).unwrap();
                    let want: Vec<(u32, i128)> = want.into_iter().filter(|t| t.1 != 0).collect();
                    let got = r.reduce_small([(m, 1)], &|| Ok(())).unwrap().unwrap();
                    assert_eq!(got, want, "{m:?}, n = {n}");
                }
            }
        }
    }

    #[test]
    fn standard_monomials_are_catalan_many() {
        // Catalan numbers, OEIS A000108
        let want = [1, 2, 5, 14, 42, 132, 429, 1430, 4862, 16796, 58786, 208012];
        for (n, &c) in (1..=12).zip(want.iter()) {
            let b = QuasiGroebner::standard_basis(n);
            assert_eq!(b.len(), c, "n = {n}");
            assert!(b.iter().all(|m| is_standard(&m.exps(n))));
        }
    }
}
