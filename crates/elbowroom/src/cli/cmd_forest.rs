//! `elbowroom forest`: forest polynomials. `--code c1,c2,…` gives P_F;
//! a permutation W gives the forest expansion of S_w; `--poly P --n N` the
//! forest expansion of any polynomial in Q[x1..xN]. Forests are written in a
//! one-line notation: each nontrivial tree in parentheses over its leaves.

use super::args::ForestArgs;
use super::error::CliError;
use super::inputs::entries;
use super::interrupt;
use super::json;
use super::json::PolyRecord;
use crate::math::forest::expansion::{ForestTerms, check_expansion_size, forest_expansion};
use crate::math::forest::indexed::{Forest, code_text};
use crate::math::forest::polynomial::forest_polynomial;
use crate::math::forest::schubert::{is_single, schubert_forest_expansion};
use crate::math::forest::trees::{a_w_by_trees, a_w_sum};
use crate::math::poly::mono::MAX_VARS;
use crate::math::poly::parse::parse_poly;
use crate::math::{Coeff, Perm};
use serde::Serialize;

pub fn run(args: &ForestArgs) -> Result<String, CliError> {
    if let Some(code) = &args.code {
        return run_code(code, args.output.json);
    }
    if let Some(poly) = &args.poly {
        let Some(n) = args.n else {
            return Err(CliError::Input(
                "--poly needs --n N, the number of variables".into(),
            ));
        };
        return run_poly(poly, n, args.output.json);
    }
    let Some(w) = &args.perm else {
        return Err(CliError::Input(
            "give a permutation W, --code c1,c2,… or --poly POLY --n N".into(),
        ));
    };
    run_perm(w, args.output.json)
}

/// Reads a code typed as `1,0,1` or `1 0 1` (a single `0` is the empty forest).
pub fn parse_code(text: &str) -> Result<Vec<usize>, CliError> {
    let accepted = "a code c1,c2,… of whole numbers, e.g. 1,0,2";
    let mut code = Vec::new();
    for e in entries(text, "--code", accepted)? {
        let v = e.parse::<usize>().map_err(|_| {
            CliError::Input(format!(
                "--code entry \"{e}\" is not a whole number; give {accepted}"
            ))
        })?;
        code.push(v);
    }
    Ok(code)
}

fn run_code(text: &str, as_json: bool) -> Result<String, CliError> {
    let forest = Forest::from_code(&parse_code(text)?)?;
    let p = interrupt::run_interruptible("P_F", "steps", 0, |progress| {
        forest_polynomial(&forest, progress)
    })?;
    if as_json {
        return json::text(&ForestRecord {
            code: forest.code(),
            polynomial: PolyRecord::of(&p),
        });
    }
    let terminals: Vec<String> = forest.terminals().iter().map(|i| i.to_string()).collect();
    let nodes = forest.size();
    Ok(format!(
        "F = {forest}  code {}, {nodes} internal node{}, terminal nodes at {}\nP_F = {p}",
        code_text(forest.code()),
        if nodes == 1 { "" } else { "s" },
        if terminals.is_empty() {
            "none".to_string()
        } else {
            terminals.join(", ")
        }
    ))
}

fn run_perm(text: &str, as_json: bool) -> Result<String, CliError> {
    let w = Perm::parse(text)?;
    let terms = interrupt::run_interruptible("the forest expansion", "steps", 0, |progress| {
        schubert_forest_expansion(&w, progress)
    })?;
    let single = is_single(&terms);
    if as_json {
        return json::text(&SchubertForestRecord {
            perm: w.one_line(),
            terms: terms_json(&terms, "coefficient"),
            single,
        });
    }
    let mut out = format!("S_{w} = {}\n", sum_text(&terms));
    out.push_str(&table_text(&terms, "coefficient"));
    out.push_str(&format!(
        "{} forest{}; {}",
        terms.len(),
        if terms.len() == 1 { "" } else { "s" },
        if single {
            "a single forest polynomial"
        } else {
            "not a single forest polynomial"
        }
    ));
    if w.length() + 1 == w.n() && w.n() >= 2 {
        out.push('\n');
        out.push_str(&trees_text(&w)?);
    }
    Ok(out)
}

/// `a_w = DS_n(S_w) by trees: Σ c·labelings = …` for ℓ(w) = n − 1.
fn trees_text(w: &Perm) -> Result<String, CliError> {
    let trees = interrupt::run_interruptible("a_w by trees", "steps", 0, |progress| {
        a_w_by_trees(w, progress)
    })?;
    let parts: Vec<String> = trees
        .iter()
        .map(|t| format!("{}·{} [{}]", t.coefficient, t.labelings, code_text(&t.code)))
        .collect();
    let sum = if parts.is_empty() {
        "0".to_string()
    } else {
        parts.join(" + ")
    };
    Ok(format!(
        "a_w = DS_{}(S_w) by trees on the leaves 1..{}, c_(w,T)·(n-1)!/Π h_v [code of T]: {sum} = {}",
        w.n(),
        w.n(),
        a_w_sum(&trees)
    ))
}

