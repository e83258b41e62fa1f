//! Sparse exact polynomials in x_1..x_n over the integers or the rationals.
//!
//! Terms are kept sorted by monomial in decreasing lex order (x_1 > x_2 > ...),
//! with no zero coefficients, so equality of polynomials is equality of term lists.

use crate::error::{MathError, MathResult};
use crate::poly::mono::{MAX_VARS, Mono};
use crate::progress::Progress;
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Signed, Zero};
use std::collections::HashMap;
use std::fmt;
use std::ops::{AddAssign, Mul, Neg, SubAssign};

/// A coefficient ring: the integers ([`BigInt`]) or the rationals ([`BigRational`]).
pub trait Coeff:
    Clone
    + PartialEq
    + fmt::Display
    + fmt::Debug
    + Send
    + Sync
    + 'static
    + Zero
    + One
    + Neg<Output = Self>
    + for<'a> AddAssign<&'a Self>
    + for<'a> SubAssign<&'a Self>
    + for<'a> Mul<&'a Self, Output = Self>
{
    /// The image of a machine integer.
    fn from_i64(v: i64) -> Self;
    /// The value as an exact rational.
    fn to_rational(&self) -> BigRational;
    /// Whether the value is below zero.
    fn is_negative_value(&self) -> bool;
}

impl Coeff for BigInt {
    fn from_i64(v: i64) -> Self {
        BigInt::from(v)
    }
    fn to_rational(&self) -> BigRational {
        BigRational::from_integer(self.clone())
    }
    fn is_negative_value(&self) -> bool {
        self.is_negative()
    }
}

impl Coeff for BigRational {
    fn from_i64(v: i64) -> Self {
        BigRational::from_integer(BigInt::from(v))
    }
    fn to_rational(&self) -> BigRational {
        self.clone()
    }
    fn is_negative_value(&self) -> bool {
        self.is_negative()
    }
}

/// A sparse polynomial with coefficients in `C`, in `nvars` variables.
#[derive(Clone, PartialEq, Eq, Hash, Debug)]
pub struct Poly<C> {
    nvars: usize,
    terms: Vec<(Mono, C)>,
}

/// A polynomial with big-integer coefficients.
pub type IntPoly = Poly<BigInt>;
/// A polynomial with big-rational coefficients.
pub type RatPoly = Poly<BigRational>;

/// The largest number of terms an intermediate product may reach before it is refused.
pub const TERM_LIMIT: usize = 20_000_000;

/// Accumulates terms in a hash map, then sorts them once into a [`Poly`].
pub struct PolyBuilder<C> {
    nvars: usize,
    map: HashMap<Mono, C, rustc_hash::FxBuildHasher>,
}

impl<C: Coeff> PolyBuilder<C> {
    /// An empty accumulator for polynomials in `nvars` variables.
    pub fn new(nvars: usize) -> Self {
        PolyBuilder {
            nvars,
            map: HashMap::default(),
        }
    }

    /// Adds c·m.
    pub fn add_term(&mut self, m: Mono, c: &C) {
        match self.map.get_mut(&m) {
            Some(v) => *v += c,
            None => {
                self.map.insert(m, c.clone());
            }
        }
    }

    /// Adds s·p.
    pub fn add_scaled(&mut self, p: &Poly<C>, s: &C) {
        for (m, c) in &p.terms {
            let t = c.clone() * s;
            self.add_term(*m, &t);
        }
    }

    /// Adds p.
    pub fn add_poly(&mut self, p: &Poly<C>) {
        for (m, c) in &p.terms {
            self.add_term(*m, c);
        }
    }

    /// Number of distinct monomials seen so far.
    pub fn len(&self) -> usize {
        self.map.len()
    }

    /// Whether nothing has been added.
    pub fn is_empty(&self) -> bool {
        self.map.is_empty()
    }

    /// The accumulated polynomial.
    pub fn build(self) -> Poly<C> {
        let mut terms: Vec<(Mono, C)> =
            self.map.into_iter().filter(|(_, c)| !c.is_zero()).collect();
        terms.sort_unstable_by_key(|t| std::cmp::Reverse(t.0));
        Poly {
            nvars: self.nvars,
            terms,
        }
    }
}

impl<C: Coeff> Poly<C> {
    /// The zero polynomial.
    pub fn zero(nvars: usize) -> Self {
        Poly {
            nvars,
            terms: Vec::new(),
        }
    }

    /// The constant c.
    pub fn constant(nvars: usize, c: C) -> Self {
        Self::monomial(nvars, Mono::ONE, c)
    }

