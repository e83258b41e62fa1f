//! Schubert polynomials: by transition (memoized) and by divided differences.

pub mod polynomial;
