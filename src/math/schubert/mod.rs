//! Schubert polynomials: the transition step, and the polynomials by
//! transition (memoized) and by divided differences.

pub mod transition;

pub mod polynomial;
