//! The mathematics: pure, exact, and independent of the rest of the crate.
//!
//! Nothing in here knows about the GUI, files or threads; every quantity
//! returned is exact (big integers or big rationals where values can grow).
//!
//! Grouped by subject, each group a module; arrows run only downward in this
//! list (a module uses the ones above it, never one below):
//!
//! 1. [`error`], [`progress`]: the shared error type and progress/cancel;
//!    [`limits`]: every limit of the mathematics, in one place.
//! 2. [`perms`]: permutations, their classes, reduced words, listings.
//! 3. [`poly`]: monomials, polynomials, compositions, quasisymmetric and
//!    symmetric polynomials, and the parser of typed polynomials.
//! 4. [`schubert`]: Schubert polynomials and the transition step.
//! 5. [`pipes`]: reduced pipe dreams (moves, traces) and bumpless pipe dreams.
//! 6. [`hessenberg`]: Hessenberg functions, divided symmetrization, tables.
//! 7. [`quotient`]: the quasisymmetric quotient Q[x]/J_n, lattice paths, surveys.
//! 8. [`permutohedra`]: permutohedron volumes and mixed Eulerian numbers.
//! 9. [`forest`]: forest polynomials, trimming, forest expansions, the forest
//!    basis of the quotient and a_w by trees.
//! 9. [`explain`]: why a_w is what it is (reduced words, rules, q-analogues).

pub mod error;
pub mod excerpt;
pub mod limits;
pub mod progress;
pub mod sizing;
pub mod typed_lists;

pub mod perms;
pub mod poly;

pub mod schubert;

pub mod pipes;

pub mod hessenberg;

pub mod quotient;

pub mod permutohedra;

pub mod explain;
pub mod forest;

pub use error::{MathError, MathResult};
pub use perms::perm::{MAX_N, Perm};
pub use poly::mono::{MAX_VARS, Mono};
pub use poly::polynomial::{Coeff, IntPoly, Poly, PolyBuilder, RatPoly};
pub use progress::Progress;
