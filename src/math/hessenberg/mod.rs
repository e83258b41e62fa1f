//! Hessenberg functions and their classes: the function h itself, divided
//! symmetrization DS_h, and tables of the coefficients a^h_w = DS_h(S_w).

pub mod function;

pub mod divsym;

pub mod table;
