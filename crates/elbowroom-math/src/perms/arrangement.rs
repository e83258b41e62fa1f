//! The next and previous rearrangement of a sequence in lexicographic order:
//! of a permutation's one-line notation, or of a multiset such as an exponent
//! vector or λ. Every listing of rearrangements in the crate steps with these.

/// Steps `v` to the next distinct rearrangement in increasing lexicographic
/// order; `false` (and `v` unchanged) when `v` is already the last one.
///
/// ```
/// use elbowroom_math::perms::arrangement::next_arrangement;
/// let mut v = [1, 1, 2];
/// assert!(next_arrangement(&mut v));
/// assert_eq!(v, [1, 2, 1]);
/// assert!(next_arrangement(&mut v));
/// assert_eq!(v, [2, 1, 1]);
/// assert!(!next_arrangement(&mut v)); // 3!/2! = 3 rearrangements in all
/// ```
pub fn next_arrangement<T: Ord>(v: &mut [T]) -> bool {
    step_arrangement(v, |a, b| a < b)
}

/// Steps `v` to the previous distinct rearrangement in lexicographic order
/// (the next one in decreasing order); `false` when `v` is the first one.
///
/// ```
/// use elbowroom_math::perms::arrangement::prev_arrangement;
/// let mut v = [2, 1, 1];
/// assert!(prev_arrangement(&mut v));
/// assert_eq!(v, [1, 2, 1]);
/// ```
pub fn prev_arrangement<T: Ord>(v: &mut [T]) -> bool {
    step_arrangement(v, |a, b| a > b)
}

/// The one step behind both directions: `before(a, b)` is the order in which
/// the listing runs.
fn step_arrangement<T: Ord>(v: &mut [T], before: impl Fn(&T, &T) -> bool) -> bool {
    let n = v.len();
    if n < 2 {
        return false;
    }
    // the longest tail that is already last in the listing's order
    let mut i = n - 1;
    while i > 0 && !before(&v[i - 1], &v[i]) {
        i -= 1;
    }
    if i == 0 {
        return false;
    }
    // the rightmost entry of the tail that comes after v[i - 1]
    let mut j = n - 1;
    while !before(&v[i - 1], &v[j]) {
        j -= 1;
    }
    v.swap(i - 1, j);
    v[i..].reverse();
    true
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn both_directions_walk_every_rearrangement_once() {
        // the multiset {1,1,2,3}: 4!/2! = 12 rearrangements
        let mut v = [1, 1, 2, 3];
        let mut up = vec![v];
        while next_arrangement(&mut v) {
            up.push(v);
        }
        assert_eq!(up.len(), 12);
        assert!(up.windows(2).all(|p| p[0] < p[1]));
        let mut down = vec![v];
        while prev_arrangement(&mut v) {
            down.push(v);
        }
        down.reverse();
        assert_eq!(up, down);
    }
}
