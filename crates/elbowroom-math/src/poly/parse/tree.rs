//! The syntax tree of a typed polynomial, read from its tokens by recursive
//! descent:
//!
//! ```text
//! expr    := ['+'|'-'] term (('+'|'-') term)*
//! term    := factor (('*' | '/' | implicit) factor)*
//! factor  := ('+'|'-')* primary ['^' integer | '^' '(' integer ')']
//! primary := number | variable | name '(' integers ')' | '(' expr ')'
//! ```
//!
//! Reading computes nothing. A mistake stops the reading, and what was read
//! before it is kept as a partial tree ending in [`Node::Broken`]: the
//! expansion goes through that part first, so a size limit passed to the left
//! of a mistake is reported as it would be by a reader that computes as it
//! reads. Each node keeps the columns its messages name.

use super::MAX_NESTING;
use super::lex::{Tok, Token, syntax};
use crate::error::MathError;
use crate::poly::mono::MAX_EXP;
use num_rational::BigRational;

/// A node of the syntax tree.
#[derive(Debug)]
pub(super) enum Node {
    /// A number.
    Num(BigRational),
    /// The variable x_i (1-based).
    Var(usize),
    /// A named atom `NAME(a, b, ...)`, at the column of its name.
    Atom {
        name: String,
        args: Vec<usize>,
        at: usize,
    },
    /// A sum of signed terms.
    Sum(Vec<Term>),
    /// A first factor, then more, each multiplied or divided in turn.
    Product(Box<Node>, Vec<(Op, Node)>),
    /// Signs before a factor, each a level of nesting.
    Signed(Vec<Sign>, Box<Node>),
    /// base^exponent; `at` is the column of the caret.
    Power {
        base: Box<Node>,
        exponent: u32,
        at: usize,
    },
    /// A parenthesized expression; `at` is the column after the parenthesis.
    Group { inner: Box<Node>, at: usize },
    /// The first node, then the second (what was read before a mistake found
    /// after it).
    Then(Box<Node>, Box<Node>),
    /// Where the reading stopped at a mistake.
    Broken,
}

/// A term of a sum.
#[derive(Debug)]
pub(super) struct Term {
    /// Whether the term is subtracted.
    pub(super) negate: bool,
    /// The term.
    pub(super) node: Node,
    /// The column of the token after the term (where a sum too long is reported).
    pub(super) after: usize,
}

/// How a factor after the first joins a product.
#[derive(Debug)]
pub(super) enum Op {
    /// Multiplied (by `*` or side by side), reported at column `at`.
    Times { at: usize },
    /// Divided by; `at` is the column of the divisor.
    Divide { at: usize },
}

/// One sign before a factor.
#[derive(Debug)]
pub(super) struct Sign {
    /// `-` (or `−`) rather than `+`.
    pub(super) minus: bool,
    /// The column of the token after the sign.
    pub(super) after: usize,
}

/// What reading a text gave: a whole tree, or the part read before a mistake.
pub(super) enum Reading {
    /// The text is a polynomial.
    Whole(Node),
    /// The text has a mistake; `tree` ends in [`Node::Broken`] at it.
    Cut { tree: Node, mistake: MathError },
}

/// Reads `tokens` (from [`super::lex::lex`]) of `text`; `declared` is the
/// number of variables of the computation, if given.
pub(super) fn read(text: &str, tokens: &[Token], declared: Option<usize>) -> Reading {
    let mut reader = Reader {
        text,
        tokens,
        pos: 0,
        declared,
        groups: 0,
        mistake: None,
    };
    if tokens.len() <= 1 {
        let at = reader.at();
        return Reading::Cut {
            tree: Node::Broken,
            mistake: syntax(
                text,
                at,
                "the input is empty; type a polynomial such as 2x1 x2 - 3/2 x3^2",
            ),
        };
    }
    let tree = match reader.expr() {
        Ok(tree) if matches!(reader.peek(), Tok::End) => return Reading::Whole(tree),
        Ok(tree) => {
            let e = reader.error_here("expected an operator (+ - * / ^) or the end of the input");
            reader.broken_after(tree, e)
        }
        Err(partial) => partial,
    };
    let mistake = reader
        .mistake
        .take()
        .unwrap_or_else(|| syntax(text, 0, "the input could not be read"));
    Reading::Cut { tree, mistake }
}