fn run_poly(text: &str, n: usize, as_json: bool) -> Result<String, CliError> {
    if n == 0 || n > MAX_VARS {
        return Err(CliError::Input(format!(
            "--n {n} is out of range; forest expansions are computed in x1..xN for N from 1 to {MAX_VARS}"
        )));
    }
    let f = parse_poly(text, Some(n))?;
    check_expansion_size(&f)?;
    let terms = interrupt::run_interruptible("the forest expansion", "steps", 0, |progress| {
        forest_expansion(&f, None, progress)
    })?;
    if as_json {
        return json::text(&ExpansionRecord {
            n,
            terms: terms_json(&terms, "coefficient"),
        });
    }
    let mut out = format!("{} = {}\n", text.trim(), sum_text(&terms));
    out.push_str(&table_text(&terms, "coefficient"));
    out.push_str(&format!(
        "{} forest{} (in Q[x1..x{n}])",
        terms.len(),
        if terms.len() == 1 { "" } else { "s" }
    ));
    Ok(out)
}

/// The JSON of `forest --code`.
#[derive(Serialize)]
struct ForestRecord<'a> {
    code: &'a [usize],
    polynomial: PolyRecord,
}

/// The JSON of `forest W`.
#[derive(Serialize)]
struct SchubertForestRecord {
    perm: Vec<usize>,
    terms: Vec<ForestTerm<'static>>,
    single: bool,
}

/// The JSON of `forest --poly`.
#[derive(Serialize)]
struct ExpansionRecord {
    n: usize,
    terms: Vec<ForestTerm<'static>>,
}

/// One term c·P_F: `{"code": [...], KEY: "c"}` (KEY `coefficient` or `value`).
pub struct ForestTerm<'k> {
    code: Vec<usize>,
    key: &'k str,
    value: String,
}

impl Serialize for ForestTerm<'_> {
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        use serde::ser::SerializeMap;
        let mut map = s.serialize_map(Some(2))?;
        map.serialize_entry("code", &self.code)?;
        map.serialize_entry(self.key, &self.value)?;
        map.end()
    }
}

/// `[{"code": [...], KEY: "c"}, ...]`, in the order given.
pub fn terms_json<C: Coeff>(terms: &ForestTerms<C>, key: &'static str) -> Vec<ForestTerm<'static>> {
    terms
        .iter()
        .map(|(code, c)| ForestTerm {
            code: code.clone(),
            key,
            value: c.to_string(),
        })
        .collect()
}

/// `P_(1,2) + 2 P_(2,1) - P_()`; `0` when there is no term.
pub fn sum_text<C: Coeff>(terms: &ForestTerms<C>) -> String {
    if terms.is_empty() {
        return "0".into();
    }
    let mut out = String::new();
    for (k, (code, c)) in terms.iter().enumerate() {
        let negative = c.is_negative_value();
        let magnitude = if negative { -c.clone() } else { c.clone() };
        let sign = match (k, negative) {
            (0, false) => "",
            (0, true) => "-",
            (_, false) => " + ",
            (_, true) => " - ",
        };
        let factor = if magnitude == C::one() {
            String::new()
        } else {
            format!("{magnitude} ")
        };
        out.push_str(&format!("{sign}{factor}P_{}", code_text(code)));
    }
    out
}

/// One row a forest: the value, the code, the forest drawn in one line.
pub fn table_text<C: Coeff>(terms: &ForestTerms<C>, heading: &str) -> String {
    let rows: Vec<(String, String, String)> = terms
        .iter()
        .map(|(code, c)| {
            let drawn = Forest::from_code(code).map_or_else(|_| "?".into(), |f| f.to_string());
            (c.to_string(), code_text(code), drawn)
        })
        .collect();
    let w0 = rows
        .iter()
        .map(|r| r.0.chars().count())
        .max()
        .unwrap_or(0)
        .max(heading.len());
    let w1 = rows
        .iter()
        .map(|r| r.1.chars().count())
        .max()
        .unwrap_or(0)
        .max(4);
    let mut out = format!("{heading:>w0$}  {:<w1$}  forest\n", "code");
    for (v, c, d) in rows {
        out.push_str(&format!("{v:>w0$}  {c:<w1$}  {d}\n"));
    }
    out
}
