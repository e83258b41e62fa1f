//! `elbowroom merge FILES...`: combines the JSON outputs of the shards of a run
//! (`--shard K/N`) into the output a single run gives.
//!
//! Dispatch is on the `"kind"` key; each kind has its own merge function. A kind's
//! shards must agree on their parameters, carry distinct `"shard": "K/N"` labels
//! with one N, and together cover the listing exactly once. (The messages call
//! a shard a "piece", as they always have.)

use super::args::MergeArgs;
use super::documents::{HESSENBERG_KIND, SURVEY_KIND, hessenberg_table_json};
use super::error::CliError;
use super::json;
use super::merge_survey::merge_surveys;
use super::shard::Shard;
use crate::math::Perm;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::table::{HessenbergTable, TableEntry};
use crate::math::perms::listing::perms_of_length;
use num_bigint::BigInt;
use serde_json::Value;
use std::collections::BTreeSet;

/// Runs the command.
pub fn run(args: &MergeArgs) -> Result<String, CliError> {
    let mut docs = Vec::new();
    for path in &args.files {
        let text = std::fs::read_to_string(path)
            .map_err(|e| CliError::Input(format!("cannot read {}: {e}", path.display())))?;
        let v: Value = serde_json::from_str(&text).map_err(|e| {
            CliError::Input(format!(
                "{} is not a JSON output of elbowroom: {e}",
                path.display()
            ))
        })?;
        docs.push((path.display().to_string(), v));
    }
    merge_documents(&docs).map(|v| json::render(&v))
}

/// Merges parsed documents (name, JSON) of one kind.
pub fn merge_documents(docs: &[(String, Value)]) -> Result<Value, CliError> {
    let Some((_, first)) = docs.first() else {
        return Err(CliError::Input("give at least one file to merge".into()));
    };
    let kind = first.get("kind").and_then(Value::as_str).unwrap_or("");
    for (name, d) in docs {
        let k = d.get("kind").and_then(Value::as_str).unwrap_or("");
        if k != kind {
            return Err(CliError::Input(format!(
                "{name} has kind '{k}' but the first file has kind '{kind}'; merge pieces of one run"
            )));
        }
    }
    match kind {
        HESSENBERG_KIND => merge_hessenberg(docs),
        SURVEY_KIND => {
            let values: Vec<Value> = docs.iter().map(|(_, v)| v.clone()).collect();
            merge_surveys(&values)
        }
        other => Err(CliError::Input(format!(
            "cannot merge files of kind '{other}'; accepted kinds: {HESSENBERG_KIND}, {SURVEY_KIND}"
        ))),
    }
}

fn shard_of(name: &str, d: &Value) -> Result<Shard, CliError> {
    match d.get("shard").and_then(Value::as_str) {
        Some(s) => Shard::parse(s),
        None => Ok(Shard::WHOLE),
    }
    .map_err(|e| CliError::Input(format!("{name}: {}", e.message())))
}

/// Merges shards of `elbowroom hessenberg --shard K/N --json`.
pub fn merge_hessenberg(docs: &[(String, Value)]) -> Result<Value, CliError> {
    let mut h_seen: Option<HessenbergFn> = None;
    let mut count_seen: Option<usize> = None;
    let mut shards = BTreeSet::new();
    let mut entries: Vec<(Perm, BigInt)> = Vec::new();
    for (name, d) in docs {
        let bad = |what: &str| CliError::Input(format!("{name}: {what}"));
        let h = hessenberg_of(name, d)?;
        if let Some(prev) = &h_seen
            && *prev != h
        {
            return Err(bad(&format!(
                "h = {h} (n = {}) differs from h = {prev} (n = {}) in the first file; merge pieces of one run",
                h.n(),
                prev.n()
            )));
        }
        h_seen = Some(h);
        let shard = shard_of(name, d)?;
        if let Some(c) = count_seen
            && c != shard.count
        {
            return Err(bad(&format!(
                "piece {}/{} belongs to a split into {} pieces, the first file to one into {c}",
                shard.index, shard.count, shard.count
            )));
        }
        count_seen = Some(shard.count);
        if !shards.insert(shard.index) {
            return Err(bad(&format!(
                "piece {}/{} appears twice",
                shard.index, shard.count
            )));
        }
        entries.extend(coefficients_of(name, d)?);
    }
    let (Some(h), Some(count)) = (h_seen, count_seen) else {
        return Err(CliError::Input("nothing to merge".into()));
    };
    check_every_shard_given(&shards, count)?;
    let table = assemble_table(h, entries)?;
    Ok(hessenberg_table_json(&table, Shard::WHOLE))
}

