//! q-deformed mixed Eulerian numbers A_c(q), read in the top degree of the algebra
//! K_n(q) = Q(q)[u_1, …, u_{n−1}] / ((1+q) u_i² − q u_{i−1} u_i − u_i u_{i+1}),
//! u_0 = u_n = 0: the top degree n − 1 is one-dimensional, and A_c(q) := u^c / u_1^{n−1}
//! there. At q = 1 these are Klyachko's relations and A_c(1) = A_c (Postnikov's
//! mixed Eulerian numbers). Nadeau–Tewari study these numbers as the remixed Eulerian
//! numbers (Forum Math. Sigma 2023, arXiv 2208.04128); our normalization is the one
//! above: A_{(n−1,0,…,0)}(q) = 1 and A_{(0,…,0,n−1)}(q) = q^{n−1}.
//!
//! Method (a q-descent formula, found and checked here, not quoted): write u_k = y_k =
//! x_1 + ⋯ + x_k in Q[x_1..x_n]/(x_1 + ⋯ + x_n); the relation at i becomes
//! y_i (q x_i − x_{i+1}) = 0, and the functional on monomials of degree n − 1 is
//!
//! Ψ_q(x^a) = (−1)^{|S|} Σ_{σ ∈ S_n, Des σ = S} q^{Σ_i (i−1) a_i − inv σ},
//! S = S(a) = {i ≤ n − 1 : a_1 + ⋯ + a_i < i},
//!
//! which at q = 1 is Postnikov's DS_n(x^a) = (−1)^{|S|} β_n(S). Then
//! A_c(q) = Σ_a [x^a] Π_k y_k^{c_k} · Ψ_q(x^a). The sum is one dynamic program over the
//! variables from x_{n−1} down to x_1: the state is the number of factors y_k already
//! given a variable (which decides the descents of S) and the relative rank of the
//! last entry of a permutation built alongside (its descent set is S reversed, its
//! inversions counted as it grows); O(n^6) coefficient steps for one c, O(n^4) at q = 1.
//! The tests check every value against the defining relations of K_n(q) (which
//! determine the one-dimensional top degree), for every c with n ≤ 7.

use crate::error::{MathError, MathResult};
use crate::perms::perm::MAX_N;
use crate::poly::qpoly::QPoly;
use num_bigint::BigInt;

/// The most work a table of A_c(q) for every c of one n may take, counted as
/// compositions × n^6 (the steps of one A_c(q)): n = 9 is 3.4·10^9 (seconds in a
/// release build), n = 10 is 2.4·10^10 and refused.
pub const REMIXED_TABLE_WORK_LIMIT: u128 = 5_000_000_000;

/// The work of the table of A_c(q) for n: C(2n − 3, n − 2) compositions × n^6.
pub fn remixed_table_work(n: usize) -> u128 {
    let n = n.max(2) as u64;
    crate::limits::binomial(2 * n - 3, n - 2).saturating_mul(u128::from(n).pow(6))
}

/// A_c(q) for a weak composition c of n − 1 into n − 1 parts (2 ≤ n ≤ 16), exactly.
///
/// ```
/// use elbowroom_math::permutohedra::remixed::remixed_eulerian;
/// // n = 4: A_{(0,3,0)}(q) = 2q(1 + q), and A_{(1,1,1)}(q) = [3]_q!
/// assert_eq!(remixed_eulerian(&[0, 3, 0]).unwrap().to_string(), "2q + 2q^2");
/// assert_eq!(remixed_eulerian(&[1, 1, 1]).unwrap().to_string(), "1 + 2q + 2q^2 + q^3");
/// ```
pub fn remixed_eulerian(c: &[u32]) -> MathResult<QPoly> {
    let coeffs = descent_walk(c, false)?;
    Ok(QPoly::from_coeffs(
        coeffs.into_iter().map(BigInt::from).collect(),
    ))
}

/// A_c = A_c(1), the mixed Eulerian number, by the same walk at q = 1 (O(n^4)).
///
/// ```
/// use elbowroom_math::permutohedra::remixed::mixed_eulerian_at_one;
/// // n = 4: A_{(0,2,1)} = 4 and A_{(0,1,2)} = 2 (Postnikov, IMRN 2009, §16)
/// assert_eq!(mixed_eulerian_at_one(&[0, 2, 1]).unwrap(), 4.into());
/// assert_eq!(mixed_eulerian_at_one(&[0, 1, 2]).unwrap(), 2.into());
/// ```
pub fn mixed_eulerian_at_one(c: &[u32]) -> MathResult<BigInt> {
    let coeffs = descent_walk(c, true)?;
    Ok(BigInt::from(coeffs.first().copied().unwrap_or(0)))
}

fn overflow() -> MathError {
    MathError::OutOfRange("a mixed Eulerian number left 128-bit integers".into())
}

