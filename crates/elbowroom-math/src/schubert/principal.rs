//! The principal specialization S_w(1, q, q², …) of a Schubert polynomial (x_i ↦ q^{i−1}),
//! a polynomial in q whose value at q = 1 is S_w(1, …, 1), the number of reduced
//! pipe dreams of w.

use crate::poly::polynomial::IntPoly;
use crate::poly::qpoly::QPoly;
use num_bigint::BigInt;

/// f(1, q, q², …) for a polynomial f in x_1, x_2, …: each monomial x^e goes to
/// q^{Σ (i−1) e_i}.
///
/// ```
/// use elbowroom_math::{Perm, schubert::{polynomial::schubert, principal::principal_specialization}};
/// // S_1432 = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3 (Macdonald, Notes, table for n = 4)
/// let p = principal_specialization(&schubert(&Perm::parse("1432").unwrap()));
/// assert_eq!(p.to_string(), "q + 2q^2 + q^3 + q^4");
/// ```
pub fn principal_specialization(f: &IntPoly) -> QPoly {
    let nvars = f.nvars();
    let mut coeffs: Vec<BigInt> = Vec::new();
    for (m, c) in f.terms() {
        let power: usize = (0..nvars).map(|i| i * m.exp(i) as usize).sum();
        if coeffs.len() <= power {
            coeffs.resize(power + 1, BigInt::default());
        }
        coeffs[power] += c;
    }
    QPoly::from_coeffs(coeffs)
}
