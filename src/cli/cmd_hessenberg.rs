//! `elbowroom hessenberg --n N [--h ...] [--shard K/N]`: the table a^h_w = DS_h(S_w).
//!
//! Rows list every w in S_n with ℓ(w) = Σ (h(i) - i), zeros included, in
//! lexicographic order of one-line notation. Ctrl-C stops the run cleanly
//! (exit status 130, nothing on stdout).

use super::args::HessenbergArgs;
use super::cmd_divsym::hessenberg_from_args;
use super::error::CliError;
use super::interrupt;
use super::json;
use super::shard::Shard;
use crate::math::hessenberg_table::{HessenbergTable, hessenberg_table};
use crate::math::{MathError, Progress};
use serde_json::{Value, json};
use std::sync::Arc;

/// The value of "kind" in this command's JSON.
pub const KIND: &str = "hessenberg_table";

/// Runs the command.
pub fn run(args: &HessenbergArgs) -> Result<String, CliError> {
    let h = hessenberg_from_args(args.n, args.h.as_deref())?;
    let shard = match &args.shard {
        Some(s) => Shard::parse(s)?,
        None => Shard::WHOLE,
    };
    let progress = Arc::new(Progress::new(0));
    let _watch = interrupt::watch(progress.clone());
    let table = match hessenberg_table(&h, &|i| shard.selects(i), &progress) {
        Ok(t) => t,
        Err(MathError::Canceled) => {
            return Err(CliError::Canceled(format!(
                "canceled after {} of {} permutations",
                progress.done(),
                progress.total()
            )));
        }
        Err(e) => return Err(e.into()),
    };
    if args.json {
        return Ok(json::render(&table_json(&table, shard)));
    }
    if args.csv {
        return Ok(csv(&table));
    }
    if args.latex {
        return Ok(latex(&table));
    }
    Ok(text(&table, shard))
}

/// The JSON object of a (possibly partial) table.
pub fn table_json(table: &HessenbergTable, shard: Shard) -> Value {
    let coefficients: Vec<Value> = table
        .entries
        .iter()
        .map(|e| json!({"perm": e.perm.one_line(), "value": json::exact(&e.value)}))
        .collect();
    let mut v = json!({
        "kind": KIND,
        "n": table.h.n(),
        "h": table.h.values(),
        "dimension": table.h.dimension(),
        "order": "lexicographic in one-line notation",
        "listed": table.listed,
        "coefficients": coefficients,
        "total": json::exact(&table.total()),
        "nonzero": table.nonzero(),
        "max": json::exact(&table.max()),
        "negative": table.negative().len(),
        "all_nonnegative_integers": table.negative().is_empty(),
    });
    if !shard.is_whole()
        && let Some(obj) = v.as_object_mut()
    {
        obj.insert(
            "shard".into(),
            Value::String(format!("{}/{}", shard.index, shard.count)),
        );
    }
    v
}

fn perm_text(w: &crate::math::Perm) -> String {
    if w.n() <= 9 {
        w.to_string()
    } else {
        let parts: Vec<String> = w.one_line().iter().map(|v| v.to_string()).collect();
        parts.join(",")
    }
}

fn csv(table: &HessenbergTable) -> String {
    let mut out = String::from("perm,length,value\n");
    let len = table.h.dimension();
    for e in &table.entries {
        let parts: Vec<String> = e.perm.one_line().iter().map(|v| v.to_string()).collect();
        out.push_str(&format!("\"{}\",{len},{}\n", parts.join(","), e.value));
    }
    out
}

fn latex(table: &HessenbergTable) -> String {
    let len = table.h.dimension();
    let mut out = format!(
        "% a^h_w = DS_h(S_w) for h = {}, n = {}\n\\begin{{tabular}}{{lrr}}\n$w$ & $\\ell(w)$ & $a^h_w$ \\\\\n\\hline\n",
        table.h,
        table.h.n()
    );
    for e in &table.entries {
        out.push_str(&format!(
            "${}$ & {len} & {} \\\\\n",
            perm_text(&e.perm),
            e.value
        ));
    }
    out.push_str("\\end{tabular}\n");
    out
}

fn text(table: &HessenbergTable, shard: Shard) -> String {
    let len = table.h.dimension();
    let mut out = format!(
        "h = {}  n = {}  dimension = {len}  permutations = {}{}\n",
        table.h,
        table.h.n(),
        table.listed,
        if shard.is_whole() {
            String::new()
        } else {
            format!(
                "  (piece {}/{}: {} of them)",
                shard.index,
                shard.count,
                table.entries.len()
            )
        }
    );
    let width = table
        .entries
        .iter()
        .map(|e| perm_text(&e.perm).len())
        .max()
        .unwrap_or(1)
        .max(1);
    out.push_str(&format!("{:<width$}  {:>6}  a^h_w\n", "w", "ℓ(w)"));
    for e in &table.entries {
        out.push_str(&format!(
            "{:<width$}  {:>6}  {}\n",
            perm_text(&e.perm),
            len,
            e.value
        ));
    }
    out.push_str(&format!(
        "total = {}  nonzero = {}  max = {}  negative = {}\n",
        table.total(),
        table.nonzero(),
        table.max(),
        table.negative().len()
    ));
    out
}