    /// The constant 1.
    pub fn one(nvars: usize) -> Self {
        Self::constant(nvars, C::one())
    }

    /// The variable x_{i+1}, by its 0-based index i < nvars (so `var_index(n, 0)` is x_1).
    pub fn var_index(nvars: usize, i: usize) -> Self {
        Self::monomial(nvars, Mono::var_index(i), C::one())
    }

    /// c·m.
    pub fn monomial(nvars: usize, m: Mono, c: C) -> Self {
        if c.is_zero() {
            return Self::zero(nvars);
        }
        Poly {
            nvars,
            terms: vec![(m, c)],
        }
    }

    /// Builds a polynomial from arbitrary terms (repeats are added, zeros dropped).
    pub fn from_terms(nvars: usize, terms: impl IntoIterator<Item = (Mono, C)>) -> Self {
        let mut b = PolyBuilder::new(nvars);
        for (m, c) in terms {
            b.add_term(m, &c);
        }
        b.build()
    }

    /// Builds from exponent vectors; fails if a vector is longer than `nvars` or an exponent exceeds 255.
    pub fn from_exp_terms(nvars: usize, terms: &[(Vec<u32>, C)]) -> MathResult<Self> {
        let mut b = PolyBuilder::new(nvars);
        for (e, c) in terms {
            if e.len() > nvars {
                return Err(MathError::OutOfRange(format!(
                    "exponent vector {e:?} has more than {nvars} entries"
                )));
            }
            let m = Mono::from_exps(e).ok_or_else(|| {
                MathError::OutOfRange(format!("exponent vector {e:?}: exponents are at most 255"))
            })?;
            b.add_term(m, c);
        }
        Ok(b.build())
    }

    /// The number of variables.
    pub fn nvars(&self) -> usize {
        self.nvars
    }

    /// The terms, leading (lex-largest) monomial first.
    pub fn terms(&self) -> &[(Mono, C)] {
        &self.terms
    }

    /// Consumes the polynomial, giving its terms.
    pub fn into_terms(self) -> Vec<(Mono, C)> {
        self.terms
    }

    /// The number of terms.
    pub fn len(&self) -> usize {
        self.terms.len()
    }

    /// Whether this is the zero polynomial.
    pub fn is_zero(&self) -> bool {
        self.terms.is_empty()
    }

    /// Whether there are no terms (the zero polynomial).
    pub fn is_empty(&self) -> bool {
        self.terms.is_empty()
    }

    /// The coefficient of m.
    pub fn coeff(&self, m: Mono) -> C {
        match self.terms.binary_search_by(|t| m.cmp(&t.0)) {
            Ok(i) => self.terms[i].1.clone(),
            Err(_) => C::zero(),
        }
    }

    /// The largest total degree of a term (0 for the zero polynomial).
    pub fn degree(&self) -> u32 {
        self.terms
            .iter()
            .map(|(m, _)| m.degree())
            .max()
            .unwrap_or(0)
    }

    /// The smallest total degree of a term (0 for the zero polynomial).
    pub fn min_degree(&self) -> u32 {
        self.terms
            .iter()
            .map(|(m, _)| m.degree())
            .min()
            .unwrap_or(0)
    }

    /// Whether all terms have the same total degree.
    pub fn is_homogeneous(&self) -> bool {
        self.degree() == self.min_degree()
    }

    /// The part of total degree d.
    pub fn homogeneous_part(&self, d: u32) -> Self {
        Poly {
            nvars: self.nvars,
            terms: self
                .terms
                .iter()
                .filter(|(m, _)| m.degree() == d)
                .cloned()
                .collect(),
        }
    }

    /// The same polynomial seen in `nvars` variables; fails if a dropped variable occurs.
    pub fn with_nvars(&self, nvars: usize) -> MathResult<Self> {
        if nvars > MAX_VARS {
            return Err(MathError::OutOfRange(format!(
                "{nvars} variables; at most {MAX_VARS} are supported"
            )));
        }
        if nvars < self.nvars {
            for (m, _) in &self.terms {
                if (nvars..self.nvars).any(|i| m.exp(i) > 0) {
                    return Err(MathError::OutOfRange(format!(
                        "the polynomial uses x{} but only x1..x{nvars} are available",
                        (nvars..self.nvars)
                            .find(|&i| m.exp(i) > 0)
                            .map_or(0, |i| i + 1)
                    )));
                }
            }
        }
        Ok(Poly {
            nvars,
            terms: self.terms.clone(),
        })
    }

