//! Schubert expansions: f = Σ c_w S_w for a polynomial f in Q[x_1..x_N].
//!
//! The Schubert polynomials S_w with w in S_∞ whose descents all lie in 1..N form a
//! basis of Q[x_1..x_N], so every f has a unique **stable** expansion. Its image in
//! H*(Fl_N) = Q[x_1..x_N]/I_N keeps the w in S_N; every other S_w lies in I_N.
//!
//! Three methods:
//! - [`schubert_expansion`] peels f: the lex-smallest monomial (x_1 > x_2 > ...) of
//!   S_w is x^{code(w)}, with coefficient 1, so if x^a is the lex-smallest monomial of
//!   f, with coefficient c, and w is the permutation with Lehmer code a, then
//!   f − c·S_w has no monomial ≤ x^a, and c_w = c. Repeat until f = 0.
//! - [`expansion_by_divided_differences`], the reference: for f homogeneous of
//!   degree d and ℓ(w) = d, c_w = (∂_w f)(0), where ∂_w = ∂_{a_1} ⋯ ∂_{a_l} for a
//!   reduced word w = s_{a_1} ⋯ s_{a_l}.
//! - [`expand_linear_factors`]: a product of linear forms (the usual shape of the
//!   class of a variety) goes through Monk's rule factor by factor, starting from
//!   S_id, and is never multiplied out into monomials.
//!
//! [`expand_typed`] reads a typed polynomial and picks the third method when the text
//! is a product of powers of linear forms ([`parse_linear_factors`]), the first
//! otherwise. Coefficients are exact rationals.

use crate::error::{MathError, MathResult};
use crate::perms::listing::mahonian_row;
use crate::perms::perm::{MAX_N, Perm};
use crate::poly::mono::Mono;
use crate::poly::parse::{LinearFactors, parse_linear_factors_with, parse_poly_with};
use crate::poly::polynomial::RatPoly;
use crate::progress::Progress;
use crate::schubert::polynomial::SchubertTable;
use crate::schubert::vector::{
    Coefficient, LinearForm, SchubertVector, Space, StepError, StepResult, exactly,
};
use num_bigint::BigInt;
use num_integer::Integer;
use num_rational::BigRational;
use num_traits::{One, Signed, Zero};
use std::collections::BTreeMap;

/// The most monomials of one degree, in the variables a polynomial uses, that
/// [`schubert_expansion`] accepts (C(d + N − 1, N − 1) for degree d in x_1..x_N).
pub const EXPANSION_MONOMIAL_LIMIT: u128 = 200_000;

/// The most terms a vector may have on the way through [`expand_linear_factors`]
/// (bounded before the work by Mahonian numbers in H*(Fl_n), and by
/// C(d + N − 1, N − 1) stably).
pub const VECTOR_TERM_LIMIT: u128 = 40_000_000;

/// A Schubert expansion Σ c_w S_w with rational coefficients.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Expansion {
    /// The space: stable (w in the smallest S_m that holds it) or H*(Fl_n) (w with n entries).
    pub space: Space,
    /// The nonzero terms (w, c_w), ordered by ℓ(w), then lexicographically.
    pub terms: Vec<(Perm, BigRational)>,
}

impl Expansion {
    /// The coefficient c_w (0 when absent); w may be given in any S_m that holds it.
    pub fn coefficient(&self, w: &Perm) -> BigRational {
        let m = w.support_size();
        self.terms
            .iter()
            .find(|(v, _)| v.support_size() == m && v.as_bytes()[..m] == w.as_bytes()[..m])
            .map(|(_, c)| c.clone())
            .unwrap_or_else(BigRational::zero)
    }

    /// Whether every coefficient is ≥ 0.
    pub fn is_nonnegative(&self) -> bool {
        self.terms.iter().all(|(_, c)| !c.is_negative())
    }

    /// The number of nonzero terms.
    pub fn len(&self) -> usize {
        self.terms.len()
    }

