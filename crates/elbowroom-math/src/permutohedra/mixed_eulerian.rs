//! Mixed Eulerian numbers A_c, for c a weak composition of n-1 into n-1 parts.
//!
//! Indexing: Vol P_λ = Σ_c A_c u^c / c! with u_i = λ_i - λ_{i+1} and c! = Π c_i!.
//! Derivation (following Postnikov, IMRN 2009, §16): with λ_n = 0 (volume is invariant
//! under translation along (1, ..., 1)), λ_i = u_i + ... + u_{n-1}, so
//! Σ_i λ_i x_i = Σ_k u_k y_k with y_k = x_1 + ... + x_k, and by the multinomial theorem
//! (Σ_k u_k y_k)^{n-1} / (n-1)! = Σ_c (u^c / c!) Π_k y_k^{c_k}; hence
//! A_c = DS_n(y_1^{c_1} ... y_{n-1}^{c_{n-1}}).
//!
//! Fast method: a depth-first walk over c_1, c_2, ... that keeps the product
//! y_1^{c_1} ... y_k^{c_k} as a dense coefficient vector over monomials of its degree,
//! shared by every c with that prefix; the last factor y_{n-1}^{c_{n-1}} is folded into
//! precomputed functionals L_k(x^a) = DS_n(x^a y_{n-1}^k), and DS_n itself is Postnikov's
//! descent formula.

use crate::error::{MathError, MathResult};
use crate::hessenberg::divsym::PostnikovFunctional;
use crate::perms::perm::MAX_N;
use crate::poly::compositions::weak_compositions;
use crate::poly::mono::Mono;
use crate::poly::polynomial::IntPoly;
use crate::progress::Progress;
use num_bigint::BigInt;
use rayon::prelude::*;
use std::collections::HashMap;

/// A composition c with its number A_c.
pub type Numbered = (Vec<u32>, BigInt);

/// Monomials of each degree 0..=n-1 in n variables, with the index of a·x_i one degree up.
struct MonomialIndex {
    n: usize,
    by_degree: Vec<Vec<Mono>>,
    /// up[d][t * n + i] = index in degree d+1 of by_degree[d][t] · x_{i+1}
    up: Vec<Vec<u32>>,
}

impl MonomialIndex {
    fn new(n: usize) -> MathResult<Self> {
        let top = n - 1;
        let mut by_degree = Vec::with_capacity(top + 1);
        for d in 0..=top {
            let mut list = Vec::new();
            for e in weak_compositions(d as u32, n) {
                list.push(
                    Mono::from_exps(&e).ok_or_else(|| {
                        MathError::OutOfRange("an exponent would exceed 255".into())
                    })?,
                );
            }
            by_degree.push(list);
        }
        let mut up = Vec::with_capacity(top);
        for d in 0..top {
            let position: HashMap<Mono, u32> = by_degree[d + 1]
                .iter()
                .enumerate()
                .map(|(k, m)| (*m, k as u32))
                .collect();
            let mut table = Vec::with_capacity(by_degree[d].len() * n);
            for m in &by_degree[d] {
                for i in 0..n {
                    let next = Mono(m.0 + Mono::var_index(i).0);
                    table.push(position.get(&next).copied().unwrap_or(0));
                }
            }
            up.push(table);
        }
        Ok(MonomialIndex { n, by_degree, up })
    }

    /// Multiplies a dense vector of degree d by y_k = x_1 + ... + x_k.
    fn times_y(&self, d: usize, k: usize, from: &[u64], to: &mut Vec<u64>) {
        to.clear();
        to.resize(self.by_degree[d + 1].len(), 0);
        let n = self.n;
        for (t, &c) in from.iter().enumerate() {
            if c == 0 {
                continue;
            }
            let row = &self.up[d][t * n..t * n + k];
            for &target in row {
                // no overflow: the coefficients of Π y_k^{c_k} sum to Π k^{c_k} <= 15^15 < 2^64
                to[target as usize] += c;
            }
        }
    }
}

