//! `elbowroom coefficient W [--h h] [--q]`: a^h_w = DS_h(S_w), the coefficient of
//! S_{w0 w} in the class of the Hessenberg variety of h, and for the default h (the
//! permutahedral class) why it is what it is: the reduced-word formula by content,
//! the rules that apply, a_{w^{-1}}, a_{w0 w w0}, the cyclic orbit and its sum, and with
//! `--q` the q-analogue a_w(q).

use super::args::CoefficientArgs;
use super::error::CliError;
use super::interrupt;
use crate::math::explain::explanation::{Explanation, explain};
use crate::math::explain::formula::{WORD_FORMULA_WORK_LIMIT, size_word_formula};
use crate::math::explain::qvalue::{QCoefficient, q_coefficient};
use crate::math::explain::rules::Rule;
use crate::math::forest::indexed::code_text;
use crate::math::forest::trees::{TreeTerm, a_w_by_trees};
use crate::math::hessenberg::divsym::HessenbergFunctional;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::limits::SCHUBERT_TERM_LIMIT;
use crate::math::pipes::dream::term_bound;
use crate::math::schubert::polynomial::schubert;
use crate::math::{MathResult, Perm, Progress};
use serde::Serialize;

/// The JSON record of `coefficient` (fields after `value` only for the default h).
#[derive(Serialize, Debug)]
pub struct CoefficientRecord<'a> {
    /// w in one-line notation.
    pub perm: Vec<usize>,
    /// n.
    pub n: usize,
    /// h(1), …, h(n).
    pub h: Vec<usize>,
    /// a^h_w, exact, as a string.
    pub value: String,
    /// The reduced-word formula by content.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub by_content: Option<Vec<ContentRow>>,
    /// w^{-1} and its coefficient.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub inverse: Option<PermValue>,
    /// w0 w w0 and its coefficient.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub conjugate: Option<PermValue>,
    /// The rules that apply, each `{"name", "value", …}`.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub rules: Option<Vec<RuleRecord<'a>>>,
    /// The cyclic orbit and its sum.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub cyclic: Option<Cyclic>,
    /// a_w by trees: Σ_T c_{w,T}·(n−1)!/Π_v h_v over the binary trees on the
    /// leaves 1..n (the forest expansion of S_w).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub by_trees: Option<Vec<TreeRow>>,
    /// a_w(q) by power of q.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub q_value: Option<Vec<String>>,
}

/// One tree of a_w by trees.
#[derive(Serialize, Debug)]
pub struct TreeRow {
    /// The code of the tree T, without trailing zeros.
    pub code: Vec<usize>,
    /// c_{w,T}, the coefficient of P_T in S_w.
    pub coefficient: String,
    /// (n − 1)!/Π_v h_v, the increasing labelings of T.
    pub labelings: String,
}

/// One content of the formula.
#[derive(Serialize, Debug)]
pub struct ContentRow {
    /// c_1, …, c_{n−1}.
    pub content: Vec<usize>,
    /// N_w(c).
    pub words: String,
    /// A_c.
    pub eulerian: String,
}

/// A permutation with its coefficient.
#[derive(Serialize, Debug)]
pub struct PermValue {
    /// One-line notation.
    pub perm: Vec<usize>,
    /// Its coefficient.
    pub value: String,
}

/// The cyclic orbit.
#[derive(Serialize, Debug)]
pub struct Cyclic {
    /// The permutations w^{(j)} with their coefficients.
    pub orbit: Vec<PermValue>,
    /// Σ_j a_{w^{(j)}}.
    pub sum: String,
    /// |Red(w)|.
    pub reduced_words: String,
}

/// A rule as its JSON object: its name and value, then what the rule
/// counts (pipe dreams; the descent, shape and tableaux; reduced words).
#[derive(Serialize, Debug, Default)]
pub struct RuleRecord<'a> {
    name: &'a str,
    value: String,
    #[serde(skip_serializing_if = "Option::is_none")]
    pipe_dreams: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    descent: Option<usize>,
    #[serde(skip_serializing_if = "Option::is_none")]
    shape: Option<&'a [usize]>,
    #[serde(skip_serializing_if = "Option::is_none")]
    tableaux_count: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    tableaux: Option<&'a [Vec<Vec<usize>>]>,
    #[serde(skip_serializing_if = "Option::is_none")]
    reduced_words: Option<String>,
}

