//! Recognising a syntax tree as a product of powers of linear forms and
//! numbers, such as `(x1-x3)(x2-x4)^2` or `-2 x1 (x1 + x2/2)^3 / 3`, without
//! multiplying it out: the factors are kept as they are, and only a
//! parenthesized sum is expanded (to see that it is linear or a number).

use super::expand::{Expander, constant_value};
use super::tree::{Node, Op, Term};
use crate::limits::TYPED_DIGIT_LIMIT;
use crate::poly::polynomial::RatPoly;
use num_rational::BigRational;
use num_traits::{One, Zero};

/// A scalar and a list of (factor of degree one, exponent).
pub(super) type Factored = (BigRational, Vec<(RatPoly, u32)>);

/// How deep parentheses may nest in a recognised product; deeper, the text
/// is read as any other polynomial.
const FACTOR_NESTING: usize = 64;

/// The recognition of one text, with the expansion its parenthesized sums use.
pub(super) struct Recognizer<'a, 'e> {
    /// Expands parenthesized sums, counting their work across the text.
    pub(super) expander: &'e mut Expander<'a>,
    /// The number of variables of the factors.
    pub(super) nvars: usize,
    /// The number of variables of the computation, if given.
    pub(super) declared: Option<usize>,
}

impl Recognizer<'_, '_> {
    /// A sum of one term that is a product of powers of linear forms; `None`
    /// for another shape (the first term is looked at even when more follow).
    pub(super) fn sum(&mut self, terms: &[Term], depth: usize) -> Option<Factored> {
        let first = terms.first()?;
        let (scalar, factors) = self.product(&first.node, depth)?;
        if terms.len() > 1 {
            return None;
        }
        Some((if first.negate { -scalar } else { scalar }, factors))
    }

    /// factor (('*' | '/' number | implicit) factor)*
    fn product(&mut self, node: &Node, depth: usize) -> Option<Factored> {
        let Node::Product(first, rest) = node else {
            return None;
        };
        let (mut scalar, mut factors) = self.power(first, depth)?;
        for (op, node) in rest {
            let (s, f) = self.power(node, depth)?;
            match op {
                Op::Times { .. } => {
                    scalar *= s;
                    factors.extend(f);
                }
                Op::Divide { .. } => {
                    if !f.is_empty() || s.is_zero() {
                        return None;
                    }
                    scalar /= s;
                }
            }
        }
        Some((scalar, factors))
    }

    /// ('+'|'-')* primary ['^' exponent]
    fn power(&mut self, node: &Node, depth: usize) -> Option<Factored> {
        let Node::Signed(signs, inner) = node else {
            return self.unsigned_power(node, depth);
        };
        let (s, f) = self.unsigned_power(inner, depth)?;
        let minus = signs.iter().filter(|s| s.minus).count() % 2 == 1;
        Some((if minus { -s } else { s }, f))
    }

    /// primary ['^' exponent]: the factors' exponents multiplied, the scalar
    /// raised unless its digits would pass [`TYPED_DIGIT_LIMIT`].
    fn unsigned_power(&mut self, node: &Node, depth: usize) -> Option<Factored> {
        let Node::Power { base, exponent, .. } = node else {
            return self.primary(node, depth);
        };
        let k = *exponent;
        let (s, f) = self.primary(base, depth)?;
        let mut powered = Vec::with_capacity(f.len());
        for (p, e) in f {
            powered.push((p, e.checked_mul(k)?));
        }
        let bits = s.numer().bits().max(s.denom().bits());
        if bits.saturating_mul(u64::from(k)) * 3 / 10 > TYPED_DIGIT_LIMIT {
            // too large here: the expansion refuses it with its column
            return None;
        }
        Some((num_traits::pow(s, k as usize), powered))
    }

    /// number | variable | '(' product ')' | '(' linear expression ')'
    fn primary(&mut self, node: &Node, depth: usize) -> Option<Factored> {
        match node {
            Node::Num(v) => Some((v.clone(), Vec::new())),
            Node::Var(i) => {
                if self.declared.is_some_and(|n| *i > n) {
                    return None;
                }
                Some((
                    BigRational::one(),
                    vec![(RatPoly::var_index(self.nvars, i - 1), 1)],
                ))
            }
            Node::Group { inner, .. } if depth < FACTOR_NESTING => {
                if let Node::Sum(terms) = inner.as_ref()
                    && let Some(product) = self.sum(terms, depth + 1)
                {
                    return Some(product);
                }
                let inner = self.expander.expand(inner).ok()?;
                match inner.degree() {
                    0 => Some((constant_value(&inner)?, Vec::new())),
                    1 => Some((BigRational::one(), vec![(inner, 1)])),
                    _ => None,
                }
            }
            _ => None,
        }
    }
}
