//! Arithmetic modulo the Mersenne prime p = 2^61 − 1, by shifts and adds (no division),
//! and a lookup from the monomials of one degree to their positions.
//!
//! A product a·b < 2^122 splits as hi·2^61 + lo with lo, hi < 2^61, and 2^61 ≡ 1 (mod p),
//! so a·b ≡ hi + lo, one conditional subtraction away from its residue.

use crate::poly::mono::Mono;
use std::collections::HashMap;
use std::hash::{BuildHasherDefault, Hasher};

/// The prime 2^61 − 1.
pub const PRIME: u64 = (1 << 61) - 1;

/// a·b mod p for a, b < p.
///
/// ```
/// use elbowroom_math::quotient::modp::{PRIME, mul_mod};
/// // (p − 1)^2 = (−1)^2 = 1, and 2^60 · 2 = 2^61 ≡ 1
/// assert_eq!(mul_mod(PRIME - 1, PRIME - 1), 1);
/// assert_eq!(mul_mod(1 << 60, 2), 1);
/// ```
#[inline]
pub fn mul_mod(a: u64, b: u64) -> u64 {
    let x = a as u128 * b as u128;
    let s = (x as u64 & PRIME) + (x >> 61) as u64;
    if s >= PRIME { s - PRIME } else { s }
}

/// a + b mod p for a, b < p.
#[inline]
pub fn add_mod(a: u64, b: u64) -> u64 {
    let s = a + b;
    if s >= PRIME { s - PRIME } else { s }
}

/// a − b mod p for a, b < p.
#[inline]
pub fn sub_mod(a: u64, b: u64) -> u64 {
    if a >= b { a - b } else { a + PRIME - b }
}

/// The inverse of a ≠ 0 modulo p (Fermat: a^(p−2)).
pub fn inv_mod(a: u64) -> u64 {
    let (mut base, mut e, mut acc) = (a, PRIME - 2, 1u64);
    while e > 0 {
        if e & 1 == 1 {
            acc = mul_mod(acc, base);
        }
        base = mul_mod(base, base);
        e >>= 1;
    }
    acc
}

/// The residue of an integer.
#[inline]
pub fn to_mod(x: i128) -> u64 {
    x.rem_euclid(PRIME as i128) as u64
}

/// The integer in (−p/2, p/2) congruent to x.
#[inline]
pub fn lift(x: u64) -> i128 {
    if x > PRIME / 2 {
        x as i128 - PRIME as i128
    } else {
        x as i128
    }
}

/// A hasher for packed monomials: one multiply and a fold (the keys are not chosen by an
/// adversary: they are the monomials of one degree).
#[derive(Default)]
pub struct MonoHasher(u64);

impl Hasher for MonoHasher {
    fn finish(&self) -> u64 {
        self.0
    }
    fn write(&mut self, bytes: &[u8]) {
        for &b in bytes {
            self.0 = (self.0 ^ b as u64).wrapping_mul(0x100_0000_01b3);
        }
    }
    fn write_u128(&mut self, x: u128) {
        let h =
            ((x as u64) ^ ((x >> 64) as u64).rotate_left(29)).wrapping_mul(0x9e37_79b9_7f4a_7c15);
        self.0 = h ^ (h >> 31);
    }
}

/// A map keyed by monomials, hashed by [`MonoHasher`].
pub type MonoMap<V> = HashMap<Mono, V, BuildHasherDefault<MonoHasher>>;

/// The monomials of one degree in n variables, increasing lex order, with their positions.
pub struct DegreeIndex {
    /// The monomials, increasing lex order.
    pub monos: Vec<Mono>,
    index: MonoMap<u32>,
}

impl DegreeIndex {
    /// The monomials of degree d in n variables.
    pub fn new(n: usize, d: u32) -> DegreeIndex {
        let mut monos = crate::poly::compositions::monomials_of_degree(n, d);
        monos.sort_unstable();
        let index = monos
            .iter()
            .enumerate()
            .map(|(i, &m)| (m, i as u32))
            .collect();
        DegreeIndex { monos, index }
    }

    /// The position of m, if it has this degree.
    #[inline]
    pub fn position(&self, m: Mono) -> Option<u32> {
        self.index.get(&m).copied()
    }
}
