//! Division by the Gröbner basis elements of lower degree, inside one degree d, on a dense
//! array indexed by the position of each degree-d monomial (no ordered map): the map φ of
//! [`crate::quotient::groebner`] from degree-d polynomials onto the span V_d of the
//! standard monomials and corners of degree d.
//!
//! Terms are taken largest first from a binary heap of positions; a monomial of V_d is
//! kept, any other is replaced by −t·(tail of G_c) with c its first corner
//! ([`crate::quotient::division::first_corner`]); every new term is smaller, so each
//! position is taken at most once. Coefficients are checked `i128`.

use crate::error::{MathError, MathResult};
use crate::poly::mono::Mono;
use crate::quotient::division::first_corner;
use crate::quotient::modp::DegreeIndex;
use std::collections::{BinaryHeap, HashMap};

/// A row over V_d: (position in V_d, coefficient), sorted by position.
pub type Row = Vec<(u32, i128)>;

/// The monomials of degree d and, for each, its position in V_d (or none).
pub struct DegreeDivision<'a> {
    n: usize,
    index: DegreeIndex,
    column: Vec<u32>,
    tails: &'a HashMap<Mono, Vec<(Mono, i128)>>,
}

/// Working space of one thread: the dense coefficients, which positions are queued, the heap.
pub struct Scratch {
    vals: Vec<i128>,
    queued: Vec<bool>,
    heap: BinaryHeap<u32>,
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
            queued: vec![false; self.index.monos.len()],
            heap: BinaryHeap::new(),
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
        while let Some(i) = s.heap.pop() {
            s.vals[i as usize] = 0;
            s.queued[i as usize] = false;
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
            if !s.queued[i] {
                s.queued[i] = true;
                s.heap.push(i as u32);
            }
        }
        let mut out = Vec::new();
        let mut steps = 0u32;
        while let Some(i) = s.heap.pop() {
            let i = i as usize;
            let x = std::mem::take(&mut s.vals[i]);
            s.queued[i] = false;
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
                if !s.queued[j] {
                    s.queued[j] = true;
                    s.heap.push(j as u32);
                }
            }
        }
        out.sort_unstable_by_key(|t| t.0);
        Ok(Some(out))
    }
}
