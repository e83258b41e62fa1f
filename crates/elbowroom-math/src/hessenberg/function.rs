//! Hessenberg functions h: [n] -> [n] and the two products they define.
//!
//! A Hessenberg function is weakly increasing with h(i) >= i and h(n) = n.
//! It defines the denominator D_h = Π_{i < j <= h(i)} (x_i - x_j) of the divided
//! symmetrization DS_h, and its complement Q_h = Π_{i < j, j > h(i)} (x_i - x_j),
//! so that D_h · Q_h = Δ = Π_{i<j} (x_i - x_j). The number of factors of D_h,
//! Σ_i (h(i) - i), is the dimension of the regular Hessenberg variety of h.

use crate::error::{MathError, MathResult};
use crate::perms::perm::MAX_N;
use crate::poly::polynomial::{IntPoly, RatPoly};
use crate::progress::Progress;
use num_rational::BigRational;
use num_traits::One;
use std::fmt;

/// A Hessenberg function, stored 1-based: `values()[i - 1] = h(i)`.
#[derive(Clone, PartialEq, Eq, Hash, Debug, PartialOrd, Ord)]
pub struct HessenbergFn {
    values: Vec<usize>,
}

/// The largest n of a Hessenberg function: one more than the polynomials'
/// [`MAX_N`], for the tables read off the class alone
/// ([`crate::hessenberg::rows`], whose keys hold S_17); every computation
/// through polynomials in x_1, ..., x_n refuses n > [`MAX_N`] itself.
pub const HESSENBERG_MAX_N: usize = MAX_N + 1;

const ACCEPTED: &str = "a Hessenberg function h(1),...,h(n) is weakly increasing, with i <= h(i) <= n and h(n) = n (for example 2,3,4,4)";

impl HessenbergFn {
    /// Checks and wraps h(1), ..., h(n).
    pub fn new(values: &[usize]) -> MathResult<HessenbergFn> {
        let n = values.len();
        if n == 0 {
            return Err(MathError::InvalidInput(format!(
                "empty Hessenberg function; {ACCEPTED}"
            )));
        }
        if n > HESSENBERG_MAX_N {
            return Err(MathError::OutOfRange(format!(
                "n = {n}; Hessenberg functions of size up to {HESSENBERG_MAX_N} are supported"
            )));
        }
        for (k, &v) in values.iter().enumerate() {
            let i = k + 1;
            if v < i || v > n {
                return Err(MathError::InvalidInput(format!(
                    "h({i}) = {v} is not in {i}..{n}; {ACCEPTED}"
                )));
            }
            if k > 0 && v < values[k - 1] {
                return Err(MathError::InvalidInput(format!(
                    "h({i}) = {v} is smaller than h({}) = {}; {ACCEPTED}",
                    i - 1,
                    values[k - 1]
                )));
            }
        }
        Ok(HessenbergFn {
            values: values.to_vec(),
        })
    }

    /// Parses `2,3,4,4` (commas or spaces); if `n` is given the length must be n.
    pub fn parse(text: &str, n: Option<usize>) -> MathResult<HessenbergFn> {
        let mut values = Vec::new();
        for tok in text.split([',', ' ', '\t']).filter(|t| !t.is_empty()) {
            let v: usize = tok.trim().parse().map_err(|_| {
                MathError::InvalidInput(format!(
                    "'{tok}' in the Hessenberg function '{text}' is not a positive integer; {ACCEPTED}"
                ))
            })?;
            values.push(v);
        }
        if let Some(n) = n
            && values.len() != n
        {
            return Err(MathError::InvalidInput(format!(
                "the Hessenberg function '{text}' has {} entries but n = {n}; {ACCEPTED}",
                values.len()
            )));
        }
        HessenbergFn::new(&values)
    }

    /// The default h(i) = i + 1 for i < n, h(n) = n, whose DS_h is Postnikov's DS_n.
    pub fn default_for(n: usize) -> MathResult<HessenbergFn> {
        HessenbergFn::new(&default_values(n))
    }

    /// Every Hessenberg function of size n, in lexicographic order (Catalan(n) of them).
    pub fn all(n: usize) -> Vec<HessenbergFn> {
        fn extend(prefix: &mut Vec<usize>, n: usize, out: &mut Vec<HessenbergFn>) {
            let i = prefix.len() + 1;
            if i > n {
                out.push(HessenbergFn {
                    values: prefix.clone(),
                });
                return;
            }
            let low = prefix.last().copied().unwrap_or(1).max(i);
            for v in low..=n {
                prefix.push(v);
                extend(prefix, n, out);
                prefix.pop();
            }
        }
        let mut out = Vec::new();
        if (1..=MAX_N).contains(&n) {
            extend(&mut Vec::new(), n, &mut out);
        }
        out
    }

