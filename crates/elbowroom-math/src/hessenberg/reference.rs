//! The reference tables of a^h_w = DS_h(S_w), for every w in S_n with ℓ(w) = |h|
//! (built with the `reference` feature: the tests and benchmarks check the
//! program's table, read off the class, against them).
//!
//! a^h_w is the coefficient of the Schubert class σ_{w0 w} in the class of the regular
//! semisimple Hessenberg variety of h. Each entry is the linear functional L = DS_h on
//! monomials of degree |h| ([`HessenbergFunctional`]) applied to the Schubert polynomial S_w.
//!
//! By transition on values ([`coefficient_table_by_divsym`]), never building S_w:
//! Lascoux–Schützenberger transition
//! S_w = x_r S_v + Σ_q S_{v t_{qr}} (r the last descent of w, v = w t_{rs}) is linear, so
//! T(m, w) = L(m · S_w) for a monomial m satisfies T(m, w) = T(m x_r, v) + Σ_q T(m, v t_{qr})
//! with T(m, id) = L(m); a^h_w = T(1, w). The values T(m, w) are machine integers,
//! memoized per half of the listing (one half per core). Reference method
//! ([`coefficient_table_by_polynomials`]): S_w from [`SchubertTable`], then L term by term.
//!
//! Listing order: permutations of length |h| in lexicographic order of their one-line
//! notation (equivalently, of their Lehmer codes).

use crate::error::{MathError, MathResult};
use crate::hessenberg::divsym::HessenbergFunctional;
use crate::hessenberg::function::HessenbergFn;
use crate::hessenberg::table::{HessenbergTable, TABLE_MAX_N, TableEntry};
use crate::perms::listing::perms_of_length;
use crate::perms::perm::Perm;
use crate::poly::mono::Mono;
use crate::progress::Progress;
use crate::schubert::polynomial::SchubertTable;
use crate::schubert::transition::{pivot, raises_length_by_one};
use num_bigint::BigInt;
use rayon::prelude::*;
use std::collections::HashMap;

/// The listing of the w of length |h| (its length) and the entries `select`
/// keeps, with their listing positions; refuses n above [`TABLE_MAX_N`].
fn chosen_permutations(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
) -> MathResult<(usize, Vec<(usize, Perm)>)> {
    let n = h.n();
    if n > TABLE_MAX_N {
        return Err(MathError::OutOfRange(format!(
            "n = {n}; Hessenberg tables are computed for n <= {TABLE_MAX_N}"
        )));
    }
    let listing = perms_of_length(n, h.dimension());
    let listed = listing.len();
    let chosen = listing
        .into_iter()
        .enumerate()
        .filter(|(i, _)| select(*i))
        .collect();
    Ok((listed, chosen))
}

/// Computes a^h_w = DS_h(S_w) for the w of length |h| whose listing index passes `select`,
/// on rayon's pool, counting progress and stopping with `Canceled` when asked.
///
/// ```
/// use elbowroom_math::{Progress, hessenberg::function::HessenbergFn, hessenberg::reference::coefficient_table_by_divsym};
/// // n = 3, h = (2,3,3), |h| = 2: a_{231} = DS_3(S_{231}) = DS_3(x1 x2) = 1 and
/// // a_{312} = DS_3(x1^2) = 1 (the permutohedral variety has class σ_{213} + σ_{132})
/// let h = HessenbergFn::new(&[2, 3, 3]).unwrap();
/// let t = coefficient_table_by_divsym(&h, &|_| true, &Progress::new(0)).unwrap();
/// let values: Vec<String> = t.entries.iter().map(|e| format!("{}:{}", e.perm, e.value)).collect();
/// assert_eq!(values, vec!["231:1", "312:1"]);
/// ```
pub fn coefficient_table_by_divsym(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
) -> MathResult<HessenbergTable> {
    let (listed, chosen) = chosen_permutations(h, select)?;
    progress.set_total(chosen.len() as u64);
    let functional = HessenbergFunctional::new(h)?;
    // one contiguous batch per thread, so neighbouring permutations share a memo
    let threads = rayon::current_num_threads().max(1);
    let batch = chosen.len().div_ceil(threads).max(1);
    let entries = in_batches(
        &chosen,
        batch,
        progress,
        || TransitionValues {
            functional: &functional,
            memo: HashMap::new(),
        },
        |memo, w| {
            let mut word: Vec<u8> = w.one_line().iter().map(|&v| v as u8).collect();
            Ok(BigInt::from(memo.value(Mono::ONE, &mut word)?))
        },
    )?;
    Ok(HessenbergTable {
        h: h.clone(),
        entries,
        listed,
    })
}

