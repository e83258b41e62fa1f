//! Forest polynomials P_F by labelings.
//!
//! P_F = Σ_κ Π_v x_{κ(v)} over the labelings κ of the internal nodes by
//! positive integers with κ(v) ≤ ρ(v), κ(left child) ≥ κ(v) and
//! κ(right child) > κ(v) (Nadeau–Tewari 2024, Definition 3.3, from memory).
//! Computed tree by tree from the leaves up: Q_v(a), the labelings of the
//! subtree at v with κ(v) = a, is x_a · (Σ_{b ≥ a} Q_left(b)) · (Σ_{b > a} Q_right(b)),
//! with suffix sums; P_F is the product over the trees of Σ_a Q_root(a).

use crate::error::{MathError, MathResult};
use crate::forest::indexed::{Child, Forest, code_text};
use crate::poly::mono::{MAX_VARS, Mono};
use crate::poly::polynomial::{IntPoly, Poly};
use crate::progress::Progress;
use num_bigint::{BigInt, BigUint};
use num_traits::{One, Zero};

/// The most labelings (terms with multiplicity, P_F(1, …, 1)) a forest
/// polynomial may have before it is refused: P_F for every forest with at
/// most 10 leaves has far fewer; 2·10^6 terms of big integers take about
/// 100 MB and a few seconds.
pub const FOREST_LABELING_LIMIT: u128 = 2_000_000;

/// The largest label each node takes in some labeling: e(v) = min(ρ(v),
/// e(left), e(right) − 1) over its internal children (κ(left) ≥ κ(v) and
/// κ(right) > κ(v)); every e(v) ≥ 1, and P_F lies in x_1..x_m, m = max e(v).
///
/// ```
/// use elbowroom_math::forest::{indexed::Forest, polynomial::label_bounds};
/// // (0,2) is 1((2 3)4): ρ = 2 and 3, but the root's label is at most its left child's
/// assert_eq!(label_bounds(&Forest::from_code(&[0, 2]).unwrap()), vec![2, 2]);
/// ```
pub fn label_bounds(f: &Forest) -> Vec<usize> {
    let mut e: Vec<usize> = Vec::with_capacity(f.size());
    for v in f.nodes() {
        let mut b = v.rho;
        if let Child::Node(k) = v.left {
            b = b.min(e[k]);
        }
        if let Child::Node(k) = v.right {
            b = b.min(e[k].saturating_sub(1));
        }
        e.push(b);
    }
    e
}

/// P_F(1, …, 1): the number of labelings of F, counted by the same recursion
/// on integers (saturating at `u128::MAX`).
pub fn labeling_count(f: &Forest) -> u128 {
    let nodes = f.nodes();
    let bounds = label_bounds(f);
    // counts[k][a-1] = labelings of the subtree at k with κ(k) = a
    let mut counts: Vec<Vec<u128>> = Vec::with_capacity(nodes.len());
    for (v, &e) in nodes.iter().zip(&bounds) {
        let mut row = Vec::with_capacity(e);
        for a in 1..=e {
            let l = side_count(&counts, v.left, a);
            let r = side_count(&counts, v.right, a + 1);
            row.push(l.saturating_mul(r));
        }
        counts.push(row);
    }
    f.roots().iter().fold(1u128, |p, &r| {
        p.saturating_mul(counts[r].iter().fold(0u128, |s, &c| s.saturating_add(c)))
    })
}

fn side_count(counts: &[Vec<u128>], c: Child, from: usize) -> u128 {
    match c {
        Child::Leaf(_) => 1,
        Child::Node(k) => counts[k]
            .iter()
            .skip(from - 1)
            .fold(0u128, |s, &c| s.saturating_add(c)),
    }
}

