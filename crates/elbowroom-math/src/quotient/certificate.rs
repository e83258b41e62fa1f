//! A cheap probabilistic certificate that every generator M_α of J_n reduces to zero
//! modulo a basis {G_c}, i.e. J_n ⊆ (G).
//!
//! # What it proves, and how surely
//! Fix a degree d with 1 <= d < n. The normal form modulo {G_c} computed modulo
//! p = 2^61 − 1 is a linear map N_d: λ ↦ NF(Σ_α λ_α M_α) mod p over the compositions α of
//! d with at most n parts (every G_c has integer coefficients and leading coefficient 1,
//! so division modulo p is division over Z read modulo p). If some M_α of degree d has a
//! normal form that is nonzero modulo p, N_d ≠ 0, and for λ drawn uniformly from
//! F_p^{#α} the probability that N_d(λ) = 0 is at most 1/p < 4.4·10^−19
//! (a nonzero linear form vanishes on a hyperplane). The λ are drawn afresh on every run
//! (a SplitMix64 stream seeded by the standard library's per-process random hash keys),
//! one combination per degree, so a wrong basis passes with probability at most
//! (n − 1)/p over all degrees, unless a normal form is nonzero yet ≡ 0 modulo p in every
//! coefficient (coefficients divisible by 2^61 − 1), which this check cannot see.
//! Degrees >= n need no check: no standard monomial has degree >= n, so every
//! normal form there is 0 whatever the basis.
//!
//! The combination costs one division of a polynomial with all monomials of degree d
//! (the coefficient of x^e is λ at the composition of the nonzero entries of e), instead
//! of 2^(d−1) divisions of the M_α one by one; the exact check of every generator stays
//! in the tests ([`crate::quotient::groebner::QuasiGroebner::check_every_generator`]).
//!
//! Together with (G) ⊆ J_n, which the construction proves exactly, this gives (G) = J_n.

use crate::error::{MathError, MathResult};
use crate::poly::compositions::compositions;
use crate::poly::mono::Mono;
use crate::progress::Progress;
use crate::quotient::division::first_corner;
use crate::quotient::groebner::QuasiGroebner;
use crate::quotient::modp::{DegreeIndex, MonoMap, PRIME, mul_mod, sub_mod};
use rayon::prelude::*;
use std::hash::{BuildHasher, Hasher};

/// SplitMix64 (Steele, Lea, Flood 2014): a stream of 64-bit words from a seed.
struct SplitMix(u64);

impl SplitMix {
    fn next(&mut self) -> u64 {
        self.0 = self.0.wrapping_add(0x9e37_79b9_7f4a_7c15);
        let mut z = self.0;
        z = (z ^ (z >> 30)).wrapping_mul(0xbf58_476d_1ce4_e5b9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94d0_49bb_1331_11eb);
        z ^ (z >> 31)
    }

    /// Uniform in [0, p): the top 61 bits, the one value p itself rejected.
    fn residue(&mut self) -> u64 {
        loop {
            let x = self.next() >> 3;
            if x < PRIME {
                return x;
            }
        }
    }
}

/// A fresh seed: the standard library's random hash keys, drawn per process.
fn fresh_seed(d: u32) -> u64 {
    let mut h = std::collections::hash_map::RandomState::new().build_hasher();
    h.write_u32(d);
    h.finish()
}

/// The composition of the nonzero entries of x^e, packed as a monomial (its entries first).
fn flattened(m: Mono, n: usize) -> Mono {
    let mut out = Mono::ONE;
    let mut k = 0;
    for i in 0..n {
        let e = m.exp(i);
        if e > 0 {
            out = out.with_exp(k, e);
            k += 1;
        }
    }
    out
}

/// The residue of a tail coefficient (|a| < p, as every lifted coefficient is).
#[inline]
fn residue(a: i128) -> u64 {
    crate::quotient::modp::to_mod(a)
}

