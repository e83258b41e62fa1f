//! `elbowroom schubert W`: the Schubert polynomial S_w.

use super::args::SchubertArgs;
use super::error::CliError;
use super::json;
use crate::math::limits::SCHUBERT_TERM_LIMIT;
use crate::math::pipes::dream::term_bound;
use crate::math::{Perm, schubert::polynomial::schubert};
use serde_json::json;

/// Runs the command.
pub fn run(args: &SchubertArgs) -> Result<String, CliError> {
    let w = Perm::parse(&args.perm)?;
    let bound = term_bound(&w);
    if bound > SCHUBERT_TERM_LIMIT {
        return Err(CliError::Input(format!(
            "S_{w} may have up to {bound} terms (its pipe dreams, or the monomials under the staircase of degree {}); at most {SCHUBERT_TERM_LIMIT} are accepted",
            w.length()
        )));
    }
    let s = schubert(&w);
    if args.json {
        return Ok(json::render(&json!({
            "perm": w.one_line(),
            "polynomial": json::poly(&s),
        })));
    }
    if args.latex {
        return Ok(format!("\\mathfrak{{S}}_{{{w}}} = {}", s.to_latex()));
    }
    Ok(format!("S_{w} = {s}"))
}
