//! The mathematics: pure, exact, and independent of the rest of the crate.
//!
//! Nothing in here knows about the GUI, files or threads; every quantity
//! returned is exact (big integers or big rationals where values can grow).

pub mod bumpless;
pub mod divsym;
pub mod error;
pub mod groebner;
pub mod hessenberg;
pub mod hessenberg_table;
pub mod lattice_path;
pub mod mixed_eulerian;
pub mod mono;
pub mod parse;
pub mod perm;
pub mod perm_class;
pub mod permutohedron;
pub mod pipe_dream;
pub mod pipe_moves;
pub mod pipe_trace;
pub mod poly;
pub mod progress;
pub mod quasisym;
pub mod quotient;
pub mod schubert;
pub mod survey;
pub mod symmetric;
pub mod words;

pub use error::{MathError, MathResult};
pub use mono::{MAX_VARS, Mono};
pub use perm::{MAX_N, Perm};
pub use poly::{Coeff, IntPoly, Poly, PolyBuilder, RatPoly};
pub use progress::Progress;
