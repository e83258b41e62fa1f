//! a^h_w and why it is what it is, and the forest expansion of S_w: the
//! records of `elbowroom coefficient --json` and `elbowroom forest W --json`
//! as Python dicts with exact values, from the same functions of the math crate.

use crate::long_run::run_long;
use crate::values::{bad, hessenberg_text, math_error, perm, perm_tuple};
use elbowroom_math::explain::explanation::{Explanation, explain};
use elbowroom_math::explain::formula::{WORD_FORMULA_WORK_LIMIT, size_word_formula};
use elbowroom_math::explain::qvalue::{QCoefficient, q_coefficient};
use elbowroom_math::explain::rules::Rule;
use elbowroom_math::forest::schubert::{is_single, schubert_forest_expansion};
use elbowroom_math::forest::trees::{TreeTerm, a_w_by_trees};
use elbowroom_math::hessenberg::divsym::HessenbergFunctional;
use elbowroom_math::hessenberg::function::HessenbergFn;
use elbowroom_math::limits::SCHUBERT_TERM_LIMIT;
use elbowroom_math::pipes::dream::term_bound;
use elbowroom_math::schubert::polynomial::schubert;
use elbowroom_math::{MathResult, Perm};
use num_rational::BigRational;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList, PyTuple};

/// An exact rational as an `int` when it is whole (a_w always is), else a Fraction.
fn exact<'py>(py: Python<'py>, r: &BigRational) -> PyResult<Bound<'py, PyAny>> {
    if r.is_integer() {
        Ok(r.to_integer().into_pyobject(py)?.into_any())
    } else {
        r.into_pyobject(py)
    }
}

fn join(v: &[usize]) -> String {
    v.iter()
        .map(|x| x.to_string())
        .collect::<Vec<_>>()
        .join(",")
}

/// `{"perm": w, "value": a}`.
fn perm_value<'py>(py: Python<'py>, w: &Perm, v: &BigRational) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("perm", perm_tuple(py, w)?)?;
    d.set_item("value", exact(py, v)?)?;
    Ok(d)
}

/// A rule as `{"name", "value", …}` with the fields of its kind.
fn rule_dict<'py>(py: Python<'py>, rule: &Rule) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("name", rule.name())?;
    d.set_item("value", rule.value())?;
    match rule {
        Rule::Parking { pipe_dreams } => d.set_item("pipe_dreams", pipe_dreams)?,
        Rule::Grassmannian {
            descent,
            shape,
            count,
            tableaux,
        } => {
            d.set_item("descent", descent)?;
            d.set_item("shape", PyTuple::new(py, shape)?)?;
            d.set_item("tableaux_count", count)?;
            let list = PyList::empty(py);
            for t in tableaux {
                let rows = PyList::empty(py);
                for row in t {
                    rows.append(PyTuple::new(py, row)?)?;
                }
                list.append(rows)?;
            }
            d.set_item("tableaux", list)?;
        }
        Rule::Coxeter { reduced_words } => d.set_item("reduced_words", reduced_words)?,
    }
    Ok(d)
}

/// `[{"code", "coefficient", "labelings"}, …]`: a_w by trees.
fn trees_list<'py>(py: Python<'py>, trees: &[TreeTerm]) -> PyResult<Bound<'py, PyList>> {
    let list = PyList::empty(py);
    for t in trees {
        let d = PyDict::new(py);
        d.set_item("code", PyTuple::new(py, &t.code)?)?;
        d.set_item("coefficient", &t.coefficient)?;
        d.set_item("labelings", &t.labelings)?;
        list.append(d)?;
    }
    Ok(list)
}

/// The record of the default h, key for key as `elbowroom coefficient --json`.
fn default_record<'py>(
    py: Python<'py>,
    w: &Perm,
    h: &HessenbergFn,
    e: &Explanation,
    q: Option<&QCoefficient>,
    trees: &[TreeTerm],
) -> PyResult<Bound<'py, PyDict>> {
    let f = &e.formula;
    let d = PyDict::new(py);
    d.set_item("perm", perm_tuple(py, w)?)?;
    d.set_item("n", w.n())?;
    d.set_item("h", PyTuple::new(py, h.values())?)?;
    d.set_item("value", exact(py, &f.value)?)?;
    let contents = PyList::empty(py);
    for s in &f.shares {
        let row = PyDict::new(py);
        row.set_item("content", PyTuple::new(py, &s.content)?)?;
        row.set_item("words", &s.words)?;
        row.set_item("eulerian", &s.eulerian)?;
        contents.append(row)?;
    }
    d.set_item("by_content", contents)?;
    d.set_item("inverse", perm_value(py, &e.inverse.0, &e.inverse.1)?)?;
    d.set_item("conjugate", perm_value(py, &e.conjugate.0, &e.conjugate.1)?)?;
    let rules = PyList::empty(py);
    for r in &e.rules {
        rules.append(rule_dict(py, r)?)?;
    }
    d.set_item("rules", rules)?;
    let cyclic = PyDict::new(py);
    let orbit = PyList::empty(py);
    for (_, u, v) in &e.orbit {
        orbit.append(perm_value(py, u, v)?)?;
    }
    cyclic.set_item("orbit", orbit)?;
    cyclic.set_item("sum", exact(py, &e.orbit_sum)?)?;
    cyclic.set_item("reduced_words", &f.reduced_words)?;
    d.set_item("cyclic", cyclic)?;
    d.set_item("by_trees", trees_list(py, trees)?)?;
    if let Some(v) = q.and_then(|q| q.value.as_ref()) {
        let coeffs = PyList::empty(py);
        for c in v.coeffs() {
            coeffs.append(c)?;
        }
        d.set_item("q_value", coeffs)?;
    }
    Ok(d)
}

