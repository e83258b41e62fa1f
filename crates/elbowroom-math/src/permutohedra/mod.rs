//! Permutohedra P_λ: exact volumes by divided symmetrization, vertices and
//! drawings, and mixed Eulerian numbers.

pub mod permutohedron;

pub mod segment;

pub mod drawing;

pub mod mixed_eulerian;

pub mod remixed;
