//! The checks the commands make before they start, with the same one-line
//! messages (the tests compare them with the command line's): the ranges of n,
//! the Hessenberg function and λ as read from their text; the size checks of
//! S_w, DS_h(f), a volume and the mixed Eulerian numbers are the math crate's
//! (`elbowroom_math::sizing`, which the commands call too), so the limits and
//! the messages are theirs.

use crate::values::{bad, math_error};
use elbowroom_math::hessenberg::function::HessenbergFn;
use elbowroom_math::permutohedra::permutohedron::Permutohedron;
use elbowroom_math::quotient::groebner::quotient_n_refusal;
use elbowroom_math::quotient::reduction::MAX_NORMAL_FORM_N;
use elbowroom_math::{MAX_N, Perm, RatPoly};
use elbowroom_math::{sizing, typed_lists};
use num_rational::BigRational;
use pyo3::PyResult;

/// The Hessenberg function of `n` (1 to `max_n`) and `h` (default
/// h(i) = i + 1), as `--n` and `--h` are read.
pub fn hessenberg_fn(n: usize, h: Option<&str>, max_n: usize) -> PyResult<HessenbergFn> {
    if n == 0 || n > max_n {
        return Err(bad(format!(
            "--n {n} is out of range; 1 <= n <= {max_n} is accepted"
        )));
    }
    match h {
        Some(text) => {
            typed_lists::entries(text, "--h", "h(1),...,h(n), for example 2,3,4,4")
                .map_err(math_error)?;
            HessenbergFn::parse(text, Some(n)).map_err(math_error)
        }
        None => HessenbergFn::default_for(n).map_err(math_error),
    }
}

/// λ from `l1,...,ln`, as `--lambda` is read.
pub fn lambda(text: &str) -> PyResult<Vec<BigRational>> {
    typed_lists::lambda(text).map_err(math_error)
}

/// The range of n for normal forms modulo J_n (through forests beyond the Gröbner basis).
pub fn normal_form_n(n: usize) -> PyResult<()> {
    if n == 0 || n > MAX_NORMAL_FORM_N {
        return Err(bad(format!(
            "--n {n} is out of range; normal forms modulo J_n are computed for n from 1 to {MAX_NORMAL_FORM_N}"
        )));
    }
    Ok(())
}

/// The range of n for the quotient by J_n.
pub fn quotient_n(n: usize) -> PyResult<()> {
    match quotient_n_refusal(n) {
        Some(refusal) => Err(bad(refusal)),
        None => Ok(()),
    }
}

/// S_w is refused when it may have more than
/// [`elbowroom_math::limits::SCHUBERT_TERM_LIMIT`] terms
/// ([`elbowroom_math::sizing::check_schubert`], the commands' check).
pub fn schubert(w: &Perm) -> PyResult<()> {
    sizing::check_schubert(w).map_err(math_error)
}

/// DS_h(f) is refused when its answer may have too many monomials or f·Q_h
/// too many terms ([`elbowroom_math::sizing::check_divsym`], the commands' check).
pub fn divsym(f: &RatPoly, h: &HessenbergFn) -> PyResult<()> {
    sizing::check_divsym(f, h).map_err(math_error)
}

/// A volume is refused when its numbers would have more than
/// [`elbowroom_math::limits::VOLUME_DIGIT_LIMIT`] digits
/// ([`elbowroom_math::sizing::check_volume`], as `elbowroom volume` calls it).
pub fn volume(p: &Permutohedron) -> PyResult<()> {
    sizing::check_volume(p, 0, "the volume").map_err(math_error)
}

/// The mixed Eulerian numbers of n: 2 <= n <= 16 and within the work limit
/// ([`elbowroom_math::sizing::check_eulerian`]).
pub fn eulerian(n: usize) -> PyResult<()> {
    if !(2..=MAX_N).contains(&n) {
        return Err(bad(format!(
            "--n {n} is out of range; 2 <= n <= {MAX_N} is accepted"
        )));
    }
    sizing::check_eulerian(n).map_err(math_error)
}
