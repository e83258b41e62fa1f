//! Python values in and out: permutations, Hessenberg functions, λ and
//! polynomials as Python objects, read through the same parsers as the
//! command line (so a bad input gets the command line's one-line message),
//! and exact results as `int`, `fractions.Fraction` and tuples.
//!
//! A list or tuple is first written as the text the command line takes
//! (`[3, 1, 2]` as `3,1,2`), then read by the same function. Floats are
//! refused wherever an exact number is expected.

use elbowroom_math::poly::parse::parse_poly;
use elbowroom_math::poly::rational::parse_rational;
use elbowroom_math::{Coeff, MathError, Perm, Poly, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use pyo3::exceptions::{PyKeyboardInterrupt, PyValueError};
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyFloat, PyInt, PyList, PyString, PyTuple};

/// A math error as a Python exception: `ValueError` with the one-line message
/// (a cancel, which only an interrupt causes, as `KeyboardInterrupt`).
pub fn math_error(e: MathError) -> PyErr {
    match e {
        MathError::Canceled => PyKeyboardInterrupt::new_err("canceled"),
        other => PyValueError::new_err(other.to_string()),
    }
}

/// A `ValueError` with this message.
pub fn bad(message: impl Into<String>) -> PyErr {
    PyValueError::new_err(message.into())
}

/// A string as it is, or the items of a tuple or list.
enum TextOrItems<'py> {
    Text(String),
    Items(Vec<Bound<'py, PyAny>>),
}

/// `obj` as a string or as the items of a tuple or list; anything else is
/// refused with `accepted()` followed by ", not as TYPE".
fn text_or_items<'py>(
    obj: &Bound<'py, PyAny>,
    accepted: impl FnOnce() -> String,
) -> PyResult<TextOrItems<'py>> {
    if let Ok(s) = obj.cast::<PyString>() {
        return Ok(TextOrItems::Text(s.to_cow()?.to_string()));
    }
    if let Ok(t) = obj.cast::<PyTuple>() {
        return Ok(TextOrItems::Items(t.iter().collect()));
    }
    if let Ok(l) = obj.cast::<PyList>() {
        return Ok(TextOrItems::Items(l.iter().collect()));
    }
    Err(bad(format!("{}, not as {}", accepted(), type_name(obj))))
}

/// The entries of a list or tuple of integers as `a,b,c`; a string as it is.
/// `what` names the input in messages ("a permutation", "h", "λ").
fn int_list_text(obj: &Bound<'_, PyAny>, what: &str, example: &str) -> PyResult<String> {
    let items = match text_or_items(obj, || {
        format!("{what} is given as a tuple or list of integers or as a string such as {example}")
    })? {
        TextOrItems::Text(text) => return Ok(text),
        TextOrItems::Items(items) => items,
    };
    let mut parts = Vec::with_capacity(items.len());
    for item in &items {
        if !item.is_instance_of::<PyInt>() {
            return Err(bad(format!(
                "the entries of {what} are integers; {} is {}",
                repr(item),
                type_name(item)
            )));
        }
        parts.push(item.str()?.to_cow()?.to_string());
    }
    Ok(parts.join(","))
}

/// A permutation from `(3, 1, 2)`, `[3, 1, 2]`, `"312"`, `"3,1,2"` or `"3 1 2"`
/// (or the int 312, read as its digits, as the command line reads `312`).
pub fn perm(obj: &Bound<'_, PyAny>) -> PyResult<Perm> {
    if obj.is_instance_of::<PyInt>() {
        return Perm::parse(&obj.str()?.to_cow()?).map_err(math_error);
    }
    let text = int_list_text(obj, "a permutation", "\"1432\" or \"3,1,5,2,4\"")?;
    Perm::parse(&text).map_err(math_error)
}

/// A Hessenberg function's text from `(2, 3, 3)`, `[2, 3, 3]` or `"2,3,3"`.
pub fn hessenberg_text(obj: &Bound<'_, PyAny>) -> PyResult<String> {
    int_list_text(obj, "h", "\"2,3,4,4\"")
}

/// λ's text from a list or tuple of `int`, `Fraction` or strings such as
/// `"1/2"`, or from a string such as `"3,1/2,0"`.
pub fn lambda_text(obj: &Bound<'_, PyAny>) -> PyResult<String> {
    let items = match text_or_items(obj, || {
        "λ is given as a tuple or list of exact numbers or as a string such as \"3,1/2,0\"".into()
    })? {
        TextOrItems::Text(text) => return Ok(text),
        TextOrItems::Items(items) => items,
    };
    let mut parts = Vec::with_capacity(items.len());
    for item in &items {
        parts.push(rational(item)?.to_string());
    }
    Ok(parts.join(","))
}

