//! Classes in H*(Fl_n) as flat bucketed vectors of packed keys, and the Monk
//! step λ · Σ c_w S_w for λ = x_i − x_j run on every core.
//!
//! A [`FlatVector`] holds its terms (w, c_w) in buckets by the first two
//! entries of w, each bucket a vector sorted by a packed key ([`FlatKey`]:
//! [`LexKey`], 64 bits, for n ≤ 16; [`WideLexKey`], 96 bits, for n ≤ 18), so
//! that the buckets read in order list the terms in lexicographic order of
//! one-line notation. A step never grows one big hash map (whose look-ups miss
//! the cache once it outgrows it): each worker takes a contiguous share of the input, writes every
//! term of Monk's rule into its own buffer of the target's bucket, and whenever a
//! buffer has doubled sorts and sums its new part and merges it into the part
//! already sorted (which is never sorted again); then each target bucket is
//! gathered by merging the workers' sorted buffers, on its own core. No
//! two threads ever write the same buffer, so there are no locks.
//!
//! Monk's rule in Chevalley's form (Monk 1959; Fulton, *Young Tableaux*, §10):
//! λ · S_w = Σ_{covers (a, b)} (λ_a − λ_b) S_{w t_{ab}} in H*(Fl_n), a cover being
//! a < b ≤ n with w(a) < w(b) and no c between them with w(a) < w(c) < w(b). For
//! λ = x_i − x_j only the covers meeting {i, j} count.
//!
//! Coefficients are checked machine integers or big integers ([`Coefficient`]);
//! a step in machine integers stops with [`StepError::Overflow`] and the caller
//! runs the product again in a wider type.

use crate::error::MathError;
use crate::progress::Progress;
use crate::schubert::vector::{Coefficient, StepError, StepResult};
use rayon::prelude::*;

/// How many terms a worker multiplies between two checks of the cancel flag.
const CHECK_EVERY: usize = 1 << 12;

/// Below this many terms a step runs on the calling thread alone.
const PARALLEL_FROM: usize = 1 << 14;

/// A worker's buffer of one bucket is sorted and summed in place when it
/// reaches twice its size after the last such pass, and at least this size.
const COMPACT_FROM: usize = 1 << 12;

/// The largest n any key holds ([`WideLexKey`]); arrays of one-line values
/// are this long plus one (index 0 unused).
pub const KEY_MAX_N: usize = 18;

/// A permutation packed so that the order of keys is the lexicographic order
/// of one-line notation, with the entries cheap to read and to swap.
///
/// Two widths: [`LexKey`] (8 bytes, n ≤ 16) and [`WideLexKey`] (12 bytes in a
/// 16-byte slot, n ≤ 18); the flat vectors are generic over the key, so a table
/// of n ≤ 16 keeps the narrow one and pays nothing for the wide.
pub trait FlatKey:
    Copy + Clone + Default + Ord + Eq + std::hash::Hash + std::fmt::Debug + Send + Sync + 'static
{
    /// The largest n whose permutations the key holds.
    const MAX_N: usize;
    /// The number of buckets (by a prefix of the key, so the buckets read in
    /// order list the keys in order).
    const BUCKETS: usize;
    /// The key of the one-line values w(1), ..., w(m) (1-based, m ≤ `MAX_N`).
    fn from_values(values: &[u8]) -> Self;
    /// The key of w0 w in S_n, (w0 w)(i) = n + 1 − w(i), from w(1), ..., w(n).
    fn of_reversed(w: &[u8], n: usize) -> Self;
    /// w(1), ..., w(n) at indices 1..=n (index 0 unused).
    fn values(self, n: usize) -> [u8; KEY_MAX_N + 1];
    /// The bucket of the key (< `BUCKETS`).
    fn bucket(self) -> usize;
    /// w t_{ab}: the entries in 1-based positions a and b swapped, given
    /// w(a) − 1 and w(b) − 1.
    fn swapped(self, a: usize, b: usize, va: u8, vb: u8) -> Self;
}

