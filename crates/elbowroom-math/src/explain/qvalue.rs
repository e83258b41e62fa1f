//! The q-analogue of a_w: a_w(q) = (1/[n−1]_q!) Σ_{a ∈ Red(w)} q^{comaj(a)} A_{c(a)}(q),
//! with A_c(q) read in the top degree of K_n(q) (see
//! [`crate::permutohedra::remixed`]); a_w(1) = a_w. Computed through the
//! distribution of reduced words by (content, comaj).

use crate::error::MathResult;
use crate::explain::formula::{WORD_FORMULA_WORK_LIMIT, size_word_formula};
use crate::perms::perm::Perm;
use crate::perms::words::counts_by_content_and_comaj_with;
use crate::permutohedra::remixed::remixed_eulerian;
use crate::poly::qpoly::QPoly;
use crate::progress::Progress;
use num_bigint::BigInt;
use rayon::prelude::*;

/// The numerator Σ_a q^{comaj(a)} A_{c(a)}(q) and the quotient a_w(q) by [n−1]_q!
/// (`None` when the division leaves a remainder: then a_w(q) is not a polynomial).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct QCoefficient {
    /// Σ_{a ∈ Red(w)} q^{comaj(a)} A_{c(a)}(q).
    pub numerator: QPoly,
    /// a_w(q), when [n−1]_q! divides the numerator.
    pub value: Option<QPoly>,
}

/// a_w(q) for ℓ(w) = n − 1; sized first (contents × n^6 steps against
/// [`WORD_FORMULA_WORK_LIMIT`]), cancellable.
///
/// ```
/// use elbowroom_math::{Perm, Progress, explain::qvalue::q_coefficient};
/// // n = 4: a_1432(q) = q^2, a_2413(q) = q + q^2
/// let a = q_coefficient(&Perm::parse("1432").unwrap(), &Progress::default()).unwrap();
/// assert_eq!(a.value.unwrap().to_string(), "q^2");
/// let b = q_coefficient(&Perm::parse("2413").unwrap(), &Progress::default()).unwrap();
/// assert_eq!(b.value.unwrap().to_string(), "q + q^2");
/// ```
pub fn q_coefficient(w: &Perm, progress: &Progress) -> MathResult<QCoefficient> {
    let n = w.n() as u128;
    size_word_formula(w, n.pow(6), WORD_FORMULA_WORK_LIMIT, progress)?;
    let counts = counts_by_content_and_comaj_with(w, progress)?;
    progress.set_total(counts.len() as u64);
    let parts: Vec<QPoly> = counts
        .into_par_iter()
        .map(|(content, comaj)| {
            progress.check()?;
            let c: Vec<u32> = content.iter().map(|&x| x as u32).collect();
            let a = remixed_eulerian(&c)?;
            let by_comaj = QPoly::from_coeffs(comaj.into_iter().map(BigInt::from).collect());
            progress.advance(1);
            Ok(a.mul(&by_comaj))
        })
        .collect::<MathResult<Vec<_>>>()?;
    let numerator = parts.iter().fold(QPoly::default(), |acc, p| acc.add(p));
    let value = numerator.div_exact(&QPoly::q_factorial(w.n() - 1));
    Ok(QCoefficient { numerator, value })
}
