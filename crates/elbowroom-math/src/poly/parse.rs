//! Reading typed polynomials in the usual notation.
//!
//! Accepted: variables `x1`, `x_1`, `x_{12}`; numbers `3`, `-3/2`, `0.25`
//! (exact); `+ - * / ^`; implicit multiplication (`2x1 x2`, `3(x1 + x2)`);
//! parentheses and powers of sums (`(3x1 + 2x2 + x3)^2`); `·`, `×` and `−`
//! as typeset; named atoms `M(2,1)` and `F(2,1)` for quasisymmetric
//! polynomials in the n variables of the computation. Division is only by
//! nonzero constants. A malformed input gives [`MathError::Syntax`], which
//! quotes the input and marks the column; reading never panics.
//!
//! One reading, in three steps: the lexer ([`lex`]: tokens with their
//! columns, numbers read by `poly::rational`) -> the syntax tree ([`tree`];
//! nothing computed) -> either the expansion into a polynomial ([`expand`],
//! every product and power sized before it is taken) or the recognition of a
//! product of powers of linear forms ([`factors`], which multiplies nothing
//! out). A text that is not such a product is expanded from the tree already
//! read.

mod expand;
mod factors;
mod lex;
mod tree;

use crate::error::{MathError, MathResult};
use crate::limits::TYPED_TEXT_LIMIT;
use crate::poly::mono::MAX_VARS;
use crate::poly::polynomial::RatPoly;
use crate::progress::Progress;
use expand::{Expander, Stop};
use lex::{Tok, Token, lex};
use num_rational::BigRational;
use tree::{Node, Reading};

/// The deepest nesting of parentheses and signs the parser follows; deeper
/// input is refused with a message instead of exhausting the stack.
pub const MAX_NESTING: usize = 200;

/// Parses a polynomial. With `nvars = Some(n)` the variables are x1..xn and a
/// larger index is an error; with `None`, n is the largest index used (at least 1).
///
/// ```
/// use elbowroom_math::poly::parse::parse_poly;
/// let f = parse_poly("(3x1 + 2x_2 + x3)^2 - 3/2", Some(3)).unwrap();
/// assert_eq!(f.to_text(), "9 x1^2 + 12 x1 x2 + 6 x1 x3 + 4 x2^2 + 4 x2 x3 + x3^2 - 3/2");
/// assert!(parse_poly("2x1 + * x3", Some(3)).is_err());
/// ```
pub fn parse_poly(text: &str, nvars: Option<usize>) -> MathResult<RatPoly> {
    parse_poly_with(text, nvars, &Progress::default())
}

/// [`parse_poly`], stopping with `Canceled` soon after a cancel of `progress`
/// (the products and powers of a typed polynomial can take long).
pub fn parse_poly_with(
    text: &str,
    nvars: Option<usize>,
    progress: &Progress,
) -> MathResult<RatPoly> {
    check_length(text)?;
    let tokens = lex(text)?;
    let width = width_of(&tokens, nvars)?;
    let reading = tree::read(text, &tokens, nvars);
    expand_reading(text, width, nvars, reading, progress)
}

/// The polynomial of a reading, or the first error met left to right: a limit
/// passed before the mistake, else the mistake.
fn expand_reading(
    text: &str,
    width: usize,
    declared: Option<usize>,
    reading: Reading,
    progress: &Progress,
) -> MathResult<RatPoly> {
    let mut expander = Expander::new(text, width, declared, progress);
    match reading {
        Reading::Whole(tree) => match expander.expand(&tree) {
            Ok(value) => value.with_nvars(width),
            Err(Stop::Failed(e)) => Err(e),
            Err(Stop::Broken) => Err(MathError::InvalidInput(
                "the polynomial could not be read".into(),
            )),
        },
        Reading::Cut { tree, mistake } => match expander.expand(&tree) {
            Err(Stop::Failed(e)) => Err(e),
            Ok(_) | Err(Stop::Broken) => Err(mistake),
        },
    }
}

/// A typed product of powers of linear forms: `scalar · Π factor^exponent`.
#[derive(Clone, Debug, PartialEq)]
pub struct LinearFactors {
    /// The number in front (0 when the product is 0).
    pub scalar: BigRational,
    /// The factors, each of degree exactly one (a constant term is allowed, as in
    /// `x1 + 1`), with their exponents; a factor may repeat.
    pub factors: Vec<(RatPoly, u32)>,
    /// The number of variables of the factors.
    pub nvars: usize,
}

impl LinearFactors {
    /// The product multiplied out (a reference for tests; it expands into monomials).
    pub fn expand(&self) -> MathResult<RatPoly> {
        let mut p = RatPoly::constant(self.nvars, self.scalar.clone());
        for (f, e) in &self.factors {
            p = p.mul(&f.pow(*e)?)?;
        }
        Ok(p)
    }

