//! Reduced pipe dreams (rc-graphs) of a permutation: the data type, its reading
//! word, monomial and permutation, the bottom and top dreams, a lazy listing of
//! all reduced pipe dreams of w, and their number.
//!
//! Conventions: cells (i, j) with i + j <= n (row i, column j, 1-based). A cross
//! in (i, j) stands for s_{i+j-1}; reading the rows top to bottom, each row right
//! to left, gives a word a_1 ... a_l, and the dream belongs to
//! w = s_{a_1} ... s_{a_l} when that word is reduced. Its weight is Π x_i over
//! the crosses in row i, and S_w is the sum of the weights of the reduced pipe
//! dreams of w (Billey–Jockusch–Stanley 1993; Fomin–Kirillov). Moves between
//! dreams live in [`crate::pipes::moves`], pipe tracing in [`crate::pipes::trace`].

use crate::error::{MathError, MathResult};
use crate::perms::perm::{MAX_N, Perm};
use crate::schubert::polynomial::SchubertTable;
use crate::schubert::transition::{partners, pivot, trim_fixed_points};
use num_bigint::BigUint;
use std::collections::HashMap;
use std::fmt;

/// A pipe dream in the staircase of size n: a set of crosses in the cells
/// (i, j) with i + j <= n, stored as one bit mask per row.
#[derive(Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub struct PipeDream {
    pub(crate) n: u8,
    /// rows[r] has bit c set when (r + 1, c + 1) is a cross.
    pub(crate) rows: [u16; MAX_N],
}

