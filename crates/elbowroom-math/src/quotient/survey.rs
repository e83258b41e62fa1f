//! Positivity surveys over S_n: for each permutation w, the normal form modulo J_n of
//! the reversed Schubert polynomial S_w(x_n, ..., x_1), whether its coefficients on the
//! standard monomials are all nonnegative, and the negative ones when they are not.
//!
//! S_w is homogeneous of degree ℓ(w), and every monomial of degree >= n lies in J_n
//! (it is divisible by a corner, and no standard monomial has degree >= n), so for
//! ℓ(w) >= n the normal form is 0 and S_w is not expanded at all. For n <= 8 a survey
//! lists all of S_n; from n = 9 on it lists only the w with ℓ(w) <= n − 1
//! ([`survey_listing`]), the others being 0.
//!
//! # By transition on normal forms
//! No Schubert polynomial is expanded. With r the last descent of w, v = w·t_{rs} and the
//! Lascoux–Schützenberger transition S_w = x_r S_v + Σ_q S_{v t_{qr}}
//! ([`crate::schubert::transition`]), reversing the variables turns x_r into
//! x_{n+1−r}, and reduction modulo J_n is linear, so
//! NF(S_w^rev) = NF(x_{n+1−r}·NF(S_v^rev)) + Σ_q NF(S_{v t_{qr}}^rev).
//! The walk goes up by length: level ℓ needs level ℓ − 1 (for v) and its own level (the
//! terms of the sum have the length of w), so only two levels are kept. Multiplication by
//! a variable on a standard monomial, NF(x_k·s), is computed once by division and kept
//! for the current degree. Coefficients are summed in checked `i128` and kept in `i64`
//! (16 bytes a term; at n = 12 the walk holds hundreds of millions); an entry whose arithmetic
//! would overflow is redone over big integers by expanding S_w and dividing.
//!
//! `progress` counts the permutations done (after the basis, if it was built on the way)
//! and a cancel request ends the run with [`MathError::Canceled`].

use crate::error::{MathError, MathResult};
use crate::perms::listing::perms_of_length;
use crate::perms::perm::Perm;
use crate::poly::mono::Mono;
use crate::poly::polynomial::IntPoly;
use crate::progress::Progress;
use crate::quotient::normal_form::{NormalForm, normal_form_by};
use crate::quotient::reduction::{Reduction, reducer_with};
use crate::schubert::polynomial::SchubertTable;
use crate::schubert::transition::{partners, pivot};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::Zero;
use std::collections::HashMap;
use std::sync::Arc;

/// Surveys of S_n for n up to this list every permutation; beyond, those of length < n.
pub const FULL_LISTING_MAX_N: usize = 8;

/// The largest n of a survey that keeps every normal form it finds (the window's; [`survey`]):
/// at n = 11 they take about 2 GB, at n = 12 several times that. The streaming walks
/// ([`survey_each`], [`survey_summaries_each`]) go to n = 12.
pub const HELD_SURVEY_MAX_N: usize = 11;

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

/// What a survey reports of one permutation, full ([`SurveyEntry`]) or summarized
/// ([`SurveySummary`]).
pub trait SurveyRecord {
    /// The permutation w.
    fn perm(&self) -> &Perm;
    /// The number of terms of the normal form.
    fn terms(&self) -> usize;
    /// The sum of the coefficients of the normal form.
    fn sum(&self) -> BigRational;
    /// The negative coefficients, with their standard monomials.
    fn negatives(&self) -> Vec<(Mono, BigRational)>;
    /// Whether every coefficient of the normal form is >= 0.
    fn nonnegative(&self) -> bool {
        self.negatives().is_empty()
    }
}

impl SurveyRecord for SurveyEntry {
    fn perm(&self) -> &Perm {
        &self.perm
    }
    fn terms(&self) -> usize {
        SurveyEntry::terms(self)
    }
    fn sum(&self) -> BigRational {
        SurveyEntry::sum(self)
    }
    fn negatives(&self) -> Vec<(Mono, BigRational)> {
        SurveyEntry::negatives(self)
    }
    fn nonnegative(&self) -> bool {
        SurveyEntry::nonnegative(self)
    }
}

