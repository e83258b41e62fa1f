//! Reading the inputs several commands share: `--n` with `--h` (divsym,
//! hessenberg) and λ as `l1,...,ln` (volume, figure permutohedron and volume).

use super::args::HessenbergArg;
use super::error::CliError;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::permutohedra::permutohedron::Permutohedron;
use crate::math::poly::rational::parse_rational;
use num_rational::BigRational;

/// Reads `--n` (1 to `max_n`) and `--h` into a Hessenberg function (default
/// h(i) = i + 1, [`HessenbergFn::default_for`]); h must have n entries.
pub fn hessenberg_from_args(
    n: usize,
    h: Option<&HessenbergArg>,
    max_n: usize,
) -> Result<HessenbergFn, CliError> {
    if n == 0 || n > max_n {
        return Err(CliError::Input(format!(
            "--n {n} is out of range; 1 <= n <= {max_n} is accepted"
        )));
    }
    Ok(match h {
        Some(typed) => {
            entries(&typed.typed, "--h", "h(1),...,h(n), for example 2,3,4,4")?;
            typed.for_n(Some(n))?
        }
        None => HessenbergFn::default_for(n)?,
    })
}

/// Parses `l1,...,ln` (commas or spaces between the entries), each entry an
/// exact rational as [`parse_rational`] reads it.
pub fn parse_lambda(text: &str) -> Result<Vec<BigRational>, CliError> {
    let parts = entries(
        text,
        "--lambda",
        "λ_1,...,λ_n as rationals, for example 3,1/2,0",
    )?;
    if parts.len() > crate::math::MAX_N {
        return Err(CliError::Input(format!(
            "--lambda has {} entries; λ has 1 to {} entries",
            parts.len(),
            crate::math::MAX_N
        )));
    }
    parts
        .iter()
        .map(|p| parse_rational(p).map_err(CliError::from))
        .collect()
}

/// Refuses a volume computation whose numbers would be too long
/// ([`crate::math::sizing::check_volume`], the check the window makes too).
pub fn check_volume_size(p: &Permutohedron, extra: u64, what: &str) -> Result<(), CliError> {
    Ok(crate::math::sizing::check_volume(p, extra, what)?)
}

/// The entries of a list typed as `a,b,c` or `a b c` (or both): between two
/// commas, and before or after one, there must be an entry (`1,,2` and `1,2,`
/// are refused rather than read as 1,2).
pub fn entries<'a>(text: &'a str, name: &str, accepted: &str) -> Result<Vec<&'a str>, CliError> {
    let mut out = Vec::new();
    let pieces: Vec<&str> = text.split(',').collect();
    for (k, piece) in pieces.iter().enumerate() {
        if piece.trim().is_empty() {
            let problem = if pieces.len() == 1 {
                "is empty".to_string()
            } else {
                format!("has an empty entry (entry {} of {})", k + 1, pieces.len())
            };
            return Err(CliError::Input(format!(
                "{name} {problem}; give {accepted}"
            )));
        }
        out.extend(piece.split_whitespace());
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn lambda_entries_are_exact() {
        let l = parse_lambda("3, 1/2 -1 0.25").unwrap_or_default();
        let shown: Vec<String> = l.iter().map(|v| v.to_string()).collect();
        assert_eq!(shown, ["3", "1/2", "-1", "1/4"]);
        assert!(parse_lambda(" , ").is_err_and(|e| matches!(e, CliError::Input(_))));
        for bad in ["1,,2", "1,2,", ",1", ""] {
            let e = parse_lambda(bad).map_err(|e| e.message().to_string());
            assert!(
                e.as_ref().is_err_and(|m| m.contains("empty")),
                "{bad:?}: {e:?}"
            );
        }
        assert!(
            parse_lambda(&vec!["1"; 17].join(",")).is_err_and(|e| matches!(e, CliError::Input(_)))
        );
        assert_eq!(
            parse_lambda("1,x").map_err(|e| e.message().to_string()),
            Err("'x' is not a rational number; accepted: integers, fractions p/q and decimals (3, -3/2, 0.25)".into())
        );
    }
}
