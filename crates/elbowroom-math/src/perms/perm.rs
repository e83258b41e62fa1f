//! Permutations in one-line notation, with their Lehmer codes, lengths and
//! products with simple transpositions.
//!
//! Conventions: w = w(1)...w(n), 1-based; ℓ(w) is the number of inversions;
//! the Lehmer code is c_i = #{j > i : w(j) < w(i)}; s_i swaps i and i+1, and
//! w·s_i swaps the entries in positions i and i+1 while s_i·w swaps the values
//! i and i+1. A word a_1...a_l stands for s_{a_1} s_{a_2} ... s_{a_l}.

use crate::error::{MathError, MathResult};
use crate::perms::arrangement::next_arrangement;
use std::fmt;

/// The largest n supported (so that polynomials in x_1..x_n fit a packed monomial).
pub const MAX_N: usize = 16;

/// A permutation of {1, ..., n} in one-line notation (values are 1-based).
#[derive(Clone, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub struct Perm {
    values: Vec<u8>,
}

impl Perm {
    /// The identity of S_n.
    pub fn identity(n: usize) -> Perm {
        Perm {
            values: (1..=n as u8).collect(),
        }
    }

    /// The longest element w0 = n (n-1) ... 1 of S_n.
    pub fn longest(n: usize) -> Perm {
        Perm {
            values: (1..=n as u8).rev().collect(),
        }
    }