/// A permutation of S_n, n ≤ 16, packed so that integer order is lexicographic
/// order of one-line notation: w(i) − 1 in the nibble at bits 60 − 4(i − 1).
///
/// ```
/// use elbowroom_math::schubert::flat::{FlatKey, LexKey};
/// let a = LexKey::from_values(&[2, 1, 3]);
/// let b = LexKey::from_values(&[2, 3, 1]);
/// assert!(a < b);
/// assert_eq!(&b.values(3)[1..=3], &[2, 3, 1]);
/// // the key of w0 w, (w0 w)(i) = n + 1 − w(i), read from w
/// assert_eq!(LexKey::of_reversed(&[2, 3, 1], 3), LexKey::from_values(&[2, 1, 3]));
/// ```
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub struct LexKey(u64);

impl FlatKey for LexKey {
    const MAX_N: usize = 16;
    /// One per value of the top byte (w(1), w(2)).
    const BUCKETS: usize = 256;

    #[inline]
    fn from_values(values: &[u8]) -> LexKey {
        let mut key = 0u64;
        for (k, &v) in values.iter().enumerate().take(Self::MAX_N) {
            key |= (u64::from(v.wrapping_sub(1)) & 15) << (60 - 4 * k);
        }
        LexKey(key)
    }

    #[inline]
    fn of_reversed(w: &[u8], n: usize) -> LexKey {
        let mut key = 0u64;
        for (k, &v) in w.iter().enumerate().take(Self::MAX_N) {
            key |= (((n as u64).wrapping_sub(u64::from(v))) & 15) << (60 - 4 * k);
        }
        LexKey(key)
    }

    #[inline]
    fn values(self, n: usize) -> [u8; KEY_MAX_N + 1] {
        let mut out = [0u8; KEY_MAX_N + 1];
        for (k, slot) in out.iter_mut().skip(1).take(n.min(Self::MAX_N)).enumerate() {
            *slot = ((self.0 >> (60 - 4 * k)) & 15) as u8 + 1;
        }
        out
    }

    #[inline]
    fn bucket(self) -> usize {
        (self.0 >> 56) as usize
    }

    #[inline]
    fn swapped(self, a: usize, b: usize, va: u8, vb: u8) -> LexKey {
        let x = u64::from(va ^ vb);
        LexKey(self.0 ^ (x << (64 - 4 * a)) ^ (x << (64 - 4 * b)))
    }
}

impl LexKey {
    /// The raw packed key.
    pub fn raw(self) -> u64 {
        self.0
    }
}

/// A permutation of S_n, n ≤ 18, packed five bits an entry so that the order
/// of keys is lexicographic order of one-line notation: w(i) − 1 for
/// i = 1..12 in `high` at bits 59 − 5(i − 1) and up, for i = 13..18 in `low`
/// at bits 27 − 5(i − 13) and up; compared as (high, low).
///
/// ```
/// use elbowroom_math::schubert::flat::{FlatKey, WideLexKey};
/// let w: Vec<u8> = (1..=17).rev().collect();
/// let key = WideLexKey::from_values(&w);
/// assert_eq!(&key.values(17)[1..=17], &w[..]);
/// // swapping positions 1 and 17 of w0 gives 1 16 15 ... 2 17
/// let swapped: Vec<u8> = [1].into_iter().chain((2..=16).rev()).chain([17]).collect();
/// assert_eq!(
///     key.swapped(1, 17, 16, 0),
///     WideLexKey::from_values(&swapped)
/// );
/// assert!(WideLexKey::from_values(&swapped) < key);
/// ```
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub struct WideLexKey {
    high: u64,
    low: u32,
}

impl WideLexKey {
    /// Entries 1..=12 in `high`, 13..=18 in `low`.
    const IN_HIGH: usize = 12;

    /// The shift of the 1-based position `i` in its word.
    #[inline]
    fn shift(i: usize) -> u32 {
        if i <= Self::IN_HIGH {
            (64 - 5 * i) as u32
        } else {
            (32 - 5 * (i - Self::IN_HIGH)) as u32
        }
    }

    #[inline]
    fn set(&mut self, i: usize, v: u8) {
        let v = v & 31;
        if i <= Self::IN_HIGH {
            self.high |= u64::from(v) << Self::shift(i);
        } else {
            self.low |= u32::from(v) << Self::shift(i);
        }
    }