    /// Whether the expansion is 0.
    pub fn is_empty(&self) -> bool {
        self.terms.is_empty()
    }

    /// The image in H*(Fl_n): the terms with w in S_n, written with n entries.
    pub fn to_flag(&self, n: usize) -> MathResult<Expansion> {
        let space = Space::flag(n)?;
        let mut terms = Vec::new();
        for (w, c) in &self.terms {
            if w.support_size() <= n {
                let v = if w.n() >= n {
                    w.restrict(n)
                } else {
                    w.embed(n).ok()
                };
                if let Some(v) = v {
                    terms.push((v, c.clone()));
                }
            }
        }
        sort_terms(&mut terms);
        Ok(Expansion { space, terms })
    }

    /// Σ c_w S_w multiplied out, in `nvars` variables (a check for tests).
    pub fn to_polynomial(&self, nvars: usize) -> MathResult<RatPoly> {
        let mut table = SchubertTable::new();
        let mut out = RatPoly::zero(nvars);
        for (w, c) in &self.terms {
            let s = table.get(w).to_rational().with_nvars(nvars)?;
            out = out.add(&s.scale(c));
        }
        Ok(out)
    }
}

/// Orders terms by ℓ(w), then lexicographically by one-line notation.
fn sort_terms(terms: &mut [(Perm, BigRational)]) {
    terms.sort_by_cached_key(|(w, _)| (w.length(), w.one_line()));
}

/// The least common multiple of the denominators of f.
fn denominator_lcm(f: &RatPoly) -> BigInt {
    f.terms()
        .iter()
        .fold(BigInt::one(), |acc, (_, c)| acc.lcm(c.denom()))
}

/// C(a, b), saturating.
fn binomial(a: u128, b: u128) -> u128 {
    let mut r: u128 = 1;
    for i in 0..b {
        r = r.saturating_mul(a - i) / (i + 1);
    }
    r
}

/// The number of monomials of degree d in x_1..x_vars (also a bound on the
/// number of w of length d whose descents lie in 1..vars).
fn monomials_of_degree(d: u128, vars: usize) -> u128 {
    if vars == 0 {
        return u128::from(d == 0);
    }
    binomial(d + vars as u128 - 1, vars as u128 - 1)
}

/// Refuses a stable computation whose terms could leave S_16: with f in
/// x_1..x_vars of degree d, every w has size at most vars + d.
fn check_stable_room(vars: usize, degree: u64, what: &str) -> MathResult<()> {
    if degree > 0 && vars as u64 + degree > MAX_N as u64 {
        return Err(MathError::OutOfRange(format!(
            "{what} uses x1..x{vars} in degree {degree}, so its stable expansion may hold \
             S_w with w in S_{}; stable expansions are limited to S_{MAX_N} \
             (variables + degree <= {MAX_N}); the expansion in H*(Fl_N) has no such limit",
            vars as u64 + degree
        )));
    }
    Ok(())
}

/// The size of the largest S_m the stable expansion of f needs, bounded from the
/// monomials of f: the w with c_w ≠ 0 that are minimal for dominance of codes
/// (a ⊴ b when a_1 + ⋯ + a_i ≤ b_1 + ⋯ + b_i for all i) have x^{code(w)} among the
/// monomials of f, since every monomial of S_w dominates code(w) (ladder moves of
/// pipe dreams move crosses up, Bergeron–Billey 1993); every other code dominates a
/// minimal one. So each code a of the expansion has a_i ≤ t_i(b) := Σ_{j ≥ i} b_j for
/// a monomial x^b of f of the same degree, and w lies in S_m with
/// m = max_{i : a_i > 0} (i + a_i) ≤ max_b max_{i : t_i(b) > 0} (i + t_i(b)).
fn peel_room(f: &RatPoly) -> usize {
    let mut room = 1;
    for (m, _) in f.terms() {
        let mut tail = 0usize;
        for i in (1..=MAX_N).rev() {
            tail += m.exp(i - 1) as usize;
            if tail > 0 {
                room = room.max(i + tail);
            }
        }
    }
    room
}

