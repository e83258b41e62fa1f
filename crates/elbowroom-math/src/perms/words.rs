//! Reduced words of a permutation: lazy lexicographic listing, exact counts
//! (in total and by content), and the commutation and braid moves between them.
//!
//! A reduced word of w is a_1 ... a_l with w = s_{a_1} s_{a_2} ... s_{a_l} and
//! l = ℓ(w). Its first letter is a left descent of w (a value a with a + 1
//! standing to the left of a in one-line notation), and the rest is a reduced
//! word of s_{a_1} w. Its last letter is a right descent (a position i with
//! w(i) > w(i+1)), and the rest is a reduced word of w s_{a_l}.

use crate::error::{MathError, MathResult};
use crate::perms::class::contains_pattern;
use crate::perms::perm::Perm;
use crate::progress::Progress;
use num_bigint::BigUint;
use num_traits::Zero;
use std::collections::{BTreeMap, HashMap};

/// The reduced words of w in lexicographic order, produced one at a time.
///
/// A depth-first search over first letters (left descents, smallest first) with
/// an explicit stack: memory is O(ℓ(w)), whatever the number of words.
#[derive(Clone, Debug)]
pub struct ReducedWords {
    /// Positions of values in the current permutation u = s_{a_k} ... s_{a_1} w
    /// (so inv[v] = u^{-1}(v + 1) - 1, 0-based).
    inv: Vec<u8>,
    word: Vec<usize>,
    length: usize,
    started: bool,
    done: bool,
}

/// The reduced words of w in lexicographic order, lazily.
///
/// ```
/// use elbowroom_math::{Perm, perms::words::reduced_words};
/// // w = 321 = s_1 s_2 s_1 = s_2 s_1 s_2
/// let w = Perm::parse("321").unwrap();
/// let all: Vec<Vec<usize>> = reduced_words(&w).collect();
/// assert_eq!(all, vec![vec![1, 2, 1], vec![2, 1, 2]]);
/// ```
pub fn reduced_words(w: &Perm) -> ReducedWords {
    ReducedWords {
        inv: w.inverse().as_bytes().iter().map(|&v| v - 1).collect(),
        word: Vec::with_capacity(w.length()),
        length: w.length(),
        started: false,
        done: false,
    }
}

impl ReducedWords {
    /// Undoes the last letter; returns it, or None at the root.
    fn pop(&mut self) -> Option<usize> {
        let a = self.word.pop()?;
        self.inv.swap(a - 1, a);
        Some(a)
    }
}

impl Iterator for ReducedWords {
    type Item = Vec<usize>;

    fn next(&mut self) -> Option<Vec<usize>> {
        if self.done {
            return None;
        }
        let mut start = if self.started {
            match self.pop() {
                Some(a) => a + 1,
                None => {
                    self.done = true;
                    return None;
                }
            }
        } else {
            self.started = true;
            1
        };
        loop {
            if self.word.len() == self.length {
                return Some(self.word.clone());
            }
            // smallest left descent a >= start of the current permutation
            let n = self.inv.len();
            match (start..n).find(|&a| self.inv[a - 1] > self.inv[a]) {
                Some(a) => {
                    self.inv.swap(a - 1, a);
                    self.word.push(a);
                    start = 1;
                }
                None => match self.pop() {
                    Some(a) => start = a + 1,
                    None => {
                        self.done = true;
                        return None;
                    }
                },
            }
        }
    }
}

/// The maps of the layered counts, keyed by packed words (Fx hashing: SipHash
/// would dominate the run time).
type PackedMap<K, V> = HashMap<K, V, rustc_hash::FxBuildHasher>;

/// The largest weak-order layer the counts will hold (beyond it they give up
/// with [`MathError::OutOfRange`] rather than exhaust memory).
pub const LAYER_LIMIT: usize = 4_000_000;

fn check_layer(len: usize) -> MathResult<()> {
    if len > LAYER_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "more than {LAYER_LIMIT} permutations in one layer of the weak-order interval below w; too large to count here"
        )));
    }
    Ok(())
}

