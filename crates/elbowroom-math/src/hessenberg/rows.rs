//! Hessenberg tables row by row: a^h_w handed out in listing order, read off
//! the class by one sequential merge.
//!
//! Q_h = Π (x_i − x_j) is expanded by Monk's rule on flat bucketed vectors
//! ([`crate::schubert::flat`]), every factor on every core, into a vector sorted
//! lexicographically by w0 w. The table lists w of length |h| in lexicographic
//! order, which is the decreasing order of w0 w ((w0 w)(i) = n + 1 − w(i)); so the
//! rows are read by walking the listing and the class backwards together, with no
//! look-up. Coefficients run in checked `i64`, then `i128`, then big integers if
//! one overflows.
//!
//! Sizing before the start: the listing (the Mahonian number M(n, |h|)) against
//! [`CLASS_TABLE_LIMIT`], and the estimate of the terms the expansion holds at once
//! ([`held_terms_bound`]) against [`CLASS_HELD_LIMIT`]; each step is also refused
//! on its own if its result passes [`crate::hessenberg::class::CLASS_TERM_LIMIT`].

use crate::error::{MathError, MathResult};
use crate::hessenberg::class::{CLASS_TERM_LIMIT, class_factors};
use crate::hessenberg::function::HessenbergFn;
use crate::hessenberg::table::{HessenbergTable, TableEntry};
use crate::perms::listing::{for_each_of_length, mahonian_row};
use crate::perms::perm::Perm;
use crate::progress::Progress;
use crate::schubert::flat::{FlatKey, FlatVector, LexKey, WideLexKey, free_later};
use crate::schubert::vector::{Coefficient, StepError, StepResult, exactly};
use num_bigint::BigInt;
use num_traits::{Signed, Zero};

/// The most permutations a table by class may list (the Mahonian number M(n, |h|));
/// M(17, 16) = 170 193 528 (the default h of n = 17) is accepted.
pub const CLASS_TABLE_LIMIT: u128 = 175_000_000;

/// The most Schubert terms the expansion of Q_h may hold at once, as bounded
/// before it starts ([`held_terms_bound`]). The default h of n = 17 is estimated
/// at 471 089 041 (M(17, 16) + M(17, 17)) and accepted; measured, it holds far
/// fewer (docs/performance-tables.md).
pub const CLASS_HELD_LIMIT: u128 = 480_000_000;

/// The bytes a term of the expansion takes in S_n: a packed key and an `i64`
/// (16 bytes with [`LexKey`], n ≤ 16; 24 with [`WideLexKey`]).
pub fn bytes_per_term(n: usize) -> u128 {
    if n <= LexKey::MAX_N { 16 } else { 24 }
}

/// How many rows are listed between two checks of the cancel flag.
const CHECK_EVERY: usize = 1 << 12;

/// The estimate of the terms the expansion of Q_h holds at once: the Mahonian
/// numbers M(n, d) + M(n, d − 1), d = deg Q_h, the most terms Q_h and the partial
/// product before its last factor can have. The
/// partial products grow towards the end (measured for the default h up to
/// n = 16: each of the last twenty steps is larger than the one before), so these
/// two are the largest held; every other step is refused on its own by
/// [`crate::hessenberg::class::CLASS_TERM_LIMIT`] if it could pass it.
///
/// ```
/// use elbowroom_math::hessenberg::function::HessenbergFn;
/// use elbowroom_math::hessenberg::rows::held_terms_bound;
/// // h = (2,3,3): Q_h = x_1 − x_3 has one factor: 1 and S_{132} + S_{213}
/// assert_eq!(held_terms_bound(&HessenbergFn::new(&[2, 3, 3]).unwrap()), 3);
/// // the default h of n = 16: M(16, 105) + M(16, 104) = M(16, 15) + M(16, 16)
/// let h = HessenbergFn::default_for(16).unwrap();
/// assert_eq!(held_terms_bound(&h), 43_874_857 + 76_893_687);
/// ```
pub fn held_terms_bound(h: &HessenbergFn) -> u128 {
    let mahonian = mahonian_row(h.n());
    let d = class_factors(h).len();
    let at = |k: Option<usize>| k.and_then(|k| mahonian.get(k).copied()).unwrap_or(0);
    // the class, and the partial product without its last factor
    (at(Some(d)) + at(d.checked_sub(1))).max(1)
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
            (held * bytes_per_term(n)).div_ceil(1_000_000_000)
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
    /// The largest a^h_w that fit an `i128` (`None` before the first such row).
    largest_small: Option<i128>,
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

    /// Takes one more value into account, without a big integer when it fits.
    pub fn add_value(&mut self, value: &RowValue) {
        match value {
            RowValue::Int(v) => {
                self.rows += 1;
                self.total += *v;
                if *v != 0 {
                    self.nonzero += 1;
                }
                if *v < 0 {
                    self.negative += 1;
                }
                if self.largest_small.is_none_or(|m| *v > m) {
                    self.largest_small = Some(*v);
                }
            }
            RowValue::Big(v) => self.add(v),
        }
    }

    /// The largest value seen (0 when none was).
    pub fn max(&self) -> BigInt {
        match (&self.largest, self.largest_small) {
            (Some(big), Some(small)) => big.clone().max(BigInt::from(small)),
            (Some(big), None) => big.clone(),
            (None, Some(small)) => BigInt::from(small),
            (None, None) => BigInt::default(),
        }
    }
}