    /// `OutOfRange` when n is beyond the polynomials' [`MAX_N`] variables
    /// (n = 17 is accepted for the tables read off the class only).
    pub fn require_polynomials(&self) -> MathResult<()> {
        let n = self.n();
        if n > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "n = {n}; computations with polynomials in x_1, ..., x_n accept n <= {MAX_N} \
                 (n = {HESSENBERG_MAX_N} is for the Hessenberg table alone)"
            )));
        }
        Ok(())
    }

    /// The size n.
    pub fn n(&self) -> usize {
        self.values.len()
    }

    /// h(1), ..., h(n).
    pub fn values(&self) -> &[usize] {
        &self.values
    }

    /// h(i) for 1 <= i <= n.
    pub fn at(&self, i: usize) -> usize {
        self.values[i - 1]
    }

    /// Whether this is h(i) = i + 1 (i < n), the denominator of DS_n.
    pub fn is_default(&self) -> bool {
        self.values
            .iter()
            .enumerate()
            .all(|(k, &v)| v == (k + 2).min(self.n()))
    }

    /// Σ_i (h(i) - i): the number of factors of D_h and the degree at which DS_h is a number.
    pub fn dimension(&self) -> usize {
        self.values
            .iter()
            .enumerate()
            .map(|(k, &v)| v - (k + 1))
            .sum()
    }

    /// The pairs (i, j), 1-based, i < j <= h(i): the factors x_i - x_j of D_h.
    pub fn denominator_pairs(&self) -> Vec<(usize, usize)> {
        let n = self.n();
        let mut out = Vec::new();
        for i in 1..=n {
            for j in i + 1..=self.at(i) {
                out.push((i, j));
            }
        }
        out
    }

    /// The pairs (i, j), 1-based, i < j with j > h(i): the factors x_i - x_j of Q_h.
    pub fn complement_pairs(&self) -> Vec<(usize, usize)> {
        let n = self.n();
        let mut out = Vec::new();
        for i in 1..=n {
            for j in self.at(i) + 1..=n {
                out.push((i, j));
            }
        }
        out
    }

    /// D_h = Π_{i < j <= h(i)} (x_i - x_j), evaluated at a rational point.
    pub fn denominator_at(&self, point: &[BigRational]) -> BigRational {
        let mut d = BigRational::one();
        for (i, j) in self.denominator_pairs() {
            d *= &point[i - 1] - &point[j - 1];
        }
        d
    }

    /// Q_h = Π_{i < j, j > h(i)} (x_i - x_j) as a polynomial (the class of the
    /// regular Hessenberg variety in Anderson–Tymoczko's description).
    pub fn complement_product(&self) -> MathResult<IntPoly> {
        self.complement_product_with(&Progress::default())
    }

    /// [`HessenbergFn::complement_product`], stopping with `Canceled` within a
    /// few thousand term products of a cancel of `progress`.
    pub fn complement_product_with(&self, progress: &Progress) -> MathResult<IntPoly> {
        self.require_polynomials()?;
        let n = self.n();
        let k = self.complement_pairs().len();
        // a product of k linear forms has at most min(2^k, C(k+n-1, n-1)) terms
        let bound = if k < 64 { 1u128 << k } else { u128::MAX }.min(binomial(k + n - 1, n - 1));
        if bound > COMPLEMENT_TERM_BOUND {
            return Err(MathError::OutOfRange(format!(
                "Q_h for h = {self} is a product of {k} factors in {n} variables, too large to expand \
                 (accepted while min(2^k, C(k+n-1, n-1)) <= {COMPLEMENT_TERM_BOUND}); h(i) = i+1 in degree n-1 needs no expansion"
            )));
        }
        let mut q = IntPoly::one(n);
        for (i, j) in self.complement_pairs() {
            let factor = IntPoly::var_index(n, i - 1).sub(&IntPoly::var_index(n, j - 1));
            q = q.mul_with(&factor, progress)?;
        }
        Ok(q)
    }

    /// D_h as a polynomial with rational coefficients (used by reference methods).
    pub fn denominator(&self) -> MathResult<RatPoly> {
        let n = self.n();
        let mut d = RatPoly::one(n);
        for (i, j) in self.denominator_pairs() {
            let factor = RatPoly::var_index(n, i - 1).sub(&RatPoly::var_index(n, j - 1));
            d = d.mul(&factor)?;
        }
        Ok(d)
    }
}

