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
use crate::figure::result_tables;
use crate::math::hessenberg::table::{HessenbergTable, coefficient_table};
use serde_json::{Value, json};

/// The value of "kind" in this command's JSON.
pub const KIND: &str = "hessenberg_table";

/// Runs the command.
pub fn run(args: &HessenbergArgs) -> Result<String, CliError> {
    let h = hessenberg_from_args(args.n, args.h.as_deref())?;
    let shard = match &args.shard {
        Some(s) => Shard::parse(s)?,
        None => Shard::WHOLE,
    };
    let table = interrupt::run_interruptible("the table", "permutations", 0, |progress| {
        coefficient_table(&h, &|i| shard.selects(i), progress)
    })?;
    if args.output.json {
        return Ok(json::render(&table_json(&table, shard)));
    }
    if let Some(out) = args
        .output
        .table(|| result_tables::hessenberg_table(&table))
    {
        return Ok(out);
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
        .map(|e| e.perm.to_string().len())
        .max()
        .unwrap_or(1)
        .max(1);
    out.push_str(&format!("{:<width$}  {:>6}  a^h_w\n", "w", "ℓ(w)"));
    for e in &table.entries {
        out.push_str(&format!(
            "{:<width$}  {:>6}  {}\n",
            e.perm.to_string(),
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