/// A coefficient a^h_w as read off the class: a machine integer when it fits.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum RowValue {
    /// The value, when it fits an `i128`.
    Int(i128),
    /// The value, when it does not.
    Big(BigInt),
}

impl RowValue {
    /// The value as a big integer.
    pub fn to_big(&self) -> BigInt {
        match self {
            RowValue::Int(v) => BigInt::from(*v),
            RowValue::Big(v) => v.clone(),
        }
    }

    fn of<C: Coefficient>(c: &C) -> RowValue {
        match c.to_i128_value() {
            Some(v) => RowValue::Int(v),
            None => RowValue::Big(c.to_big()),
        }
    }
}

/// One row as read off the class: w (its one-line values) at its listing
/// position, and a^h_w.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct ValueRow<'a> {
    /// The position of w in the full listing (0-based).
    pub index: usize,
    /// w(1), ..., w(n).
    pub line: &'a [u8],
    /// a^h_w = DS_h(S_w).
    pub value: RowValue,
}

/// The class Q_h in H*(Fl_n), sorted by w0 w, in whichever integers it fit;
/// keyed by [`LexKey`] (n ≤ 16) unless another key is named.
pub enum FlatClass<K = LexKey> {
    /// Every coefficient of every partial product fit an `i64`.
    Word(FlatVector<i64, K>),
    /// Every one fit an `i128`.
    Wide(FlatVector<i128, K>),
    /// Big integers.
    Big(FlatVector<BigInt, K>),
}

impl<K: FlatKey> FlatClass<K> {
    /// The number of nonzero terms of Q_h (the nonzero a^h_w).
    pub fn len(&self) -> usize {
        match self {
            FlatClass::Word(v) => v.len(),
            FlatClass::Wide(v) => v.len(),
            FlatClass::Big(v) => v.len(),
        }
    }

    /// Whether Q_h = 0 (never, for a Hessenberg function).
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }
}

fn product_in<C: Coefficient, K: FlatKey>(
    n: usize,
    factors: &[(usize, usize)],
    progress: &Progress,
) -> StepResult<FlatVector<C, K>> {
    let mut v = FlatVector::<C, K>::one(n)?;
    for &pair in factors {
        v = v.times_difference(pair, progress, CLASS_TERM_LIMIT)?;
        progress.advance(1);
    }
    Ok(v)
}

/// Q_h = Π_{i<j, j>h(i)} (x_i − x_j) in H*(Fl_n) on flat vectors, every factor
/// on every core, in `i64`, else `i128`, else big integers; progress advances
/// once a factor. Not sized here: [`size_class_table`] first. Keyed by
/// [`LexKey`], so n ≤ 16 (`OutOfRange` beyond); [`flat_class_keyed`] takes
/// the key as a parameter.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::hessenberg::function::HessenbergFn;
/// use elbowroom_math::hessenberg::rows::{FlatClass, flat_class};
/// // h = (1,2,3): Q_h = (x_1 − x_2)(x_1 − x_3)(x_2 − x_3) = 3! S_{321} in H*(Fl_3)
/// let q = flat_class(&HessenbergFn::new(&[1, 2, 3]).unwrap(), &Progress::default()).unwrap();
/// let FlatClass::Word(v) = q else { panic!() };
/// let terms: Vec<i64> = v.iter().map(|t| t.1).collect();
/// assert_eq!(terms, vec![6]);
/// ```
pub fn flat_class(h: &HessenbergFn, progress: &Progress) -> MathResult<FlatClass> {
    flat_class_keyed::<LexKey>(h, progress)
}

