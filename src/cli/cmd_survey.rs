//! `elbowroom survey (--n N | --perm W)`: for each permutation w, the normal form modulo
//! J_n of the reversed Schubert polynomial S_w(x_n, ..., x_1), whether its coefficients are
//! all nonnegative, its number of terms and coefficient sum, and every counterexample.
//!
//! From n = 9 on only the w with ℓ(w) <= n − 1 are listed (the others reduce to 0).
//!
//! Ctrl-C stops the run: stderr says how far it got, the exit status is 130 and nothing
//! is printed on stdout.

use super::args::SurveyArgs;
use super::documents::SURVEY_KIND;
use super::error::CliError;
use super::interrupt;
use super::json;
use super::shard::Shard;
use crate::math::Perm;
use crate::math::quotient::groebner::MAX_QUOTIENT_N;
use crate::math::quotient::survey::{
    FULL_LISTING_MAX_N, SurveyEntry, SurveyRecord, survey, survey_listing, survey_summaries,
};
use crate::tables::results::survey_table;
use serde_json::{Value, json};

fn negatives_json<E: SurveyRecord>(e: &E, n: usize) -> Vec<Value> {
    e.negatives()
        .iter()
        .map(|(m, c)| json!({"monomial": m.exps(n), "value": c.to_string()}))
        .collect()
}

/// Runs the command.
pub fn run(args: &SurveyArgs) -> Result<String, CliError> {
    let shard = Shard::of_arg(args.shard.as_deref())?;
    let (n, perms): (usize, Vec<Perm>) = match (&args.perm, args.n) {
        (Some(text), _) => {
            let w = Perm::parse(text)?;
            if w.n() > MAX_QUOTIENT_N {
                return Err(CliError::Input(format!(
                    "{w} has n = {}; surveys run for n from 1 to {MAX_QUOTIENT_N}",
                    w.n()
                )));
            }
            (w.n(), vec![w])
        }
        (None, Some(n)) => {
            if n == 0 || n > MAX_QUOTIENT_N {
                return Err(CliError::Input(format!(
                    "--n {n} is out of range; surveys run for n from 1 to {MAX_QUOTIENT_N}"
                )));
            }
            (n, survey_listing(n))
        }
        (None, None) => {
            return Err(CliError::Input(
                "give --n N (all of S_N) or --perm W (one permutation)".into(),
            ));
        }
    };
    let listed_total = perms.len();
    if shard.index > listed_total {
        return Err(CliError::Input(format!(
            "--shard {}/{} is beyond the listing: it has {listed_total} {}, so K can be at most {listed_total}",
            shard.index,
            shard.count,
            if listed_total == 1 {
                "permutation"
            } else {
                "permutations"
            }
        )));
    }
    let perms: Vec<Perm> = perms
        .into_iter()
        .enumerate()
        .filter(|(i, _)| shard.selects(*i))
        .map(|(_, w)| w)
        .collect();
    let shard_text = format!("{}/{}", shard.index, shard.count);
    let extra = |v: &mut Value| {
        if n > FULL_LISTING_MAX_N
            && let Some(obj) = v.as_object_mut()
        {
            obj.insert("version".into(), json!(env!("CARGO_PKG_VERSION")));
            obj.insert("listed_total".into(), json!(listed_total));
            obj.insert("listing".into(), json!(listing_name(n)));
        }
    };
    let table_asked = args.output.csv || args.output.latex;
    if args.summary && !table_asked {
        // the summary needs no normal form kept: the compact records
        let entries = interrupt::run_interruptible(
            "the survey",
            "permutations",
            perms.len() as u64,
            |progress| survey_summaries(&perms, progress),
        )?;
        if args.output.json {
            let mut v = survey_json(n, &shard_text, &entries, &|_| None);
            extra(&mut v);
            return Ok(json::render(&v));
        }
        return Ok(survey_text(n, &shard_text, &entries, true, &|_| None));
    }
    let entries = interrupt::run_interruptible(
        "the survey",
        "permutations",
        perms.len() as u64,
        |progress| survey(&perms, progress),
    )?;
    let summary = args.summary;
    if args.output.json {
        let nf = |e: &SurveyEntry| (!summary).then(|| json::poly(&e.normal_form.poly));
        let mut v = survey_json(n, &shard_text, &entries, &nf);
        extra(&mut v);
        return Ok(json::render(&v));
    }
    if let Some(out) = args
        .output
        .table(|| survey_table(n, &entries, args.summary))
    {
        return Ok(out);
    }
    let nf = |e: &SurveyEntry| (!summary).then(|| e.normal_form.poly.to_string());
    Ok(survey_text(n, &shard_text, &entries, summary, &nf))
}

