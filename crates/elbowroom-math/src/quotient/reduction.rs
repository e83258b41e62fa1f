//! One shape for the two ways of computing normal forms modulo J_n on the standard
//! monomials: division by the Gröbner basis ([`QuasiGroebner`]) and the forest
//! route ([`ForestReducer`]). Surveys and normal forms take either.

use crate::error::MathResult;
use crate::poly::mono::Mono;
use crate::progress::Progress;
use crate::quotient::forest_route::ForestReducer;
use crate::quotient::groebner::QuasiGroebner;
use crate::quotient::normal_form::groebner_basis_with;
use num_bigint::BigInt;
use std::sync::Arc;

/// Normal forms modulo J_n on the standard monomials.
pub trait Reduction: Send + Sync {
    /// The number of variables.
    fn n(&self) -> usize;
    /// The standard monomials: by increasing degree, each degree in decreasing lex order.
    fn basis(&self) -> &[Mono];
    /// The normal form of Σ c·m as (basis position, coefficient) sorted by position;
    /// `None` when a coefficient would outgrow `i128`. Polls `check`.
    fn reduce_i128(
        &self,
        terms: &[(Mono, i128)],
        check: &dyn Fn() -> MathResult<()>,
    ) -> MathResult<Option<Vec<(u32, i128)>>>;
    /// The normal form of Σ c_m m as (basis position, coefficient), nonzero only, in basis
    /// order; checked `i128`, redone over `BigInt` on an overflow. Monomials in variables
    /// beyond x_n are an error.
    fn normal_form_with(
        &self,
        terms: &[(Mono, BigInt)],
        progress: &Progress,
    ) -> MathResult<Vec<(usize, BigInt)>>;
}

impl Reduction for QuasiGroebner {
    fn n(&self) -> usize {
        QuasiGroebner::n(self)
    }
    fn basis(&self) -> &[Mono] {
        QuasiGroebner::basis(self)
    }
    fn reduce_i128(
        &self,
        terms: &[(Mono, i128)],
        check: &dyn Fn() -> MathResult<()>,
    ) -> MathResult<Option<Vec<(u32, i128)>>> {
        self.reduce_small(terms.iter().copied(), check)
    }
    fn normal_form_with(
        &self,
        terms: &[(Mono, BigInt)],
        progress: &Progress,
    ) -> MathResult<Vec<(usize, BigInt)>> {
        QuasiGroebner::normal_form_with(self, terms, progress)
    }
}

impl Reduction for ForestReducer {
    fn n(&self) -> usize {
        ForestReducer::n(self)
    }
    fn basis(&self) -> &[Mono] {
        ForestReducer::basis(self)
    }
    fn reduce_i128(
        &self,
        terms: &[(Mono, i128)],
        check: &dyn Fn() -> MathResult<()>,
    ) -> MathResult<Option<Vec<(u32, i128)>>> {
        self.reduce_small(terms.iter().copied(), check)
    }
    fn normal_form_with(
        &self,
        terms: &[(Mono, BigInt)],
        progress: &Progress,
    ) -> MathResult<Vec<(usize, BigInt)>> {
        ForestReducer::normal_form_with(self, terms, progress)
    }
}

/// The largest n for which normal forms modulo J_n are computed (either way).
pub const MAX_NORMAL_FORM_N: usize = crate::quotient::groebner::MAX_QUOTIENT_N;

/// The default way of reducing modulo J_n: the Gröbner basis (built on first use, or the
/// one the program shared); callers who want the forest route make a [`ForestReducer`].
pub fn reducer_with(n: usize, progress: &Progress) -> MathResult<Arc<dyn Reduction>> {
    let q: Arc<dyn Reduction> = groebner_basis_with(n, progress)?;
    Ok(q)
}
