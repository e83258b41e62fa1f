//! Sizing before a computation starts, in one place for every front end: the
//! commands and the window call these functions and refuse alike, with the
//! message they return (naming the estimate and the limit of
//! [`crate::limits`]). Each returns [`MathError::TooLarge`] past its limit.

use crate::hessenberg::function::HessenbergFn;
use crate::limits::{
    DIVSYM_PRODUCT_LIMIT, DIVSYM_TERM_LIMIT, EULERIAN_WORK_LIMIT, SCHUBERT_TERM_LIMIT,
    VOLUME_DIGIT_LIMIT, binomial, monomials_of_degree,
};
use crate::permutohedra::permutohedron::Permutohedron;
use crate::pipes::dream::term_bound;
use crate::{MathError, MathResult, Perm, RatPoly};

/// DS_h(f): refused when its answer could have more than
/// [`DIVSYM_TERM_LIMIT`] monomials (it is symmetric of degree deg f − |h|, so
/// at most C(deg f − |h| + n − 1, n − 1) of them), or when f·Q_h could have
/// more than [`DIVSYM_PRODUCT_LIMIT`] terms (terms(f) times
/// min(2^k, C(k + n − 1, n − 1)) for the k factors of Q_h).
pub fn check_divsym(f: &RatPoly, h: &HessenbergFn) -> MathResult<()> {
    h.require_polynomials()?;
    let n = h.n() as u64;
    let dim = h.dimension() as u64;
    let degree = u64::from(f.degree());
    // the message names what was asked for: DS_n for the default h
    let name = if h.is_default() {
        format!("DS_{n}(f)")
    } else {
        "DS_h(f)".to_string()
    };
    if !f.is_zero() && degree > dim {
        let monomials = monomials_of_degree(degree - dim, n);
        if monomials > DIVSYM_TERM_LIMIT {
            return Err(MathError::TooLarge(format!(
                "{name} is symmetric of degree {} in {n} variables and may have {monomials} monomials; at most {DIVSYM_TERM_LIMIT} are accepted",
                degree - dim
            )));
        }
    }
    let needs_q = degree > dim || (degree == dim && !h.is_default());
    if needs_q {
        let k = h.complement_pairs().len() as u64;
        let q_terms = if k >= 127 {
            u128::MAX
        } else {
            (1u128 << k).min(binomial(k + n - 1, n - 1))
        };
        let product = (f.len() as u128).saturating_mul(q_terms);
        if product > DIVSYM_PRODUCT_LIMIT {
            let (short, through) = if h.is_default() {
                (
                    "Q",
                    format!(", Q the product of the {k} factors x_i − x_j with j > i + 1"),
                )
            } else {
                ("Q_h", String::new())
            };
            return Err(MathError::TooLarge(format!(
                "{name} goes through f·{short}{through}: {} terms of f times up to {q_terms} terms of {short} is {product}; at most {DIVSYM_PRODUCT_LIMIT} are accepted",
                f.len()
            )));
        }
    }
    Ok(())
}

/// S_w: refused when it may have more than [`SCHUBERT_TERM_LIMIT`] terms
/// ([`term_bound`]: its pipe dreams, or the monomials under the staircase).
pub fn check_schubert(w: &Perm) -> MathResult<()> {
    let bound = term_bound(w);
    if bound > SCHUBERT_TERM_LIMIT {
        return Err(MathError::TooLarge(format!(
            "S_{w} may have up to {bound} terms (its pipe dreams, or the monomials under the staircase of degree {}); at most {SCHUBERT_TERM_LIMIT} are accepted",
            w.length()
        )));
    }
    Ok(())
}

/// The mixed Eulerian numbers of n (n >= 2): refused past
/// [`EULERIAN_WORK_LIMIT`] steps (C(2n − 3, n − 2) compositions, each over the
/// monomials of degree n − 1 in n variables).
pub fn check_eulerian(n: usize) -> MathResult<()> {
    let n = n.max(2) as u64;
    let compositions = binomial(2 * n - 3, n - 2);
    let work = compositions.saturating_mul(monomials_of_degree(n - 1, n));
    if work > EULERIAN_WORK_LIMIT {
        return Err(MathError::TooLarge(format!(
            "mixed Eulerian numbers at n = {n}: {compositions} compositions, each over {} monomials of degree {}, is {work} steps; at most {EULERIAN_WORK_LIMIT} are accepted (n <= 10)",
            monomials_of_degree(n - 1, n),
            n - 1
        )));
    }
    Ok(())
}

/// A volume of P_λ (`what`, for the message): refused when its numbers would
/// have more than [`VOLUME_DIGIT_LIMIT`] digits
/// ([`Permutohedron::volume_digit_estimate`], plus `extra`).
pub fn check_volume(p: &Permutohedron, extra: u64, what: &str) -> MathResult<()> {
    let digits = p.volume_digit_estimate().saturating_add(extra);
    if digits > VOLUME_DIGIT_LIMIT {
        return Err(MathError::TooLarge(format!(
            "{what} at n = {} works with numbers of about {digits} digits ((n − 1) times the digits of λ over a common denominator); at most {VOLUME_DIGIT_LIMIT} are accepted",
            p.n()
        )));
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_limits_decide() {
        // 1 3 5 ... 15 2 4 ... 16 has 2^28 reduced pipe dreams (S_w(1) = 2^28):
        // refused; w0 of S_16 is the single monomial x^δ: accepted
        let wide = Perm::parse("1,3,5,7,9,11,13,15,2,4,6,8,10,12,14,16");
        assert!(matches!(
            wide.map(|w| check_schubert(&w)),
            Ok(Err(MathError::TooLarge(_)))
        ));
        let w0 = Perm::parse("16,15,14,13,12,11,10,9,8,7,6,5,4,3,2,1");
        assert!(matches!(w0.map(|w| check_schubert(&w)), Ok(Ok(()))));
        // A_c of n = 10 is within the work limit, n = 12 is not (the message says n <= 10)
        assert!(check_eulerian(10).is_ok());
        assert!(matches!(check_eulerian(12), Err(MathError::TooLarge(m)) if m.contains("n <= 10")));
    }
}