/// Which permutations the survey of S_n lists (the `"listing"` of the JSON).
fn listing_name(n: usize) -> &'static str {
    if n <= FULL_LISTING_MAX_N {
        "all of S_n"
    } else {
        "length at most n - 1 (the others reduce to 0)"
    }
}

/// The survey as the JSON object of the command (`"kind": "quotient_survey"`); each
/// result carries `"normal_form"` when `normal_form` gives one (not in a summary).
pub fn survey_json<E: SurveyRecord>(
    n: usize,
    shard: &str,
    entries: &[E],
    normal_form: &dyn Fn(&E) -> Option<Value>,
) -> Value {
    let results: Vec<Value> = entries
        .iter()
        .map(|e| {
            let mut v = json!({
                "perm": e.perm().one_line(),
                "length": e.perm().length(),
                "nonnegative": e.nonnegative(),
                "terms": e.terms(),
                "sum": e.sum().to_string(),
            });
            if let Some(p) = normal_form(e) {
                v["normal_form"] = p;
            }
            v
        })
        .collect();
    let counterexamples: Vec<Value> = entries
        .iter()
        .filter(|e| !e.nonnegative())
        .map(
            |e| json!({"perm": e.perm().one_line(), "negative_coefficients": negatives_json(e, n)}),
        )
        .collect();
    json!({
        "kind": SURVEY_KIND,
        "n": n,
        "shard": shard,
        "count": entries.len(),
        "all_nonnegative": counterexamples.is_empty(),
        "results": results,
        "counterexamples": counterexamples,
    })
}

fn survey_text<E: SurveyRecord>(
    n: usize,
    shard: &str,
    entries: &[E],
    summary: bool,
    normal_form: &dyn Fn(&E) -> Option<String>,
) -> String {
    let bad = entries.iter().filter(|e| !e.nonnegative()).count();
    let mut out = format!(
        "normal forms of S_w(x{n}, ..., x1) modulo J_{n} (piece {shard}): {} {}, {bad} with a negative coefficient\n\n",
        entries.len(),
        if entries.len() == 1 {
            "permutation"
        } else {
            "permutations"
        },
    );
    if n > FULL_LISTING_MAX_N {
        out.push_str(&format!(
            "(listed: the w with ℓ(w) <= {}; every S_w of degree >= {n} lies in J_{n})\n\n",
            n - 1
        ));
    }
    out.push_str(&format!(
        "{:<10} {:>3} {:>6} {:>8} {:>6}{}\n",
        "w",
        "ℓ",
        "terms",
        "sum",
        "≥ 0",
        if summary { "" } else { "  normal form" }
    ));
    for e in entries {
        out.push_str(&format!(
            "{:<10} {:>3} {:>6} {:>8} {:>6}",
            e.perm().to_string(),
            e.perm().length(),
            e.terms(),
            e.sum().to_string(),
            if e.nonnegative() { "yes" } else { "NO" }
        ));
        if let Some(p) = normal_form(e) {
            out.push_str(&format!("  {p}"));
        }
        out.push('\n');
    }
    if bad > 0 {
        out.push_str("\ncounterexamples (negative coefficients):\n");
        for e in entries.iter().filter(|e| !e.nonnegative()) {
            let negs: Vec<String> = e
                .negatives()
                .iter()
                .map(|(m, c)| format!("{c}·{}", m.text(n)))
                .collect();
            out.push_str(&format!("  {}: {}\n", e.perm(), negs.join(", ")));
        }
    }
    out
}
