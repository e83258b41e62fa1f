//! Hessenberg tables row by row: a^h_w handed out in listing order as each is
//! read off the class, so that a table of any number of rows is written with
//! memory bounded by the class, not by the rows.
//!
//! Q_h = Π (x_i − x_j) is expanded by Monk's rule ([`crate::hessenberg::class`])
//! up to its last factor λ = x_i − x_j; the last product is never built. Its
//! coefficient of S_u is read off the partial product P by Monk's rule read
//! backwards (Chevalley's formula λ · S_v = Σ_{v ⋖ v t_{ab}} (λ_a − λ_b) S_{v t_{ab}}):
//!
//! [S_u] λ·P = Σ_{a < b, u(a) > u(b), ℓ(u t_{ab}) = ℓ(u) − 1} (λ_a − λ_b) [S_{u t_{ab}}] P,
//!
//! where ℓ drops by one exactly when no position c between a and b has
//! u(b) < u(c) < u(a). Only pairs meeting {i, j} count (λ_a = λ_b otherwise), so
//! each row costs a few look-ups. A shard thus computes only its own rows of the
//! last product, and the largest vector held is P, not Q_h.
//!
//! Sizing before the start: the listing (the Mahonian number M(n, |h|)) against
//! [`CLASS_TABLE_LIMIT`], and the estimate of the terms the expansion holds at once
//! ([`held_terms_bound`]) against [`CLASS_HELD_LIMIT`]; each step is also refused
//! on its own before it starts if it could pass its limit.

use crate::error::{MathError, MathResult};
use crate::hessenberg::class::{class_factors, product_of_differences};
use crate::hessenberg::function::HessenbergFn;
use crate::hessenberg::table::{HessenbergTable, TableEntry};
use crate::perms::listing::{for_each_of_length, mahonian_row};
use crate::perms::perm::MAX_N;
use crate::perms::perm::Perm;
use crate::progress::Progress;
use crate::schubert::vector::{Coefficient, PackedPerm, StepError, StepResult, TermMap, exactly};
use num_bigint::BigInt;
use num_traits::{Signed, Zero};

/// The most permutations a table by class may list (the Mahonian number M(n, |h|));
/// M(16, 15) = 43 874 857 (the default h of n = 16) is accepted.
pub const CLASS_TABLE_LIMIT: u128 = 50_000_000;

/// The most Schubert terms the expansion of Q_h may hold at once, as bounded
/// before it starts ([`held_terms_bound`]). The default h of n = 16 is estimated
/// at 207 595 673 (M(16, 16) + M(16, 17)) and accepted; measured, it holds far
/// fewer (README, "Performance").
pub const CLASS_HELD_LIMIT: u128 = 220_000_000;

/// How many rows are listed between two checks of the cancel flag.
const CHECK_EVERY: usize = 1 << 12;

/// The estimate of the terms the expansion of Q_h holds at once: the Mahonian
/// numbers M(n, d − 1) + M(n, d − 2), d = deg Q_h, the most terms its last two
/// partial products (the last one built and the one before it) can have. The
/// partial products grow towards the end (measured for the default h up to
/// n = 16: each of the last twenty steps is larger than the one before), so these
/// two are the largest held; every other step is refused on its own by
/// [`crate::hessenberg::class::CLASS_TERM_LIMIT`] if it could pass it.
///
/// ```
/// use elbowroom_math::hessenberg::function::HessenbergFn;
/// use elbowroom_math::hessenberg::rows::held_terms_bound;
/// // h = (2,3,3): Q_h = x_1 − x_3 has one factor; only S_id = 1 is ever held
/// assert_eq!(held_terms_bound(&HessenbergFn::new(&[2, 3, 3]).unwrap()), 1);
/// // the default h of n = 16: M(16, 16) + M(16, 17)
/// let h = HessenbergFn::default_for(16).unwrap();
/// assert_eq!(held_terms_bound(&h), 76_893_687 + 130_701_986);
/// ```
pub fn held_terms_bound(h: &HessenbergFn) -> u128 {
    let mahonian = mahonian_row(h.n());
    let d = class_factors(h).len();
    let at = |k: Option<usize>| k.and_then(|k| mahonian.get(k).copied()).unwrap_or(0);
    // the partial product without the last factor, and the one before it
    (at(d.checked_sub(1)) + at(d.checked_sub(2))).max(1)
}

/// Refuses a table whose listing or expansion is too large; returns M(n, |h|).
pub fn size_class_table(h: &HessenbergFn) -> MathResult<u128> {
    let n = h.n();
    let listed = mahonian_row(n).get(h.dimension()).copied().unwrap_or(0);
    if listed > CLASS_TABLE_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "the table of h = {h} lists {listed} permutations (those of length {} in S_{n}), \
             more than the {CLASS_TABLE_LIMIT} accepted",
            h.dimension()
        )));
    }
    let held = held_terms_bound(h);
    if held > CLASS_HELD_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "the class of h = {h} in H*(Fl_{n}) is estimated to hold up to {held} Schubert \
             terms at once (about {} GB), more than the {CLASS_HELD_LIMIT} accepted",
            held * 48 / 1_000_000_000
        )));
    }
    Ok(listed)
}