/// A_c for every weak composition c of n-1 into n-1 parts (decreasing lexicographic order
/// of c), for 2 <= n <= 16, with progress counted in compositions and cancellation.
///
/// ```
/// use elbowroom_math::{Progress, permutohedra::mixed_eulerian::mixed_eulerian_numbers};
/// // n = 3: A_{(2,0)} = 1, A_{(1,1)} = 2, A_{(0,2)} = 1 (Postnikov, §16)
/// let a = mixed_eulerian_numbers(3, &Progress::new(0)).unwrap();
/// let v: Vec<String> = a.iter().map(|(c, v)| format!("{c:?}={v}")).collect();
/// assert_eq!(v, vec!["[2, 0]=1", "[1, 1]=2", "[0, 2]=1"]);
/// ```
pub fn mixed_eulerian_numbers(
    n: usize,
    progress: &Progress,
) -> MathResult<Vec<(Vec<u32>, BigInt)>> {
    if !(2..=MAX_N).contains(&n) {
        return Err(MathError::OutOfRange(format!(
            "n = {n}; mixed Eulerian numbers are computed for 2 <= n <= {MAX_N}"
        )));
    }
    let top = n - 1;
    let count = weak_composition_count(top as u64, top as u64);
    progress.set_total(count);
    let index = MonomialIndex::new(n)?;
    let last = values_times_last_part(&index, &PostnikovFunctional::new(n))?;
    if top == 1 {
        let mut out = Vec::new();
        walk(
            &index,
            &last,
            &mut Vec::new(),
            0,
            vec![1],
            progress,
            &mut out,
        )?;
        return Ok(out);
    }
    let results: Vec<MathResult<Vec<Numbered>>> = (0..=top as u32)
        .into_par_iter()
        .map(|c1| walk_from_first_part(&index, &last, c1, progress))
        .collect();
    let mut all = Vec::with_capacity(usize::try_from(count).unwrap_or(0));
    // c1 descending gives decreasing lexicographic order
    for r in results.into_iter().rev() {
        all.extend(r?);
    }
    Ok(all)
}

/// The number of weak compositions of `total` into `parts` parts,
/// C(total + parts − 1, parts − 1), counted without listing them.
fn weak_composition_count(total: u64, parts: u64) -> u64 {
    if parts == 0 {
        return u64::from(total == 0);
    }
    // C(total + parts - 1, parts - 1), exact at each step
    (1..parts).fold(1u64, |acc, k| acc * (total + k) / k)
}

/// last[k][t] = DS_n(x^a y_{n-1}^k) for the t-th monomial a of degree
/// n − 1 − k: the values that fold the last part of c into one lookup.
/// Sums are checked: a sum beyond i128 is an error (it does not occur for
/// n <= 16, where the values stay below 10^30).
fn values_times_last_part(
    index: &MonomialIndex,
    ds: &PostnikovFunctional,
) -> MathResult<Vec<Vec<i128>>> {
    let n = index.n;
    let top = n - 1;
    let mut last: Vec<Vec<i128>> = Vec::with_capacity(n);
    last.push(
        index.by_degree[top]
            .iter()
            .map(|m| i128::from(ds.value(*m)))
            .collect(),
    );
    for k in 1..=top {
        let d = top - k;
        let prev = &last[k - 1];
        let row: Option<Vec<i128>> = (0..index.by_degree[d].len())
            .map(|t| {
                index.up[d][t * n..t * n + (n - 1)]
                    .iter()
                    .try_fold(0i128, |acc, &u| acc.checked_add(prev[u as usize]))
            })
            .collect();
        let Some(row) = row else {
            return Err(MathError::OutOfRange(format!(
                "a value DS_n(x^a y_{}^{k}) at n = {n} exceeds the 128-bit range",
                n - 1
            )));
        };
        last.push(row);
    }
    Ok(last)
}

/// Every A_c with first part c_1, walked depth-first from y_1^{c_1} = x_1^{c_1}.
fn walk_from_first_part(
    index: &MonomialIndex,
    last: &[Vec<i128>],
    c1: u32,
    progress: &Progress,
) -> MathResult<Vec<Numbered>> {
    let mut out = Vec::new();
    let mut start = vec![0u64; index.by_degree[c1 as usize].len()];
    let first = Mono::from_exps(&[c1]).unwrap_or(Mono::ONE);
    let pos = index.by_degree[c1 as usize]
        .iter()
        .position(|m| *m == first)
        .unwrap_or(0);
    start[pos] = 1;
    let mut prefix = vec![c1];
    walk(
        index,
        last,
        &mut prefix,
        c1 as usize,
        start,
        progress,
        &mut out,
    )?;
    Ok(out)
}

