//! Everything that explains one a_w (ℓ(w) = n − 1), gathered once for the window and
//! the commands: the reduced-word formula by content, the rules that apply, the values
//! at w^{-1} and w0 w w0, and the cyclic orbit with its sum.

use crate::error::MathResult;
use crate::explain::formula::{WordFormula, word_formula};
use crate::explain::rules::{Rule, rules_for};
use crate::explain::symmetry::{conjugate_by_longest, cyclic_orbit};
use crate::perms::perm::Perm;
use crate::progress::Progress;
use num_rational::BigRational;

/// a_w with its explanations.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Explanation {
    /// The reduced-word formula for w.
    pub formula: WordFormula,
    /// The rules that apply.
    pub rules: Vec<Rule>,
    /// w^{-1} and a_{w^{-1}}.
    pub inverse: (Perm, BigRational),
    /// w0 w w0 and a_{w0 w w0}.
    pub conjugate: (Perm, BigRational),
    /// The cyclic orbit: (shift j, w^{(j)}, a_{w^{(j)}}).
    pub orbit: Vec<(usize, Perm, BigRational)>,
    /// Σ_j a_{w^{(j)}}.
    pub orbit_sum: BigRational,
}

/// a_w explained: each value by the reduced-word formula (sized before it starts,
/// cancellable).
///
/// ```
/// use elbowroom_math::{Perm, Progress, explain::explanation::explain};
/// let e = explain(&Perm::parse("1432").unwrap(), &Progress::default()).unwrap();
/// // the cyclic sum equals |Red(1432)| = 2
/// assert_eq!(e.orbit_sum.to_string(), "2");
/// assert_eq!(e.formula.reduced_words, 2u8.into());
/// ```
pub fn explain(w: &Perm, progress: &Progress) -> MathResult<Explanation> {
    let formula = word_formula(w, progress)?;
    let rules = rules_for(&formula, progress)?;
    let value_of = |u: &Perm| -> MathResult<BigRational> {
        if u == w {
            return Ok(formula.value.clone());
        }
        Ok(word_formula(u, progress)?.value)
    };
    let inv = w.inverse();
    let inverse_value = value_of(&inv)?;
    let conj = conjugate_by_longest(w);
    let conjugate_value = value_of(&conj)?;
    let mut orbit = Vec::new();
    let mut orbit_sum = BigRational::default();
    for (j, u) in cyclic_orbit(w)? {
        let v = value_of(&u)?;
        orbit_sum += &v;
        orbit.push((j, u, v));
    }
    Ok(Explanation {
        formula,
        rules,
        inverse: (inv, inverse_value),
        conjugate: (conj, conjugate_value),
        orbit,
        orbit_sum,
    })
}