    #[inline]
    fn get(self, i: usize) -> u8 {
        if i <= Self::IN_HIGH {
            ((self.high >> Self::shift(i)) & 31) as u8
        } else {
            ((self.low >> Self::shift(i)) & 31) as u8
        }
    }

    #[inline]
    fn toggle(&mut self, i: usize, x: u8) {
        if i <= Self::IN_HIGH {
            self.high ^= u64::from(x) << Self::shift(i);
        } else {
            self.low ^= u32::from(x) << Self::shift(i);
        }
    }
}

impl FlatKey for WideLexKey {
    const MAX_N: usize = 18;
    /// One per value of the top ten bits (w(1), w(2)).
    const BUCKETS: usize = 1024;

    #[inline]
    fn from_values(values: &[u8]) -> WideLexKey {
        let mut key = WideLexKey::default();
        for (k, &v) in values.iter().enumerate().take(Self::MAX_N) {
            key.set(k + 1, v.wrapping_sub(1));
        }
        key
    }

    #[inline]
    fn of_reversed(w: &[u8], n: usize) -> WideLexKey {
        let mut key = WideLexKey::default();
        for (k, &v) in w.iter().enumerate().take(Self::MAX_N) {
            key.set(k + 1, (n as u8).wrapping_sub(v));
        }
        key
    }

    #[inline]
    fn values(self, n: usize) -> [u8; KEY_MAX_N + 1] {
        let mut out = [0u8; KEY_MAX_N + 1];
        for (i, slot) in out.iter_mut().enumerate().skip(1).take(n.min(Self::MAX_N)) {
            *slot = self.get(i) + 1;
        }
        out
    }

    #[inline]
    fn bucket(self) -> usize {
        (self.high >> 54) as usize
    }

    #[inline]
    fn swapped(self, a: usize, b: usize, va: u8, vb: u8) -> WideLexKey {
        let x = va ^ vb;
        let mut key = self;
        key.toggle(a, x);
        key.toggle(b, x);
        key
    }
}

/// A vector Σ c_w S_w in H*(Fl_n) (n ≤ `K::MAX_N`), its terms in buckets by
/// (w(1), w(2)), each sorted by the key K; no zero coefficients.
#[derive(Clone, Debug)]
pub struct FlatVector<C, K = LexKey> {
    n: usize,
    buckets: Vec<Vec<(K, C)>>,
}

impl<C: Coefficient, K: FlatKey> FlatVector<C, K> {
    /// S_id = 1 in H*(Fl_n); `OutOfRange` unless 1 ≤ n ≤ `K::MAX_N`.
    pub fn one(n: usize) -> Result<Self, MathError> {
        if n == 0 || n > K::MAX_N {
            return Err(MathError::OutOfRange(format!(
                "H*(Fl_{n}): n must be between 1 and {}",
                K::MAX_N
            )));
        }
        let mut buckets: Vec<Vec<(K, C)>> = (0..K::BUCKETS).map(|_| Vec::new()).collect();
        let id: Vec<u8> = (1..=n as u8).collect();
        let key = K::from_values(&id);
        buckets[key.bucket()].push((key, C::from_i64(1)));
        Ok(FlatVector { n, buckets })
    }

    /// The n of H*(Fl_n).
    pub fn n(&self) -> usize {
        self.n
    }

    /// The number of nonzero terms.
    pub fn len(&self) -> usize {
        self.buckets.iter().map(Vec::len).sum()
    }

    /// Whether the vector is 0.
    pub fn is_empty(&self) -> bool {
        self.buckets.iter().all(Vec::is_empty)
    }

    /// The terms in increasing lexicographic order of w.
    pub fn iter(&self) -> impl DoubleEndedIterator<Item = &(K, C)> {
        self.buckets.iter().flat_map(|b| b.iter())
    }

    /// c_w (0 when absent), by binary search in the bucket of w.
    pub fn coefficient(&self, key: K) -> C {
        let bucket = &self.buckets[key.bucket()];
        match bucket.binary_search_by_key(&key, |t| t.0) {
            Ok(k) => bucket[k].1.clone(),
            Err(_) => C::zero_value(),
        }
    }

