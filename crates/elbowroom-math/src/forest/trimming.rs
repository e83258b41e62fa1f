//! The trimming operators (quasisymmetric divided differences) of
//! Nadeau–Spink–Tewari: R_i f = f(x_1, …, x_{i−1}, 0, x_i, x_{i+1}, …) and
//! T_i f = (R_{i+1} f − R_i f)/x_i.
//!
//! On a monomial x^e: R_{i+1} x^e is 0 unless e_{i+1} = 0 and then deletes
//! the (i+1)-st exponent; R_i likewise with e_i. When e_i = e_{i+1} = 0 the two
//! images agree and cancel, so T_i x^e has at most one term, computed on the
//! packed monomial with no division.

use crate::poly::mono::{MAX_VARS, Mono};
use crate::poly::polynomial::{Coeff, Poly, PolyBuilder};

/// The monomial with the exponent of variable p (0-based) deleted and the later ones moved down.
#[inline]
fn delete_var(m: Mono, p: usize) -> Mono {
    let low_bits = 8 * (MAX_VARS - 1 - p) as u32; // the variables after p
    let high = if p == 0 {
        0
    } else {
        m.0 & !((1u128 << (8 * (MAX_VARS - p) as u32)) - 1)
    };
    let low = if low_bits == 0 {
        0
    } else {
        m.0 & ((1u128 << low_bits) - 1)
    };
    Mono(high | (low << 8))
}

/// R_i f = f(x_1, …, x_{i−1}, 0, x_i, …), i ≥ 1.
pub fn r_op<C: Coeff>(f: &Poly<C>, i: usize) -> Poly<C> {
    let p = i - 1;
    let mut b = PolyBuilder::new(f.nvars());
    if p < MAX_VARS {
        for (m, c) in f.terms() {
            if m.exp(p) == 0 {
                b.add_term(delete_var(*m, p), c);
            }
        }
    } else {
        b.add_poly(f);
    }
    b.build()
}

/// T_i f = (R_{i+1} f − R_i f)/x_i, i ≥ 1 (0 for i past the variables of f).
///
/// ```
/// use elbowroom_math::forest::trimming::trim;
/// use elbowroom_math::poly::parse::parse_poly;
/// // T_2 (x1 + x2) = 1 (the forest polynomial of one node on the leaves 2, 3)
/// let f = parse_poly("x1 + x2", Some(3)).unwrap();
/// assert_eq!(trim(&f, 2).to_text(), "1");
/// assert!(trim(&f, 1).is_zero());
/// ```
pub fn trim<C: Coeff>(f: &Poly<C>, i: usize) -> Poly<C> {
    if i == 0 || i > MAX_VARS {
        return Poly::zero(f.nvars());
    }
    let a = i - 1;
    let xa = Mono::var_index(a);
    let mut b = PolyBuilder::new(f.nvars());
    for (m, c) in f.terms() {
        let ea = m.exp(a);
        let eb = if a + 1 < MAX_VARS { m.exp(a + 1) } else { 0 };
        if eb == 0 && ea > 0 {
            let d = if a + 1 < MAX_VARS {
                delete_var(*m, a + 1)
            } else {
                *m
            };
            b.add_term(d.divided_by(xa), c);
        } else if ea == 0 && eb > 0 {
            b.add_term(delete_var(*m, a).divided_by(xa), &-c.clone());
        }
    }
    b.build()
}

/// The same T_i by its definition, with R_i and an exact division by x_i
/// (the second method of the tests).
pub fn trim_by_definition<C: Coeff>(f: &Poly<C>, i: usize) -> Poly<C> {
    let d = r_op(f, i + 1).sub(&r_op(f, i));
    let xi = Mono::var_index(i - 1);
    let terms: Vec<(Mono, C)> = d
        .terms()
        .iter()
        .map(|(m, c)| {
            assert!(xi.divides(*m), "R_(i+1) f − R_i f is divisible by x_i");
            (m.divided_by(xi), c.clone())
        })
        .collect();
    Poly::from_terms(f.nvars(), terms)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::poly::parse::parse_poly;

    #[test]
    fn trim_agrees_with_its_definition() {
        let f = parse_poly("x1^3*x2 - 2*x2^2*x4 + x3*x5 + 7*x1*x3^2 + x1 + 4", Some(6)).unwrap();
        for i in 1..=6 {
            assert_eq!(trim(&f, i), trim_by_definition(&f, i), "T_{i}");
        }
    }

    #[test]
    fn trim_kills_quasisymmetric_polynomials() {
        // Nadeau–Spink–Tewari: T_i vanishes on QSym_n; M_(2,1) and F_(1,2) in x1..x5
        for text in ["M(2,1)", "F(1,2)", "M(1,1,1)"] {
            let f = parse_poly(text, Some(5)).unwrap();
            for i in 1..5 {
                assert!(trim(&f, i).is_zero(), "T_{i} {text}");
            }
        }
    }
}