/// Checks degree d: a random combination of the M_α with |α| = d reduces to zero modulo p.
fn certify_degree(q: &QuasiGroebner, d: u32, seed: u64, progress: &Progress) -> MathResult<()> {
    let n = q.n();
    let mut rng = SplitMix(seed);
    let mut lambda: MonoMap<u64> = MonoMap::default();
    for alpha in compositions(d) {
        if alpha.len() <= n
            && let Some(a) = Mono::from_exps(&alpha)
        {
            lambda.insert(a, rng.residue());
        }
    }
    let idx = DegreeIndex::new(n, d);
    let mut coef: Vec<u64> = idx
        .monos
        .iter()
        .map(|&m| lambda.get(&flattened(m, n)).copied().unwrap_or(0))
        .collect();
    let mut tails_mod: MonoMap<Vec<(Mono, u64)>> = MonoMap::default();
    for i in (0..coef.len()).rev() {
        if i % 4096 == 0 {
            progress.check()?;
        }
        let x = coef[i];
        if x == 0 {
            continue;
        }
        let m = idx.monos[i];
        let Some(c) = first_corner(m, n) else {
            // a standard monomial: every term still to come is smaller, so it stays
            return Err(MathError::InvalidInput(format!(
                "a combination of the generators of degree {d} does not reduce to zero \
                 (it keeps {m:?}); the basis is wrong"
            )));
        };
        let t = m.divided_by(c);
        let tail = tails_mod.entry(c).or_insert_with(|| {
            q.tail(c)
                .unwrap_or(&[])
                .iter()
                .map(|&(s, a)| (s, residue(a)))
                .collect()
        });
        for &(s, a) in tail.iter() {
            let Some(j) = idx.position(Mono(s.0 + t.0)) else {
                return Err(MathError::InvalidInput(format!(
                    "internal: a tail term of {c:?} times {t:?} left degree {d}"
                )));
            };
            let j = j as usize;
            coef[j] = sub_mod(coef[j], mul_mod(x, a));
        }
        coef[i] = 0;
    }
    Ok(())
}

/// The certificate of the module doc for every degree 1..n−1 (degrees in parallel on
/// rayon's pool), counting one unit per degree on `progress`; an error when some random
/// combination keeps a standard monomial.
///
/// ```
/// use elbowroom_math::{progress::Progress, quotient::{certificate::certify, groebner::QuasiGroebner}};
/// let g = QuasiGroebner::compute(5, None).unwrap();
/// assert!(certify(&g, &Progress::new(0)).is_ok());
/// ```
pub fn certify(q: &QuasiGroebner, progress: &Progress) -> MathResult<()> {
    let n = q.n() as u32;
    let degrees: Vec<u32> = (1..n).rev().collect();
    degrees.par_iter().try_for_each(|&d| {
        certify_degree(q, d, fresh_seed(d), progress)?;
        progress.advance(1);
        Ok(())
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_damaged_tail_is_caught() {
        // the basis of J_5 with one tail coefficient changed is no longer a basis of J_5;
        // the certificate must say so (the chance it does not is at most 4/p)
        let good = QuasiGroebner::compute(5, None).unwrap();
        assert!(certify(&good, &Progress::new(0)).is_ok());
        let mut elements = good.elements().to_vec();
        let e = elements.iter_mut().find(|e| !e.tail.is_empty()).unwrap();
        e.tail[0].1 += 1;
        let bad = QuasiGroebner::from_parts(
            5,
            elements,
            QuasiGroebner::standard_basis(5),
            good.rows_used().to_vec(),
        );
        assert!(certify(&bad, &Progress::new(0)).is_err());
    }

    #[test]
    fn splitmix_matches_its_reference_stream() {
        // SplitMix64 seeded with 1234567 (the reference implementation's first outputs,
        // from memory): 6457827717110365317, 3203168211198807973
        let mut r = SplitMix(1234567);
        assert_eq!(r.next(), 6457827717110365317);
        assert_eq!(r.next(), 3203168211198807973);
    }
}