    /// (x_i − x_j) · self in H*(Fl_n) by Monk's rule (module notes), consuming
    /// self (each input bucket is freed once multiplied); stops with `OutOfRange`
    /// when the result has more than `limit` terms, `Canceled` on a cancel.
    ///
    /// ```
    /// use elbowroom_math::Progress;
    /// use elbowroom_math::schubert::flat::{FlatKey, FlatVector, LexKey};
    /// // (x_1 − x_3) · 1 = S_{132} + S_{213} in H*(Fl_3)
    /// let one = FlatVector::<i64>::one(3).unwrap();
    /// let v = one.times_difference((1, 3), &Progress::default(), 100).unwrap();
    /// let terms: Vec<(u64, i64)> = v.iter().map(|(k, c)| (k.raw(), *c)).collect();
    /// assert_eq!(terms, vec![
    ///     (LexKey::from_values(&[1, 3, 2]).raw(), 1),
    ///     (LexKey::from_values(&[2, 1, 3]).raw(), 1),
    /// ]);
    /// ```
    pub fn times_difference(
        self,
        (i, j): (usize, usize),
        progress: &Progress,
        limit: u128,
    ) -> StepResult<Self> {
        let n = self.n;
        if i == 0 || j == 0 || i == j || i > n || j > n {
            return Err(StepError::Math(MathError::InvalidInput(format!(
                "x_{i} - x_{j} is not a difference of two variables of H*(Fl_{n})"
            ))));
        }
        let total = self.len();
        let workers = if total < PARALLEL_FROM {
            1
        } else {
            rayon::current_num_threads().max(1)
        };
        let groups = split_into_groups(self.buckets, total, workers);
        let sprays: Vec<StepResult<Spray<C, K>>> = if workers == 1 {
            groups
                .into_iter()
                .map(|g| spray_group(g, n, (i, j), progress))
                .collect()
        } else {
            groups
                .into_par_iter()
                .map(|g| spray_group(g, n, (i, j), progress))
                .collect()
        };
        let sprays = all_or_free_later(sprays)?;
        if let Err(e) = progress.check() {
            free_later(sprays);
            return Err(e.into());
        }
        // per target bucket, the workers' buffers
        let mut pieces: Vec<Vec<Vec<(K, C)>>> = (0..K::BUCKETS).map(|_| Vec::new()).collect();
        for spray in sprays {
            for (b, buf) in spray.buffers.into_iter().enumerate() {
                if !buf.is_empty() {
                    pieces[b].push(buf);
                }
            }
        }
        // each part is sorted with distinct keys (the workers finish their
        // buffers): the parts of a bucket are merged, never sorted again
        let gather = |parts: Vec<Vec<(K, C)>>| -> StepResult<Vec<(K, C)>> {
            if let Err(e) = progress.check() {
                free_later(parts);
                return Err(e.into());
            }
            let mut parts = parts;
            let Some(largest) = (0..parts.len()).max_by_key(|&k| parts[k].len()) else {
                return Ok(Vec::new());
            };
            let mut merged = parts.swap_remove(largest);
            for mut part in parts {
                merge_into(&mut merged, &mut part)?;
            }
            merged.shrink_to_fit();
            Ok(merged)
        };
        let buckets: Vec<StepResult<Vec<(K, C)>>> = if workers == 1 {
            pieces.into_iter().map(gather).collect()
        } else {
            pieces.into_par_iter().map(gather).collect()
        };
        let buckets = all_or_free_later(buckets)?;
        let out = FlatVector { n, buckets };
        let len = out.len() as u128;
        if len > limit {
            return Err(StepError::Math(MathError::OutOfRange(format!(
                "the product in H*(Fl_{n}) reaches {len} Schubert terms, more than the {limit} accepted"
            ))));
        }
        Ok(out)
    }
}

/// Frees `value` on the rayon pool rather than on the calling thread: a step
/// canceled while it holds gigabytes returns at once (freeing them takes a
/// tenth of a second at n = 17), and its memory goes back meanwhile.
pub fn free_later<T: Send + 'static>(value: T) {
    rayon::spawn(move || drop(value));
}

