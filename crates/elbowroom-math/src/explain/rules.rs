//! Rules that give a_w at once, each where it applies (ℓ(w) = n − 1):
//!
//! - every reduced word a parking word (c_1 + ⋯ + c_i ≥ i, so A_c = Π i^{c_i}):
//!   a_w = S_w(1, …, 1), the number of reduced pipe dreams (Nadeau–Tewari, IMRN 2023);
//! - w Grassmannian with its descent at k and shape λ (|λ| = n − 1): a_w is the number
//!   of standard tableaux of shape λ with k − 1 descents (i a descent when i + 1 lies
//!   in a lower row, rows drawn top to bottom);
//! - w a Coxeter element (each s_i once): every content is (1, …, 1), A = (n−1)!, so
//!   a_w = |Red(w)|.

use crate::error::MathResult;
use crate::explain::formula::WordFormula;
use crate::perms::class::is_coxeter_element;
use crate::perms::perm::Perm;
use crate::pipes::dream::count_pipe_dreams;
use crate::progress::Progress;
use num_bigint::{BigInt, BigUint};

/// The most standard tableaux a Grassmannian rule lists (it counts them all).
pub const TABLEAUX_LISTED: usize = 200;

/// A rule that applies to w, with the value it gives.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Rule {
    /// Every reduced word is a parking word: a_w = S_w(1, …, 1) = `pipe_dreams`.
    Parking {
        /// The number of reduced pipe dreams of w.
        pipe_dreams: BigUint,
    },
    /// w is Grassmannian: a_w = the number of standard tableaux of shape λ with k − 1 descents.
    Grassmannian {
        /// The descent k of w.
        descent: usize,
        /// The shape λ.
        shape: Vec<usize>,
        /// The number of standard tableaux of shape λ with k − 1 descents.
        count: BigUint,
        /// The first [`TABLEAUX_LISTED`] of them, as rows of entries.
        tableaux: Vec<Vec<Vec<usize>>>,
    },
    /// w is a Coxeter element: a_w = |Red(w)|.
    Coxeter {
        /// |Red(w)|.
        reduced_words: BigUint,
    },
}

impl Rule {
    /// The rule's name: `parking`, `grassmannian` or `coxeter`.
    pub fn name(&self) -> &'static str {
        match self {
            Rule::Parking { .. } => "parking",
            Rule::Grassmannian { .. } => "grassmannian",
            Rule::Coxeter { .. } => "coxeter",
        }
    }

    /// The value of a_w the rule gives.
    pub fn value(&self) -> BigInt {
        match self {
            Rule::Parking { pipe_dreams } => pipe_dreams.clone().into(),
            Rule::Grassmannian { count, .. } => count.clone().into(),
            Rule::Coxeter { reduced_words } => reduced_words.clone().into(),
        }
    }

    /// One line saying what the rule is and what it gives.
    pub fn statement(&self) -> String {
        match self {
            Rule::Parking { pipe_dreams } => format!(
                "every reduced word is a parking word, so a_w = S_w(1, …, 1) = {pipe_dreams} (pipe dreams)"
            ),
            Rule::Grassmannian {
                descent,
                shape,
                count,
                ..
            } => format!(
                "Grassmannian (descent at {descent}, shape {shape:?}): a_w = {count} standard tableaux with {} descent{}",
                descent - 1,
                if *descent == 2 { "" } else { "s" }
            ),
            Rule::Coxeter { reduced_words } => format!(
                "a Coxeter element: every content is (1, …, 1), so a_w = |Red(w)| = {reduced_words}"
            ),
        }
    }
}

/// The rules that apply to w, given its reduced-word formula.
pub fn rules_for(formula: &WordFormula, progress: &Progress) -> MathResult<Vec<Rule>> {
    let w = &formula.perm;
    let mut rules = Vec::new();
    if formula.all_parking() {
        rules.push(Rule::Parking {
            pipe_dreams: count_pipe_dreams(w),
        });
    }
    if let [k] = w.descents()[..] {
        let shape = grassmannian_shape(w);
        let (count, tableaux) = tableaux_with_descents(&shape, k - 1, progress)?;
        rules.push(Rule::Grassmannian {
            descent: k,
            shape,
            count,
            tableaux,
        });
    }
    if is_coxeter_element(w) {
        rules.push(Rule::Coxeter {
            reduced_words: formula.reduced_words.clone(),
        });
    }
    Ok(rules)
}

/// The shape λ of a Grassmannian w with its descent at k: λ_i = w(k+1−i) − (k+1−i),
/// zero parts dropped.
pub fn grassmannian_shape(w: &Perm) -> Vec<usize> {
    let Some(&k) = w.descents().first() else {
        return Vec::new();
    };
    (1..=k)
        .map(|i| w.at(k + 1 - i) - (k + 1 - i))
        .filter(|&p| p > 0)
        .collect()
}

/// The descents of a standard tableau (rows top to bottom): the i with i + 1 in a lower row.
pub fn tableau_descents(tableau: &[Vec<usize>]) -> Vec<usize> {
    let size: usize = tableau.iter().map(|r| r.len()).sum();
    let mut row_of = vec![0; size + 2];
    for (r, row) in tableau.iter().enumerate() {
        for &x in row {
            row_of[x] = r;
        }
    }
    (1..size).filter(|&i| row_of[i + 1] > row_of[i]).collect()
}

/// The standard tableaux of shape λ with exactly `descents` descents: their number and
/// the first [`TABLEAUX_LISTED`] (entries placed 1, 2, … at outer corners, in order).
pub fn tableaux_with_descents(
    shape: &[usize],
    descents: usize,
    progress: &Progress,
) -> MathResult<(BigUint, Vec<Vec<Vec<usize>>>)> {
    let size: usize = shape.iter().sum();
    let mut rows: Vec<Vec<usize>> = shape.iter().map(|_| Vec::new()).collect();
    let mut count = BigUint::default();
    let mut listed = Vec::new();
    let mut steps = 0u64;
    place(
        shape,
        &mut rows,
        1,
        size,
        usize::MAX,
        0,
        descents,
        &mut count,
        &mut listed,
        progress,
        &mut steps,
    )?;
    Ok((count, listed))
}

#[allow(clippy::too_many_arguments)]
fn place(
    shape: &[usize],
    rows: &mut Vec<Vec<usize>>,
    next: usize,
    size: usize,
    last_row: usize,
    used: usize,
    wanted: usize,
    count: &mut BigUint,
    listed: &mut Vec<Vec<Vec<usize>>>,
    progress: &Progress,
    steps: &mut u64,
) -> MathResult<()> {
    *steps += 1;
    if (*steps).is_multiple_of(4096) {
        progress.check()?;
    }
    if used > wanted {
        return Ok(());
    }
    if next > size {
        if used == wanted {
            *count += 1u8;
            if listed.len() < TABLEAUX_LISTED {
                listed.push(rows.clone());
            }
        }
        return Ok(());
    }
    for r in 0..shape.len() {
        let fits = rows[r].len() < shape[r] && (r == 0 || rows[r - 1].len() > rows[r].len());
        if !fits {
            continue;
        }
        let descent = last_row != usize::MAX && r > last_row;
        rows[r].push(next);
        place(
            shape,
            rows,
            next + 1,
            size,
            r,
            used + usize::from(descent),
            wanted,
            count,
            listed,
            progress,
            steps,
        )?;
        rows[r].pop();
    }
    Ok(())
}