/// A permutation of size <= 16 packed 4 bits per entry (0-based values), entry i at bits 4i.
fn pack(w: &Perm) -> u64 {
    w.as_bytes()
        .iter()
        .enumerate()
        .fold(0u64, |acc, (i, &v)| acc | (((v - 1) as u64) << (4 * i)))
}

#[inline]
fn nibble(p: u64, i: usize) -> u64 {
    (p >> (4 * i)) & 0xf
}

/// w·s_{i+1} on a packed permutation: swaps entries i and i+1 (0-based).
#[inline]
fn swap_adjacent(p: u64, i: usize) -> u64 {
    let a = nibble(p, i);
    let b = nibble(p, i + 1);
    let cleared = p & !(0xffu64 << (4 * i));
    cleared | (b << (4 * i)) | (a << (4 * (i + 1)))
}

/// Layered path counting in u128; None when a count overflows.
fn count_layers_u128(
    start: u64,
    n: usize,
    length: usize,
    progress: &Progress,
) -> MathResult<Option<u128>> {
    let mut layer: PackedMap<u64, u128> = PackedMap::default();
    layer.insert(start, 1);
    for _ in 0..length {
        progress.check()?;
        let mut next: PackedMap<u64, u128> = PackedMap::default();
        next.reserve(layer.len() * 2);
        for (&p, &c) in &layer {
            check_layer(next.len())?;
            for i in 0..n - 1 {
                if nibble(p, i) > nibble(p, i + 1) {
                    let slot = next.entry(swap_adjacent(p, i)).or_insert(0);
                    let Some(sum) = slot.checked_add(c) else {
                        return Ok(None);
                    };
                    *slot = sum;
                }
            }
        }
        check_layer(next.len())?;
        layer = next;
        progress.advance(1);
    }
    Ok(Some(layer.values().copied().sum()))
}

/// Layered path counting in big integers.
fn count_layers_big(
    start: u64,
    n: usize,
    length: usize,
    progress: &Progress,
) -> MathResult<BigUint> {
    let mut layer: PackedMap<u64, BigUint> = PackedMap::default();
    layer.insert(start, BigUint::from(1u8));
    for _ in 0..length {
        progress.check()?;
        let mut next: PackedMap<u64, BigUint> = PackedMap::default();
        for (&p, c) in &layer {
            check_layer(next.len())?;
            for i in 0..n - 1 {
                if nibble(p, i) > nibble(p, i + 1) {
                    *next.entry(swap_adjacent(p, i)).or_default() += c;
                }
            }
        }
        check_layer(next.len())?;
        layer = next;
        progress.advance(1);
    }
    Ok(layer.into_values().fold(BigUint::zero(), |a, b| a + b))
}

/// The number of reduced words of w, exactly.
///
/// Counts maximal chains from w down to the identity in right weak order, one
/// length at a time (two layers kept, keyed by packed permutations), in 128-bit
/// integers with a big-integer fallback on overflow. For w0 this is Stanley's
/// count (N)! / Π_{k=1}^{n-1} (2k-1)^{n-k}, N = n(n-1)/2 (OEIS A005118).
///
/// ```
/// use elbowroom_math::{Perm, perms::words::count_reduced_words};
/// use num_bigint::BigUint;
/// // w0 in S_4: 6! / (1^3 3^2 5^1) = 16 (Stanley 1984)
/// assert_eq!(count_reduced_words(&Perm::longest(4)).unwrap(), BigUint::from(16u32));
/// ```
///
/// [`MathError::OutOfRange`] when the interval below w is too large to count
/// (a layer beyond [`LAYER_LIMIT`]); [`count_reduced_words_with`] also reports
/// progress and can be cancelled.
pub fn count_reduced_words(w: &Perm) -> MathResult<BigUint> {
    count_reduced_words_with(w, &Progress::default())
}