/// The survey record of one permutation without its normal form: what `survey --summary`
/// prints, in a few words of memory (a survey of S_11 holds 113,906 of them).
#[derive(Clone, Debug, PartialEq)]
pub struct SurveySummary {
    /// The permutation w.
    pub perm: Perm,
    /// The number of terms of the normal form.
    pub terms: usize,
    /// The sum of its coefficients.
    pub sum: BigRational,
    /// Its negative coefficients, with their standard monomials.
    pub negatives: Vec<(Mono, BigRational)>,
}

impl SurveySummary {
    fn of(e: &SurveyEntry) -> SurveySummary {
        SurveySummary {
            perm: e.perm.clone(),
            terms: e.terms(),
            sum: e.sum(),
            negatives: e.negatives(),
        }
    }
}

impl SurveyRecord for SurveySummary {
    fn perm(&self) -> &Perm {
        &self.perm
    }
    fn terms(&self) -> usize {
        self.terms
    }
    fn sum(&self) -> BigRational {
        self.sum.clone()
    }
    fn negatives(&self) -> Vec<(Mono, BigRational)> {
        self.negatives.clone()
    }
}

/// The permutations a survey of S_n lists, in lexicographic order: all of S_n for
/// n <= [`FULL_LISTING_MAX_N`], otherwise those with ℓ(w) <= n − 1 (the normal form of
/// every other one is 0). At n = 9, 10, 11 there are 8,095, 30,239 and 113,906 of them
/// (sums of Mahonian numbers, OEIS A008302).
///
/// ```
/// use elbowroom_math::quotient::survey::survey_listing;
/// assert_eq!(survey_listing(3).len(), 6);
/// assert_eq!(survey_listing(9).len(), 8095);
/// ```
pub fn survey_listing(n: usize) -> Vec<Perm> {
    if n <= FULL_LISTING_MAX_N {
        return Perm::all(n).collect();
    }
    let mut out: Vec<Perm> = (0..n).flat_map(|l| perms_of_length(n, l)).collect();
    out.sort_by(|a, b| a.as_bytes().cmp(b.as_bytes()));
    out
}

/// The survey record of one permutation, by expanding S_w and dividing.
///
/// ```
/// use elbowroom_math::{Perm, quotient::survey::survey_one};
/// // S_{132} = x1 + x2, reversed: x3 + x2 ≡ x2 + x3 (both standard) modulo J_3
/// let e = survey_one(&Perm::parse("132").unwrap()).unwrap();
/// assert_eq!(e.normal_form.poly.to_text(), "x2 + x3");
/// assert!(e.nonnegative());
/// ```
pub fn survey_one(w: &Perm) -> MathResult<SurveyEntry> {
    let q = reducer_with(w.n(), &Progress::new(0))?;
    let mut table = SchubertTable::new();
    entry_by_expansion(w, q.as_ref(), &mut table)
}

fn entry_by_expansion(
    w: &Perm,
    q: &dyn Reduction,
    table: &mut SchubertTable,
) -> MathResult<SurveyEntry> {
    let n = w.n();
    let normal_form = if w.length() >= n {
        normal_form_by(q, &IntPoly::zero(n))?
    } else {
        let s = table.get(w);
        normal_form_by(q, &s.reverse_vars())?
    };
    Ok(SurveyEntry {
        perm: w.clone(),
        normal_form,
    })
}

/// Up to this many permutations are surveyed by expansion instead of the transition walk.
const FEW: usize = 16;

/// A normal form as (basis position, coefficient), sorted; `None` after an overflow.
type Sparse = Option<Arc<[Term]>>;

/// One term of a kept normal form in one word: the basis position in the low 24 bits
/// (Catalan(12) = 208,012 < 2^24), the coefficient in the high 40 bits (two's complement).
/// At n = 12 a survey holds hundreds of millions of them.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
struct Term(u64);

const POSITION_BITS: u32 = 24;