/// Computes `value(state, w)` for every chosen (index, w) on rayon's pool, in
/// batches of `batch` neighbouring permutations that each start a fresh
/// `state` (a memo), counting progress and stopping with `Canceled` when asked.
fn in_batches<S>(
    chosen: &[(usize, Perm)],
    batch: usize,
    progress: &Progress,
    fresh: impl Fn() -> S + Sync,
    value: impl Fn(&mut S, &Perm) -> MathResult<BigInt> + Sync,
) -> MathResult<Vec<TableEntry>> {
    let batches: Vec<MathResult<Vec<TableEntry>>> = chosen
        .par_chunks(batch)
        .map(|chunk| {
            let mut state = fresh();
            let mut out = Vec::with_capacity(chunk.len());
            for (index, w) in chunk {
                progress.check()?;
                out.push(TableEntry {
                    index: *index,
                    perm: w.clone(),
                    value: value(&mut state, w)?,
                });
                progress.advance(1);
            }
            Ok(out)
        })
        .collect();
    let mut entries = Vec::with_capacity(chosen.len());
    for b in batches {
        entries.extend(b?);
    }
    if progress.is_canceled() {
        return Err(MathError::Canceled);
    }
    Ok(entries)
}

/// T(m, w) = DS_h(m · S_w), memoized, computed by transition (see the module notes).
struct TransitionValues<'a> {
    functional: &'a HessenbergFunctional,
    memo: HashMap<(u128, u64), i128>,
}

fn pack(w: &[u8]) -> u64 {
    w.iter().fold(0u64, |acc, &v| (acc << 4) | u64::from(v - 1))
}

fn overflow() -> MathError {
    MathError::OutOfRange("a table value does not fit 128 bits".into())
}

impl TransitionValues<'_> {
    fn value(&mut self, m: Mono, w: &mut [u8]) -> MathResult<i128> {
        let key = (m.0, pack(w));
        if let Some(v) = self.memo.get(&key) {
            return Ok(*v);
        }
        let Some((r, s)) = pivot(w) else {
            let v = i128::try_from(self.functional.value(m)).map_err(|_| overflow())?;
            self.memo.insert(key, v);
            return Ok(v);
        };
        w.swap(r, s); // w is now v = w t_{rs}
        let mut total = self.value(Mono(m.0 + Mono::var_index(r).0), w)?;
        for q in 0..r {
            if raises_length_by_one(w, q, r) {
                w.swap(q, r);
                let t = self.value(m, w);
                w.swap(q, r);
                total = total.checked_add(t?).ok_or_else(overflow)?;
            }
        }
        w.swap(r, s);
        self.memo.insert(key, total);
        Ok(total)
    }
}

/// The reference method: S_w from [`SchubertTable`] (one memo per batch of neighbouring
/// permutations), then DS_h term by term. Same arguments and result as [`coefficient_table_by_divsym`].
pub fn coefficient_table_by_polynomials(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
) -> MathResult<HessenbergTable> {
    let (listed, chosen) = chosen_permutations(h, select)?;
    progress.set_total(chosen.len() as u64);
    let functional = HessenbergFunctional::new(h)?;
    let batch = (chosen.len() / (rayon::current_num_threads().max(1) * 16)).clamp(1, 512);
    let entries = in_batches(&chosen, batch, progress, SchubertTable::new, |memo, w| {
        Ok(functional.apply(&memo.get(w)))
    })?;
    Ok(HessenbergTable {
        h: h.clone(),
        entries,
        listed,
    })
}