/// The record of a rule.
pub fn rule_json(rule: &Rule) -> RuleRecord<'_> {
    let base = RuleRecord {
        name: rule.name(),
        value: rule.value().to_string(),
        ..RuleRecord::default()
    };
    match rule {
        Rule::Parking { pipe_dreams } => RuleRecord {
            pipe_dreams: Some(pipe_dreams.to_string()),
            ..base
        },
        Rule::Grassmannian {
            descent,
            shape,
            count,
            tableaux,
        } => RuleRecord {
            descent: Some(*descent),
            shape: Some(shape),
            tableaux_count: Some(count.to_string()),
            tableaux: Some(tableaux),
            ..base
        },
        Rule::Coxeter { reduced_words } => RuleRecord {
            reduced_words: Some(reduced_words.to_string()),
            ..base
        },
    }
}

pub fn run(args: &CoefficientArgs) -> Result<String, CliError> {
    let w = Perm::parse(&args.perm)?;
    let n = w.n();
    let h = match &args.h {
        Some(typed) => typed.for_n(None)?,
        None => HessenbergFn::default_for(n)?,
    };
    if h.n() != n {
        return Err(CliError::Input(format!(
            "{w} is a permutation of {n}; h = {} has {} values: they must have the same n",
            join(h.values()),
            h.n()
        )));
    }
    let needed = h.dimension();
    if w.length() != needed {
        return Err(CliError::Input(format!(
            "{w} has length {}; a^h_w for h = {} needs a permutation of length |h| = {needed}",
            w.length(),
            join(h.values())
        )));
    }
    if !h.is_default() {
        if args.q {
            return Err(CliError::Input(
                "--q is given for the default h (the permutahedral class) only".into(),
            ));
        }
        return other_h(args, &w, &h);
    }
    let (e, q, trees) =
        interrupt::run_interruptible("the explanation", "contents", 0, |progress| {
            if args.q {
                // a_w(q) is sized before anything is computed
                let steps = (n as u128).pow(6);
                size_word_formula(&w, steps, WORD_FORMULA_WORK_LIMIT, progress)?;
            }
            let e = explain(&w, progress)?;
            let q = if args.q {
                Some(q_coefficient(&w, progress)?)
            } else {
                None
            };
            let trees = a_w_by_trees(&w, progress)?;
            Ok((e, q, trees))
        })?;
    let record = record(&w, &h, &e, q.as_ref(), &trees);
    if args.output.json {
        return serde_json::to_string(&record)
            .map_err(|e| CliError::Input(format!("the record could not be written as JSON: {e}")));
    }
    Ok(text(&w, &e, q.as_ref(), &trees))
}

fn join(v: &[usize]) -> String {
    v.iter()
        .map(|x| x.to_string())
        .collect::<Vec<_>>()
        .join(",")
}

fn pv(w: &Perm, value: &impl std::fmt::Display) -> PermValue {
    PermValue {
        perm: w.one_line(),
        value: value.to_string(),
    }
}

/// The record of the default h.
pub fn record<'a>(
    w: &Perm,
    h: &HessenbergFn,
    e: &'a Explanation,
    q: Option<&QCoefficient>,
    trees: &[TreeTerm],
) -> CoefficientRecord<'a> {
    let f = &e.formula;
    CoefficientRecord {
        perm: w.one_line(),
        n: w.n(),
        h: h.values().to_vec(),
        value: f.value.to_string(),
        by_content: Some(
            f.shares
                .iter()
                .map(|s| ContentRow {
                    content: s.content.clone(),
                    words: s.words.to_string(),
                    eulerian: s.eulerian.to_string(),
                })
                .collect(),
        ),
        inverse: Some(pv(&e.inverse.0, &e.inverse.1)),
        conjugate: Some(pv(&e.conjugate.0, &e.conjugate.1)),
        rules: Some(e.rules.iter().map(rule_json).collect()),
        cyclic: Some(Cyclic {
            orbit: e.orbit.iter().map(|(_, u, v)| pv(u, v)).collect(),
            sum: e.orbit_sum.to_string(),
            reduced_words: f.reduced_words.to_string(),
        }),
        by_trees: Some(
            trees
                .iter()
                .map(|t| TreeRow {
                    code: t.code.clone(),
                    coefficient: t.coefficient.to_string(),
                    labelings: t.labelings.to_string(),
                })
                .collect(),
        ),
        q_value: q.and_then(|q| q.value.as_ref().map(|v| v.coeff_strings())),
    }
}