impl PipeDream {
    /// The dream with no crosses in the staircase of size n (the one of the identity).
    pub fn empty(n: usize) -> MathResult<PipeDream> {
        if n == 0 || n > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "n = {n}; pipe dreams of size 1..{MAX_N} are supported"
            )));
        }
        Ok(PipeDream {
            n: n as u8,
            rows: [0; MAX_N],
        })
    }

    /// A dream from its crosses (1-based (row, col) with row + col <= n); the
    /// word it spells need not be reduced (see [`PipeDream::is_reduced`]).
    pub fn from_crosses(n: usize, crosses: &[(usize, usize)]) -> MathResult<PipeDream> {
        let mut d = PipeDream::empty(n)?;
        for &(i, j) in crosses {
            if i == 0 || j == 0 || i + j > n {
                return Err(MathError::InvalidInput(format!(
                    "cell ({i}, {j}) is not in the staircase of size {n}; crosses sit in cells (i, j) with i, j >= 1 and i + j <= {n}"
                )));
            }
            d.rows[i - 1] |= 1 << (j - 1);
        }
        Ok(d)
    }

    /// The bottom (Lehmer) dream of w: crosses in columns 1..c_i of row i, c the Lehmer code.
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::dream::PipeDream};
    /// let w = Perm::parse("31524").unwrap(); // code 2 0 2 0 0
    /// assert_eq!(PipeDream::bottom(&w).crosses(), vec![(1, 1), (1, 2), (3, 1), (3, 2)]);
    /// ```
    pub fn bottom(w: &Perm) -> PipeDream {
        let mut rows = [0u16; MAX_N];
        for (r, &c) in w.code().iter().enumerate() {
            rows[r] = ((1u32 << c) - 1) as u16;
        }
        PipeDream {
            n: w.n() as u8,
            rows,
        }
    }

    /// The top dream of w: the transpose of the bottom dream of w^{-1}, that is,
    /// crosses in rows 1..c_j(w^{-1}) of column j (transposing a reduced pipe
    /// dream of w gives one of w^{-1}).
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::dream::PipeDream};
    /// let w = Perm::parse("1432").unwrap(); // w^{-1} = 1432, code 0 2 1 0
    /// assert_eq!(PipeDream::top(&w).crosses(), vec![(1, 2), (1, 3), (2, 2)]);
    /// ```
    pub fn top(w: &Perm) -> PipeDream {
        PipeDream::bottom(&w.inverse()).transpose()
    }

    /// The mirror image in the diagonal: (i, j) -> (j, i).
    pub fn transpose(&self) -> PipeDream {
        let mut rows = [0u16; MAX_N];
        for (r, &mask) in self.rows.iter().enumerate().take(self.n()) {
            let mut m = mask;
            while m != 0 {
                let c = m.trailing_zeros() as usize;
                m &= m - 1;
                rows[c] |= 1 << r;
            }
        }
        PipeDream { n: self.n, rows }
    }

    /// The size n of the staircase.
    pub fn n(&self) -> usize {
        self.n as usize
    }

    /// The row masks (bit c of entry r is the cell (r + 1, c + 1)).
    pub fn row_masks(&self) -> &[u16] {
        &self.rows[..self.n()]
    }

    /// The crosses as 1-based (row, col), in row-major order.
    pub fn crosses(&self) -> Vec<(usize, usize)> {
        let mut out = Vec::with_capacity(self.len());
        for (r, &mask) in self.row_masks().iter().enumerate() {
            let mut m = mask;
            while m != 0 {
                let c = m.trailing_zeros() as usize;
                m &= m - 1;
                out.push((r + 1, c + 1));
            }
        }
        out
    }

    /// Whether (row, col) (1-based) is a cross; false outside the staircase.
    pub fn is_cross(&self, row: usize, col: usize) -> bool {
        row >= 1
            && col >= 1
            && row <= self.n()
            && col <= 16
            && self.rows[row - 1] >> (col - 1) & 1 == 1
    }

    /// The number of crosses.
    pub fn len(&self) -> usize {
        self.row_masks()
            .iter()
            .map(|m| m.count_ones() as usize)
            .sum()
    }

    /// Whether there are no crosses.
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// The reading word: rows top to bottom, each row right to left, a cross in (i, j) read as i + j - 1.
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::dream::PipeDream};
    /// let d = PipeDream::from_crosses(4, &[(1, 1), (1, 3), (2, 1)]).unwrap();
    /// assert_eq!(d.reading_word(), vec![3, 1, 2]);
    /// ```
    pub fn reading_word(&self) -> Vec<usize> {
        let mut word = Vec::with_capacity(self.len());
        for (r, &mask) in self.row_masks().iter().enumerate() {
            let mut m = mask;
            while m != 0 {
                let c = 15 - m.leading_zeros() as usize;
                m &= !(1 << c);
                word.push(r + c + 1);
            }
        }
        word
    }

    /// The exponent vector of the weight Π x_i over the crosses in row i (length n).
    pub fn monomial(&self) -> Vec<u32> {
        self.row_masks().iter().map(|m| m.count_ones()).collect()
    }

    /// The product s_{a_1} ... s_{a_l} of the reading word (the permutation of
    /// the dream when the word is reduced).
    pub fn permutation(&self) -> Perm {
        let n = self.n();
        let mut values: Vec<usize> = (1..=n).collect();
        for a in self.reading_word() {
            values.swap(a - 1, a);
        }
        Perm::from_one_line(&values).unwrap_or_else(|_| Perm::identity(n))
    }

    /// Whether the reading word is reduced (no two pipes cross twice).
    pub fn is_reduced(&self) -> bool {
        self.permutation().length() == self.len()
    }
}

impl fmt::Debug for PipeDream {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "PipeDream(n = {}, crosses = {:?})",
            self.n,
            self.crosses()
        )
    }
}

impl fmt::Display for PipeDream {
    /// A small picture: `+` for a cross, `╯╭` for an elbow (the arc joining left
    /// to top, then the arc joining bottom to right), `╯` on the boundary i + j = n + 1.
    /// Row i starts with its pipe's label i; above column j stands the label of
    /// the pipe leaving there.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let n = self.n();
        let inv = self.permutation().inverse();
        let width = if n >= 10 { 2 } else { 1 };
        write!(f, "{:>width$} ", "")?;
        for j in 1..=n {
            write!(f, "{:<2}", inv.at(j))?;
        }
        writeln!(f)?;
        for i in 1..=n {
            write!(f, "{i:>width$} ")?;
            for j in 1..=n + 1 - i {
                let tile = if i + j == n + 1 {
                    "╯"
                } else if self.is_cross(i, j) {
                    "+ "
                } else {
                    "╯╭"
                };
                write!(f, "{tile}")?;
            }
            if i < n {
                writeln!(f)?;
            }
        }
        Ok(())
    }
}

