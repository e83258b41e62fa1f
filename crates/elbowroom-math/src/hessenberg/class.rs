//! Hessenberg coefficients of every h through the class itself.
//!
//! The class of the regular semisimple Hessenberg variety of h in H*(Fl_n) is
//! (Anderson–Tymoczko, J. Algebra 2010)
//! [Hess(h)] = Q_h = Π_{i < j, j > h(i)} (x_i − x_j),
//! and a^h_w = DS_h(S_w) is its coefficient of S_{w0 w}, where (w0 w)(i) = n + 1 − w(i)
//! and ℓ(w) = |h| = Σ_i (h(i) − i).
//!
//! Method: Q_h is expanded in the Schubert basis of H*(Fl_n) through Monk's rule,
//! one factor x_i − x_j at a time, starting from S_id; it is never written in
//! monomials. The order of the factors matters for the sizes on the way: rows from
//! the top (i = 1, 2, ...), and in each row j from n down to h(i) + 1
//! ([`class_factors`]). Measured: for h(i) = i at n = 9 (all 36 factors) every
//! partial product has at most 8 terms in this order, against about 19 000 with rows
//! from the bottom; the reason for row 1 is that Π_{j>1}(x_1 − x_j) = n x_1^{n−1}
//! = n S_{n 1 2 ⋯ n−1} in H*(Fl_n).
//!
//! Sizes: a vector of degree t in H*(Fl_n) has at most M(n, t) terms (the Mahonian
//! number); a step whose bound (that, or the fan-out of Monk's rule) exceeds
//! [`CLASS_TERM_LIMIT`] counts its terms and stops as soon as they pass it; tables are sized and read off row by
//! row in [`crate::hessenberg::rows`]. Coefficients are checked `i128`, and the whole run is
//! repeated in big integers if one overflows.

use crate::error::{MathError, MathResult};
use crate::hessenberg::function::HessenbergFn;
use crate::perms::listing::mahonian_row;
use crate::perms::perm::MAX_N;
use crate::progress::Progress;
use crate::schubert::vector::{
    Coefficient, LinearForm, Monk, PackedPerm, SchubertVector, Space, StepError, StepResult,
    TermMap, add_into, exactly,
};

/// How many terms are multiplied between two checks of the cancel flag and the size.
const CHECK_EVERY: usize = 1 << 12;
use num_bigint::BigInt;

/// The most terms a vector may reach on the way to Q_h.
/// M(17, 17) = 300 895 513 (the Mahonian bound of the next-to-last partial
/// product of the default h of n = 17, [`crate::hessenberg::rows`]) is accepted.
pub const CLASS_TERM_LIMIT: u128 = 320_000_000;

/// The factors x_i − x_j of Q_h in the order they are multiplied: rows i = 1, 2, ...
/// from the top, and in each row j = n, n − 1, ..., h(i) + 1.
///
/// ```
/// use elbowroom_math::hessenberg::class::class_factors;
/// use elbowroom_math::hessenberg::function::HessenbergFn;
/// let h = HessenbergFn::new(&[1, 3, 3]).unwrap();
/// assert_eq!(class_factors(&h), vec![(1, 3), (1, 2)]);
/// ```
pub fn class_factors(h: &HessenbergFn) -> Vec<(usize, usize)> {
    let n = h.n();
    let mut out = Vec::new();
    for i in 1..=n {
        for j in (h.at(i) + 1..=n).rev() {
            out.push((i, j));
        }
    }
    out
}

/// The most terms x_i − x_j · S_w can have: covers (a, b) with a or b in {i, j}.
fn fan_out(n: usize) -> u128 {
    4 * n as u128
}

/// v · (x_i − x_j) in H*(Fl_n), never holding more than [`CLASS_TERM_LIMIT`] terms:
/// when the bound of the result (the Mahonian number of its degree, and the fan-out
/// 4n times the terms of v) is within the limit the step runs at once; otherwise it
/// runs counting its terms and stops with `OutOfRange` as soon as they pass the limit.
pub(crate) fn times_difference<C: Coefficient>(
    v: &SchubertVector<C>,
    (i, j): (usize, usize),
    degree: usize,
    mahonian: &[u128],
    progress: &Progress,
) -> StepResult<SchubertVector<C>> {
    let n = match v.space() {
        Space::Flag(n) => n,
        Space::Stable => MAX_N,
    };
    let by_degree = mahonian.get(degree).copied().unwrap_or(0);
    let by_fan = (v.len() as u128).saturating_mul(fan_out(n));
    let bound = by_degree.min(by_fan);
    let form = LinearForm::difference(i, j)?;
    if bound <= CLASS_TERM_LIMIT {
        return v.times_linear(&form, progress);
    }
    let out = guarded_product(v.term_map(), &form, n, degree, bound, progress)?;
    SchubertVector::from_terms(v.space(), out)
}

