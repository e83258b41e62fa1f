//! What the explorer can ask for, keyed by its inputs, and how each answer is
//! computed (always by the same `math` functions the command line uses).

use super::forest_jobs::{ForestRows, forest_class, forest_poly, schubert_forests};
use super::layout::{TableLayout, table_layout};
use crate::math::explain::content_words::ContentWords;
use crate::math::explain::explanation::{Explanation, explain};
use crate::math::explain::qvalue::{QCoefficient, q_coefficient};
use crate::math::hessenberg::coefficients::coefficient_table;
use crate::math::hessenberg::divsym::{DividedSymmetrization, divided_symmetrize_with};
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::table::HessenbergTable;
use crate::math::limits::SCHUBERT_TERM_LIMIT;
use crate::math::perms::class::PermClass;
use crate::math::perms::words::{count_reduced_words_with, reduced_words};
pub use crate::math::permutohedra::drawing::PolytopeDrawing;
use crate::math::permutohedra::mixed_eulerian::mixed_eulerian_numbers;
use crate::math::permutohedra::permutohedron::Permutohedron;
use crate::math::permutohedra::segment::volume_along_segment;
use crate::math::pipes::bumpless::{BumplessDream, bumpless_dreams};
use crate::math::pipes::dream::term_bound;
use crate::math::pipes::dream::{PipeDream, count_pipe_dreams, pipe_dreams};
use crate::math::poly::parse::parse_poly_with;
use crate::math::poly::qpoly::QPoly;
use crate::math::quotient::normal_form::{NormalForm, graded_dimensions, normal_form_by};
use crate::math::quotient::reduction::MAX_NORMAL_FORM_N;
use crate::math::quotient::survey::HELD_SURVEY_MAX_N;
use crate::math::quotient::survey::{SurveyEntry, survey, survey_listing};
use crate::math::schubert::expansion::expand_typed;
use crate::math::schubert::polynomial::SchubertTable;
use crate::math::schubert::polynomial::schubert;
use crate::math::schubert::principal::principal_specialization;
use crate::math::schubert::product::schubert_product;
use crate::math::schubert::vector::Space;
use crate::math::{IntPoly, MathError, MathResult, Perm, Progress};
use num_bigint::{BigInt, BigUint};
use num_rational::BigRational;
use num_traits::Signed;
use std::sync::Arc;

/// How the permutation browser filters and orders S_n.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub struct BrowseKey {
    /// The size n.
    pub n: usize,
    /// Smallest length kept.
    pub min_length: usize,
    /// Largest length kept.
    pub max_length: usize,
    /// Keep only this class.
    pub class: Option<PermClass>,
    /// Order by length, then lexicographically (otherwise lexicographically).
    pub by_length: bool,
}

