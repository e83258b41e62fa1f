//! `elbowroom eulerian --n N`: the mixed Eulerian numbers A_c, c a weak composition
//! of n-1 into n-1 parts, listed in decreasing lexicographic order of c, as
//! text, JSON, CSV or a LaTeX tabular.

use super::args::EulerianArgs;
use super::error::CliError;
use super::interrupt;
use super::json;
use crate::math::permutohedra::mixed_eulerian::mixed_eulerian_numbers;
use crate::tables::results::eulerian_table;
use num_bigint::BigInt;
use serde_json::{Value, json};

/// Runs the command.
pub fn run(args: &EulerianArgs) -> Result<String, CliError> {
    if !(2..=crate::math::MAX_N).contains(&args.n) {
        return Err(CliError::Input(format!(
            "--n {} is out of range; 2 <= n <= {} is accepted",
            args.n,
            crate::math::MAX_N
        )));
    }
    crate::math::sizing::check_eulerian(args.n)?;
    let numbers = interrupt::run_interruptible("the computation", "compositions", 0, |progress| {
        mixed_eulerian_numbers(args.n, progress)
    })?;
    let sum: BigInt = numbers.iter().map(|(_, v)| v).sum();
    if let Some(out) = args.output.table(|| eulerian_table(args.n, &numbers)) {
        return Ok(out);
    }
    if args.output.json {
        let list: Vec<Value> = numbers
            .iter()
            .map(|(c, v)| json!({"c": c, "value": json::exact(v)}))
            .collect();
        return Ok(json::render(&json!({
            "n": args.n,
            "order": "decreasing lexicographic in c",
            "numbers": list,
            "count": numbers.len(),
            "sum": json::exact(&sum),
        })));
    }
    let width = numbers
        .iter()
        .map(|(c, _)| format!("{c:?}").len())
        .max()
        .unwrap_or(1);
    let mut out = format!(
        "mixed Eulerian numbers A_c, n = {} ({} compositions c of {} into {} parts)\n",
        args.n,
        numbers.len(),
        args.n - 1,
        args.n - 1
    );
    for (c, v) in &numbers {
        out.push_str(&format!("{:<width$}  {v}\n", format!("{c:?}")));
    }
    out.push_str(&format!("sum = {sum}\n"));
    Ok(out)
}