/// The walk; at q = 1 every polynomial is its one value (length 1).
fn descent_walk(c: &[u32], at_one: bool) -> MathResult<Vec<i128>> {
    let n = c.len() + 1;
    if !(2..=MAX_N).contains(&n) || c.iter().map(|&x| x as usize).sum::<usize>() != n - 1 {
        return Err(MathError::InvalidInput(format!(
            "{c:?} is not a weak composition of {} into {} parts (2 <= n <= {MAX_N})",
            n - 1,
            n - 1
        )));
    }
    let top = n - 1;
    // exponents Σ (j−1) a_j − inv σ, shifted by `offset` = C(n, 2) to stay ≥ 0
    let offset = if at_one { 0 } else { n * (n - 1) / 2 };
    let len = if at_one {
        1
    } else {
        offset + (n - 2) * (n - 1) + 1
    };
    // suffix[j] = c_j + ⋯ + c_{n−1} (1-based j; c_n = 0)
    let mut suffix = vec![0usize; n + 2];
    for j in (1..n).rev() {
        suffix[j] = suffix[j + 1] + c[j - 1] as usize;
    }
    let ranks = n + 1;
    let cell = |t: usize, r: usize| (t * ranks + r) * len;
    let mut dp = vec![0i128; (top + 1) * ranks * len];
    let mut next = dp.clone();
    // the permutation built alongside has one entry; no factor placed yet
    dp[cell(0, 1) + offset] = 1;
    let mut binom = vec![vec![0i128; n + 1]; n + 1];
    for a in 0..=n {
        binom[a][0] = 1;
        for b in 1..=a {
            binom[a][b] = binom[a - 1][b - 1] + binom[a - 1][b];
        }
    }
    for j in (1..n).rev() {
        let p = n - j; // entries of the permutation so far
        // 1. its next entry: a descent exactly when j ∈ S, i.e. T_{j+1} > n − 1 − j
        next.iter_mut().for_each(|v| *v = 0);
        for t in 0..=top {
            let descent = t > n - 1 - j;
            for r in 1..=p + 1 {
                // ascent: previous rank k < r; descent: k ≥ r
                let ks: std::ops::Range<usize> = if descent { r..p + 1 } else { 1..r };
                let shift = p + 1 - r; // entries before it that are larger
                for k in ks {
                    let from = cell(t, k);
                    let to = cell(t, r);
                    for e in 0..len {
                        let v = dp[from + e];
                        if v == 0 {
                            continue;
                        }
                        let target = if at_one { 0 } else { e - shift };
                        let signed = if descent { -v } else { v };
                        next[to + target] =
                            next[to + target].checked_add(signed).ok_or_else(overflow)?;
                    }
                }
            }
        }
        std::mem::swap(&mut dp, &mut next);
        // 2. a_j of the pool of factors y_k, k ≥ j, not yet placed, go to x_j
        next.iter_mut().for_each(|v| *v = 0);
        for t in 0..=top {
            let Some(pool) = suffix[j].checked_sub(t) else {
                continue;
            };
            let choices: std::ops::RangeInclusive<usize> =
                if j == 1 { pool..=pool } else { 0..=pool };
            for a in choices {
                let weight = binom[pool][a];
                let shift = (j - 1) * a;
                for r in 1..=p + 1 {
                    let from = cell(t, r);
                    let to = cell(t + a, r);
                    for e in 0..len {
                        let v = dp[from + e];
                        if v == 0 {
                            continue;
                        }
                        let target = if at_one { 0 } else { e + shift };
                        let add = v.checked_mul(weight).ok_or_else(overflow)?;
                        next[to + target] =
                            next[to + target].checked_add(add).ok_or_else(overflow)?;
                    }
                }
            }
        }
        std::mem::swap(&mut dp, &mut next);
    }
    let mut total = vec![0i128; len];
    for r in 1..=n {
        let from = cell(top, r);
        for e in 0..len {
            total[e] = total[e].checked_add(dp[from + e]).ok_or_else(overflow)?;
        }
    }
    if total[..offset].iter().any(|&v| v != 0) {
        return Err(MathError::OutOfRange(format!(
            "A_c(q) for c = {c:?} came out with a negative power of q"
        )));
    }
    let mut out = total.split_off(offset);
    while out.last() == Some(&0) {
        out.pop();
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn n_equals_four_values() {
        // values from the definition in K_4(q), computed independently by solving
        // the linear relations (and listed with the definition)
        let table: [([u32; 3], &str); 10] = [
            ([3, 0, 0], "1"),
            ([2, 1, 0], "1 + q"),
            ([2, 0, 1], "1 + q + q^2"),
            ([1, 2, 0], "1 + 2q + q^2"),
            ([1, 1, 1], "1 + 2q + 2q^2 + q^3"),
            ([1, 0, 2], "q + q^2 + q^3"),
            ([0, 3, 0], "2q + 2q^2"),
            ([0, 2, 1], "q + 2q^2 + q^3"),
            ([0, 1, 2], "q^2 + q^3"),
            ([0, 0, 3], "q^3"),
        ];
        for (c, v) in table {
            assert_eq!(remixed_eulerian(&c).unwrap().to_string(), v, "{c:?}");
        }
    }
}
