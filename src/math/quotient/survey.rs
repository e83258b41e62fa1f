//! Positivity surveys over S_n: for each permutation w, the normal form modulo J_n of
//! the reversed Schubert polynomial S_w(x_n, ..., x_1), whether its coefficients on the
//! standard monomials are all nonnegative, and the negative ones when they are not.
//!
//! S_w is homogeneous of degree ℓ(w), and every monomial of degree >= n lies in J_n
//! (it is divisible by a corner, and no standard monomial has degree >= n), so for
//! ℓ(w) >= n the normal form is 0 and S_w is not expanded at all.
//!
//! Runs on rayon's pool, one [`SchubertTable`] per worker; `progress` counts the
//! permutations done and a cancel request ends the run with [`MathError::Canceled`].

use crate::math::error::{MathError, MathResult};
use crate::math::perms::perm::Perm;
use crate::math::poly::mono::Mono;
use crate::math::progress::Progress;
use crate::math::quotient::normal_form::{NormalForm, groebner_basis, normal_form};
use crate::math::schubert::polynomial::SchubertTable;
use num_rational::BigRational;
use num_traits::Zero;
use rayon::prelude::*;

/// The survey record of one permutation.
#[derive(Clone, Debug, PartialEq)]
pub struct SurveyEntry {
    /// The permutation w.
    pub perm: Perm,
    /// The normal form of S_w(x_n, ..., x_1) modulo J_n.
    pub normal_form: NormalForm,
}

impl SurveyEntry {
    /// Whether every coefficient of the normal form is >= 0.
    pub fn nonnegative(&self) -> bool {
        self.normal_form.is_nonnegative()
    }

    /// The number of terms of the normal form.
    pub fn terms(&self) -> usize {
        self.normal_form.coefficients.len()
    }

    /// The sum of the coefficients of the normal form.
    pub fn sum(&self) -> BigRational {
        self.normal_form.coefficient_sum()
    }

    /// The negative coefficients, with their standard monomials.
    pub fn negatives(&self) -> Vec<(Mono, BigRational)> {
        self.normal_form
            .coefficients
            .iter()
            .filter(|(_, _, c)| *c < BigRational::zero())
            .map(|(_, m, c)| (*m, c.clone()))
            .collect()
    }
}

/// The survey record of one permutation (computes J_n's data on first use).
///
/// ```
/// use elbowroom::math::{Perm, quotient::survey::survey_one};
/// // S_{132} = x1 + x2, reversed: x3 + x2 ≡ x2 + x3 (both standard) modulo J_3
/// let e = survey_one(&Perm::parse("132").unwrap()).unwrap();
/// assert_eq!(e.normal_form.poly.to_text(), "x2 + x3");
/// assert!(e.nonnegative());
/// ```
pub fn survey_one(w: &Perm) -> MathResult<SurveyEntry> {
    let mut table = SchubertTable::new();
    entry(w, &mut table)
}

fn entry(w: &Perm, table: &mut SchubertTable) -> MathResult<SurveyEntry> {
    let n = w.n();
    let q = groebner_basis(n)?;
    let normal_form = if w.length() >= n {
        normal_form(&q, &crate::math::poly::polynomial::IntPoly::zero(n))?
    } else {
        let s = table.get(w);
        normal_form(&q, &s.reverse_vars())?
    };
    Ok(SurveyEntry {
        perm: w.clone(),
        normal_form,
    })
}

/// Surveys the given permutations (all of the same size n <= 8), in parallel, in order.
///
/// ```
/// use elbowroom::math::{Perm, Progress, quotient::survey::survey};
/// let perms: Vec<Perm> = Perm::all(3).collect();
/// let progress = Progress::new(perms.len() as u64);
/// let entries = survey(&perms, &progress).unwrap();
/// assert_eq!(entries.len(), 6);
/// assert_eq!(progress.done(), 6);
/// ```
pub fn survey(perms: &[Perm], progress: &Progress) -> MathResult<Vec<SurveyEntry>> {
    let Some(first) = perms.first() else {
        return Ok(Vec::new());
    };
    let n = first.n();
    if let Some(w) = perms.iter().find(|w| w.n() != n) {
        return Err(MathError::InvalidInput(format!(
            "a survey takes permutations of one size; {w} is not in S_{n}"
        )));
    }
    groebner_basis(n)?;
    progress.check()?;
    perms
        .par_iter()
        .map_init(SchubertTable::new, |table, w| {
            progress.check()?;
            let e = entry(w, table);
            progress.advance(1);
            e
        })
        .collect()
}