/// How deep parentheses may nest in a tree, a bound for the stack: deeper
/// than any text is accepted. The expansion refuses more than [`MAX_NESTING`]
/// levels of parentheses and signs; the recognition of products reads 64
/// levels of parentheses and expands the sum inside the last one afresh, so it
/// accepts up to 64 + [`MAX_NESTING`] levels.
const GROUP_LIMIT: usize = 2 * MAX_NESTING;

/// A partial tree, returned upward when the reading stops at a mistake.
type Read = Result<Node, Node>;

struct Reader<'a> {
    text: &'a str,
    tokens: &'a [Token],
    pos: usize,
    declared: Option<usize>,
    /// How many parentheses enclose the current position (the stack's bound).
    groups: usize,
    /// The mistake the reading stopped at.
    mistake: Option<MathError>,
}

impl Reader<'_> {
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

    fn error_here(&self, expected: &str) -> MathError {
        syntax(self.text, self.at(), expected)
    }

    /// Stops at `mistake`: nothing was read at this point.
    fn broken(&mut self, mistake: MathError) -> Read {
        self.mistake = Some(mistake);
        Err(Node::Broken)
    }

    /// Stops at `mistake` after `node` was read whole.
    fn broken_after(&mut self, node: Node, mistake: MathError) -> Node {
        self.mistake = Some(mistake);
        Node::Then(Box::new(node), Box::new(Node::Broken))
    }

    fn starts_factor(t: &Tok) -> bool {
        matches!(t, Tok::Num(_) | Tok::Var(_) | Tok::Name(_) | Tok::LParen)
    }

    /// expr := ['+'|'-'] term (('+'|'-') term)*
    fn expr(&mut self) -> Read {
        let mut terms = Vec::new();
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
                _ => return Ok(Node::Sum(terms)),
            };
            first = false;
            let (node, whole) = match self.term() {
                Ok(node) => (node, true),
                Err(partial) => (partial, false),
            };
            terms.push(Term {
                negate,
                node,
                after: self.at(),
            });
            if !whole {
                return Err(Node::Sum(terms));
            }
        }
    }

    /// term := factor (('*' | '/' | implicit) factor)*
    fn term(&mut self) -> Read {
        let first = match self.factor() {
            Ok(node) => Box::new(node),
            Err(partial) => return Err(Node::Product(Box::new(partial), Vec::new())),
        };
        let mut rest = Vec::new();
        loop {
            let at = self.at();
            let op = match self.peek() {
                Tok::Star => {
                    self.bump();
                    Op::Times { at }
                }
                Tok::Slash => {
                    self.bump();
                    Op::Divide { at: self.at() }
                }
                t if Self::starts_factor(t) => Op::Times { at },
                _ => return Ok(Node::Product(first, rest)),
            };
            match self.factor() {
                Ok(node) => rest.push((op, node)),
                Err(partial) => {
                    rest.push((op, partial));
                    return Err(Node::Product(first, rest));
                }
            }
        }
    }

    /// factor := ('+'|'-')* primary ['^' exponent]; signs are read in a loop,
    /// so a long run of them cannot deepen the stack.
    fn factor(&mut self) -> Read {
        let mut signs = Vec::new();
        loop {
            let minus = match self.peek() {
                Tok::Minus => true,
                Tok::Plus => false,
                _ => break,
            };
            self.bump();
            signs.push(Sign {
                minus,
                after: self.at(),
            });
        }
        let read = self.unsigned_factor();
        if signs.is_empty() {
            return read;
        }
        match read {
            Ok(node) => Ok(Node::Signed(signs, Box::new(node))),
            Err(partial) => Err(Node::Signed(signs, Box::new(partial))),
        }
    }

    /// primary ['^' exponent], the exponent a whole number from 0 to 255.
    fn unsigned_factor(&mut self) -> Read {
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
                        let e = syntax(
                            self.text,
                            exp_at + 1,
                            "an exponent is a whole number from 0 to 255",
                        );
                        return Err(self.broken_after(base, e));
                    }
                };
                if !matches!(self.bump(), Tok::RParen) {
                    let e = syntax(self.text, exp_at, "expected ')' after the exponent");
                    return Err(self.broken_after(base, e));
                }
                inner
            }
            _ => {
                let e = syntax(
                    self.text,
                    exp_at,
                    "an exponent is a whole number from 0 to 255 (no negative or fractional powers)",
                );
                return Err(self.broken_after(base, e));
            }
        };
        let Some(k) = u32::try_from(k).ok().filter(|&k| k <= MAX_EXP) else {
            let e = syntax(
                self.text,
                exp_at,
                "an exponent is a whole number from 0 to 255",
            );
            return Err(self.broken_after(base, e));
        };
        if matches!(self.peek(), Tok::Caret) {
            let e = self.error_here("write repeated powers with parentheses, as (x1^2)^3");
            return Err(self.broken_after(base, e));
        }
        Ok(Node::Power {
            base: Box::new(base),
            exponent: k,
            at: caret_at,
        })
    }

    /// primary := number | variable | name '(' integers ')' | '(' expr ')'
    fn primary(&mut self) -> Read {
        let at = self.at();
        match self.bump() {
            Tok::Num(v) => Ok(Node::Num(v)),
            Tok::Var(i) => {
                if let Some(n) = self.declared
                    && i > n
                {
                    let e = syntax(
                        self.text,
                        at,
                        &format!("x{i} is not among the variables x1..x{n} of this computation"),
                    );
                    return self.broken(e);
                }
                Ok(Node::Var(i))
            }
            Tok::LParen => {
                let inner_at = self.at();
                if self.groups >= GROUP_LIMIT {
                    // the expansion reports the nesting at or before this point
                    let e = self.error_here(&format!(
                        "the input nests parentheses and signs more than {MAX_NESTING} deep; \
                         write it with fewer"
                    ));
                    self.mistake = Some(e);
                    return Err(Node::Group {
                        inner: Box::new(Node::Broken),
                        at: inner_at,
                    });
                }
                self.groups += 1;
                let inner = self.expr();
                self.groups -= 1;
                let inner = match inner {
                    Ok(inner) => inner,
                    Err(partial) => {
                        return Err(Node::Group {
                            inner: Box::new(partial),
                            at: inner_at,
                        });
                    }
                };
                if !matches!(self.peek(), Tok::RParen) {
                    let e = self.error_here("expected ')' to close the parenthesis");
                    return Err(Node::Group {
                        inner: Box::new(self.broken_after(inner, e)),
                        at: inner_at,
                    });
                }
                self.bump();
                Ok(Node::Group {
                    inner: Box::new(inner),
                    at: inner_at,
                })
            }
            Tok::Name(name) => match self.name_arguments(&name, at) {
                Ok(args) => Ok(Node::Atom { name, args, at }),
                Err(e) => self.broken(e),
            },
            Tok::End => {
                let e = syntax(
                    self.text,
                    at,
                    "the input ends too early; expected a number, a variable like x1, or '('",
                );
                self.broken(e)
            }
            _ => {
                let e = syntax(
                    self.text,
                    at,
                    "expected a number, a variable like x1, or '(' here",
                );
                self.broken(e)
            }
        }
    }

    /// The parts of a named atom's composition, `(a, b, ...)`.
    fn name_arguments(&mut self, name: &str, at: usize) -> Result<Vec<usize>, MathError> {
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
