//! `elbowroom eulerian --n N`: the mixed Eulerian numbers A_c, c a weak composition
//! of n-1 into n-1 parts, listed in decreasing lexicographic order of c, as
//! text, JSON, CSV or a LaTeX tabular.

use super::args::EulerianArgs;
use super::error::CliError;
use super::interrupt;
use super::json;
use crate::math::limits::{REMIXED_TABLE_WORK_LIMIT, binomial};
use crate::math::permutohedra::mixed_eulerian::mixed_eulerian_numbers;
use crate::math::permutohedra::remixed::{remixed_eulerian, remixed_table_work};
use crate::math::poly::qpoly::QPoly;
use crate::math::{MathResult, Progress};
use crate::tables::results::eulerian_table;
use num_bigint::BigInt;
use serde::Serialize;

/// One A_c (and A_c(q) with `--q`).
#[derive(Serialize)]
struct EulerianNumber<'a, C: Serialize> {
    c: &'a C,
    value: String,
    #[serde(skip_serializing_if = "Option::is_none")]
    q: Option<Vec<String>>,
}

/// The JSON of `eulerian`.
#[derive(Serialize)]
struct EulerianRecord<'a, C: Serialize> {
    n: usize,
    order: &'static str,
    numbers: Vec<EulerianNumber<'a, C>>,
    count: usize,
    sum: String,
}

pub fn run(args: &EulerianArgs) -> Result<String, CliError> {
    if !(2..=crate::math::MAX_N).contains(&args.n) {
        return Err(CliError::Input(format!(
            "--n {} is out of range; 2 <= n <= {} is accepted",
            args.n,
            crate::math::MAX_N
        )));
    }
    crate::math::sizing::check_eulerian(args.n)?;
    let n = args.n as u64;
    let compositions = binomial(2 * n - 3, n - 2);
    if args.q && remixed_table_work(args.n) > REMIXED_TABLE_WORK_LIMIT {
        return Err(CliError::Input(format!(
            "A_c(q) at n = {n}: {compositions} compositions, each {} steps, is {} steps; at most {REMIXED_TABLE_WORK_LIMIT} are accepted (n <= 9)",
            n.pow(6),
            remixed_table_work(args.n)
        )));
    }
    let numbers = interrupt::run_interruptible("the computation", "compositions", 0, |progress| {
        mixed_eulerian_numbers(args.n, progress)
    })?;
    let sum: BigInt = numbers.iter().map(|(_, v)| v).sum();
    if let Some(out) = args.output.table(|| eulerian_table(args.n, &numbers)) {
        return Ok(out);
    }
    let q_values = if args.q {
        Some(interrupt::run_interruptible(
            "the q-analogues",
            "compositions",
            0,
            |progress| remixed_all(&numbers, progress),
        )?)
    } else {
        None
    };
    if args.output.json {
        return json::text(&EulerianRecord {
            n: args.n,
            order: "decreasing lexicographic in c",
            numbers: numbers
                .iter()
                .enumerate()
                .map(|(k, (c, v))| EulerianNumber {
                    c,
                    value: v.to_string(),
                    q: q_values.as_ref().map(|q| q[k].coeff_strings()),
                })
                .collect(),
            count: numbers.len(),
            sum: sum.to_string(),
        });
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
    for (k, (c, v)) in numbers.iter().enumerate() {
        match &q_values {
            Some(q) => out.push_str(&format!(
                "{:<width$}  {v}  A_c(q) = {}\n",
                format!("{c:?}"),
                q[k]
            )),
            None => out.push_str(&format!("{:<width$}  {v}\n", format!("{c:?}"))),
        }
    }
    out.push_str(&format!("sum = {sum}\n"));
    Ok(out)
}

/// A_c(q) for every c of the table, in its order.
fn remixed_all(numbers: &[(Vec<u32>, BigInt)], progress: &Progress) -> MathResult<Vec<QPoly>> {
    progress.set_total(numbers.len() as u64);
    numbers
        .iter()
        .map(|(c, _)| {
            progress.check()?;
            let q = remixed_eulerian(c)?;
            progress.advance(1);
            Ok(q)
        })
        .collect()
}