impl Term {
    /// The term, or `None` when the position or the coefficient does not fit.
    fn new(position: u32, c: i128) -> Option<Term> {
        let limit = 1i128 << (63 - POSITION_BITS);
        if position >= 1 << POSITION_BITS || c < -limit || c >= limit {
            return None;
        }
        Some(Term(
            ((c as i64 as u64) << POSITION_BITS) | u64::from(position),
        ))
    }

    fn position(self) -> u32 {
        (self.0 & ((1 << POSITION_BITS) - 1)) as u32
    }

    fn coefficient(self) -> i64 {
        (self.0 as i64) >> POSITION_BITS
    }
}

/// The transition walk of one survey: two levels of normal forms and the products x_k·s.
///
/// Each normal form of the level below is dropped once the last w of the current level
/// that starts from it (its v) is done, and on the top level, where nothing is kept for
/// a next one, each normal form once it is handed out and every w whose sum needs it is
/// done: both counted before the level starts, from the transition alone.
struct Walk<'q> {
    q: &'q dyn Reduction,
    n: usize,
    /// NF(x_k·s) by (k, basis position of s), for s of the degree below the current level.
    times_var: HashMap<(u8, u32), Sparse>,
    prev: HashMap<Vec<u8>, Sparse>,
    cur: HashMap<Vec<u8>, Sparse>,
    /// How many w of the current level still start from each v of `prev`.
    prev_uses: HashMap<Vec<u8>, u32>,
    /// On the top level: how many uses each w of `cur` still has (its own record, and
    /// every w of the level with it in its sum).
    cur_uses: Option<HashMap<Vec<u8>, u32>>,
    acc: Vec<i128>,
    touched: Vec<u32>,
}

/// The transition of w of length >= 1: v = w·t_{rs} and the terms v·t_{qr} of its sum.
fn transition(w: &[u8]) -> Option<(usize, Vec<u8>, Vec<Vec<u8>>)> {
    let (r, s) = pivot(w)?;
    let mut v = w.to_vec();
    v.swap(r, s);
    let others = partners(&v, r)
        .map(|q| {
            let mut u = v.clone();
            u.swap(q, r);
            u
        })
        .collect();
    Some((r, v, others))
}

/// Takes one use of `key` off `uses`; true when it was the last.
fn release(uses: &mut HashMap<Vec<u8>, u32>, key: &[u8]) -> bool {
    match uses.get_mut(key) {
        Some(c) if *c > 1 => {
            *c -= 1;
            false
        }
        Some(_) => {
            uses.remove(key);
            true
        }
        None => false,
    }
}