/// Refuses a peel whose terms could leave S_16 (see [`peel_room`]).
fn check_peel_room(f: &RatPoly) -> MathResult<()> {
    let room = peel_room(f);
    if room > MAX_N {
        return Err(MathError::OutOfRange(format!(
            "the stable expansion of the polynomial may hold S_w with w in S_{room}; stable \
             expansions are limited to S_{MAX_N}; the expansion in H*(Fl_N) has no such limit"
        )));
    }
    Ok(())
}

/// The Schubert expansion of f (stable, or its image in H*(Fl_n)), by peeling the
/// lex-smallest monomial (see the module notes).
///
/// In H*(Fl_n) f must lie in Q[x_1..x_n]. When the stable expansion would need
/// permutations beyond S_16, the image in H*(Fl_n) is computed by
/// [`expansion_by_divided_differences`] instead.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::poly::parse::parse_poly;
/// use elbowroom_math::schubert::expansion::schubert_expansion;
/// use elbowroom_math::schubert::vector::Space;
/// // peel x_2^2 = x^{code(1423)}: x_2^2 − S_{1423} = −x_1^2 − x_1 x_2 (S_{1423} = x_1^2 + x_1 x_2 + x_2^2),
/// // then x_1 x_2 = S_{231} and x_1^2 = S_{312}: x_2^2 = S_{1423} − S_{231} − S_{312}
/// let f = parse_poly("x2^2", Some(2)).unwrap();
/// let e = schubert_expansion(&f, Space::Stable, &Progress::default()).unwrap();
/// let text: Vec<String> = e.terms.iter().map(|(w, c)| format!("{c} S_{w}")).collect();
/// assert_eq!(text, vec!["1 S_1423", "-1 S_231", "-1 S_312"]);
/// assert_eq!(e.to_polynomial(4).unwrap(), f.with_nvars(4).unwrap());
/// ```
pub fn schubert_expansion(f: &RatPoly, space: Space, progress: &Progress) -> MathResult<Expansion> {
    let vars = f.used_vars();
    let degree = u64::from(f.degree());
    if let Space::Flag(n) = space {
        Space::flag(n)?;
        if vars > n {
            return Err(MathError::OutOfRange(format!(
                "the polynomial uses x{vars}, which is not a variable of H*(Fl_{n})"
            )));
        }
        if check_peel_room(f).is_err() {
            return expansion_by_divided_differences(f, space, progress);
        }
    } else {
        check_peel_room(f)?;
    }
    let monomials = monomials_of_degree(u128::from(degree), vars);
    if monomials > EXPANSION_MONOMIAL_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "the polynomial has degree {degree} in x1..x{vars}: {monomials} monomials of that degree, \
             more than the {EXPANSION_MONOMIAL_LIMIT} accepted"
        )));
    }
    // work over the integers: f = g / den
    let den = denominator_lcm(f);
    let mut rest: BTreeMap<Mono, BigInt> = BTreeMap::new();
    for (m, c) in f.terms() {
        let v = c * BigRational::from_integer(den.clone());
        rest.insert(*m, v.to_integer());
    }
    let mut table = SchubertTable::new();
    let mut found: Vec<(Perm, BigInt)> = Vec::new();
    while let Some((m, c)) = rest.pop_first() {
        progress.check()?;
        let code: Vec<usize> = m.exps(MAX_N).iter().map(|&e| e as usize).collect();
        let w = Perm::from_code(&code[..vars.max(1)], None)?;
        let s = table.get(&w);
        let mut leading_seen = false;
        for (mm, cc) in s.terms() {
            if *mm == m {
                // the claim of the module notes: x^{code(w)} has coefficient 1
                if !cc.is_one() {
                    return Err(MathError::InvalidInput(format!(
                        "internal: x^code(w) has coefficient {cc} in S_{w}"
                    )));
                }
                leading_seen = true;
                continue;
            }
            if *mm < m {
                return Err(MathError::InvalidInput(format!(
                    "internal: S_{w} has a monomial lex-smaller than x^code(w)"
                )));
            }
            let entry = rest.entry(*mm).or_insert_with(BigInt::zero);
            *entry -= &c * cc;
            if entry.is_zero() {
                rest.remove(mm);
            }
        }
        if !leading_seen {
            return Err(MathError::InvalidInput(format!(
                "internal: x^code(w) is missing from S_{w}"
            )));
        }
        found.push((w, c));
    }
    let den = BigRational::from_integer(den);
    let mut terms: Vec<(Perm, BigRational)> = Vec::with_capacity(found.len());
    for (w, c) in found {
        let keep = match space {
            Space::Stable => Some(w.restrict(w.support_size()).unwrap_or(w)),
            Space::Flag(n) => {
                if w.support_size() <= n {
                    w.restrict(w.support_size()).and_then(|v| v.embed(n).ok())
                } else {
                    None
                }
            }
        };
        if let Some(w) = keep {
            terms.push((w, BigRational::from_integer(c) / &den));
        }
    }
    sort_terms(&mut terms);
    Ok(Expansion { space, terms })
}