/// The values when every result is one; else the first error, the values
/// freed on the pool ([`free_later`]).
fn all_or_free_later<T: Send + 'static>(results: Vec<StepResult<T>>) -> StepResult<Vec<T>> {
    let mut kept = Vec::with_capacity(results.len());
    let mut first = None;
    for r in results {
        match r {
            Ok(v) => kept.push(v),
            Err(e) => {
                first.get_or_insert(e);
            }
        }
    }
    match first {
        None => Ok(kept),
        Some(e) => {
            free_later(kept);
            Err(e)
        }
    }
}

/// The input buckets cut into `workers` runs of about equal terms, in order.
fn split_into_groups<C, K>(
    buckets: Vec<Vec<(K, C)>>,
    total: usize,
    workers: usize,
) -> Vec<Vec<Vec<(K, C)>>> {
    let share = total.div_ceil(workers.max(1)).max(1);
    let mut groups = Vec::with_capacity(workers);
    let mut current = Vec::new();
    let mut size = 0usize;
    for b in buckets {
        if b.is_empty() {
            continue;
        }
        size += b.len();
        current.push(b);
        if size >= share {
            groups.push(std::mem::take(&mut current));
            size = 0;
        }
    }
    if !current.is_empty() {
        groups.push(current);
    }
    groups
}

/// One worker's output: a buffer per target bucket.
struct Spray<C, K> {
    buffers: Vec<Vec<(K, C)>>,
    /// Room for the unsorted rest of a buffer while it is compacted.
    scratch: Vec<(K, C)>,
    /// The length of each buffer after its last sort-and-sum.
    clean: Vec<usize>,
}

impl<C: Coefficient, K: FlatKey> Spray<C, K> {
    fn new() -> Self {
        Spray {
            buffers: (0..K::BUCKETS).map(|_| Vec::new()).collect(),
            scratch: Vec::new(),
            clean: vec![0; K::BUCKETS],
        }
    }

    #[inline]
    fn push(&mut self, key: K, c: C) -> StepResult<()> {
        let b = key.bucket();
        let buf = &mut self.buffers[b];
        buf.push((key, c));
        if buf.len() >= (2 * self.clean[b]).max(COMPACT_FROM) {
            compact(buf, self.clean[b], &mut self.scratch)?;
            self.clean[b] = buf.len();
        }
        Ok(())
    }

    /// Every buffer sorted with distinct keys and no zeros.
    fn finish(&mut self, progress: &Progress) -> StepResult<()> {
        for (buf, clean) in self.buffers.iter_mut().zip(&self.clean) {
            if buf.len() > *clean {
                progress.check()?;
                compact(buf, *clean, &mut self.scratch)?;
            }
        }
        self.scratch = Vec::new();
        Ok(())
    }
}

/// The terms of (x_i − x_j) · (one worker's share), into its own buffers; each
/// input bucket is dropped once multiplied.
fn spray_group<C: Coefficient, K: FlatKey>(
    group: Vec<Vec<(K, C)>>,
    n: usize,
    (i, j): (usize, usize),
    progress: &Progress,
) -> StepResult<Spray<C, K>> {
    let mut spray = Spray::new();
    let mut rest = group.into_iter();
    match spray_into(&mut spray, &mut rest, n, (i, j), progress) {
        Ok(()) => Ok(spray),
        Err(e) => {
            free_later((spray, rest));
            Err(e)
        }
    }
}

/// The body of [`spray_group`]: the buckets of `rest` multiplied into `spray`
/// until they run out or the step fails.
fn spray_into<C: Coefficient, K: FlatKey>(
    spray: &mut Spray<C, K>,
    rest: &mut std::vec::IntoIter<Vec<(K, C)>>,
    n: usize,
    (i, j): (usize, usize),
    progress: &Progress,
) -> StepResult<()> {
    let mut count = 0usize;
    let two = C::from_i64(2);
    let minus_two = C::from_i64(-2);
    let one = C::from_i64(1);
    let minus_one = C::from_i64(-1);
    for bucket in rest.by_ref() {
        for (key, c) in bucket {
            count += 1;
            if count.is_multiple_of(CHECK_EVERY) {
                progress.check()?;
            }
            let mut failure = None;
            covers_of_difference(key, n, (i, j), |target, mult| {
                if failure.is_some() {
                    return;
                }
                let factor = match mult {
                    2 => &two,
                    -2 => &minus_two,
                    1 => &one,
                    _ => &minus_one,
                };
                let pushed = c.mul_checked(factor).and_then(|t| spray.push(target, t));
                if let Err(e) = pushed {
                    failure = Some(e);
                }
            });
            if let Some(e) = failure {
                return Err(e);
            }
        }
    }
    spray.finish(progress)
}