/// The inputs of one computation; equal keys give equal results.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub enum JobKey {
    /// The Schubert polynomial S_w (a small job the engine's tests run; no view asks for it).
    #[cfg(test)]
    Schubert(Perm),
    /// The permutations of S_n passing a filter, in order.
    Browse(BrowseKey),
    /// The number of reduced pipe dreams S_w(1, ..., 1) of each permutation.
    Counts(Vec<Perm>),
    /// The reduced pipe dreams of w (at most [`DREAM_LIMIT`]), in enumeration order.
    PipeDreams(Perm),
    /// The bumpless pipe dreams of w.
    Bumpless(Perm),
    /// The number of reduced words of w.
    WordCount(Perm),
    /// Page k (of [`WORD_PAGE`] words) of the reduced words of w in lex order.
    Words(Perm, usize),
    /// The table a^h_w = DS_h(S_w) over w of length |h|, for h(1), ..., h(n).
    Hessenberg(Vec<usize>),
    /// The exact volume of P_λ.
    Volume(Vec<BigRational>),
    /// Vol P_λ at λ = (1 - t) a + t b for t = k / m, k = 0..=m.
    VolumeSegment(Vec<BigRational>, Vec<BigRational>, usize),
    /// The mixed Eulerian numbers A_c of n.
    Eulerian(usize),
    /// The vertices and edges of P_λ with drawing coordinates (n <= 5).
    Polytope(Vec<BigRational>),
    /// DS_h(f) for a typed polynomial f (as typed) and h(1), ..., h(n).
    DivSym(String, Vec<usize>),
    /// DS_n of a typed single monomial x^c of degree n − 1 by the descent-set
    /// formula DS_n(x^c) = (−1)^{|S(c)|} β_n(S(c)) (n = the `usize`).
    MonomialRoute(String, usize),
    /// A normal form modulo J_n, with the Hilbert series of the quotient.
    NormalForm(QuotientInput),
    /// The positivity survey: the normal form of S_w(x_n, ..., x_1) for every w in S_n.
    Survey(usize),
    /// S_u · S_v = Σ c^w_{uv} S_w: stably (`None`) or in H*(Fl_n) (`Some(n)`).
    Product(Perm, Perm, Option<usize>),
    /// The Schubert expansion of a typed polynomial (as typed) in x_1..x_n,
    /// stably (`true`) or in H*(Fl_n).
    Expansion(String, usize, bool),
    /// The Hessenberg table of h arranged for the view: sorted by a column
    /// (`perm`, `length` or `value`), descending or not.
    HessenbergLayout(Vec<usize>, String, bool),
    /// The place (0-based) of a reduced word of w in the lexicographic list of them.
    WordRank(Perm, Vec<usize>),
    /// Page k (of [`WORD_PAGE`] words) of the reduced words of w of content c
    /// (c_1, …, c_{n−1}), in lex order.
    ContentWords(Perm, Vec<usize>, usize),
    /// The place (0-based) of a reduced word of w among those of content c.
    ContentWordRank(Perm, Vec<usize>, Vec<usize>),
    /// A typed polynomial (as typed) in n variables, read and written back
    /// (the first [`TYPED_SHOWN`] characters) with its number of terms.
    Typed(String, usize),
    /// The forest polynomial P_F of the forest with this code.
    ForestPolynomial(Vec<usize>),
    /// The forest expansion of S_w.
    ForestExpansion(Perm),
    /// The class modulo J_n of what the quotient view reduces, in the forest basis.
    ForestClass(QuotientInput),
    /// Why a_w is what it is (ℓ(w) = n − 1): the reduced-word formula, rules,
    /// symmetries, a_w(q) and S_w(1, q, …).
    Explain(Perm),
}

/// a_w explained, for the words view's panel.
#[derive(Clone, Debug)]
pub struct Explained {
    /// The formula, rules, symmetries and cyclic orbit.
    pub explanation: Explanation,
    /// a_w(q), or why it was not computed (too large).
    pub q: Result<QCoefficient, String>,
    /// S_w(1, q, q², …), or why it was not computed.
    pub principal: Result<QPoly, String>,
    /// a_w by trees (code, c_{w,T}, labelings), or why it was not computed.
    pub trees: Result<Vec<crate::math::forest::trees::TreeTerm>, String>,
}

/// What the quotient view reduces.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub enum QuotientInput {
    /// The reversed Schubert polynomial S_w(x_n, ..., x_1) in n = |w| variables.
    ReversedSchubert(Perm),
    /// A typed polynomial (as typed) in n variables.
    Typed(String, usize),
}

/// A normal form with what the quotient view shows beside it.
#[derive(Clone, Debug)]
pub struct Reduced {
    /// The number of variables.
    pub n: usize,
    /// The polynomial reduced, as text.
    pub input: String,
    /// Its normal form.
    pub normal: NormalForm,
    /// The graded dimensions of Q[x]/J_n.
    pub hilbert: Vec<usize>,
}

/// How much of a typed polynomial's expanded text the workbench shows.
pub const TYPED_SHOWN: usize = 600;

/// A Schubert expansion Σ c_w S_w as rows (w, c_w): by ℓ(w), then
/// lexicographically, as the commands `product` and `expand` print them.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Terms {
    /// The nonzero terms.
    pub terms: Vec<(Perm, BigRational)>,
}

