//! Ladder and chute moves on pipe dreams (Bergeron–Billey, Experiment. Math. 1993),
//! in both directions, and the list of moves a dream allows.
//!
//! A ladder move takes a cross at (i, j) with (i, j+1) empty, climbs the column
//! pair (j, j+1) past rows where both cells are crosses, and, at the first row
//! i - m where both cells are empty, moves the cross to (i - m, j + 1). A chute
//! move is its transpose: a cross at (i, j) with (i+1, j) empty moves left along
//! the row pair (i, i+1) past columns where both cells are crosses to
//! (i + 1, j - m) at the first column j - m where both cells are empty. Both
//! preserve the permutation and the number of crosses; a ladder move shifts one
//! unit of weight from x_i to x_{i-m}, a chute move from x_i to x_{i+1}.

use crate::pipes::dream::PipeDream;

/// The kind of a move between pipe dreams.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum MoveKind {
    /// A ladder move (a cross moves up and one column right).
    Ladder,
    /// The inverse of a ladder move (a cross moves down and one column left).
    LadderBack,
    /// A chute move (a cross moves one row down and left).
    Chute,
    /// The inverse of a chute move (a cross moves one row up and right).
    ChuteBack,
}

/// A move available in a dream: its kind, the cross it moves and where it lands (1-based cells).
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub struct PipeMove {
    /// The kind of move.
    pub kind: MoveKind,
    /// The cross that moves, 1-based (row, col).
    pub from: (usize, usize),
    /// Where it lands, 1-based (row, col).
    pub to: (usize, usize),
}

impl PipeDream {
    /// The ladder move of the cross at (row, col), 1-based, if it applies.
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::dream::PipeDream};
    /// // bottom dream of 1432: crosses (2,1), (2,2), (3,1); the cross (3,1) climbs to (1,2)
    /// let d = PipeDream::bottom(&Perm::parse("1432").unwrap());
    /// let e = d.ladder_move_at(3, 1).unwrap();
    /// assert_eq!(e.crosses(), vec![(1, 2), (2, 1), (2, 2)]);
    /// assert_eq!(e.permutation(), d.permutation());
    /// ```
    pub fn ladder_move_at(&self, row: usize, col: usize) -> Option<PipeDream> {
        if !self.is_cross(row, col) {
            return None;
        }
        self.ladder_raw(row - 1, col - 1).map(|(_, d)| d)
    }

    /// The inverse ladder move of the cross at (row, col), 1-based, if it applies.
    pub fn ladder_back_at(&self, row: usize, col: usize) -> Option<PipeDream> {
        if !self.is_cross(row, col) {
            return None;
        }
        self.ladder_back_raw(row - 1, col - 1).map(|(_, d)| d)
    }

    /// The chute move of the cross at (row, col), 1-based, if it applies (the
    /// transpose of a ladder move).
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::dream::PipeDream};
    /// // top dream of 1432: crosses (1,2), (1,3), (2,2); the cross (1,3) chutes to (2,1)
    /// let d = PipeDream::top(&Perm::parse("1432").unwrap());
    /// let e = d.chute_move_at(1, 3).unwrap();
    /// assert_eq!(e.crosses(), vec![(1, 2), (2, 1), (2, 2)]);
    /// ```
    pub fn chute_move_at(&self, row: usize, col: usize) -> Option<PipeDream> {
        self.transpose()
            .ladder_move_at(col, row)
            .map(|d| d.transpose())
    }

    /// The inverse chute move of the cross at (row, col), 1-based, if it applies.
    pub fn chute_back_at(&self, row: usize, col: usize) -> Option<PipeDream> {
        self.transpose()
            .ladder_back_at(col, row)
            .map(|d| d.transpose())
    }

    /// The result of a move of the given kind at (row, col), if it applies.
    pub fn move_at(&self, kind: MoveKind, row: usize, col: usize) -> Option<PipeDream> {
        match kind {
            MoveKind::Ladder => self.ladder_move_at(row, col),
            MoveKind::LadderBack => self.ladder_back_at(row, col),
            MoveKind::Chute => self.chute_move_at(row, col),
            MoveKind::ChuteBack => self.chute_back_at(row, col),
        }
    }

    /// The moves the cross at (row, col) allows (empty for an empty cell).
    pub fn moves_at(&self, row: usize, col: usize) -> Vec<PipeMove> {
        let kinds = [
            MoveKind::Ladder,
            MoveKind::LadderBack,
            MoveKind::Chute,
            MoveKind::ChuteBack,
        ];
        let mut out = Vec::new();
        for kind in kinds {
            if let Some(d) = self.move_at(kind, row, col) {
                // the landing cell is the one cross of d that self lacks
                let to = d
                    .crosses()
                    .into_iter()
                    .find(|&(i, j)| !self.is_cross(i, j))
                    .unwrap_or((row, col));
                out.push(PipeMove {
                    kind,
                    from: (row, col),
                    to,
                });
            }
        }
        out
    }

    /// Every move the dream allows, by cross in row-major order.
    pub fn available_moves(&self) -> Vec<PipeMove> {
        self.crosses()
            .into_iter()
            .flat_map(|(i, j)| self.moves_at(i, j))
            .collect()
    }
}