/// All reduced pipe dreams of w, produced lazily without repeats.
///
/// The dreams form a tree under ladder moves rooted at the bottom dream
/// (Bergeron–Billey 1993: ladder moves from the bottom dream reach every reduced
/// pipe dream of w). A ladder move moves a cross up and to the right, so every
/// dream other than the bottom one has at least one inverse ladder move; its
/// canonical parent is the result of the first one in row-major order of the
/// moved cross. A depth-first walk then visits each dream exactly once, keeping
/// only the current branch in memory.
pub struct PipeDreams {
    stack: Vec<(PipeDream, u16)>,
    root: Option<PipeDream>,
}

/// All reduced pipe dreams of w, lazily (bottom dream first, then a depth-first
/// walk of the ladder-move tree).
///
/// ```
/// use elbowroom_math::{Perm, pipes::dream::pipe_dreams};
/// // S_{1432} = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3: five dreams
/// let w = Perm::parse("1432").unwrap();
/// let dreams: Vec<_> = pipe_dreams(&w).collect();
/// assert_eq!(dreams.len(), 5);
/// assert!(dreams.iter().all(|d| d.permutation() == w));
/// ```
pub fn pipe_dreams(w: &Perm) -> PipeDreams {
    PipeDreams {
        stack: Vec::new(),
        root: Some(PipeDream::bottom(w)),
    }
}

impl Iterator for PipeDreams {
    type Item = PipeDream;

    fn next(&mut self) -> Option<PipeDream> {
        if let Some(root) = self.root.take() {
            self.stack.push((root, 0));
            return Some(root);
        }
        loop {
            let (dream, cursor) = self.stack.last_mut()?;
            match dream.next_child(cursor) {
                Some(child) => {
                    self.stack.push((child, 0));
                    return Some(child);
                }
                None => {
                    self.stack.pop();
                }
            }
        }
    }
}

impl PipeDream {
    /// The next child in the ladder-move tree, scanning source cells from
    /// `cursor` (= 16 r + c, 0-based) on; advances the cursor past it.
    fn next_child(&self, cursor: &mut u16) -> Option<PipeDream> {
        let n = self.n();
        let mut r = (*cursor >> 4) as usize;
        let mut c_from = (*cursor & 15) as u32;
        while r < n {
            let row = self.rows[r];
            // crosses at c with no cross at c + 1
            let mut cand = (row & !(row >> 1)) & (u16::MAX << c_from.min(15));
            if c_from >= 16 {
                cand = 0;
            }
            while cand != 0 {
                let c = cand.trailing_zeros() as usize;
                cand &= cand - 1;
                if let Some((k, child)) = self.ladder_raw(r, c) {
                    if child.first_back_before(k, c + 1) {
                        continue;
                    }
                    let next = r * 16 + c + 1;
                    *cursor = next as u16;
                    return Some(child);
                }
            }
            r += 1;
            c_from = 0;
            *cursor = (r * 16) as u16;
        }
        None
    }

    /// The ladder move of the cross at 0-based (r, c): returns the landing row and the result.
    #[inline]
    pub(crate) fn ladder_raw(&self, r: usize, c: usize) -> Option<(usize, PipeDream)> {
        if c + 1 >= 16 || self.rows[r] >> c & 1 == 0 || self.rows[r] >> (c + 1) & 1 == 1 {
            return None;
        }
        let pair = 0b11u16 << c;
        let mut k = r;
        while k > 0 {
            k -= 1;
            let both = self.rows[k] & pair;
            if both == pair {
                continue;
            }
            if both != 0 {
                return None;
            }
            let mut out = *self;
            out.rows[r] &= !(1 << c);
            out.rows[k] |= 1 << (c + 1);
            return Some((k, out));
        }
        None
    }

    /// The inverse ladder move of the cross at 0-based (k, c + 1): it moves down
    /// column pair (c, c + 1) past rows holding two crosses to the first row r
    /// with both cells empty and lands at (r, c). Returns r and the result.
    #[inline]
    pub(crate) fn ladder_back_raw(&self, k: usize, c1: usize) -> Option<(usize, PipeDream)> {
        if c1 == 0 || c1 >= 16 || self.rows[k] >> c1 & 1 == 0 || self.rows[k] >> (c1 - 1) & 1 == 1 {
            return None;
        }
        let c = c1 - 1;
        let n = self.n();
        let pair = 0b11u16 << c;
        for r in k + 1..n {
            let both = self.rows[r] & pair;
            if both == pair {
                continue;
            }
            if both != 0 || r + c + 2 > n {
                return None;
            }
            let mut out = *self;
            out.rows[k] &= !(1 << c1);
            out.rows[r] |= 1 << c;
            return Some((r, out));
        }
        None
    }

