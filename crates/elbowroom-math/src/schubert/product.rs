//! Structure constants: S_u · S_v = Σ_w c^w_{uv} S_w, stably and in H*(Fl_n).
//!
//! Method: transition on u combined with Monk's rule. For u ≠ id let r be the last
//! descent of u, s > r the largest index with u(s) < u(r), and u' = u t_{rs}; then
//! (Lascoux–Schützenberger transition)
//! S_u = x_r S_{u'} + Σ_{q < r, ℓ(u' t_{qr}) = ℓ(u)} S_{u' t_{qr}},
//! so P(u) := S_u · S_v obeys P(u) = x_r · P(u') + Σ_q P(u' t_{qr}) with P(id) = S_v,
//! and x_r · P(u') is one application of Monk's rule to a vector. The permutations
//! reached from u form a finite set; u' is shorter than u and each u' t_{qr} has the
//! length of u and is lexicographically larger (its entry at q grows from u(q) to
//! u(s)), so evaluating them by increasing length, and within a length by decreasing
//! lexicographic order, meets every one after the ones it needs. No recursion; each
//! P is dropped once the last permutation that needs it is done. Of u and v the one
//! with fewer permutations reached is the one transitioned (the product commutes).
//!
//! The reference [`product_by_polynomials`] multiplies the two Schubert polynomials
//! and expands the product by [`schubert_expansion`].
//!
//! The transition step here is a small private helper on packed permutations.

use crate::error::{MathError, MathResult};
use crate::perms::listing::mahonian_row;
use crate::perms::perm::{MAX_N, Perm};
use crate::progress::Progress;
use crate::schubert::expansion::schubert_expansion;
use crate::schubert::polynomial::SchubertTable;
use crate::schubert::transition::{partners, pivot};
use crate::schubert::vector::{
    Coefficient, LinearForm, PackedPerm, SchubertVector, Space, StepResult, exactly,
};
use num_bigint::BigInt;
use std::collections::{HashMap, HashSet};

/// The most Schubert terms a product may have, bounded before the work: by the
/// Mahonian number of ℓ(u) + ℓ(v) in H*(Fl_n), and stably by the number of codes
/// of that sum supported on the descents allowed.
pub const PRODUCT_TERM_LIMIT: u128 = 20_000_000;

/// The most permutations the transition of u may reach.
pub const TRANSITION_NODE_LIMIT: usize = 2_000_000;

/// One transition step of x ≠ id: (r, x' = x t_{rs}, the x' t_{qr} of the same length as x).
/// `None` for the identity. Positions are 1-based.
fn transition_step(x: PackedPerm) -> Option<(usize, PackedPerm, Vec<PackedPerm>)> {
    let m = x.support();
    let (r, s) = pivot(&x.values()[..m])?;
    let xp = x.swapped(r + 1, s + 1);
    let w = xp.values();
    let others = partners(&w[..m], r)
        .map(|q| xp.swapped(q + 1, r + 1))
        .collect();
    Some((r + 1, xp, others))
}

/// The permutations reached from u by transition, ordered so that each comes after
/// the ones it needs: by increasing length, then decreasing lexicographic order.
fn transition_closure(
    u: PackedPerm,
    limit: usize,
    progress: &Progress,
) -> MathResult<Vec<PackedPerm>> {
    let mut seen: HashSet<PackedPerm> = HashSet::new();
    let mut stack = vec![u];
    seen.insert(u);
    while let Some(x) = stack.pop() {
        if seen.len().is_multiple_of(1 << 12) {
            progress.check()?;
        }
        if let Some((_, xp, others)) = transition_step(x) {
            for y in std::iter::once(xp).chain(others) {
                if seen.insert(y) {
                    if seen.len() > limit {
                        return Err(MathError::OutOfRange(format!(
                            "the transition of S_{} reaches more than {limit} permutations",
                            u.to_minimal_perm()
                        )));
                    }
                    stack.push(y);
                }
            }
        }
    }
    let mut order: Vec<(usize, [u8; MAX_N], PackedPerm)> = seen
        .into_iter()
        .map(|x| (x.length(), x.values(), x))
        .collect();
    order.sort_unstable_by(|a, b| a.0.cmp(&b.0).then(b.1.cmp(&a.1)));
    Ok(order.into_iter().map(|t| t.2).collect())
}