/// The `"h"` of one file.
fn hessenberg_of(name: &str, d: &Value) -> Result<HessenbergFn, CliError> {
    let bad = |what: &str| CliError::Input(format!("{name}: {what}"));
    let h_values: Vec<usize> = d
        .get("h")
        .and_then(Value::as_array)
        .ok_or_else(|| bad("no Hessenberg function \"h\""))?
        .iter()
        .map(|v| v.as_u64().map(|x| x as usize))
        .collect::<Option<Vec<_>>>()
        .ok_or_else(|| bad("\"h\" is not a list of positive integers"))?;
    HessenbergFn::new(&h_values).map_err(|e| bad(&e.to_string()))
}

/// The `"coefficients"` of one file: (w, a^h_w) pairs.
fn coefficients_of(name: &str, d: &Value) -> Result<Vec<(Perm, BigInt)>, CliError> {
    let bad = |what: &str| CliError::Input(format!("{name}: {what}"));
    let coeffs = d
        .get("coefficients")
        .and_then(Value::as_array)
        .ok_or_else(|| bad("no \"coefficients\" list"))?;
    let mut entries = Vec::with_capacity(coeffs.len());
    for c in coeffs {
        let perm: Vec<usize> = c
            .get("perm")
            .and_then(Value::as_array)
            .and_then(|a| {
                a.iter()
                    .map(|v| v.as_u64().map(|x| x as usize))
                    .collect::<Option<Vec<_>>>()
            })
            .ok_or_else(|| bad("a coefficient without a \"perm\" list"))?;
        let w = Perm::from_one_line(&perm).map_err(|e| bad(&e.to_string()))?;
        let value: BigInt = c
            .get("value")
            .and_then(Value::as_str)
            .and_then(|s| s.parse().ok())
            .ok_or_else(|| bad("a coefficient whose \"value\" is not an integer string"))?;
        entries.push((w, value));
    }
    Ok(entries)
}

/// Refuses a merge that lacks some of the shards 1..count.
fn check_every_shard_given(shards: &BTreeSet<usize>, count: usize) -> Result<(), CliError> {
    let missing: Vec<String> = (1..=count)
        .filter(|k| !shards.contains(k))
        .map(|k| format!("{k}/{count}"))
        .collect();
    if !missing.is_empty() {
        return Err(CliError::Input(format!(
            "pieces {} are missing; give all {count} pieces of the run",
            missing.join(", ")
        )));
    }
    Ok(())
}

/// The whole table from the entries of all shards, which must cover the
/// listing of the permutations of length |h| exactly once.
fn assemble_table(
    h: HessenbergFn,
    mut entries: Vec<(Perm, BigInt)>,
) -> Result<HessenbergTable, CliError> {
    let listing = perms_of_length(h.n(), h.dimension());
    entries.sort_by(|a, b| a.0.cmp(&b.0));
    for pair in entries.windows(2) {
        if pair[0].0 == pair[1].0 {
            return Err(CliError::Input(format!(
                "w = {} appears in two pieces; the pieces are not disjoint",
                pair[0].0
            )));
        }
    }
    if entries.len() != listing.len() || entries.iter().zip(&listing).any(|(e, w)| e.0 != *w) {
        return Err(CliError::Input(format!(
            "the pieces hold {} permutations but the table for h = {h} lists {} of length {}; they do not cover it exactly",
            entries.len(),
            listing.len(),
            h.dimension()
        )));
    }
    Ok(HessenbergTable {
        h,
        listed: listing.len(),
        entries: entries
            .into_iter()
            .enumerate()
            .map(|(index, (perm, value))| TableEntry { index, perm, value })
            .collect(),
    })
}