/// The Codes c with c_i = 0 for i > vars and Σ c_i = d (and c_i ≤ n − i when `n` is
/// given), in lexicographic order.
fn codes(vars: usize, d: usize, n: Option<usize>, out: &mut Vec<Vec<usize>>) {
    fn go(
        i: usize,
        vars: usize,
        rest: usize,
        n: Option<usize>,
        code: &mut Vec<usize>,
        out: &mut Vec<Vec<usize>>,
    ) {
        if i == vars {
            if rest == 0 {
                out.push(code.clone());
            }
            return;
        }
        let cap = n.map_or(rest, |n| rest.min(n.saturating_sub(i + 1)));
        for c in 0..=cap {
            code.push(c);
            go(i + 1, vars, rest - c, n, code, out);
            code.pop();
        }
    }
    go(0, vars, d, n, &mut Vec::with_capacity(vars), out);
}

/// The reference method: c_w = (∂_w f_d)(0) for every w of length d and every degree d
/// of f (f_d the part of degree d); stably over the w whose descents lie in 1..N
/// (N the largest variable used), in H*(Fl_n) over S_n.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::poly::parse::parse_poly;
/// use elbowroom_math::schubert::expansion::expansion_by_divided_differences;
/// use elbowroom_math::schubert::vector::Space;
/// // x_1 + x_2 = S_{132}: ∂_2(x_1 + x_2) = 1 and ∂_1(x_1 + x_2) = 0
/// let f = parse_poly("x1 + x2", Some(2)).unwrap();
/// let e = expansion_by_divided_differences(&f, Space::Stable, &Progress::default()).unwrap();
/// let text: Vec<String> = e.terms.iter().map(|(w, c)| format!("{c} S_{w}")).collect();
/// assert_eq!(text, vec!["1 S_132"]);
/// ```
pub fn expansion_by_divided_differences(
    f: &RatPoly,
    space: Space,
    progress: &Progress,
) -> MathResult<Expansion> {
    let vars = f.used_vars();
    let (span, bound) = match space {
        Space::Stable => {
            check_stable_room(vars, u64::from(f.degree()), "the polynomial")?;
            (vars, None)
        }
        Space::Flag(n) => {
            Space::flag(n)?;
            if vars > n {
                return Err(MathError::OutOfRange(format!(
                    "the polynomial uses x{vars}, which is not a variable of H*(Fl_{n})"
                )));
            }
            (n, Some(n))
        }
    };
    let mut degrees: Vec<u32> = f.terms().iter().map(|(m, _)| m.degree()).collect();
    degrees.sort_unstable();
    degrees.dedup();
    let mut terms = Vec::new();
    for d in degrees {
        let count = match bound {
            Some(n) => mahonian_row(n).get(d as usize).copied().unwrap_or(0),
            None => monomials_of_degree(u128::from(d), vars),
        };
        if count > EXPANSION_MONOMIAL_LIMIT {
            return Err(MathError::OutOfRange(format!(
                "{count} permutations of length {d} to try, more than the {EXPANSION_MONOMIAL_LIMIT} accepted"
            )));
        }
        let part = f.homogeneous_part(d);
        let mut list = Vec::new();
        codes(span.max(1), d as usize, bound, &mut list);
        for code in list {
            progress.check()?;
            let w = Perm::from_code(&code, bound)?;
            let nvars = w.n().max(vars).max(1);
            let mut g = part.with_nvars(nvars)?;
            // peel right descents: w = (w s_i) s_i, so ∂_i acts first
            let mut u = w.clone();
            while let Some(&i) = u.descents().last() {
                g = g.divided_difference(i);
                u = u.times_s(i)?;
                if g.is_zero() {
                    break;
                }
            }
            let c = g.coeff(Mono::ONE);
            if !c.is_zero() {
                let w = match space {
                    Space::Stable => w.restrict(w.support_size()).unwrap_or(w),
                    Space::Flag(_) => w,
                };
                terms.push((w, c));
            }
        }
    }
    sort_terms(&mut terms);
    Ok(Expansion { space, terms })
}

