//! Divided symmetrization and the Hessenberg class tables, with the tables
//! kept in the process for the next call with the same h.

use crate::calculus::size_arg;
use crate::long_run::run_long;
use crate::sizes;
use crate::values::{bad, hessenberg_text, math_error, poly_dict, polynomial};
use elbowroom_math::MathError;
use elbowroom_math::hessenberg::divsym::divided_symmetrize_with;
use elbowroom_math::hessenberg::function::HessenbergFn;
use elbowroom_math::hessenberg::rows::{for_each_class_row, size_class_table};
use elbowroom_math::limits::COLLECTED_ROWS_LIMIT;
use num_bigint::BigInt;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyTuple};
use std::collections::HashMap;
use std::sync::{Arc, Mutex};

/// The Hessenberg function of the arguments `n` and `h`.
fn hessenberg_args(
    n: &Bound<'_, PyAny>,
    h: Option<&Bound<'_, PyAny>>,
    max_n: usize,
) -> PyResult<HessenbergFn> {
    let n = size_arg(n, "n")?;
    let text = match h {
        Some(h) if !h.is_none() => Some(hessenberg_text(h)?),
        _ => None,
    };
    sizes::hessenberg_fn(n, text.as_deref(), max_n)
}

/// divsym(poly, n, h=None, *, progress=None) -> dict[exponents, Fraction]
///
/// The divided symmetrization DS_h(f) = Σ_{σ in S_n} σ(f / Π_{i < j <= h(i)} (x_i − x_j))
/// of a polynomial f in x1..xn, as a dict from exponent tuples (length n) to
/// Fractions; h(1), ..., h(n) is weakly increasing with i <= h(i) <= n, and the
/// default h(i) = i + 1 gives Postnikov's DS_n. When deg f = |h| = Σ (h(i) − i)
/// the answer is the constant {(0, ..., 0): c}; above it is a symmetric
/// polynomial; below it is 0 (the empty dict). poly is text or a dict.
#[pyfunction]
#[pyo3(signature = (poly, n, h = None, *, progress = None))]
pub fn divsym<'py>(
    py: Python<'py>,
    poly: &Bound<'py, PyAny>,
    n: &Bound<'py, PyAny>,
    h: Option<&Bound<'py, PyAny>>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let h = hessenberg_args(n, h, elbowroom_math::MAX_N)?;
    let f = polynomial(poly, h.n())?;
    sizes::divsym(&f, &h)?;
    let ds = run_long(py, progress, |p| divided_symmetrize_with(&f, &h, p))?;
    poly_dict(py, &ds.value)
}

/// The rows of one table: the one-line values of every w (n bytes each, in
/// lexicographic order) and a^h_w (in an i64 where it fits).
struct Table {
    n: usize,
    lines: Vec<u8>,
    small: Vec<i64>,
    big: HashMap<usize, BigInt>,
}

/// The most rows kept in the process over all cached tables (about 30 bytes each).
const CACHED_ROWS: usize = 4_000_000;

/// The tables computed so far, oldest first.
static TABLES: Mutex<Vec<(HessenbergFn, Arc<Table>)>> = Mutex::new(Vec::new());

fn cached(h: &HessenbergFn) -> Option<Arc<Table>> {
    let tables = TABLES.lock().ok()?;
    tables.iter().find(|(k, _)| k == h).map(|(_, t)| t.clone())
}

fn keep(h: &HessenbergFn, table: &Arc<Table>) {
    let rows = table.small.len();
    if rows > CACHED_ROWS {
        return;
    }
    let Ok(mut tables) = TABLES.lock() else {
        return;
    };
    let mut held: usize = tables.iter().map(|(_, t)| t.small.len()).sum();
    while held + rows > CACHED_ROWS && !tables.is_empty() {
        held -= tables.remove(0).1.small.len();
    }
    tables.push((h.clone(), table.clone()));
}

/// hessenberg(n, h=None, *, progress=None) -> dict[perm, int]
///
/// The Hessenberg class table: a^h_w = DS_h(S_w) for every w in S_n of length
/// |h| = Σ (h(i) − i), zeros included, as a dict from w (a tuple) to an int,
/// in lexicographic order of one-line notation (as `elbowroom hessenberg
/// --json` lists them). a^h_w is the coefficient of the Schubert class of
/// w0·w in the class of the Hessenberg variety of h (Anderson–Tymoczko), with
/// (w0 w)(i) = n + 1 − w(i). h defaults to h(i) = i + 1; give it as (2, 3, 3)
/// or "2,3,3". Tables are kept in the process, so a second call with the same
/// h is a lookup. Refused when the table has more rows than the math crate's
/// limits accept, or more than `elbowroom_math::limits::COLLECTED_ROWS_LIMIT`
/// (a dict that large would take gigabytes; the command streams instead).
#[pyfunction]
#[pyo3(signature = (n, h = None, *, progress = None))]
pub fn hessenberg<'py>(
    py: Python<'py>,
    n: &Bound<'py, PyAny>,
    h: Option<&Bound<'py, PyAny>>,
    progress: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyDict>> {
    let h = hessenberg_args(n, h, elbowroom_math::limits::HESSENBERG_MAX_N)?;
    let listed = size_class_table(&h).map_err(math_error)?;
    if listed > COLLECTED_ROWS_LIMIT {
        return Err(bad(format!(
            "the table of h = {h} lists {listed} permutations; at most {COLLECTED_ROWS_LIMIT} are collected into a dict (`elbowroom hessenberg` streams larger tables)"
        )));
    }
    let table = match cached(&h) {
        Some(t) => t,
        None => {
            let t = Arc::new(run_long(py, progress, |p| collect(&h, listed, p))?);
            keep(&h, &t);
            t
        }
    };
    let out = PyDict::new(py);
    for (k, (line, v)) in table
        .lines
        .chunks(table.n.max(1))
        .zip(&table.small)
        .enumerate()
    {
        if k % (1 << 16) == 0 {
            py.check_signals()?;
        }
        let w = PyTuple::new(py, line)?;
        match table.big.get(&k) {
            Some(big) => out.set_item(w, big)?,
            None => out.set_item(w, v)?,
        }
    }
    Ok(out)
}

/// Every row of the table of h, collected.
fn collect(
    h: &HessenbergFn,
    listed: u128,
    progress: &elbowroom_math::Progress,
) -> Result<Table, MathError> {
    let n = h.n();
    let rows = usize::try_from(listed).unwrap_or(0);
    let mut table = Table {
        n,
        lines: Vec::with_capacity(rows * n),
        small: Vec::with_capacity(rows),
        big: HashMap::new(),
    };
    for_each_class_row(h, &|_| true, progress, &mut |row| {
        table.lines.extend_from_slice(row.line);
        match i64::try_from(&row.value) {
            Ok(v) => table.small.push(v),
            Err(_) => {
                table.big.insert(table.small.len(), row.value);
                table.small.push(0);
            }
        }
        Ok::<(), MathError>(())
    })?;
    Ok(table)
}
