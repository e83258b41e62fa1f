//! `elbowroom schubert W`: the Schubert polynomial S_w.

use super::args::SchubertArgs;
use super::error::CliError;
use super::json;
use crate::math::schubert::polynomial::schubert;
use serde_json::json;

/// Runs the command.
pub fn run(args: &SchubertArgs) -> Result<String, CliError> {
    let w = args.perm.clone();
    crate::math::sizing::check_schubert(&w)?;
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
