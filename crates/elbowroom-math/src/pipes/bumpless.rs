//! Bumpless pipe dreams (Lam–Lee–Shimozono, Compositio Math. 2021; preprint 2018).
//!
//! An n×n grid of tiles: blank, cross, horizontal, vertical, and two elbows:
//! `┌` (joining the bottom and right sides) and `┘` (joining the left and top
//! sides). n pipes enter through the bottom edge, one in each column, and leave
//! through the right edge, one in each row; no two pipes cross twice. Reading
//! convention: the pipe that leaves row i on the right entered at the bottom of
//! column w(i). The weight is Π x_i over the blank tiles in row i, and the sum of
//! the weights over the bumpless pipe dreams of w is S_w.
//!
//! The Rothe dream of w has a `┌` at (i, w(i)), its pipe running right along row i
//! and down column w(i); its blanks form the Rothe diagram. Every bumpless pipe
//! dream of w is reached from it by droop moves (Lam–Lee–Shimozono, the
//! droop-move generation theorem): a `┌` at (a, b) and a blank at (c, d) with
//! a < c, b < d, with no other elbow in the rectangle [a, c] × [b, d]; the pipe
//! through (a, b) is rerouted to turn at (c, b), (c, d) and (a, d) instead.

use crate::error::{MathError, MathResult};
use crate::perms::perm::{MAX_N, Perm};
use std::collections::HashSet;
use std::fmt;

/// The kind of a tile of a bumpless pipe dream.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Tile {
    /// No pipe.
    Blank,
    /// Two pipes crossing.
    Cross,
    /// One pipe from left to right.
    Horizontal,
    /// One pipe from bottom to top.
    Vertical,
    /// An elbow joining the bottom side to the right side (`┌`).
    ElbowDownRight,
    /// An elbow joining the left side to the top side (`┘`).
    ElbowUpLeft,
}

impl Tile {
    /// A one-character picture of the tile.
    pub fn symbol(self) -> char {
        match self {
            Tile::Blank => '·',
            Tile::Cross => '┼',
            Tile::Horizontal => '─',
            Tile::Vertical => '│',
            Tile::ElbowDownRight => '┌',
            Tile::ElbowUpLeft => '┘',
        }
    }

    fn is_elbow(self) -> bool {
        matches!(self, Tile::ElbowDownRight | Tile::ElbowUpLeft)
    }
}

/// A bumpless pipe dream: n×n tiles in row-major order.
#[derive(Clone, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub struct BumplessDream {
    n: usize,
    tiles: Vec<Tile>,
}

