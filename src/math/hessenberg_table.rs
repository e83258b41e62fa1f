//! Hessenberg class tables: a^h_w = DS_h(S_w) for every w in S_n with ℓ(w) = |h|.
//!
//! a^h_w is the coefficient of the Schubert class σ_{w0 w} in the class of the regular
//! semisimple Hessenberg variety of h. Each entry is the linear functional DS_h on
//! monomials of degree |h| ([`HessenbergFunctional`]) applied to the Schubert polynomial
//! S_w; Schubert polynomials come from a memo of transitions, one memo per batch of
//! neighbouring permutations, and batches run on rayon's pool.
//!
//! Listing order: permutations of length |h| in lexicographic order of their one-line
//! notation (equivalently, of their Lehmer codes).

use super::divsym::HessenbergFunctional;
use super::error::{MathError, MathResult};
use super::hessenberg::HessenbergFn;
use super::perm::Perm;
use super::progress::Progress;
use super::schubert::SchubertTable;
use num_bigint::BigInt;
use num_traits::{Signed, Zero};
use rayon::prelude::*;

/// One entry a^h_w of a table.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct TableEntry {
    /// The position of w in the full listing (0-based).
    pub index: usize,
    /// The permutation w.
    pub perm: Perm,
    /// a^h_w = DS_h(S_w).
    pub value: BigInt,
}

/// The coefficients a^h_w for the selected w of length |h| (all of them unless sharded).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct HessenbergTable {
    /// The Hessenberg function.
    pub h: HessenbergFn,
    /// The entries, in listing order.
    pub entries: Vec<TableEntry>,
    /// How many permutations the full listing has.
    pub listed: usize,
}

impl HessenbergTable {
    /// Σ_w a^h_w over the entries present.
    pub fn total(&self) -> BigInt {
        self.entries.iter().map(|e| &e.value).sum()
    }

    /// The number of nonzero entries.
    pub fn nonzero(&self) -> usize {
        self.entries.iter().filter(|e| !e.value.is_zero()).count()
    }

    /// The largest entry (0 for an empty table).
    pub fn max(&self) -> BigInt {
        self.entries
            .iter()
            .map(|e| e.value.clone())
            .max()
            .unwrap_or_else(BigInt::zero)
    }

    /// The entries with a negative value (none, by the positivity of Hessenberg classes).
    pub fn negative(&self) -> Vec<&TableEntry> {
        self.entries
            .iter()
            .filter(|e| e.value.is_negative())
            .collect()
    }
}

/// All w in S_n with ℓ(w) = len, in lexicographic order of one-line notation.
///
/// ```
/// use elbowroom::math::hessenberg_table::perms_of_length;
/// let w: Vec<String> = perms_of_length(3, 1).iter().map(|w| w.to_string()).collect();
/// assert_eq!(w, vec!["132", "213"]);
/// ```
pub fn perms_of_length(n: usize, len: usize) -> Vec<Perm> {
    fn go(i: usize, n: usize, rest: usize, code: &mut Vec<usize>, out: &mut Vec<Perm>) {
        if i == n {
            if rest == 0
                && let Ok(w) = Perm::from_code(code, Some(n))
            {
                out.push(w);
            }
            return;
        }
        // c_i <= n - i (1-based i), and the later entries can hold at most Σ_{k>i} (n - k)
        let cap = n - 1 - i;
        let later: usize = (i + 1..n).map(|k| n - 1 - k).sum();
        for c in 0..=cap.min(rest) {
            if rest - c > later {
                continue;
            }
            code.push(c);
            go(i + 1, n, rest - c, code, out);
            code.pop();
        }
    }
    let mut out = Vec::new();
    if n >= 1 && len <= n * (n - 1) / 2 {
        go(0, n, len, &mut Vec::with_capacity(n), &mut out);
    }
    out
}

/// Computes a^h_w = DS_h(S_w) for the w of length |h| whose listing index passes `select`,
/// on rayon's pool, counting progress and stopping with `Canceled` when asked.
///
/// ```
/// use elbowroom::math::{Progress, hessenberg::HessenbergFn, hessenberg_table::hessenberg_table};
/// // n = 3, h = (2,3,3), |h| = 2: a_{231} = DS_3(S_{231}) = DS_3(x1 x2) = 1 and
/// // a_{312} = DS_3(x1^2) = 1 (the permutohedral variety has class σ_{213} + σ_{132})
/// let h = HessenbergFn::new(&[2, 3, 3]).unwrap();
/// let t = hessenberg_table(&h, &|_| true, &Progress::new(0)).unwrap();
/// let values: Vec<String> = t.entries.iter().map(|e| format!("{}:{}", e.perm, e.value)).collect();
/// assert_eq!(values, vec!["231:1", "312:1"]);
/// ```
pub fn hessenberg_table(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
) -> MathResult<HessenbergTable> {
    let n = h.n();
    let listing = perms_of_length(n, h.dimension());
    let listed = listing.len();
    let chosen: Vec<(usize, Perm)> = listing
        .into_iter()
        .enumerate()
        .filter(|(i, _)| select(*i))
        .collect();
    progress.set_total(chosen.len() as u64);
    let functional = HessenbergFunctional::new(h)?;
    let batch = (chosen.len() / (rayon::current_num_threads().max(1) * 16)).clamp(1, 512);
    let batches: Vec<MathResult<Vec<TableEntry>>> = chosen
        .par_chunks(batch)
        .map(|chunk| {
            let mut memo = SchubertTable::new();
            let mut out = Vec::with_capacity(chunk.len());
            for (index, w) in chunk {
                progress.check()?;
                let s = memo.get(w);
                let value = functional.apply(&s);
                out.push(TableEntry {
                    index: *index,
                    perm: w.clone(),
                    value,
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
    Ok(HessenbergTable {
        h: h.clone(),
        entries,
        listed,
    })
}