/// [`flat_class`] with the permutations packed in the key K (n ≤ `K::MAX_N`).
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::hessenberg::function::HessenbergFn;
/// use elbowroom_math::hessenberg::rows::{FlatClass, flat_class_keyed};
/// use elbowroom_math::schubert::flat::WideLexKey;
/// // h = (2,3,3): Q_h = x_1 − x_3 = S_{132} + S_{213}, in either key
/// let h = HessenbergFn::new(&[2, 3, 3]).unwrap();
/// let q = flat_class_keyed::<WideLexKey>(&h, &Progress::default()).unwrap();
/// let FlatClass::Word(v) = q else { panic!() };
/// assert_eq!(v.iter().map(|t| t.1).collect::<Vec<i64>>(), vec![1, 1]);
/// ```
pub fn flat_class_keyed<K: FlatKey>(
    h: &HessenbergFn,
    progress: &Progress,
) -> MathResult<FlatClass<K>> {
    let factors = class_factors(h);
    let n = h.n();
    match product_in::<i64, K>(n, &factors, progress) {
        Ok(v) => Ok(FlatClass::Word(v)),
        Err(StepError::Math(e)) => Err(e),
        Err(StepError::Overflow) => exactly(
            || product_in::<i128, K>(n, &factors, progress).map(FlatClass::Wide),
            || product_in::<BigInt, K>(n, &factors, progress).map(FlatClass::Big),
        ),
    }
}

