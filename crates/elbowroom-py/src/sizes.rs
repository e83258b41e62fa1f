//! The checks the commands make before they start, with the same one-line
//! messages (the tests compare them with the command line's): the ranges of n,
//! the Hessenberg function and λ as read from their text, and the size
//! estimates of S_w, DS_h(f), a volume and the mixed Eulerian numbers against
//! the limits of `elbowroom_math::limits`. Every estimate is the math crate's;
//! only the wording lives here, as it does beside each command.

use crate::values::{bad, math_error};
use elbowroom_math::hessenberg::function::HessenbergFn;
use elbowroom_math::limits::{
    DIVSYM_PRODUCT_LIMIT, DIVSYM_TERM_LIMIT, EULERIAN_WORK_LIMIT, SCHUBERT_TERM_LIMIT,
    VOLUME_DIGIT_LIMIT, binomial, monomials_of_degree,
};
use elbowroom_math::permutohedra::permutohedron::Permutohedron;
use elbowroom_math::pipes::dream::term_bound;
use elbowroom_math::poly::rational::parse_rational;
use elbowroom_math::quotient::groebner::MAX_QUOTIENT_N;
use elbowroom_math::{MAX_N, Perm, RatPoly};
use num_rational::BigRational;
use pyo3::PyResult;

/// The Hessenberg function of `n` and `h` (default h(i) = i + 1), as `--n` and `--h` are read.
pub fn hessenberg_fn(n: usize, h: Option<&str>) -> PyResult<HessenbergFn> {
    if n == 0 || n > MAX_N {
        return Err(bad(format!(
            "--n {n} is out of range; 1 <= n <= {MAX_N} is accepted"
        )));
    }
    match h {
        Some(text) => {
            entries(text, "--h", "h(1),...,h(n), for example 2,3,4,4")?;
            HessenbergFn::parse(text, Some(n)).map_err(math_error)
        }
        None => HessenbergFn::default_for(n).map_err(math_error),
    }
}

/// λ from `l1,...,ln`, as `--lambda` is read.
pub fn lambda(text: &str) -> PyResult<Vec<BigRational>> {
    let parts = entries(
        text,
        "--lambda",
        "λ_1,...,λ_n as rationals, for example 3,1/2,0",
    )?;
    if parts.len() > MAX_N {
        return Err(bad(format!(
            "--lambda has {} entries; λ has 1 to {MAX_N} entries",
            parts.len()
        )));
    }
    parts
        .iter()
        .map(|p| parse_rational(p).map_err(math_error))
        .collect()
}

/// The entries of `a,b,c` or `a b c`; an empty entry is refused.
fn entries<'a>(text: &'a str, name: &str, accepted: &str) -> PyResult<Vec<&'a str>> {
    let mut out = Vec::new();
    let pieces: Vec<&str> = text.split(',').collect();
    for (k, piece) in pieces.iter().enumerate() {
        if piece.trim().is_empty() {
            let problem = if pieces.len() == 1 {
                "is empty".to_string()
            } else {
                format!("has an empty entry (entry {} of {})", k + 1, pieces.len())
            };
            return Err(bad(format!("{name} {problem}; give {accepted}")));
        }
        out.extend(piece.split_whitespace());
    }
    Ok(out)
}

/// The range of n for the quotient by J_n.
pub fn quotient_n(n: usize) -> PyResult<()> {
    if n == 0 || n > MAX_QUOTIENT_N {
        return Err(bad(format!(
            "--n {n} is out of range; the quotient is computed for n from 1 to {MAX_QUOTIENT_N}"
        )));
    }
    Ok(())
}

/// S_w is refused when it may have more than [`SCHUBERT_TERM_LIMIT`] terms.
pub fn schubert(w: &Perm) -> PyResult<()> {
    let bound = term_bound(w);
    if bound > SCHUBERT_TERM_LIMIT {
        return Err(bad(format!(
            "S_{w} may have up to {bound} terms (its pipe dreams, or the monomials under the staircase of degree {}); at most {SCHUBERT_TERM_LIMIT} are accepted",
            w.length()
        )));
    }
    Ok(())
}

/// DS_h(f) is refused when its answer may have more than [`DIVSYM_TERM_LIMIT`]
/// monomials or f·Q_h more than [`DIVSYM_PRODUCT_LIMIT`] terms.
pub fn divsym(f: &RatPoly, h: &HessenbergFn) -> PyResult<()> {
    let n = h.n() as u64;
    let dim = h.dimension() as u64;
    let degree = u64::from(f.degree());
    if !f.is_zero() && degree > dim {
        let monomials = monomials_of_degree(degree - dim, n);
        if monomials > DIVSYM_TERM_LIMIT {
            return Err(bad(format!(
                "DS_h(f) is symmetric of degree {} in {n} variables and may have {monomials} monomials; at most {DIVSYM_TERM_LIMIT} are accepted",
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
            return Err(bad(format!(
                "DS_h(f) goes through f·Q_h: {} terms of f times up to {q_terms} terms of Q_h is {product}; at most {DIVSYM_PRODUCT_LIMIT} are accepted",
                f.len()
            )));
        }
    }
    Ok(())
}

/// A volume is refused when its numbers would have more than [`VOLUME_DIGIT_LIMIT`] digits.
pub fn volume(p: &Permutohedron) -> PyResult<()> {
    let digits = p.volume_digit_estimate();
    if digits > VOLUME_DIGIT_LIMIT {
        return Err(bad(format!(
            "the volume at n = {} works with numbers of about {digits} digits ((n − 1) times the digits of λ over a common denominator); at most {VOLUME_DIGIT_LIMIT} are accepted",
            p.n()
        )));
    }
    Ok(())
}

/// The mixed Eulerian numbers of n: 2 <= n <= 16 and at most [`EULERIAN_WORK_LIMIT`] steps.
pub fn eulerian(n: usize) -> PyResult<()> {
    if !(2..=MAX_N).contains(&n) {
        return Err(bad(format!(
            "--n {n} is out of range; 2 <= n <= {MAX_N} is accepted"
        )));
    }
    let n = n as u64;
    let compositions = binomial(2 * n - 3, n - 2);
    let work = compositions.saturating_mul(monomials_of_degree(n - 1, n));
    if work > EULERIAN_WORK_LIMIT {
        return Err(bad(format!(
            "mixed Eulerian numbers at n = {n}: {compositions} compositions, each over {} monomials of degree {}, is {work} steps; at most {EULERIAN_WORK_LIMIT} are accepted (n <= 10)",
            monomials_of_degree(n - 1, n),
            n - 1
        )));
    }
    Ok(())
}
