//! The sweep over every Hessenberg function of n: for each h the summary of its
//! table a^h_w (w in S_n, ℓ(w) = |h|).
//!
//! There are Catalan(n) functions (1430 at n = 8, 4862 at n = 9). For each one the
//! class Q_h = Π_{i<j, j>h(i)} (x_i − x_j) is expanded in H*(Fl_n) through Monk's rule
//! (see [`crate::hessenberg::class`]); a^h_w is its coefficient of S_{w0 w}, so the
//! summary is read off the vector: its terms are exactly the nonzero a^h_w.
//!
//! Sharing: the factors of Q_h in row i are x_i − x_j for j = n, n − 1, ..., h(i) + 1,
//! and the rows are multiplied from the top. So the functions are walked depth-first
//! by h(1), h(2), ...: the partial product of rows 1..i − 1 is shared by every h with
//! that prefix, and within row i the choices h(i) = n, n − 1, ... are one chain, each
//! a single factor more than the previous. Every node of the walk costs one
//! multiplication. The subtrees under each (h(1), h(2)) run on rayon's pool. The
//! walk's recursion depth is n ≤ 16.

use crate::error::{MathError, MathResult};
use crate::hessenberg::class::times_difference;
use crate::hessenberg::function::HessenbergFn;
use crate::perms::listing::mahonian_row;
use crate::progress::Progress;
use crate::schubert::vector::{Coefficient, SchubertVector, Space, StepResult, exactly};
use num_bigint::BigInt;
use num_traits::Zero;
use rayon::prelude::*;

/// The largest n swept (Catalan(10) = 16 796 functions).
pub const SWEEP_MAX_N: usize = 10;

/// The summary of one table a^h_w over the w of length |h|.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct SweepRow {
    /// The Hessenberg function.
    pub h: HessenbergFn,
    /// |h| = Σ (h(i) − i), the dimension of the Hessenberg variety and ℓ(w) of the listing.
    pub dimension: usize,
    /// Σ_w a^h_w.
    pub total: BigInt,
    /// The number of w with a^h_w ≠ 0.
    pub nonzero: usize,
    /// The largest a^h_w (0 when some listed w has a^h_w = 0 and the rest are negative).
    pub max: BigInt,
    /// The number of w with a^h_w < 0.
    pub negative: usize,
}

/// Every Hessenberg function of n, in lexicographic order (the order of
/// [`HessenbergFn::all`]), with the summary of its table; cancellable, with progress
/// counting functions.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::hessenberg::sweep::sweep_every_h;
/// // n = 3: h = (1,2,3) has Q_h = Δ = 6 S_{321}, so a_{123} = 3! = 6; h = (2,3,3) has
/// // a_{231} = a_{312} = 1; h = (3,3,3) is the whole flag variety, a_{321} = 1
/// let rows = sweep_every_h(3, &Progress::default()).unwrap();
/// let text: Vec<String> = rows.iter().map(|r| format!("{} {} {}", r.h, r.dimension, r.total)).collect();
/// assert_eq!(text, vec!["(1,2,3) 0 6", "(1,3,3) 1 3", "(2,2,3) 1 3", "(2,3,3) 2 2", "(3,3,3) 3 1"]);
/// ```
pub fn sweep_every_h(n: usize, progress: &Progress) -> MathResult<Vec<SweepRow>> {
    if n == 0 {
        return Err(MathError::OutOfRange(format!(
            "n = 0: the sweep over every Hessenberg function runs for 1 <= n <= {SWEEP_MAX_N}"
        )));
    }
    if n > SWEEP_MAX_N {
        // Catalan(n) = C(2n, n)/(n + 1) (OEIS A000108), exact in u128 for n <= 16
        let catalan = (0..n as u128).fold(1u128, |c, k| c * 2 * (2 * k + 1) / (k + 2));
        return Err(MathError::OutOfRange(format!(
            "n = {n}: the sweep over every Hessenberg function would meet Catalan({n}) = \
             {catalan} functions; it runs for 1 <= n <= {SWEEP_MAX_N}"
        )));
    }
    let count = HessenbergFn::all(n).len();
    progress.set_total(count as u64);
    let mut rows = exactly(
        || sweep_in::<i128>(n, progress),
        || sweep_in::<BigInt>(n, progress),
    )?;
    rows.sort_by(|a, b| a.h.cmp(&b.h));
    if rows.len() != count {
        return Err(MathError::InvalidInput(format!(
            "internal: the sweep met {} functions, not Catalan({n}) = {count}",
            rows.len()
        )));
    }
    Ok(rows)
}