/// One factor λ + c of degree one, over the integers, with its exponent.
struct IntFactor {
    linear: Vec<BigInt>,
    constant: BigInt,
    exponent: u32,
}

/// The Schubert expansion of scalar · Π (λ_i + c_i)^{e_i} through Monk's rule:
/// v_0 = S_id and v ← λ·v + c·v factor by factor, never in monomials.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::poly::parse::parse_linear_factors;
/// use elbowroom_math::schubert::expansion::expand_linear_factors;
/// use elbowroom_math::schubert::vector::Space;
/// // (x_1 − x_2)(x_1 − x_3)(x_2 − x_3) = Δ = 3! [pt] = 6 S_{321} in H*(Fl_3)
/// let f = parse_linear_factors("(x1-x2)(x1-x3)(x2-x3)", Some(3)).unwrap().unwrap();
/// let e = expand_linear_factors(&f, Space::Flag(3), &Progress::default()).unwrap();
/// let text: Vec<String> = e.terms.iter().map(|(w, c)| format!("{c} S_{w}")).collect();
/// assert_eq!(text, vec!["6 S_321"]);
/// ```
pub fn expand_linear_factors(
    product: &LinearFactors,
    space: Space,
    progress: &Progress,
) -> MathResult<Expansion> {
    let vars = product
        .factors
        .iter()
        .map(|(f, _)| f.used_vars())
        .max()
        .unwrap_or(0);
    let degree = product.degree();
    let affine = product
        .factors
        .iter()
        .any(|(f, e)| *e > 0 && !f.coeff(Mono::ONE).is_zero());
    // size the largest vector before the work
    let bound = match space {
        Space::Flag(n) => {
            Space::flag(n)?;
            if vars > n {
                return Err(MathError::OutOfRange(format!(
                    "the product uses x{vars}, which is not a variable of H*(Fl_{n})"
                )));
            }
            let row = mahonian_row(n);
            let top = (degree as usize).min(row.len() - 1);
            if affine {
                row[..=top].iter().fold(0u128, |a, b| a.saturating_add(*b))
            } else {
                row[..=top].iter().copied().max().unwrap_or(1)
            }
        }
        Space::Stable => {
            check_stable_room(vars, degree, "the product")?;
            if affine {
                (0..=u128::from(degree))
                    .fold(0u128, |a, d| a.saturating_add(monomials_of_degree(d, vars)))
            } else {
                (0..=u128::from(degree))
                    .map(|d| monomials_of_degree(d, vars))
                    .max()
                    .unwrap_or(1)
            }
        }
    };
    if bound > VECTOR_TERM_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "the product of {degree} linear factors may pass through {bound} Schubert terms, \
             more than the {VECTOR_TERM_LIMIT} accepted"
        )));
    }
    // integer factors: λ + c = (λ' + c') / den
    let mut scalar = product.scalar.clone();
    let mut factors = Vec::with_capacity(product.factors.len());
    for (f, e) in &product.factors {
        let den = denominator_lcm(f);
        let scale = BigRational::from_integer(den.clone());
        let int = |c: BigRational| (c * &scale).to_integer();
        let linear: Vec<BigInt> = (0..vars)
            .map(|i| int(f.coeff(Mono::var_index(i))))
            .collect();
        let constant = int(f.coeff(Mono::ONE));
        scalar /= num_traits::pow(scale.clone(), *e as usize);
        factors.push(IntFactor {
            linear,
            constant,
            exponent: *e,
        });
    }
    // a phase of its own after the reading
    progress.restart(degree);
    let vector = if scalar.is_zero() {
        SchubertVector::<BigInt>::zero(space)
    } else {
        exactly(
            || monk_product::<i128>(&factors, space, progress).map(|v| v.to_big()),
            || monk_product::<BigInt>(&factors, space, progress),
        )?
    };
    let mut terms: Vec<(Perm, BigRational)> = vector
        .sorted_terms()
        .into_iter()
        .map(|(w, c)| (w, BigRational::from_integer(c) * &scalar))
        .collect();
    terms.retain(|(_, c)| !c.is_zero());
    Ok(Expansion { space, terms })
}

