//! The typed errors of the mathematics core.

use thiserror::Error;

/// Everything that can go wrong in an exact computation: bad input, a size the
/// crate does not support, or a computation that was cancelled by its caller.
#[derive(Debug, Clone, PartialEq, Eq, Error)]
pub enum MathError {
    /// A permutation, code or word that does not describe a permutation.
    #[error("invalid permutation: {0}")]
    InvalidPermutation(String),
    /// A polynomial that could not be parsed; the message quotes the input and marks the column.
    #[error("{0}")]
    Parse(String),
    /// An input outside the supported range (too many variables, too large an exponent, ...).
    #[error("out of range: {0}")]
    OutOfRange(String),
    /// Any other malformed input (a Hessenberg function, a composition, ...).
    #[error("invalid input: {0}")]
    InvalidInput(String),
    /// The computation was cancelled before it finished.
    #[error("canceled")]
    Canceled,
}

/// Shorthand for results of the mathematics core.
pub type MathResult<T> = Result<T, MathError>;
