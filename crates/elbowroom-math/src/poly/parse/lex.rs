//! The lexer of typed polynomials: numbers (read by the one reader of exact
//! decimals, `poly::rational`), variables `x1`, `x_2`, `x_{12}`, names such as
//! `M` and `F`, operators and parentheses, each with the column where it
//! starts; and the one way a mistake is reported ([`syntax`]).

use crate::error::{MathError, MathResult};
use crate::limits::QUOTE_LIMIT;
use crate::poly::mono::MAX_VARS;
use crate::poly::rational::unsigned_number;
use num_rational::BigRational;

/// What a token is.
#[derive(Clone, Debug, PartialEq)]
pub(super) enum Tok {
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

/// A token and where it starts.
#[derive(Clone, Debug)]
pub(super) struct Token {
    pub(super) kind: Tok,
    /// 0-based character index where the token starts.
    pub(super) at: usize,
}

/// A syntax error at character `at`. A long input is quoted as an excerpt of
/// at most [`QUOTE_LIMIT`] characters around the column, with `…` where it was cut.
pub(super) fn syntax(text: &str, at: usize, expected: &str) -> MathError {
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

/// The tokens of `text`, ending in [`Tok::End`]; a character that starts no
/// token, a malformed number or variable is a syntax error at its column.
pub(super) fn lex(text: &str) -> MathResult<Vec<Token>> {
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
            let Some(value) = unsigned_number(&s) else {
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
