//! Polynomials with exact coefficients, in layers: packed monomials,
//! sparse polynomials, quasisymmetric and symmetric polynomials, and at the
//! top the parser of typed polynomials (which knows `M(..)` and `F(..)`).

pub mod mono;
pub mod polynomial;

pub mod quasisym;
pub mod symmetric;

pub mod parse;

pub mod rational;