    /// Builds a permutation from its one-line notation, checking that it is one.
    pub fn from_one_line(values: &[usize]) -> MathResult<Perm> {
        let n = values.len();
        if n == 0 {
            return Err(MathError::InvalidPermutation(
                "empty; give the values w(1)...w(n), for example 31524".into(),
            ));
        }
        if n > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "n = {n}; permutations of size up to {MAX_N} are supported"
            )));
        }
        let mut seen = vec![false; n + 1];
        for &v in values {
            if v == 0 || v > n {
                return Err(MathError::InvalidPermutation(format!(
                    "value {v} is not in 1..{n}; the entries of a permutation of size {n} are 1, ..., {n}, each once"
                )));
            }
            if seen[v] {
                return Err(MathError::InvalidPermutation(format!(
                    "value {v} appears twice; the entries of a permutation of size {n} are 1, ..., {n}, each once"
                )));
            }
            seen[v] = true;
        }
        Ok(Perm {
            values: values.iter().map(|&v| v as u8).collect(),
        })
    }

    /// Parses one-line notation: `31524` (digits, n <= 9), `3 1 5 2 4`, `3,1,5,2,4`
    /// (the comma or space form is needed for n >= 10); brackets are ignored.
    pub fn parse(text: &str) -> MathResult<Perm> {
        let shown = crate::excerpt::excerpt(text);
        let trimmed = text
            .trim()
            .trim_start_matches(['[', '('])
            .trim_end_matches([']', ')'])
            .trim();
        if trimmed.is_empty() {
            return Err(MathError::InvalidPermutation(format!(
                "'{shown}' is empty; accepted: 31524, 3 1 5 2 4 or 3,1,5,2,4"
            )));
        }
        let has_sep = trimmed.contains([',', ' ', '\t']);
        let mut values = Vec::new();
        if has_sep {
            // between two commas there must be an entry: `1,,2` is not 12
            if trimmed.split(',').any(|piece| piece.trim().is_empty()) {
                return Err(MathError::InvalidPermutation(format!(
                    "'{shown}' has an empty entry between commas; accepted: 31524, 3 1 5 2 4 or 3,1,5,2,4"
                )));
            }
            for tok in trimmed.split([',', ' ', '\t']).filter(|t| !t.is_empty()) {
                let v: usize = tok.parse().map_err(|_| {
                    let tok = crate::excerpt::excerpt(tok);
                    MathError::InvalidPermutation(format!(
                        "'{tok}' in '{shown}' is not a positive integer; accepted: 31524, 3 1 5 2 4 or 3,1,5,2,4"
                    ))
                })?;
                values.push(v);
            }
        } else {
            for ch in trimmed.chars() {
                let Some(d) = ch.to_digit(10) else {
                    let ch = crate::excerpt::excerpt(&ch.to_string());
                    return Err(MathError::InvalidPermutation(format!(
                        "'{ch}' in '{shown}' is not a digit; accepted: 31524, 3 1 5 2 4 or 3,1,5,2,4"
                    )));
                };
                values.push(d as usize);
            }
        }
        Perm::from_one_line(&values).map_err(|e| annotate(e, &format!("in '{shown}'")))
    }

    /// Builds the permutation of S_n with Lehmer code `code` (c_i <= n - i).
    /// Trailing entries may be omitted; n defaults to the smallest size that fits.
    pub fn from_code(code: &[usize], n: Option<usize>) -> MathResult<Perm> {
        let needed = code
            .iter()
            .enumerate()
            .map(|(i, &c)| if c > 0 { i + 1 + c } else { 0 })
            .max()
            .unwrap_or(0)
            .max(code.len())
            .max(1);
        let n = n.unwrap_or(needed);
        if n < needed {
            return Err(MathError::InvalidPermutation(format!(
                "code {code:?} needs n >= {needed}; a Lehmer code has c_i <= n - i"
            )));
        }
        if n > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "n = {n}; permutations of size up to {MAX_N} are supported"
            )));
        }
        let mut remaining: Vec<usize> = (1..=n).collect();
        let mut values = Vec::with_capacity(n);
        for i in 0..n {
            let c = code.get(i).copied().unwrap_or(0);
            if c >= remaining.len() {
                return Err(MathError::InvalidPermutation(format!(
                    "code entry c_{} = {c} is too large; a Lehmer code of size {n} has c_i <= n - i",
                    i + 1
                )));
            }
            values.push(remaining.remove(c));
        }
        Perm::from_one_line(&values)
    }

    /// Builds s_{a_1} ... s_{a_l} in S_n (n defaults to max a + 1) and checks the word is reduced.
    pub fn from_reduced_word(word: &[usize], n: Option<usize>) -> MathResult<Perm> {
        let perm = Perm::from_word(word, n)?;
        if perm.length() != word.len() {
            return Err(MathError::InvalidPermutation(format!(
                "the word {word:?} is not reduced: it has {} letters but its product has length {}",
                word.len(),
                perm.length()
            )));
        }
        Ok(perm)
    }

    /// The product s_{a_1} ... s_{a_l} in S_n, reduced or not.
    pub fn from_word(word: &[usize], n: Option<usize>) -> MathResult<Perm> {
        let needed = word.iter().copied().max().map_or(1, |m| m + 1);
        let n = n.unwrap_or(needed);
        if word.iter().any(|&a| a == 0 || a >= n) {
            return Err(MathError::InvalidPermutation(format!(
                "the word {word:?} has a letter outside 1..{}; in S_{n} the letters are 1, ..., n-1",
                n.saturating_sub(1)
            )));
        }
        let mut perm = Perm::identity(n);
        if n > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "n = {n}; permutations of size up to {MAX_N} are supported"
            )));
        }
        for &a in word {
            perm.values.swap(a - 1, a);
        }
        Ok(perm)
    }

    /// The size n.
    pub fn n(&self) -> usize {
        self.values.len()
    }

    /// w(i) for 1 <= i <= n.
    pub fn at(&self, i: usize) -> usize {
        self.values[i - 1] as usize
    }

    /// The one-line notation as 1-based values.
    pub fn one_line(&self) -> Vec<usize> {
        self.values.iter().map(|&v| v as usize).collect()
    }

    /// The one-line notation as raw bytes (1-based values).
    pub fn as_bytes(&self) -> &[u8] {
        &self.values
    }

    /// ℓ(w), the number of inversions.
    pub fn length(&self) -> usize {
        self.code().iter().sum()
    }

    /// The Lehmer code c_i = #{j > i : w(j) < w(i)}.
    pub fn code(&self) -> Vec<usize> {
        let v = &self.values;
        (0..v.len())
            .map(|i| v[i + 1..].iter().filter(|&&x| x < v[i]).count())
            .collect()
    }

    /// The inverse permutation.
    pub fn inverse(&self) -> Perm {
        let mut inv = vec![0u8; self.n()];
        for (i, &v) in self.values.iter().enumerate() {
            inv[v as usize - 1] = (i + 1) as u8;
        }
        Perm { values: inv }
    }

    /// The descents: positions i (1-based) with w(i) > w(i+1).
    pub fn descents(&self) -> Vec<usize> {
        (1..self.n())
            .filter(|&i| self.values[i - 1] > self.values[i])
            .collect()
    }

    /// Whether i is a (right) descent, i.e. ℓ(w s_i) < ℓ(w).
    pub fn has_descent(&self, i: usize) -> bool {
        i >= 1 && i < self.n() && self.values[i - 1] > self.values[i]
    }

    /// w·s_i: swaps the entries in positions i and i+1.
    pub fn times_s(&self, i: usize) -> MathResult<Perm> {
        self.check_letter(i)?;
        let mut p = self.clone();
        p.values.swap(i - 1, i);
        Ok(p)
    }

    /// s_i·w: swaps the values i and i+1.
    pub fn s_times(&self, i: usize) -> MathResult<Perm> {
        self.check_letter(i)?;
        let mut p = self.clone();
        for v in p.values.iter_mut() {
            if *v as usize == i {
                *v += 1;
            } else if *v as usize == i + 1 {
                *v -= 1;
            }
        }
        Ok(p)
    }

    fn check_letter(&self, i: usize) -> MathResult<()> {
        if i == 0 || i >= self.n() {
            return Err(MathError::InvalidInput(format!(
                "s_{i} is not a simple transposition of S_{}; accepted: 1 <= i <= {}",
                self.n(),
                self.n().saturating_sub(1)
            )));
        }
        Ok(())
    }

    /// The product u·v as functions: (u·v)(i) = u(v(i)). Both must lie in the same S_n.
    pub fn compose(&self, v: &Perm) -> MathResult<Perm> {
        if self.n() != v.n() {
            return Err(MathError::InvalidInput(format!(
                "cannot multiply permutations of sizes {} and {}",
                self.n(),
                v.n()
            )));
        }
        Ok(Perm {
            values: v
                .values
                .iter()
                .map(|&j| self.values[j as usize - 1])
                .collect(),
        })
    }

    /// The image of w under S_n ⊂ S_m (fixing n+1, ..., m); m >= n.
    pub fn embed(&self, m: usize) -> MathResult<Perm> {
        if m < self.n() || m > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "cannot embed S_{} in S_{m}; need {} <= m <= {MAX_N}",
                self.n(),
                self.n()
            )));
        }
        let mut values = self.values.clone();
        values.extend(self.n() as u8 + 1..=m as u8);
        Ok(Perm { values })
    }

    /// The smallest n' such that w fixes everything beyond n' (at least 1).
    pub fn support_size(&self) -> usize {
        let mut m = self.n();
        while m > 1 && self.values[m - 1] as usize == m {
            m -= 1;
        }
        m
    }

    /// Restricts to S_m when w fixes m+1, ..., n.
    pub fn restrict(&self, m: usize) -> Option<Perm> {
        if m == 0 || m > self.n() || self.support_size() > m {
            return None;
        }
        Some(Perm {
            values: self.values[..m].to_vec(),
        })
    }

    /// All permutations of S_n in lexicographic order of their one-line notation.
    pub fn all(n: usize) -> AllPerms {
        AllPerms {
            next: Some(Perm::identity(n)),
        }
    }

    /// The next permutation in lexicographic order, if any.
    pub fn next_lex(&self) -> Option<Perm> {
        let mut values = self.values.clone();
        next_arrangement(&mut values).then_some(Perm { values })
    }
}