impl Terms {
    /// Whether some coefficient is negative.
    pub fn has_negative(&self) -> bool {
        self.terms.iter().any(|(_, c)| c.is_negative())
    }
}

/// The most pipe dreams the explorer lists for one permutation.
pub const DREAM_LIMIT: usize = 200_000;
/// Reduced words per page.
pub const WORD_PAGE: usize = 200;

impl JobKey {
    /// Whether the job is batch work that uses rayon inside (it then runs in
    /// the engine's pool, which leaves one core to the window).
    pub fn is_batch(&self) -> bool {
        matches!(
            self,
            JobKey::Hessenberg(_) | JobKey::Eulerian(_) | JobKey::Survey(_)
        )
    }

    /// A short description for the status line.
    pub fn label(&self) -> String {
        match self {
            #[cfg(test)]
            JobKey::Schubert(w) => format!("Schubert polynomial of {w}"),
            JobKey::Browse(b) => format!("listing S_{}", b.n),
            JobKey::Counts(ws) => format!("counting pipe dreams of {} permutations", ws.len()),
            JobKey::PipeDreams(w) => format!("pipe dreams of {w}"),
            JobKey::Bumpless(w) => format!("bumpless pipe dreams of {w}"),
            JobKey::WordCount(w) => format!("counting reduced words of {w}"),
            JobKey::Words(w, p) => format!("reduced words of {w}, page {}", p + 1),
            JobKey::Hessenberg(h) => format!("Hessenberg table of h = {}", h_text(h)),
            JobKey::Volume(_) => "volume of P_λ".to_string(),
            JobKey::VolumeSegment(..) => "volumes along a segment".to_string(),
            JobKey::Eulerian(n) => format!("mixed Eulerian numbers of {n}"),
            JobKey::Polytope(_) => "vertices of P_λ".to_string(),
            JobKey::DivSym(_, h) => format!("divided symmetrization for h = {}", h_text(h)),
            JobKey::MonomialRoute(_, n) => format!("DS_{n} of a monomial by descent sets"),
            JobKey::NormalForm(_) => "normal form modulo J_n".to_string(),
            JobKey::Survey(n) => format!("positivity survey of S_{n}"),
            JobKey::Product(u, v, None) => format!("S_{u} · S_{v}, stably"),
            JobKey::Product(u, v, Some(n)) => format!("S_{u} · S_{v} in H*(Fl_{n})"),
            JobKey::Expansion(_, n, true) => format!("Schubert expansion in x1..x{n}, stably"),
            JobKey::Expansion(_, n, false) => format!("Schubert expansion in H*(Fl_{n})"),
            JobKey::Typed(_, n) => format!("reading a polynomial in x1..x{n}"),
            JobKey::HessenbergLayout(h, ..) => {
                format!("arranging the table of h = {}", h_text(h))
            }
            JobKey::WordRank(w, _) => format!("finding a reduced word of {w} in the list"),
            JobKey::ContentWords(w, c, p) => {
                format!("reduced words of {w} of content {c:?}, page {}", p + 1)
            }
            JobKey::ContentWordRank(w, c, _) => {
                format!("finding a reduced word of {w} among those of content {c:?}")
            }
            JobKey::ForestPolynomial(c) => format!("P_F of the code {}", h_text(c)),
            JobKey::ForestExpansion(w) => format!("forest expansion of S_{w}"),
            JobKey::ForestClass(_) => "class modulo J_n in the forest basis".to_string(),
            JobKey::Explain(w) => format!("explaining a_{w} by its reduced words"),
        }
    }
}

/// h written as the explorer and the commands write it everywhere: `(2,3,3)`.
pub fn h_text(h: &[usize]) -> String {
    let parts: Vec<String> = h.iter().map(|v| v.to_string()).collect();
    format!("({})", parts.join(","))
}

