//! Permutohedra: exact volumes and the mixed Eulerian numbers.

use crate::calculus::size_arg;
use crate::long_run::run_long;
use crate::sizes;
use crate::values::{lambda_text, math_error};
use elbowroom_math::permutohedra::mixed_eulerian::mixed_eulerian_numbers;
use elbowroom_math::permutohedra::permutohedron::Permutohedron;
use num_rational::BigRational;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyTuple};

/// volume(lam, *, progress=None) -> Fraction
///
/// The exact volume of the permutohedron P_λ = conv(S_n·λ), that of its
/// projection to the first n − 1 coordinates, as a Fraction; it equals
/// DS_n((λ_1 x_1 + ... + λ_n x_n)^{n-1}) / (n−1)!. lam is a tuple or list of
/// ints, Fractions or strings such as "1/2", or a string such as "3,1/2,0";
/// any order (it is sorted decreasingly).
#[pyfunction]
#[pyo3(signature = (lam, *, progress = None))]
pub fn volume(
    py: Python<'_>,
    lam: &Bound<'_, PyAny>,
    progress: Option<&Bound<'_, PyAny>>,
) -> PyResult<BigRational> {
    let lambda = sizes::lambda(&lambda_text(lam)?)?;
    let p = Permutohedron::new(&lambda).map_err(math_error)?;
    sizes::volume(&p)?;
    run_long(py, progress, |_| Ok(p.volume()))
}

/// mixed_eulerian(n, *, progress=None) -> dict[composition, int]
///
/// The mixed Eulerian numbers A_c of n as a dict from c, a weak composition of
/// n − 1 into n − 1 parts (a tuple), to an int, in decreasing lexicographic
/// order of c: Vol P_λ = Σ_c A_c u^c / c! with u_i = λ_i − λ_{i+1}
/// (Postnikov). 2 <= n <= 10.
#[pyfunction]
#[pyo3(signature = (n, *, progress = None))]
pub fn mixed_eulerian<'py>(
    py: Python<'py>,
    n: &Bound<'py, PyAny>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let n = size_arg(n, "n")?;
    sizes::eulerian(n)?;
    let numbers = run_long(py, progress, |p| mixed_eulerian_numbers(n, p))?;
    let out = PyDict::new(py);
    for (c, v) in &numbers {
        out.set_item(PyTuple::new(py, c)?, v)?;
    }
    Ok(out)
}
