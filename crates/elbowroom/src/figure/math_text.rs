//! Our plain notation for mathematics, read as a mathematician writes it:
//! runs of text on the baseline, lowered (subscripts) or raised
//! (superscripts). The window's typesetting (`gui::typeset`) and the figure
//! writers (SVG `tspan`s, TikZ math) share this one reading.
//!
//! The plain notation is the one the program prints: `x2^2*x3` or
//! `x2^2 x3` (a polynomial as `Poly` prints it), `a^h_w`, `σ_{w0 w}`,
//! `S_1432`, `DS_h(f)`, `m_{(2,1,1)}`. The rules:
//! - `_` and `^` lower or raise what follows: a group in braces, or else a
//!   run of letters, digits and `∞`; nested scripts are set at the same level;
//! - a variable `x`, `y` or `z` followed by digits has the digits as its
//!   index (`x12` is x with 12 lowered), and so has `w0` (the longest element);
//! - in a polynomial (see [`MathText::Poly`]) the products `*` and the spaces
//!   between factors vanish (`2 x1 x2` is 2x₁x₂), a space stays after a
//!   fraction (`3/2 x1`), and `-` is the minus sign `−`.

/// The height a run of text sits at.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Level {
    /// On the baseline.
    Base,
    /// Lowered: a subscript.
    Sub,
    /// Raised: a superscript.
    Sup,
}

/// A run of text at one height.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Piece {
    /// The characters of the run.
    pub text: String,
    /// Where it sits.
    pub level: Level,
}

/// How to read a text.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum MathText {
    /// A polynomial as `Poly` prints it (`x2^2*x3`, `-3/2 x1 + x2`).
    Poly,
    /// An indexed symbol or a formula with words (`a^h_w`, `σ_{w0 w}`, `DS_h(f) = …`):
    /// spaces and `*` are kept.
    Symbol,
}

/// Whether `text` has anything to lower or raise (a `_`, a `^`, or an
/// indexed variable such as `x2`); figure writers leave other labels as they are.
pub fn has_scripts(text: &str) -> bool {
    pieces(text, MathText::Symbol)
        .iter()
        .any(|p| p.level != Level::Base)
}

/// How a figure label is read: `None` when it has nothing to lower or raise
/// (it is then written as it is), as a polynomial when it holds only
/// variables, digits and `^ * / + -` (`x2 x3^2`), else as a symbol.
pub fn label_reading(text: &str) -> Option<MathText> {
    if !has_scripts(text) {
        return None;
    }
    let polynomial = text
        .chars()
        .all(|c| c == 'x' || c.is_ascii_digit() || " ^*/+-".contains(c));
    Some(if polynomial {
        MathText::Poly
    } else {
        MathText::Symbol
    })
}

/// Reads `text` as `how` into runs, neighbouring runs at the same height merged.
///
/// ```
/// use elbowroom::figure::math_text::{pieces, Level, MathText};
/// let p = pieces("x2^2*x3", MathText::Poly);
/// let seen: Vec<(&str, Level)> = p.iter().map(|p| (p.text.as_str(), p.level)).collect();
/// assert_eq!(
///     seen,
///     [("x", Level::Base), ("2", Level::Sub), ("2", Level::Sup), ("x", Level::Base), ("3", Level::Sub)]
/// );
/// ```
pub fn pieces(text: &str, how: MathText) -> Vec<Piece> {
    let chars: Vec<char> = text.chars().collect();
    let mut out = Out::default();
    let mut i = 0;
    while i < chars.len() {
        i = step(&chars, i, Level::Base, how, &mut out);
    }
    out.pieces
}

#[derive(Default)]
struct Out {
    pieces: Vec<Piece>,
}

impl Out {
    fn push(&mut self, s: &str, level: Level) {
        if s.is_empty() {
            return;
        }
        match self.pieces.last_mut() {
            Some(p) if p.level == level => p.text.push_str(s),
            _ => self.pieces.push(Piece {
                text: s.to_string(),
                level,
            }),
        }
    }

