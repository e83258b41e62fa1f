//! Reading typed polynomials in the usual notation.
//!
//! Accepted: variables `x1`, `x_1`, `x_{12}`; numbers `3`, `-3/2`, `0.25`
//! (exact); `+ - * / ^`; implicit multiplication (`2x1 x2`, `3(x1 + x2)`);
//! parentheses and powers of sums (`(3x1 + 2x2 + x3)^2`); `·`, `×` and `−`
//! as typeset; named atoms `M(2,1)` and `F(2,1)` for quasisymmetric
//! polynomials in the n variables of the computation. Division is only by
//! nonzero constants. A malformed input gives [`MathError::Syntax`], which
//! quotes the input and marks the column; reading never panics.

use crate::error::{MathError, MathResult};
use crate::limits::{
    QUOTE_LIMIT, TYPED_DIGIT_LIMIT, TYPED_PRODUCT_LIMIT, TYPED_TERM_LIMIT, TYPED_TEXT_LIMIT,
    monomials_up_to_degree,
};
use crate::poly::mono::{MAX_EXP, MAX_VARS};
use crate::poly::polynomial::{PolyBuilder, RatPoly};
use crate::progress::Progress;
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Zero};

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
    let declared = nvars;
    let width = width_of(&tokens, nvars)?;
    let mut p = Parser {
        text,
        tokens,
        pos: 0,
        nvars: width,
        declared,
        depth: 0,
        spent: std::cell::Cell::new(0),
        progress,
    };
    if p.tokens.len() == 1 {
        return Err(p.error_here("the input is empty; type a polynomial such as 2x1 x2 - 3/2 x3^2"));
    }
    let value = p.expr()?;
    if !matches!(p.peek(), Tok::End) {
        return Err(p.error_here("expected an operator (+ - * / ^) or the end of the input"));
    }
    value.with_nvars(width)
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
    let tokens = match lex(text) {
        Ok(t) => t,
        Err(_) => return parse_poly_with(text, nvars, progress).map(|_| None),
    };
    let width = width_of(&tokens, nvars)?;
    let mut p = Parser {
        text,
        tokens,
        pos: 0,
        nvars: width,
        declared: nvars,
        depth: 0,
        spent: std::cell::Cell::new(0),
        progress: &Progress::default(),
    };
    if p.tokens.len() > 1
        && let Some((scalar, factors)) = p.factored_product(0)
        && matches!(p.peek(), Tok::End)
    {
        return Ok(Some(LinearFactors {
            scalar,
            factors,
            nvars: width,
        }));
    }
    // another shape, or an error that the full reader reports with its column
    parse_poly_with(text, nvars, progress).map(|_| None)
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

/// How deep parentheses may nest in [`parse_linear_factors`] before the text is
/// left to [`parse_poly`].
const FACTOR_NESTING: usize = 64;

/// A scalar and a list of (factor of degree one, exponent).
type Factored = (BigRational, Vec<(RatPoly, u32)>);

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

#[derive(Clone, Debug, PartialEq)]
enum Tok {
    Num(BigRational),
    Var(usize),
    Name(String),
    Plus,
    Minus,
    Star,
    Slash,
    Caret,
    LParen,
    RParen,
    Comma,
    End,
}

#[derive(Clone, Debug)]
struct Token {
    kind: Tok,
    /// 0-based character index where the token starts.
    at: usize,
}

