//! Polynomials in one variable q with big-integer coefficients: q-integers
//! [k]_q = 1 + q + ⋯ + q^{k−1}, q-factorials, exact division, and the shape
//! tests (palindromic, unimodal) the q-analogues are checked against.

use num_bigint::BigInt;
use num_traits::{One, Signed, Zero};
use std::fmt;

/// Σ_k c_k q^k with exact integer coefficients, stored by power of q with no
/// trailing zeros (the zero polynomial has no coefficients).
#[derive(Clone, Debug, PartialEq, Eq, Default, Hash)]
pub struct QPoly {
    coeffs: Vec<BigInt>,
}

impl QPoly {
    /// The polynomial with these coefficients, c_0 first.
    pub fn from_coeffs(coeffs: Vec<BigInt>) -> QPoly {
        let mut p = QPoly { coeffs };
        p.trim();
        p
    }

    /// The constant `c`.
    pub fn constant(c: BigInt) -> QPoly {
        QPoly::from_coeffs(vec![c])
    }

    /// c · q^k.
    pub fn monomial(c: BigInt, k: usize) -> QPoly {
        let mut coeffs = vec![BigInt::zero(); k];
        coeffs.push(c);
        QPoly::from_coeffs(coeffs)
    }

    /// The q-integer [k]_q = 1 + q + ⋯ + q^{k−1} ([0]_q = 0).
    pub fn q_integer(k: usize) -> QPoly {
        QPoly::from_coeffs(vec![BigInt::one(); k])
    }

    /// The q-factorial [k]_q! = [1]_q [2]_q ⋯ [k]_q.
    pub fn q_factorial(k: usize) -> QPoly {
        (1..=k).fold(QPoly::constant(BigInt::one()), |acc, i| {
            acc.mul(&QPoly::q_integer(i))
        })
    }

    fn trim(&mut self) {
        while self.coeffs.last().is_some_and(|c| c.is_zero()) {
            self.coeffs.pop();
        }
    }

    /// The coefficients c_0, c_1, … (empty for zero).
    pub fn coeffs(&self) -> &[BigInt] {
        &self.coeffs
    }

    /// Whether this is the zero polynomial.
    pub fn is_zero(&self) -> bool {
        self.coeffs.is_empty()
    }

    /// The degree (None for zero).
    pub fn degree(&self) -> Option<usize> {
        self.coeffs.len().checked_sub(1)
    }

    /// The sum of two polynomials.
    pub fn add(&self, other: &QPoly) -> QPoly {
        let len = self.coeffs.len().max(other.coeffs.len());
        let coeffs = (0..len)
            .map(|k| {
                self.coeffs.get(k).cloned().unwrap_or_default()
                    + other.coeffs.get(k).cloned().unwrap_or_default()
            })
            .collect();
        QPoly::from_coeffs(coeffs)
    }

    /// The product of two polynomials.
    pub fn mul(&self, other: &QPoly) -> QPoly {
        if self.is_zero() || other.is_zero() {
            return QPoly::default();
        }
        let mut coeffs = vec![BigInt::zero(); self.coeffs.len() + other.coeffs.len() - 1];
        for (i, a) in self.coeffs.iter().enumerate() {
            for (j, b) in other.coeffs.iter().enumerate() {
                coeffs[i + j] += a * b;
            }
        }
        QPoly::from_coeffs(coeffs)
    }

    /// This polynomial times the integer `c`.
    pub fn scale(&self, c: &BigInt) -> QPoly {
        QPoly::from_coeffs(self.coeffs.iter().map(|a| a * c).collect())
    }

    /// The exact quotient by `divisor`, whose leading coefficient must divide
    /// every step; `None` when the division leaves a remainder (or is not exact over ℤ).
    pub fn div_exact(&self, divisor: &QPoly) -> Option<QPoly> {
        let d = divisor.degree()?;
        let lead = &divisor.coeffs[d];
        let mut rest = self.coeffs.clone();
        if rest.len() <= d {
            return if self.is_zero() {
                Some(QPoly::default())
            } else {
                None
            };
        }
        let mut quotient = vec![BigInt::zero(); rest.len() - d];
        for k in (0..quotient.len()).rev() {
            let top = &rest[k + d];
            if top.is_zero() {
                continue;
            }
            if !(top % lead).is_zero() {
                return None;
            }
            let f = top / lead;
            for (j, b) in divisor.coeffs.iter().enumerate() {
                rest[k + j] -= &f * b;
            }
            quotient[k] = f;
        }
        if rest.iter().all(|c| c.is_zero()) {
            Some(QPoly::from_coeffs(quotient))
        } else {
            None
        }
    }