/// Calls `emit(w t_{ab}, λ_a − λ_b)` for every cover (a, b) of w in S_n with
/// λ_a ≠ λ_b, for λ = x_i − x_j (λ_i = 1, λ_j = −1, else 0); the multiplier is
/// ±1 or ±2.
#[inline]
pub fn covers_of_difference<K: FlatKey>(
    key: K,
    n: usize,
    (i, j): (usize, usize),
    mut emit: impl FnMut(K, i8),
) {
    let v = key.values(n);
    let lambda = |k: usize| -> i8 {
        if k == i {
            1
        } else if k == j {
            -1
        } else {
            0
        }
    };
    for a in [i, j] {
        // covers (a, b), b > a: w(a) < w(b) below every w(c) > w(a) in between
        let va = v[a];
        let mut ceiling = u8::MAX;
        for (b, &vb) in v.iter().enumerate().take(n + 1).skip(a + 1) {
            if vb > va && vb < ceiling {
                ceiling = vb;
                let mult = lambda(a) - lambda(b);
                if mult != 0 {
                    emit(key.swapped(a, b, va - 1, vb - 1), mult);
                }
                if ceiling == va + 1 {
                    break;
                }
            }
        }
    }
    for b in [i, j] {
        // covers (a, b), a < b, a outside {i, j}: w(a) < w(b) above every w(c) < w(b) in between
        let vb = v[b];
        let mut floor = 0u8;
        for a in (1..b).rev() {
            let va = v[a];
            if va < vb && va > floor {
                floor = va;
                if a != i && a != j {
                    emit(key.swapped(a, b, va - 1, vb - 1), -lambda(b));
                }
                if floor + 1 == vb {
                    break;
                }
            }
        }
    }
}

/// A buffer whose first `clean` terms are sorted with distinct keys and no
/// zeros made so entirely: the rest sorted and summed on its own, then merged
/// into the clean run in place (the clean run is never sorted again).
/// `scratch` holds the rest meanwhile (kept by the caller between calls, so
/// a worker allocates it once).
fn compact<C: Coefficient, K: FlatKey>(
    buf: &mut Vec<(K, C)>,
    clean: usize,
    scratch: &mut Vec<(K, C)>,
) -> StepResult<()> {
    if clean == 0 {
        return combine(buf);
    }
    scratch.clear();
    scratch.extend(buf.drain(clean..));
    combine(scratch)?;
    merge_into(buf, scratch)
}

/// Merges the run `tail` into the run `head` (each sorted with distinct keys
/// and no zeros) in place, from the back: equal keys summed, zeros dropped.
/// `head` grows by at most `tail.len()`; no term is cloned; `tail` is left
/// empty (its allocation kept).
fn merge_into<C: Coefficient, K: FlatKey>(
    head: &mut Vec<(K, C)>,
    tail: &mut Vec<(K, C)>,
) -> StepResult<()> {
    let (h, t) = (head.len(), tail.len());
    if t == 0 {
        return Ok(());
    }
    head.reserve_exact(t);
    head.resize_with(h + t, || (K::default(), C::zero_value()));
    let (mut i, mut j, mut w) = (h, t, h + t);
    let mut summed = false;
    while j > 0 {
        if i > 0 && head[i - 1].0 > tail[j - 1].0 {
            head.swap(i - 1, w - 1);
            i -= 1;
        } else if i > 0 && head[i - 1].0 == tail[j - 1].0 {
            head.swap(i - 1, w - 1);
            head[w - 1].1.add_assign_checked(&tail[j - 1].1)?;
            summed = true;
            i -= 1;
            j -= 1;
        } else {
            std::mem::swap(&mut head[w - 1], &mut tail[j - 1]);
            j -= 1;
        }
        w -= 1;
    }
    tail.clear();
    // head[..i] is in place; the merged terms start at w (a gap when keys met)
    if w > i {
        head.drain(i..w);
    }
    if summed {
        head.retain(|term| !term.1.is_zero_value());
    }
    Ok(())
}