/// The size of the largest S_m a stable computation of S_t · S_o may need when t is
/// transitioned: each Monk step by x_r (r < the size of t) moves at most one position
/// past what is already moved; and every term has its descents among 1..k (k the
/// larger last descent of the two) and length ℓ(t) + ℓ(o).
fn stable_room(t: &Perm, o: &Perm) -> usize {
    let (st, so) = (t.support_size(), o.support_size());
    let via_monk = so.max(st.saturating_sub(1)) + t.length();
    let len = t.length() + o.length();
    let k = last_descent(t).max(last_descent(o));
    let by_code = if len == 0 { 1 } else { k + len };
    via_monk.min(by_code)
}

fn last_descent(w: &Perm) -> usize {
    w.descents().last().copied().unwrap_or(0)
}

/// C(a, b), saturating.
fn binomial(a: u128, b: u128) -> u128 {
    let mut r: u128 = 1;
    for i in 0..b {
        r = r.saturating_mul(a - i) / (i + 1);
    }
    r
}

/// Checks u and v against the space and sizes the product; the number of terms bound.
fn size_product(u: &Perm, v: &Perm, space: Space) -> MathResult<u128> {
    let len = u.length() + v.length();
    match space {
        Space::Flag(n) => {
            Space::flag(n)?;
            for w in [u, v] {
                if w.support_size() > n {
                    return Err(MathError::OutOfRange(format!(
                        "S_{w} is not a class of H*(Fl_{n}): {w} does not lie in S_{n}"
                    )));
                }
            }
            let row = mahonian_row(n);
            Ok(row.get(len).copied().unwrap_or(0))
        }
        Space::Stable => {
            let k = last_descent(u).max(last_descent(v)) as u128;
            Ok(if k == 0 {
                1
            } else {
                binomial(len as u128 + k - 1, k - 1)
            })
        }
    }
}

/// S_u · S_v = Σ_w c^w_{uv} S_w, stably (`Space::Stable`) or in H*(Fl_n)
/// (`Space::Flag(n)`, u and v in S_n), by transition and Monk's rule (module notes).
///
/// ```
/// use elbowroom_math::{Perm, Progress};
/// use elbowroom_math::schubert::product::schubert_product;
/// use elbowroom_math::schubert::vector::Space;
/// // S_{132} · S_{132} = (x_1 + x_2)^2 = S_{231} + S_{1423}
/// let w = Perm::parse("132").unwrap();
/// let p = schubert_product(&w, &w, Space::Stable, &Progress::default()).unwrap();
/// let text: Vec<String> = p.sorted_terms().iter().map(|(w, c)| format!("{c} S_{w}")).collect();
/// assert_eq!(text, vec!["1 S_1423", "1 S_231"]);
/// // in H*(Fl_3), S_{1423} lies in I_3
/// let p3 = schubert_product(&w, &w, Space::Flag(3), &Progress::default()).unwrap();
/// assert_eq!(p3.sorted_terms().len(), 1);
/// ```
pub fn schubert_product(
    u: &Perm,
    v: &Perm,
    space: Space,
    progress: &Progress,
) -> MathResult<SchubertVector<BigInt>> {
    let bound = size_product(u, v, space)?;
    if bound > PRODUCT_TERM_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "S_{u} · S_{v} may have {bound} terms, more than the {PRODUCT_TERM_LIMIT} accepted"
        )));
    }
    let (pu, pv) = (PackedPerm::from_perm(u), PackedPerm::from_perm(v));
    // transition the factor that reaches fewer permutations
    let cu = transition_closure(pu, TRANSITION_NODE_LIMIT, progress);
    let cv = transition_closure(pv, TRANSITION_NODE_LIMIT, progress);
    let (order, other) = match (cu, cv) {
        (Ok(a), Ok(b)) => {
            if a.len() <= b.len() {
                (a, pv)
            } else {
                (b, pu)
            }
        }
        (Ok(a), Err(_)) => (a, pv),
        (Err(_), Ok(b)) => (b, pu),
        (Err(e), Err(_)) => return Err(e),
    };
    // in the stable space every term must fit S_16
    if space == Space::Stable {
        let (t, o) = if other == pv { (u, v) } else { (v, u) };
        let room = stable_room(t, o);
        if room > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "S_{u} · S_{v} may hold S_w with w in S_{room}; stable products are limited \
                 to S_{MAX_N} (multiply in H*(Fl_n) for a bounded n instead)"
            )));
        }
    }
    progress.set_total(order.len() as u64);
    exactly(
        || transition_product::<i128>(&order, other, space, progress).map(|p| p.to_big()),
        || transition_product::<BigInt>(&order, other, space, progress),
    )
}

