//! Hessenberg functions and their classes: the function h itself, divided
//! symmetrization DS_h, tables of the coefficients a^h_w = DS_h(S_w) by DS_h
//! and by the class Q_h itself, the choice between them, and the sweep over
//! every h of a given n; the reference tables by DS_h with the `reference` feature.

pub mod function;

pub mod divsym;

pub mod table;

#[cfg(feature = "reference")]
pub mod reference;

pub mod class;

pub mod rows;

pub mod coefficients;

pub mod sweep;
