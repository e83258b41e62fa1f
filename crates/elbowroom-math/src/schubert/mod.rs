//! Schubert polynomials and the Schubert basis, in layers:
//!
//! - [`transition`]: the transition step, written once.
//! - [`polynomial`]: Schubert polynomials by transition (memoized) and by divided differences.
//! - [`principal`]: the principal specialization S_w(1, q, q², …).
//! - [`vector`]: sparse vectors Σ c_w S_w (stable or in H*(Fl_n)) and Monk's rule.
//! - [`flat`]: classes in H*(Fl_n) as flat bucketed vectors, Monk steps on every core.
//! - [`expansion`]: the Schubert expansion of a polynomial, and of a product of linear forms.
//! - [`product`]: structure constants S_u · S_v = Σ c^w_{uv} S_w.

pub mod transition;

pub mod polynomial;
pub mod principal;

pub mod vector;

pub mod flat;

pub mod expansion;
pub mod product;