/// [`count_reduced_words`] with progress and cancellation;
/// [`MathError::OutOfRange`] when the interval below w is too large.
///
/// Two methods: when w has lexicographic rank below [`RANK_LIMIT`] (all of S_n
/// for n <= 10), a pull over all permutations lexicographically below w, in
/// decreasing order, in one flat array ([`count_reduced_words_by_rank`]);
/// otherwise the layered push ([`count_reduced_words_layered`]).
pub fn count_reduced_words_with(w: &Perm, progress: &Progress) -> MathResult<BigUint> {
    if let Some(count) = count_reduced_words_vexillary(w) {
        return Ok(count);
    }
    if let Some(count) = count_reduced_words_by_rank(w, progress)? {
        return Ok(count);
    }
    count_reduced_words_layered(w, progress)
}

/// For vexillary w (2143-avoiding) the Stanley symmetric function is a single
/// Schur function s_λ with λ the Lehmer code sorted decreasingly (or its
/// conjugate), so the number of reduced words is the number f^λ of standard
/// Young tableaux, by the hook length formula (Stanley, European J. Combin.
/// 1984; Edelman–Greene 1987). None for other w. For w0 this is
/// N! / Π_{k=1}^{n-1} (2k-1)^{n-k}.
///
/// ```
/// use elbowroom_math::{Perm, perms::words::count_reduced_words_vexillary};
/// use num_bigint::BigUint;
/// // w0 in S_5: 10! / (1^4 3^3 5^2 7) = 768 (OEIS A005118)
/// assert_eq!(count_reduced_words_vexillary(&Perm::longest(5)), Some(BigUint::from(768u32)));
/// assert_eq!(count_reduced_words_vexillary(&Perm::parse("2143").unwrap()), None);
/// ```
pub fn count_reduced_words_vexillary(w: &Perm) -> Option<BigUint> {
    if contains_pattern(w, &[2, 1, 4, 3]) {
        return None;
    }
    let mut shape = w.code();
    shape.sort_unstable_by(|a, b| b.cmp(a));
    shape.retain(|&p| p > 0);
    let size: usize = shape.iter().sum();
    let mut num = BigUint::from(1u8);
    for k in 2..=size {
        num *= BigUint::from(k);
    }
    let mut hooks = BigUint::from(1u8);
    for (i, &row) in shape.iter().enumerate() {
        for j in 0..row {
            let arm = row - j - 1;
            let leg = shape[i + 1..].iter().filter(|&&r| r > j).count();
            hooks *= BigUint::from(arm + leg + 1);
        }
    }
    Some(num / hooks)
}

/// The layered method: maximal chains from w down to the identity in right weak
/// order, one length at a time, two layers of a hash map keyed by packed
/// permutations, u128 counts with a big-integer rerun on overflow.
pub fn count_reduced_words_layered(w: &Perm, progress: &Progress) -> MathResult<BigUint> {
    let n = w.n();
    if n < 2 {
        return Ok(BigUint::from(1u8));
    }
    let length = w.length();
    progress.set_total(length as u64);
    let start = pack(w);
    match count_layers_u128(start, n, length, progress)? {
        Some(c) => Ok(BigUint::from(c)),
        None => {
            progress.set_total(2 * length as u64);
            count_layers_big(start, n, length, progress)
        }
    }
}

/// The largest lexicographic rank (plus one) for which [`count_reduced_words_by_rank`] runs.
pub const RANK_LIMIT: usize = 4_000_000;

