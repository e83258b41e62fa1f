//! Expanding a syntax tree into a polynomial, left to right, every product and
//! power sized before it is taken: the work of reading one text is bounded by
//! [`TYPED_PRODUCT_LIMIT`] coefficient products in all, its sums and products
//! by [`TYPED_TERM_LIMIT`] terms, its powers by [`TYPED_DIGIT_LIMIT`] digits,
//! and parentheses and signs nest at most [`MAX_NESTING`] deep.

use super::MAX_NESTING;
use super::lex::syntax;
use super::tree::{Node, Op, Term};
use crate::error::MathError;
use crate::limits::{
    TYPED_DIGIT_LIMIT, TYPED_PRODUCT_LIMIT, TYPED_TERM_LIMIT, monomials_up_to_degree,
};
use crate::poly::polynomial::{PolyBuilder, RatPoly};
use crate::progress::Progress;
use num_rational::BigRational;
use num_traits::{One, Zero};

/// Why an expansion stopped.
pub(super) enum Stop {
    /// A limit, a division by a non-number, a cancel: the error to report.
    Failed(MathError),
    /// The partial tree ended where the reading found a mistake.
    Broken,
}

impl From<MathError> for Stop {
    fn from(e: MathError) -> Self {
        Stop::Failed(e)
    }
}

/// The expansion of the trees of one text; the work spent is counted across
/// every tree it expands.
pub(super) struct Expander<'a> {
    text: &'a str,
    /// The number of variables of the result.
    nvars: usize,
    /// The number of variables of the computation, if given.
    declared: Option<usize>,
    /// How many parentheses and signs enclose the node being expanded.
    depth: usize,
    /// Coefficient products spent so far.
    spent: u128,
    /// Polled in products and powers, and told the coefficient products done
    /// against those sized so far (the reading is a phase of its own: the
    /// first product sized starts it with [`Progress::restart`]).
    progress: &'a Progress,
    /// Whether the reading has started its phase on `progress`.
    reporting: bool,
}

impl<'a> Expander<'a> {
    pub(super) fn new(
        text: &'a str,
        nvars: usize,
        declared: Option<usize>,
        progress: &'a Progress,
    ) -> Self {
        Expander {
            text,
            nvars,
            declared,
            depth: 0,
            spent: 0,
            progress,
            reporting: false,
        }
    }

    /// Tells `progress` that the reading will take at least `work` coefficient
    /// products in all (starting the reading's phase the first time).
    fn expect(&mut self, work: u128) {
        let work = u64::try_from(work).unwrap_or(u64::MAX);
        if !self.reporting {
            self.reporting = true;
            self.progress.restart(work);
        } else {
            self.progress.raise_total(work);
        }
    }

    /// The polynomial of `node`.
    pub(super) fn expand(&mut self, node: &Node) -> Result<RatPoly, Stop> {
        match node {
            Node::Num(v) => Ok(RatPoly::constant(self.nvars, v.clone())),
            Node::Var(i) => Ok(RatPoly::var_index(self.nvars, i - 1)),
            Node::Atom { name, args, at } => {
                let p = crate::poly::quasisym::named_atom(name, args, self.declared)
                    .map_err(|e| self.fail(*at, e))?;
                Ok(p.with_nvars(self.nvars).unwrap_or(p))
            }
            Node::Sum(terms) => self.sum(terms),
            Node::Product(first, rest) => self.product_of(first, rest),
            Node::Signed(signs, inner) => {
                let entered = self.depth;
                for sign in signs {
                    if self.depth >= MAX_NESTING {
                        self.depth = entered;
                        return Err(self.too_deep(sign.after).into());
                    }
                    self.depth += 1;
                }
                let value = self.expand(inner);
                self.depth = entered;
                let minus = signs.iter().filter(|s| s.minus).count() % 2 == 1;
                Ok(if minus { value?.neg() } else { value? })
            }
            Node::Power { base, exponent, at } => {
                let base = self.expand(base)?;
                Ok(self.power(&base, *exponent, *at)?)
            }
            Node::Group { inner, at } => {
                if self.depth >= MAX_NESTING {
                    return Err(self.too_deep(*at).into());
                }
                self.depth += 1;
                let value = self.expand(inner);
                self.depth -= 1;
                value
            }
            Node::Then(first, second) => {
                self.expand(first)?;
                self.expand(second)
            }
            Node::Broken => Err(Stop::Broken),
        }
    }