    fn last_char(&self) -> Option<char> {
        self.pieces.last().and_then(|p| p.text.chars().last())
    }
}

fn is_run_char(c: char) -> bool {
    c.is_alphanumeric() || c == '∞'
}

fn is_operator(c: char) -> bool {
    matches!(
        c,
        '+' | '-' | '−' | '=' | '·' | ',' | ':' | '(' | ')' | '<' | '>'
    )
}

/// Reads one token of `chars` at `i`, set at `level` (a script's level when
/// inside one); returns the index after it.
fn step(chars: &[char], i: usize, level: Level, how: MathText, out: &mut Out) -> usize {
    let c = chars[i];
    let prev_alnum = i > 0 && chars[i - 1].is_alphanumeric();
    match c {
        '_' | '^' => {
            let script = if level != Level::Base {
                level
            } else if c == '_' {
                Level::Sub
            } else {
                Level::Sup
            };
            if chars.get(i + 1) == Some(&'{') {
                let Some(close) = matching_brace(chars, i + 1) else {
                    out.push(&c.to_string(), level);
                    return i + 1;
                };
                let mut j = i + 2;
                while j < close {
                    j = step(chars, j, script, MathText::Symbol, out);
                }
                // a space closing a group inside a script is dropped (`w0 w` is w₀w)
                return close + 1;
            }
            let mut j = i + 1;
            while j < chars.len() && is_run_char(chars[j]) {
                j += 1;
            }
            if j == i + 1 {
                out.push(&c.to_string(), level);
                return i + 1;
            }
            let run: String = chars[i + 1..j].iter().collect();
            out.push(&run, script);
            j
        }
        'x' | 'y' | 'z' | 'w' if !prev_alnum => {
            let mut j = i + 1;
            while j < chars.len() && chars[j].is_ascii_digit() {
                j += 1;
            }
            let ends_word = j >= chars.len() || !chars[j].is_alphabetic();
            let indexed =
                j > i + 1 && ends_word && (c != 'w' || (j == i + 2 && chars[i + 1] == '0'));
            out.push(&c.to_string(), level);
            if indexed {
                let index: String = chars[i + 1..j].iter().collect();
                let lowered = if level == Level::Base {
                    Level::Sub
                } else {
                    level
                };
                out.push(&index, lowered);
                return j;
            }
            i + 1
        }
        '*' if how == MathText::Poly => {
            if out.last_char().is_some_and(|p| p.is_ascii_digit())
                && chars.get(i + 1).is_some_and(|n| n.is_alphabetic())
                && fraction_before(chars, i)
            {
                out.push(" ", level);
            }
            i + 1
        }
        ' ' if how == MathText::Poly || level != Level::Base => {
            let before = out.last_char();
            let after = chars[i + 1..].iter().find(|c| **c != ' ').copied();
            let keep = level == Level::Base
                && (before.is_some_and(is_operator)
                    || after.is_some_and(is_operator)
                    || (before.is_some_and(|b| b.is_ascii_digit()) && fraction_before(chars, i)));
            if keep && before != Some(' ') {
                out.push(" ", level);
            }
            i + 1
        }
        '-' if how == MathText::Poly => {
            out.push("−", level);
            i + 1
        }
        _ => {
            out.push(&c.to_string(), level);
            i + 1
        }
    }
}

/// Whether the number just before `i` is a fraction (`3/2`): a space then
/// stays between it and the monomial, which reads 3/2 x₁, not 3/2x₁.
fn fraction_before(chars: &[char], i: usize) -> bool {
    let mut j = i;
    while j > 0 && (chars[j - 1].is_ascii_digit() || chars[j - 1] == '/') {
        j -= 1;
        if chars[j] == '/' {
            return true;
        }
    }
    false
}