    /// The value at q = 1 (the sum of the coefficients).
    pub fn at_one(&self) -> BigInt {
        self.coeffs.iter().sum()
    }

    /// Whether every coefficient is ≥ 0.
    pub fn is_nonnegative(&self) -> bool {
        self.coeffs.iter().all(|c| !c.is_negative())
    }

    /// Whether the coefficients read the same from the lowest nonzero one to the highest.
    pub fn is_palindromic(&self) -> bool {
        let Some(low) = self.coeffs.iter().position(|c| !c.is_zero()) else {
            return true;
        };
        let c = &self.coeffs[low..];
        c.iter().eq(c.iter().rev())
    }

    /// Whether the coefficients rise weakly and then fall weakly (no interior zeros).
    pub fn is_unimodal(&self) -> bool {
        let Some(low) = self.coeffs.iter().position(|c| !c.is_zero()) else {
            return true;
        };
        let c = &self.coeffs[low..];
        let mut k = 1;
        while k < c.len() && c[k] >= c[k - 1] {
            k += 1;
        }
        while k < c.len() && c[k] <= c[k - 1] {
            k += 1;
        }
        k == c.len() && c.iter().all(|x| !x.is_zero())
    }

    /// The coefficients as decimal strings (the JSON shape of a q-polynomial).
    pub fn coeff_strings(&self) -> Vec<String> {
        self.coeffs.iter().map(|c| c.to_string()).collect()
    }
}

impl fmt::Display for QPoly {
    /// Plain text, lowest power first: `q + 2q^2 + q^3 + q^4`, `0` for zero.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.is_zero() {
            return write!(f, "0");
        }
        let mut first = true;
        for (k, c) in self.coeffs.iter().enumerate() {
            if c.is_zero() {
                continue;
            }
            let sign = if c.is_negative() { "-" } else { "+" };
            if first {
                if c.is_negative() {
                    write!(f, "-")?;
                }
            } else {
                write!(f, " {sign} ")?;
            }
            first = false;
            let a = c.abs();
            let unit = a.is_one();
            match (k, unit) {
                (0, _) => write!(f, "{a}")?,
                (1, true) => write!(f, "q")?,
                (1, false) => write!(f, "{a}q")?,
                (_, true) => write!(f, "q^{k}")?,
                (_, false) => write!(f, "{a}q^{k}")?,
            }
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn p(v: &[i64]) -> QPoly {
        QPoly::from_coeffs(v.iter().map(|&c| BigInt::from(c)).collect())
    }

    #[test]
    fn q_factorial_at_one_is_the_factorial() {
        // [k]_q! at q = 1 is k!; its degree is C(k, 2) (the inversions of w0)
        let f = QPoly::q_factorial(5);
        assert_eq!(f.at_one(), BigInt::from(120));
        assert_eq!(f.degree(), Some(10));
        // Mahonian numbers for n = 4 (OEIS A008302): 1 3 5 6 5 3 1
        assert_eq!(QPoly::q_factorial(4), p(&[1, 3, 5, 6, 5, 3, 1]));
    }

    #[test]
    fn exact_division_and_remainders() {
        let f = QPoly::q_factorial(4);
        assert_eq!(
            f.div_exact(&QPoly::q_integer(4)),
            Some(QPoly::q_factorial(3))
        );
        assert_eq!(p(&[1, 0, 1]).div_exact(&p(&[1, 1])), None);
        assert_eq!(p(&[0, 1, 2, 1, 1]).to_string(), "q + 2q^2 + q^3 + q^4");
        assert!(p(&[0, 1, 2, 1]).is_palindromic());
        assert!(p(&[1, 3, 2, 2]).is_unimodal());
        assert!(!p(&[1, 3, 1, 2]).is_unimodal());
    }
}