/// An exact number from an `int`, a `fractions.Fraction` or a string such as
/// `"-3/2"` or `"0.25"` (read as the command line reads it); floats are refused.
pub fn rational(obj: &Bound<'_, PyAny>) -> PyResult<BigRational> {
    if obj.is_instance_of::<PyFloat>() {
        return Err(bad(format!(
            "{} is a float; values are exact: give an int, a fractions.Fraction or a string such as \"1/3\"",
            repr(obj)
        )));
    }
    if obj.is_instance_of::<PyInt>() {
        return Ok(BigRational::from_integer(obj.extract::<BigInt>()?));
    }
    if let Ok(s) = obj.cast::<PyString>() {
        return parse_rational(&s.to_cow()?).map_err(math_error);
    }
    obj.extract::<BigRational>().map_err(|_| {
        bad(format!(
            "{} ({}) is not an exact number; give an int, a fractions.Fraction or a string such as \"1/3\"",
            repr(obj),
            type_name(obj)
        ))
    })
}

/// A polynomial in x_1..x_n: the text the commands take (`"x1^2 x2 - 3/2"`),
/// or a dict from exponent tuples to exact coefficients (`{(2, 1): 1, (0, 0): Fraction(-3, 2)}`;
/// a tuple may be shorter than n).
pub fn polynomial(obj: &Bound<'_, PyAny>, n: usize) -> PyResult<RatPoly> {
    if let Ok(s) = obj.cast::<PyString>() {
        return parse_poly(&s.to_cow()?, Some(n)).map_err(math_error);
    }
    let Ok(d) = obj.cast::<PyDict>() else {
        return Err(bad(format!(
            "a polynomial is given as text such as \"x1^2 x2 - 3/2 x3\" or as a dict from exponent tuples to coefficients, not as {}",
            type_name(obj)
        )));
    };
    let mut terms = Vec::with_capacity(d.len());
    for (key, value) in d.iter() {
        let exps: Vec<u32> = if let Ok(t) = key.cast::<PyTuple>() {
            exponents(&t.iter().collect::<Vec<_>>(), &key)?
        } else if let Ok(l) = key.cast::<PyList>() {
            exponents(&l.iter().collect::<Vec<_>>(), &key)?
        } else {
            return Err(bad(format!(
                "the keys of a polynomial are exponent tuples such as (2, 1, 0); {} is {}",
                repr(&key),
                type_name(&key)
            )));
        };
        terms.push((exps, rational(&value)?));
    }
    Poly::from_exp_terms(n, &terms).map_err(math_error)
}

/// An exponent vector from its entries (non-negative integers).
fn exponents(items: &[Bound<'_, PyAny>], key: &Bound<'_, PyAny>) -> PyResult<Vec<u32>> {
    items
        .iter()
        .map(|e| {
            if e.is_instance_of::<PyInt>()
                && let Ok(v) = e.extract::<u32>()
            {
                return Ok(v);
            }
            Err(bad(format!(
                "exponent vector {}: exponents are non-negative integers",
                repr(key)
            )))
        })
        .collect()
}

/// A coefficient as a Python object: `int` or `fractions.Fraction`.
pub trait ExactValue {
    /// The value as a Python object.
    fn to_object<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>>;
}

impl ExactValue for BigInt {
    fn to_object<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        Ok(self.into_pyobject(py)?.into_any())
    }
}

impl ExactValue for BigRational {
    fn to_object<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        self.into_pyobject(py)
    }
}

/// A polynomial as a dict from exponent tuples (of length `p.nvars()`) to
/// coefficients, leading term first (lex order, x_1 > x_2 > ...).
pub fn poly_dict<'py, C: Coeff + ExactValue>(
    py: Python<'py>,
    p: &Poly<C>,
) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    let n = p.nvars();
    for (m, c) in p.terms() {
        d.set_item(PyTuple::new(py, m.exps(n))?, c.to_object(py)?)?;
    }
    Ok(d)
}

/// A permutation as a tuple of its one-line values.
pub fn perm_tuple<'py>(py: Python<'py>, w: &Perm) -> PyResult<Bound<'py, PyTuple>> {
    PyTuple::new(py, w.one_line())
}

/// "an object of type T", for messages.
fn type_name(obj: &Bound<'_, PyAny>) -> String {
    obj.get_type()
        .name()
        .map(|n| format!("an object of type {n}"))
        .unwrap_or_else(|_| "an object of another type".into())
}

fn repr(obj: &Bound<'_, PyAny>) -> String {
    obj.repr()
        .map(|r| r.to_string())
        .unwrap_or_else(|_| "?".into())
}
