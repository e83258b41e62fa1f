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
//! number); each step is refused before it starts when that bound and the fan-out of
//! Monk's rule both exceed [`CLASS_TERM_LIMIT`], and a table is refused when its listing
//! exceeds [`CLASS_TABLE_LIMIT`]. Coefficients are checked `i128`, and the whole run is
//! repeated in big integers if one overflows.

use crate::math::error::{MathError, MathResult};
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::table::{HessenbergTable, TableEntry};
use crate::math::perms::listing::{for_each_of_length, mahonian_row};
use crate::math::perms::perm::{MAX_N, Perm};
use crate::math::progress::Progress;
use crate::math::schubert::vector::{
    Coefficient, LinearForm, PackedPerm, SchubertVector, Space, StepError, StepResult, exactly,
};
use num_bigint::BigInt;

/// The most terms a vector may reach on the way to Q_h.
pub const CLASS_TERM_LIMIT: u128 = 40_000_000;

/// The most permutations a table by class may list (the Mahonian number M(n, |h|));
/// M(12, 33) = 25 598 186 (the largest at n = 12) is accepted.
pub const CLASS_TABLE_LIMIT: u128 = 30_000_000;

/// How many entries are filled between two checks of the cancel flag.
const CHECK_EVERY: usize = 1 << 12;

/// The factors x_i − x_j of Q_h in the order they are multiplied: rows i = 1, 2, ...
/// from the top, and in each row j = n, n − 1, ..., h(i) + 1.
///
/// ```
/// use elbowroom::math::hessenberg::class::class_factors;
/// use elbowroom::math::hessenberg::function::HessenbergFn;
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

/// v · (x_i − x_j) in H*(Fl_n), refused before it starts when the result could pass
/// [`CLASS_TERM_LIMIT`] terms (the Mahonian bound of its degree and the fan-out bound
/// both above the limit).
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
    if bound > CLASS_TERM_LIMIT {
        return Err(StepError::Math(MathError::OutOfRange(format!(
            "the Hessenberg class in H*(Fl_{n}) may pass through {bound} Schubert terms in \
             degree {degree}, more than the {CLASS_TERM_LIMIT} accepted"
        ))));
    }
    v.times_linear(&LinearForm::difference(i, j)?, progress)
}

/// Q_h in H*(Fl_n) in coefficients C, factor by factor.
fn class_in<C: Coefficient>(
    h: &HessenbergFn,
    progress: &Progress,
) -> StepResult<SchubertVector<C>> {
    let n = h.n();
    let mahonian = mahonian_row(n);
    let mut v = SchubertVector::<C>::one(Space::flag(n)?);
    for (t, pair) in class_factors(h).into_iter().enumerate() {
        v = times_difference(&v, pair, t + 1, &mahonian, progress)?;
        progress.advance(1);
    }
    Ok(v)
}

/// The class [Hess(h)] = Q_h = Π_{i<j, j>h(i)} (x_i − x_j) in H*(Fl_n), in the Schubert basis.
///
/// ```
/// use elbowroom::math::Progress;
/// use elbowroom::math::hessenberg::class::hessenberg_class;
/// use elbowroom::math::hessenberg::function::HessenbergFn;
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

/// Checks n and the listing size of a table of h; returns M(n, |h|).
fn size_table(h: &HessenbergFn) -> MathResult<u128> {
    let n = h.n();
    let listed = mahonian_row(n).get(h.dimension()).copied().unwrap_or(0);
    if listed > CLASS_TABLE_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "the table of h = {h} lists {listed} permutations (those of length {} in S_{n}), \
             more than the {CLASS_TABLE_LIMIT} accepted",
            h.dimension()
        )));
    }
    Ok(listed)
}

/// a^h_w = DS_h(S_w) for the w of length |h| whose listing index passes `select`, read
/// off the class: a^h_w is the coefficient of S_{w0 w} in Q_h (module notes).
///
/// Same arguments and result as the DS_h method
/// ([`crate::math::hessenberg::table::hessenberg_table`]): the w of length |h| are
/// listed in lexicographic order, `select` sees the listing index, the entries come in
/// listing order and zeros are included. Cancellable; progress counts the factors of
/// Q_h, then the entries.
///
/// ```
/// use elbowroom::math::Progress;
/// use elbowroom::math::hessenberg::class::coefficient_table_by_class;
/// use elbowroom::math::hessenberg::function::HessenbergFn;
/// // n = 3, h = (2,3,3): Q_h = x_1 − x_3 = S_{132} + S_{213}, so with w0 w = 132, 213
/// // a_{312} = a_{231} = 1 (the same as DS_3(x_1^2) = DS_3(x_1 x_2) = 1)
/// let h = HessenbergFn::new(&[2, 3, 3]).unwrap();
/// let t = coefficient_table_by_class(&h, &|_| true, &Progress::default()).unwrap();
/// let values: Vec<String> = t.entries.iter().map(|e| format!("{}:{}", e.perm, e.value)).collect();
/// assert_eq!(values, vec!["231:1", "312:1"]);
/// ```
pub fn coefficient_table_by_class(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
) -> MathResult<HessenbergTable> {
    let listed = size_table(h)?;
    let factors = class_factors(h).len() as u64;
    progress.set_total(factors + listed as u64);
    exactly(
        || table_in::<i128>(h, select, progress),
        || table_in::<BigInt>(h, select, progress),
    )
}

fn table_in<C: Coefficient>(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
) -> StepResult<HessenbergTable> {
    let class = class_in::<C>(h, progress)?;
    let n = h.n();
    let terms = class.term_map();
    let mut entries = Vec::new();
    let mut reversed = [0u8; MAX_N];
    let mut pending = 0u64;
    for_each_of_length(n, h.dimension(), &mut |index, line| {
        pending += 1;
        if pending as usize >= CHECK_EVERY {
            progress.check()?;
            progress.advance(pending);
            pending = 0;
        }
        if !select(index) {
            return Ok(());
        }
        for (k, &v) in line.iter().enumerate() {
            reversed[k] = n as u8 + 1 - v;
        }
        let key = PackedPerm::from_values(&reversed[..n]);
        let value = terms.get(&key).map_or_else(BigInt::default, |c| c.to_big());
        let perm = Perm::from_one_line(&line.iter().map(|&v| v as usize).collect::<Vec<_>>())?;
        entries.push(TableEntry { index, perm, value });
        Ok(())
    })
    .map_err(StepError::Math)?;
    progress.advance(pending);
    progress.check()?;
    Ok(HessenbergTable {
        h: h.clone(),
        entries,
        listed: mahonian_row(n).get(h.dimension()).copied().unwrap_or(0) as usize,
    })
}
