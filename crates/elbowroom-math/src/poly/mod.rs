//! Polynomials with exact coefficients, in layers: exact rationals as typed,
//! packed monomials, sparse polynomials, compositions, quasisymmetric and
//! symmetric polynomials, and at the top the parser of typed polynomials
//! (which knows `M(..)` and `F(..)`).

pub mod rational;

pub mod mono;
pub mod polynomial;

pub mod compositions;
pub mod qpoly;
pub mod quasisym;
pub mod symmetric;

pub mod parse;
