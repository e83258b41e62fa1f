//! `elbowroom quotient --n N`: the quasisymmetric quotient Q[x_1..x_n]/J_n — its basis of
//! standard monomials (with their lattice paths), graded dimensions and Gröbner basis.

use super::args::QuotientArgs;
use super::error::CliError;
use super::interrupt;
use super::json;
use super::json::PolyRecord;
use crate::math::quotient::groebner::quotient_n_refusal;
use crate::math::quotient::lattice_path::{LatticePath, Step};
use crate::math::quotient::normal_form::hilbert_series;
use serde::Serialize;

/// A lattice path as JSON: its size, monomial, the word of its steps and,
/// per step, the variable it carries (or null).
#[derive(Serialize)]
pub struct PathRecord<'a> {
    size: usize,
    monomial: &'a [u32],
    steps: String,
    labels: Vec<Option<usize>>,
}

/// The record of a path.
pub fn path_json(p: &LatticePath) -> PathRecord<'_> {
    PathRecord {
        size: p.size,
        monomial: &p.exponents,
        steps: p.word(),
        labels: p
            .steps
            .iter()
            .map(|s| match s {
                Step::North { var: Some(i) } => Some(*i),
                _ => None,
            })
            .collect(),
    }
}

/// The JSON of `quotient`.
#[derive(Serialize)]
struct QuotientRecord<'a> {
    n: usize,
    order: &'static str,
    dimension: String,
    basis: &'a [Vec<u32>],
    hilbert: Vec<usize>,
    groebner_size: usize,
    groebner: Vec<PolyRecord>,
    paths: Vec<PathRecord<'a>>,
}

pub fn run(args: &QuotientArgs) -> Result<String, CliError> {
    if args.no_cache {
        crate::basis_cache::disable();
    }
    let n = args.n;
    if let Some(refusal) = quotient_n_refusal(n) {
        return Err(CliError::Input(refusal));
    }
    let q = interrupt::run_interruptible(&format!("the basis of J_{n}"), "steps", 0, |progress| {
        crate::basis_cache::basis_with(n, progress)
    })?;
    let hilbert = hilbert_series(&q);
    let basis: Vec<Vec<u32>> = q.basis().iter().map(|m| m.exps(n)).collect();
    let mut paths = Vec::with_capacity(basis.len());
    for e in &basis {
        paths.push(LatticePath::of_monomial(e)?);
    }
    let gb = q.polys();
    if args.output.json {
        return json::text(&QuotientRecord {
            n,
            order: "lex, x1 > x2 > ... > xn",
            dimension: q.basis().len().to_string(),
            basis: &basis,
            hilbert,
            groebner_size: gb.len(),
            groebner: gb.iter().map(PolyRecord::of).collect(),
            paths: paths.iter().map(path_json).collect(),
        });
    }
    let mut out = String::new();
    out.push_str(&format!(
        "Q[x1..x{n}]/J_{n}, lex order x1 > ... > x{n}\ndimension {} (standard monomials x^e with e1+...+ei <= i-1)\n",
        q.basis().len()
    ));
    out.push_str("\ndegree  dimension\n");
    for (d, h) in hilbert.iter().enumerate() {
        out.push_str(&format!("{d:>6}  {h:>9}\n"));
    }
    out.push_str(&format!(
        "\nreduced Gröbner basis ({} elements):\n",
        gb.len()
    ));
    for p in &gb {
        out.push_str(&format!("  {p}\n"));
    }
    let draw = args.draw || n <= 4;
    out.push_str("\nbasis (monomial, path word; E = east, N = north)\n");
    for (m, p) in q.basis().iter().zip(&paths) {
        let mono = m.text(n);
        out.push_str(&format!("  {mono:<16} {}\n", p.word()));
        if draw {
            for line in p.ascii().lines() {
                out.push_str(&format!("      {line}\n"));
            }
        }
    }
    Ok(out)
}