    /// The total degree Σ exponents.
    pub fn degree(&self) -> u64 {
        self.factors.iter().map(|(_, e)| u64::from(*e)).sum()
    }
}

/// Reads `text` as a product of powers of linear forms and numbers, such as
/// `(x1-x3)(x2-x4)^2` or `-2 x1 (x1 + x2/2)^3 / 3`, without multiplying it out.
/// `Ok(None)` when the text is a polynomial of another shape (a sum at the top,
/// a factor of degree two or more, `M(..)`); then [`parse_poly`] reads it, and
/// gives the error for a malformed input. With `nvars` as in [`parse_poly`].
///
/// ```
/// use elbowroom_math::poly::parse::parse_linear_factors;
/// let f = parse_linear_factors("-(x1-x3)(x2 - x4)^2/2", Some(4)).unwrap().unwrap();
/// assert_eq!(f.scalar.to_string(), "-1/2");
/// let shown: Vec<String> = f.factors.iter().map(|(p, e)| format!("({})^{e}", p.to_text())).collect();
/// assert_eq!(shown, vec!["(x1 - x3)^1", "(x2 - x4)^2"]);
/// assert!(parse_linear_factors("x1 x2 + x3", Some(4)).unwrap().is_none());
/// assert!(parse_linear_factors("(x1 + x2)(x1^2 - x3)", Some(4)).unwrap().is_none());
/// assert!(parse_linear_factors("x5", Some(4)).is_err());
/// ```
pub fn parse_linear_factors(text: &str, nvars: Option<usize>) -> MathResult<Option<LinearFactors>> {
    parse_linear_factors_with(text, nvars, &Progress::default())
}

/// [`parse_linear_factors`], with `progress` polled when the text is read in full.
pub fn parse_linear_factors_with(
    text: &str,
    nvars: Option<usize>,
    progress: &Progress,
) -> MathResult<Option<LinearFactors>> {
    check_length(text)?;
    let tokens = lex(text)?;
    let width = width_of(&tokens, nvars)?;
    let reading = tree::read(text, &tokens, nvars);
    if let Reading::Whole(Node::Sum(terms)) = &reading {
        // the sums inside parentheses are expanded with a count of work of their own
        let quiet = Progress::default();
        let mut expander = Expander::new(text, width, nvars, &quiet);
        let mut recognizer = factors::Recognizer {
            expander: &mut expander,
            nvars: width,
            declared: nvars,
        };
        if let Some((scalar, factors)) = recognizer.sum(terms, 0) {
            return Ok(Some(LinearFactors {
                scalar,
                factors,
                nvars: width,
            }));
        }
    }
    // another shape, or a mistake reported with its column
    expand_reading(text, width, nvars, reading, progress).map(|_| None)
}

/// Refuses a text longer than [`TYPED_TEXT_LIMIT`] characters before reading it.
fn check_length(text: &str) -> MathResult<()> {
    let len = text.chars().count();
    if len > TYPED_TEXT_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "the polynomial is {len} characters long; at most {TYPED_TEXT_LIMIT} are accepted"
        )));
    }
    Ok(())
}

