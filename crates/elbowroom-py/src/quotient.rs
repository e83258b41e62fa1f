//! The quasisymmetric quotient Q[x1..xn]/J_n: its standard monomials and
//! normal forms (the Gröbner data of J_n is kept in the process by the math
//! crate, so it is built once per n).

use crate::calculus::size_arg;
use crate::long_run::run_long;
use crate::sizes;
use crate::values::{poly_dict, polynomial};
use elbowroom_math::quotient::normal_form::normal_form_by;
use elbowroom_math::quotient::reduction::reducer_with;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList, PyTuple};

/// reduce(poly, n, *, progress=None) -> dict[exponents, Fraction]
///
/// The normal form of a polynomial f in x1..xn modulo J_n, the ideal generated
/// by the quasisymmetric polynomials of positive degree, as a dict from
/// exponent tuples (length n) to Fractions. The order is lex with
/// x1 > x2 > ... > xn, whose standard monomials are the x^e with
/// e_1 + ... + e_i <= i − 1 for every i (Catalan(n) of them), so every key is
/// one of `quotient_basis(n)`. 1 <= n <= 12; the Gröbner basis of J_n is
/// built on the first call for that n (through forests: under a second at
/// n = 10, about half a minute at n = 12) and kept.
#[pyfunction]
#[pyo3(signature = (poly, n, *, progress = None))]
pub fn reduce<'py>(
    py: Python<'py>,
    poly: &Bound<'py, PyAny>,
    n: &Bound<'py, PyAny>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let n = size_arg(n, "n")?;
    sizes::normal_form_n(n)?;
    let f = polynomial(poly, n)?;
    let nf = run_long(py, progress, |p| {
        let q = reducer_with(n, p)?;
        normal_form_by(q.as_ref(), &f)
    })?;
    poly_dict(py, &nf.poly)
}

/// quotient_basis(n, *, progress=None) -> list[exponents]
///
/// The standard monomials of Q[x1..xn]/J_n under lex order x1 > ... > xn, as
/// exponent tuples: the e with e_1 + ... + e_i <= i − 1 for every i, Catalan(n)
/// of them, by degree, as `elbowroom quotient --n N --json` lists them.
#[pyfunction]
#[pyo3(signature = (n, *, progress = None))]
pub fn quotient_basis<'py>(
    py: Python<'py>,
    n: &Bound<'py, PyAny>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyList>> {
    let n = size_arg(n, "n")?;
    sizes::quotient_n(n)?;
    let q = run_long(py, progress, |p| reducer_with(n, p))?;
    let items: Vec<Bound<'py, PyTuple>> = q
        .basis()
        .iter()
        .map(|m| PyTuple::new(py, m.exps(n)))
        .collect::<PyResult<_>>()?;
    PyList::new(py, items)
}