impl<'q> Walk<'q> {
    fn new(q: &'q dyn Reduction, n: usize) -> Walk<'q> {
        Walk {
            q,
            n,
            times_var: HashMap::new(),
            prev: HashMap::new(),
            cur: HashMap::new(),
            prev_uses: HashMap::new(),
            cur_uses: None,
            acc: vec![0; q.basis().len()],
            touched: Vec::new(),
        }
    }

    /// Moves on to the permutations of length `level`: the finished level becomes the
    /// level below, the products of the degree before it are dropped, and the uses of
    /// what is kept are counted.
    fn next_level(&mut self, level: usize, top: bool, progress: &Progress) -> MathResult<()> {
        self.prev = std::mem::take(&mut self.cur);
        crate::schubert::flat::free_later(std::mem::take(&mut self.times_var));
        self.prev_uses.clear();
        let mut cur_uses: HashMap<Vec<u8>, u32> = HashMap::new();
        for (k, w) in perms_of_length(self.n, level).into_iter().enumerate() {
            if k % 4096 == 0 {
                progress.check()?;
            }
            let Some((_, v, others)) = transition(w.as_bytes()) else {
                continue;
            };
            *self.prev_uses.entry(v).or_default() += 1;
            if top {
                *cur_uses.entry(w.as_bytes().to_vec()).or_default() += 1;
                for u in others {
                    *cur_uses.entry(u).or_default() += 1;
                }
            }
        }
        self.prev.retain(|v, _| self.prev_uses.contains_key(v));
        self.cur_uses = top.then_some(cur_uses);
        Ok(())
    }

    /// Hands everything the walk holds to rayon's pool to free.
    fn free_later(&mut self) {
        crate::schubert::flat::free_later((
            std::mem::take(&mut self.times_var),
            std::mem::take(&mut self.prev),
            std::mem::take(&mut self.cur),
            std::mem::take(&mut self.prev_uses),
            self.cur_uses.take(),
            std::mem::take(&mut self.acc),
        ));
    }

    /// The record of w is handed out: on the top level its normal form may go.
    fn done_with(&mut self, w: &[u8]) {
        self.release_cur(w);
    }

    fn release_cur(&mut self, w: &[u8]) {
        if let Some(uses) = self.cur_uses.as_mut()
            && release(uses, w)
        {
            self.cur.remove(w);
        }
    }

    /// NF(x_k·s) for the standard monomial at basis position s.
    fn times(&mut self, k: u8, s: u32, progress: &Progress) -> MathResult<Sparse> {
        if let Some(x) = self.times_var.get(&(k, s)) {
            return Ok(x.clone());
        }
        let m = Mono(self.q.basis()[s as usize].0 + Mono::var_index(k as usize).0);
        let nf = self
            .q
            .reduce_i128(&[(m, 1i128)], &|| progress.check())?
            .and_then(|v| narrow(&v));
        self.times_var.insert((k, s), nf.clone());
        Ok(nf)
    }

    /// NF(S_w^rev) for w of the current level (ℓ(w) >= 1), its dependencies first.
    fn normal_form(&mut self, w: &[u8], progress: &Progress) -> MathResult<Sparse> {
        if let Some(x) = self.cur.get(w) {
            return Ok(x.clone());
        }
        progress.check()?;
        let Some((r, v, others)) = transition(w) else {
            return Ok(Term::new(0, 1).map(|t| Arc::from(vec![t].into_boxed_slice())));
        };
        let mut parts = Vec::with_capacity(others.len());
        for u in &others {
            parts.push(self.normal_form(u, progress)?);
        }
        let Some(base) = self.prev.get(&v).cloned() else {
            return Err(MathError::InvalidInput(format!(
                "internal: the transition left the levels at {v:?}"
            )));
        };
        if release(&mut self.prev_uses, &v) {
            self.prev.remove(&v);
        }
        let k = (self.n - 1 - r) as u8;
        let out = self.combine(base, k, &parts, progress)?;
        self.cur.insert(w.to_vec(), out.clone());
        for u in &others {
            self.release_cur(u);
        }
        Ok(out)
    }

    /// NF(x_k·base) + Σ parts, in the dense accumulator.
    fn combine(
        &mut self,
        base: Sparse,
        k: u8,
        parts: &[Sparse],
        progress: &Progress,
    ) -> MathResult<Sparse> {
        let Some(base) = base else {
            return Ok(None);
        };
        let mut ok = true;
        for (j, t) in base.iter().enumerate() {
            if j % 64 == 63 {
                progress.check()?;
            }
            let (s, b) = (t.position(), t.coefficient());
            let Some(xs) = self.times(k, s, progress)? else {
                ok = false;
                break;
            };
            for x in xs.iter() {
                let (i, a) = (x.position(), x.coefficient());
                let slot = &mut self.acc[i as usize];
                if *slot == 0 {
                    self.touched.push(i);
                }
                match i128::from(a)
                    .checked_mul(i128::from(b))
                    .and_then(|p| slot.checked_add(p))
                {
                    Some(x) => *slot = x,
                    None => ok = false,
                }
            }
        }
        for p in parts {
            let Some(p) = p else {
                ok = false;
                break;
            };
            for x in p.iter() {
                let (i, a) = (x.position(), x.coefficient());
                let slot = &mut self.acc[i as usize];
                if *slot == 0 {
                    self.touched.push(i);
                }
                match slot.checked_add(i128::from(a)) {
                    Some(x) => *slot = x,
                    None => ok = false,
                }
            }
        }
        self.touched.sort_unstable();
        self.touched.dedup();
        let mut out = Vec::with_capacity(self.touched.len());
        for &i in &self.touched {
            let x = std::mem::take(&mut self.acc[i as usize]);
            if x != 0 {
                match Term::new(i, x) {
                    Some(t) => out.push(t),
                    None => ok = false,
                }
            }
        }
        self.touched.clear();
        Ok(ok.then(|| Arc::from(out.into_boxed_slice())))
    }
}

/// A normal form kept in words ([`Term`]); `None` when a coefficient does not fit.
fn narrow(v: &[(u32, i128)]) -> Sparse {
    let out: Option<Vec<Term>> = v.iter().map(|&(i, c)| Term::new(i, c)).collect();
    out.map(|o| Arc::from(o.into_boxed_slice()))
}

fn to_normal_form(q: &dyn Reduction, v: &[Term]) -> NormalForm {
    let basis = q.basis();
    let coefficients: Vec<(usize, Mono, BigRational)> = v
        .iter()
        .map(|t| {
            let i = t.position() as usize;
            (
                i,
                basis[i],
                BigRational::from_integer(BigInt::from(t.coefficient())),
            )
        })
        .collect();
    let poly = crate::poly::polynomial::RatPoly::from_terms(
        q.n(),
        coefficients.iter().map(|(_, m, c)| (*m, c.clone())),
    );
    NormalForm { poly, coefficients }
}

/// Surveys the given permutations (all of the same size n <= [`HELD_SURVEY_MAX_N`]), in order: the
/// records of [`survey_each`] collected.
///
/// ```
/// use elbowroom_math::{Perm, Progress, quotient::survey::survey};
/// let perms: Vec<Perm> = Perm::all(3).collect();
/// let progress = Progress::new(perms.len() as u64);
/// let entries = survey(&perms, &progress).unwrap();
/// assert_eq!(entries.len(), 6);
/// // progress counts the construction of the basis (when not cached), then one unit a w
/// assert!(progress.done() >= 6);
/// assert_eq!(progress.done(), progress.total());
/// ```
pub fn survey(perms: &[Perm], progress: &Progress) -> MathResult<Vec<SurveyEntry>> {
    if let Some(w) = perms.first().filter(|w| w.n() > HELD_SURVEY_MAX_N) {
        return Err(MathError::OutOfRange(format!(
            "a survey that keeps every normal form runs for n up to {HELD_SURVEY_MAX_N}, not n = {}",
            w.n()
        )));
    }
    collect(perms, |each| survey_each(perms, progress, each))
}

/// [`survey`] with a given way of reducing (the Gröbner basis or the forest route).
pub fn survey_by(
    q: &dyn Reduction,
    perms: &[Perm],
    progress: &Progress,
) -> MathResult<Vec<SurveyEntry>> {
    collect(perms, |each| survey_each_by(q, perms, progress, each))
}

/// [`survey`] keeping only the summary of each normal form (terms, sum, negatives).
///
/// ```
/// use elbowroom_math::{Perm, Progress, quotient::survey::{SurveyRecord, survey_summaries}};
/// let perms: Vec<Perm> = Perm::all(3).collect();
/// let s = survey_summaries(&perms, &Progress::new(0)).unwrap();
/// // S_{123} = 1, S_{132} = x1 + x2 reversed: x2 + x3, two terms
/// assert_eq!((s[0].terms(), s[1].terms()), (1, 2));
/// ```
pub fn survey_summaries(perms: &[Perm], progress: &Progress) -> MathResult<Vec<SurveySummary>> {
    collect(perms, |each| survey_summaries_each(perms, progress, each))
}

/// The records handed out by a walk, put back in the order of `perms`.
fn collect<E>(
    perms: &[Perm],
    walk: impl FnOnce(&mut dyn FnMut(usize, E) -> MathResult<()>) -> MathResult<()>,
) -> MathResult<Vec<E>> {
    let mut out: Vec<Option<E>> = (0..perms.len()).map(|_| None).collect();
    walk(&mut |i, e| {
        out[i] = Some(e);
        Ok(())
    })?;
    out.into_iter()
        .enumerate()
        .map(|(i, e)| {
            e.ok_or_else(|| {
                MathError::InvalidInput(format!("internal: {} was not surveyed", perms[i]))
            })
        })
        .collect()
}

/// The survey of the given permutations (all of one size n <= 11), each record handed
/// to `each` with its position in `perms` as soon as it is known: first the w with
/// ℓ(w) >= n (normal form 0), then level by level (by length), so not in the order of
/// `perms`. Every position is handed out exactly once; an error of `each` ends the walk.
///
/// ```
/// use elbowroom_math::{Perm, Progress, quotient::survey::survey_each};
/// let perms: Vec<Perm> = Perm::all(3).collect();
/// let mut seen = Vec::new();
/// survey_each(&perms, &Progress::new(0), &mut |i, e| {
///     assert_eq!(e.perm, perms[i]);
///     seen.push(i);
///     Ok::<(), elbowroom_math::MathError>(())
/// })
/// .unwrap();
/// seen.sort();
/// assert_eq!(seen, vec![0, 1, 2, 3, 4, 5]);
/// ```
pub fn survey_each<X: From<MathError>>(
    perms: &[Perm],
    progress: &Progress,
    each: &mut dyn FnMut(usize, SurveyEntry) -> Result<(), X>,
) -> Result<(), X> {
    run(None, perms, progress, &make_entry, each)
}

/// [`survey_each`] with a given way of reducing ([`Reduction`]: the Gröbner basis or
/// the forest route); the permutations must be in S_n for that reduction's n.
pub fn survey_each_by<X: From<MathError>>(
    q: &dyn Reduction,
    perms: &[Perm],
    progress: &Progress,
    each: &mut dyn FnMut(usize, SurveyEntry) -> Result<(), X>,
) -> Result<(), X> {
    run(Some(q), perms, progress, &make_entry, each)
}

/// [`survey_each`] handing out only the summary of each normal form.
pub fn survey_summaries_each<X: From<MathError>>(
    perms: &[Perm],
    progress: &Progress,
    each: &mut dyn FnMut(usize, SurveySummary) -> Result<(), X>,
) -> Result<(), X> {
    run(None, perms, progress, &make_summary, each)
}

/// [`survey_summaries_each`] with a given way of reducing (see [`survey_each_by`]).
pub fn survey_summaries_each_by<X: From<MathError>>(
    q: &dyn Reduction,
    perms: &[Perm],
    progress: &Progress,
    each: &mut dyn FnMut(usize, SurveySummary) -> Result<(), X>,
) -> Result<(), X> {
    run(Some(q), perms, progress, &make_summary, each)
}

fn make_entry(
    q: &dyn Reduction,
    w: &Perm,
    nf: Option<&[Term]>,
    table: &mut SchubertTable,
) -> MathResult<SurveyEntry> {
    match nf {
        Some(v) => Ok(SurveyEntry {
            perm: w.clone(),
            normal_form: to_normal_form(q, v),
        }),
        None => entry_by_expansion(w, q, table),
    }
}

fn make_summary(
    q: &dyn Reduction,
    w: &Perm,
    nf: Option<&[Term]>,
    table: &mut SchubertTable,
) -> MathResult<SurveySummary> {
    match nf {
        Some(v) => {
            let basis = q.basis();
            let int = |c: i64| BigRational::from_integer(BigInt::from(c));
            // the sum in checked i128 (each term fits i64), over big integers only beyond
            let sum = v
                .iter()
                .try_fold(0i128, |acc, t| acc.checked_add(i128::from(t.coefficient())))
                .map(|t| BigRational::from_integer(BigInt::from(t)))
                .unwrap_or_else(|| {
                    v.iter()
                        .fold(BigRational::zero(), |acc, t| acc + int(t.coefficient()))
                });
            Ok(SurveySummary {
                perm: w.clone(),
                terms: v.len(),
                sum,
                negatives: v
                    .iter()
                    .filter(|t| t.coefficient() < 0)
                    .map(|t| (basis[t.position() as usize], int(t.coefficient())))
                    .collect(),
            })
        }
        None => entry_by_expansion(w, q, table).map(|e| SurveySummary::of(&e)),
    }
}

/// Makes the record of w from its normal form (`None`: redo it by expansion).
type Make<'a, E> =
    dyn Fn(&dyn Reduction, &Perm, Option<&[Term]>, &mut SchubertTable) -> MathResult<E> + 'a;

fn run<E: Clone, X: From<MathError>>(
    given: Option<&dyn Reduction>,
    perms: &[Perm],
    progress: &Progress,
    make: &Make<'_, E>,
    each: &mut dyn FnMut(usize, E) -> Result<(), X>,
) -> Result<(), X> {
    let Some(first) = perms.first() else {
        return Ok(());
    };
    let n = first.n();
    if let Some(w) = perms.iter().find(|w| w.n() != n) {
        return Err(MathError::InvalidInput(format!(
            "a survey takes permutations of one size; {w} is not in S_{n}"
        ))
        .into());
    }
    match given {
        Some(q) => run_by(q, perms, progress, make, each),
        None => run_by(
            reducer_with(n, progress)?.as_ref(),
            perms,
            progress,
            make,
            each,
        ),
    }
}

fn run_by<E: Clone, X: From<MathError>>(
    q: &dyn Reduction,
    perms: &[Perm],
    progress: &Progress,
    make: &Make<'_, E>,
    each: &mut dyn FnMut(usize, E) -> Result<(), X>,
) -> Result<(), X> {
    let n = q.n();
    if let Some(w) = perms.iter().find(|w| w.n() != n) {
        return Err(MathError::InvalidInput(format!(
            "a survey by a reduction for n = {n} takes permutations of S_{n}, not {w}"
        ))
        .into());
    }
    // everything counted so far (the basis, here or by the caller) plus one per permutation
    progress.set_total(progress.done() + perms.len() as u64);
    progress.check()?;
    let mut table = SchubertTable::new();
    // by level: which of the requested permutations have each length
    let mut wanted: HashMap<Vec<u8>, Vec<usize>> = HashMap::new();
    let mut top = 0usize;
    for (i, w) in perms.iter().enumerate() {
        if w.length() >= n {
            each(i, make(q, w, Some(&[]), &mut table)?)?;
            progress.advance(1);
        } else {
            top = top.max(w.length());
            wanted.entry(w.as_bytes().to_vec()).or_default().push(i);
        }
    }
    if !wanted.is_empty() && wanted.len() <= FEW {
        // a few permutations: expanding them is cheaper than walking every level below
        for (i, w) in perms.iter().enumerate() {
            if w.length() < n {
                progress.check()?;
                each(i, make(q, w, None, &mut table)?)?;
                progress.advance(1);
            }
        }
    } else if !wanted.is_empty() {
        let mut walk = Walk::new(q, n);
        let mut levels = || -> Result<(), X> {
            for level in 0..=top {
                walk.next_level(level, level == top, progress)?;
                for w in perms_of_length(n, level) {
                    let key = w.as_bytes();
                    let nf = walk.normal_form(key, progress)?;
                    if level == 0 {
                        walk.cur.insert(key.to_vec(), nf.clone());
                    }
                    walk.done_with(key);
                    let Some(places) = wanted.get(key) else {
                        continue;
                    };
                    let e = make(q, &w, nf.as_deref(), &mut table)?;
                    for &i in places {
                        each(i, e.clone())?;
                        progress.advance(1);
                    }
                }
            }
            Ok(())
        };
        let walked = levels();
        if walked.is_err() {
            // a stopped walk hands what it holds (gigabytes at n = 12) to the pool to free,
            // so that the stop is reported at once
            walk.free_later();
        }
        return walked;
    }
    Ok(())
}

#[cfg(test)]
mod term_tests {
    use super::Term;

    #[test]
    fn a_term_keeps_its_position_and_coefficient() {
        for (i, c) in [
            (0u32, 1i128),
            (208_011, -1),
            (5, (1 << 39) - 1),
            (7, -(1 << 39)),
        ] {
            let t = Term::new(i, c).expect("fits");
            assert_eq!((t.position(), i128::from(t.coefficient())), (i, c));
        }
        assert_eq!(Term::new(1, 1 << 39), None);
        assert_eq!(Term::new(1, -(1 << 39) - 1), None);
        assert_eq!(Term::new(1 << 24, 1), None);
    }
}
