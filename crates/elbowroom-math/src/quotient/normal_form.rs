//! The quasisymmetric quotient Q[x_1..x_n]/J_n: normal forms, coefficients in the
//! basis of standard monomials (the lattice-path basis), graded dimensions, and
//! divided symmetrization read off the normal form.
//!
//! Order: lex with x_1 > x_2 > ... > x_n (exactly `Ord` on [`Mono`]). Standard
//! monomials: x^e with e_1 + ... + e_i <= i - 1 for all i; there are Catalan(n).
//!
//! Caching: the Gröbner data of each n is computed once per process and kept in a
//! `std::sync::OnceLock` per n ([`groebner_basis`], [`groebner_basis_with`]); it holds no
//! thread and no file, only the basis, so the mathematics stays pure. A program that keeps
//! bases between runs ([`crate::quotient::basis_bytes`]) hands one back with
//! [`share_basis`] and asks first with [`built_basis`]. [`QuasiGroebner::compute`] builds a fresh
//! copy for callers who want no sharing (benchmarks).

use crate::error::{MathError, MathResult};
use crate::poly::mono::Mono;
use crate::poly::polynomial::{Coeff, Poly, RatPoly};
use crate::progress::Progress;
use crate::quotient::groebner::{MAX_QUOTIENT_N, QuasiGroebner};
use crate::quotient::reduction::Reduction;
use num_bigint::BigInt;
use num_integer::Integer;
use num_rational::BigRational;
use num_traits::{One, Zero};
use std::sync::{Arc, Mutex, OnceLock, TryLockError};

static CACHE: [OnceLock<Arc<QuasiGroebner>>; MAX_QUOTIENT_N + 1] =
    [const { OnceLock::new() }; MAX_QUOTIENT_N + 1];
static BUILDING: [Mutex<()>; MAX_QUOTIENT_N + 1] = [const { Mutex::new(()) }; MAX_QUOTIENT_N + 1];

/// The Gröbner data of J_n, computed on first use and shared afterwards.
///
/// ```
/// use elbowroom_math::quotient::normal_form::groebner_basis;
/// // dim Q[x1..x4]/J_4 = Catalan(4) = 14 (Aval–Bergeron–Bergeron 2004)
/// assert_eq!(groebner_basis(4).unwrap().basis().len(), 14);
/// ```
pub fn groebner_basis(n: usize) -> MathResult<Arc<QuasiGroebner>> {
    groebner_basis_with(n, &Progress::new(0))
}

/// [`groebner_basis`] with progress and cancellation: the construction counts on `progress`
/// and stops with [`MathError::Canceled`] within a few milliseconds of a cancel. Only a
/// finished basis is cached, so a cancelled construction leaves the cache as it was; a
/// caller that finds another thread building the same n waits for it (still polling the
/// cancel flag) and shares its result.
pub fn groebner_basis_with(n: usize, progress: &Progress) -> MathResult<Arc<QuasiGroebner>> {
    if n == 0 || n > MAX_QUOTIENT_N {
        return Err(MathError::OutOfRange(format!(
            "the quotient is computed for 1 <= n <= {MAX_QUOTIENT_N}, not n = {n}"
        )));
    }
    if let Some(q) = CACHE[n].get() {
        return Ok(q.clone());
    }
    let _building = loop {
        match BUILDING[n].try_lock() {
            Ok(guard) => break guard,
            Err(TryLockError::Poisoned(p)) => break p.into_inner(),
            Err(TryLockError::WouldBlock) => {
                progress.check()?;
                if let Some(q) = CACHE[n].get() {
                    return Ok(q.clone());
                }
                std::thread::sleep(std::time::Duration::from_millis(20));
            }
        }
    };
    if let Some(q) = CACHE[n].get() {
        return Ok(q.clone());
    }
    let q = Arc::new(QuasiGroebner::compute(n, Some(progress))?);
    let _ = CACHE[n].set(q.clone());
    Ok(q)
}

/// The basis of J_n if this process already holds it (built or shared), without building it.
pub fn built_basis(n: usize) -> Option<Arc<QuasiGroebner>> {
    CACHE.get(n).and_then(|c| c.get()).cloned()
}

/// Shares a basis obtained elsewhere (for instance read back by
/// [`crate::quotient::basis_bytes::from_bytes`] and certified) with every later call of
/// [`groebner_basis`] for its n in this process; returns the basis now shared (the one
/// already held, if another was shared or built first).
pub fn share_basis(q: QuasiGroebner) -> Arc<QuasiGroebner> {
    let n = q.n();
    let q = Arc::new(q);
    match CACHE.get(n) {
        Some(cell) => cell.get_or_init(|| q).clone(),
        None => q,
    }
}

/// A normal form: the reduced polynomial and its coefficients on the standard monomials.
#[derive(Clone, Debug, PartialEq)]
pub struct NormalForm {
    /// The reduced polynomial (a combination of standard monomials).
    pub poly: RatPoly,
    /// (position in the basis, standard monomial, coefficient), nonzero only, in basis order.
    pub coefficients: Vec<(usize, Mono, BigRational)>,
}

