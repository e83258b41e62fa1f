//! Listings of permutations: those of S_n of a given length, in
//! lexicographic order.

use crate::math::perms::perm::Perm;

/// The permutations of S_n of length `len`, in lexicographic order of their
/// one-line notation (by their Lehmer codes, which list in the same order).
/// Their number is the Mahonian number (OEIS A008302).
///
/// ```
/// use elbowroom::math::perms::listing::perms_of_length;
/// let w: Vec<String> = perms_of_length(3, 1).iter().map(|w| w.to_string()).collect();
/// assert_eq!(w, vec!["132", "213"]);
/// ```
pub fn perms_of_length(n: usize, len: usize) -> Vec<Perm> {
    fn go(i: usize, n: usize, rest: usize, code: &mut Vec<usize>, out: &mut Vec<Perm>) {
        if i == n {
            if rest == 0
                && let Ok(w) = Perm::from_code(code, Some(n))
            {
                out.push(w);
            }
            return;
        }
        // c_i <= n - i (1-based i), and the later entries can hold at most Σ_{k>i} (n - k)
        let cap = n - 1 - i;
        let later: usize = (i + 1..n).map(|k| n - 1 - k).sum();
        for c in 0..=cap.min(rest) {
            if rest - c > later {
                continue;
            }
            code.push(c);
            go(i + 1, n, rest - c, code, out);
            code.pop();
        }
    }
    let mut out = Vec::new();
    if n >= 1 && len <= n * (n - 1) / 2 {
        go(0, n, len, &mut Vec::with_capacity(n), &mut out);
    }
    out
}
