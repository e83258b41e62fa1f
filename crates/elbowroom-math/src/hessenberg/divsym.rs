//! Divided symmetrization DS_h(f) = Σ_{σ in S_n} σ( f / Π_{i < j <= h(i)} (x_i - x_j) ).
//!
//! Method. With Δ = Π_{i<j} (x_i - x_j) and Q_h = Π_{i<j, j>h(i)} (x_i - x_j) we have
//! 1/D_h = Q_h/Δ and σ(Δ) = sign(σ) Δ, so
//! DS_h(f) = Σ_σ sign(σ) σ(f Q_h) / Δ = ∂_{w0}(f · Q_h),
//! since ∂_{w0} g = Σ_σ sign(σ) σ(g) / Δ (the two sides agree for n = 2, ∂_1 g =
//! (g - s_1 g)/(x_1 - x_2), and the tests check the sign against the definition).
//! Term by term, ∂_{w0}(x^a) is ±s_{sort(a) - δ} or 0 (the bialternant rule,
//! [`crate::poly::symmetric::bialternant`]); so DS_h(f) is 0 below degree |h| = Σ(h(i) - i),
//! a number in degree |h| and a symmetric polynomial above.
//!
//! Fast path for DS_n (h(i) = i + 1) in degree n - 1 (Postnikov, *Permutohedra,
//! associahedra, and beyond*, IMRN 2009, Prop. 3.5, from memory; checked here against
//! the definition): for a weak composition a of n - 1 with n parts, let
//! S_a = {i in [n-1] : a_1 + ... + a_i < i}; then DS_n(x^a) = (-1)^{|S_a|} β_n(S_a),
//! where β_n(S) is the number of permutations in S_n with descent set S.

use crate::error::{MathError, MathResult};
use crate::hessenberg::function::HessenbergFn;
use crate::perms::perm::Perm;
use crate::poly::mono::Mono;
use crate::poly::polynomial::{IntPoly, RatPoly};
use crate::poly::symmetric::{Partition, bialternant, monomial_expansion, schur_to_monomial};
use crate::progress::Progress;
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::Zero;
use std::collections::BTreeMap;

/// The largest number of (term of f) × (term of Q_h) pairs a computation may visit.
pub const PAIR_LIMIT: u128 = 2_000_000_000;

/// β_n(S) for every S ⊆ [n-1]: the number of permutations of S_n with descent set S,
/// indexed by the bit mask of S (bit i - 1 set when i is in S).
///
/// ```
/// use elbowroom_math::hessenberg::divsym::descent_set_counts;
/// // S_3: descent set {} -> 123, {1} -> 213 312, {2} -> 132 231, {1,2} -> 321
/// assert_eq!(descent_set_counts(3), vec![1, 2, 2, 1]);
/// ```
pub fn descent_set_counts(n: usize) -> Vec<u64> {
    let n = n.max(1);
    let masks = 1usize << (n - 1);
    let mut out = Vec::with_capacity(masks);
    let mut g = vec![0u64; n + 1];
    let mut next = vec![0u64; n + 1];
    for mask in 0..masks {
        // g[j] = number of arrangements of the first i values ending at relative rank j (1-based)
        g.iter_mut().for_each(|v| *v = 0);
        g[1] = 1;
        for i in 1..n {
            let descent = mask >> (i - 1) & 1 == 1;
            next.iter_mut().for_each(|v| *v = 0);
            if descent {
                // previous rank k >= new rank j
                let mut suffix = 0u64;
                for j in (1..=i + 1).rev() {
                    if j <= i {
                        suffix += g[j];
                    }
                    next[j] = suffix;
                }
            } else {
                let mut prefix = 0u64;
                for j in 1..=i + 1 {
                    next[j] = prefix;
                    if j <= i {
                        prefix += g[j];
                    }
                }
            }
            std::mem::swap(&mut g, &mut next);
        }
        out.push(g[1..=n].iter().sum());
    }
    out
}

/// DS_n as a linear functional on monomials of degree n - 1 (Postnikov's descent formula).
#[derive(Clone, Debug)]
pub struct PostnikovFunctional {
    n: usize,
    beta: Vec<u64>,
}

impl PostnikovFunctional {
    /// Precomputes β_n(S) for all S ⊆ [n-1] (2^{n-1} values).
    pub fn new(n: usize) -> Self {
        PostnikovFunctional {
            n,
            beta: descent_set_counts(n),
        }
    }

    /// The number of variables.
    pub fn n(&self) -> usize {
        self.n
    }

