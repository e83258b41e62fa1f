//! Reading one exact rational as typed: an integer (`3`, `-2`), a fraction
//! (`-3/2`, spaces allowed around the slash) or a decimal (`0.25`, `-.5`).
//! The one reader of λ entries, for the commands and the explorer alike; a
//! decimal needs a digit after its point (`1.` is refused).

use crate::error::{MathError, MathResult};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::Zero;

/// Parses one exact rational: `3`, `-3/2` or `0.25` (surrounding spaces ignored).
///
/// ```
/// use elbowroom_math::poly::rational::parse_rational;
/// assert_eq!(parse_rational("-3/2").unwrap().to_string(), "-3/2");
/// assert_eq!(parse_rational(" 1.25 ").unwrap().to_string(), "5/4");
/// assert!(parse_rational("1.").is_err());
/// assert_eq!(parse_rational("1/0").unwrap_err().to_string(), "'1/0' divides by zero");
/// ```
pub fn parse_rational(text: &str) -> MathResult<BigRational> {
    let t = text.trim();
    let bad = || {
        MathError::Parse(format!(
            "'{t}' is not a rational number; accepted: integers, fractions p/q and decimals (3, -3/2, 0.25)"
        ))
    };
    if let Some((p, q)) = t.split_once('/') {
        let p: BigInt = p.trim().parse().map_err(|_| bad())?;
        let q: BigInt = q.trim().parse().map_err(|_| bad())?;
        if q.is_zero() {
            return Err(MathError::Parse(format!("'{t}' divides by zero")));
        }
        return Ok(BigRational::new(p, q));
    }
    if let Some((whole, frac)) = t.split_once('.') {
        return decimal(whole, frac).ok_or_else(bad);
    }
    let v: BigInt = t.parse().map_err(|_| bad())?;
    Ok(BigRational::from_integer(v))
}

/// An unsigned number as the polynomial reader's lexer cuts it out of a typed
/// polynomial: ASCII digits with at most one point, a digit after the point
/// (`3`, `0.25`, `.5`; `1.` and `1.2.3` are refused). Its decimal part is read
/// by the same [`decimal`] as [`parse_rational`]'s.
pub(crate) fn unsigned_number(text: &str) -> Option<BigRational> {
    match text.split_once('.') {
        None => text.parse::<BigInt>().ok().map(BigRational::from_integer),
        Some((_, frac)) if frac.contains('.') => None,
        Some((whole, frac)) => decimal(whole, frac),
    }
}

/// `whole.frac` with at least one digit in `frac` (`whole` may be empty or `-`).
fn decimal(whole: &str, frac: &str) -> Option<BigRational> {
    let negative = whole.trim_start().starts_with('-');
    if frac.is_empty() || !frac.chars().all(|c| c.is_ascii_digit()) {
        return None;
    }
    let w: BigInt = if whole.is_empty() || whole == "-" {
        BigInt::zero()
    } else {
        whole.parse().ok()?
    };
    let f: BigInt = frac.parse().ok()?;
    let scale = num_traits::pow(BigInt::from(10), frac.len());
    let mag = BigRational::new(f, scale);
    let base = BigRational::from_integer(w);
    Some(if negative { base - mag } else { base + mag })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn read(t: &str) -> String {
        parse_rational(t).map_or_else(|e| format!("error: {e}"), |r| r.to_string())
    }

    #[test]
    fn integers_fractions_and_decimals() {
        assert_eq!(read("3"), "3");
        assert_eq!(read(" -2 "), "-2");
        assert_eq!(read("3 / 2"), "3/2");
        assert_eq!(read("-3/2"), "-3/2");
        assert_eq!(read("0.25"), "1/4");
        assert_eq!(read("-1.5"), "-3/2");
        assert_eq!(read("-.5"), "-1/2");
        assert_eq!(read("-0.5"), "-1/2");
    }

    #[test]
    fn what_is_refused_and_how() {
        let bad = "is not a rational number; accepted: integers, fractions p/q and decimals (3, -3/2, 0.25)";
        for t in ["1.", "x", "", "1.5/2", "1.-5", "1e3"] {
            assert_eq!(read(t), format!("error: '{t}' {bad}"), "{t:?}");
        }
        assert_eq!(read("2/0"), "error: '2/0' divides by zero");
    }

    #[test]
    fn unsigned_numbers_of_the_polynomial_reader() {
        let read = |t: &str| unsigned_number(t).map(|r| r.to_string());
        assert_eq!(read("3").as_deref(), Some("3"));
        assert_eq!(read("0.25").as_deref(), Some("1/4"));
        assert_eq!(read(".5").as_deref(), Some("1/2"));
        assert_eq!(read("007.50").as_deref(), Some("15/2"));
        for t in ["1.", ".", "1.2.3", "..5", ""] {
            assert_eq!(read(t), None, "{t:?}");
        }
        // the same value as the rational reader wherever both read the text
        for t in ["12", "0.125", "3.0", "10.01"] {
            assert_eq!(
                unsigned_number(t).unwrap(),
                parse_rational(t).unwrap(),
                "{t:?}"
            );
        }
    }
}
