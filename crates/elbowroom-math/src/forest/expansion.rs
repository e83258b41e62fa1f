//! The forest expansion of a polynomial: f = Σ_F ε(T_F f) P_F
//! (Nadeau–Spink–Tewari 2024, the analogue of f = Σ_w ε(∂_w f) S_w), with
//! T_F = T_{i_d} ⋯ T_{i_1} along a trimming sequence of F and ε the constant term.
//!
//! Every forest is visited once, along its *canonical* trimming sequence:
//! always trim the leftmost terminal node. Trimming the terminal node at i can
//! create a terminal node at i − 1 (when the node was a right child) but none
//! further left, so the canonical sequences are exactly the sequences
//! i_1, i_2, … with i_{k+1} ≥ i_k − 1, and the forest is rebuilt from its
//! sequence by inserting terminal nodes in reverse. The walk goes depth-first
//! over those sequences keeping only g = T_{i_k} ⋯ T_{i_1} f, and reads the
//! coefficient of each forest as the constant term of g. With a bound n on the
//! leaves (the quotient by J_n), a forest supported in [n] loses a leaf with
//! each trim, so at depth k only i ≤ n − k − 1 and degrees ≤ n − k − 1 remain.

use crate::error::{MathError, MathResult};
use crate::forest::indexed::insert_code;
use crate::forest::trimming::trim;
use crate::poly::mono::Mono;
use crate::poly::polynomial::{Coeff, Poly};
use crate::progress::Progress;

/// The most steps (trimmed polynomials) one expansion may take before it
/// stops with an error: the expansion of S_w for w = 10 9 … 1's largest
/// intervals stays below a million (see `docs/forests.md`).
pub const FOREST_STEP_LIMIT: u64 = 20_000_000;

/// The most monomials of the degree of a typed polynomial (in its variables)
/// its forest expansion may have to consider: the forests of degree d in
/// x_1..x_m are the weak compositions of d into m parts.
pub const FOREST_MONOMIAL_LIMIT: u128 = 2_000_000;

/// A forest expansion: (code without trailing zeros, coefficient), nonzero
/// coefficients only, in decreasing lexicographic order of code.
pub type ForestTerms<C> = Vec<(Vec<usize>, C)>;

/// The number of weak compositions of d into m parts, C(d + m − 1, m − 1), saturating.
pub fn compositions_count(d: u64, m: u64) -> u128 {
    if m == 0 {
        return u128::from(d == 0);
    }
    let mut c: u128 = 1;
    for k in 1..m {
        // C(d + k, k) = C(d + k − 1, k − 1)·(d + k)/k
        c = match c.checked_mul(u128::from(d + k)) {
            Some(v) => v / u128::from(k),
            None => return u128::MAX,
        };
    }
    c
}

/// Refuses a polynomial whose forest expansion could hold more than
/// [`FOREST_MONOMIAL_LIMIT`] forests in one degree.
pub fn check_expansion_size<C: Coeff>(f: &Poly<C>) -> MathResult<()> {
    let m = f.used_vars() as u64;
    let mut degrees: Vec<u32> = f.terms().iter().map(|(t, _)| t.degree()).collect();
    degrees.sort_unstable();
    degrees.dedup();
    let total = degrees.iter().fold(0u128, |s, &d| {
        s.saturating_add(compositions_count(u64::from(d), m))
    });
    if total > FOREST_MONOMIAL_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "the polynomial has {total} monomials of its degrees in x1..x{m} (each a possible forest); \
             at most {FOREST_MONOMIAL_LIMIT} are accepted"
        )));
    }
    Ok(())
}

/// The forest expansion f = Σ_F ε(T_F f) P_F; with `leaves = Some(n)` only the
/// forests supported in [n] (the class of f modulo J_n in the forest basis,
/// since every other P_F in Q[x_1..x_n] lies in J_n).
///
/// ```
/// use elbowroom_math::forest::expansion::forest_expansion;
/// use elbowroom_math::poly::parse::parse_poly;
/// use elbowroom_math::Progress;
/// // x2^2 = P_(0,2) − P_(1,1) − P_(2): x1^2 + x1 x2 + x2^2 − x1 x2 − x1^2
/// let f = parse_poly("x2^2", Some(2)).unwrap();
/// let e = forest_expansion(&f, None, &Progress::default()).unwrap();
/// let text: Vec<String> = e.iter().map(|(c, v)| format!("{v} {c:?}")).collect();
/// assert_eq!(text, vec!["-1 [2]", "-1 [1, 1]", "1 [0, 2]"]);
/// ```
pub fn forest_expansion<C: Coeff>(
    f: &Poly<C>,
    leaves: Option<usize>,
    progress: &Progress,
) -> MathResult<ForestTerms<C>> {
    let mut walk = Walk {
        leaves,
        out: Vec::new(),
        steps: 0,
        progress,
    };
    let mut seq = Vec::new();
    let start = match leaves {
        Some(n) => keep_degrees_up_to(f, n.saturating_sub(1)),
        None => f.clone(),
    };
    walk.visit(&start, &mut seq)?;
    let mut out = walk.out;
    out.sort_unstable_by(|a, b| b.0.cmp(&a.0));
    Ok(out)
}

struct Walk<'a, C> {
    leaves: Option<usize>,
    out: ForestTerms<C>,
    steps: u64,
    progress: &'a Progress,
}

impl<C: Coeff> Walk<'_, C> {
    fn visit(&mut self, g: &Poly<C>, seq: &mut Vec<usize>) -> MathResult<()> {
        self.steps += 1;
        self.progress.check()?;
        self.progress.advance(1);
        if self.steps > FOREST_STEP_LIMIT {
            return Err(MathError::OutOfRange(format!(
                "the forest expansion took more than {FOREST_STEP_LIMIT} steps and was stopped"
            )));
        }
        let eps = g.coeff(Mono::ONE);
        if !eps.is_zero() {
            let mut code = Vec::new();
            for &i in seq.iter().rev() {
                code = insert_code(&code, i);
            }
            while code.last() == Some(&0) {
                code.pop();
            }
            self.out.push((code, eps));
        }
        if g.degree() == 0 {
            return Ok(());
        }
        let depth = seq.len();
        let lo = seq.last().map_or(1, |&i| i.saturating_sub(1).max(1));
        let mut hi = g.used_vars();
        if let Some(n) = self.leaves {
            // after this trim the rest must stand on n − depth − 1 leaves
            hi = hi.min(n.saturating_sub(depth + 1));
        }
        for i in lo..=hi {
            let mut h = trim(g, i);
            if let Some(n) = self.leaves {
                h = keep_degrees_up_to(&h, n.saturating_sub(depth + 2));
            }
            if h.is_zero() {
                continue;
            }
            seq.push(i);
            self.visit(&h, seq)?;
            seq.pop();
        }
        Ok(())
    }
}

/// The part of f of degree at most d.
fn keep_degrees_up_to<C: Coeff>(f: &Poly<C>, d: usize) -> Poly<C> {
    if f.degree() as usize <= d {
        return f.clone();
    }
    Poly::from_terms(
        f.nvars(),
        f.terms()
            .iter()
            .filter(|(m, _)| m.degree() as usize <= d)
            .cloned(),
    )
}