/// The values of the default Hessenberg function, h(i) = i + 1 for i < n and
/// h(n) = n (empty for n = 0).
///
/// ```
/// use elbowroom_math::hessenberg::function::default_values;
/// assert_eq!(default_values(4), vec![2, 3, 4, 4]);
/// ```
pub fn default_values(n: usize) -> Vec<usize> {
    (1..=n).map(|i| (i + 1).min(n)).collect()
}

/// Sets h(i) = j and adjusts the other values so that h stays a Hessenberg
/// function: weakly increasing, h(k) >= k, h(n) = n (all 1-based). Asking for
/// a value no Hessenberg function has there (j < i, or i, j outside 1..n)
/// changes nothing. This is the editing rule of the explorer's h grid.
///
/// ```
/// use elbowroom_math::hessenberg::function::set_value;
/// let mut h = vec![2, 3, 4, 4];
/// set_value(&mut h, 3, 3); // h(3) = 3 pulls nothing before it above 3
/// assert_eq!(h, vec![2, 3, 3, 4]);
/// set_value(&mut h, 1, 4); // h(1) = 4 pushes every later value up to 4
/// assert_eq!(h, vec![4, 4, 4, 4]);
/// ```
pub fn set_value(h: &mut [usize], i: usize, j: usize) {
    let n = h.len();
    if i == 0 || i > n || j < i || j > n {
        return;
    }
    h[i - 1] = j;
    for k in i + 1..=n {
        h[k - 1] = h[k - 1].max(j);
    }
    for k in 1..i {
        h[k - 1] = h[k - 1].min(j).max(k);
    }
    h[n - 1] = n;
}

/// The largest size bound of Q_h that [`HessenbergFn::complement_product`] expands.
pub const COMPLEMENT_TERM_BOUND: u128 = 50_000_000;

fn binomial(a: usize, b: usize) -> u128 {
    let mut r: u128 = 1;
    for i in 0..b as u128 {
        r = r.saturating_mul(a as u128 - i) / (i + 1);
    }
    r
}

impl fmt::Display for HessenbergFn {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let parts: Vec<String> = self.values.iter().map(|v| v.to_string()).collect();
        write!(f, "({})", parts.join(","))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn validation_explains_what_is_accepted() {
        assert!(HessenbergFn::new(&[2, 3, 3]).is_ok());
        let e = HessenbergFn::new(&[2, 1, 3]).unwrap_err().to_string();
        assert!(e.contains("weakly increasing"), "{e}");
        assert!(HessenbergFn::new(&[3, 3, 2]).is_err());
        assert!(HessenbergFn::new(&[1, 2, 4]).is_err());
        assert!(HessenbergFn::new(&[]).is_err());
        assert!(HessenbergFn::parse("2,3", Some(3)).is_err());
        assert!(HessenbergFn::parse("2,x,3", None).is_err());
        assert_eq!(
            HessenbergFn::default_for(4).unwrap().values(),
            &[2, 3, 4, 4]
        );
        assert_eq!(HessenbergFn::default_for(4).unwrap().dimension(), 3);
    }

    #[test]
    fn there_are_catalan_many_hessenberg_functions() {
        // Catalan numbers, OEIS A000108
        let catalan = [1usize, 1, 2, 5, 14, 42, 132, 429];
        for (n, &count) in catalan.iter().enumerate().skip(1) {
            assert_eq!(HessenbergFn::all(n).len(), count, "n = {n}");
        }
    }

    #[test]
    fn editing_keeps_h_a_hessenberg_function() {
        let mut h = default_values(5);
        set_value(&mut h, 2, 5);
        assert_eq!(h, vec![2, 5, 5, 5, 5]);
        set_value(&mut h, 1, 1);
        assert_eq!(h, vec![1, 5, 5, 5, 5]);
        set_value(&mut h, 4, 4);
        assert_eq!(h, vec![1, 4, 4, 4, 5]);
        // every click of every box of every function leaves a valid function
        for start in HessenbergFn::all(4) {
            for i in 1..=4 {
                for j in i..=4 {
                    let mut v = start.values().to_vec();
                    set_value(&mut v, i, j);
                    assert!(HessenbergFn::new(&v).is_ok(), "{v:?}");
                    assert_eq!(v[i - 1], if i == 4 { 4 } else { j });
                }
            }
        }
    }
}
