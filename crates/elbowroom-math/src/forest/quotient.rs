//! The forest basis of the quotient Q[x_1..x_n]/J_n: the P_F whose
//! nontrivial trees have all their leaves in [n] (equivalently
//! c_i + ⋯ + c_n ≤ n − i for every i) project to a basis, Catalan(n) of them,
//! graded as the Hilbert series; every other P_F in Q[x_1..x_n] lies in J_n
//! (Nadeau–Tewari 2024). The class of f is therefore its forest expansion
//! restricted to those forests, computed without the Gröbner basis of J_n.

use crate::error::{MathError, MathResult};
use crate::forest::expansion::{ForestTerms, forest_expansion};
use crate::poly::polynomial::{Coeff, Poly};
use crate::progress::Progress;

/// The largest n of the forest basis of the quotient listed whole (Catalan(16) = 35 357 670 codes
/// would be too many to hold; Catalan(14) = 2 674 440 is the last listed).
pub const FOREST_BASIS_MAX_N: usize = 14;

/// The codes of the forests supported in [n], by degree, and within a degree
/// in decreasing lexicographic order.
///
/// ```
/// use elbowroom_math::forest::quotient::forest_basis;
/// // n = 3: ∅, (1,0), (0,1), (2), (1,1): Catalan(3) = 5
/// let b = forest_basis(3).unwrap();
/// assert_eq!(b, vec![vec![], vec![1], vec![0, 1], vec![2], vec![1, 1]]);
/// ```
pub fn forest_basis(n: usize) -> MathResult<Vec<Vec<usize>>> {
    if n > FOREST_BASIS_MAX_N {
        return Err(MathError::OutOfRange(format!(
            "the forest basis for n = {n}; it is listed for n up to {FOREST_BASIS_MAX_N}"
        )));
    }
    let mut by_degree: Vec<Vec<Vec<usize>>> = vec![Vec::new(); n.max(1)];
    let mut code = vec![0usize; n];
    fill(n, 0, &mut code, &mut by_degree);
    let mut out = Vec::new();
    for mut level in by_degree {
        level.sort_unstable_by(|a, b| b.cmp(a));
        out.extend(level);
    }
    Ok(out)
}

/// Chooses c_i, …, c_n from the right: `i` counts the positions already chosen
/// from the right, the suffix sums stay within c_j + ⋯ + c_n ≤ n − j.
fn fill(n: usize, chosen: usize, code: &mut Vec<usize>, out: &mut [Vec<Vec<usize>>]) {
    if chosen == n {
        let mut c = code.clone();
        while c.last() == Some(&0) {
            c.pop();
        }
        let d: usize = c.iter().sum();
        out[d].push(c);
        return;
    }
    let j = n - chosen; // the position being chosen, 1-based
    let suffix: usize = code[j..].iter().sum();
    for v in 0..=(n - j - suffix) {
        code[j - 1] = v;
        fill(n, chosen + 1, code, out);
    }
    code[j - 1] = 0;
}

/// The graded dimensions counted from the forest basis: entry k counts the forests of size k.
pub fn forest_hilbert_series(n: usize) -> MathResult<Vec<usize>> {
    let mut h = vec![0usize; n.max(1)];
    for c in forest_basis(n)? {
        h[c.iter().sum::<usize>()] += 1;
    }
    Ok(h)
}

/// The class of f modulo J_n in the forest basis: (code, coefficient) over
/// the forests supported in [n], in decreasing lexicographic order of code.
///
/// ```
/// use elbowroom_math::forest::quotient::forest_normal_form;
/// use elbowroom_math::poly::parse::parse_poly;
/// use elbowroom_math::Progress;
/// // x1 ≡ −(x2 + x3) mod J_3; x1 = P_(1), which is supported in [2] ⊂ [3]
/// let f = parse_poly("x1^2", Some(3)).unwrap();
/// let nf = forest_normal_form(&f, 3, &Progress::default()).unwrap();
/// // x1^2 = P_(2) exactly, and (2) is the tree ((1 2)3) on the leaves 1..3
/// assert_eq!(nf.len(), 1);
/// assert_eq!(nf[0].0, vec![2]);
/// ```
pub fn forest_normal_form<C: Coeff>(
    f: &Poly<C>,
    n: usize,
    progress: &Progress,
) -> MathResult<ForestTerms<C>> {
    let used = f.used_vars();
    if used > n {
        return Err(MathError::OutOfRange(format!(
            "the polynomial uses x{used} but the quotient has only x1..x{n}"
        )));
    }
    forest_expansion(f, Some(n), progress)
}