/// Sorts the terms by key and sums the repeated ones, dropping zeros.
fn combine<C: Coefficient, K: Ord + Copy>(v: &mut Vec<(K, C)>) -> StepResult<()> {
    v.sort_unstable_by_key(|t| t.0);
    let mut w = 0usize;
    for r in 0..v.len() {
        if w > 0 && v[w - 1].0 == v[r].0 {
            let c = std::mem::replace(&mut v[r].1, C::zero_value());
            v[w - 1].1.add_assign_checked(&c)?;
        } else {
            if w > 0 && v[w - 1].1.is_zero_value() {
                w -= 1;
            }
            v.swap(w, r);
            w += 1;
        }
    }
    if w > 0 && v[w - 1].1.is_zero_value() {
        w -= 1;
    }
    v.truncate(w);
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::perms::perm::Perm;
    use crate::schubert::vector::{LinearForm, SchubertVector, Space};

    /// Every step of the flat product agrees with the hash-map product by Monk's
    /// rule (`SchubertVector::times_linear`), factor by factor, for products of
    /// differences in S_6 and S_7 (two methods written apart).
    #[test]
    fn flat_steps_agree_with_the_map_steps() {
        for n in [4usize, 6, 7] {
            let mut flat = FlatVector::<i64>::one(n).unwrap();
            let mut map = SchubertVector::<i64>::one(Space::Flag(n));
            let factors: Vec<(usize, usize)> = (1..=n)
                .flat_map(|i| (i + 1..=n).rev().map(move |j| (i, j)))
                .filter(|&(i, j)| j > i + 1)
                .collect();
            for (i, j) in factors {
                flat = flat
                    .times_difference((i, j), &Progress::default(), u128::MAX)
                    .unwrap();
                map = map
                    .times_linear(&LinearForm::difference(i, j).unwrap(), &Progress::default())
                    .unwrap();
                assert_eq!(flat.len(), map.len(), "n = {n}, factor ({i}, {j})");
                for (w, c) in map.iter() {
                    let values = w.to_perm(n).unwrap();
                    let key = LexKey::from_values(values.as_bytes());
                    assert_eq!(flat.coefficient(key), *c);
                }
                let keys: Vec<LexKey> = flat.iter().map(|t| t.0).collect();
                assert!(keys.windows(2).all(|p| p[0] < p[1]));
            }
        }
    }

    #[test]
    fn keys_order_like_one_line_notation() {
        let perms: Vec<Perm> = Perm::all(5).collect();
        let keys: Vec<LexKey> = perms
            .iter()
            .map(|w| LexKey::from_values(w.as_bytes()))
            .collect();
        let mut sorted = perms.clone();
        sorted.sort_by(|a, b| a.as_bytes().cmp(b.as_bytes()));
        let mut by_key: Vec<(LexKey, &Perm)> = keys.iter().copied().zip(perms.iter()).collect();
        by_key.sort();
        assert!(by_key.iter().map(|t| t.1).eq(sorted.iter()));
    }

    /// The wide key reads back, orders and swaps as one-line notation does,
    /// on permutations of S_18 of every shape of swap (both positions in the
    /// high word, both in the low word, one in each).
    #[test]
    fn wide_keys_read_order_and_swap_like_one_line_notation() {
        let mut state = 0x9e37_79b9_7f4a_7c15u64;
        let mut next = move || {
            state ^= state << 13;
            state ^= state >> 7;
            state ^= state << 17;
            state
        };
        let mut perms: Vec<Vec<u8>> = Vec::new();
        for _ in 0..400 {
            let mut w: Vec<u8> = (1..=18).collect();
            for k in (1..w.len()).rev() {
                w.swap(k, (next() % (k as u64 + 1)) as usize);
            }
            perms.push(w);
        }
        for w in &perms {
            let key = WideLexKey::from_values(w);
            assert_eq!(&key.values(18)[1..=18], &w[..]);
            let reversed: Vec<u8> = w.iter().map(|&v| 19 - v).collect();
            assert_eq!(
                WideLexKey::of_reversed(w, 18),
                WideLexKey::from_values(&reversed)
            );
            for (a, b) in [(1, 2), (3, 12), (12, 13), (5, 17), (13, 18), (1, 18)] {
                let mut t = w.clone();
                t.swap(a - 1, b - 1);
                assert_eq!(
                    key.swapped(a, b, w[a - 1] - 1, w[b - 1] - 1),
                    WideLexKey::from_values(&t)
                );
            }
        }
        let mut by_key = perms.clone();
        by_key.sort_by_key(|w| WideLexKey::from_values(w));
        let mut by_line = perms;
        by_line.sort();
        assert_eq!(by_key, by_line);
        // the buckets are a prefix of the key: increasing with the key
        let mut keys: Vec<WideLexKey> =
            by_line.iter().map(|w| WideLexKey::from_values(w)).collect();
        keys.sort();
        assert!(keys.windows(2).all(|p| p[0].bucket() <= p[1].bucket()));
        assert!(keys.iter().all(|k| k.bucket() < WideLexKey::BUCKETS));
    }

    /// Products of differences on the wide key agree term by term with the
    /// narrow key (each written on its own packing), in S_7 through every
    /// factor, and in S_16 for a few factors meeting positions on both sides
    /// of the wide key's two words.
    #[test]
    fn wide_and_narrow_keys_give_the_same_products() {
        let cases: Vec<(usize, Vec<(usize, usize)>)> = vec![
            (
                7,
                (1..=7)
                    .flat_map(|i| (i + 1..=7).rev().map(move |j| (i, j)))
                    .collect(),
            ),
            (
                16,
                vec![(1, 16), (12, 13), (3, 14), (13, 16), (2, 12), (11, 15)],
            ),
        ];
        for (n, factors) in cases {
            let mut narrow = FlatVector::<i64, LexKey>::one(n).unwrap();
            let mut wide = FlatVector::<i64, WideLexKey>::one(n).unwrap();
            for &f in &factors {
                narrow = narrow
                    .times_difference(f, &Progress::default(), u128::MAX)
                    .unwrap();
                wide = wide
                    .times_difference(f, &Progress::default(), u128::MAX)
                    .unwrap();
                assert_eq!(narrow.len(), wide.len(), "n = {n}, factor {f:?}");
                for ((kn, cn), (kw, cw)) in narrow.iter().zip(wide.iter()) {
                    assert_eq!(kn.values(n), kw.values(n));
                    assert_eq!(cn, cw);
                }
            }
        }
    }

    /// Merging a sorted run into another in place gives what sorting and
    /// summing their concatenation gives, cancellations included.
    #[test]
    fn merging_runs_in_place_is_sorting_their_union() {
        let mut state = 0x2545_f491_4f6c_dd1du64;
        let mut next = move |m: u64| {
            state ^= state << 13;
            state ^= state >> 7;
            state ^= state << 17;
            state % m
        };
        for round in 0..300 {
            let run = |len: u64, next: &mut dyn FnMut(u64) -> u64| {
                let mut v: Vec<(LexKey, i64)> = (0..len)
                    .map(|_| (LexKey(next(64)), next(5) as i64 - 2))
                    .collect();
                combine(&mut v).unwrap();
                v
            };
            let head = run(next(40), &mut next);
            let tail = run(next(40), &mut next);
            let mut expected: Vec<(LexKey, i64)> = head.iter().chain(&tail).copied().collect();
            combine(&mut expected).unwrap();
            let mut merged = head.clone();
            let mut rest = tail.clone();
            merge_into(&mut merged, &mut rest).unwrap();
            assert_eq!(merged, expected, "round {round}: {head:?} + {tail:?}");
            assert!(rest.is_empty());
            // and through a buffer with a clean prefix
            let clean = head.len();
            let mut buf = head;
            buf.extend(tail.iter().rev().copied());
            compact(&mut buf, clean, &mut rest).unwrap();
            assert_eq!(buf, expected, "round {round}");
        }
    }

    #[test]
    fn overflow_is_reported_not_wrapped() {
        let mut v = vec![(LexKey(1), i64::MAX), (LexKey(1), 1)];
        assert_eq!(combine(&mut v), Err(StepError::Overflow));
    }
}
