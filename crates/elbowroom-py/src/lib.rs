//! The Python module `elbowroom`: the exact mathematics of `elbowroom-math`
//! for notebooks and scripts, calling the same functions as the commands.
//!
//! This crate is the native part, `elbowroom._elbowroom`; the package
//! `python/elbowroom/__init__.py` re-exports it and adds the sympy
//! conversions. Build and install with `pip install .` from the repository
//! root (maturin, reading the root `pyproject.toml`, turns on the
//! `extension-module` feature). Within the workspace the crate builds and
//! lints as an ordinary library and has no Rust test targets; its tests are
//! `tests/test_*.py` (pytest), run against the installed module.
//!
//! Values cross as exact Python objects ([`values`]); every long computation
//! runs without the interpreter lock and stops on KeyboardInterrupt
//! ([`long_run`]); the commands' size checks refuse oversized work first
//! ([`sizes`]). A new function is one `#[pyfunction]` in the module of its
//! subject, added to the list in [`_elbowroom`] and to `__all__` in
//! `__init__.py`.

pub mod calculus;
pub mod coefficient;
pub mod hessenberg;
pub mod long_run;
pub mod permutohedra;
pub mod quotient;
pub mod sizes;
pub mod values;
pub mod words;

use pyo3::prelude::*;
use pyo3::types::PyDict;

/// polynomial(text, n=None) -> dict[exponents, Fraction]
///
/// Reads a polynomial typed as the commands take it ("x1^2 x2 - 3/2 x3",
/// "(x1 + x2)^3", implicit multiplication, exact numbers) into a dict from
/// exponent tuples to Fractions, leading term first (lex, x1 > x2 > ...). With
/// n the variables are x1..xn and the tuples have n entries; without, n is the
/// largest index used.
#[pyfunction]
#[pyo3(signature = (text, n = None))]
fn polynomial<'py>(
    py: Python<'py>,
    text: &str,
    n: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let n = match n {
        Some(n) if !n.is_none() => Some(calculus::size_arg(n, "n")?),
        _ => None,
    };
    let f = elbowroom_math::poly::parse::parse_poly(text, n).map_err(values::math_error)?;
    values::poly_dict(py, &f)
}

/// Exact Schubert calculus from Python: Schubert polynomials, reduced words
/// and pipe dreams, products and expansions, divided symmetrization and
/// Hessenberg tables, the quasisymmetric quotient and permutohedra.
///
/// Conventions: permutations in one-line notation w = w(1)...w(n), 1-based,
/// given as tuples, lists or strings ("1432", "3,1,5,2,4") and returned as
/// tuples; s_i swaps i and i+1, and w·s_i swaps the entries in positions i
/// and i+1; polynomials are dicts from exponent tuples to exact coefficients
/// (int or fractions.Fraction) or the text the commands take; exponent tuples
/// are ordered lex with x1 > x2 > ... (also the order of the quotient by J_n).
/// Bad input raises ValueError with the command line's message; long work
/// releases the GIL, takes progress=callable(done, total), and stops on
/// KeyboardInterrupt.
#[pymodule]
fn _elbowroom(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(words::schubert, m)?)?;
    m.add_function(wrap_pyfunction!(words::reduced_words, m)?)?;
    m.add_function(wrap_pyfunction!(words::pipe_dreams, m)?)?;
    m.add_function(wrap_pyfunction!(words::count_reduced_words, m)?)?;
    m.add_function(wrap_pyfunction!(calculus::product, m)?)?;
    m.add_function(wrap_pyfunction!(calculus::expand, m)?)?;
    m.add_function(wrap_pyfunction!(hessenberg::divsym, m)?)?;
    m.add_function(wrap_pyfunction!(hessenberg::hessenberg, m)?)?;
    m.add_function(wrap_pyfunction!(quotient::reduce, m)?)?;
    m.add_function(wrap_pyfunction!(quotient::quotient_basis, m)?)?;
    m.add_function(wrap_pyfunction!(permutohedra::volume, m)?)?;
    m.add_function(wrap_pyfunction!(permutohedra::mixed_eulerian, m)?)?;
    m.add_function(wrap_pyfunction!(coefficient::coefficient, m)?)?;
    m.add_function(wrap_pyfunction!(coefficient::forest, m)?)?;
    m.add_function(wrap_pyfunction!(polynomial, m)?)?;
    m.add_class::<words::ReducedWordIterator>()?;
    m.add_class::<words::PipeDreamIterator>()?;
    m.add("__version__", env!("CARGO_PKG_VERSION"))?;
    Ok(())
}
