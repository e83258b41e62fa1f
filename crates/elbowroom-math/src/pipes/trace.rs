//! Following the pipes of a pipe dream through the staircase.
//!
//! Tiles: every cell (i, j) with i + j <= n + 1. A cell with i + j <= n is a
//! cross or an elbow pair (one arc joins its left side to its top, the other its
//! bottom side to its right); a boundary cell with i + j = n + 1 holds only the
//! arc from its left side to its top.
//!
//! Labelling: pipe i enters row i from the left edge and leaves through the top
//! edge of column w(i), where w is the permutation of the (reduced) dream — the
//! product s_{a_1} ... s_{a_l} of its reading word (checked in tests for all
//! reduced pipe dreams of S_n, n <= 6).

use crate::perms::perm::Perm;
use crate::pipes::dream::PipeDream;

/// A side of a tile.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Side {
    /// The left edge.
    Left,
    /// The right edge.
    Right,
    /// The top edge.
    Top,
    /// The bottom edge.
    Bottom,
}

/// One pipe's passage through a tile: its label and the two sides it joins
/// (in the direction of travel: from its entry to its exit).
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub struct Passage {
    /// The pipe's label (1..n).
    pub label: usize,
    /// The side where the pipe comes in.
    pub enters: Side,
    /// The side where the pipe goes out.
    pub leaves: Side,
}

/// A tile of the staircase with the pipes that pass through it.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct TileTrace {
    /// Row, 1-based.
    pub row: usize,
    /// Column, 1-based.
    pub col: usize,
    /// Whether the tile is a cross (otherwise an elbow pair, or a single arc on the boundary).
    pub cross: bool,
    /// Whether the tile lies on the boundary i + j = n + 1.
    pub boundary: bool,
    /// The pipes through the tile (two inside the staircase, one on the boundary).
    pub passages: Vec<Passage>,
}

/// A pipe's route: it enters row `entry_row` from the left and leaves through
/// the top of column `exit_col`, visiting `cells` in order.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct PipePath {
    /// The label (equal to the entry row).
    pub label: usize,
    /// The row whose left edge the pipe enters.
    pub entry_row: usize,
    /// The column whose top edge the pipe leaves.
    pub exit_col: usize,
    /// The tiles visited, 1-based (row, col), in order.
    pub cells: Vec<(usize, usize)>,
}

/// All tiles and all pipes of a dream.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct PipeTrace {
    /// The size n.
    pub n: usize,
    /// The tiles (i, j) with i + j <= n + 1, in row-major order.
    pub tiles: Vec<TileTrace>,
    /// The pipes, pipe i at index i - 1.
    pub pipes: Vec<PipePath>,
}

impl PipeTrace {
    /// The tile at (row, col), 1-based, if it is in the staircase.
    pub fn tile(&self, row: usize, col: usize) -> Option<&TileTrace> {
        if row == 0 || col == 0 || row + col > self.n + 1 {
            return None;
        }
        // rows before `row` hold n, n-1, ... tiles
        let before: usize = (1..row).map(|i| self.n + 1 - i).sum();
        self.tiles.get(before + col - 1)
    }

    /// The permutation read off the pipes: i -> the exit column of pipe i.
    pub fn permutation(&self) -> Perm {
        let values: Vec<usize> = self.pipes.iter().map(|p| p.exit_col).collect();
        Perm::from_one_line(&values).unwrap_or_else(|_| Perm::identity(self.n))
    }
}

impl PipeDream {
    /// Follows every pipe through the staircase.
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::dream::PipeDream};
    /// // the bottom dream of 312 has crosses (1,1), (1,2): pipe 1 runs along row 1 to column 3
    /// let t = PipeDream::bottom(&Perm::parse("312").unwrap()).trace();
    /// assert_eq!(t.pipes[0].exit_col, 3);
    /// assert_eq!(t.pipes[0].cells, vec![(1, 1), (1, 2), (1, 3)]);
    /// assert_eq!(t.permutation(), Perm::parse("312").unwrap());
    /// ```
    pub fn trace(&self) -> PipeTrace {
        let n = self.n();
        let mut tiles = Vec::new();
        for i in 1..=n {
            for j in 1..=n + 1 - i {
                tiles.push(TileTrace {
                    row: i,
                    col: j,
                    cross: i + j <= n && self.is_cross(i, j),
                    boundary: i + j == n + 1,
                    passages: Vec::with_capacity(2),
                });
            }
        }
        let index =
            |i: usize, j: usize| -> usize { (1..i).map(|r| n + 1 - r).sum::<usize>() + j - 1 };
        let mut pipes = Vec::with_capacity(n);
        for label in 1..=n {
            let (mut i, mut j, mut enters) = (label, 1usize, Side::Left);
            let mut cells = Vec::new();
            // each step moves up or right, so the walk ends within 2n steps
            loop {
                cells.push((i, j));
                let cross = i + j <= n && self.is_cross(i, j);
                let leaves = match (cross, enters) {
                    (true, Side::Left) => Side::Right,
                    (true, _) => Side::Top,
                    (false, Side::Left) => Side::Top,
                    (false, _) => Side::Right,
                };
                tiles[index(i, j)].passages.push(Passage {
                    label,
                    enters,
                    leaves,
                });
                match leaves {
                    Side::Right => {
                        j += 1;
                        enters = Side::Left;
                    }
                    _ => {
                        if i == 1 {
                            break;
                        }
                        i -= 1;
                        enters = Side::Bottom;
                    }
                }
            }
            pipes.push(PipePath {
                label,
                entry_row: label,
                exit_col: j,
                cells,
            });
        }
        PipeTrace { n, tiles, pipes }
    }
}