/// A finished result.
#[derive(Clone, Debug)]
pub enum Output {
    /// A polynomial with integer coefficients.
    Poly(IntPoly),
    /// A list of permutations.
    Perms(Vec<Perm>),
    /// A list of counts.
    Counts(Vec<BigUint>),
    /// Plain text.
    Text(String),
    /// Reduced pipe dreams.
    Dreams(Vec<PipeDream>),
    /// Bumpless pipe dreams.
    Bumpless(Vec<BumplessDream>),
    /// One exact count.
    Count(BigUint),
    /// Words (of a page).
    Words(Vec<Vec<usize>>),
    /// A Hessenberg class table.
    Hessenberg(HessenbergTable),
    /// One exact rational.
    Rational(BigRational),
    /// Exact samples (t, value).
    Samples(Vec<(BigRational, BigRational)>),
    /// Mixed Eulerian numbers (c, A_c).
    Eulerian(Vec<(Vec<u32>, BigInt)>),
    /// A polytope for drawing: vertex labels, coordinates (floats, for pictures) and edges.
    Polytope(PolytopeDrawing),
    /// A divided symmetrization.
    DivSym(DividedSymmetrization),
    /// A normal form in the quotient.
    Reduced(Reduced),
    /// A positivity survey, one entry per permutation in lexicographic order.
    Survey(Vec<SurveyEntry>),
    /// A Schubert expansion (of a product or of a typed polynomial).
    Terms(Terms),
    /// A Hessenberg table's summary and row order.
    Layout(TableLayout),
    /// Forest terms (code, coefficient).
    Forests(ForestRows),
    /// a_w explained.
    Explain(Arc<Explained>),
    /// DS_n of one monomial by the descent-set formula.
    Monomial(crate::math::explain::monomials::MonomialValue),
}

impl Output {
    /// The polynomial, if this is one.
    pub fn poly(&self) -> Option<&IntPoly> {
        match self {
            Output::Poly(p) => Some(p),
            _ => None,
        }
    }

    /// The permutations, if this is a list of them.
    pub fn perms(&self) -> Option<&[Perm]> {
        match self {
            Output::Perms(p) => Some(p),
            _ => None,
        }
    }

    /// The counts, if this is a list of them.
    pub fn counts(&self) -> Option<&[BigUint]> {
        match self {
            Output::Counts(c) => Some(c),
            _ => None,
        }
    }

    /// The pipe dreams, if these are.
    pub fn dreams(&self) -> Option<&[PipeDream]> {
        match self {
            Output::Dreams(d) => Some(d),
            _ => None,
        }
    }

    /// The bumpless pipe dreams, if these are.
    pub fn bumpless(&self) -> Option<&[BumplessDream]> {
        match self {
            Output::Bumpless(d) => Some(d),
            _ => None,
        }
    }

    /// The count, if this is one.
    pub fn count(&self) -> Option<&BigUint> {
        match self {
            Output::Count(c) => Some(c),
            _ => None,
        }
    }

    /// The words, if these are.
    pub fn words(&self) -> Option<&[Vec<usize>]> {
        match self {
            Output::Words(w) => Some(w),
            _ => None,
        }
    }

    /// The Hessenberg table, if this is one.
    pub fn hessenberg(&self) -> Option<&HessenbergTable> {
        match self {
            Output::Hessenberg(t) => Some(t),
            _ => None,
        }
    }

    /// The rational, if this is one.
    pub fn rational(&self) -> Option<&BigRational> {
        match self {
            Output::Rational(r) => Some(r),
            _ => None,
        }
    }

    /// The Schubert expansion, if this is one.
    pub fn terms(&self) -> Option<&Terms> {
        match self {
            Output::Terms(t) => Some(t),
            _ => None,
        }
    }

    /// The forest terms, if these are.
    pub fn forests(&self) -> Option<&ForestRows> {
        match self {
            Output::Forests(f) => Some(f),
            _ => None,
        }
    }

    /// The text, if this is text.
    pub fn text(&self) -> Option<&str> {
        match self {
            Output::Text(t) => Some(t),
            _ => None,
        }
    }
}