/// Π (λ_i + c_i)^{e_i} · S_id by Monk's rule, in coefficients C.
fn monk_product<C: Coefficient>(
    factors: &[IntFactor],
    space: Space,
    progress: &Progress,
) -> StepResult<SchubertVector<C>> {
    let mut v = SchubertVector::<C>::one(space);
    for f in factors {
        let mut coefficients = Vec::with_capacity(f.linear.len());
        for c in &f.linear {
            coefficients.push(C::from_big(c).ok_or(StepError::Overflow)?);
        }
        let form = LinearForm::new(coefficients)?;
        let constant = C::from_big(&f.constant).ok_or(StepError::Overflow)?;
        for _ in 0..f.exponent {
            let mut next = v.times_linear(&form, progress)?;
            if !constant.is_zero_value() {
                next.add_scaled(&v, &constant)?;
            }
            v = next;
            progress.advance(1);
        }
    }
    Ok(v)
}

/// Reads a typed polynomial in x_1..x_n and expands it: in H*(Fl_n), or stably
/// (`stable = true`, over S_∞). A product of powers of linear forms goes through
/// [`expand_linear_factors`], any other polynomial through [`schubert_expansion`].
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::schubert::expansion::expand_typed;
/// // in H*(Fl_3), x_3 = −x_1 − x_2 and x_2^2 = −x_1^2 − x_1 x_2, so
/// // (x_1 − x_3)(x_2 − x_3) = 2x_1^2 + 5x_1 x_2 + 2x_2^2 = 3 x_1 x_2 = 3 S_{231}
/// let e = expand_typed("(x1 - x3)(x2 - x3)", 3, false, &Progress::default()).unwrap();
/// let text: Vec<String> = e.terms.iter().map(|(w, c)| format!("{c} S_{w}")).collect();
/// assert_eq!(text, vec!["3 S_231"]);
/// let same = expand_typed("x1 x2 - x1 x3 - x2 x3 + x3^2", 3, false, &Progress::default()).unwrap();
/// assert_eq!(same, e);
/// ```
pub fn expand_typed(
    text: &str,
    n: usize,
    stable: bool,
    progress: &Progress,
) -> MathResult<Expansion> {
    let space = if stable {
        Space::flag(n)?;
        Space::Stable
    } else {
        Space::flag(n)?
    };
    match parse_linear_factors_with(text, Some(n), progress)? {
        Some(product) => expand_linear_factors(&product, space, progress),
        None => {
            let f = parse_poly_with(text, Some(n), progress)?;
            // the expansion is a phase of its own after the reading
            progress.restart(0);
            schubert_expansion(&f, space, progress)
        }
    }
}
