//! Monomials x_1^{e_1} ... x_n^{e_n} packed into one `u128`.
//!
//! Eight bits per variable, x_1 in the most significant byte, so comparing the
//! packed integers compares exponent vectors lexicographically with
//! x_1 > x_2 > ... (the lex order), and multiplying monomials is an addition.

use std::fmt;

/// The largest number of variables a packed monomial holds.
pub const MAX_VARS: usize = 16;
/// The largest exponent of one variable.
pub const MAX_EXP: u32 = 255;

const HIGH_BITS: u128 = 0x8080_8080_8080_8080_8080_8080_8080_8080;

/// A monomial in at most [`MAX_VARS`] variables; variable i (0-based) is byte 15 - i.
#[derive(Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Default)]
pub struct Mono(pub u128);

impl Mono {
    /// The monomial 1.
    pub const ONE: Mono = Mono(0);

    #[inline]
    fn shift(i: usize) -> u32 {
        (8 * (MAX_VARS - 1 - i)) as u32
    }

    /// Builds x^e from an exponent vector; `None` if it has more than 16 entries or one above 255.
    pub fn from_exps(exps: &[u32]) -> Option<Mono> {
        if exps.len() > MAX_VARS {
            return None;
        }
        let mut m = 0u128;
        for (i, &e) in exps.iter().enumerate() {
            if e > MAX_EXP {
                return None;
            }
            m |= (e as u128) << Self::shift(i);
        }
        Some(Mono(m))
    }

    /// The variable x_{i+1}, by its 0-based index i (so `var_index(0)` is x_1).
    pub fn var_index(i: usize) -> Mono {
        Mono(1u128 << Self::shift(i))
    }

    /// The exponent of variable i (0-based).
    #[inline]
    pub fn exp(self, i: usize) -> u32 {
        ((self.0 >> Self::shift(i)) & 0xff) as u32
    }

    /// Sets the exponent of variable i (0-based); e must be at most 255.
    #[inline]
    pub fn with_exp(self, i: usize, e: u32) -> Mono {
        debug_assert!(e <= MAX_EXP);
        let s = Self::shift(i);
        Mono((self.0 & !(0xffu128 << s)) | ((e as u128) << s))
    }

    /// The exponent vector of the first `nvars` variables.
    pub fn exps(self, nvars: usize) -> Vec<u32> {
        (0..nvars).map(|i| self.exp(i)).collect()
    }

    /// The monomial as text in the first `nvars` variables (see [`exponents_text`]).
    pub fn text(self, nvars: usize) -> String {
        exponents_text(&self.exps(nvars))
    }

    /// The total degree.
    pub fn degree(self) -> u32 {
        (0..MAX_VARS).map(|i| self.exp(i)).sum()
    }

    /// The product, or `None` when an exponent would exceed 255.
    #[inline]
    pub fn checked_mul(self, other: Mono) -> Option<Mono> {
        if (self.0 | other.0) & HIGH_BITS == 0 {
            return Some(Mono(self.0 + other.0));
        }
        let mut out = Mono(0);
        for i in 0..MAX_VARS {
            let e = self.exp(i) + other.exp(i);
            if e > MAX_EXP {
                return None;
            }
            out = out.with_exp(i, e);
        }
        Some(out)
    }

    /// Whether `self` divides `other`.
    pub fn divides(self, other: Mono) -> bool {
        (0..MAX_VARS).all(|i| self.exp(i) <= other.exp(i))
    }

    /// self / divisor, assuming `divisor` divides `self`.
    pub fn divided_by(self, divisor: Mono) -> Mono {
        Mono(self.0 - divisor.0)
    }

    /// The monomial with variables renamed: variable i goes to `map[i]` (0-based).
    pub fn rename(self, map: &[usize]) -> Mono {
        let mut out = Mono(0);
        for (i, &j) in map.iter().enumerate() {
            let e = self.exp(i);
            if e > 0 {
                out = out.with_exp(j, out.exp(j) + e);
            }
        }
        out
    }

    /// Swaps variables i and j (0-based).
    pub fn swap(self, i: usize, j: usize) -> Mono {
        let (a, b) = (self.exp(i), self.exp(j));
        self.with_exp(i, b).with_exp(j, a)
    }
}

impl fmt::Debug for Mono {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let last = (0..MAX_VARS)
            .rev()
            .find(|&i| self.exp(i) > 0)
            .map_or(0, |i| i + 1);
        write!(f, "x^{:?}", self.exps(last))
    }
}

/// `x1^2 x3` for the exponents [2, 0, 1]; `1` for the zero vector.
///
/// ```
/// use elbowroom_math::poly::mono::exponents_text;
/// assert_eq!(exponents_text(&[2, 0, 1]), "x1^2 x3");
/// assert_eq!(exponents_text(&[0, 0]), "1");
/// ```
pub fn exponents_text(exps: &[u32]) -> String {
    let parts: Vec<String> = exps
        .iter()
        .enumerate()
        .filter(|&(_, &e)| e > 0)
        .map(|(i, &e)| {
            if e == 1 {
                format!("x{}", i + 1)
            } else {
                format!("x{}^{e}", i + 1)
            }
        })
        .collect();
    if parts.is_empty() {
        "1".to_string()
    } else {
        parts.join(" ")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn packing_orders_lexicographically() {
        let a = Mono::from_exps(&[1, 0, 5]).unwrap();
        let b = Mono::from_exps(&[0, 9, 9]).unwrap();
        assert!(a > b);
        assert_eq!(a.checked_mul(b).unwrap().exps(3), vec![1, 9, 14]);
        let big = Mono::from_exps(&[200]).unwrap();
        assert!(big.checked_mul(big).is_none());
        assert_eq!(
            Mono::from_exps(&[100])
                .unwrap()
                .checked_mul(Mono::from_exps(&[155]).unwrap())
                .unwrap()
                .exp(0),
            255
        );
    }
}
