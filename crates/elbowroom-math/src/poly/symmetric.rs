//! Symmetric polynomials in n variables: partitions, Kostka numbers, the
//! passage from Schur polynomials to monomial symmetric polynomials, and the
//! bialternant rule for ∂_{w0} of a monomial.
//!
//! Bialternant rule (Jacobi): with δ = (n-1, ..., 1, 0) and A the
//! antisymmetrizer, A(x^a)/A(x^δ) = 0 when a has a repeated entry, and otherwise
//! ε · s_{b - δ}, where b is a sorted decreasingly and ε is the sign of the sort.
//! Since ∂_{w0} f = A(f)/Δ with Δ = A(x^δ), this computes ∂_{w0} term by term.

use crate::error::{MathError, MathResult};
use crate::perms::arrangement::next_arrangement;
use crate::poly::mono::Mono;
use crate::poly::polynomial::{Coeff, Poly, PolyBuilder};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Zero};
use std::collections::{BTreeMap, HashMap};

/// A partition as a weakly decreasing exponent vector padded with zeros to n entries.
pub type Partition = Vec<u32>;

/// ∂_{w0}(x^a) as ±s_μ: `None` when a has a repeated entry, else `(sign, μ)`
/// with μ padded to n entries.
///
/// ```
/// use elbowroom_math::poly::symmetric::bialternant;
/// // ∂_{w0} x^δ = 1 = s_∅, and x2^2 x1 = x^{(1,2,0)} gives -s_∅ in three variables
/// assert_eq!(bialternant(&[2, 1, 0]), Some((1, vec![0, 0, 0])));
/// assert_eq!(bialternant(&[1, 2, 0]), Some((-1, vec![0, 0, 0])));
/// assert_eq!(bialternant(&[3, 1, 0]), Some((1, vec![1, 0, 0])));
/// assert_eq!(bialternant(&[1, 1, 0]), None);
/// ```
pub fn bialternant(a: &[u32]) -> Option<(i32, Partition)> {
    let n = a.len();
    let mut inversions = 0usize;
    for i in 0..n {
        for j in i + 1..n {
            if a[i] == a[j] {
                return None;
            }
            if a[i] < a[j] {
                inversions += 1;
            }
        }
    }
    let mut b = a.to_vec();
    b.sort_unstable_by(|x, y| y.cmp(x));
    let mu: Partition = b
        .iter()
        .enumerate()
        .map(|(i, &v)| v - (n - 1 - i) as u32)
        .collect();
    Some((if inversions.is_multiple_of(2) { 1 } else { -1 }, mu))
}

/// All partitions of `total` with at most `parts` parts, padded to `parts`
/// entries, in decreasing lexicographic order.
pub fn partitions(total: u32, parts: usize) -> Vec<Partition> {
    fn go(rest: u32, max: u32, prefix: &mut Vec<u32>, parts: usize, out: &mut Vec<Partition>) {
        if prefix.len() == parts {
            if rest == 0 {
                out.push(prefix.clone());
            }
            return;
        }
        let slots = (parts - prefix.len()) as u32;
        for v in (0..=max.min(rest)).rev() {
            // the remaining parts are at most v each
            if v.saturating_mul(slots) < rest {
                break;
            }
            prefix.push(v);
            go(rest - v, v, prefix, parts, out);
            prefix.pop();
        }
    }
    let mut out = Vec::new();
    if parts == 0 {
        if total == 0 {
            out.push(Vec::new());
        }
        return out;
    }
    go(total, total, &mut Vec::new(), parts, &mut out);
    out
}

/// Kostka numbers K_{μλ} (semistandard tableaux of shape μ and content λ), memoized.
#[derive(Default)]
pub struct Kostka {
    memo: HashMap<(Vec<u32>, Vec<u32>), BigInt>,
}

impl Kostka {
    /// An empty memo.
    pub fn new() -> Self {
        Self::default()
    }

    /// K_{μλ}: the largest letter ℓ fills a horizontal strip μ/ν of size λ_ℓ.
    ///
    /// ```
    /// use elbowroom_math::poly::symmetric::Kostka;
    /// let mut k = Kostka::new();
    /// // s_{21} = m_{21} + 2 m_{111}
    /// assert_eq!(k.number(&[2, 1], &[2, 1]).to_string(), "1");
    /// assert_eq!(k.number(&[2, 1], &[1, 1, 1]).to_string(), "2");
    /// ```
    pub fn number(&mut self, mu: &[u32], lambda: &[u32]) -> BigInt {
        let mu: Vec<u32> = mu.iter().copied().filter(|&v| v > 0).collect();
        let lambda: Vec<u32> = lambda.iter().copied().filter(|&v| v > 0).collect();
        if mu.iter().sum::<u32>() != lambda.iter().sum::<u32>() {
            return BigInt::zero();
        }
        self.inner(mu, lambda)
    }

    fn inner(&mut self, mu: Vec<u32>, lambda: Vec<u32>) -> BigInt {
        let Some((&last, rest)) = lambda.split_last() else {
            return if mu.is_empty() {
                BigInt::one()
            } else {
                BigInt::zero()
            };
        };
        if mu.len() > lambda.len() {
            // a column of a tableau holds distinct letters
            return BigInt::zero();
        }
        let key = (mu.clone(), lambda.clone());
        if let Some(v) = self.memo.get(&key) {
            return v.clone();
        }
        let mut total = BigInt::zero();
        let mut nu = Vec::new();
        let mut strips = Vec::new();
        horizontal_strips(&mu, 0, last, &mut nu, &mut strips);
        let rest = rest.to_vec();
        for nu in strips {
            total += self.inner(nu, rest.clone());
        }
        self.memo.insert(key, total.clone());
        total
    }
}