    /// DS_n(x^a) = (-1)^{|S_a|} β_n(S_a) for a monomial of degree n - 1 (0 for other degrees).
    ///
    /// ```
    /// use elbowroom_math::{Mono, hessenberg::divsym::PostnikovFunctional};
    /// let ds = PostnikovFunctional::new(3);
    /// // DS_3(x2^2) = -2 and DS_3(x1 x2) = 1
    /// assert_eq!(ds.value(Mono::from_exps(&[0, 2, 0]).unwrap()), -2);
    /// assert_eq!(ds.value(Mono::from_exps(&[1, 1, 0]).unwrap()), 1);
    /// ```
    pub fn value(&self, a: Mono) -> i64 {
        let n = self.n;
        let mut prefix = 0u32;
        let mut mask = 0usize;
        let mut odd = false;
        for i in 1..n {
            prefix += a.exp(i - 1);
            if prefix < i as u32 {
                mask |= 1 << (i - 1);
                odd = !odd;
            }
        }
        if prefix + a.exp(n - 1) != (n - 1) as u32 {
            return 0;
        }
        let b = self.beta[mask] as i64;
        if odd { -b } else { b }
    }
}

/// DS_h as a linear functional on monomials of degree |h| = Σ (h(i) - i), whose values
/// are integers. For h(i) = i + 1 it is Postnikov's formula; otherwise
/// DS_h(x^a) = Σ_b q_b ε(a + b) over the terms q_b x^b of Q_h with a + b a rearrangement of δ.
#[derive(Clone, Debug)]
pub enum HessenbergFunctional {
    /// h(i) = i + 1: the descent formula.
    Postnikov(PostnikovFunctional),
    /// Any other h: pairing with the terms of Q_h.
    Complement {
        /// The size n.
        n: usize,
        /// The degree |h| at which the functional is defined.
        degree: u32,
        /// The terms of Q_h.
        terms: Vec<(Mono, i64)>,
    },
}

impl HessenbergFunctional {
    /// Prepares DS_h for monomials of degree |h|.
    pub fn new(h: &HessenbergFn) -> MathResult<Self> {
        h.require_polynomials()?;
        if h.is_default() {
            return Ok(HessenbergFunctional::Postnikov(PostnikovFunctional::new(
                h.n(),
            )));
        }
        Self::by_complement(h)
    }

    /// The pairing with Q_h, whatever h is (also used to cross-check the descent formula).
    pub fn by_complement(h: &HessenbergFn) -> MathResult<Self> {
        Self::pairing_with(h, &h.complement_product()?)
    }

    /// The pairing with `q`, which must be Q_h already expanded.
    fn pairing_with(h: &HessenbergFn, q: &IntPoly) -> MathResult<Self> {
        let mut terms = Vec::with_capacity(q.len());
        for (m, c) in q.terms() {
            let Ok(c) = i64::try_from(c) else {
                return Err(MathError::OutOfRange(
                    "a coefficient of Q_h does not fit 64 bits".into(),
                ));
            };
            terms.push((*m, c));
        }
        Ok(HessenbergFunctional::Complement {
            n: h.n(),
            degree: h.dimension() as u32,
            terms,
        })
    }

    /// DS_h(x^a) for a monomial of degree |h| (0 for any other degree).
    pub fn value(&self, a: Mono) -> BigInt {
        match self.value_checked(a, || Ok::<(), std::convert::Infallible>(())) {
            Ok(v) => v,
            Err(never) => match never {},
        }
    }

    /// [`HessenbergFunctional::value`], stopping with `Canceled` within a few
    /// thousand terms of Q_h of a cancel of `progress`.
    pub fn value_with(&self, a: Mono, progress: &Progress) -> MathResult<BigInt> {
        self.value_checked(a, || progress.check())
    }

    /// The value, calling `check` every 4096 terms of Q_h (and stopping at its error).
    fn value_checked<E>(
        &self,
        a: Mono,
        mut check: impl FnMut() -> Result<(), E>,
    ) -> Result<BigInt, E> {
        match self {
            HessenbergFunctional::Postnikov(p) => Ok(BigInt::from(p.value(a))),
            HessenbergFunctional::Complement { n, degree, terms } => {
                if a.degree() != *degree {
                    return Ok(BigInt::zero());
                }
                let mut total: i128 = 0;
                let mut exps = vec![0u32; *n];
                for (k, (b, q)) in terms.iter().enumerate() {
                    if k % 4096 == 4095 {
                        check()?;
                    }
                    let Some(m) = a.checked_mul(*b) else {
                        continue;
                    };
                    for (i, e) in exps.iter_mut().enumerate() {
                        *e = m.exp(i);
                    }
                    if let Some((sign, _)) = bialternant(&exps) {
                        total += i128::from(sign) * i128::from(*q);
                    }
                }
                Ok(BigInt::from(total))
            }
        }
    }