impl NormalForm {
    /// The sum of the coefficients.
    pub fn coefficient_sum(&self) -> BigRational {
        self.coefficients
            .iter()
            .fold(BigRational::zero(), |s, (_, _, c)| s + c)
    }

    /// Whether every coefficient is >= 0.
    pub fn is_nonnegative(&self) -> bool {
        self.coefficients
            .iter()
            .all(|(_, _, c)| *c >= BigRational::zero())
    }
}

/// The normal form of f modulo J_n (f in at most n variables, any coefficients).
///
/// ```
/// use elbowroom_math::{poly::parse::parse_poly, quotient::normal_form::{groebner_basis, normal_form}};
/// let q = groebner_basis(3).unwrap();
/// // x1 ≡ -(x2 + x3), since x1 + x2 + x3 = M_(1) lies in J_3
/// let f = parse_poly("x1", Some(3)).unwrap();
/// assert_eq!(normal_form(&q, &f).unwrap().poly.to_text(), "-x2 - x3");
/// ```
pub fn normal_form<C: Coeff>(q: &QuasiGroebner, f: &Poly<C>) -> MathResult<NormalForm> {
    normal_form_by(q, f)
}

/// [`normal_form`] by either way of reducing ([`Reduction`]): the Gröbner basis or the
/// forest route.
pub fn normal_form_by<C: Coeff>(q: &dyn Reduction, f: &Poly<C>) -> MathResult<NormalForm> {
    let n = q.n();
    if f.nvars() > n && f.used_vars() > n {
        return Err(MathError::OutOfRange(format!(
            "the polynomial uses x{} but the quotient has only x1..x{n}",
            f.used_vars()
        )));
    }
    let rat: Vec<(Mono, BigRational)> = f
        .terms()
        .iter()
        .map(|(m, c)| (*m, c.to_rational()))
        .collect();
    let lcm = rat.iter().fold(BigInt::one(), |l, (_, c)| l.lcm(c.denom()));
    let ints: Vec<(Mono, BigInt)> = rat
        .iter()
        .map(|(m, c)| {
            (
                *m,
                (c * BigRational::from_integer(lcm.clone())).to_integer(),
            )
        })
        .collect();
    let coeffs = q.normal_form_with(&ints, &Progress::new(0))?;
    let basis = q.basis();
    let coefficients: Vec<(usize, Mono, BigRational)> = coeffs
        .into_iter()
        .map(|(i, c)| (i, basis[i], BigRational::new(c, lcm.clone())))
        .collect();
    let poly = RatPoly::from_terms(n, coefficients.iter().map(|(_, m, c)| (*m, c.clone())));
    Ok(NormalForm { poly, coefficients })
}

/// The graded dimensions of Q[x]/J_n: entry k counts the standard monomials of degree k.
///
/// ```
/// use elbowroom_math::quotient::normal_form::{groebner_basis, hilbert_series};
/// // n = 4: 1 + 3t + 5t^2 + 5t^3 (the Catalan triangle row, OEIS A009766)
/// assert_eq!(hilbert_series(&groebner_basis(4).unwrap()), vec![1, 3, 5, 5]);
/// ```
pub fn hilbert_series(q: &QuasiGroebner) -> Vec<usize> {
    graded_dimensions(q.basis())
}

/// The number of standard monomials of each degree (entry k: degree k), for any list of
/// them ([`Reduction::basis`]).
pub fn graded_dimensions(basis: &[Mono]) -> Vec<usize> {
    let mut h = Vec::new();
    for m in basis {
        let d = m.degree() as usize;
        if h.len() <= d {
            h.resize(d + 1, 0);
        }
        h[d] += 1;
    }
    h
}

/// Divided symmetrization of a polynomial f of degree n - 1 in x_1..x_n, read off its
/// normal form: DS_n(f) = (-1)^{n-1} · (sum of the coefficients of NF(f) on the standard
/// monomials). Terms of other degrees do not contribute (DS_n of a homogeneous polynomial
/// of degree ≠ n - 1 is 0 or not a constant; only the degree n - 1 part is used).
/// The identity rests on DS_n vanishing on J_n in degree n - 1 and taking the value
/// (-1)^{n-1} on every standard monomial of degree n - 1 (Nadeau–Tewari, from memory);
/// the tests check it against the definition of DS_n.
///
/// ```
/// use elbowroom_math::{poly::parse::parse_poly, quotient::normal_form::divsym_via_quotient};
/// // DS_2(x1) = x1/(x1 - x2) + x2/(x2 - x1) = 1
/// let f = parse_poly("x1", Some(2)).unwrap();
/// assert_eq!(divsym_via_quotient(&f, 2).unwrap().to_string(), "1");
/// ```
pub fn divsym_via_quotient<C: Coeff>(f: &Poly<C>, n: usize) -> MathResult<BigRational> {
    let q = groebner_basis(n)?;
    let part = f.homogeneous_part(n.saturating_sub(1) as u32);
    let nf = normal_form(&q, &part)?;
    let s = nf.coefficient_sum();
    Ok(if n.is_multiple_of(2) { -s } else { s })
}
