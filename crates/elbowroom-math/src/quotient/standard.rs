//! The standard monomials of Q[x_1..x_n]/J_n under lex order x_1 > ⋯ > x_n
//! (Aval–Bergeron–Bergeron): x^e with e_1 + ⋯ + e_i <= i − 1 for every i, and
//! the corners, the minimal monomials that are not standard (the leading
//! monomials of the reduced Gröbner basis).

/// Whether x^e is standard: e_1 + ... + e_i <= i - 1 for every i.
///
/// ```
/// use elbowroom_math::quotient::standard::is_standard;
/// assert!(is_standard(&[0, 1, 1, 0]));  // partial sums 0, 1, 2, 2 <= 0, 1, 2, 3
/// assert!(!is_standard(&[0, 2, 0, 0])); // 0 + 2 > 1
/// ```
pub fn is_standard(e: &[u32]) -> bool {
    let mut s = 0u32;
    for (i, &a) in e.iter().enumerate() {
        s += a;
        if s as usize > i {
            return false;
        }
    }
    true
}

/// Whether x^e is a corner: a minimal non-standard monomial.
pub fn is_corner(e: &[u32]) -> bool {
    let mut s = 0u32;
    for (i, &a) in e.iter().enumerate() {
        s += a;
        if s as usize > i {
            return s as usize == i + 1 && e[i + 1..].iter().all(|&x| x == 0);
        }
    }
    false
}
