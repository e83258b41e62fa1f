//! The forest computations the explorer asks for, each one call into
//! `math::forest` (the same functions as the `forest` and `reduce --forest`
//! commands): P_F, the forest expansion of S_w, and the class of what the
//! quotient view reduces in the forest basis.

use super::requests::QuotientInput;
use crate::math::forest::indexed::Forest;
use crate::math::forest::polynomial::forest_polynomial;
use crate::math::forest::quotient::forest_normal_form;
use crate::math::forest::schubert::schubert_forest_expansion;
use crate::math::poly::parse::parse_poly_with;
use crate::math::quotient::reduction::MAX_NORMAL_FORM_N;
use crate::math::schubert::polynomial::SchubertTable;
use crate::math::{IntPoly, MathError, MathResult, Perm, Progress};
use num_rational::BigRational;

/// Forest terms (code without trailing zeros, coefficient), in decreasing
/// lexicographic order of code.
pub type ForestRows = Vec<(Vec<usize>, BigRational)>;

/// P_F of the forest with this code.
pub fn forest_poly(code: &[usize], progress: &Progress) -> MathResult<IntPoly> {
    progress.set_total(1);
    let p = forest_polynomial(&Forest::from_code(code)?, progress)?;
    progress.advance(1);
    Ok(p)
}

/// The forest expansion of S_w.
pub fn schubert_forests(w: &Perm, progress: &Progress) -> MathResult<ForestRows> {
    let terms = schubert_forest_expansion(w, progress)?;
    Ok(terms
        .into_iter()
        .map(|(c, v)| (c, BigRational::from_integer(v)))
        .collect())
}

/// The class modulo J_n of what the quotient view reduces, in the forest basis.
pub fn forest_class(input: &QuotientInput, progress: &Progress) -> MathResult<ForestRows> {
    let (n, f) = match input {
        QuotientInput::ReversedSchubert(w) => {
            crate::math::forest::schubert::check_schubert_size(w)?;
            let s = SchubertTable::new().get(w);
            (w.n(), s.reverse_vars().to_rational())
        }
        QuotientInput::Typed(text, n) => {
            let f = parse_poly_with(text, Some(*n), progress)?;
            // the normal form is a phase of its own after the reading
            progress.restart(0);
            (*n, f)
        }
    };
    if n == 0 || n > MAX_NORMAL_FORM_N {
        return Err(MathError::OutOfRange(format!(
            "n = {n}; the quotient is shown for n from 1 to {MAX_NORMAL_FORM_N}"
        )));
    }
    forest_normal_form(&f, n, progress)
}
