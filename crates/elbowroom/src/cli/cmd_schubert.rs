//! `elbowroom schubert W`: the Schubert polynomial S_w.

use super::args::SchubertArgs;
use super::error::CliError;
use super::json;
use super::json::PolyRecord;
use crate::math::schubert::polynomial::schubert;
use crate::math::schubert::principal::principal_specialization;
use serde::Serialize;

/// The JSON of `schubert`; the principal specialization with `--principal`.
#[derive(Serialize)]
struct SchubertRecord {
    perm: Vec<usize>,
    polynomial: PolyRecord,
    #[serde(skip_serializing_if = "Option::is_none")]
    principal: Option<Vec<String>>,
    #[serde(skip_serializing_if = "Option::is_none")]
    at_ones: Option<String>,
}

pub fn run(args: &SchubertArgs) -> Result<String, CliError> {
    let w = args.perm.clone();
    crate::math::sizing::check_schubert(&w)?;
    let s = schubert(&w);
    let principal = args.principal.then(|| principal_specialization(&s));
    if args.output.json {
        return json::text(&SchubertRecord {
            perm: w.one_line(),
            polynomial: PolyRecord::of(&s),
            principal: principal.as_ref().map(|p| p.coeff_strings()),
            at_ones: principal.as_ref().map(|p| p.at_one().to_string()),
        });
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
