//! Reading the inputs several commands share: `--n` with `--h` (divsym,
//! hessenberg) and λ as `l1,...,ln` (volume, figure permutohedron and volume).

use super::args::HessenbergArg;
use super::error::CliError;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::permutohedra::permutohedron::Permutohedron;
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
/// exact rational ([`crate::math::typed_lists::lambda`]).
pub fn parse_lambda(text: &str) -> Result<Vec<BigRational>, CliError> {
    crate::math::typed_lists::lambda(text).map_err(typed)
}

/// A refusal of the list reader as the commands' own bad input (exit status 2,
/// the message as it is).
fn typed(e: crate::math::MathError) -> CliError {
    match e {
        crate::math::MathError::Parse(m) => CliError::Input(m),
        other => other.into(),
    }
}

/// The entries of a list typed as `a,b,c` or `a b c`
/// ([`crate::math::typed_lists::entries`]).
pub fn entries<'a>(text: &'a str, name: &str, accepted: &str) -> Result<Vec<&'a str>, CliError> {
    crate::math::typed_lists::entries(text, name, accepted).map_err(typed)
}

/// Refuses a volume computation whose numbers would be too long
/// ([`crate::math::sizing::check_volume`], the check the window makes too).
pub fn check_volume_size(p: &Permutohedron, extra: u64, what: &str) -> Result<(), CliError> {
    Ok(crate::math::sizing::check_volume(p, extra, what)?)
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