/// Calls `visit` with a^h_w for every w of length |h| whose listing index passes
/// `select`, in listing order, read off `class` (= Q_h) by a backward merge.
fn read_rows<C: Coefficient, K: FlatKey, E: From<MathError>>(
    class: &FlatVector<C, K>,
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
    visit: &mut dyn FnMut(ValueRow<'_>) -> Result<(), E>,
) -> Result<(), E> {
    let n = h.n();
    let mut cursor = class.iter().rev().peekable();
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
        let key = K::of_reversed(line, n);
        while cursor.next_if(|t| t.0 > key).is_some() {}
        let value = match cursor.peek() {
            Some(t) if t.0 == key => RowValue::of(&t.1),
            _ => RowValue::Int(0),
        };
        if let Err(e) = visit(ValueRow { index, line, value }) {
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
    Ok(())
}

/// Calls `visit` with a^h_w for every w of length |h| whose listing index passes
/// `select`, in listing order (lexicographic in one-line notation), zeros
/// included; returns the length of the full listing, M(n, |h|). The class is
/// expanded on every core ([`flat_class`]) and read by one merge.
///
/// a^h_w is the coefficient of S_{w0 w} in Q_h (Anderson–Tymoczko), with
/// (w0 w)(i) = n + 1 − w(i). Sized before it starts ([`size_class_table`]);
/// cancellable in every phase; progress counts the factors of Q_h, then the listing.
/// An error of `visit` (a failed write) stops the walk and is returned.
pub fn for_each_class_value<E: From<MathError>>(
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
    visit: &mut dyn FnMut(ValueRow<'_>) -> Result<(), E>,
) -> Result<usize, E> {
    let listed = size_class_table(h)?;
    progress.set_total(class_factors(h).len() as u64 + listed as u64);
    if h.n() <= LexKey::MAX_N {
        let class = flat_class_keyed::<LexKey>(h, progress)?;
        rows_then_free(class, h, select, progress, visit)?;
    } else {
        let class = flat_class_keyed::<WideLexKey>(h, progress)?;
        rows_then_free(class, h, select, progress, visit)?;
    }
    Ok(listed as usize)
}

/// The rows of `class`; when they stop early (a cancel, a failed write) the
/// class is freed on the rayon pool, so the caller hears of it at once.
fn rows_then_free<K: FlatKey, E: From<MathError>>(
    class: FlatClass<K>,
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
    visit: &mut dyn FnMut(ValueRow<'_>) -> Result<(), E>,
) -> Result<(), E> {
    let read = for_each_row_of(&class, h, select, progress, visit);
    if read.is_err() {
        free_later(class);
    }
    read
}

/// The rows of [`for_each_class_value`] read off a class already expanded
/// (`class` = Q_h for this h, from [`flat_class`]) by one backward merge.
pub fn for_each_row_of<K: FlatKey, E: From<MathError>>(
    class: &FlatClass<K>,
    h: &HessenbergFn,
    select: &(dyn Fn(usize) -> bool + Sync),
    progress: &Progress,
    visit: &mut dyn FnMut(ValueRow<'_>) -> Result<(), E>,
) -> Result<(), E> {
    match class {
        FlatClass::Word(v) => read_rows(v, h, select, progress, visit),
        FlatClass::Wide(v) => read_rows(v, h, select, progress, visit),
        FlatClass::Big(v) => read_rows(v, h, select, progress, visit),
    }
}

/// Calls `visit` with a^h_w for every w of length |h| whose listing index passes
/// `select`, in listing order (lexicographic in one-line notation), zeros included;
/// returns the length of the full listing, M(n, |h|): the rows of
/// [`for_each_class_value`] with their values as big integers.
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
    for_each_class_value(h, select, progress, &mut |row| {
        visit(ClassRow {
            index: row.index,
            line: row.line,
            value: row.value.to_big(),
        })
    })
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

    /// The rows read off the flat class agree with the class expanded on hash maps
    /// (`hessenberg_class`, Monk's rule written apart), for every Hessenberg
    /// function of n ≤ 6.
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
                        q.coefficient(crate::schubert::vector::PackedPerm::from_values(&u)),
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

    fn table_of(h: &HessenbergFn) -> Vec<(Vec<u8>, RowValue)> {
        let mut rows = Vec::new();
        for_each_class_value(h, &|_| true, &Progress::default(), &mut |row| {
            rows.push((row.line.to_vec(), row.value));
            Ok::<(), MathError>(())
        })
        .unwrap();
        rows
    }

    /// n = 17 runs on the wide key. Q_h for h = (16, 17, ..., 17) is
    /// x_1 − x_17 = S_{s_1} + S_{s_16} in H*(Fl_17), since S_{s_k} = x_1 + ⋯ + x_k
    /// and x_1 + ⋯ + x_n = 0 there (Fulton, *Young Tableaux*, §10): so a^h_w = 1
    /// exactly for w0 w = s_1 and s_16, 0 for the other 14 w of length 135.
    #[test]
    fn n_17_reads_the_class_of_one_difference() {
        let mut values = vec![17usize; 17];
        values[0] = 16;
        let h = HessenbergFn::new(&values).unwrap();
        let rows = table_of(&h);
        assert_eq!(rows.len() as u128, mahonian_row(17)[h.dimension()]);
        assert_eq!(rows.len(), 16);
        let ones: Vec<&Vec<u8>> = rows
            .iter()
            .filter(|(_, v)| *v == RowValue::Int(1))
            .map(|(w, _)| w)
            .collect();
        let w0_s1: Vec<u8> = [16, 17].into_iter().chain((1..=15).rev()).collect();
        let w0_s16: Vec<u8> = (3..=17).rev().chain([1, 2]).collect();
        assert_eq!(ones, vec![&w0_s1, &w0_s16]);
        assert!(rows.iter().all(|(_, v)| matches!(v, RowValue::Int(0 | 1))));
    }

    /// a^h_w = a^{h*}_{w0 w w0}, h* the transpose of h in the antidiagonal (the
    /// symmetry of the class under the flip of the flag, from memory), on
    /// classes of S_17 with a few factors each (at most six: the listing is
    /// M(17, k) for k factors), whose keys use both words of the wide key.
    #[test]
    fn n_17_tables_have_the_antidiagonal_symmetry() {
        use crate::explain::symmetry::transpose_hessenberg;
        let cases: Vec<Vec<usize>> = vec![
            [15, 16].into_iter().chain([17; 15]).collect(),
            [14, 17].into_iter().chain([17; 15]).collect(),
            [15, 15, 15].into_iter().chain([17; 14]).collect(),
        ];
        for values in cases {
            let h = HessenbergFn::new(&values).unwrap();
            let star = transpose_hessenberg(&h).unwrap();
            let table = table_of(&h);
            let flipped: std::collections::HashMap<Vec<u8>, RowValue> =
                table_of(&star).into_iter().collect();
            assert_eq!(table.len(), flipped.len(), "h = {h}");
            for (w, v) in &table {
                // (w0 w w0)(i) = 18 − w(18 − i)
                let conj: Vec<u8> = (1..=17).map(|i| 18 - w[17 - i]).collect();
                assert_eq!(flipped.get(&conj), Some(v), "h = {h}, w = {w:?}");
            }
            assert!(table.iter().any(|(_, v)| *v != RowValue::Int(0)));
        }
    }
}
