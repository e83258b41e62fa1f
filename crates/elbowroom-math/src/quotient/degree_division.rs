//! Division by the Gröbner basis elements of lower degree, inside one degree d, on a dense
//! array indexed by the position of each degree-d monomial (no ordered map): the map φ of
//! [`crate::quotient::groebner`] from degree-d polynomials onto the span V_d of the
//! standard monomials and corners of degree d.
//!
//! Terms are taken largest first from a two-level bitset of positions; a monomial of V_d is
//! kept, any other is replaced by −t·(tail of G_c) with c its first corner
//! ([`crate::quotient::division::first_corner`]); every new term is smaller, so each
//! position is taken at most once. Coefficients are checked `i128`.

use crate::error::{MathError, MathResult};
use crate::poly::mono::Mono;
use crate::quotient::division::first_corner;
use crate::quotient::modp::DegreeIndex;
use std::collections::HashMap;

/// A row over V_d: (position in V_d, coefficient), sorted by position.
pub type Row = Vec<(u32, i128)>;

/// The monomials of degree d and, for each, its position in V_d (or none).
pub struct DegreeDivision<'a> {
    n: usize,
    index: DegreeIndex,
    column: Vec<u32>,
    tails: &'a HashMap<Mono, Vec<(Mono, i128)>>,
}

/// Working space of one thread: the dense coefficients and the positions queued.
pub struct Scratch {
    vals: Vec<i128>,
    queued: Queue,
}

/// A set of positions, taken largest first: a bit per position and a bit per word of 64.
struct Queue {
    words: Vec<u64>,
    summary: Vec<u64>,
    /// No summary word above this one is nonzero.
    top: usize,
}

impl Queue {
    fn new(len: usize) -> Queue {
        let words = len.div_ceil(64);
        Queue {
            words: vec![0; words],
            summary: vec![0; words.div_ceil(64).max(1)],
            top: 0,
        }
    }

    /// Adds i; false if it was there already.
    #[inline]
    fn insert(&mut self, i: usize) -> bool {
        let (w, b) = (i >> 6, 1u64 << (i & 63));
        if self.words[w] & b != 0 {
            return false;
        }
        self.words[w] |= b;
        let s = w >> 6;
        self.summary[s] |= 1u64 << (w & 63);
        self.top = self.top.max(s);
        true
    }

    /// Removes and returns the largest position.
    #[inline]
    fn pop(&mut self) -> Option<usize> {
        loop {
            let sw = self.summary[self.top];
            if sw != 0 {
                let w = (self.top << 6) + 63 - sw.leading_zeros() as usize;
                let bits = self.words[w];
                let b = 63 - bits.leading_zeros() as usize;
                self.words[w] &= !(1u64 << b);
                if self.words[w] == 0 {
                    self.summary[self.top] &= !(1u64 << (w & 63));
                }
                return Some((w << 6) + b);
            }
            if self.top == 0 {
                return None;
            }
            self.top -= 1;
        }
    }
}

const NONE: u32 = u32::MAX;

impl<'a> DegreeDivision<'a> {
    /// The division of degree d in n variables; `vidx` gives the positions in V_d,
    /// `tails` the tails of the lower basis elements.
    pub fn new(
        n: usize,
        d: u32,
        vidx: &HashMap<Mono, u32>,
        tails: &'a HashMap<Mono, Vec<(Mono, i128)>>,
    ) -> DegreeDivision<'a> {
        let index = DegreeIndex::new(n, d);
        let column = index
            .monos
            .iter()
            .map(|m| vidx.get(m).copied().unwrap_or(NONE))
            .collect();
        DegreeDivision {
            n,
            index,
            column,
            tails,
        }
    }

    /// Fresh working space for [`Self::image`].
    pub fn scratch(&self) -> Scratch {
        Scratch {
            vals: vec![0; self.index.monos.len()],
            queued: Queue::new(self.index.monos.len()),
        }
    }

    fn position(&self, m: Mono) -> MathResult<usize> {
        self.index.position(m).map(|i| i as usize).ok_or_else(|| {
            MathError::InvalidInput(format!("internal: {m:?} has not the degree being divided"))
        })
    }

    /// φ(Σ a·m): the image in V_d, or `None` when a coefficient outgrows `i128`. Polls
    /// `check` every 1024 steps. `scratch` is left clean for the next call.
    pub fn image(
        &self,
        terms: impl IntoIterator<Item = (Mono, i128)>,
        s: &mut Scratch,
        check: &dyn Fn() -> MathResult<()>,
    ) -> MathResult<Option<Row>> {
        let out = self.image_inner(terms, s, check);
        // leave the space clean whatever happened
        while let Some(i) = s.queued.pop() {
            s.vals[i] = 0;
        }
        out
    }

    fn image_inner(
        &self,
        terms: impl IntoIterator<Item = (Mono, i128)>,
        s: &mut Scratch,
        check: &dyn Fn() -> MathResult<()>,
    ) -> MathResult<Option<Row>> {
        for (m, a) in terms {
            let i = self.position(m)?;
            let Some(v) = s.vals[i].checked_add(a) else {
                return Ok(None);
            };
            s.vals[i] = v;
            s.queued.insert(i);
        }
        let mut out = Vec::new();
        let mut steps = 0u32;
        while let Some(i) = s.queued.pop() {
            let x = std::mem::take(&mut s.vals[i]);
            steps = steps.wrapping_add(1);
            if steps.is_multiple_of(1024) {
                check()?;
            }
            if x == 0 {
                continue;
            }
            if self.column[i] != NONE {
                out.push((self.column[i], x));
                continue;
            }
            let m = self.index.monos[i];
            let tail = first_corner(m, self.n).and_then(|c| self.tails.get(&c).map(|t| (c, t)));
            let Some((c, tail)) = tail else {
                return Err(MathError::InvalidInput(format!(
                    "internal: {m:?} is neither standard, a corner, nor divisible by a lower corner"
                )));
            };
            let t = m.divided_by(c);
            for &(u, a) in tail {
                let j = self.position(Mono(u.0 + t.0))?;
                let Some(v) = a.checked_mul(x).and_then(|p| s.vals[j].checked_sub(p)) else {
                    return Ok(None);
                };
                s.vals[j] = v;
                s.queued.insert(j);
            }
        }
        out.sort_unstable_by_key(|t| t.0);
        Ok(Some(out))
    }
}

#[cfg(test)]
mod tests {
    use super::Queue;

    #[test]
    fn the_queue_gives_positions_largest_first_once_each() {
        let mut q = Queue::new(10_000);
        for i in [5, 9_999, 64, 4_096, 4_095, 5, 0, 63] {
            q.insert(i);
        }
        let mut out = Vec::new();
        while let Some(i) = q.pop() {
            out.push(i);
            if i == 4_096 {
                q.insert(100);
            }
        }
        assert_eq!(out, [9_999, 4_096, 4_095, 100, 64, 63, 5, 0]);
    }
}