    /// The largest index (1-based) of a variable that occurs, 0 for a constant.
    pub fn used_vars(&self) -> usize {
        self.terms
            .iter()
            .map(|(m, _)| {
                (0..MAX_VARS)
                    .rev()
                    .find(|&i| m.exp(i) > 0)
                    .map_or(0, |i| i + 1)
            })
            .max()
            .unwrap_or(0)
    }

    /// -p.
    pub fn neg(&self) -> Self {
        Poly {
            nvars: self.nvars,
            terms: self.terms.iter().map(|(m, c)| (*m, -c.clone())).collect(),
        }
    }

    /// s·p.
    pub fn scale(&self, s: &C) -> Self {
        if s.is_zero() {
            return Self::zero(self.nvars);
        }
        Poly {
            nvars: self.nvars,
            terms: self
                .terms
                .iter()
                .map(|(m, c)| (*m, c.clone() * s))
                .collect(),
        }
    }

    /// p + q (a merge of the two sorted term lists).
    pub fn add(&self, other: &Self) -> Self {
        self.merge(other, false)
    }

    /// p - q.
    pub fn sub(&self, other: &Self) -> Self {
        self.merge(other, true)
    }

    fn merge(&self, other: &Self, subtract: bool) -> Self {
        let mut out = Vec::with_capacity(self.terms.len() + other.terms.len());
        let (mut i, mut j) = (0, 0);
        let (a, b) = (&self.terms, &other.terms);
        while i < a.len() || j < b.len() {
            let take_a = j >= b.len() || (i < a.len() && a[i].0 > b[j].0);
            let take_b = i >= a.len() || (j < b.len() && b[j].0 > a[i].0);
            if take_a {
                out.push(a[i].clone());
                i += 1;
            } else if take_b {
                let c = if subtract {
                    -b[j].1.clone()
                } else {
                    b[j].1.clone()
                };
                out.push((b[j].0, c));
                j += 1;
            } else {
                let mut c = a[i].1.clone();
                if subtract {
                    c -= &b[j].1;
                } else {
                    c += &b[j].1;
                }
                if !c.is_zero() {
                    out.push((a[i].0, c));
                }
                i += 1;
                j += 1;
            }
        }
        Poly {
            nvars: self.nvars.max(other.nvars),
            terms: out,
        }
    }

    /// p·q; fails if an exponent would exceed 255 or the product is too large to hold.
    pub fn mul(&self, other: &Self) -> MathResult<Self> {
        self.mul_with(other, &Progress::default())
    }

    /// [`Poly::mul`], stopping with `Canceled` within a few thousand term
    /// products of a cancel of `progress`.
    pub fn mul_with(&self, other: &Self, progress: &Progress) -> MathResult<Self> {
        self.mul_counted(other, progress, false)
    }

    /// [`Poly::mul_with`], also adding to `progress` the term products done
    /// (len(self)·len(other) in all), row by row, for a progress bar.
    pub fn mul_reporting(&self, other: &Self, progress: &Progress) -> MathResult<Self> {
        self.mul_counted(other, progress, true)
    }

    fn mul_counted(&self, other: &Self, progress: &Progress, report: bool) -> MathResult<Self> {
        let nvars = self.nvars.max(other.nvars);
        if self.terms.len().saturating_mul(other.terms.len()) > TERM_LIMIT * 8 {
            return Err(too_large());
        }
        let mut b = PolyBuilder::new(nvars);
        let mut since_check = 0usize;
        for (m1, c1) in &self.terms {
            for (m2, c2) in &other.terms {
                let m = m1
                    .checked_mul(*m2)
                    .ok_or_else(|| exponent_overflow(*m1, *m2))?;
                let c = c1.clone() * c2;
                b.add_term(m, &c);
            }
            since_check += other.terms.len();
            if report {
                progress.advance(other.terms.len() as u64);
            }
            if since_check >= 4096 {
                progress.check()?;
                since_check = 0;
            }
            if b.len() > TERM_LIMIT {
                return Err(too_large());
            }
        }
        progress.check()?;
        Ok(b.build())
    }

    /// c·m·p for a monomial m.
    pub fn mul_term(&self, m: Mono, c: &C) -> MathResult<Self> {
        let mut terms = Vec::with_capacity(self.terms.len());
        for (m1, c1) in &self.terms {
            terms.push((
                m1.checked_mul(m).ok_or_else(|| exponent_overflow(*m1, m))?,
                c1.clone() * c,
            ));
        }
        if c.is_zero() {
            terms.clear();
        }
        Ok(Poly {
            nvars: self.nvars,
            terms,
        })
    }