/// The number of variables: `nvars`, or the largest index used (at least 1).
fn width_of(tokens: &[Token], nvars: Option<usize>) -> MathResult<usize> {
    Ok(match nvars {
        Some(n) => {
            if n == 0 || n > MAX_VARS {
                return Err(MathError::OutOfRange(format!(
                    "{n} variables; between 1 and {MAX_VARS} are supported"
                )));
            }
            n
        }
        None => tokens
            .iter()
            .filter_map(|t| match t.kind {
                Tok::Var(i) => Some(i),
                _ => None,
            })
            .max()
            .unwrap_or(1)
            .max(1),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn text(s: &str, n: Option<usize>) -> String {
        parse_poly(s, n)
            .map(|p| p.to_text())
            .unwrap_or_else(|e| format!("ERR {e}"))
    }

    #[test]
    fn notation_variants() {
        assert_eq!(text("x1 + x_2 + x_{3}", None), "x1 + x2 + x3");
        assert_eq!(text("2x1 x2", None), "2 x1 x2");
        assert_eq!(text("3/2 x1 - x1/2", None), "x1");
        assert_eq!(text("0.25 x2 * 4", None), "x2");
        assert_eq!(text("-(x1 - x2)^2", None), "-x1^2 + 2 x1 x2 - x2^2");
        assert_eq!(text("2(x1+1)", None), "2 x1 + 2");
        assert_eq!(text("x1^0", None), "1");
        assert_eq!(text("x1 − x2 · x3", None), "x1 - x2 x3");
        assert_eq!(text("0", Some(3)), "0");
    }

    #[test]
    fn errors_mark_the_column() {
        for (input, col) in [
            ("2x1 + * x3", 7),
            ("x1 +", 5),
            ("(x1 + x2", 9),
            ("x1^-1", 4),
            ("x1 $ x2", 4),
            ("x9", 1),
            ("x1/x2", 4),
            ("", 1),
            ("x1^2^3", 5),
        ] {
            match parse_poly(input, Some(4)) {
                Err(MathError::Syntax { column, .. }) => assert_eq!(column, col, "input {input:?}"),
                other => panic!("{input:?}: expected a syntax error, got {other:?}"),
            }
        }
    }

    #[test]
    fn size_limits_are_errors_not_panics() {
        assert!(parse_poly("x1^300", None).is_err());
        assert!(parse_poly("x17", None).is_err());
        assert!(parse_poly("(x1+x2+x3+x4+x5+x6+x7+x8+x9+x10+x11+x12)^200", None).is_err());
    }

    #[test]
    fn deep_nesting_is_refused_not_followed() {
        let deep = |k: usize| format!("{}x1{}", "(".repeat(k), ")".repeat(k));
        assert_eq!(parse_poly(&deep(150), None).unwrap().to_text(), "x1");
        for text in [deep(99_999), format!("{}x1", "-".repeat(60_000))] {
            let e = parse_poly(&text, None).unwrap_err().to_string();
            assert!(e.contains("more than 200 deep"), "{}", &e[..80]);
        }
        // the recognizer of products of linear forms falls back on the same parser
        assert!(parse_linear_factors(&deep(99_999), Some(3)).is_err());
        // and reads a long run of signs in a loop: 99 999 minus signs are one minus
        let signs = format!("{}(x1 - x2)", "-".repeat(99_999));
        let f = parse_linear_factors(&signs, Some(3)).unwrap().unwrap();
        assert_eq!(f.scalar.to_string(), "-1");
    }

    #[test]
    fn a_limit_passed_before_a_mistake_is_reported_first() {
        // read left to right: the power is refused before the stray '*' is reached
        let e = parse_poly("(x1+x2+x3+x4)^100 + * x3", None)
            .unwrap_err()
            .to_string();
        assert!(
            e.contains("coefficient products") && e.contains("column 14"),
            "{e}"
        );
        // a division by a non-number before a mistake: the division is reported
        let e = parse_poly("x1/x2 + * x3", None).unwrap_err().to_string();
        assert!(e.contains("division is only by a nonzero number"), "{e}");
        // with nothing refused before it, the mistake itself
        let e = parse_poly("x1/2 + * x3", None).unwrap_err().to_string();
        assert!(e.contains("column 8"), "{e}");
    }

    #[test]
    fn products_are_recognised_inside_parentheses_nested_past_the_reader_of_sums() {
        // 230 parentheses around a linear form: recognised as one factor, while
        // expanding the text refuses more than 200 levels
        let text = format!("{}x1 - x2{}", "(".repeat(230), ")".repeat(230));
        let f = parse_linear_factors(&text, Some(2)).unwrap().unwrap();
        assert_eq!(f.factors.len(), 1);
        assert_eq!(f.factors[0].0.to_text(), "x1 - x2");
        assert!(parse_poly(&text, Some(2)).is_err());
    }

    #[test]
    fn sizes_are_refused_before_the_work() {
        let e = parse_poly(&"x1+".repeat(70_000), None)
            .unwrap_err()
            .to_string();
        assert!(e.contains("at most 200000 are accepted"), "{e}");
        // (x1 + ... + x4)^20 has C(23, 3) = 1771 terms
        assert_eq!(parse_poly("(x1+x2+x3+x4)^20", None).unwrap().len(), 1771);
        let e = parse_poly("(x1+x2+x3+x4)^100", None)
            .unwrap_err()
            .to_string();
        assert!(
            e.contains("coefficient products; a typed polynomial may take at most 400000"),
            "{e}"
        );
        let e = parse_poly("123456789^255^1", None).unwrap_err().to_string();
        assert!(e.contains("column"), "{e}");
        let e = parse_poly(&format!("{}^255", "9".repeat(2_000)), None)
            .unwrap_err()
            .to_string();
        assert!(
            e.contains("digits; a typed polynomial may have at most 100000"),
            "{e}"
        );
        // an error in a long input is quoted as an excerpt around its column
        let long = format!("{}$", "x1 + ".repeat(10_000));
        let e = parse_poly(&long, None).unwrap_err().to_string();
        assert!(
            e.len() < 400 && e.contains("column 50001") && e.contains('…'),
            "{e}"
        );
    }
}