    /// DS_h(f) for f homogeneous of degree |h|, by linearity.
    pub fn apply(&self, f: &IntPoly) -> BigInt {
        let mut total = BigInt::zero();
        for (m, c) in f.terms() {
            let v = self.value(*m);
            if !v.is_zero() {
                total += c * v;
            }
        }
        total
    }
}

/// The value of DS_h(f): a symmetric polynomial, both as a polynomial in x_1..x_n and
/// in the monomial symmetric basis.
#[derive(Clone, Debug, PartialEq)]
pub struct DividedSymmetrization {
    /// DS_h(f) as a polynomial in n variables (a constant when deg f = |h|).
    pub value: RatPoly,
    /// DS_h(f) = Σ_λ c_λ m_λ, λ padded to n entries, zeros omitted.
    pub symmetric: BTreeMap<Partition, BigRational>,
}

/// DS_h(f) for any polynomial f in at most n variables, exactly.
///
/// ```
/// use elbowroom_math::{Mono, RatPoly, hessenberg::divsym::divided_symmetrize, hessenberg::function::HessenbergFn};
/// use num_rational::BigRational;
/// use num_traits::One;
/// let h = HessenbergFn::default_for(3).unwrap();
/// // DS_3(x1^2) = Σ_σ σ(x1^2 / ((x1 - x2)(x2 - x3))) = 1
/// let f = RatPoly::monomial(3, Mono::from_exps(&[2, 0, 0]).unwrap(), BigRational::one());
/// assert_eq!(divided_symmetrize(&f, &h).unwrap().value.to_text(), "1");
/// // one degree higher the result is symmetric: DS_3(x1^3) = x1 + x2 + x3
/// let g = RatPoly::monomial(3, Mono::from_exps(&[3, 0, 0]).unwrap(), BigRational::one());
/// assert_eq!(divided_symmetrize(&g, &h).unwrap().value.to_text(), "x1 + x2 + x3");
/// ```
pub fn divided_symmetrize(f: &RatPoly, h: &HessenbergFn) -> MathResult<DividedSymmetrization> {
    divided_symmetrize_with(f, h, &Progress::default())
}

/// [`divided_symmetrize`], stopping with `Canceled` within a few thousand
/// coefficient products of a cancel of `progress` (in the expansion of Q_h, the
/// pairing with it and the Schur terms above degree |h|).
pub fn divided_symmetrize_with(
    f: &RatPoly,
    h: &HessenbergFn,
    progress: &Progress,
) -> MathResult<DividedSymmetrization> {
    h.require_polynomials()?;
    let n = h.n();
    let f = f.with_nvars(n)?;
    let d0 = h.dimension() as u32;
    let at_degree: Vec<&(Mono, BigRational)> =
        f.terms().iter().filter(|(m, _)| m.degree() == d0).collect();
    let above: Vec<&(Mono, BigRational)> =
        f.terms().iter().filter(|(m, _)| m.degree() > d0).collect();
    // Q_h is expanded once, and only when some part of f needs it
    let needs_q = !above.is_empty() || (!at_degree.is_empty() && !h.is_default());
    let q = if needs_q {
        Some(h.complement_product_with(progress)?)
    } else {
        None
    };
    let mut schur: BTreeMap<Partition, BigRational> = BTreeMap::new();
    if !at_degree.is_empty() {
        let constant = constant_part(&at_degree, h, q.as_ref(), progress)?;
        if !constant.is_zero() {
            schur.insert(vec![0; n], constant);
        }
    }
    if let Some(q) = &q
        && !above.is_empty()
    {
        add_schur_terms_above(&above, q, n, &mut schur, progress)?;
    }
    schur.retain(|_, c| !c.is_zero());
    progress.check()?;
    let symmetric = schur_to_monomial(&schur, n);
    progress.check()?;
    let value = monomial_expansion(&symmetric, n)?;
    Ok(DividedSymmetrization { value, symmetric })
}

