//! Lists as users type them, `a,b,c` or `a b c` (or both): the one reader of
//! their entries, and λ read from one. The commands and the Python module both
//! call it, so they refuse alike; the messages name the command-line flag the
//! list came from.

use crate::limits::MAX_N;
use crate::poly::rational::parse_rational;
use crate::{MathError, MathResult};
use num_rational::BigRational;

/// The entries of a list typed as `a,b,c` or `a b c`: between two commas, and
/// before or after one, there must be an entry (`1,,2` and `1,2,` are refused
/// rather than read as 1,2), with [`MathError::Parse`] naming `name` and what
/// is `accepted`.
///
/// ```
/// use elbowroom_math::typed_lists::entries;
/// assert_eq!(entries("3, 1 2", "--h", "h").unwrap(), ["3", "1", "2"]);
/// assert_eq!(
///     entries("1,,2", "--h", "h(1),...,h(n)").unwrap_err().to_string(),
///     "--h has an empty entry (entry 2 of 3); give h(1),...,h(n)"
/// );
/// ```
pub fn entries<'a>(text: &'a str, name: &str, accepted: &str) -> MathResult<Vec<&'a str>> {
    let mut out = Vec::new();
    let pieces: Vec<&str> = text.split(',').collect();
    for (k, piece) in pieces.iter().enumerate() {
        if piece.trim().is_empty() {
            let problem = if pieces.len() == 1 {
                "is empty".to_string()
            } else {
                format!("has an empty entry (entry {} of {})", k + 1, pieces.len())
            };
            return Err(MathError::Parse(format!(
                "{name} {problem}; give {accepted}"
            )));
        }
        out.extend(piece.split_whitespace());
    }
    Ok(out)
}

/// λ = (λ_1, ..., λ_m) from `l1,...,lm` (`--lambda`), m ≤ [`MAX_N`], each entry
/// an exact rational as [`parse_rational`] reads it.
///
/// ```
/// use elbowroom_math::typed_lists::lambda;
/// let l: Vec<String> = lambda("3, 1/2 0.25").unwrap().iter().map(|v| v.to_string()).collect();
/// assert_eq!(l, ["3", "1/2", "1/4"]);
/// ```
pub fn lambda(text: &str) -> MathResult<Vec<BigRational>> {
    let parts = entries(
        text,
        "--lambda",
        "λ_1,...,λ_n as rationals, for example 3,1/2,0",
    )?;
    if parts.len() > MAX_N {
        return Err(MathError::Parse(format!(
            "--lambda has {} entries; λ has 1 to {MAX_N} entries",
            parts.len()
        )));
    }
    parts.iter().map(|p| parse_rational(p)).collect()
}
