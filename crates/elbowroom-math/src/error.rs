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
    /// A typed expression that could not be read: the input, the 1-based column
    /// (in characters) where reading stopped, and what was expected there.
    #[error("cannot read \"{input}\" at column {column}: {expected}; marked: \"{marked}\"")]
    Syntax {
        /// The text as typed.
        input: String,
        /// 1-based character column of the problem.
        column: usize,
        /// What was wrong and what is accepted there.
        expected: String,
        /// The input with `⟦⟧` around the character at the column (`⟦⟧` at the end when input ran out).
        marked: String,
    },
    /// An input outside the supported range (too many variables, too large an exponent, ...).
    #[error("out of range: {0}")]
    OutOfRange(String),
    /// Any other malformed input (a Hessenberg function, a composition, ...).
    #[error("invalid input: {0}")]
    InvalidInput(String),
    /// A computation past its documented size, refused before it starts: the
    /// message names the estimate and the limit ([`crate::sizing`]).
    #[error("{0}")]
    TooLarge(String),
    /// The computation was cancelled before it finished.
    #[error("canceled")]
    Canceled,
}

/// Shorthand for results of the mathematics core.
pub type MathResult<T> = Result<T, MathError>;
