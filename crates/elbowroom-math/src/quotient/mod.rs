//! The quotient Q[x_1..x_n]/J_n by the quasisymmetric ideal: its standard
//! monomials, its lex Gröbner basis, division by it, normal forms on the standard
//! monomials, their lattice paths, and positivity surveys of Schubert polynomials modulo J_n.

pub mod standard;

pub mod basis_by_forests;
pub mod basis_bytes;
pub mod certificate;
pub mod degree_division;
pub mod division;
pub mod elimination;
pub mod forest_route;
pub mod groebner;
pub mod lattice_path;
pub mod modp;

pub mod normal_form;
pub mod reduction;

pub mod survey;