/// A syntax error at character `at`. A long input is quoted as an excerpt of
/// at most [`QUOTE_LIMIT`] characters around the column, with `…` where it was cut.
fn syntax(text: &str, at: usize, expected: &str) -> MathError {
    let chars: Vec<char> = text.chars().collect();
    let (from, to) = if chars.len() <= QUOTE_LIMIT {
        (0, chars.len())
    } else {
        let from = at
            .saturating_sub(QUOTE_LIMIT / 2)
            .min(chars.len() - QUOTE_LIMIT);
        (from, from + QUOTE_LIMIT)
    };
    let cut = |s: String| {
        let head = if from > 0 { "…" } else { "" };
        let tail = if to < chars.len() { "…" } else { "" };
        format!("{head}{s}{tail}")
    };
    let mut marked = String::new();
    for (i, c) in chars.iter().enumerate().take(to).skip(from) {
        if i == at {
            marked.push('⟦');
            marked.push(*c);
            marked.push('⟧');
        } else {
            marked.push(*c);
        }
    }
    if at >= chars.len() {
        marked.push_str("⟦⟧");
    }
    let marked = cut(marked);
    MathError::Syntax {
        input: cut(chars[from..to].iter().collect()),
        column: at + 1,
        expected: expected.to_string(),
        marked,
    }
}

fn lex(text: &str) -> MathResult<Vec<Token>> {
    let chars: Vec<char> = text.chars().collect();
    let mut out = Vec::new();
    let mut i = 0;
    while i < chars.len() {
        let c = chars[i];
        let start = i;
        let simple = match c {
            '+' => Some(Tok::Plus),
            '-' | '−' => Some(Tok::Minus),
            '*' | '·' | '×' => Some(Tok::Star),
            '/' => Some(Tok::Slash),
            '^' => Some(Tok::Caret),
            '(' => Some(Tok::LParen),
            ')' => Some(Tok::RParen),
            ',' => Some(Tok::Comma),
            _ => None,
        };
        if let Some(kind) = simple {
            out.push(Token { kind, at: start });
            i += 1;
            continue;
        }
        if c.is_whitespace() {
            i += 1;
            continue;
        }
        if c.is_ascii_digit() || c == '.' {
            let mut j = i;
            while j < chars.len() && (chars[j].is_ascii_digit() || chars[j] == '.') {
                j += 1;
            }
            let s: String = chars[i..j].iter().collect();
            let Some(value) = decimal(&s) else {
                return Err(syntax(
                    text,
                    start,
                    &format!("'{s}' is not a number; numbers are like 3, 0.25 or 3/2"),
                ));
            };
            out.push(Token {
                kind: Tok::Num(value),
                at: start,
            });
            i = j;
            continue;
        }
        if c == 'x' || c == 'X' {
            let mut j = i + 1;
            if j < chars.len() && chars[j] == '_' {
                j += 1;
            }
            let braced = j < chars.len() && chars[j] == '{';
            if braced {
                j += 1;
            }
            let d0 = j;
            while j < chars.len() && chars[j].is_ascii_digit() {
                j += 1;
            }
            if j == d0 {
                return Err(syntax(
                    text,
                    start,
                    "a variable needs an index, like x1, x_2 or x_{12}",
                ));
            }
            let digits: String = chars[d0..j].iter().collect();
            if braced {
                if j < chars.len() && chars[j] == '}' {
                    j += 1;
                } else {
                    return Err(syntax(text, j, "expected '}' to close the variable index"));
                }
            }
            let index: usize = digits.parse().unwrap_or(usize::MAX);
            if index == 0 || index > MAX_VARS {
                return Err(syntax(
                    text,
                    start,
                    &format!("variables are x1 to x{MAX_VARS}; x{digits} is not one of them"),
                ));
            }
            out.push(Token {
                kind: Tok::Var(index),
                at: start,
            });
            i = j;
            continue;
        }
        if c.is_alphabetic() {
            let mut j = i;
            while j < chars.len() && chars[j].is_alphanumeric() {
                j += 1;
            }
            let name: String = chars[i..j].iter().collect();
            out.push(Token {
                kind: Tok::Name(name),
                at: start,
            });
            i = j;
            continue;
        }
        return Err(syntax(
            text,
            start,
            &format!(
                "'{c}' is not allowed; use numbers, variables x1..xn, + - * / ^ and parentheses"
            ),
        ));
    }
    out.push(Token {
        kind: Tok::End,
        at: chars.len(),
    });
    Ok(out)
}