/// P(x) = S_x · S_other for every x of `order` (children first); returns the last.
fn transition_product<C: Coefficient>(
    order: &[PackedPerm],
    other: PackedPerm,
    space: Space,
    progress: &Progress,
) -> StepResult<SchubertVector<C>> {
    // how many later permutations need each P, so that it can be dropped after its last use
    let mut uses: HashMap<PackedPerm, usize> = HashMap::new();
    let mut steps = Vec::with_capacity(order.len());
    for &x in order {
        let step = transition_step(x);
        if let Some((_, xp, others)) = &step {
            *uses.entry(*xp).or_default() += 1;
            for y in others {
                *uses.entry(*y).or_default() += 1;
            }
        }
        steps.push(step);
    }
    let base = SchubertVector::<C>::from_terms(space, [(other, C::from_i64(1))])?;
    let mut memo: HashMap<PackedPerm, SchubertVector<C>> = HashMap::new();
    let mut last = base.clone();
    for (&x, step) in order.iter().zip(steps) {
        progress.check()?;
        let value = match step {
            None => base.clone(),
            Some((r, xp, others)) => {
                let Some(prev) = memo.get(&xp) else {
                    return Err(missing(x));
                };
                let mut acc = prev.times_linear(&LinearForm::var(r)?, progress)?;
                release(&mut memo, &mut uses, xp);
                for y in others {
                    let Some(p) = memo.get(&y) else {
                        return Err(missing(x));
                    };
                    acc.add_scaled(p, &C::from_i64(1))?;
                    release(&mut memo, &mut uses, y);
                }
                acc
            }
        };
        progress.advance(1);
        if uses.get(&x).copied().unwrap_or(0) > 0 {
            memo.insert(x, value.clone());
        }
        last = value;
    }
    Ok(last)
}

fn missing(x: PackedPerm) -> crate::schubert::vector::StepError {
    MathError::InvalidInput(format!(
        "internal: the transition of S_{} met a permutation out of order",
        x.to_minimal_perm()
    ))
    .into()
}

/// Counts one use of P(y) and drops it after its last.
fn release<C>(
    memo: &mut HashMap<PackedPerm, SchubertVector<C>>,
    uses: &mut HashMap<PackedPerm, usize>,
    y: PackedPerm,
) {
    if let Some(k) = uses.get_mut(&y) {
        *k = k.saturating_sub(1);
        if *k == 0 {
            memo.remove(&y);
        }
    }
}

/// The reference: the polynomial S_u · S_v, then its Schubert expansion in the space
/// (see [`schubert_expansion`]). Same result as [`schubert_product`].
pub fn product_by_polynomials(
    u: &Perm,
    v: &Perm,
    space: Space,
    progress: &Progress,
) -> MathResult<SchubertVector<BigInt>> {
    size_product(u, v, space)?;
    let mut table = SchubertTable::new();
    let n = u.n().max(v.n());
    let su = table.get(&u.embed(n)?);
    let sv = table.get(&v.embed(n)?);
    let f = su.mul(&sv)?.to_rational();
    let e = schubert_expansion(&f, space, progress)?;
    let mut terms = Vec::with_capacity(e.terms.len());
    for (w, c) in e.terms {
        if !c.is_integer() {
            return Err(MathError::InvalidInput(format!(
                "internal: a structure constant {c} is not an integer"
            )));
        }
        terms.push((PackedPerm::from_perm(&w), c.to_integer()));
    }
    SchubertVector::from_terms(space, terms).map_err(|e| match e {
        crate::schubert::vector::StepError::Math(m) => m,
        crate::schubert::vector::StepError::Overflow => MathError::OutOfRange("overflow".into()),
    })
}
