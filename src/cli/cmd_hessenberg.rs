//! `elbowroom hessenberg --n N [--h ...] [--shard K/N]`: the table a^h_w = DS_h(S_w).
//!
//! Rows list every w in S_n with ℓ(w) = Σ (h(i) - i), zeros included, in
//! lexicographic order of one-line notation. Ctrl-C stops the run cleanly
//! (exit status 130, nothing on stdout).

use super::args::HessenbergArgs;
use super::documents::hessenberg_table_json;
use super::error::CliError;
use super::inputs::hessenberg_from_args;
use super::interrupt;
use super::json;
use super::shard::Shard;
use crate::math::hessenberg::table::{HessenbergTable, coefficient_table};
use crate::tables::results::hessenberg_table;

/// Runs the command.
pub fn run(args: &HessenbergArgs) -> Result<String, CliError> {
    let h = hessenberg_from_args(args.n, args.h.as_deref())?;
    let shard = Shard::of_arg(args.shard.as_deref())?;
    let table = interrupt::run_interruptible("the table", "permutations", 0, |progress| {
        coefficient_table(&h, &|i| shard.selects(i), progress)
    })?;
    if args.output.json {
        return Ok(json::render(&hessenberg_table_json(&table, shard)));
    }
    if let Some(out) = args.output.table(|| hessenberg_table(&table)) {
        return Ok(out);
    }
    Ok(text(&table, shard))
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
