//! Listings of permutations: those of S_n of a given length, in
//! lexicographic order (collected, or streamed to a visitor), and their
//! number, the Mahonian numbers.

use crate::error::MathResult;
use crate::perms::perm::Perm;

/// The permutations of S_n of length `len`, in lexicographic order of their
/// one-line notation (by their Lehmer codes, which list in the same order).
/// Their number is the Mahonian number (OEIS A008302), [`mahonian_row`].
///
/// ```
/// use elbowroom_math::perms::listing::perms_of_length;
/// let w: Vec<String> = perms_of_length(3, 1).iter().map(|w| w.to_string()).collect();
/// assert_eq!(w, vec!["132", "213"]);
/// ```
pub fn perms_of_length(n: usize, len: usize) -> Vec<Perm> {
    let mut out = Vec::new();
    // the visitor never fails, so neither does the walk
    let _ = for_each_of_length(n, len, &mut |_, line| {
        let values: Vec<usize> = line.iter().map(|&v| usize::from(v)).collect();
        if let Ok(w) = Perm::from_one_line(&values) {
            out.push(w);
        }
        Ok(())
    });
    out
}

/// Calls `visit(index, w)` for every w in S_n of length `len`, in lexicographic order
/// of one-line notation (that is, of Lehmer codes); stops at the first error.
/// Recursion depth n ≤ 16.
pub fn for_each_of_length(
    n: usize,
    len: usize,
    visit: &mut dyn FnMut(usize, &[u8]) -> MathResult<()>,
) -> MathResult<()> {
    struct Walk<'a> {
        n: usize,
        code: Vec<usize>,
        line: Vec<u8>,
        index: usize,
        visit: &'a mut dyn FnMut(usize, &[u8]) -> MathResult<()>,
    }
    fn go(walk: &mut Walk<'_>, i: usize, rest: usize, free: &mut Vec<u8>) -> MathResult<()> {
        let n = walk.n;
        if i == n {
            if rest == 0 {
                (walk.visit)(walk.index, &walk.line)?;
                walk.index += 1;
            }
            return Ok(());
        }
        // c_i ≤ n − i (1-based i), and the later entries hold at most Σ_{k>i} (n − k)
        let cap = n - 1 - i;
        let later = if i + 2 <= n {
            (n - 2 - i) * (n - 1 - i) / 2
        } else {
            0
        };
        for c in 0..=cap.min(rest) {
            if rest - c > later {
                continue;
            }
            let value = free.remove(c);
            walk.code.push(c);
            walk.line.push(value);
            go(walk, i + 1, rest - c, free)?;
            walk.line.pop();
            walk.code.pop();
            free.insert(c, value);
        }
        Ok(())
    }
    if n == 0 || len > n * (n - 1) / 2 {
        return Ok(());
    }
    let mut walk = Walk {
        n,
        code: Vec::with_capacity(n),
        line: Vec::with_capacity(n),
        index: 0,
        visit,
    };
    let mut free: Vec<u8> = (1..=n as u8).collect();
    go(&mut walk, 0, len, &mut free)
}

/// The Mahonian numbers of S_n: entry k is the number of w in S_n with ℓ(w) = k,
/// the dimension of the degree-k part of H*(Fl_n) (OEIS A008302), for k = 0..=n(n−1)/2.
///
/// ```
/// use elbowroom_math::perms::listing::mahonian_row;
/// assert_eq!(mahonian_row(4), vec![1, 3, 5, 6, 5, 3, 1]);
/// ```
pub fn mahonian_row(n: usize) -> Vec<u128> {
    let mut row = vec![1u128];
    for m in 2..=n {
        // multiply by 1 + q + ... + q^{m-1}
        let mut next = vec![0u128; row.len() + m - 1];
        for (k, &c) in row.iter().enumerate() {
            for slot in &mut next[k..k + m] {
                *slot = slot.saturating_add(c);
            }
        }
        row = next;
    }
    row
}
