//! Quasisymmetric polynomials in x_1..x_n: the monomial basis M_α and the
//! fundamental basis F_α (Gessel 1984), indexed by compositions α.
//!
//! - M_α(x_1..x_n) = Σ_{i_1 < ... < i_k} x_{i_1}^{α_1} ... x_{i_k}^{α_k}, zero when α has more than n parts.
//! - F_α(x_1..x_n) = Σ x_{j_1} x_{j_2} ... x_{j_d} over j_1 <= ... <= j_d (d = |α|) with a strict
//!   ascent j_s < j_{s+1} wherever s is a partial sum α_1 + ... + α_r < d.
//!
//! The two are computed independently here; Gessel's identity F_α = Σ_{β refines α} M_β
//! is checked in the tests.

use crate::error::{MathError, MathResult};
use crate::poly::compositions::compositions;
use crate::poly::mono::{MAX_EXP, MAX_VARS, Mono};
use crate::poly::polynomial::{IntPoly, PolyBuilder, RatPoly};
use num_bigint::BigInt;
use num_traits::One;

/// Checks that α is a composition (positive parts) usable in n variables.
fn check_composition(alpha: &[u32], nvars: usize) -> MathResult<()> {
    if nvars == 0 || nvars > MAX_VARS {
        return Err(MathError::OutOfRange(format!(
            "{nvars} variables; between 1 and {MAX_VARS} are supported"
        )));
    }
    if alpha.is_empty() {
        return Err(MathError::InvalidInput(
            "a composition needs at least one part, as in M(2,1)".into(),
        ));
    }
    if let Some(p) = alpha.iter().find(|&&p| p == 0 || p > MAX_EXP) {
        return Err(MathError::InvalidInput(format!(
            "the composition ({}) has the part {p}; parts are whole numbers from 1 to {MAX_EXP}",
            join(alpha)
        )));
    }
    Ok(())
}

fn join(alpha: &[u32]) -> String {
    alpha
        .iter()
        .map(|p| p.to_string())
        .collect::<Vec<_>>()
        .join(",")
}

/// The monomial quasisymmetric polynomial M_α in x_1..x_n.
///
/// ```
/// use elbowroom_math::poly::quasisym::monomial_qsym;
/// // M_(2,1)(x1,x2,x3) = Σ_{i<j} x_i^2 x_j
/// let m = monomial_qsym(&[2, 1], 3).unwrap();
/// assert_eq!(m.to_text(), "x1^2 x2 + x1^2 x3 + x2^2 x3");
/// ```
pub fn monomial_qsym(alpha: &[u32], nvars: usize) -> MathResult<IntPoly> {
    check_composition(alpha, nvars)?;
    let mut b = PolyBuilder::new(nvars);
    let one = BigInt::one();
    let k = alpha.len();
    if k <= nvars {
        let mut pos: Vec<usize> = (0..k).collect();
        loop {
            let mut m = Mono::ONE;
            for (&p, &a) in pos.iter().zip(alpha) {
                m = m.with_exp(p, a);
            }
            b.add_term(m, &one);
            // next k-subset of 0..nvars in lex order
            let Some(r) = (0..k).rev().find(|&r| pos[r] < nvars - k + r) else {
                break;
            };
            pos[r] += 1;
            for s in r + 1..k {
                pos[s] = pos[s - 1] + 1;
            }
        }
    }
    Ok(b.build())
}