/// One row of a table: w (its one-line values) at its listing position, and a^h_w.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct ClassRow<'a> {
    /// The position of w in the full listing (0-based).
    pub index: usize,
    /// w(1), ..., w(n).
    pub line: &'a [u8],
    /// a^h_w = DS_h(S_w).
    pub value: BigInt,
}

/// Σ a^h_w, the nonzero and negative counts and the maximum of the rows seen,
/// accumulated as they go by.
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct RowSummary {
    /// The number of rows seen.
    pub rows: usize,
    /// Σ a^h_w.
    pub total: BigInt,
    /// The number of nonzero a^h_w.
    pub nonzero: usize,
    /// The number of negative a^h_w.
    pub negative: usize,
    /// The largest a^h_w (`None` before the first row).
    largest: Option<BigInt>,
}

impl RowSummary {
    /// Takes one more value into account.
    pub fn add(&mut self, value: &BigInt) {
        self.rows += 1;
        self.total += value;
        if !value.is_zero() {
            self.nonzero += 1;
        }
        if value.is_negative() {
            self.negative += 1;
        }
        if self.largest.as_ref().is_none_or(|m| value > m) {
            self.largest = Some(value.clone());
        }
    }

    /// The largest value seen (0 when none was).
    pub fn max(&self) -> BigInt {
        self.largest.clone().unwrap_or_default()
    }
}

/// The partial product of Q_h without its last factor, in whichever integers it fit.
enum Partial {
    Word(TermMap<i64>),
    Small(TermMap<i128>),
    Big(TermMap<BigInt>),
}

/// [S_u] P, for a class with no factor at all (P = Q_h = 1).
fn lookup<C: Coefficient>(p: &TermMap<C>, u: &[u8; MAX_N + 1], n: usize) -> BigInt {
    p.get(&PackedPerm::from_values(&u[1..=n]))
        .map_or_else(BigInt::default, Coefficient::to_big)
}

/// [S_u] (x_i − x_j)·P from P (module notes); `u` holds u(1..=n) at indices 1..=n.
/// The sum is taken in C and again in big integers if it overflows.
fn last_product_coefficient<C: Coefficient>(
    p: &TermMap<C>,
    (i, j): (usize, usize),
    u: &[u8; MAX_N + 1],
    n: usize,
) -> BigInt {
    let lambda = |k: usize| -> i64 {
        if k == i {
            1
        } else if k == j {
            -1
        } else {
            0
        }
    };
    let key = PackedPerm::from_values(&u[1..=n]);
    let mut terms: [(PackedPerm, i64); 4 * MAX_N] = [(PackedPerm::IDENTITY, 0); 4 * MAX_N];
    let mut count = 0;
    for a in [i, j] {
        // (a, b), b > a: u(b) < u(a) and above every u(c) < u(a) between them
        let mut floor = 0u8;
        for b in a + 1..=n {
            if u[b] < u[a] && u[b] > floor {
                floor = u[b];
                let mult = lambda(a) - lambda(b);
                if mult != 0 {
                    terms[count] = (key.swapped(a, b), mult);
                    count += 1;
                }
            }
        }
    }
    for b in [i, j] {
        // (a, b), a < b, a outside {i, j}: u(a) > u(b) and below every u(c) > u(b) between
        let mut ceiling = u8::MAX;
        for a in (1..b).rev() {
            if u[a] > u[b] && u[a] < ceiling {
                ceiling = u[a];
                if a != i && a != j {
                    terms[count] = (key.swapped(a, b), -lambda(b));
                    count += 1;
                }
            }
        }
    }
    let terms = &terms[..count];
    let small = || -> StepResult<C> {
        let mut sum = C::zero_value();
        for (v, mult) in terms {
            if let Some(c) = p.get(v) {
                sum.add_assign_checked(&c.mul_checked(&C::from_i64(*mult))?)?;
            }
        }
        Ok(sum)
    };
    match small() {
        Ok(sum) => sum.to_big(),
        Err(_) => terms
            .iter()
            .filter_map(|(v, mult)| p.get(v).map(|c| c.to_big() * BigInt::from(*mult)))
            .sum(),
    }
}

