//! `elbowroom schubert W`: the Schubert polynomial S_w.

use super::args::SchubertArgs;
use super::error::CliError;
use super::json;
use crate::math::schubert::polynomial::schubert;
use crate::math::schubert::principal::principal_specialization;
use serde_json::json;

/// Runs the command.
pub fn run(args: &SchubertArgs) -> Result<String, CliError> {
    let w = args.perm.clone();
    crate::math::sizing::check_schubert(&w)?;
    let s = schubert(&w);
    let principal = args.principal.then(|| principal_specialization(&s));
    if args.output.json {
        let mut v = json!({
            "perm": w.one_line(),
            "polynomial": json::poly(&s),
        });
        if let Some(p) = &principal {
            v["principal"] = json!(p.coeff_strings());
            v["at_ones"] = json::exact(&p.at_one());
        }
        return Ok(json::render(&v));
    }
    let tail = match &principal {
        Some(p) => format!(
            "\nS_{w}(1, q, q^2, ...) = {p}\nS_{w}(1, ..., 1) = {}",
            p.at_one()
        ),
        None => String::new(),
    };
    if args.output.latex {
        return Ok(format!("\\mathfrak{{S}}_{{{w}}} = {}{tail}", s.to_latex()));
    }
    Ok(format!("S_{w} = {s}{tail}"))
}