    /// p^k by repeated squaring.
    pub fn pow(&self, k: u32) -> MathResult<Self> {
        self.pow_with(k, &Progress::default())
    }

    /// [`Poly::pow`], stopping with `Canceled` soon after a cancel of `progress`.
    pub fn pow_with(&self, k: u32, progress: &Progress) -> MathResult<Self> {
        let mut result = Self::one(self.nvars);
        let mut base = self.clone();
        let mut k = k;
        while k > 0 {
            if k & 1 == 1 {
                result = result.mul_with(&base, progress)?;
            }
            k >>= 1;
            if k > 0 {
                base = base.mul_with(&base, progress)?;
            }
        }
        Ok(result)
    }

    /// Renames variables: x_{i+1} becomes x_{map[i]+1} (0-based map over all nvars variables).
    /// With `map` a permutation this is the action σ·f(x) = f(x_{σ(1)}, ..., x_{σ(n)}).
    pub fn rename(&self, map: &[usize]) -> Self {
        let mut b = PolyBuilder::new(self.nvars);
        for (m, c) in &self.terms {
            b.add_term(m.rename(map), c);
        }
        b.build()
    }

    /// f(x_n, ..., x_1): the variables in reverse order.
    pub fn reverse_vars(&self) -> Self {
        let n = self.nvars;
        let map: Vec<usize> = (0..n).map(|i| n - 1 - i).collect();
        self.rename(&map)
    }

    /// Swaps x_{i+1} and x_{j+1} (0-based).
    pub fn swap_vars(&self, i: usize, j: usize) -> Self {
        let mut b = PolyBuilder::new(self.nvars);
        for (m, c) in &self.terms {
            b.add_term(m.swap(i, j), c);
        }
        b.build()
    }

    /// The divided difference ∂_i f = (f - s_i f)/(x_i - x_{i+1}) for 1 <= i < nvars.
    ///
    /// ```
    /// use elbowroom_math::{IntPoly, Mono};
    /// use num_bigint::BigInt;
    /// // ∂_1 x1^2 = x1 + x2
    /// let f = IntPoly::monomial(2, Mono::from_exps(&[2, 0]).unwrap(), BigInt::from(1));
    /// let g = f.divided_difference(1);
    /// assert_eq!(g.to_string(), "x1 + x2");
    /// ```
    pub fn divided_difference(&self, i: usize) -> Self {
        let (a, b) = (i - 1, i);
        let mut out = PolyBuilder::new(self.nvars);
        for (m, c) in &self.terms {
            let (p, q) = (m.exp(a), m.exp(b));
            if p == q {
                continue;
            }
            let (hi, lo, sign_neg) = if p > q { (p, q, false) } else { (q, p, true) };
            let coeff = if sign_neg { -c.clone() } else { c.clone() };
            // x_a^lo x_b^lo * Σ_{k=0}^{hi-lo-1} x_a^{hi-lo-1-k} x_b^k
            let d = hi - lo;
            for k in 0..d {
                let mm = m.with_exp(a, lo + d - 1 - k).with_exp(b, lo + k);
                out.add_term(mm, &coeff);
            }
        }
        out.build()
    }

    /// The value at a rational point (missing coordinates count as 0).
    pub fn eval(&self, point: &[BigRational]) -> BigRational {
        let mut total = BigRational::zero();
        for (m, c) in &self.terms {
            let mut t = c.to_rational();
            for (i, x) in point.iter().enumerate().take(self.nvars) {
                let e = m.exp(i);
                if e > 0 {
                    t *= num_traits::pow(x.clone(), e as usize);
                }
            }
            if (point.len()..self.nvars).any(|i| m.exp(i) > 0) {
                continue;
            }
            total += t;
        }
        total
    }

    /// The same polynomial over the rationals.
    pub fn to_rational(&self) -> RatPoly {
        Poly {
            nvars: self.nvars,
            terms: self
                .terms
                .iter()
                .map(|(m, c)| (*m, c.to_rational()))
                .collect(),
        }
    }

    /// The sum of the coefficients, i.e. the value at (1, ..., 1).
    pub fn coefficient_sum(&self) -> C {
        let mut s = C::zero();
        for (_, c) in &self.terms {
            s += c;
        }
        s
    }

    /// Whether every coefficient is at least zero.
    pub fn is_nonnegative(&self) -> bool {
        self.terms.iter().all(|(_, c)| !c.is_negative_value())
    }

    /// Whether f is invariant under every permutation of its variables.
    pub fn is_symmetric(&self) -> bool {
        (1..self.nvars).all(|i| self.swap_vars(i - 1, i) == *self)
    }