fn decimal(s: &str) -> Option<BigRational> {
    let (int, frac) = match s.split_once('.') {
        Some((a, b)) => (a, b),
        None => (s, ""),
    };
    // as the rational reader: a point needs a digit after it (`1.` is refused)
    if frac.contains('.')
        || (s.contains('.') && frac.is_empty())
        || int.is_empty() && frac.is_empty()
    {
        return None;
    }
    let digits = format!("{int}{frac}");
    let num: BigInt = digits.parse().ok()?;
    let den = num_traits::pow(BigInt::from(10), frac.len());
    Some(BigRational::new(num, den))
}

/// The deepest nesting of parentheses and signs the parser follows; deeper
/// input is refused with a message instead of exhausting the stack.
pub const MAX_NESTING: usize = 200;

struct Parser<'a> {
    text: &'a str,
    tokens: Vec<Token>,
    pos: usize,
    nvars: usize,
    declared: Option<usize>,
    /// How many parentheses and signs enclose the current position.
    depth: usize,
    /// Polled in products and powers.
    progress: &'a Progress,
    /// Coefficient products spent so far on this text (bounded in all by
    /// [`TYPED_PRODUCT_LIMIT`]).
    spent: std::cell::Cell<u128>,
}

impl Parser<'_> {
    fn peek(&self) -> &Tok {
        &self.tokens[self.pos.min(self.tokens.len() - 1)].kind
    }

    fn at(&self) -> usize {
        self.tokens[self.pos.min(self.tokens.len() - 1)].at
    }

    fn bump(&mut self) -> Tok {
        let t = self.peek().clone();
        if self.pos < self.tokens.len() - 1 {
            self.pos += 1;
        }
        t
    }

    /// Runs `inner` one level deeper, refusing input nested beyond [`MAX_NESTING`].
    fn nested(
        &mut self,
        inner: impl FnOnce(&mut Self) -> MathResult<RatPoly>,
    ) -> MathResult<RatPoly> {
        if self.depth >= MAX_NESTING {
            return Err(self.error_here(&format!(
                "the input nests parentheses and signs more than {MAX_NESTING} deep; \
                 write it with fewer"
            )));
        }
        self.depth += 1;
        let result = inner(self);
        self.depth -= 1;
        result
    }

    fn error_here(&self, expected: &str) -> MathError {
        syntax(self.text, self.at(), expected)
    }

    fn fail(&self, at: usize, e: MathError) -> MathError {
        match e {
            MathError::Syntax { .. } | MathError::Canceled => e,
            other => syntax(self.text, at, &other.to_string()),
        }
    }

    /// expr := ['+'|'-'] term (('+'|'-') term)*
    fn expr(&mut self) -> MathResult<RatPoly> {
        // the terms are gathered in a builder, so a long sum costs its length, not its square
        let mut acc = PolyBuilder::new(self.nvars);
        let minus_one = -BigRational::one();
        let mut first = true;
        loop {
            let negate = match self.peek() {
                Tok::Plus => {
                    self.bump();
                    false
                }
                Tok::Minus => {
                    self.bump();
                    true
                }
                _ if first => false,
                _ => return Ok(acc.build()),
            };
            first = false;
            let t = self.term()?;
            if negate {
                acc.add_scaled(&t, &minus_one);
            } else {
                acc.add_poly(&t);
            }
            if acc.len() as u128 > TYPED_TERM_LIMIT {
                return Err(self.error_here(&format!(
                    "the sum has more than {TYPED_TERM_LIMIT} terms, the most a typed polynomial may have"
                )));
            }
        }
    }

    /// product := ('+'|'-')* power (('*' | '/' number | implicit) power)*, up to the
    /// end or a ')'; `None` when the text has another shape.
    fn factored_product(&mut self, depth: usize) -> Option<Factored> {
        let mut scalar = BigRational::one();
        let mut factors = Vec::new();
        loop {
            match self.peek() {
                Tok::Plus => {
                    self.bump();
                }
                Tok::Minus => {
                    self.bump();
                    scalar = -scalar;
                }
                _ => break,
            }
        }
        let (s, f) = self.factored_power(depth)?;
        scalar *= s;
        factors.extend(f);
        loop {
            match self.peek().clone() {
                Tok::Star => {
                    self.bump();
                    let (s, f) = self.factored_power(depth)?;
                    scalar *= s;
                    factors.extend(f);
                }
                Tok::Slash => {
                    self.bump();
                    let (s, f) = self.factored_power(depth)?;
                    if !f.is_empty() || s.is_zero() {
                        return None;
                    }
                    scalar /= s;
                }
                t if Self::starts_factor(&t) => {
                    let (s, f) = self.factored_power(depth)?;
                    scalar *= s;
                    factors.extend(f);
                }
                Tok::End | Tok::RParen => return Some((scalar, factors)),
                _ => return None,
            }
        }
    }

    /// power := ('-'|'+') power | primary ['^' integer]
    fn factored_power(&mut self, depth: usize) -> Option<Factored> {
        // signs are read in a loop, so a long run of them cannot deepen the stack
        let mut negative = false;
        loop {
            match self.peek() {
                Tok::Minus => negative = !negative,
                Tok::Plus => {}
                _ => break,
            }
            self.bump();
        }
        if negative {
            let (s, f) = self.factored_unsigned_power(depth)?;
            return Some((-s, f));
        }
        self.factored_unsigned_power(depth)
    }

    /// primary ['^' integer]
    fn factored_unsigned_power(&mut self, depth: usize) -> Option<Factored> {
        let (s, f) = self.factored_primary(depth)?;
        if !matches!(self.peek(), Tok::Caret) {
            return Some((s, f));
        }
        self.bump();
        let k = match self.bump() {
            Tok::Num(v) if v.is_integer() => v.to_integer(),
            Tok::LParen => {
                let Tok::Num(v) = self.bump() else {
                    return None;
                };
                if !v.is_integer() || !matches!(self.bump(), Tok::RParen) {
                    return None;
                }
                v.to_integer()
            }
            _ => return None,
        };
        let k = u32::try_from(k).ok().filter(|&k| k <= MAX_EXP)?;
        if matches!(self.peek(), Tok::Caret) {
            return None;
        }
        let mut powered = Vec::with_capacity(f.len());
        for (p, e) in f {
            powered.push((p, e.checked_mul(k)?));
        }
        let bits = s.numer().bits().max(s.denom().bits());
        if bits.saturating_mul(u64::from(k)) * 3 / 10 > TYPED_DIGIT_LIMIT {
            // too large here: the full reader refuses it with its column
            return None;
        }
        Some((num_traits::pow(s, k as usize), powered))
    }

    /// primary := number | variable | '(' product ')' | '(' linear expression ')'
    fn factored_primary(&mut self, depth: usize) -> Option<Factored> {
        match self.peek().clone() {
            Tok::Num(v) => {
                self.bump();
                Some((v, Vec::new()))
            }
            Tok::Var(i) => {
                if self.declared.is_some_and(|n| i > n) {
                    return None;
                }
                self.bump();
                Some((
                    BigRational::one(),
                    vec![(RatPoly::var_index(self.nvars, i - 1), 1)],
                ))
            }
            Tok::LParen if depth < FACTOR_NESTING => {
                self.bump();
                let start = self.pos;
                if let Some(inner) = self.factored_product(depth + 1)
                    && matches!(self.peek(), Tok::RParen)
                {
                    self.bump();
                    return Some(inner);
                }
                self.pos = start;
                let inner = self.expr().ok()?;
                if !matches!(self.peek(), Tok::RParen) {
                    return None;
                }
                self.bump();
                match inner.degree() {
                    0 => Some((constant_value(&inner)?, Vec::new())),
                    1 => Some((BigRational::one(), vec![(inner, 1)])),
                    _ => None,
                }
            }
            _ => None,
        }
    }

    fn starts_factor(t: &Tok) -> bool {
        matches!(t, Tok::Num(_) | Tok::Var(_) | Tok::Name(_) | Tok::LParen)
    }

    /// term := factor (('*' | '/' | implicit) factor)*
    fn term(&mut self) -> MathResult<RatPoly> {
        let mut acc = self.factor()?;
        loop {
            let at = self.at();
            match self.peek().clone() {
                Tok::Star => {
                    self.bump();
                    let f = self.factor()?;
                    acc = self.product(&acc, &f, at)?;
                }
                Tok::Slash => {
                    self.bump();
                    let at_divisor = self.at();
                    let f = self.factor()?;
                    let c = constant_value(&f).filter(|c| !c.is_zero()).ok_or_else(|| {
                        syntax(
                            self.text,
                            at_divisor,
                            "division is only by a nonzero number, as in x1/2 or 3/2 x1",
                        )
                    })?;
                    acc = acc.scale(&(BigRational::one() / c));
                }
                t if Self::starts_factor(&t) => {
                    let f = self.factor()?;
                    acc = self.product(&acc, &f, at)?;
                }
                _ => return Ok(acc),
            }
        }
    }

    /// factor := '-' factor | primary ['^' integer]
    fn factor(&mut self) -> MathResult<RatPoly> {
        if matches!(self.peek(), Tok::Minus) {
            self.bump();
            return self.nested(|p| Ok(p.factor()?.neg()));
        }
        if matches!(self.peek(), Tok::Plus) {
            self.bump();
            return self.nested(|p| p.factor());
        }
        let base = self.primary()?;
        if !matches!(self.peek(), Tok::Caret) {
            return Ok(base);
        }
        let caret_at = self.at();
        self.bump();
        let exp_at = self.at();
        let k = match self.bump() {
            Tok::Num(v) if v.is_integer() => v.to_integer(),
            Tok::LParen => {
                let inner = match self.bump() {
                    Tok::Num(v) if v.is_integer() => v.to_integer(),
                    _ => {
                        return Err(syntax(
                            self.text,
                            exp_at + 1,
                            "an exponent is a whole number from 0 to 255",
                        ));
                    }
                };
                if !matches!(self.bump(), Tok::RParen) {
                    return Err(syntax(self.text, exp_at, "expected ')' after the exponent"));
                }
                inner
            }
            _ => {
                return Err(syntax(
                    self.text,
                    exp_at,
                    "an exponent is a whole number from 0 to 255 (no negative or fractional powers)",
                ));
            }
        };
        let Some(k) = u32::try_from(k).ok().filter(|&k| k <= MAX_EXP) else {
            return Err(syntax(
                self.text,
                exp_at,
                "an exponent is a whole number from 0 to 255",
            ));
        };
        if matches!(self.peek(), Tok::Caret) {
            return Err(self.error_here("write repeated powers with parentheses, as (x1^2)^3"));
        }
        self.power(&base, k, caret_at)
    }

    /// a·b, refused before it starts when it would take more than
    /// [`TYPED_PRODUCT_LIMIT`] coefficient products or could have more than
    /// [`TYPED_TERM_LIMIT`] terms.
    fn product(&self, a: &RatPoly, b: &RatPoly, at: usize) -> MathResult<RatPoly> {
        let products = a.len() as u128 * b.len() as u128;
        let spent = self.spent.get().saturating_add(products);
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
        self.spent.set(spent);
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
        a.mul_with(b, self.progress).map_err(|e| self.fail(at, e))
    }

    /// base^k by repeated squaring, each multiplication sized by [`Self::product`];
    /// refused at once when base^k could have more than [`TYPED_TERM_LIMIT`] terms,
    /// estimated as min(C(k + t − 1, t − 1), C(k·d + n, n)) for t terms of degree d.
    fn power(&self, base: &RatPoly, k: u32, at: usize) -> MathResult<RatPoly> {
        let t = base.len() as u64;
        let d = u64::from(base.degree());
        // terms of base^j are at most min(C(j + t − 1, t − 1), C(j·d + n, n))
        let terms_of = |j: u64| {
            crate::limits::binomial(j + t - 1, t - 1).min(monomials_up_to_degree(
                d.saturating_mul(j),
                self.nvars as u64,
            ))
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
            let work = work.saturating_add(self.spent.get());
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

    /// primary := number | variable | name '(' integers ')' | '(' expr ')'
    fn primary(&mut self) -> MathResult<RatPoly> {
        let at = self.at();
        match self.bump() {
            Tok::Num(v) => Ok(RatPoly::constant(self.nvars, v)),
            Tok::Var(i) => {
                if let Some(n) = self.declared
                    && i > n
                {
                    return Err(syntax(
                        self.text,
                        at,
                        &format!("x{i} is not among the variables x1..x{n} of this computation"),
                    ));
                }
                Ok(RatPoly::var_index(self.nvars, i - 1))
            }
            Tok::LParen => {
                let inner = self.nested(|p| p.expr())?;
                if !matches!(self.peek(), Tok::RParen) {
                    return Err(self.error_here("expected ')' to close the parenthesis"));
                }
                self.bump();
                Ok(inner)
            }
            Tok::Name(name) => {
                let args = self.name_arguments(&name, at)?;
                named_atom(&name, &args, self.declared)
                    .map_err(|e| self.fail(at, e))
                    .map(|p| p.with_nvars(self.nvars).unwrap_or(p))
            }
            Tok::End => Err(syntax(
                self.text,
                at,
                "the input ends too early; expected a number, a variable like x1, or '('",
            )),
            _ => Err(syntax(
                self.text,
                at,
                "expected a number, a variable like x1, or '(' here",
            )),
        }
    }

    fn name_arguments(&mut self, name: &str, at: usize) -> MathResult<Vec<usize>> {
        if !matches!(self.peek(), Tok::LParen) {
            return Err(syntax(
                self.text,
                at,
                &format!(
                    "'{name}' is not known; accepted names are M(a,b,...) and F(a,b,...), variables are x1, x2, ..."
                ),
            ));
        }
        self.bump();
        let mut args = Vec::new();
        loop {
            let here = self.at();
            match self.bump() {
                Tok::Num(v) if v.is_integer() => {
                    let Some(k) = usize::try_from(v.to_integer())
                        .ok()
                        .filter(|k| (1..=255).contains(k))
                    else {
                        return Err(syntax(
                            self.text,
                            here,
                            "the parts of a composition are whole numbers from 1 to 255",
                        ));
                    };
                    args.push(k);
                }
                _ => {
                    return Err(syntax(
                        self.text,
                        here,
                        "the parts of a composition are positive whole numbers, as in M(2,1)",
                    ));
                }
            }
            match self.bump() {
                Tok::Comma => continue,
                Tok::RParen => return Ok(args),
                _ => {
                    let here = self.tokens[self.pos.saturating_sub(1)].at;
                    return Err(syntax(
                        self.text,
                        here,
                        "expected ',' or ')' in the composition",
                    ));
                }
            }
        }
    }
}

/// The value of a named atom `NAME(a, b, ...)` in `nvars` variables.
/// Quasisymmetric atoms `M(α)` and `F(α)` are resolved here.
fn named_atom(name: &str, args: &[usize], nvars: Option<usize>) -> MathResult<RatPoly> {
    crate::poly::quasisym::named_atom(name, args, nvars)
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

fn constant_value(p: &RatPoly) -> Option<BigRational> {
    match p.terms() {
        [] => Some(BigRational::zero()),
        [(m, c)] if m.degree() == 0 => Some(c.clone()),
        _ => None,
    }
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
