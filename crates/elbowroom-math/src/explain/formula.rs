//! The reduced-word formula (Nadeau–Tewari, "The permutahedral variety, mixed
//! Eulerian numbers, and principal specializations of Schubert polynomials", IMRN
//! 2023, arXiv 2005.12194): for ℓ(w) = n − 1,
//! a_w = (1/(n−1)!) Σ_{a ∈ Red(w)} A_{c(a)} = (1/(n−1)!) Σ_c N_w(c) A_c,
//! N_w(c) the number of reduced words of content c. Computed through the
//! distribution of contents (no word is listed) and A_c only for the contents that occur.

use crate::error::{MathError, MathResult};
use crate::perms::perm::Perm;
use crate::perms::words::{count_reduced_words_with, counts_by_content_with};
use crate::permutohedra::remixed::mixed_eulerian_at_one;
use crate::progress::Progress;
use num_bigint::{BigInt, BigUint};
use num_rational::BigRational;
use rayon::prelude::*;

/// The largest n the explanations of a_w take (compositions of n − 1 in 8-bit parts,
/// permutations packed in 64 bits).
pub const EXPLAIN_MAX_N: usize = 14;

/// The most work the reduced-word formula may take before it starts, counted as
/// (a bound on the contents that occur) × the steps of one A_c (n^4 at q = 1, n^6 for
/// A_c(q)). Every letter of w's support (k letters) occurs in every reduced word, so the
/// contents are compositions of n − 1 into k positive parts: at most
/// min(|Red(w)|, C(n − 2, k − 1)) of them (252 at n = 12, 1 716 at n = 14).
pub const WORD_FORMULA_WORK_LIMIT: u128 = 20_000_000_000;

/// One row of the formula: a content c, its number of reduced words N_w(c),
/// the mixed Eulerian number A_c, and the share N_w(c)·A_c/(n−1)! of a_w.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct ContentShare {
    /// The content c_1, …, c_{n−1}.
    pub content: Vec<usize>,
    /// N_w(c).
    pub words: BigUint,
    /// A_c.
    pub eulerian: BigInt,
    /// N_w(c)·A_c/(n−1)!.
    pub share: BigRational,
}

/// The reduced-word formula for one w: its rows (contents in decreasing
/// lexicographic order), Σ N_w(c)·A_c, |Red(w)|, and a_w.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct WordFormula {
    /// The permutation.
    pub perm: Perm,
    /// The rows, contents in decreasing lexicographic order.
    pub shares: Vec<ContentShare>,
    /// Σ_c N_w(c)·A_c = (n−1)!·a_w.
    pub total: BigInt,
    /// (n−1)!.
    pub factorial: BigInt,
    /// |Red(w)|.
    pub reduced_words: BigUint,
    /// a_w.
    pub value: BigRational,
}

impl WordFormula {
    /// Whether every reduced word of w is a parking word (c_1 + ⋯ + c_i ≥ i for all i).
    pub fn all_parking(&self) -> bool {
        self.shares.iter().all(|s| is_parking(&s.content))
    }
}

/// Whether c is a parking content: c_1 + ⋯ + c_i ≥ i for every i.
pub fn is_parking(c: &[usize]) -> bool {
    let mut sum = 0;
    c.iter().enumerate().all(|(i, &x)| {
        sum += x;
        sum > i
    })
}

/// Checks that w can be explained (2 ≤ n ≤ [`EXPLAIN_MAX_N`], ℓ(w) = n − 1) and sizes the
/// formula against [`WORD_FORMULA_WORK_LIMIT`], with `per_content` the steps of one
/// A_c (n^4 at q = 1, n^6 for A_c(q)); returns |Red(w)|. The one-line refusal names the
/// estimate and the limit.
pub fn size_word_formula(
    w: &Perm,
    per_content: u128,
    limit: u128,
    progress: &Progress,
) -> MathResult<BigUint> {
    let n = w.n();
    if !(2..=EXPLAIN_MAX_N).contains(&n) {
        return Err(MathError::OutOfRange(format!(
            "n = {n}; a_w is explained by reduced words for 2 <= n <= {EXPLAIN_MAX_N}"
        )));
    }
    if w.length() != n - 1 {
        return Err(MathError::InvalidInput(format!(
            "{w} has length {}; the permutahedral class has coefficients a_w for ℓ(w) = n − 1 = {}",
            w.length(),
            n - 1
        )));
    }
    let words = count_reduced_words_with(w, progress)?;
    let letters = crate::explain::symmetry::support(w).len() as u64;
    let compositions = crate::limits::binomial(n as u64 - 2, letters.saturating_sub(1));
    let contents = u128::try_from(&words)
        .unwrap_or(u128::MAX)
        .min(compositions);
    let work = contents.saturating_mul(per_content);
    if work > limit {
        return Err(MathError::OutOfRange(format!(
            "the reduced-word formula for {w}: up to {contents} contents, each {per_content} steps, is {work} steps; at most {limit} are accepted"
        )));
    }
    Ok(words)
}

/// a_w by the reduced-word formula, with its rows; sized first (see
/// [`size_word_formula`]), cancellable, contents counted in `progress`.
///
/// ```
/// use elbowroom_math::{Perm, Progress, explain::formula::word_formula};
/// // Red(1432) = {232, 323}; (A_021 + A_012)/3! = (4 + 2)/6 = 1
/// let f = word_formula(&Perm::parse("1432").unwrap(), &Progress::default()).unwrap();
/// assert_eq!(f.total, 6.into());
/// assert_eq!(f.value.to_string(), "1");
/// ```
pub fn word_formula(w: &Perm, progress: &Progress) -> MathResult<WordFormula> {
    let n = w.n() as u128;
    let reduced_words = size_word_formula(w, n.pow(4), WORD_FORMULA_WORK_LIMIT, progress)?;
    let counts = counts_by_content_with(w, progress)?;
    progress.set_total(counts.len() as u64);
    let mut shares: Vec<ContentShare> = counts
        .into_par_iter()
        .map(|(content, words)| {
            progress.check()?;
            let c: Vec<u32> = content.iter().map(|&x| x as u32).collect();
            let eulerian = mixed_eulerian_at_one(&c)?;
            progress.advance(1);
            Ok(ContentShare {
                content,
                words,
                eulerian,
                share: BigRational::default(),
            })
        })
        .collect::<MathResult<Vec<_>>>()?;
    shares.sort_by(|a, b| b.content.cmp(&a.content));
    let factorial: BigInt = (1..w.n()).map(BigInt::from).product();
    let mut total = BigInt::default();
    for s in &mut shares {
        let product = BigInt::from(s.words.clone()) * &s.eulerian;
        total += &product;
        s.share = BigRational::new(product, factorial.clone());
    }
    let value = BigRational::new(total.clone(), factorial.clone());
    Ok(WordFormula {
        perm: w.clone(),
        shares,
        total,
        factorial,
        reduced_words,
        value,
    })
}
