//! Compositions: weak compositions of a total into a number of parts (the
//! exponent vectors of the monomials of one degree), compositions into
//! positive parts (the indices of quasisymmetric polynomials), and the
//! monomials of one degree.

use crate::poly::mono::Mono;

/// All weak compositions of `total` into `parts` parts, in decreasing lexicographic order.
///
/// ```
/// use elbowroom_math::poly::compositions::weak_compositions;
/// assert_eq!(weak_compositions(2, 2), vec![vec![2, 0], vec![1, 1], vec![0, 2]]);
/// ```
pub fn weak_compositions(total: u32, parts: usize) -> Vec<Vec<u32>> {
    fn go(rest: u32, parts: usize, prefix: &mut Vec<u32>, out: &mut Vec<Vec<u32>>) {
        if prefix.len() + 1 == parts {
            prefix.push(rest);
            out.push(prefix.clone());
            prefix.pop();
            return;
        }
        for v in (0..=rest).rev() {
            prefix.push(v);
            go(rest - v, parts, prefix, out);
            prefix.pop();
        }
    }
    let mut out = Vec::new();
    if parts == 0 {
        if total == 0 {
            out.push(Vec::new());
        }
        return out;
    }
    go(total, parts, &mut Vec::with_capacity(parts), &mut out);
    out
}

/// All compositions of d (positive parts summing to d), in lex order of part lists.
///
/// ```
/// use elbowroom_math::poly::compositions::compositions;
/// assert_eq!(compositions(3), vec![vec![1, 1, 1], vec![1, 2], vec![2, 1], vec![3]]);
/// assert_eq!(compositions(6).len(), 32); // 2^(d-1)
/// ```
pub fn compositions(d: u32) -> Vec<Vec<u32>> {
    if d == 0 {
        return vec![Vec::new()];
    }
    let mut out = Vec::new();
    for first in 1..=d {
        for mut rest in compositions(d - first) {
            rest.insert(0, first);
            out.push(rest);
        }
    }
    out
}

/// All monomials of degree d in n variables, in increasing lex order (the
/// weak compositions of d into n parts, read backwards).
///
/// ```
/// use elbowroom_math::{Mono, poly::compositions::monomials_of_degree};
/// let m: Vec<String> = monomials_of_degree(2, 2).iter().map(|m| m.text(2)).collect();
/// assert_eq!(m, vec!["x2^2", "x1 x2", "x1^2"]);
/// ```
pub fn monomials_of_degree(n: usize, d: u32) -> Vec<Mono> {
    if n == 0 {
        return Vec::new();
    }
    weak_compositions(d, n)
        .iter()
        .rev()
        .filter_map(|e| Mono::from_exps(e))
        .collect()
}