/// Computes the answer for `key`, reporting to `progress` and stopping with
/// `Canceled` when asked to. One function per kind of job below.
pub fn compute(key: &JobKey, progress: &Progress) -> MathResult<Output> {
    match key {
        #[cfg(test)]
        JobKey::Schubert(w) => schubert_polynomial(w, progress).map(Output::Poly),
        JobKey::Browse(b) => browse(b, progress).map(Output::Perms),
        JobKey::Counts(ws) => dream_counts(ws, progress).map(Output::Counts),
        JobKey::PipeDreams(w) => dreams(w, progress).map(Output::Dreams),
        JobKey::Bumpless(w) => bumpless(w, progress).map(Output::Bumpless),
        JobKey::WordCount(w) => count_reduced_words_with(w, progress).map(Output::Count),
        JobKey::Words(w, page) => word_page(w, *page, progress).map(Output::Words),
        JobKey::Hessenberg(h) => {
            let h = HessenbergFn::new(h)?;
            coefficient_table(&h, &|_| true, progress).map(Output::Hessenberg)
        }
        JobKey::Volume(lambda) => volume(lambda, progress).map(Output::Rational),
        JobKey::VolumeSegment(a, b, m) => {
            volume_along_segment(a, b, *m, progress).map(Output::Samples)
        }
        JobKey::Eulerian(n) => mixed_eulerian_numbers(*n, progress).map(Output::Eulerian),
        JobKey::Polytope(lambda) => {
            PolytopeDrawing::of(&Permutohedron::new(lambda)?).map(Output::Polytope)
        }
        JobKey::DivSym(text, h) => divsym(text, h, progress).map(Output::DivSym),
        JobKey::MonomialRoute(text, n) => monomial_route(text, *n, progress).map(Output::Monomial),
        JobKey::Survey(n) => survey_of_all(*n, progress).map(Output::Survey),
        JobKey::NormalForm(input) => reduce(input, progress).map(Output::Reduced),
        JobKey::Product(u, v, n) => product(u, v, *n, progress).map(Output::Terms),
        JobKey::Expansion(text, n, stable) => expand_typed(text, *n, *stable, progress)
            .map(|e| Output::Terms(Terms { terms: e.terms })),
        JobKey::Typed(text, n) => typed(text, *n, progress).map(Output::Text),
        JobKey::WordRank(w, word) => word_rank(w, word, progress).map(Output::Count),
        JobKey::ContentWords(w, c, page) => {
            content_word_page(w, c, *page, progress).map(Output::Words)
        }
        JobKey::ContentWordRank(w, c, word) => {
            let mut words = ContentWords::new(w, c, progress)?;
            words.rank(word).map(|r| Output::Count(BigUint::from(r)))
        }
        JobKey::Explain(w) => explained(w, progress).map(|e| Output::Explain(Arc::new(e))),
        JobKey::HessenbergLayout(h, column, descending) => {
            // the view passes the table it has; from the key alone it is computed again
            let table = coefficient_table(&HessenbergFn::new(h)?, &|_| true, progress)?;
            table_layout(&table, column, *descending, progress).map(Output::Layout)
        }
        JobKey::ForestPolynomial(code) => forest_poly(code, progress).map(Output::Poly),
        JobKey::ForestExpansion(w) => schubert_forests(w, progress).map(Output::Forests),
        JobKey::ForestClass(input) => forest_class(input, progress).map(Output::Forests),
    }
}

/// Page `page` (of [`WORD_PAGE`] words) of the reduced words of w of content c.
fn content_word_page(
    w: &Perm,
    c: &[usize],
    page: usize,
    progress: &Progress,
) -> MathResult<Vec<Vec<usize>>> {
    progress.set_total(1);
    let mut words = ContentWords::new(w, c, progress)?;
    let skip = (page as u128).saturating_mul(WORD_PAGE as u128);
    let out = words.page(skip, WORD_PAGE)?;
    progress.advance(1);
    Ok(out)
}

/// The place of `word` in the lexicographic list of the reduced words of w.
fn word_rank(w: &Perm, word: &[usize], progress: &Progress) -> MathResult<BigUint> {
    for (k, candidate) in reduced_words(w).enumerate() {
        if k % 1024 == 0 {
            progress.check()?;
            progress.advance(1024);
        }
        if candidate == word {
            return Ok(BigUint::from(k));
        }
    }
    Err(MathError::InvalidInput(format!(
        "{word:?} is not a reduced word of {w}"
    )))
}