/// DS_h of the terms of degree |h|, a constant: by the descent formula for the
/// default h, otherwise by pairing with `q` = Q_h.
fn constant_part(
    at_degree: &[&(Mono, BigRational)],
    h: &HessenbergFn,
    q: Option<&IntPoly>,
    progress: &Progress,
) -> MathResult<BigRational> {
    let mut constant = BigRational::zero();
    match q {
        Some(q) if !h.is_default() => {
            check_pairs(at_degree.len(), q.len())?;
            let functional = HessenbergFunctional::pairing_with(h, q)?;
            for (m, c) in at_degree {
                let v = functional.value_with(*m, progress)?;
                if !v.is_zero() {
                    constant += c * BigRational::from_integer(v);
                }
            }
        }
        _ => {
            let p = PostnikovFunctional::new(h.n());
            for (k, (m, c)) in at_degree.iter().enumerate() {
                if k % 4096 == 4095 {
                    progress.check()?;
                }
                let v = p.value(*m);
                if v != 0 {
                    constant += c * BigRational::from_integer(BigInt::from(v));
                }
            }
        }
    }
    Ok(constant)
}

/// Adds to `schur` the Schur expansion of DS_h of the terms above degree |h|:
/// ∂_{w0}(x^a · Q_h) term by term, each product a Schur polynomial or 0 by the
/// bialternant rule.
fn add_schur_terms_above(
    above: &[&(Mono, BigRational)],
    q: &IntPoly,
    n: usize,
    schur: &mut BTreeMap<Partition, BigRational>,
    progress: &Progress,
) -> MathResult<()> {
    check_pairs(above.len(), q.len())?;
    let mut exps = vec![0u32; n];
    for (m, c) in above {
        for (k, (b, qc)) in q.terms().iter().enumerate() {
            if k % 4096 == 4095 {
                progress.check()?;
            }
            let Some(mm) = m.checked_mul(*b) else {
                return Err(MathError::OutOfRange("an exponent would exceed 255".into()));
            };
            for (i, e) in exps.iter_mut().enumerate() {
                *e = mm.exp(i);
            }
            if let Some((sign, mu)) = bialternant(&exps) {
                let term = c * BigRational::from_integer(qc * BigInt::from(sign));
                let entry = schur.entry(mu).or_insert_with(BigRational::zero);
                *entry += term;
            }
        }
    }
    Ok(())
}

fn check_pairs(a: usize, b: usize) -> MathResult<()> {
    if (a as u128) * (b as u128) > PAIR_LIMIT {
        return Err(MathError::OutOfRange(format!(
            "{a} terms times {b} terms of Q_h is more than {PAIR_LIMIT} products; try a smaller input"
        )));
    }
    Ok(())
}

/// The reference method: Σ_{σ in S_n} f(p_σ) / D_h(p_σ) at a rational point p with
/// distinct coordinates, where p_σ = (p_{σ(1)}, ..., p_{σ(n)}), summed over all n! permutations.
///
/// ```
/// use elbowroom_math::{Mono, RatPoly, hessenberg::divsym::divided_symmetrize_at, hessenberg::function::HessenbergFn};
/// use num_rational::BigRational;
/// use num_traits::One;
/// let h = HessenbergFn::default_for(3).unwrap();
/// let f = RatPoly::monomial(3, Mono::from_exps(&[0, 2, 0]).unwrap(), BigRational::one());
/// let p: Vec<BigRational> = [2, 5, 11].iter().map(|&v| BigRational::from_integer(v.into())).collect();
/// assert_eq!(divided_symmetrize_at(&f, &h, &p).unwrap(), BigRational::from_integer((-2).into()));
/// ```
pub fn divided_symmetrize_at(
    f: &RatPoly,
    h: &HessenbergFn,
    point: &[BigRational],
) -> MathResult<BigRational> {
    let n = h.n();
    if point.len() != n {
        return Err(MathError::InvalidInput(format!(
            "the point has {} coordinates; {n} are needed",
            point.len()
        )));
    }
    for i in 0..n {
        for j in i + 1..n {
            if point[i] == point[j] {
                return Err(MathError::InvalidInput(
                    "the point needs distinct coordinates".into(),
                ));
            }
        }
    }
    let mut total = BigRational::zero();
    for sigma in Perm::all(n) {
        let q: Vec<BigRational> = sigma
            .one_line()
            .iter()
            .map(|&v| point[v - 1].clone())
            .collect();
        let den = h.denominator_at(&q);
        total += f.eval(&q) / den;
    }
    Ok(total)
}

/// DS_h of an integer polynomial of degree |h| by the definition at one point
/// (a reference for table entries; the result is a number, so one point suffices).
pub fn divided_symmetrize_number_by_definition(
    f: &IntPoly,
    h: &HessenbergFn,
) -> MathResult<BigRational> {
    let n = h.n();
    let point: Vec<BigRational> = (0..n)
        .map(|i| BigRational::from_integer(BigInt::from((i * i + 3 * i + 1) as i64)))
        .collect();
    divided_symmetrize_at(&f.to_rational(), h, &point)
}