/// Calls `visit` with a^h_w for every w of length |h| whose listing index passes
/// `select`, in listing order (lexicographic in one-line notation), zeros included;
/// returns the length of the full listing, M(n, |h|).
///
/// a^h_w is the coefficient of S_{w0 w} in Q_h (Anderson–Tymoczko), with
/// (w0 w)(i) = n + 1 − w(i). Sized before it starts ([`size_class_table`]);
/// cancellable in every phase; progress counts the factors of Q_h, then the listing.
/// An error of `visit` (a failed write) stops the walk and is returned.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::hessenberg::function::HessenbergFn;
/// use elbowroom_math::hessenberg::rows::for_each_class_row;
/// // n = 3, h = (2,3,3): Q_h = x_1 − x_3 = S_{132} + S_{213}, so a_{231} = a_{312} = 1
/// let h = HessenbergFn::new(&[2, 3, 3]).unwrap();
/// let mut seen = Vec::new();
/// let listed = for_each_class_row(&h, &|_| true, &Progress::default(), &mut |row| {
///     seen.push(format!("{:?}:{}", row.line, row.value));
///     Ok::<(), elbowroom_math::MathError>(())
/// })
/// .unwrap();
/// assert_eq!((listed, seen), (2, vec!["[2, 3, 1]:1".to_string(), "[3, 1, 2]:1".to_string()]));
/// ```
pub fn for_each_class_row<E: From<MathError>>(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
    visit: &mut dyn FnMut(ClassRow<'_>) -> Result<(), E>,
) -> Result<usize, E> {
    let listed = size_class_table(h)?;
    let mut factors = class_factors(h);
    progress.set_total(factors.len() as u64 + listed as u64);
    let last = factors.pop();
    // i64 first (half the memory), then i128, then big integers
    let partial = match product_of_differences::<i64>(h.n(), &factors, progress) {
        Ok(v) => Partial::Word(v),
        Err(StepError::Math(e)) => return Err(e.into()),
        Err(StepError::Overflow) => exactly(
            || product_of_differences::<i128>(h.n(), &factors, progress).map(Partial::Small),
            || product_of_differences::<BigInt>(h.n(), &factors, progress).map(Partial::Big),
        )?,
    };
    let n = h.n();
    let value_of = |u: &[u8; MAX_N + 1]| -> BigInt {
        match (&partial, last) {
            (Partial::Word(p), Some(pair)) => last_product_coefficient(p, pair, u, n),
            (Partial::Small(p), Some(pair)) => last_product_coefficient(p, pair, u, n),
            (Partial::Big(p), Some(pair)) => last_product_coefficient(p, pair, u, n),
            (Partial::Word(p), None) => lookup(p, u, n),
            (Partial::Small(p), None) => lookup(p, u, n),
            (Partial::Big(p), None) => lookup(p, u, n),
        }
    };
    if last.is_some() {
        progress.advance(1);
    }
    let mut reversed = [0u8; MAX_N + 1];
    let mut pending = 0usize;
    let mut failure: Option<E> = None;
    let walked = for_each_of_length(n, h.dimension(), &mut |index, line| {
        pending += 1;
        if pending >= CHECK_EVERY {
            progress.check()?;
            progress.advance(pending as u64);
            pending = 0;
        }
        if !select(index) {
            return Ok(());
        }
        for (k, &v) in line.iter().enumerate() {
            reversed[k + 1] = n as u8 + 1 - v;
        }
        let value = value_of(&reversed);
        if let Err(e) = visit(ClassRow { index, line, value }) {
            failure = Some(e);
            // stops the walk; the visitor's error is returned below
            return Err(MathError::Canceled);
        }
        Ok(())
    });
    if let Some(e) = failure {
        return Err(e);
    }
    walked?;
    progress.advance(pending as u64);
    progress.check()?;
    Ok(listed as usize)
}

/// a^h_w for the w of length |h| whose listing index passes `select`, collected
/// into a table (the rows of [`for_each_class_row`]): for the window and for small
/// tables; the commands stream the rows instead.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::hessenberg::rows::coefficient_table_by_class;
/// use elbowroom_math::hessenberg::function::HessenbergFn;
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
    let mut entries = Vec::new();
    let listed = for_each_class_row(h, select, progress, &mut |row| {
        let line: Vec<usize> = row.line.iter().map(|&v| usize::from(v)).collect();
        entries.push(TableEntry {
            index: row.index,
            perm: Perm::from_one_line(&line)?,
            value: row.value,
        });
        Ok::<(), MathError>(())
    })?;
    Ok(HessenbergTable {
        h: h.clone(),
        entries,
        listed,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::hessenberg::class::hessenberg_class;

    /// The row-by-row last step agrees with the whole product by Monk's rule, for
    /// every Hessenberg function of n ≤ 6.
    #[test]
    fn last_step_read_backwards_is_monk() {
        for n in 1..=6 {
            for h in HessenbergFn::all(n) {
                let q = hessenberg_class(&h, &Progress::default()).unwrap();
                let mut rows = 0;
                for_each_class_row(&h, &|_| true, &Progress::default(), &mut |row| {
                    let u: Vec<u8> = row.line.iter().map(|&v| n as u8 + 1 - v).collect();
                    assert_eq!(
                        row.value,
                        q.coefficient(PackedPerm::from_values(&u)),
                        "h = {h}"
                    );
                    rows += 1;
                    Ok::<(), MathError>(())
                })
                .unwrap();
                assert_eq!(rows as u128, mahonian_row(n)[h.dimension()]);
            }
        }
    }
}