impl BumplessDream {
    /// The Rothe bumpless pipe dream of w (its blanks are the Rothe diagram of w).
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::bumpless::BumplessDream};
    /// let w = Perm::parse("2143").unwrap();
    /// let d = BumplessDream::rothe(&w);
    /// assert_eq!(d.blanks(), vec![(1, 1), (3, 3)]);
    /// assert_eq!(d.permutation(), w);
    /// ```
    pub fn rothe(w: &Perm) -> BumplessDream {
        let n = w.n();
        let inv = w.inverse();
        let mut tiles = Vec::with_capacity(n * n);
        for r in 1..=n {
            for c in 1..=n {
                let horizontal = c > w.at(r);
                let vertical = r > inv.at(c);
                tiles.push(if c == w.at(r) {
                    Tile::ElbowDownRight
                } else if horizontal && vertical {
                    Tile::Cross
                } else if horizontal {
                    Tile::Horizontal
                } else if vertical {
                    Tile::Vertical
                } else {
                    Tile::Blank
                });
            }
        }
        BumplessDream { n, tiles }
    }

    /// A dream from its tiles (row-major, n² of them); checks that the pipes
    /// connect, that each pipe runs from the bottom edge to the right edge, and
    /// that no two pipes cross twice.
    pub fn from_tiles(n: usize, tiles: Vec<Tile>) -> MathResult<BumplessDream> {
        if n == 0 || n > MAX_N || tiles.len() != n * n {
            return Err(MathError::InvalidInput(format!(
                "a bumpless pipe dream of size n (1..{MAX_N}) has n² tiles; got {} tiles for n = {n}",
                tiles.len()
            )));
        }
        let d = BumplessDream { n, tiles };
        let bad = |m: String| Err(MathError::InvalidInput(m));
        for r in 1..=n {
            for c in 1..=n {
                let t = d.tile(r, c);
                let right = matches!(t, Tile::Cross | Tile::Horizontal | Tile::ElbowDownRight);
                let bottom = matches!(t, Tile::Cross | Tile::Vertical | Tile::ElbowDownRight);
                let next_left = c < n
                    && matches!(
                        d.tile(r, c + 1),
                        Tile::Cross | Tile::Horizontal | Tile::ElbowUpLeft
                    );
                let below_top = r < n
                    && matches!(
                        d.tile(r + 1, c),
                        Tile::Cross | Tile::Vertical | Tile::ElbowUpLeft
                    );
                if c < n && right != next_left {
                    return bad(format!(
                        "the pipes do not connect between ({r}, {c}) and ({r}, {})",
                        c + 1
                    ));
                }
                if r < n && bottom != below_top {
                    return bad(format!(
                        "the pipes do not connect between ({r}, {c}) and ({}, {c})",
                        r + 1
                    ));
                }
                if c == n && !right {
                    return bad(format!("no pipe leaves row {r} on the right"));
                }
                if r == n && !bottom {
                    return bad(format!("no pipe enters column {c} from the bottom"));
                }
                let left_open = matches!(t, Tile::Cross | Tile::Horizontal | Tile::ElbowUpLeft);
                let top_open = matches!(t, Tile::Cross | Tile::Vertical | Tile::ElbowUpLeft);
                if c == 1 && left_open {
                    return bad(format!("a pipe leaves through the left edge at row {r}"));
                }
                if r == 1 && top_open {
                    return bad(format!("a pipe leaves through the top edge at column {c}"));
                }
            }
        }
        let blanks = d.blanks().len();
        if d.permutation().length() != blanks {
            return bad("two pipes cross twice: the dream is not reduced".into());
        }
        Ok(d)
    }

    /// The size n.
    pub fn n(&self) -> usize {
        self.n
    }

    /// The tile at (row, col), 1-based.
    pub fn tile(&self, row: usize, col: usize) -> Tile {
        self.tiles[(row - 1) * self.n + col - 1]
    }

    /// All tiles in row-major order.
    pub fn tiles(&self) -> &[Tile] {
        &self.tiles
    }

    /// The blank tiles as 1-based (row, col), row-major.
    pub fn blanks(&self) -> Vec<(usize, usize)> {
        (0..self.n * self.n)
            .filter(|&k| self.tiles[k] == Tile::Blank)
            .map(|k| (k / self.n + 1, k % self.n + 1))
            .collect()
    }

    /// The exponent vector of Π x_i over the blank tiles in row i (length n).
    pub fn monomial(&self) -> Vec<u32> {
        (0..self.n)
            .map(|r| {
                self.tiles[r * self.n..(r + 1) * self.n]
                    .iter()
                    .filter(|&&t| t == Tile::Blank)
                    .count() as u32
            })
            .collect()
    }

    /// The permutation: w(i) is the column whose bottom the pipe leaving row i entered.
    pub fn permutation(&self) -> Perm {
        let n = self.n;
        let mut values = vec![0usize; n];
        for start in 1..=n {
            // walk up from the bottom of column `start`
            let (mut r, mut c, mut from_below) = (n, start, true);
            let mut steps = 0;
            loop {
                steps += 1;
                if steps > 2 * n + 1 {
                    break;
                }
                let t = self.tile(r, c);
                let go_up = match (t, from_below) {
                    (Tile::Vertical | Tile::Cross, true) => true,
                    (Tile::ElbowDownRight, true) => false,
                    (Tile::Horizontal | Tile::Cross, false) => false,
                    (Tile::ElbowUpLeft, false) => true,
                    _ => break,
                };
                if go_up {
                    if r == 1 {
                        break;
                    }
                    r -= 1;
                    from_below = true;
                } else {
                    if c == n {
                        values[r - 1] = start;
                        break;
                    }
                    c += 1;
                    from_below = false;
                }
            }
        }
        Perm::from_one_line(&values).unwrap_or_else(|_| Perm::identity(n))
    }

    /// The droop of the `┌` at (a, b) into the blank at (c, d), 1-based, if allowed.
    ///
    /// ```
    /// use elbowroom_math::{Perm, pipes::bumpless::BumplessDream};
    /// // 132: the Rothe dream has its blank at (2, 2); the elbow at (1, 1) droops into it
    /// let d = BumplessDream::rothe(&Perm::parse("132").unwrap());
    /// let e = d.droop(1, 1, 2, 2).unwrap();
    /// assert_eq!(e.blanks(), vec![(1, 1)]);
    /// assert_eq!(e.permutation(), d.permutation());
    /// ```
    pub fn droop(&self, a: usize, b: usize, c: usize, d: usize) -> Option<BumplessDream> {
        let n = self.n;
        if a == 0 || b == 0 || c > n || d > n || a >= c || b >= d {
            return None;
        }
        if self.tile(a, b) != Tile::ElbowDownRight || self.tile(c, d) != Tile::Blank {
            return None;
        }
        for r in a..=c {
            for col in b..=d {
                if (r, col) != (a, b) && self.tile(r, col).is_elbow() {
                    return None;
                }
            }
        }
        let mut out = self.clone();
        let mut set = |r: usize, col: usize, t: Tile| out.tiles[(r - 1) * n + col - 1] = t;
        set(a, b, Tile::Blank);
        set(c, d, Tile::ElbowUpLeft);
        set(c, b, Tile::ElbowDownRight);
        set(a, d, Tile::ElbowDownRight);
        // the old route: row a and column b; the new one: row c and column d
        for col in b + 1..d {
            let top = self.tile(a, col);
            set(
                a,
                col,
                if top == Tile::Cross {
                    Tile::Vertical
                } else {
                    Tile::Blank
                },
            );
            let bottom = self.tile(c, col);
            set(
                c,
                col,
                if bottom == Tile::Vertical {
                    Tile::Cross
                } else {
                    Tile::Horizontal
                },
            );
        }
        for r in a + 1..c {
            let left = self.tile(r, b);
            set(
                r,
                b,
                if left == Tile::Cross {
                    Tile::Horizontal
                } else {
                    Tile::Blank
                },
            );
            let right = self.tile(r, d);
            set(
                r,
                d,
                if right == Tile::Horizontal {
                    Tile::Cross
                } else {
                    Tile::Vertical
                },
            );
        }
        Some(out)
    }

    /// Every droop this dream allows, as the resulting dreams.
    pub fn droops(&self) -> Vec<BumplessDream> {
        let n = self.n;
        let mut out = Vec::new();
        for a in 1..=n {
            for b in 1..=n {
                if self.tile(a, b) != Tile::ElbowDownRight {
                    continue;
                }
                for c in a + 1..=n {
                    for d in b + 1..=n {
                        if let Some(e) = self.droop(a, b, c, d) {
                            out.push(e);
                        }
                    }
                }
            }
        }
        out
    }
}

