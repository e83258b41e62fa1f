//! `elbowroom reduce POLY --n N`: the normal form of a polynomial modulo J_n and its
//! coefficients on the standard monomials (the lattice-path basis); with
//! `--forest`, also its class in the forest basis.

use super::args::ReduceArgs;
use super::cmd_forest::{ForestTerm, sum_text, table_text, terms_json};
use super::error::CliError;
use super::interrupt;
use super::json;
use super::json::PolyRecord;
use crate::math::forest::quotient::forest_normal_form;
use crate::math::poly::parse::parse_poly;
use crate::math::quotient::forest_route::ForestReducer;
use crate::math::quotient::normal_form::normal_form_by;
use crate::math::quotient::reduction::{MAX_NORMAL_FORM_N, Reduction};
use serde::Serialize;

/// One coefficient of the normal form, on a standard monomial.
#[derive(Serialize)]
struct StandardTerm {
    monomial: Vec<u32>,
    basis_index: usize,
    value: String,
}

/// The JSON of `reduce`; the forest basis with `--forest`.
#[derive(Serialize)]
struct ReduceRecord {
    n: usize,
    input: PolyRecord,
    normal_form: PolyRecord,
    coefficients: Vec<StandardTerm>,
    sum: String,
    #[serde(skip_serializing_if = "Option::is_none")]
    forest: Option<Vec<ForestTerm<'static>>>,
}

pub fn run(args: &ReduceArgs) -> Result<String, CliError> {
    if args.no_cache {
        crate::basis_cache::disable();
    }
    let n = args.n;
    if n == 0 || n > MAX_NORMAL_FORM_N {
        return Err(CliError::Input(format!(
            "--n {n} is out of range; normal forms modulo J_n are computed for n from 1 to {MAX_NORMAL_FORM_N}"
        )));
    }
    let f = parse_poly(&args.poly, Some(n))?;
    let q: std::sync::Arc<dyn Reduction> = if args.by_forests {
        std::sync::Arc::new(ForestReducer::new(n)?)
    } else {
        interrupt::run_interruptible(&format!("the basis of J_{n}"), "steps", 0, |progress| {
            crate::basis_cache::reducer_with(n, progress)
        })?
    };
    let nf = normal_form_by(q.as_ref(), &f)?;
    let forest = if args.forest {
        Some(interrupt::run_interruptible(
            "the class in the forest basis",
            "steps",
            0,
            |progress| forest_normal_form(&f, n, progress),
        )?)
    } else {
        None
    };
    if args.output.json {
        return json::text(&ReduceRecord {
            n,
            input: PolyRecord::of(&f),
            normal_form: PolyRecord::of(&nf.poly),
            coefficients: nf
                .coefficients
                .iter()
                .map(|(i, m, c)| StandardTerm {
                    monomial: m.exps(n),
                    basis_index: *i,
                    value: c.to_string(),
                })
                .collect(),
            sum: nf.coefficient_sum().to_string(),
            forest: forest.as_ref().map(|terms| terms_json(terms, "value")),
        });
    }
    let mut out = format!("f        = {f}\nNF(f)    = {}\n", nf.poly);
    out.push_str(&format!(
        "sum of coefficients {}\n\ncoefficient  standard monomial\n",
        nf.coefficient_sum()
    ));
    for (_, m, c) in &nf.coefficients {
        out.push_str(&format!("{:>11}  {}\n", c.to_string(), m.text(n)));
    }
    if let Some(terms) = &forest {
        out.push_str(&format!(
            "\nin the forest basis (forests with leaves in 1..{n}): {}\n",
            sum_text(terms)
        ));
        out.push_str(&table_text(terms, "value"));
    }
    Ok(out)
}