/// λ · Σ c_w S_w in H*(Fl_n) by Monk's rule on a bare map of terms, stopping with
/// `OutOfRange` as soon as the result passes [`CLASS_TERM_LIMIT`] terms.
fn guarded_product<C: Coefficient>(
    v: &TermMap<C>,
    form: &LinearForm<C>,
    n: usize,
    degree: usize,
    bound: u128,
    progress: &Progress,
) -> StepResult<TermMap<C>> {
    let too_many = || {
        StepError::Math(MathError::OutOfRange(format!(
            "the Hessenberg class in H*(Fl_{n}) passes {CLASS_TERM_LIMIT} Schubert terms in \
             degree {degree} (bounded by {bound} before the step), more than the \
             {CLASS_TERM_LIMIT} accepted"
        )))
    };
    let monk = Monk::new(form, Space::flag(n)?);
    let mut out = TermMap::<C>::default();
    // near the end of the product each step is at most about twice the one before
    out.reserve(((v.len() as u128 * 2).min(bound)) as usize);
    for (count, (w, c)) in v.iter().enumerate() {
        if count % CHECK_EVERY == 0 {
            progress.check()?;
            if out.len() as u128 > CLASS_TERM_LIMIT {
                return Err(too_many());
            }
        }
        monk.apply(*w, |target, mult| {
            let t = c.mul_checked(mult)?;
            add_into(&mut out, target, &t)
        })?;
    }
    if out.len() as u128 > CLASS_TERM_LIMIT {
        return Err(too_many());
    }
    progress.check()?;
    Ok(out)
}

/// Π (x_i − x_j) over `factors`, in this order, in H*(Fl_n) in coefficients C, as a
/// bare map of terms (no copy at any step); each step guarded as in
/// [`times_difference`] and counted on `progress`.
pub(crate) fn product_of_differences<C: Coefficient>(
    n: usize,
    factors: &[(usize, usize)],
    progress: &Progress,
) -> StepResult<TermMap<C>> {
    let mahonian = mahonian_row(n);
    Space::flag(n)?;
    let mut v = TermMap::<C>::default();
    v.insert(PackedPerm::IDENTITY, C::from_i64(1));
    for (t, &(i, j)) in factors.iter().enumerate() {
        let degree = t + 1;
        let bound = mahonian
            .get(degree)
            .copied()
            .unwrap_or(0)
            .min((v.len() as u128).saturating_mul(fan_out(n)));
        let form = LinearForm::difference(i, j)?;
        let next = guarded_product(&v, &form, n, degree, bound, progress)?;
        // the previous product goes before the next step starts
        v = next;
        progress.advance(1);
    }
    Ok(v)
}

/// Q_h in H*(Fl_n) in coefficients C, factor by factor.
fn class_in<C: Coefficient>(
    h: &HessenbergFn,
    progress: &Progress,
) -> StepResult<SchubertVector<C>> {
    let terms = product_of_differences::<C>(h.n(), &class_factors(h), progress)?;
    SchubertVector::from_terms(Space::flag(h.n())?, terms)
}

/// The class [Hess(h)] = Q_h = Π_{i<j, j>h(i)} (x_i − x_j) in H*(Fl_n), in the Schubert basis.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::hessenberg::class::hessenberg_class;
/// use elbowroom_math::hessenberg::function::HessenbergFn;
/// // h = (2,3,3): Q_h = x_1 − x_3 = S_{132} + S_{213} in H*(Fl_3) (the permutohedral variety)
/// let q = hessenberg_class(&HessenbergFn::new(&[2, 3, 3]).unwrap(), &Progress::default()).unwrap();
/// let text: Vec<String> = q.sorted_terms().iter().map(|(w, c)| format!("{c} S_{w}")).collect();
/// assert_eq!(text, vec!["1 S_132", "1 S_213"]);
/// ```
pub fn hessenberg_class(
    h: &HessenbergFn,
    progress: &Progress,
) -> MathResult<SchubertVector<BigInt>> {
    progress.set_total(class_factors(h).len() as u64);
    exactly(
        || class_in::<i128>(h, progress).map(|v| v.to_big()),
        || class_in::<BigInt>(h, progress),
    )
}
