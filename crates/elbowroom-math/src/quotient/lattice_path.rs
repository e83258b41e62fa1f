//! The lattice path of a standard monomial, as data for drawing.
//!
//! The picture: in the n×n square with corners (0,0) and (n,n), the monomial
//! x^e = x_1^{e_1} ... x_n^{e_n} (standard: e_1 + ... + e_i <= i - 1) is the path
//!
//! N^{e_1} E N^{e_2} E ... N^{e_n} E N^{n - |e|}
//!
//! from (0,0) to (n,n): the north run just before the i-th east step has e_i steps,
//! each labelled by the variable x_i; the last run (at x = n) is unlabelled and closes
//! the path. Before the i-th east step the height is e_1 + ... + e_i <= i - 1, so the path
//! stays weakly below the diagonal y = x, touching it only at (0,0) and (n,n)'s run;
//! conversely every such path with a first step east comes from exactly one standard
//! monomial, which gives Catalan(n) paths.

use crate::error::{MathError, MathResult};
use crate::quotient::standard::is_standard;

/// One unit step of a path.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Step {
    /// One unit to the right.
    East,
    /// One unit up, carrying the variable x_i (1-based) or none for the closing run.
    North {
        /// The variable this step stands for (1-based), `None` on the closing run.
        var: Option<usize>,
    },
}

/// The lattice path of a standard monomial.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct LatticePath {
    /// The side of the square region (the number of variables n).
    pub size: usize,
    /// The exponent vector e.
    pub exponents: Vec<u32>,
    /// The 2n unit steps from (0,0) to (n,n).
    pub steps: Vec<Step>,
}

impl LatticePath {
    /// The path of the standard monomial x^e (an error if e is not standard).
    ///
    /// ```
    /// use elbowroom_math::quotient::lattice_path::{LatticePath, Step};
    /// // x2 x3 in 3 variables: E N E N E N (the first N stands for x2, the second for x3)
    /// let p = LatticePath::of_monomial(&[0, 1, 1]).unwrap();
    /// assert_eq!(p.word(), "ENENEN");
    /// assert_eq!(p.steps[1], Step::North { var: Some(2) });
    /// assert_eq!(p.steps[5], Step::North { var: None });
    /// ```
    pub fn of_monomial(e: &[u32]) -> MathResult<LatticePath> {
        if !is_standard(e) {
            return Err(MathError::InvalidInput(format!(
                "x^{e:?} is not standard (e_1 + ... + e_i <= i - 1 fails), so it has no path"
            )));
        }
        let n = e.len();
        let mut steps = Vec::with_capacity(2 * n);
        for (i, &a) in e.iter().enumerate() {
            for _ in 0..a {
                steps.push(Step::North { var: Some(i + 1) });
            }
            steps.push(Step::East);
        }
        let total: u32 = e.iter().sum();
        for _ in total as usize..n {
            steps.push(Step::North { var: None });
        }
        Ok(LatticePath {
            size: n,
            exponents: e.to_vec(),
            steps,
        })
    }

    /// The steps as a word in E and N.
    pub fn word(&self) -> String {
        self.steps
            .iter()
            .map(|s| match s {
                Step::East => 'E',
                Step::North { .. } => 'N',
            })
            .collect()
    }

    /// The 2n + 1 lattice points visited, starting at (0,0).
    pub fn vertices(&self) -> Vec<(usize, usize)> {
        let mut p = (0, 0);
        let mut out = vec![p];
        for s in &self.steps {
            match s {
                Step::East => p.0 += 1,
                Step::North { .. } => p.1 += 1,
            }
            out.push(p);
        }
        out
    }

    /// A small ASCII drawing, one text line per row of unit cells (top line: y = n - 1):
    /// '_' for an east step along the bottom of a cell, '|' for a north step, '.' for a
    /// cell below the diagonal that the path does not run along.
    ///
    /// ```
    /// use elbowroom_math::quotient::lattice_path::LatticePath;
    /// let p = LatticePath::of_monomial(&[0, 1, 0]).unwrap();
    /// // E N E E N N: the path (0,0) (1,0) (1,1) (2,1) (3,1) (3,2) (3,3)
    /// assert_eq!(p.ascii(), "     .|\n   _ _|\n _|. .");
    /// ```
    pub fn ascii(&self) -> String {
        let n = self.size;
        // grid of (n rows) x (n + 1 columns); column x holds vertical steps at x,
        // row y (from the bottom) holds east steps at height y, drawn as '_' in the row above
        let mut grid = vec![vec![' '; 2 * n + 1]; n];
        for (y, row) in grid.iter_mut().enumerate() {
            for x in y..n {
                row[2 * x + 1] = '.';
            }
        }
        let mut p = (0usize, 0usize);
        for s in &self.steps {
            match s {
                Step::East => {
                    if p.1 < n {
                        grid[p.1][2 * p.0 + 1] = '_';
                    }
                    p.0 += 1;
                }
                Step::North { .. } => {
                    if p.1 < n {
                        grid[p.1][2 * p.0] = '|';
                    }
                    p.1 += 1;
                }
            }
        }
        grid.iter()
            .rev()
            .map(|row| row.iter().collect::<String>().trim_end().to_string())
            .collect::<Vec<_>>()
            .join("\n")
    }
}