/// Iterator over S_n in lexicographic order.
pub struct AllPerms {
    next: Option<Perm>,
}

impl Iterator for AllPerms {
    type Item = Perm;
    fn next(&mut self) -> Option<Perm> {
        let cur = self.next.take()?;
        self.next = cur.next_lex();
        Some(cur)
    }
}

fn annotate(e: MathError, context: &str) -> MathError {
    match e {
        MathError::InvalidPermutation(m) => {
            MathError::InvalidPermutation(format!("{m} ({context})"))
        }
        MathError::OutOfRange(m) => MathError::OutOfRange(format!("{m} ({context})")),
        other => other,
    }
}

impl fmt::Display for Perm {
    /// One-line notation: digits run together for n <= 9, commas otherwise.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.n() <= 9 {
            for v in &self.values {
                write!(f, "{v}")?;
            }
            Ok(())
        } else {
            let parts: Vec<String> = self.values.iter().map(|v| v.to_string()).collect();
            write!(f, "{}", parts.join(","))
        }
    }
}

impl fmt::Debug for Perm {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "Perm({self})")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn parse_forms_agree() {
        let a = Perm::parse("31524").unwrap();
        assert_eq!(Perm::parse("3 1 5 2 4").unwrap(), a);
        assert_eq!(Perm::parse("3,1,5,2,4").unwrap(), a);
        assert_eq!(Perm::parse("[3, 1, 5, 2, 4]").unwrap(), a);
        assert!(Perm::parse("3155").is_err());
        assert!(Perm::parse("31a").is_err());
        assert!(Perm::parse("").is_err());
        assert!(Perm::parse("10,1,2,3,4,5,6,7,8,9").is_ok());
    }

    #[test]
    fn code_length_inverse() {
        let w = Perm::parse("31524").unwrap();
        assert_eq!(w.code(), vec![2, 0, 2, 0, 0]);
        assert_eq!(w.length(), 4);
        assert_eq!(Perm::from_code(&[2, 0, 2], Some(5)).unwrap(), w);
        assert_eq!(w.compose(&w.inverse()).unwrap(), Perm::identity(5));
        assert_eq!(w.descents(), vec![1, 3]);
    }

    #[test]
    fn words_and_products() {
        // w = s_2 s_1 : positions: start 123, swap pos 2 -> 132, swap pos 1 -> 312
        let w = Perm::from_reduced_word(&[2, 1], Some(3)).unwrap();
        assert_eq!(w, Perm::parse("312").unwrap());
        assert!(Perm::from_reduced_word(&[1, 1], Some(3)).is_err());
        assert_eq!(w.times_s(1).unwrap(), Perm::parse("132").unwrap());
        assert_eq!(w.s_times(1).unwrap(), Perm::parse("321").unwrap());
    }

    #[test]
    fn lex_enumeration_counts() {
        assert_eq!(Perm::all(5).count(), 120);
    }
}
