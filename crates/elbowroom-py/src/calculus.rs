//! Schubert calculus: products of Schubert classes and Schubert expansions.

use crate::long_run::run_long;
use crate::values::{bad, perm, perm_tuple, polynomial};
use elbowroom_math::schubert::expansion::{expand_typed, schubert_expansion};
use elbowroom_math::schubert::product::schubert_product;
use elbowroom_math::schubert::vector::Space;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyInt, PyString};

/// A size argument (n): a non-negative int (a larger one than any limit reads as usize::MAX).
pub fn size_arg(obj: &Bound<'_, PyAny>, name: &str) -> PyResult<usize> {
    if !obj.is_instance_of::<PyInt>() {
        return Err(bad(format!("{name} is an int, not {}", obj.repr()?)));
    }
    match obj.extract::<i128>() {
        Ok(v) if v < 0 => Err(bad(format!(
            "--{name} {v} is out of range; {name} is a positive int"
        ))),
        Ok(v) => Ok(usize::try_from(v).unwrap_or(usize::MAX)),
        Err(_) => Ok(usize::MAX),
    }
}

/// product(u, v, n=None, *, progress=None) -> dict[perm, int]
///
/// The structure constants of S_u · S_v = Σ_w c^w_{uv} S_w as a dict from w
/// (a tuple in one-line notation) to c^w_{uv}: stably (each w in the smallest
/// S_m that holds it) or, with n, in H*(Fl_n) (each w with n entries; u and v
/// must lie in S_n). Terms by length, then lexicographically, as
/// `elbowroom product U V [--n N] --json` lists them.
#[pyfunction]
#[pyo3(signature = (u, v, n = None, *, progress = None))]
pub fn product<'py>(
    py: Python<'py>,
    u: &Bound<'py, PyAny>,
    v: &Bound<'py, PyAny>,
    n: Option<&Bound<'py, PyAny>>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let u = perm(u)?;
    let v = perm(v)?;
    let n = match n {
        Some(n) if !n.is_none() => Some(size_arg(n, "n")?),
        _ => None,
    };
    let space = match n {
        None => Space::Stable,
        Some(n) => Space::flag(n).map_err(crate::values::math_error)?,
    };
    let product = run_long(py, progress, |p| schubert_product(&u, &v, space, p))?;
    let out = PyDict::new(py);
    for (w, c) in product.sorted_terms() {
        let w = match n {
            Some(n) => w.embed(n).unwrap_or_else(|_| w.clone()),
            None => w.restrict(w.support_size()).unwrap_or_else(|| w.clone()),
        };
        out.set_item(perm_tuple(py, &w)?, c)?;
    }
    Ok(out)
}

/// expand(poly, n, stable=False, *, progress=None) -> dict[perm, Fraction]
///
/// The Schubert expansion Σ c_w S_w of a polynomial in x1..xn as a dict from
/// w (a tuple) to c_w (a Fraction): its class in H*(Fl_n) = Q[x1..xn]/I_n
/// (every w in S_n, written with n entries), or with stable=True its unique
/// expansion over S_∞ (each w in the smallest S_m that holds it; the identity
/// is (1,)). poly is the text the commands take (a product of powers of
/// linear forms such as "(x1 - x3)(x2 - x3)" goes through Monk's rule and is
/// never multiplied out) or a dict from exponent tuples to coefficients.
#[pyfunction]
#[pyo3(signature = (poly, n, stable = false, *, progress = None))]
pub fn expand<'py>(
    py: Python<'py>,
    poly: &Bound<'py, PyAny>,
    n: &Bound<'py, PyAny>,
    stable: bool,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let n = size_arg(n, "n")?;
    let flag = Space::flag(n).map_err(crate::values::math_error)?;
    let space = if stable { Space::Stable } else { flag };
    let expansion = if let Ok(text) = poly.cast::<PyString>() {
        let text = text.to_cow()?.to_string();
        run_long(py, progress, |p| expand_typed(&text, n, stable, p))?
    } else {
        let f = polynomial(poly, n)?;
        run_long(py, progress, |p| schubert_expansion(&f, space, p))?
    };
    let out = PyDict::new(py);
    for (w, c) in &expansion.terms {
        out.set_item(perm_tuple(py, w)?, c)?;
    }
    Ok(out)
}