    fn too_deep(&self, at: usize) -> MathError {
        syntax(
            self.text,
            at,
            &format!(
                "the input nests parentheses and signs more than {MAX_NESTING} deep; \
                 write it with fewer"
            ),
        )
    }

    fn fail(&self, at: usize, e: MathError) -> MathError {
        match e {
            MathError::Syntax { .. } | MathError::Canceled => e,
            other => syntax(self.text, at, &other.to_string()),
        }
    }

    /// The terms gathered in a builder, so a long sum costs its length, not its square.
    fn sum(&mut self, terms: &[Term]) -> Result<RatPoly, Stop> {
        let mut acc = PolyBuilder::new(self.nvars);
        let minus_one = -BigRational::one();
        for term in terms {
            let t = self.expand(&term.node)?;
            if term.negate {
                acc.add_scaled(&t, &minus_one);
            } else {
                acc.add_poly(&t);
            }
            if acc.len() as u128 > TYPED_TERM_LIMIT {
                return Err(syntax(
                    self.text,
                    term.after,
                    &format!(
                        "the sum has more than {TYPED_TERM_LIMIT} terms, the most a typed polynomial may have"
                    ),
                )
                .into());
            }
        }
        Ok(acc.build())
    }

    fn product_of(&mut self, first: &Node, rest: &[(Op, Node)]) -> Result<RatPoly, Stop> {
        let mut acc = self.expand(first)?;
        for (op, node) in rest {
            let f = self.expand(node)?;
            match op {
                Op::Times { at } => acc = self.product(&acc, &f, *at)?,
                Op::Divide { at } => {
                    let c = constant_value(&f).filter(|c| !c.is_zero()).ok_or_else(|| {
                        syntax(
                            self.text,
                            *at,
                            "division is only by a nonzero number, as in x1/2 or 3/2 x1",
                        )
                    })?;
                    acc = acc.scale(&(BigRational::one() / c));
                }
            }
        }
        Ok(acc)
    }

    /// a·b, refused before it starts when it would take more than
    /// [`TYPED_PRODUCT_LIMIT`] coefficient products or could have more than
    /// [`TYPED_TERM_LIMIT`] terms.
    fn product(&mut self, a: &RatPoly, b: &RatPoly, at: usize) -> Result<RatPoly, MathError> {
        let products = a.len() as u128 * b.len() as u128;
        let spent = self.spent.saturating_add(products);
        if spent > TYPED_PRODUCT_LIMIT {
            return Err(syntax(
                self.text,
                at,
                &format!(
                    "multiplying polynomials of {} and {} terms brings the work of reading \
                     this text to {spent} coefficient products; a typed polynomial may take \
                     at most {TYPED_PRODUCT_LIMIT} in all",
                    a.len(),
                    b.len()
                ),
            ));
        }
        self.spent = spent;
        let degree = u64::from(a.degree()) + u64::from(b.degree());
        let bound = products.min(monomials_up_to_degree(degree, self.nvars as u64));
        if bound > TYPED_TERM_LIMIT {
            return Err(syntax(
                self.text,
                at,
                &format!(
                    "the product may have up to {bound} terms; a typed polynomial may have at most {TYPED_TERM_LIMIT}"
                ),
            ));
        }
        self.expect(spent);
        a.mul_reporting(b, self.progress)
            .map_err(|e| self.fail(at, e))
    }

