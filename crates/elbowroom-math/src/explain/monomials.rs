//! A third route to a_w (Postnikov, "Permutohedra, associahedra, and beyond", IMRN
//! 2009, the divided symmetrization of a monomial, from memory): for a monomial x^c of
//! degree n − 1, DS_n(x^c) = (−1)^{|S|} β_n(S) with S = {i ≤ n − 1 : c_1 + ⋯ + c_i < i}
//! and β_n(S) the number of permutations of [n] with descent set S; so
//! a_w = Σ_c [x^c]S_w · (−1)^{|S(c)|} β_n(S(c)).

use crate::error::{MathError, MathResult};
use crate::hessenberg::divsym::descent_set_counts;
use crate::perms::perm::Perm;
use crate::poly::polynomial::IntPoly;
use num_bigint::BigInt;

/// DS_n of one monomial x^c of degree n − 1, with the set S(c) and β_n(S(c)).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct MonomialValue {
    /// The exponents c_1, …, c_n.
    pub exponents: Vec<u32>,
    /// S(c) = {i ≤ n − 1 : c_1 + ⋯ + c_i < i}.
    pub descent_set: Vec<usize>,
    /// β_n(S(c)).
    pub beta: u64,
    /// DS_n(x^c) = (−1)^{|S|} β_n(S).
    pub value: i64,
}

/// DS_n(x^c) by Postnikov's formula, for exponents c_1..c_n of total degree n − 1.
///
/// ```
/// use elbowroom_math::explain::monomials::monomial_value;
/// // DS_3(x2^2) = −β_3({1}) = −2
/// let v = monomial_value(&[0, 2, 0]).unwrap();
/// assert_eq!((v.descent_set, v.beta, v.value), (vec![1], 2, -2));
/// ```
pub fn monomial_value(exponents: &[u32]) -> MathResult<MonomialValue> {
    let n = exponents.len();
    if !(2..=crate::perms::perm::MAX_N).contains(&n)
        || exponents.iter().map(|&e| e as usize).sum::<usize>() != n - 1
    {
        return Err(MathError::InvalidInput(format!(
            "x^{exponents:?} is not a monomial of degree n − 1 in n variables (2 <= n <= {})",
            crate::perms::perm::MAX_N
        )));
    }
    let mut prefix = 0usize;
    let mut descent_set = Vec::new();
    let mut mask = 0usize;
    for i in 1..n {
        prefix += exponents[i - 1] as usize;
        if prefix < i {
            descent_set.push(i);
            mask |= 1 << (i - 1);
        }
    }
    let beta = descent_set_counts(n)[mask];
    let signed = i64::try_from(beta).unwrap_or(i64::MAX);
    let value = if descent_set.len() % 2 == 1 {
        -signed
    } else {
        signed
    };
    Ok(MonomialValue {
        exponents: exponents.to_vec(),
        descent_set,
        beta,
        value,
    })
}

/// The monomials of S_w with their DS_n values, and a_w = Σ [x^c]S_w · DS_n(x^c).
pub fn coefficient_by_monomials(
    w: &Perm,
    schubert: &IntPoly,
) -> MathResult<(Vec<(BigInt, MonomialValue)>, BigInt)> {
    let n = w.n();
    let mut rows = Vec::with_capacity(schubert.len());
    let mut total = BigInt::default();
    for (m, c) in schubert.terms() {
        let exps: Vec<u32> = (0..n).map(|i| m.exp(i)).collect();
        let v = monomial_value(&exps)?;
        total += c * BigInt::from(v.value);
        rows.push((c.clone(), v));
    }
    Ok((rows, total))
}