/// The fundamental quasisymmetric polynomial F_α in x_1..x_n, summed directly over
/// weakly increasing index words with forced strict ascents at the partial sums of α.
///
/// ```
/// use elbowroom_math::poly::quasisym::fundamental_qsym;
/// // F_(1,2)(x1,x2) = Σ x_i x_j x_k over i < j <= k = x1 x2^2 (only i=1, j=k=2)
/// assert_eq!(fundamental_qsym(&[1, 2], 2).unwrap().to_text(), "x1 x2^2");
/// // F_(2) is the complete homogeneous h_2
/// assert_eq!(fundamental_qsym(&[2], 2).unwrap().to_text(), "x1^2 + x1 x2 + x2^2");
/// ```
pub fn fundamental_qsym(alpha: &[u32], nvars: usize) -> MathResult<IntPoly> {
    check_composition(alpha, nvars)?;
    let d: u32 = alpha.iter().sum();
    if d > MAX_EXP {
        return Err(MathError::OutOfRange(format!(
            "the composition ({}) has size {d}; at most {MAX_EXP} is supported",
            join(alpha)
        )));
    }
    // each weakly increasing word of length d gives a different monomial of degree d
    let bound = crate::limits::monomials_of_degree(u64::from(d), nvars as u64);
    if bound > crate::limits::TYPED_TERM_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "F({}) in {nvars} variables may have up to {bound} terms (monomials of degree {d}); at most {} are accepted",
            join(alpha),
            crate::limits::TYPED_TERM_LIMIT
        )));
    }
    // strict[s] = whether the step from letter s to letter s+1 (0-based) must ascend strictly
    let mut strict = vec![false; d as usize];
    let mut acc = 0u32;
    for &p in &alpha[..alpha.len() - 1] {
        acc += p;
        strict[acc as usize - 1] = true;
    }
    let mut b = PolyBuilder::new(nvars);
    let one = BigInt::one();
    let mut word: Vec<usize> = Vec::with_capacity(d as usize);
    fill_words(&strict, nvars, &mut word, Mono::ONE, &mut b, &one);
    Ok(b.build())
}

fn fill_words(
    strict: &[bool],
    nvars: usize,
    word: &mut Vec<usize>,
    m: Mono,
    b: &mut PolyBuilder<BigInt>,
    one: &BigInt,
) {
    let s = word.len();
    if s == strict.len() {
        b.add_term(m, one);
        return;
    }
    let start = match word.last() {
        None => 0,
        Some(&j) if strict[s - 1] => j + 1,
        Some(&j) => j,
    };
    for j in start..nvars {
        word.push(j);
        fill_words(strict, nvars, word, m.with_exp(j, m.exp(j) + 1), b, one);
        word.pop();
    }
}

/// The compositions refining α (obtained by splitting its parts), α itself included.
pub fn refinements(alpha: &[u32]) -> Vec<Vec<u32>> {
    let mut out = vec![Vec::new()];
    for &p in alpha {
        let mut next = Vec::new();
        for prefix in &out {
            for split in compositions(p) {
                let mut v = prefix.clone();
                v.extend(split);
                next.push(v);
            }
        }
        out = next;
    }
    out
}

/// The value of a named atom `M(α)` or `F(α)` in n variables, for the polynomial reader.
pub fn named_atom(name: &str, args: &[usize], nvars: Option<usize>) -> MathResult<RatPoly> {
    let alpha: Vec<u32> = args
        .iter()
        .map(|&a| a.min(u32::MAX as usize) as u32)
        .collect();
    let Some(n) = nvars else {
        return Err(MathError::InvalidInput(format!(
            "{name}(...) needs the number of variables of the computation (give n)"
        )));
    };
    let p = match name {
        "M" => monomial_qsym(&alpha, n)?,
        "F" => fundamental_qsym(&alpha, n)?,
        _ => {
            return Err(MathError::InvalidInput(format!(
                "'{name}(...)' is not known; accepted names are M(a,b,...) and F(a,b,...)"
            )));
        }
    };
    Ok(p.to_rational())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn m_counts_and_vanishing() {
        // M_α(x_1..x_n) has C(n, ℓ(α)) terms, and vanishes when ℓ(α) > n
        assert_eq!(monomial_qsym(&[1, 1, 1], 5).unwrap().len(), 10);
        assert!(monomial_qsym(&[1, 1, 1], 2).unwrap().is_zero());
        assert!(monomial_qsym(&[0, 1], 2).is_err());
        assert!(monomial_qsym(&[], 2).is_err());
    }
}
