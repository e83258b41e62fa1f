//! `elbowroom expand POLY --n N [--stable] [--json]`: the Schubert expansion
//! of a typed polynomial, its class in H*(Fl_N) (every w in S_N, written with N
//! entries) or, with `--stable`, its unique expansion in Q[x_1..x_N] over S_∞
//! (each w in the smallest S_m that holds it; the identity is `[1]`). Terms by
//! length, then lexicographically. A product of powers of linear forms goes
//! through Monk's rule and is never multiplied out.

use super::args::ExpandArgs;
use super::error::CliError;
use super::expansion_text::{sum_text, terms_json};
use super::interrupt;
use super::json;
use crate::math::schubert::expansion::expand_typed;
use serde_json::json;

/// Runs the command.
pub fn run(args: &ExpandArgs) -> Result<String, CliError> {
    let expansion = interrupt::run_interruptible("the expansion", "steps", 0, |progress| {
        expand_typed(&args.poly, args.n, args.stable, progress)
    })?;
    if args.json {
        return Ok(json::render(&json!({
            "n": args.n,
            "stable": args.stable,
            "terms": terms_json(&expansion.terms),
            "nonnegative": expansion.is_nonnegative(),
        })));
    }
    let space = if args.stable {
        format!("in Q[x1..x{}], over S_∞", args.n)
    } else {
        format!("in H*(Fl_{})", args.n)
    };
    let count = expansion.terms.len();
    Ok(format!(
        "{} = {}\n  ({space}; {count} {}, {})",
        args.poly.trim(),
        sum_text(&expansion.terms),
        if count == 1 { "term" } else { "terms" },
        if expansion.is_nonnegative() {
            "all coefficients nonnegative"
        } else {
            "some coefficient negative"
        }
    ))
}
