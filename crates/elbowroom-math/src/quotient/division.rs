//! Division by the lex Gröbner basis of J_n, one term at a time, largest first.
//!
//! Every monomial x^e that is not standard has a *first corner*: with k the first index
//! where e_1 + ... + e_k >= k, the corner c = (e_1, ..., e_{k-1}, k - (e_1 + ... + e_{k-1}))
//! divides x^e. Division replaces t·c by −t·(tail of G_c); every term of the tail is
//! lex-smaller than c, so the terms only decrease and each monomial is the leading term
//! at most once. The work is bounded by the number of monomials of the degree (times the
//! length of a tail), whatever the input; nothing is stored beyond the terms alive.
//!
//! Coefficients are checked `i128` ([`Scalar`] for `i128`) with a `BigInt` twin: a caller
//! that sees `None` (an overflow) runs the same division again over `BigInt`.

use crate::error::MathResult;
use crate::poly::mono::Mono;
use num_bigint::BigInt;
use num_traits::Zero;
use std::collections::BTreeMap;

/// An exact coefficient ring for division: checked `i128`, or `BigInt`.
pub trait Scalar: Clone + PartialEq + std::fmt::Debug {
    /// Zero.
    fn zero() -> Self;
    /// Whether this is zero.
    fn is_zero(&self) -> bool;
    /// self − c·a, or `None` on overflow.
    fn sub_mul(&self, c: &Self, a: i128) -> Option<Self>;
    /// self + c, or `None` on overflow.
    fn add(&self, c: &Self) -> Option<Self>;
}

impl Scalar for i128 {
    fn zero() -> Self {
        0
    }
    fn is_zero(&self) -> bool {
        *self == 0
    }
    fn sub_mul(&self, c: &Self, a: i128) -> Option<Self> {
        c.checked_mul(a).and_then(|p| self.checked_sub(p))
    }
    fn add(&self, c: &Self) -> Option<Self> {
        self.checked_add(*c)
    }
}

impl Scalar for BigInt {
    fn zero() -> Self {
        Zero::zero()
    }
    fn is_zero(&self) -> bool {
        Zero::is_zero(self)
    }
    fn sub_mul(&self, c: &Self, a: i128) -> Option<Self> {
        Some(self - c * BigInt::from(a))
    }
    fn add(&self, c: &Self) -> Option<Self> {
        Some(self + c)
    }
}

/// The first corner dividing x^m (see the module doc), or `None` when m is standard.
///
/// ```
/// use elbowroom_math::{Mono, quotient::division::first_corner};
/// // x2 x3^3: partial sums 0, 1, 4 > 2 at k = 3, so the corner is x2 x3^2
/// let m = Mono::from_exps(&[0, 1, 3]).unwrap();
/// assert_eq!(first_corner(m, 3), Mono::from_exps(&[0, 1, 2]));
/// assert_eq!(first_corner(Mono::from_exps(&[0, 1, 1]).unwrap(), 3), None);
/// ```
pub fn first_corner(m: Mono, n: usize) -> Option<Mono> {
    let mut s = 0u32;
    let mut c = Mono::ONE;
    for i in 0..n {
        let e = m.exp(i);
        if s + e > i as u32 {
            return Some(c.with_exp(i, i as u32 + 1 - s));
        }
        s += e;
        if e > 0 {
            c = c.with_exp(i, e);
        }
    }
    None
}

/// What one division step does with a leading monomial.
pub enum Step<'a> {
    /// Keep the term, at this position of the output.
    Keep(u32),
    /// Drop the term (it lies in J_n by itself).
    Drop,
    /// Replace t·c by −t·tail (t = the monomial divided by its first corner c).
    Divide(Mono, &'a [(Mono, i128)]),
}

/// Divides Σ c_m·m term by term, largest first; `step` says what to do with each leading
/// monomial. Returns the kept terms as (position, coefficient), sorted by position, or
/// `None` if a coefficient overflowed `T`. `check` is called every 1024 steps.
pub fn divide<'a, T: Scalar>(
    terms: impl IntoIterator<Item = (Mono, T)>,
    step: &dyn Fn(Mono) -> MathResult<Step<'a>>,
    check: &dyn Fn() -> MathResult<()>,
) -> MathResult<Option<Vec<(u32, T)>>> {
    let mut alive: BTreeMap<Mono, T> = BTreeMap::new();
    for (m, c) in terms {
        if c.is_zero() {
            continue;
        }
        let slot = alive.entry(m).or_insert_with(T::zero);
        let Some(sum) = slot.add(&c) else {
            return Ok(None);
        };
        *slot = sum;
    }
    let mut out: Vec<(u32, T)> = Vec::new();
    let mut steps = 0u32;
    while let Some((m, c)) = alive.pop_last() {
        steps = steps.wrapping_add(1);
        if steps.is_multiple_of(1024) {
            check()?;
        }
        if c.is_zero() {
            continue;
        }
        match step(m)? {
            Step::Keep(i) => out.push((i, c)),
            Step::Drop => {}
            Step::Divide(t, tail) => {
                for &(u, a) in tail {
                    let slot = alive.entry(Mono(u.0 + t.0)).or_insert_with(T::zero);
                    let Some(next) = slot.sub_mul(&c, a) else {
                        return Ok(None);
                    };
                    *slot = next;
                }
            }
        }
    }
    out.sort_unstable_by_key(|t| t.0);
    Ok(Some(out))
}