/// S_u · S_v by [`schubert_product`] (as the command `product`), each w written
/// as the command writes it: in the smallest S_m stably, with n entries in H*(Fl_n).
fn product(u: &Perm, v: &Perm, n: Option<usize>, progress: &Progress) -> MathResult<Terms> {
    let space = match n {
        None => Space::Stable,
        Some(n) => Space::flag(n)?,
    };
    let p = schubert_product(u, v, space, progress)?;
    let terms = p
        .sorted_terms()
        .into_iter()
        .map(|(w, c)| {
            let w = match n {
                Some(n) => w.embed(n).unwrap_or_else(|_| w.clone()),
                None => w.restrict(w.support_size()).unwrap_or_else(|| w.clone()),
            };
            (w, BigRational::from_integer(c))
        })
        .collect();
    Ok(Terms { terms })
}

/// A typed polynomial read in n variables, written back: its first
/// [`TYPED_SHOWN`] characters, and its number of terms when cut.
fn typed(text: &str, n: usize, progress: &Progress) -> MathResult<String> {
    // the reading reports its coefficient products as it multiplies
    let f = parse_poly_with(text, Some(n), progress)?;
    let written = f.to_text();
    if written.chars().count() <= TYPED_SHOWN {
        return Ok(written);
    }
    let head: String = written.chars().take(TYPED_SHOWN).collect();
    Ok(format!("{head} … ({} terms in all)", f.len()))
}

#[cfg(test)]
fn schubert_polynomial(w: &Perm, progress: &Progress) -> MathResult<IntPoly> {
    progress.set_total(1);
    // the same refusal as `elbowroom schubert`
    crate::math::sizing::check_schubert(w)?;
    progress.check()?;
    let p = SchubertTable::new().get(w);
    progress.advance(1);
    Ok((*p).clone())
}

fn dream_counts(ws: &[Perm], progress: &Progress) -> MathResult<Vec<BigUint>> {
    progress.set_total(ws.len() as u64);
    let mut out = Vec::with_capacity(ws.len());
    for w in ws {
        progress.check()?;
        out.push(count_pipe_dreams(w));
        progress.advance(1);
    }
    Ok(out)
}

/// The first [`DREAM_LIMIT`] reduced pipe dreams of w.
fn dreams(w: &Perm, progress: &Progress) -> MathResult<Vec<PipeDream>> {
    let total = count_pipe_dreams(w);
    let total = u64::try_from(&total)
        .unwrap_or(u64::MAX)
        .min(DREAM_LIMIT as u64);
    progress.set_total(total);
    let mut out = Vec::new();
    for d in pipe_dreams(w).take(DREAM_LIMIT) {
        if out.len() % 256 == 0 {
            progress.check()?;
            progress.advance(256);
        }
        out.push(d);
    }
    Ok(out)
}

fn bumpless(w: &Perm, progress: &Progress) -> MathResult<Vec<BumplessDream>> {
    progress.set_total(1);
    let out = bumpless_dreams(w);
    progress.check()?;
    progress.advance(1);
    Ok(out)
}

/// Page `page` (of [`WORD_PAGE`] words) of the reduced words of w in lex order.
fn word_page(w: &Perm, page: usize, progress: &Progress) -> MathResult<Vec<Vec<usize>>> {
    let skip = page.saturating_mul(WORD_PAGE);
    progress.set_total((skip + WORD_PAGE) as u64);
    let mut out = Vec::with_capacity(WORD_PAGE);
    for (k, word) in reduced_words(w).enumerate().take(skip + WORD_PAGE) {
        if k % 1024 == 0 {
            progress.check()?;
            progress.advance(1024);
        }
        if k >= skip {
            out.push(word);
        }
    }
    Ok(out)
}