/// Every ν ⊆ μ with μ/ν a horizontal strip of `size` boxes (μ_{i+1} <= ν_i <= μ_i).
fn horizontal_strips(mu: &[u32], i: usize, size: u32, nu: &mut Vec<u32>, out: &mut Vec<Vec<u32>>) {
    if i == mu.len() {
        if size == 0 {
            out.push(nu.iter().copied().filter(|&v| v > 0).collect());
        }
        return;
    }
    let low = mu.get(i + 1).copied().unwrap_or(0);
    let remaining_capacity: u32 = (i..mu.len())
        .map(|k| mu[k] - mu.get(k + 1).copied().unwrap_or(0))
        .sum();
    if remaining_capacity < size {
        return;
    }
    for v in low..=mu[i] {
        let taken = mu[i] - v;
        if taken > size {
            continue;
        }
        nu.push(v);
        horizontal_strips(mu, i + 1, size - taken, nu, out);
        nu.pop();
    }
}

/// Converts Σ_μ c_μ s_μ (in n variables) to Σ_λ d_λ m_λ, dropping zeros.
pub fn schur_to_monomial(
    schur: &BTreeMap<Partition, BigRational>,
    n: usize,
) -> BTreeMap<Partition, BigRational> {
    let mut kostka = Kostka::new();
    let mut out: BTreeMap<Partition, BigRational> = BTreeMap::new();
    let degrees: std::collections::BTreeSet<u32> = schur.keys().map(|mu| mu.iter().sum()).collect();
    for d in degrees {
        for lambda in partitions(d, n) {
            let mut acc = BigRational::zero();
            for (mu, c) in schur.iter().filter(|(mu, _)| mu.iter().sum::<u32>() == d) {
                let k = kostka.number(mu, &lambda);
                if !k.is_zero() {
                    acc += c * BigRational::from_integer(k);
                }
            }
            if !acc.is_zero() {
                out.insert(lambda, acc);
            }
        }
    }
    out
}

/// Expands Σ_λ d_λ m_λ into a polynomial in n variables (every distinct
/// rearrangement of each λ).
pub fn monomial_expansion<C: Coeff>(sym: &BTreeMap<Partition, C>, n: usize) -> MathResult<Poly<C>> {
    let mut b = PolyBuilder::new(n);
    for (lambda, c) in sym {
        let mut arrangement = lambda.clone();
        arrangement.sort_unstable();
        loop {
            let m = Mono::from_exps(&arrangement)
                .ok_or_else(|| MathError::OutOfRange("an exponent would exceed 255".into()))?;
            b.add_term(m, c);
            if !next_arrangement(&mut arrangement) {
                break;
            }
        }
    }
    Ok(b.build())
}

/// The m_λ coefficients of a symmetric polynomial: its coefficients at x^λ for partitions λ.
pub fn monomial_coefficients<C: Coeff>(f: &Poly<C>) -> BTreeMap<Partition, C> {
    let n = f.nvars();
    let mut out = BTreeMap::new();
    for (m, c) in f.terms() {
        let e = m.exps(n);
        if e.windows(2).all(|w| w[0] >= w[1]) {
            out.insert(e, c.clone());
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn partition_counts_match_oeis_a008284_sums() {
        // p(n) = number of partitions of n, OEIS A000041
        let p = [1usize, 1, 2, 3, 5, 7, 11, 15, 22, 30, 42];
        for (d, &count) in p.iter().enumerate() {
            assert_eq!(partitions(d as u32, d.max(1)).len(), count, "d = {d}");
        }
        assert_eq!(partitions(4, 2), vec![vec![4, 0], vec![3, 1], vec![2, 2]]);
    }

    #[test]
    fn kostka_numbers_of_size_four() {
        // Macdonald, Symmetric Functions and Hall Polynomials, table of K_{λμ} for n = 4 (from memory):
        // K_{(2,1,1),(1,1,1,1)} = 3, K_{(2,2),(1,1,1,1)} = 2, K_{(3,1),(2,1,1)} = 2, K_{(2,2),(2,1,1)} = 1
        let mut k = Kostka::new();
        assert_eq!(k.number(&[2, 1, 1], &[1, 1, 1, 1]), BigInt::from(3));
        assert_eq!(k.number(&[2, 2], &[1, 1, 1, 1]), BigInt::from(2));
        assert_eq!(k.number(&[3, 1], &[2, 1, 1]), BigInt::from(2));
        assert_eq!(k.number(&[2, 2], &[2, 1, 1]), BigInt::from(1));
        assert_eq!(k.number(&[2, 2], &[3, 1]), BigInt::from(0));
        // K_{λ,1^n} = number of standard tableaux; f^{(3,2,1)} = 16 (hook length formula)
        assert_eq!(k.number(&[3, 2, 1], &[1, 1, 1, 1, 1, 1]), BigInt::from(16));
    }

    #[test]
    fn schur_expansion_is_symmetric_and_has_the_right_number_of_terms() {
        // s_{(1,1)} in 3 variables is e_2 = x1x2 + x1x3 + x2x3
        let mut s = BTreeMap::new();
        s.insert(vec![1, 1, 0], BigRational::one());
        let m = schur_to_monomial(&s, 3);
        let p = monomial_expansion(&m, 3).unwrap();
        assert_eq!(p.to_text(), "x1 x2 + x1 x3 + x2 x3");
        assert!(p.is_symmetric());
        assert_eq!(monomial_coefficients(&p), m);
    }
}