/// The rank method, or None when w's rank is at least [`RANK_LIMIT`] or a count
/// overflows 128 bits.
///
/// Every cover x < x·s_i in right weak order (x(i) < x(i+1)) goes up in
/// lexicographic order, so the number of paths from w down to x,
/// N(x) = Σ_{i : x(i) < x(i+1)} N(x s_i) with N(w) = 1, can be filled in for
/// all x lexicographically below w in decreasing order; then the number of
/// reduced words of w is N(id). Permutations are walked through their Lehmer
/// codes (the factorial-base digits of their rank): i is an ascent of x iff
/// c_i <= c_{i+1}, and x s_i has c_i' = c_{i+1} + 1, c_{i+1}' = c_i, so its rank
/// is found by a difference of two factorials, with no permutation built.
pub fn count_reduced_words_by_rank(w: &Perm, progress: &Progress) -> MathResult<Option<BigUint>> {
    let n = w.n();
    if n < 2 {
        return Ok(Some(BigUint::from(1u8)));
    }
    let mut code = w.code();
    // weights[k] = (n - 1 - k)!
    let mut weights = vec![1usize; n];
    for k in (0..n - 1).rev() {
        weights[k] = weights[k + 1] * (n - 1 - k);
    }
    let mut rank = 0usize;
    for k in 0..n {
        rank = match code[k]
            .checked_mul(weights[k])
            .and_then(|t| rank.checked_add(t))
        {
            Some(r) if r < RANK_LIMIT => r,
            _ => return Ok(None),
        };
    }
    let top = rank;
    let mut paths = vec![0u128; top + 1];
    paths[top] = 1;
    progress.set_total(top as u64 + 1);
    while rank > 0 {
        // the previous code in factorial base: decrement the last nonzero digit,
        // set the digits after it to their largest values
        let Some(k) = (0..n).rev().find(|&k| code[k] > 0) else {
            break;
        };
        code[k] -= 1;
        for (j, c) in code.iter_mut().enumerate().skip(k + 1) {
            *c = n - 1 - j;
        }
        rank -= 1;
        if rank & 0xffff == 0 {
            progress.check()?;
            progress.advance(0x10000);
        }
        let mut sum = 0u128;
        for i in 0..n - 1 {
            if code[i] <= code[i + 1] {
                // rank(x s_i) - rank(x), positive
                let up = rank + (code[i + 1] + 1 - code[i]) * weights[i] + code[i] * weights[i + 1]
                    - code[i + 1] * weights[i + 1];
                if up <= top {
                    let Some(s2) = sum.checked_add(paths[up]) else {
                        return Ok(None);
                    };
                    sum = s2;
                }
            }
        }
        paths[rank] = sum;
    }
    Ok(Some(BigUint::from(paths[0])))
}

/// The number of reduced words of w with each content (c_i = number of letters
/// equal to i; vectors of length n - 1), by the same layered propagation
/// (empty when too large; see [`counts_by_content_with`]).
///
/// ```
/// use elbowroom_math::{Perm, perms::words::counts_by_content};
/// use num_bigint::BigUint;
/// // 321 has the words 121 and 212
/// let by = counts_by_content(&Perm::parse("321").unwrap());
/// assert_eq!(by[&vec![2, 1]], BigUint::from(1u8));
/// assert_eq!(by[&vec![1, 2]], BigUint::from(1u8));
/// ```
pub fn counts_by_content(w: &Perm) -> BTreeMap<Vec<usize>, BigUint> {
    counts_by_content_with(w, &Progress::default()).unwrap_or_default()
}

/// [`counts_by_content`] with progress and cancellation; [`MathError::OutOfRange`]
/// when a layer of (permutation, content) pairs exceeds [`LAYER_LIMIT`].
pub fn counts_by_content_with(
    w: &Perm,
    progress: &Progress,
) -> MathResult<BTreeMap<Vec<usize>, BigUint>> {
    let n = w.n();
    let length = w.length();
    if length > 255 {
        return Err(MathError::OutOfRange(format!(
            "ℓ(w) = {length}; contents are counted for lengths up to 255"
        )));
    }
    progress.set_total(length as u64);
    // key: packed permutation and content, 8 bits per letter (letter i at bits 8(i-1))
    let mut layer: PackedMap<(u64, u128), BigUint> = PackedMap::default();
    layer.insert((pack(w), 0), BigUint::from(1u8));
    for _ in 0..length {
        progress.check()?;
        let mut next: PackedMap<(u64, u128), BigUint> = PackedMap::default();
        for (&(p, content), c) in &layer {
            check_layer(next.len())?;
            for i in 0..n.saturating_sub(1) {
                if nibble(p, i) > nibble(p, i + 1) {
                    let key = (swap_adjacent(p, i), content + (1u128 << (8 * i)));
                    *next.entry(key).or_default() += c;
                }
            }
        }
        check_layer(next.len())?;
        layer = next;
        progress.advance(1);
    }
    let mut out = BTreeMap::new();
    for ((_, content), c) in layer {
        let v: Vec<usize> = (0..n.saturating_sub(1))
            .map(|i| ((content >> (8 * i)) & 0xff) as usize)
            .collect();
        *out.entry(v).or_insert_with(BigUint::zero) += c;
    }
    Ok(out)
}