    /// Plain-text form, e.g. `x1^2 x2 - 3/2 x3 + 1`.
    pub fn to_text(&self) -> String {
        self.render(false)
    }

    /// LaTeX form, e.g. `x_{1}^{2} x_{2} - \frac{3}{2} x_{3} + 1`.
    pub fn to_latex(&self) -> String {
        self.render(true)
    }

    fn render(&self, latex: bool) -> String {
        if self.terms.is_empty() {
            return "0".into();
        }
        let mut out = String::new();
        for (k, (m, c)) in self.terms.iter().enumerate() {
            let neg = c.is_negative_value();
            let abs = if neg { -c.clone() } else { c.clone() };
            if k == 0 {
                if neg {
                    out.push('-');
                }
            } else {
                out.push_str(if neg { " - " } else { " + " });
            }
            let mono = render_mono(*m, self.nvars, latex);
            let coeff = render_coeff(&abs.to_string(), latex);
            if mono.is_empty() {
                out.push_str(&coeff);
            } else if abs.is_one() {
                out.push_str(&mono);
            } else {
                out.push_str(&coeff);
                out.push(' ');
                out.push_str(&mono);
            }
        }
        out
    }
}

fn render_coeff(s: &str, latex: bool) -> String {
    match (latex, s.split_once('/')) {
        (true, Some((p, q))) => format!("\\frac{{{p}}}{{{q}}}"),
        _ => s.to_string(),
    }
}

fn render_mono(m: Mono, nvars: usize, latex: bool) -> String {
    let mut parts = Vec::new();
    let _ = nvars;
    for i in 0..MAX_VARS {
        let e = m.exp(i);
        if e == 0 {
            continue;
        }
        let v = i + 1;
        parts.push(match (latex, e) {
            (false, 1) => format!("x{v}"),
            (false, _) => format!("x{v}^{e}"),
            (true, 1) => format!("x_{{{v}}}"),
            (true, _) => format!("x_{{{v}}}^{{{e}}}"),
        });
    }
    parts.join(" ")
}

/// The product m1·m2 has an exponent above [`crate::poly::mono::MAX_EXP`]: name the variable.
fn exponent_overflow(m1: Mono, m2: Mono) -> MathError {
    let max = crate::poly::mono::MAX_EXP;
    let over = (0..MAX_VARS).find(|&i| m1.exp(i) + m2.exp(i) > max);
    match over {
        Some(i) => MathError::OutOfRange(format!(
            "x{} would have the exponent {}; exponents go up to {max}",
            i + 1,
            m1.exp(i) + m2.exp(i)
        )),
        None => MathError::OutOfRange(format!("an exponent would exceed {max}")),
    }
}

fn too_large() -> MathError {
    MathError::OutOfRange(format!(
        "the product would have more than {TERM_LIMIT} terms; try a smaller input"
    ))
}

impl<C: Coeff> fmt::Display for Poly<C> {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.to_text())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn x(n: usize, i: usize) -> IntPoly {
        IntPoly::var_index(n, i)
    }

    #[test]
    fn arithmetic_and_printing() {
        let p = x(3, 0).add(&x(3, 1)); // x1 + x2
        let sq = p.pow(2).unwrap();
        assert_eq!(sq.to_text(), "x1^2 + 2 x1 x2 + x2^2");
        assert_eq!(sq.sub(&sq), IntPoly::zero(3));
        assert_eq!(sq.reverse_vars().to_text(), "x2^2 + 2 x2 x3 + x3^2");
        let r = sq
            .to_rational()
            .scale(&BigRational::new(BigInt::from(-3), BigInt::from(2)));
        assert_eq!(r.to_text(), "-3/2 x1^2 - 3 x1 x2 - 3/2 x2^2");
        assert_eq!(
            r.to_latex(),
            "-\\frac{3}{2} x_{1}^{2} - 3 x_{1} x_{2} - \\frac{3}{2} x_{2}^{2}"
        );
    }

    #[test]
    fn divided_difference_is_exact_division() {
        // ∂_1 (x1^3 x2) = x1^2 x2 + x1 x2^2 ... check (x1 - x2) ∂ f = f - s1 f
        let f = IntPoly::from_exp_terms(
            3,
            &[
                (vec![3, 1, 0], BigInt::from(1)),
                (vec![0, 2, 1], BigInt::from(5)),
            ],
        )
        .unwrap();
        let d = f.divided_difference(1);
        let lhs = x(3, 0).sub(&x(3, 1)).mul(&d).unwrap();
        assert_eq!(lhs, f.sub(&f.swap_vars(0, 1)));
    }
}
