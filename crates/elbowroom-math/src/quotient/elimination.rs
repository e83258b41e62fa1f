//! Sparse row reduction modulo p = 2^61 − 1 over the columns of one degree, for the
//! construction of the Gröbner basis of J_n: rows are absorbed one at a time into an
//! echelon form (one pivot row per leading column, entry 1 there), each through a dense
//! accumulator reused from row to row; then the pivot rows are back-substituted on a set
//! of columns (the corners) so that each pivot column appears in its own row only.
//!
//! Columns are positions 0, 1, ... (position 0 the largest monomial); a row is a list of
//! (column, residue) sorted by column.

use crate::error::MathResult;
use crate::progress::Progress;
use crate::quotient::modp::{inv_mod, mul_mod, sub_mod};

/// A sparse row with entries modulo p, sorted by column.
pub type ModRow = Vec<(u32, u64)>;

/// What absorbing a row did.
#[derive(Debug, PartialEq, Eq)]
pub enum Absorbed {
    /// It reduced to zero: it depends on the rows already there.
    Dependent,
    /// It became the pivot row of this column.
    Pivot(u32),
}

/// An echelon form modulo p over a fixed number of columns.
pub struct Echelon {
    pivots: Vec<Option<ModRow>>,
    acc: Vec<u64>,
}

impl Echelon {
    /// An empty echelon form over `columns` columns.
    pub fn new(columns: usize) -> Echelon {
        Echelon {
            pivots: vec![None; columns],
            acc: vec![0; columns],
        }
    }

    /// The pivot row of a column, if any.
    pub fn pivot(&self, col: u32) -> Option<&ModRow> {
        self.pivots.get(col as usize).and_then(|p| p.as_ref())
    }

    /// Reduces `row` by the pivots until its leading column has none, and makes it the
    /// pivot there (scaled to entry 1) unless `accept(col)` refuses that column, in which
    /// case `Err(col)` is returned and nothing changes. Polls `progress` every 256 steps.
    pub fn absorb(
        &mut self,
        row: &[(u32, u64)],
        accept: &dyn Fn(u32) -> bool,
        progress: &Progress,
    ) -> MathResult<Result<Absorbed, u32>> {
        let Some(&(first, _)) = row.first() else {
            return Ok(Ok(Absorbed::Dependent));
        };
        for &(c, x) in row {
            self.acc[c as usize] = x;
        }
        let width = self.acc.len();
        let mut steps = 0u32;
        for col in first as usize..width {
            let x = self.acc[col];
            if x == 0 {
                continue;
            }
            if let Some(p) = &self.pivots[col] {
                for &(k, y) in p {
                    let k = k as usize;
                    self.acc[k] = sub_mod(self.acc[k], mul_mod(x, y));
                }
                steps += 1;
                if steps.is_multiple_of(256)
                    && let Err(e) = progress.check()
                {
                    self.acc.iter_mut().for_each(|v| *v = 0);
                    return Err(e);
                }
                continue;
            }
            let col32 = col as u32;
            if !accept(col32) {
                self.acc[col..].iter_mut().for_each(|v| *v = 0);
                return Ok(Err(col32));
            }
            let inv = inv_mod(x);
            let mut out = Vec::new();
            for (k, v) in self.acc[col..].iter_mut().enumerate() {
                if *v != 0 {
                    out.push(((col + k) as u32, mul_mod(*v, inv)));
                    *v = 0;
                }
            }
            self.pivots[col] = Some(out);
            return Ok(Ok(Absorbed::Pivot(col32)));
        }
        Ok(Ok(Absorbed::Dependent))
    }

    /// Back-substitution: for every pivot column j (from the last to the first), clears
    /// from j's row every later column k with `clear(k)` that has a pivot, so that in the end
    /// such a column appears in its own pivot row only. Returns the pivot rows by column.
    pub fn back_substitute(
        mut self,
        clear: &dyn Fn(u32) -> bool,
        progress: &Progress,
    ) -> MathResult<Vec<(u32, ModRow)>> {
        let cols: Vec<u32> = (0..self.pivots.len() as u32)
            .filter(|&c| self.pivots[c as usize].is_some())
            .collect();
        for &j in cols.iter().rev() {
            progress.check()?;
            let Some(row) = self.pivots[j as usize].take() else {
                continue;
            };
            let needs = row
                .iter()
                .any(|&(k, _)| k > j && clear(k) && self.pivots[k as usize].is_some());
            if !needs {
                self.pivots[j as usize] = Some(row);
                continue;
            }
            for &(c, x) in &row {
                self.acc[c as usize] = x;
            }
            for &(k, _) in &row {
                let ku = k as usize;
                let x = self.acc[ku];
                if k <= j || x == 0 || !clear(k) {
                    continue;
                }
                // rows after j are already cleared on these columns, so subtracting one
                // adds no entry at another cleared column
                if let Some(p) = &self.pivots[ku] {
                    for &(c, y) in p {
                        let c = c as usize;
                        self.acc[c] = sub_mod(self.acc[c], mul_mod(x, y));
                    }
                }
            }
            let mut out = Vec::new();
            for (c, v) in self.acc.iter_mut().enumerate().skip(j as usize) {
                if *v != 0 {
                    out.push((c as u32, *v));
                    *v = 0;
                }
            }
            self.pivots[j as usize] = Some(out);
        }
        Ok(cols
            .into_iter()
            .filter_map(|c| self.pivots[c as usize].take().map(|r| (c, r)))
            .collect())
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::quotient::modp::PRIME;

    #[test]
    fn echelon_of_a_small_matrix_by_hand() {
        // rows (1 2 3), (2 4 7), (1 2 3): the second reduces to (0 0 1), the third to zero;
        // back-substitution on column 2 leaves (1 2 0) and (0 0 1)
        let p = Progress::new(0);
        let mut e = Echelon::new(3);
        let all = |_: u32| true;
        let r1 = vec![(0, 1), (1, 2), (2, 3)];
        let r2 = vec![(0, 2), (1, 4), (2, 7)];
        assert_eq!(e.absorb(&r1, &all, &p).unwrap(), Ok(Absorbed::Pivot(0)));
        assert_eq!(e.absorb(&r2, &all, &p).unwrap(), Ok(Absorbed::Pivot(2)));
        assert_eq!(e.absorb(&r1, &all, &p).unwrap(), Ok(Absorbed::Dependent));
        let rows = e.back_substitute(&|k| k == 2, &p).unwrap();
        assert_eq!(rows, vec![(0, vec![(0, 1), (1, 2)]), (2, vec![(2, 1)])]);
        // a leading column that is refused is reported and nothing is kept
        let mut e = Echelon::new(2);
        let r = vec![(1, PRIME - 1)];
        assert_eq!(e.absorb(&r, &|c| c == 0, &p).unwrap(), Err(1));
        assert!(e.pivot(1).is_none());
    }
}
