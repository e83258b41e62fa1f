//! Reading the inputs several commands share: `--n` with `--h` (divsym,
//! hessenberg) and λ as `l1,...,ln` (volume, figure permutohedron and volume).

use super::error::CliError;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::poly::rational::parse_rational;
use num_rational::BigRational;

/// Reads `--n` and `--h` into a Hessenberg function (default h(i) = i + 1, [`HessenbergFn::default_for`]).
pub fn hessenberg_from_args(n: usize, h: Option<&str>) -> Result<HessenbergFn, CliError> {
    if n == 0 || n > crate::math::MAX_N {
        return Err(CliError::Input(format!(
            "--n {n} is out of range; 1 <= n <= {} is accepted",
            crate::math::MAX_N
        )));
    }
    Ok(match h {
        Some(text) => HessenbergFn::parse(text, Some(n))?,
        None => HessenbergFn::default_for(n)?,
    })
}

/// Parses `l1,...,ln` (commas or spaces between the entries), each entry an
/// exact rational as [`parse_rational`] reads it.
pub fn parse_lambda(text: &str) -> Result<Vec<BigRational>, CliError> {
    let parts: Vec<&str> = text.split([',', ' ']).filter(|s| !s.is_empty()).collect();
    if parts.is_empty() {
        return Err(CliError::Input(
            "--lambda is empty; give λ_1,...,λ_n as rationals, for example 3,1/2,0".into(),
        ));
    }
    parts
        .iter()
        .map(|p| parse_rational(p).map_err(CliError::from))
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn lambda_entries_are_exact() {
        let l = parse_lambda("3, 1/2 -1 0.25").unwrap_or_default();
        let shown: Vec<String> = l.iter().map(|v| v.to_string()).collect();
        assert_eq!(shown, ["3", "1/2", "-1", "1/4"]);
        assert!(parse_lambda(" , ").is_err());
        assert_eq!(
            parse_lambda("1,x").map_err(|e| e.message().to_string()),
            Err("'x' is not a rational number; accepted: integers, fractions p/q and decimals (3, -3/2, 0.25)".into())
        );
    }
}
