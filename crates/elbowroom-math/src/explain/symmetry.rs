//! The symmetries of a_w and the cyclic sum.
//!
//! - a_w = a_{w^{-1}} = a_{w0 w w0} (reversing a word, and a_i ↦ n − a_i).
//! - Cyclic sum: read letters modulo n (n ≡ 0). For the shifts j for which every
//!   letter of w's reduced words, shifted by j, avoids 0, the shifted words are the
//!   reduced words of one permutation w^{(j)}; then Σ_j a_{w^{(j)}} = |Red(w)|
//!   (from the reduced-word formula and the cyclic sum of mixed Eulerian numbers,
//!   Postnikov, IMRN 2009, §16).
//! - For other h: a^h_w = a^{h*}_{w0 w w0}, h* the transpose of h (the cells
//!   {(i, j) : i ≤ h(j)} reflected in the antidiagonal).

use crate::error::MathResult;
use crate::hessenberg::function::HessenbergFn;
use crate::perms::perm::Perm;
use crate::perms::words::reduced_words;

/// w0 w w0: (w0 w w0)(i) = n + 1 − w(n + 1 − i).
pub fn conjugate_by_longest(w: &Perm) -> Perm {
    let n = w.n();
    let values: Vec<usize> = (1..=n).map(|i| n + 1 - w.at(n + 1 - i)).collect();
    Perm::from_one_line(&values).unwrap_or_else(|_| w.clone())
}

/// The letters of w's reduced words: the i with w(1..i) ≠ {1, …, i}.
pub fn support(w: &Perm) -> Vec<usize> {
    let mut max = 0;
    let mut out = Vec::new();
    for i in 1..w.n() {
        max = max.max(w.at(i));
        if max > i {
            out.push(i);
        }
    }
    out
}

/// The cyclic orbit: for each shift j = 0, …, n − 1 whose shifted letters avoid 0
/// (mod n), the pair (j, w^{(j)}); j = 0 gives w itself.
///
/// ```
/// use elbowroom_math::{Perm, explain::symmetry::cyclic_orbit};
/// // 1432 (letters {2, 3}): j = 0 gives 1432, j = 3 maps 232 to 121, so 3214
/// let orbit = cyclic_orbit(&Perm::parse("1432").unwrap()).unwrap();
/// let shown: Vec<String> = orbit.iter().map(|(j, u)| format!("{j}:{u}")).collect();
/// assert_eq!(shown, vec!["0:1432", "3:3214"]);
/// ```
pub fn cyclic_orbit(w: &Perm) -> MathResult<Vec<(usize, Perm)>> {
    let n = w.n();
    let letters = support(w);
    let word = reduced_words(w).next().unwrap_or_default();
    let mut out = Vec::new();
    for j in 0..n {
        if letters.iter().any(|&a| (a + j) % n == 0) {
            continue;
        }
        let shifted: Vec<usize> = word.iter().map(|&a| (a + j) % n).collect();
        out.push((j, Perm::from_reduced_word(&shifted, Some(n))?));
    }
    Ok(out)
}

/// h*: the transpose of h in the antidiagonal, h*(j) = max{i : h(n + 1 − i) ≥ n + 1 − j}.
pub fn transpose_hessenberg(h: &HessenbergFn) -> MathResult<HessenbergFn> {
    let n = h.n();
    let values: Vec<usize> = (1..=n)
        .map(|j| {
            (1..=n)
                .filter(|&i| h.at(n + 1 - i) >= n + 1 - j)
                .max()
                .unwrap_or(j)
        })
        .collect();
    HessenbergFn::new(&values)
}
