//! `elbowroom hessenberg --n N [--h ...] [--shard K/N]`: the table a^h_w = DS_h(S_w);
//! `elbowroom hessenberg --n N --every-h`: one summary line per Hessenberg function.
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
use crate::math::hessenberg::coefficients::coefficient_table;
use crate::math::hessenberg::sweep::{SweepRow, sweep_every_h};
use crate::math::hessenberg::table::HessenbergTable;
use crate::tables::results::{every_h_table, hessenberg_table};
use serde_json::json;

/// Runs the command.
pub fn run(args: &HessenbergArgs) -> Result<String, CliError> {
    if args.every_h {
        return every_h(args);
    }
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

/// `--every-h`: the sweep over every Hessenberg function of n.
fn every_h(args: &HessenbergArgs) -> Result<String, CliError> {
    let n = args.n;
    let rows = interrupt::run_interruptible("the sweep", "Hessenberg functions", 0, |progress| {
        sweep_every_h(n, progress)
    })?;
    if args.output.json {
        let functions: Vec<_> = rows
            .iter()
            .map(|r| {
                json!({
                    "h": r.h.values(),
                    "dimension": r.dimension,
                    "total": json::exact(&r.total),
                    "nonzero": r.nonzero,
                    "max": json::exact(&r.max),
                    "negative": r.negative,
                })
            })
            .collect();
        return Ok(json::render(&json!({"n": n, "functions": functions})));
    }
    if let Some(out) = args.output.table(|| every_h_table(n, &rows)) {
        return Ok(out);
    }
    Ok(every_h_text(n, &rows))
}

fn every_h_text(n: usize, rows: &[SweepRow]) -> String {
    let with_negative = rows.iter().filter(|r| r.negative > 0).count();
    let mut out = format!(
        "every Hessenberg function of n = {n}: {} of them, {with_negative} with a negative a^h_w\n",
        rows.len()
    );
    let h_width = rows
        .iter()
        .map(|r| r.h.to_string().chars().count())
        .max()
        .unwrap_or(1)
        .max(1);
    let cells: Vec<[String; 4]> = rows
        .iter()
        .map(|r| {
            [
                r.total.to_string(),
                r.nonzero.to_string(),
                r.max.to_string(),
                r.negative.to_string(),
            ]
        })
        .collect();
    let widths: Vec<usize> = (0..4)
        .map(|k| cells.iter().map(|c| c[k].len()).max().unwrap_or(0))
        .zip([5, 7, 3, 8])
        .map(|(a, b)| a.max(b))
        .collect();
    out.push_str(&format!(
        "{:<h_width$}  {:>3}  {:>w0$}  {:>w1$}  {:>w2$}  {:>w3$}\n",
        "h",
        "|h|",
        "total",
        "nonzero",
        "max",
        "negative",
        w0 = widths[0],
        w1 = widths[1],
        w2 = widths[2],
        w3 = widths[3],
    ));
    for (r, c) in rows.iter().zip(&cells) {
        out.push_str(&format!(
            "{:<h_width$}  {:>3}  {:>w0$}  {:>w1$}  {:>w2$}  {:>w3$}\n",
            r.h.to_string(),
            r.dimension,
            c[0],
            c[1],
            c[2],
            c[3],
            w0 = widths[0],
            w1 = widths[1],
            w2 = widths[2],
            w3 = widths[3],
        ));
    }
    out
}