impl fmt::Debug for BumplessDream {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "BumplessDream(n = {}, blanks = {:?})",
            self.n,
            self.blanks()
        )
    }
}

impl fmt::Display for BumplessDream {
    /// The grid with `·` blank, `┼` cross, `─` horizontal, `│` vertical, `┌` and `┘` elbows.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        for r in 1..=self.n {
            let line: String = (1..=self.n).map(|c| self.tile(r, c).symbol()).collect();
            write!(f, "{line}")?;
            if r < self.n {
                writeln!(f)?;
            }
        }
        Ok(())
    }
}

/// All bumpless pipe dreams of w: the closure of the Rothe dream under droop
/// moves, each listed once (a breadth-first search with a set of dreams seen),
/// sorted by blank set for a stable order.
///
/// ```
/// use elbowroom_math::{Perm, pipes::bumpless::bumpless_dreams};
/// // S_{1432} has five terms, so 1432 has five bumpless pipe dreams
/// assert_eq!(bumpless_dreams(&Perm::parse("1432").unwrap()).len(), 5);
/// ```
pub fn bumpless_dreams(w: &Perm) -> Vec<BumplessDream> {
    let start = BumplessDream::rothe(w);
    let mut seen: HashSet<BumplessDream> = HashSet::new();
    seen.insert(start.clone());
    let mut queue = vec![start];
    while let Some(d) = queue.pop() {
        for e in d.droops() {
            if seen.insert(e.clone()) {
                queue.push(e);
            }
        }
    }
    let mut all: Vec<BumplessDream> = seen.into_iter().collect();
    all.sort_by_key(|d| d.blanks());
    all
}

/// The number of bumpless pipe dreams of w (by listing them).
pub fn count_bumpless(w: &Perm) -> usize {
    bumpless_dreams(w).len()
}