fn volume(lambda: &[BigRational], progress: &Progress) -> MathResult<BigRational> {
    progress.set_total(1);
    let p = Permutohedron::new(lambda)?;
    let digits = p.volume_digit_estimate();
    let limit = crate::math::limits::VOLUME_DIGIT_LIMIT;
    if digits > limit {
        return Err(MathError::OutOfRange(format!(
            "the volume at n = {} works with numbers of about {digits} digits ((n − 1) times the digits of λ over a common denominator); at most {limit} are accepted",
            p.n()
        )));
    }
    let v = p.volume();
    progress.advance(1);
    Ok(v)
}

fn divsym(text: &str, h: &[usize], progress: &Progress) -> MathResult<DividedSymmetrization> {
    let h = HessenbergFn::new(h)?;
    let f = parse_poly_with(text, Some(h.n()), progress)?;
    // the same refusal as `elbowroom divsym`
    crate::math::sizing::check_divsym(&f, &h)?;
    // DS_h is a phase of its own after the reading
    progress.restart(1);
    let out = divided_symmetrize_with(&f, &h, progress)?;
    progress.advance(1);
    Ok(out)
}

/// DS_n(x^c) = (−1)^{|S(c)|} β_n(S(c)) for a typed polynomial that is one
/// monomial x^c of degree n − 1 with coefficient 1 (anything else is refused).
fn monomial_route(
    text: &str,
    n: usize,
    progress: &Progress,
) -> MathResult<crate::math::explain::monomials::MonomialValue> {
    let f = parse_poly_with(text, Some(n), progress)?;
    let [(mono, c)] = f.terms() else {
        return Err(MathError::InvalidInput("not a single monomial".into()));
    };
    if !num_traits::One::is_one(c) {
        return Err(MathError::InvalidInput("the coefficient is not 1".into()));
    }
    let exps: Vec<u32> = (0..n).map(|i| mono.exp(i)).collect();
    crate::math::explain::monomials::monomial_value(&exps)
}

/// The positivity survey over all of S_n, in lexicographic order.
fn survey_of_all(n: usize, progress: &Progress) -> MathResult<Vec<SurveyEntry>> {
    if n == 0 || n > HELD_SURVEY_MAX_N {
        return Err(MathError::OutOfRange(format!(
            "the window surveys n from 1 to {HELD_SURVEY_MAX_N} (it keeps every normal form)"
        )));
    }
    crate::basis_cache::basis_with(n, progress)?;
    let perms: Vec<Perm> = survey_listing(n);
    progress.set_total(perms.len() as u64);
    survey(&perms, progress)
}

/// The normal form modulo J_n of what the quotient view reduces.
fn reduce(input: &QuotientInput, progress: &Progress) -> MathResult<Reduced> {
    progress.set_total(2);
    let (n, f) = match input {
        QuotientInput::ReversedSchubert(w) => {
            let s = SchubertTable::new().get(w);
            (w.n(), s.reverse_vars().to_rational())
        }
        QuotientInput::Typed(text, n) => {
            let f = parse_poly_with(text, Some(*n), progress)?;
            // the reduction is a phase of its own after the reading
            progress.restart(2);
            (*n, f)
        }
    };
    if n == 0 || n > MAX_NORMAL_FORM_N {
        return Err(MathError::OutOfRange(format!(
            "normal forms modulo J_n are computed for n from 1 to {MAX_NORMAL_FORM_N}"
        )));
    }
    let q = crate::basis_cache::reducer_with(n, progress)?;
    progress.advance(1);
    progress.check()?;
    let normal = normal_form_by(q.as_ref(), &f)?;
    progress.advance(1);
    Ok(Reduced {
        n,
        input: f.to_text(),
        normal,
        hilbert: graded_dimensions(q.basis()),
    })
}

/// The largest n whose S_n the browser lists (9! = 362 880 rows).
pub const BROWSE_MAX_N: usize = 9;

