//! The Lascoux–Schützenberger transition step, written once.
//!
//! For w ≠ id let r be the last descent of w, s > r the largest position with
//! w(s) < w(r), and v = w·t_{rs} (so ℓ(v) = ℓ(w) − 1). Then
//!
//! S_w = x_r S_v + Σ_{q < r, ℓ(v t_{qr}) = ℓ(w)} S_{v t_{qr}}.
//!
//! The recursion ends at the identity (S_id = 1). Schubert polynomials,
//! counts of pipe dreams (S_w(1, …, 1)) and Hessenberg coefficients all walk
//! it; they share [`pivot`] and [`partners`]. Positions here are 0-based
//! indices into one-line notation (`w[0]` is w(1)).

/// ℓ(w·t_{ab}) = ℓ(w) + 1 for positions a < b: w(a) < w(b) and no position c
/// between them has w(a) < w(c) < w(b).
///
/// ```
/// use elbowroom_math::schubert::transition::raises_length_by_one;
/// // w = 132: t_{12} gives 312 (length 2), t_{13} gives 231 (length 2)
/// assert!(raises_length_by_one(&[1, 3, 2], 0, 1));
/// assert!(raises_length_by_one(&[1, 3, 2], 0, 2));
/// assert!(!raises_length_by_one(&[1, 3, 2], 1, 2));
/// ```
pub fn raises_length_by_one(w: &[u8], a: usize, b: usize) -> bool {
    a < b && w[a] < w[b] && !w[a + 1..b].iter().any(|&c| w[a] < c && c < w[b])
}

/// The transition pivot (r, s) of w (0-based), or `None` for the identity:
/// r the last descent, s > r the largest position with w(s) < w(r).
///
/// ```
/// use elbowroom_math::schubert::transition::pivot;
/// assert_eq!(pivot(&[1, 4, 3, 2]), Some((2, 3)));
/// assert_eq!(pivot(&[2, 1, 4, 3]), Some((2, 3)));
/// assert_eq!(pivot(&[3, 1, 2]), Some((0, 2)));
/// assert_eq!(pivot(&[1, 2, 3]), None);
/// ```
pub fn pivot(w: &[u8]) -> Option<(usize, usize)> {
    let n = w.len();
    let r = (0..n.saturating_sub(1)).rev().find(|&i| w[i] > w[i + 1])?;
    let s = (r + 1..n).rev().find(|&j| w[j] < w[r]).unwrap_or(r + 1);
    Some((r, s))
}

/// The positions q < r with ℓ(v·t_{qr}) = ℓ(v) + 1, for v = w·t_{rs}: the
/// terms S_{v t_{qr}} of the transition sum.
///
/// ```
/// use elbowroom_math::schubert::transition::partners;
/// // w = 1432: r = 3, s = 4 (1-based), v = 1423; only q = 1 qualifies:
/// // S_1432 = x3 S_1423 + S_2413
/// let q: Vec<usize> = partners(&[1, 4, 2, 3], 2).collect();
/// assert_eq!(q, vec![0]);
/// ```
pub fn partners(v: &[u8], r: usize) -> impl Iterator<Item = usize> + '_ {
    (0..r).filter(move |&q| raises_length_by_one(v, q, r))
}

/// w with its trailing fixed points dropped (at least one entry kept): S_w
/// does not change under S_n ⊂ S_{n+1}.
///
/// ```
/// use elbowroom_math::schubert::transition::trim_fixed_points;
/// assert_eq!(trim_fixed_points(&[2, 1, 3, 4]), &[2, 1]);
/// assert_eq!(trim_fixed_points(&[1, 2]), &[1]);
/// ```
pub fn trim_fixed_points(w: &[u8]) -> &[u8] {
    let mut m = w.len();
    while m > 1 && w[m - 1] as usize == m {
        m -= 1;
    }
    &w[..m]
}