    /// base^k by repeated squaring, each multiplication sized by [`Self::product`];
    /// refused at once when base^k could have more than [`TYPED_TERM_LIMIT`] terms,
    /// estimated as min(C(k + t − 1, t − 1), C(k·d + n, n)) for t terms of degree d.
    fn power(&mut self, base: &RatPoly, k: u32, at: usize) -> Result<RatPoly, MathError> {
        let t = base.len() as u64;
        let d = u64::from(base.degree());
        let nvars = self.nvars as u64;
        // terms of base^j are at most min(C(j + t − 1, t − 1), C(j·d + n, n))
        let terms_of = |j: u64| {
            crate::limits::binomial(j + t - 1, t - 1)
                .min(monomials_up_to_degree(d.saturating_mul(j), nvars))
        };
        if t > 1 && k > 1 {
            let bound = terms_of(u64::from(k));
            // the products of the squaring chain, estimated before any is taken
            let (mut work, mut have, mut j, mut rest) = (0u128, 0u64, 1u64, k);
            while rest > 0 {
                if rest & 1 == 1 {
                    work = work.saturating_add(terms_of(have).saturating_mul(terms_of(j)));
                    have += j;
                }
                rest >>= 1;
                if rest > 0 {
                    work = work.saturating_add(terms_of(j).saturating_mul(terms_of(j)));
                    j *= 2;
                }
            }
            let work = work.saturating_add(self.spent);
            if work > TYPED_PRODUCT_LIMIT {
                return Err(syntax(
                    self.text,
                    at,
                    &format!(
                        "the power brings the work of reading this text to about {work} coefficient \
                         products; a typed polynomial may take at most {TYPED_PRODUCT_LIMIT} in all"
                    ),
                ));
            }
            if bound > TYPED_TERM_LIMIT {
                return Err(syntax(
                    self.text,
                    at,
                    &format!(
                        "the power may have up to {bound} terms; a typed polynomial may have at most {TYPED_TERM_LIMIT}"
                    ),
                ));
            }
            // the whole squaring chain is the bar's total from its start
            self.expect(work);
        }
        let digits = u64::from(k).saturating_mul(largest_digits(base));
        if digits > TYPED_DIGIT_LIMIT {
            return Err(syntax(
                self.text,
                at,
                &format!(
                    "the power has coefficients of about {digits} digits; a typed polynomial may have at most {TYPED_DIGIT_LIMIT}"
                ),
            ));
        }
        let mut result = RatPoly::one(self.nvars);
        let mut square = base.clone();
        let mut k = k;
        while k > 0 {
            if k & 1 == 1 {
                result = self.product(&result, &square, at)?;
            }
            k >>= 1;
            if k > 0 {
                square = self.product(&square, &square, at)?;
            }
        }
        Ok(result)
    }
}

/// The decimal digits of the largest numerator or denominator of p (an estimate from its bits).
fn largest_digits(p: &RatPoly) -> u64 {
    p.terms()
        .iter()
        .map(|(_, c)| c.numer().bits().max(c.denom().bits()))
        .max()
        .unwrap_or(0)
        * 3
        / 10
        + 1
}

/// The value of a constant polynomial (0 for the zero polynomial).
pub(super) fn constant_value(p: &RatPoly) -> Option<BigRational> {
    match p.terms() {
        [] => Some(BigRational::zero()),
        [(m, c)] if m.degree() == 0 => Some(c.clone()),
        _ => None,
    }
}

#[cfg(test)]
mod tests {
    use crate::poly::parse::parse_poly_with;
    use crate::progress::Progress;

    /// (x1 + x2 + x3)^4 by repeated squaring: base² (3·3 = 9 coefficient
    /// products), (base²)² (6·6 = 36), then 1·base⁴ (1·15 = 15): 60 in all,
    /// the number sized before the first product (C(j + 2, 2) terms of base^j,
    /// stars and bars); the bar ends full.
    #[test]
    fn a_power_reports_the_products_it_sized() {
        let progress = Progress::new(7);
        progress.advance(5);
        let f = parse_poly_with("(x1+x2+x3)^4", Some(3), &progress);
        assert_eq!(f.map(|f| f.len()).ok(), Some(15));
        assert_eq!((progress.done(), progress.total()), (60, 60));
        // a text with nothing to multiply leaves the count alone
        let quiet = Progress::new(7);
        assert!(parse_poly_with("x1 + x2 - x3", Some(3), &quiet).is_ok());
        assert_eq!((quiet.done(), quiet.total()), (0, 7));
    }
}