/// The index of the `}` closing the `{` at `open`, if there is one.
fn matching_brace(chars: &[char], open: usize) -> Option<usize> {
    let mut depth = 0usize;
    for (k, &c) in chars.iter().enumerate().skip(open) {
        match c {
            '{' => depth += 1,
            '}' => {
                depth -= 1;
                if depth == 0 {
                    return Some(k);
                }
            }
            _ => {}
        }
    }
    None
}

/// The text with the scripts' braces and markers gone (what a reader of the
/// typeset form sees, letter for letter): `a^h_w` is `ahw`.
pub fn flat(text: &str, how: MathText) -> String {
    pieces(text, how).into_iter().map(|p| p.text).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn seen(text: &str, how: MathText) -> Vec<(String, Level)> {
        pieces(text, how)
            .into_iter()
            .map(|p| (p.text, p.level))
            .collect()
    }

    fn v(list: &[(&str, Level)]) -> Vec<(String, Level)> {
        list.iter().map(|(s, l)| (s.to_string(), *l)).collect()
    }

    use Level::{Base, Sub, Sup};

    #[test]
    fn a_monomial_as_printed() {
        let want = v(&[("x", Base), ("2", Sub), ("2", Sup), ("x", Base), ("3", Sub)]);
        assert_eq!(seen("x2^2*x3", MathText::Poly), want);
        assert_eq!(seen("x2^2 x3", MathText::Poly), want);
    }

    #[test]
    fn coefficients_and_signs_of_a_polynomial() {
        assert_eq!(
            seen("-3/2*x1 + x12^10", MathText::Poly),
            v(&[
                ("−3/2 x", Base),
                ("1", Sub),
                (" + x", Base),
                ("12", Sub),
                ("10", Sup)
            ])
        );
        assert_eq!(
            seen("2 x1 x2 - x3", MathText::Poly),
            v(&[
                ("2x", Base),
                ("1", Sub),
                ("x", Base),
                ("2", Sub),
                (" − x", Base),
                ("3", Sub)
            ])
        );
        assert_eq!(seen("0", MathText::Poly), v(&[("0", Base)]));
    }

    #[test]
    fn indexed_symbols() {
        assert_eq!(
            seen("a^h_w", MathText::Symbol),
            v(&[("a", Base), ("h", Sup), ("w", Sub)])
        );
        assert_eq!(
            seen("σ_{w0 w}", MathText::Symbol),
            v(&[("σ", Base), ("w0w", Sub)])
        );
        assert_eq!(
            seen("DS_h(f) = 3", MathText::Symbol),
            v(&[("DS", Base), ("h", Sub), ("(f) = 3", Base)])
        );
        assert_eq!(
            seen("S_1432", MathText::Symbol),
            v(&[("S", Base), ("1432", Sub)])
        );
        assert_eq!(
            seen("m_{(2,1,1)}", MathText::Symbol),
            v(&[("m", Base), ("(2,1,1)", Sub)])
        );
        assert_eq!(
            seen("w0 of S_∞", MathText::Symbol),
            v(&[("w", Base), ("0", Sub), (" of S", Base), ("∞", Sub)])
        );
    }

    #[test]
    fn words_and_lone_marks_stay_as_they_are() {
        // a word containing x or w, a trailing mark, an unclosed brace
        for plain in ["wx2a", "box2", "max", "a_", "a^{b", "w12", "Fl5"] {
            assert_eq!(
                flat(plain, MathText::Symbol),
                plain,
                "{plain} changed letters"
            );
        }
        assert!(!has_scripts("12345"));
        assert!(!has_scripts("-3/2"));
        assert!(has_scripts("x2 x3^2"));
        assert!(has_scripts("Vol P_λ(t)"));
        assert_eq!(label_reading("x2 x3^2"), Some(MathText::Poly));
        assert_eq!(label_reading("a^h_w"), Some(MathText::Symbol));
        assert_eq!(label_reading("-3/2"), None);
        assert_eq!(label_reading("1 2 3"), None);
    }
}