/// coefficient(w, h=None, q=False, *, progress=None) -> dict
///
/// a^h_w = DS_h(S_w), the coefficient of the Schubert class of w0·w in the
/// class of the Hessenberg variety of h, as `elbowroom coefficient W --json`
/// gives it, with the same keys in the same order and exact values: w is a
/// permutation of n (a tuple, list or string such as "1432") of length
/// |h| = Σ (h(i) − i); h (a tuple, list or string "3,3,4,4") defaults to
/// h(i) = i + 1, the class of the permutahedral variety, where a_w = DS_n(S_w)
/// (Postnikov's divided symmetrization) and ℓ(w) = n − 1.
///
/// For the default h the dict is {"perm": tuple, "n": int, "h": tuple,
/// "value": int, "by_content": [{"content": tuple (c_1..c_{n−1}), "words":
/// N_w(c), "eulerian": A_c}], "inverse": {"perm", "value"} (w^{-1}),
/// "conjugate": {"perm", "value"} (w0 w w0), "rules": [{"name", "value", …}]
/// (parking: "pipe_dreams"; grassmannian: "descent", "shape" (tuple),
/// "tableaux_count", "tableaux" (lists of row tuples); coxeter:
/// "reduced_words"), "cyclic": {"orbit": [{"perm", "value"}], "sum",
/// "reduced_words"}, "by_trees": [{"code": tuple, "coefficient",
/// "labelings"}] (a_w = Σ_T c_{w,T}·(n−1)!/Π_v h_v over the binary trees T on
/// the leaves 1..n)}, and with q=True also "q_value": the coefficients of the
/// q-analogue a_w(q), lowest power of q first (absent when a_w(q) is not a
/// polynomial). a_w = (1/(n−1)!) Σ_c N_w(c)·A_c over the contents c of the
/// reduced words of w (one-line notation, s_i swaps i and i+1). For another
/// h the dict is {"perm", "n", "h", "value"} only, and q=True is refused.
/// All numbers are ints.
#[pyfunction]
#[pyo3(signature = (w, h = None, q = false, *, progress = None))]
pub fn coefficient<'py>(
    py: Python<'py>,
    w: &Bound<'py, PyAny>,
    h: Option<&Bound<'py, PyAny>>,
    q: bool,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let w = perm(w)?;
    let n = w.n();
    let h = match h {
        Some(h) if !h.is_none() => {
            HessenbergFn::parse(&hessenberg_text(h)?, None).map_err(math_error)?
        }
        _ => HessenbergFn::default_for(n).map_err(math_error)?,
    };
    if h.n() != n {
        return Err(bad(format!(
            "{w} is a permutation of {n}; h = {} has {} values: they must have the same n",
            join(h.values()),
            h.n()
        )));
    }
    let needed = h.dimension();
    if w.length() != needed {
        return Err(bad(format!(
            "{w} has length {}; a^h_w for h = {} needs a permutation of length |h| = {needed}",
            w.length(),
            join(h.values())
        )));
    }
    if !h.is_default() {
        if q {
            return Err(bad(
                "--q is given for the default h (the permutahedral class) only",
            ));
        }
        let bound = term_bound(&w);
        if bound > SCHUBERT_TERM_LIMIT {
            return Err(bad(format!(
                "S_{w} may have up to {bound} terms; at most {SCHUBERT_TERM_LIMIT} are accepted"
            )));
        }
        let value = run_long(py, progress, |p| -> MathResult<_> {
            p.check()?;
            let functional = HessenbergFunctional::new(&h)?;
            Ok(functional.apply(&schubert(&w)))
        })?;
        let d = PyDict::new(py);
        d.set_item("perm", perm_tuple(py, &w)?)?;
        d.set_item("n", n)?;
        d.set_item("h", PyTuple::new(py, h.values())?)?;
        d.set_item("value", value)?;
        return Ok(d);
    }
    let (e, qv, trees) = run_long(py, progress, |p| {
        if q {
            // a_w(q) is sized before anything is computed
            let steps = (n as u128).pow(6);
            size_word_formula(&w, steps, WORD_FORMULA_WORK_LIMIT, p)?;
        }
        let e = explain(&w, p)?;
        let qv = if q { Some(q_coefficient(&w, p)?) } else { None };
        let trees = a_w_by_trees(&w, p)?;
        Ok((e, qv, trees))
    })?;
    default_record(py, &w, &h, &e, qv.as_ref(), &trees)
}

/// forest(w, *, progress=None) -> dict
///
/// The forest expansion S_w = Σ_F c_F P_F of the Schubert polynomial of w
/// into forest polynomials (Nadeau–Tewari), as `elbowroom forest W --json`
/// gives it: {"perm": tuple, "terms": [{"code": tuple, "coefficient": int}],
/// "single": bool}, in the command's order; a forest is given by its code
/// (c_1, c_2, ...) without trailing zeros, and "single" says whether S_w is
/// one forest polynomial with coefficient 1. w is a tuple, list or string in
/// one-line notation.
#[pyfunction]
#[pyo3(signature = (w, *, progress = None))]
pub fn forest<'py>(
    py: Python<'py>,
    w: &Bound<'py, PyAny>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let w = perm(w)?;
    let terms = run_long(py, progress, |p| schubert_forest_expansion(&w, p))?;
    let d = PyDict::new(py);
    d.set_item("perm", perm_tuple(py, &w)?)?;
    let list = PyList::empty(py);
    for (code, c) in &terms {
        let t = PyDict::new(py);
        t.set_item("code", PyTuple::new(py, code)?)?;
        t.set_item("coefficient", c)?;
        list.append(t)?;
    }
    d.set_item("terms", list)?;
    d.set_item("single", is_single(&terms))?;
    Ok(d)
}