/// The reduced words of w by content and by comaj: for each content c, the
/// polynomial Σ_{a ∈ Red(w), c(a) = c} q^{comaj(a)} as its coefficients (comaj(a) =
/// Σ of the positions i with a_i < a_{i+1}), by the layered propagation of
/// [`counts_by_content_with`] that also keeps the letter last placed (words are built
/// from their last letter back). [`MathError::OutOfRange`] beyond [`LAYER_LIMIT`].
///
/// ```
/// use elbowroom_math::{Perm, Progress, perms::words::counts_by_content_and_comaj_with};
/// // 1432: 232 (comaj 1) and 323 (comaj 2)
/// let by = counts_by_content_and_comaj_with(&Perm::parse("1432").unwrap(), &Progress::default()).unwrap();
/// assert_eq!(by[&vec![0, 2, 1]], vec![0, 1]);
/// assert_eq!(by[&vec![0, 1, 2]], vec![0, 0, 1]);
/// ```
pub fn counts_by_content_and_comaj_with(
    w: &Perm,
    progress: &Progress,
) -> MathResult<BTreeMap<Vec<usize>, Vec<u64>>> {
    let n = w.n();
    let length = w.length();
    if length > 255 {
        return Err(MathError::OutOfRange(format!(
            "ℓ(w) = {length}; contents are counted for lengths up to 255"
        )));
    }
    let overflow = || MathError::OutOfRange("a count of reduced words left 64-bit integers".into());
    progress.set_total(length as u64);
    // key: packed permutation, packed content, last letter placed (0: none yet)
    let mut layer: PackedMap<(u64, u128, u8), Vec<u64>> = PackedMap::default();
    layer.insert((pack(w), 0, 0), vec![1]);
    for placed in 0..length {
        progress.check()?;
        let position = length - placed; // 1-based position of the letter placed now
        let mut next: PackedMap<(u64, u128, u8), Vec<u64>> = PackedMap::default();
        for (&(p, content, last), poly) in &layer {
            check_layer(next.len())?;
            for i in 0..n.saturating_sub(1) {
                if nibble(p, i) > nibble(p, i + 1) {
                    let letter = (i + 1) as u8;
                    let shift = if last != 0 && letter < last {
                        position
                    } else {
                        0
                    };
                    let key = (swap_adjacent(p, i), content + (1u128 << (8 * i)), letter);
                    let entry = next.entry(key).or_default();
                    if entry.len() < poly.len() + shift {
                        entry.resize(poly.len() + shift, 0);
                    }
                    for (e, &v) in poly.iter().enumerate() {
                        entry[e + shift] = entry[e + shift].checked_add(v).ok_or_else(overflow)?;
                    }
                }
            }
        }
        check_layer(next.len())?;
        layer = next;
        progress.advance(1);
    }
    let mut out: BTreeMap<Vec<usize>, Vec<u64>> = BTreeMap::new();
    for ((_, content, _), poly) in layer {
        let v: Vec<usize> = (0..n.saturating_sub(1))
            .map(|i| ((content >> (8 * i)) & 0xff) as usize)
            .collect();
        let entry = out.entry(v).or_default();
        if entry.len() < poly.len() {
            entry.resize(poly.len(), 0);
        }
        for (e, &c) in poly.iter().enumerate() {
            entry[e] = entry[e].checked_add(c).ok_or_else(overflow)?;
        }
    }
    for poly in out.values_mut() {
        while poly.last() == Some(&0) {
            poly.pop();
        }
    }
    Ok(out)
}

