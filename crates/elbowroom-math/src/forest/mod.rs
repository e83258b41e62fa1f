//! Forest polynomials (Nadeau–Tewari, "Forest polynomials and the class of the
//! permutahedral variety", 2024; Nadeau–Spink–Tewari, "Quasisymmetric divided
//! differences", 2024): indexed forests and their codes, P_F by labelings,
//! the trimming operators T_i, the expansion f = Σ ε(T_F f) P_F, Schubert
//! polynomials in the forest basis, the forest basis of Q[x_1..x_n]/J_n, and
//! a_w by trees.
//!
//! In the arrows of [`crate`], this group sits below `schubert`, `pipes`
//! and `quotient`: it uses polynomials, Schubert polynomials and the term
//! bound of pipe dreams, and nothing uses it. It needs no Gröbner basis.

pub mod indexed;

pub mod polynomial;
pub mod trimming;

pub mod expansion;

pub mod quotient;
pub mod schubert;
pub mod trees;
