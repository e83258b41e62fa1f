//! Schubert polynomials, reduced words and pipe dreams of one permutation.

use crate::long_run::run_long;
use crate::sizes;
use crate::values::{bad, perm, poly_dict};
use elbowroom_math::perms::words::{
    ReducedWords, count_reduced_words_with, reduced_words as words_of,
};
use elbowroom_math::pipes::dream::{PipeDreams, pipe_dreams as dreams_of};
use elbowroom_math::schubert::polynomial::schubert as schubert_of;
use num_bigint::BigUint;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyInt, PyTuple};
use std::iter::Take;

/// schubert(w, *, progress=None) -> dict
///
/// The Schubert polynomial S_w as a dict from exponent tuples (e_1, ..., e_n),
/// n the size of w, to int coefficients, leading term first (lex order,
/// x1 > x2 > ...). S_{w0} = x1^{n-1} x2^{n-2} ... x_{n-1}, and
/// S_{w s_i} = ∂_i S_w when ℓ(w s_i) < ℓ(w) (w·s_i swaps the entries in
/// positions i and i+1). w is in one-line notation: a tuple or list such as
/// (1, 4, 3, 2), or a string "1432" or "3,1,5,2,4". Refused (ValueError) when
/// S_w may have more terms than the limit of `elbowroom schubert`.
#[pyfunction]
#[pyo3(signature = (w, *, progress = None))]
pub fn schubert<'py>(
    py: Python<'py>,
    w: &Bound<'py, PyAny>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let w = perm(w)?;
    sizes::schubert(&w)?;
    let s = run_long(py, progress, |_| Ok(schubert_of(&w)))?;
    poly_dict(py, &s)
}

/// count_reduced_words(w, *, progress=None) -> int
///
/// The number of reduced words of w (words a_1 ... a_l with
/// w = s_{a_1} ... s_{a_l}, l = ℓ(w)), exactly, as an int of any size.
#[pyfunction]
#[pyo3(signature = (w, *, progress = None))]
pub fn count_reduced_words(
    py: Python<'_>,
    w: &Bound<'_, PyAny>,
    progress: Option<&Bound<'_, PyAny>>,
) -> PyResult<BigUint> {
    let w = perm(w)?;
    run_long(py, progress, |p| count_reduced_words_with(&w, p))
}

/// A `limit` argument: None (no limit, `usize::MAX`) or a non-negative int.
fn limit_arg(limit: Option<&Bound<'_, PyAny>>) -> PyResult<usize> {
    let Some(l) = limit else {
        return Ok(usize::MAX);
    };
    if l.is_none() {
        return Ok(usize::MAX);
    }
    if !l.is_instance_of::<PyInt>() {
        return Err(bad("limit is None or a non-negative int"));
    }
    match l.extract::<i128>() {
        Ok(v) if v < 0 => Err(bad(format!(
            "limit = {v} is negative; give None or a non-negative int"
        ))),
        Ok(v) => Ok(usize::try_from(v).unwrap_or(usize::MAX)),
        Err(_) => Ok(usize::MAX),
    }
}

/// reduced_words(w, limit=None) -> iterator of tuples
///
/// The reduced words of w in lexicographic order, lazily, each a tuple
/// (a_1, ..., a_l) with w = s_{a_1} s_{a_2} ... s_{a_l}, l = ℓ(w) (the identity
/// has one word, the empty tuple); at most `limit` of them when it is given.
#[pyfunction]
#[pyo3(signature = (w, limit = None))]
pub fn reduced_words(
    w: &Bound<'_, PyAny>,
    limit: Option<&Bound<'_, PyAny>>,
) -> PyResult<ReducedWordIterator> {
    let w = perm(w)?;
    Ok(ReducedWordIterator {
        words: words_of(&w).take(limit_arg(limit)?),
    })
}

/// The reduced words of a permutation, one tuple at a time.
#[pyclass(module = "elbowroom")]
pub struct ReducedWordIterator {
    words: Take<ReducedWords>,
}

#[pymethods]
impl ReducedWordIterator {
    fn __iter__(slf: PyRef<'_, Self>) -> PyRef<'_, Self> {
        slf
    }

    fn __next__<'py>(
        mut slf: PyRefMut<'py, Self>,
        py: Python<'py>,
    ) -> PyResult<Option<Bound<'py, PyTuple>>> {
        slf.words
            .next()
            .map(|word| PyTuple::new(py, word))
            .transpose()
    }
}

/// pipe_dreams(w, limit=None) -> iterator of tuples
///
/// The reduced pipe dreams of w, lazily: the bottom dream first (crosses in
/// columns 1..c_i of row i, c the Lehmer code), then a depth-first walk of
/// the ladder moves. Each dream is a tuple of its crosses (i, j) (row i,
/// column j, i + j <= n) in the order of `elbowroom dreams --json`; a cross in
/// (i, j) stands for s_{i+j-1}, and the product of x_i over the crosses gives
/// the dream's monomial of S_w. At most `limit` of them when it is given.
#[pyfunction]
#[pyo3(signature = (w, limit = None))]
pub fn pipe_dreams(
    w: &Bound<'_, PyAny>,
    limit: Option<&Bound<'_, PyAny>>,
) -> PyResult<PipeDreamIterator> {
    let w = perm(w)?;
    Ok(PipeDreamIterator {
        dreams: dreams_of(&w).take(limit_arg(limit)?),
    })
}

/// The reduced pipe dreams of a permutation, one tuple of crosses at a time.
#[pyclass(module = "elbowroom")]
pub struct PipeDreamIterator {
    dreams: Take<PipeDreams>,
}

#[pymethods]
impl PipeDreamIterator {
    fn __iter__(slf: PyRef<'_, Self>) -> PyRef<'_, Self> {
        slf
    }

    fn __next__<'py>(
        mut slf: PyRefMut<'py, Self>,
        py: Python<'py>,
    ) -> PyResult<Option<Bound<'py, PyTuple>>> {
        let Some(dream) = slf.dreams.next() else {
            return Ok(None);
        };
        let crosses: Vec<Bound<'py, PyTuple>> = dream
            .crosses()
            .into_iter()
            .map(|(i, j)| PyTuple::new(py, [i, j]))
            .collect::<PyResult<_>>()?;
        Ok(Some(PyTuple::new(py, crosses)?))
    }
}