    /// Whether an inverse ladder move exists at a cross strictly before (k, c1)
    /// in row-major order (0-based), i.e. whether (k, c1) is not the canonical
    /// parent move.
    #[inline]
    fn first_back_before(&self, k: usize, c1: usize) -> bool {
        for r in 0..=k {
            let row = self.rows[r];
            // crosses at c1' >= 1 with no cross at c1' - 1
            let mut cand = row & !(row << 1) & !1;
            if r == k {
                cand &= ((1u32 << c1) - 1) as u16;
            }
            while cand != 0 {
                let c = cand.trailing_zeros() as usize;
                cand &= cand - 1;
                if self.ladder_back_raw(r, c).is_some() {
                    return true;
                }
            }
        }
        false
    }
}

/// The number of reduced pipe dreams of w: S_w(1, ..., 1).
///
/// Computed by Lascoux–Schützenberger transition evaluated at x = (1, ..., 1):
/// with r the last descent of w, s > r the largest index with w(s) < w(r) and
/// v = w t_{rs}, S_w(1) = S_v(1) + Σ S_{v t_{qr}}(1) over q < r with
/// ℓ(v t_{qr}) = ℓ(w) — the same recursion as [`SchubertTable`], on integers
/// instead of polynomials (tests check it against the coefficient sum of S_w).
///
/// ```
/// use elbowroom_math::{Perm, pipes::dream::count_pipe_dreams};
/// use num_bigint::BigUint;
/// // S_{1432} = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3
/// assert_eq!(count_pipe_dreams(&Perm::parse("1432").unwrap()), BigUint::from(5u8));
/// ```
pub fn count_pipe_dreams(w: &Perm) -> BigUint {
    let mut memo: HashMap<Vec<u8>, BigUint> = HashMap::new();
    transition_count(trim_fixed_points(w.as_bytes()), &mut memo)
}

fn transition_count(w: &[u8], memo: &mut HashMap<Vec<u8>, BigUint>) -> BigUint {
    if let Some(c) = memo.get(w) {
        return c.clone();
    }
    let Some((r, s)) = pivot(w) else {
        return BigUint::from(1u8);
    };
    let mut v = w.to_vec();
    v.swap(r, s);
    let mut total = transition_count(trim_fixed_points(&v), memo);
    for q in partners(&v, r) {
        let mut u = v.clone();
        u.swap(q, r);
        total += transition_count(trim_fixed_points(&u), memo);
    }
    memo.insert(w.to_vec(), total.clone());
    total
}

/// A bound on the number of terms of S_w, found without building it: the
/// smaller of S_w(1, ..., 1) (the number of reduced pipe dreams, each giving
/// one monomial) and the number of exponent vectors of degree ℓ(w) under the
/// staircase, a_i <= n − i (every monomial of S_w divides x^δ, Macdonald (4.13)
/// from memory). Saturates at `u128::MAX`.
///
/// ```
/// use elbowroom_math::{Perm, pipes::dream::term_bound, schubert::polynomial::schubert};
/// let w = Perm::parse("1432").unwrap();
/// assert!(term_bound(&w) >= schubert(&w).len() as u128);
/// assert_eq!(term_bound(&w), 5);
/// ```
pub fn term_bound(w: &Perm) -> u128 {
    let dreams = u128::try_from(count_pipe_dreams(w)).unwrap_or(u128::MAX);
    let n = w.n();
    let l = w.length();
    // ways[s] = number of (a_1..a_i) with a_j <= n − j and sum s
    let mut ways = vec![0u128; l + 1];
    ways[0] = 1;
    for i in 1..=n {
        let cap = n - i;
        let mut next = vec![0u128; l + 1];
        for (s, &v) in ways.iter().enumerate() {
            if v == 0 {
                continue;
            }
            for a in 0..=cap.min(l - s) {
                next[s + a] = next[s + a].saturating_add(v);
            }
        }
        ways = next;
    }
    dreams.min(ways[l])
}

/// The number of reduced pipe dreams of w as the coefficient sum of S_w (a
/// second method, through the polynomial).
pub fn count_pipe_dreams_by_polynomial(w: &Perm) -> BigUint {
    let mut table = SchubertTable::new();
    let sum = table.get(w).coefficient_sum();
    sum.to_biguint().unwrap_or_default()
}