/// The content of a word: c_i = number of letters equal to i, for i = 1..n-1.
pub fn content(word: &[usize], n: usize) -> Vec<usize> {
    let mut c = vec![0; n.saturating_sub(1)];
    for &a in word {
        if a >= 1 && a < n {
            c[a - 1] += 1;
        }
    }
    c
}

/// A local move between reduced words of the same permutation.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum WordMove {
    /// Swap the letters at positions k and k+1 (0-based k), which differ by at least 2.
    Commute {
        /// The position of the first of the two letters (0-based).
        at: usize,
    },
    /// Replace i, i+1, i by i+1, i, i+1 (or back) at positions k, k+1, k+2 (0-based k).
    Braid {
        /// The position of the first of the three letters (0-based).
        at: usize,
    },
}

/// The commutation and braid moves available in a word, in order of position
/// (commutations before braids at the same position).
///
/// ```
/// use elbowroom_math::perms::words::{word_moves, WordMove};
/// // 1 3 2 3: 1,3 commute; 3 2 3 is a braid
/// assert_eq!(
///     word_moves(&[1, 3, 2, 3]),
///     vec![WordMove::Commute { at: 0 }, WordMove::Braid { at: 1 }]
/// );
/// ```
pub fn word_moves(word: &[usize]) -> Vec<WordMove> {
    let mut moves = Vec::new();
    for k in 0..word.len() {
        if k + 1 < word.len() && word[k].abs_diff(word[k + 1]) >= 2 {
            moves.push(WordMove::Commute { at: k });
        }
        if k + 2 < word.len() && is_braid(word[k], word[k + 1], word[k + 2]) {
            moves.push(WordMove::Braid { at: k });
        }
    }
    moves
}

fn is_braid(a: usize, b: usize, c: usize) -> bool {
    a == c && a.abs_diff(b) == 1
}

/// Applies a move to a word; an error if the move does not apply there.
///
/// ```
/// use elbowroom_math::perms::words::{apply_word_move, WordMove};
/// // s_1 s_2 s_1 = s_2 s_1 s_2
/// assert_eq!(apply_word_move(&[1, 2, 1], WordMove::Braid { at: 0 }).unwrap(), vec![2, 1, 2]);
/// ```
pub fn apply_word_move(word: &[usize], mv: WordMove) -> MathResult<Vec<usize>> {
    let mut out = word.to_vec();
    match mv {
        WordMove::Commute { at } => {
            if at + 1 >= word.len() || word[at].abs_diff(word[at + 1]) < 2 {
                return Err(MathError::InvalidInput(format!(
                    "no commutation at position {at} of {word:?}; the two letters must differ by at least 2"
                )));
            }
            out.swap(at, at + 1);
        }
        WordMove::Braid { at } => {
            if at + 2 >= word.len() || !is_braid(word[at], word[at + 1], word[at + 2]) {
                return Err(MathError::InvalidInput(format!(
                    "no braid at position {at} of {word:?}; the letters must read i, i±1, i"
                )));
            }
            let (a, b) = (word[at], word[at + 1]);
            out[at] = b;
            out[at + 1] = a;
            out[at + 2] = b;
        }
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn packed_swap_is_times_s() {
        let w = Perm::parse("31524").unwrap();
        for i in 1..5 {
            assert_eq!(swap_adjacent(pack(&w), i - 1), pack(&w.times_s(i).unwrap()));
        }
    }

    #[test]
    fn identity_has_the_empty_word() {
        let all: Vec<Vec<usize>> = reduced_words(&Perm::identity(4)).collect();
        assert_eq!(all, vec![Vec::<usize>::new()]);
        assert_eq!(
            count_reduced_words(&Perm::identity(1)).unwrap(),
            BigUint::from(1u8)
        );
    }

    #[test]
    fn big_fallback_agrees_with_u128() {
        let w = Perm::longest(6);
        let p = Progress::default();
        let small = count_layers_u128(pack(&w), 6, w.length(), &p)
            .unwrap()
            .unwrap();
        let big = count_layers_big(pack(&w), 6, w.length(), &p).unwrap();
        assert_eq!(BigUint::from(small), big);
    }
}