fn browse(b: &BrowseKey, progress: &Progress) -> MathResult<Vec<Perm>> {
    if b.n == 0 || b.n > BROWSE_MAX_N {
        return Err(MathError::OutOfRange(format!(
            "the browser lists S_n for 1 <= n <= {BROWSE_MAX_N}, not n = {}",
            b.n
        )));
    }
    let total: u64 = (1..=b.n as u64).product();
    progress.set_total(total);
    let mut out = Vec::new();
    for (k, w) in Perm::all(b.n).enumerate() {
        if k % 1024 == 0 {
            progress.check()?;
            progress.advance(1024.min(total - k as u64));
        }
        let l = w.length();
        if l < b.min_length || l > b.max_length {
            continue;
        }
        if let Some(c) = b.class
            && !c.contains(&w)
        {
            continue;
        }
        out.push(w);
    }
    if b.by_length {
        out.sort_by_cached_key(|w| w.length());
    }
    Ok(out)
}

/// a_w explained; a_w(q) and S_w(1, q, …) are left out (with the reason) when
/// they are over their limits, the rest is refused as a whole.
fn explained(w: &Perm, progress: &Progress) -> MathResult<Explained> {
    let explanation = explain(w, progress)?;
    let q = match q_coefficient(w, progress) {
        Ok(q) => Ok(q),
        Err(MathError::Canceled) => return Err(MathError::Canceled),
        Err(e) => Err(e.to_string()),
    };
    let bound = term_bound(w);
    let principal = if bound > SCHUBERT_TERM_LIMIT {
        Err(format!(
            "S_{w} may have up to {bound} terms; at most {SCHUBERT_TERM_LIMIT} are expanded"
        ))
    } else {
        Ok(principal_specialization(&schubert(w)))
    };
    let trees = match crate::math::forest::trees::a_w_by_trees(w, progress) {
        Ok(t) => Ok(t),
        Err(MathError::Canceled) => return Err(MathError::Canceled),
        Err(e) => Err(e.to_string()),
    };
    Ok(Explained {
        explanation,
        q,
        principal,
        trees,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn browsing_s4_by_class() -> MathResult<()> {
        let p = Progress::new(0);
        let key = |class| BrowseKey {
            n: 4,
            min_length: 0,
            max_length: 6,
            class,
            by_length: true,
        };
        // all of S_4
        let all = browse(&key(None), &p)?;
        assert_eq!(all.len(), 24);
        assert!(all.windows(2).all(|w| w[0].length() <= w[1].length()));
        // 132-avoiding permutations of S_4: Catalan(4) = 14 (OEIS A000108)
        assert_eq!(browse(&key(Some(PermClass::Dominant)), &p)?.len(), 14);
        // 2143-avoiding permutations of S_4: 23 (OEIS A005802)
        assert_eq!(browse(&key(Some(PermClass::Vexillary)), &p)?.len(), 23);
        Ok(())
    }

    #[test]
    fn pipe_dream_counts_are_schubert_values_at_one() -> MathResult<()> {
        // S_{1432}(1,1,1) = 5 and S_{w0} = x1^2 x2 has one pipe dream (Macdonald's table)
        let ws = vec![Perm::parse("1432")?, Perm::parse("321")?];
        let out = compute(&JobKey::Counts(ws), &Progress::new(0))?;
        let c: Vec<String> = out
            .counts()
            .unwrap_or_default()
            .iter()
            .map(|c| c.to_string())
            .collect();
        assert_eq!(c, ["5", "1"]);
        Ok(())
    }

    #[test]
    fn the_segment_and_the_drawing_come_from_the_shared_functions() -> MathResult<()> {
        let r = |v: i64| BigRational::from_integer(v.into());
        let (a, b) = (vec![r(1), r(1), r(0)], vec![r(2), r(1), r(0)]);
        let p = Progress::new(0);
        let out = compute(&JobKey::VolumeSegment(a.clone(), b.clone(), 4), &p)?;
        let Output::Samples(samples) = out else {
            return Err(MathError::InvalidInput("not samples".into()));
        };
        assert_eq!(samples, volume_along_segment(&a, &b, 4, &p)?);
        let out = compute(&JobKey::Polytope(b.clone()), &p)?;
        let Output::Polytope(d) = out else {
            return Err(MathError::InvalidInput("not a drawing".into()));
        };
        assert_eq!(d, PolytopeDrawing::of(&Permutohedron::new(&b)?)?);
        Ok(())
    }
}