fn walk(
    index: &MonomialIndex,
    last: &[Vec<i128>],
    prefix: &mut Vec<u32>,
    degree: usize,
    poly: Vec<u64>,
    progress: &Progress,
    out: &mut Vec<(Vec<u32>, BigInt)>,
) -> MathResult<()> {
    let n = index.n;
    let top = n - 1;
    if prefix.len() == top - 1 {
        progress.check()?;
        // the last part c_{n-1} = top - degree is folded into last[c_{n-1}]
        let k = top - degree;
        let table = &last[k];
        let mut c = prefix.clone();
        c.push(k as u32);
        out.push((c, fold_last_part(&poly, table)));
        progress.advance(1);
        return Ok(());
    }
    let k = prefix.len() + 1; // the next factor is y_k, 1-based
    // poly · y_k^e for e = 0, 1, ...: each written once, from the one before (no copies)
    let mut children: Vec<(u32, Vec<u64>)> = Vec::with_capacity(top - degree + 1);
    children.push((0u32, poly));
    for e in 1..=(top - degree) as u32 {
        let mut next = Vec::new();
        if let Some((_, current)) = children.last() {
            index.times_y(degree + e as usize - 1, k, current, &mut next);
        }
        children.push((e, next));
    }
    // decreasing lexicographic order: larger parts first
    for (e, p) in children.into_iter().rev() {
        prefix.push(e);
        walk(index, last, prefix, degree + e as usize, p, progress, out)?;
        prefix.pop();
    }
    Ok(())
}

/// Σ_t poly[t] · table[t] in checked i128, redone in big integers if a step overflows.
fn fold_last_part(poly: &[u64], table: &[i128]) -> BigInt {
    let mut total: i128 = 0;
    for (t, &c) in poly.iter().enumerate() {
        if c == 0 {
            continue;
        }
        let Some(next) = i128::from(c)
            .checked_mul(table[t])
            .and_then(|v| total.checked_add(v))
        else {
            return poly
                .iter()
                .zip(table)
                .map(|(&c, &v)| BigInt::from(c) * BigInt::from(v))
                .sum();
        };
        total = next;
    }
    BigInt::from(total)
}

/// A_c = DS_n(y_1^{c_1} ... y_{n-1}^{c_{n-1}}) for one composition, by expanding the
/// product as a polynomial (a second method, used to check the walk).
pub fn mixed_eulerian_number(c: &[u32]) -> MathResult<BigInt> {
    let n = c.len() + 1;
    if n > MAX_N || c.iter().sum::<u32>() as usize != n - 1 {
        return Err(MathError::InvalidInput(format!(
            "{c:?} is not a weak composition of {} into {} parts",
            n - 1,
            n - 1
        )));
    }
    let mut product = IntPoly::one(n);
    for (k, &e) in c.iter().enumerate() {
        let mut y = IntPoly::zero(n);
        for i in 0..=k {
            y = y.add(&IntPoly::var_index(n, i));
        }
        product = product.mul(&y.pow(e)?)?;
    }
    let ds = PostnikovFunctional::new(n);
    let mut total = BigInt::from(0);
    for (m, coeff) in product.terms() {
        total += coeff * BigInt::from(ds.value(*m));
    }
    Ok(total)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_fold_agrees_in_big_integers_past_the_128_bit_range() {
        let poly = [u64::MAX, 3, 0];
        let table = [i128::MAX / 2, -7, 5];
        let expected = BigInt::from(u64::MAX) * BigInt::from(i128::MAX / 2) - BigInt::from(21);
        assert_eq!(fold_last_part(&poly, &table), expected);
        assert_eq!(fold_last_part(&[2, 3], &[5, -1]), BigInt::from(7));
    }

    #[test]
    fn the_count_of_weak_compositions_is_the_length_of_their_listing() {
        for total in 0..=7u32 {
            for parts in 0..=7usize {
                assert_eq!(
                    weak_composition_count(u64::from(total), parts as u64),
                    weak_compositions(total, parts).len() as u64,
                    "{total} into {parts} parts"
                );
            }
        }
        // C(29, 14) at n = 16, counted without listing 77 558 760 compositions
        assert_eq!(weak_composition_count(15, 15), 77_558_760);
    }
}