fn text(w: &Perm, e: &Explanation, q: Option<&QCoefficient>, trees: &[TreeTerm]) -> String {
    let f = &e.formula;
    let n = w.n();
    let mut out = format!(
        "a_{w} = {} (coefficient of S_(w0 w) in the permutahedral class, n = {n})\n",
        f.value
    );
    out.push_str(&format!(
        "reduced-word formula: a_w = (1/{}!) Σ_c N_w(c) A_c, over {} reduced word{}\n",
        n - 1,
        f.reduced_words,
        if f.reduced_words == 1u8.into() {
            ""
        } else {
            "s"
        }
    ));
    let rows: Vec<[String; 4]> = f
        .shares
        .iter()
        .map(|s| {
            [
                format!("{:?}", s.content),
                s.words.to_string(),
                s.eulerian.to_string(),
                s.share.to_string(),
            ]
        })
        .collect();
    let head = ["content c", "N_w(c)", "A_c", "N_w(c)·A_c/(n-1)!"];
    let width: Vec<usize> = (0..4)
        .map(|k| {
            rows.iter()
                .map(|r| r[k].chars().count())
                .chain([head[k].chars().count()])
                .max()
                .unwrap_or(0)
        })
        .collect();
    for r in std::iter::once(&head.map(String::from)).chain(rows.iter()) {
        let cells: Vec<String> = (0..4)
            .map(|k| {
                let pad = width[k] - r[k].chars().count();
                if k == 0 {
                    format!("{}{}", r[k], " ".repeat(pad))
                } else {
                    format!("{}{}", " ".repeat(pad), r[k])
                }
            })
            .collect();
        out.push_str(&format!("  {}\n", cells.join("  ").trim_end()));
    }
    out.push_str(&format!("  sum: {}/{}! = {}\n", f.total, n - 1, f.value));
    if e.rules.is_empty() {
        out.push_str("rules: none of parking, Grassmannian, Coxeter applies\n");
    }
    for r in &e.rules {
        out.push_str(&format!("rule: {}\n", r.statement()));
        if let Rule::Grassmannian { tableaux, .. } = r {
            for t in tableaux {
                let rows: Vec<String> = t.iter().map(|row| join(row)).collect();
                out.push_str(&format!("  tableau {}\n", rows.join(" / ")));
            }
        }
    }
    out.push_str(&format!(
        "symmetries: a_(w^-1) = a_{} = {}; a_(w0 w w0) = a_{} = {}\n",
        e.inverse.0, e.inverse.1, e.conjugate.0, e.conjugate.1
    ));
    let orbit: Vec<String> = e
        .orbit
        .iter()
        .map(|(j, u, v)| format!("j={j}: {u} ({v})"))
        .collect();
    out.push_str(&format!(
        "cyclic orbit: {}; sum {} = |Red(w)| = {}\n",
        orbit.join(", "),
        e.orbit_sum,
        f.reduced_words
    ));
    let terms: Vec<String> = trees
        .iter()
        .map(|t| format!("{}·{} {}", t.coefficient, t.labelings, code_text(&t.code)))
        .collect();
    out.push_str(&format!(
        "by trees: a_w = Σ_T c_(w,T)·(n-1)!/Π h_v = {}\n",
        if terms.is_empty() {
            "0".to_string()
        } else {
            terms.join(" + ")
        }
    ));
    if let Some(q) = q {
        match &q.value {
            Some(v) => out.push_str(&format!("a_w(q) = {v}\n")),
            None => out.push_str(&format!(
                "a_w(q) = ({}) / [{}]_q! (not a polynomial)\n",
                q.numerator,
                n - 1
            )),
        }
    }
    out.pop();
    out
}

fn other_h(args: &CoefficientArgs, w: &Perm, h: &HessenbergFn) -> Result<String, CliError> {
    let bound = term_bound(w);
    if bound > SCHUBERT_TERM_LIMIT {
        return Err(CliError::Input(format!(
            "S_{w} may have up to {bound} terms; at most {SCHUBERT_TERM_LIMIT} are accepted"
        )));
    }
    let value = interrupt::run_interruptible("the coefficient", "steps", 0, |progress| {
        coefficient_for_h(w, h, progress)
    })?;
    if args.output.json {
        let record = CoefficientRecord {
            perm: w.one_line(),
            n: w.n(),
            h: h.values().to_vec(),
            value: value.to_string(),
            by_content: None,
            inverse: None,
            conjugate: None,
            rules: None,
            cyclic: None,
            by_trees: None,
            q_value: None,
        };
        return serde_json::to_string(&record)
            .map_err(|e| CliError::Input(format!("the record could not be written as JSON: {e}")));
    }
    Ok(format!(
        "a^h_{w} = {value} (h = {}; coefficient of S_(w0 w) in the class of the Hessenberg variety)",
        join(h.values())
    ))
}

/// a^h_w = DS_h(S_w) by the Hessenberg functional.
fn coefficient_for_h(
    w: &Perm,
    h: &HessenbergFn,
    progress: &Progress,
) -> MathResult<num_bigint::BigInt> {
    progress.check()?;
    let functional = HessenbergFunctional::new(h)?;
    Ok(functional.apply(&schubert(w)))
}
