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

use crate::math::error::{MathError, MathResult};
use crate::math::hessenberg::divsym::PostnikovFunctional;
use crate::math::perms::perm::MAX_N;
use crate::math::poly::compositions::weak_compositions;
use crate::math::poly::mono::Mono;
use crate::math::poly::polynomial::IntPoly;
use crate::math::progress::Progress;
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
                to[target as usize] += c;
            }
        }
    }
}

/// A_c for every weak composition c of n-1 into n-1 parts (decreasing lexicographic order
/// of c), for 2 <= n <= 16, with progress counted in compositions and cancellation.
///
/// ```
/// use elbowroom::math::{Progress, permutohedra::mixed_eulerian::mixed_eulerian_numbers};
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
    let compositions = weak_compositions(top as u32, top);
    progress.set_total(compositions.len() as u64);
    let index = MonomialIndex::new(n)?;
    let ds = PostnikovFunctional::new(n);
    // last[k][t] = DS_n(x^a y_{n-1}^k) for the t-th monomial a of degree n-1-k
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
        let row: Vec<i128> = (0..index.by_degree[d].len())
            .map(|t| {
                index.up[d][t * n..t * n + (n - 1)]
                    .iter()
                    .map(|&u| prev[u as usize])
                    .sum()
            })
            .collect();
        last.push(row);
    }
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
        .map(|c1| {
            let mut out = Vec::new();
            // the product y_1^{c1} = x_1^{c1}
            let mut start = vec![0u64; index.by_degree[c1 as usize].len()];
            let first = Mono::from_exps(&[c1]).unwrap_or(Mono::ONE);
            let pos = index.by_degree[c1 as usize]
                .iter()
                .position(|m| *m == first)
                .unwrap_or(0);
            start[pos] = 1;
            let mut prefix = vec![c1];
            walk(
                &index,
                &last,
                &mut prefix,
                c1 as usize,
                start,
                progress,
                &mut out,
            )?;
            Ok(out)
        })
        .collect();
    let mut all = Vec::with_capacity(compositions.len());
    // c1 descending gives decreasing lexicographic order
    for r in results.into_iter().rev() {
        all.extend(r?);
    }
    Ok(all)
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
        let mut total: i128 = 0;
        for (t, &c) in poly.iter().enumerate() {
            if c != 0 {
                total += i128::from(c) * table[t];
            }
        }
        let mut c = prefix.clone();
        c.push(k as u32);
        out.push((c, BigInt::from(total)));
        progress.advance(1);
        return Ok(());
    }
    let k = prefix.len() + 1; // the next factor is y_k, 1-based
    let mut children = Vec::new();
    let mut current = poly;
    let mut next = Vec::new();
    children.push((0u32, current.clone()));
    for e in 1..=(top - degree) as u32 {
        index.times_y(degree + e as usize - 1, k, &current, &mut next);
        std::mem::swap(&mut current, &mut next);
        children.push((e, current.clone()));
    }
    // decreasing lexicographic order: larger parts first
    for (e, p) in children.into_iter().rev() {
        prefix.push(e);
        walk(index, last, prefix, degree + e as usize, p, progress, out)?;
        prefix.pop();
    }
    Ok(())
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