/// The shared state of one walk.
struct Walk<'a> {
    n: usize,
    mahonian: &'a [u128],
    progress: &'a Progress,
}

fn sweep_in<C: Coefficient>(n: usize, progress: &Progress) -> StepResult<Vec<SweepRow>> {
    let mahonian = mahonian_row(n);
    let walk = Walk {
        n,
        mahonian: &mahonian,
        progress,
    };
    let space = Space::flag(n)?;
    // the tasks: every choice of h(1) (and of h(2) when n >= 2), run in parallel
    let mut tasks: Vec<Vec<usize>> = Vec::new();
    for a in 1..=n {
        if n >= 2 {
            for b in a.max(2)..=n {
                tasks.push(vec![a, b]);
            }
        } else {
            tasks.push(vec![a]);
        }
    }
    let results: Vec<StepResult<Vec<SweepRow>>> = tasks
        .par_iter()
        .map(|prefix| {
            // the rows of the prefix, from scratch
            let mut v = SchubertVector::<C>::one(space);
            let mut degree = 0;
            for (k, &hk) in prefix.iter().enumerate() {
                for j in (hk + 1..=n).rev() {
                    degree += 1;
                    v = times_difference(&v, (k + 1, j), degree, walk.mahonian, progress)?;
                }
            }
            let mut out = Vec::new();
            let mut h = prefix.clone();
            walk.descend(&mut h, &v, degree, &mut out)?;
            Ok(out)
        })
        .collect();
    let mut rows = Vec::with_capacity(HessenbergFn::all(n).len());
    for r in results {
        rows.extend(r?);
    }
    Ok(rows)
}

impl Walk<'_> {
    /// With h(1..i) fixed in `h` and `v` = the product of their rows (of degree
    /// `degree`), every completion of h.
    fn descend<C: Coefficient>(
        &self,
        h: &mut Vec<usize>,
        v: &SchubertVector<C>,
        degree: usize,
        out: &mut Vec<SweepRow>,
    ) -> StepResult<()> {
        self.progress.check()?;
        let n = self.n;
        let i = h.len() + 1;
        if i > n {
            out.push(self.summary(h, v)?);
            self.progress.advance(1);
            return Ok(());
        }
        let low = h.last().copied().unwrap_or(1).max(i);
        // h(i) = n (no factor), then n − 1, ... : each one more factor x_i − x_{k+1}
        let mut cur = v.clone();
        let mut d = degree;
        for k in (low..=n).rev() {
            if k < n {
                d += 1;
                cur = times_difference(&cur, (i, k + 1), d, self.mahonian, self.progress)?;
            }
            h.push(k);
            self.descend(h, &cur, d, out)?;
            h.pop();
        }
        Ok(())
    }

    fn summary<C: Coefficient>(&self, h: &[usize], v: &SchubertVector<C>) -> StepResult<SweepRow> {
        let h = HessenbergFn::new(h)?;
        let dimension = h.dimension();
        let listed = self.mahonian.get(dimension).copied().unwrap_or(0);
        let mut total = C::zero_value();
        let mut max: Option<C> = None;
        let mut negative = 0;
        for (_, c) in v.iter() {
            total.add_assign_checked(c)?;
            if c.is_negative_value() {
                negative += 1;
            }
            if max.as_ref().is_none_or(|m| c > m) {
                max = Some(c.clone());
            }
        }
        let mut max = max.map_or_else(BigInt::zero, |m| m.to_big());
        if (v.len() as u128) < listed && max < BigInt::zero() {
            max = BigInt::zero();
        }
        Ok(SweepRow {
            h,
            dimension,
            total: total.to_big(),
            nonzero: v.len(),
            max,
            negative,
        })
    }
}