/// The forest polynomial P_F, in x_1..x_m with m the largest ρ(v) (at least 1).
///
/// ```
/// use elbowroom_math::forest::{indexed::Forest, polynomial::forest_polynomial};
/// use elbowroom_math::Progress;
/// // Nadeau–Tewari's small examples: P_(0,2) = x1^2 + x1 x2 + x2^2, P_(1,0,1) = x1 (x1 + x2 + x3)
/// let p = |c: &[usize]| forest_polynomial(&Forest::from_code(c).unwrap(), &Progress::default()).unwrap();
/// assert_eq!(p(&[0, 2]).to_text(), "x1^2 + x1 x2 + x2^2");
/// assert_eq!(p(&[1, 0, 1]).to_text(), "x1^2 + x1 x2 + x1 x3");
/// ```
pub fn forest_polynomial(f: &Forest, progress: &Progress) -> MathResult<IntPoly> {
    let count = labeling_count(f);
    if count > FOREST_LABELING_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "P_F of the code {} has {count} labelings; at most {FOREST_LABELING_LIMIT} are accepted",
            code_text(f.code())
        )));
    }
    let nodes = f.nodes();
    let bounds = label_bounds(f);
    let nvars = bounds.iter().copied().max().unwrap_or(0).max(1);
    if nvars > MAX_VARS {
        return Err(MathError::OutOfRange(format!(
            "P_F of the code {} uses x{nvars}; at most x{MAX_VARS}",
            code_text(f.code())
        )));
    }
    // suffix[k][a-1] = Σ_{b ≥ a} Q_k(b)
    let mut suffix: Vec<Vec<IntPoly>> = Vec::with_capacity(nodes.len());
    for (v, &e) in nodes.iter().zip(&bounds) {
        progress.check()?;
        let mut q: Vec<IntPoly> = Vec::with_capacity(e);
        for a in 1..=e {
            let l = side_poly(&suffix, v.left, a, nvars);
            let r = side_poly(&suffix, v.right, a + 1, nvars);
            let lr = l.mul_with(&r, progress)?;
            q.push(lr.mul_term(Mono::var_index(a - 1), &BigInt::one())?);
        }
        let mut acc = IntPoly::zero(nvars);
        let mut sums = vec![IntPoly::zero(nvars); q.len()];
        for a in (0..q.len()).rev() {
            acc = acc.add(&q[a]);
            sums[a] = acc.clone();
        }
        suffix.push(sums);
    }
    let mut p = IntPoly::one(nvars);
    for &r in f.roots() {
        let tree = suffix[r]
            .first()
            .cloned()
            .unwrap_or_else(|| IntPoly::zero(nvars));
        p = p.mul_with(&tree, progress)?;
    }
    Ok(p)
}

fn side_poly(suffix: &[Vec<IntPoly>], c: Child, from: usize, nvars: usize) -> IntPoly {
    match c {
        Child::Leaf(_) => IntPoly::one(nvars),
        Child::Node(k) => suffix[k]
            .get(from - 1)
            .cloned()
            .unwrap_or_else(|| Poly::zero(nvars)),
    }
}

/// P_F(1, …, 1) as an exact count (the number of labelings).
pub fn labeling_count_exact(f: &Forest) -> BigUint {
    let nodes = f.nodes();
    let bounds = label_bounds(f);
    let mut counts: Vec<Vec<BigUint>> = Vec::with_capacity(nodes.len());
    for (v, &e) in nodes.iter().zip(&bounds) {
        let mut row = Vec::with_capacity(e);
        for a in 1..=e {
            let side = |c: Child, from: usize| match c {
                Child::Leaf(_) => BigUint::one(),
                Child::Node(k) => counts[k]
                    .iter()
                    .skip(from - 1)
                    .fold(BigUint::zero(), |s, c| s + c),
            };
            row.push(side(v.left, a) * side(v.right, a + 1));
        }
        counts.push(row);
    }
    f.roots().iter().fold(BigUint::one(), |p, &r| {
        p * counts[r].iter().fold(BigUint::zero(), |s, c| s + c)
    })
}
