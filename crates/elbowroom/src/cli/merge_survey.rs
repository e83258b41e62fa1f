//! Merging the shards of a survey (`elbowroom survey --shard K/N --json`) back
//! into one survey, as if it had been run whole.

use super::documents::SURVEY_KIND;
use super::error::CliError;
use super::shard::Shard;
use serde_json::{Value, json};
use std::cmp::Ordering;

fn perm_key(v: &Value) -> Vec<u64> {
    v.get("perm")
        .and_then(Value::as_array)
        .map(|a| a.iter().filter_map(Value::as_u64).collect())
        .unwrap_or_default()
}

fn bad(msg: String) -> CliError {
    CliError::Input(msg)
}

/// Merges survey documents (`"kind": "quotient_survey"`) of the same n whose shards
/// K/N cover 1..N exactly once. Results and counterexamples come back in listing order
/// (lex order of the permutations), with `"shard": "1/1"` and `"merged_from": N`.
pub fn merge_surveys(docs: &[Value]) -> Result<Value, CliError> {
    let Some(first) = docs.first() else {
        return Err(bad(
            "nothing to merge: give the JSON files of the pieces".into()
        ));
    };
    let n = first.get("n").and_then(Value::as_u64);
    let version = first.get("version").and_then(Value::as_str);
    // pieces of n <= 8 carry no "listed_total": they list all of S_n
    let full = |d: &Value| {
        d.get("listed_total").and_then(Value::as_u64).or_else(|| {
            let m = d.get("n").and_then(Value::as_u64)?;
            (m <= 8).then(|| (1..=m).product())
        })
    };
    let listed_total = full(first);
    let mut seen: Vec<bool> = Vec::new();
    let mut count: Option<usize> = None;
    let mut results: Vec<Value> = Vec::new();
    let mut counterexamples: Vec<Value> = Vec::new();
    for (i, doc) in docs.iter().enumerate() {
        if doc.get("kind").and_then(Value::as_str) != Some(SURVEY_KIND) {
            return Err(bad(format!(
                "piece {} is not a quotient survey (its \"kind\" is not \"quotient_survey\")",
                i + 1
            )));
        }
        let shard = doc.get("shard").and_then(Value::as_str).unwrap_or("");
        let its_n = doc.get("n").and_then(Value::as_u64);
        if its_n != n {
            return Err(bad(format!(
                "piece {} ({shard}) surveys n = {}, the first piece n = {}; merge pieces of one run",
                i + 1,
                its_n.map_or("?".into(), |v| v.to_string()),
                n.map_or("?".into(), |v| v.to_string())
            )));
        }
        let its_version = doc.get("version").and_then(Value::as_str);
        if its_version != version {
            return Err(bad(format!(
                "piece {} ({shard}) was written by version {}, the first piece by {}; rerun the pieces with one version",
                i + 1,
                its_version.unwrap_or("(none)"),
                version.unwrap_or("(none)")
            )));
        }
        if full(doc) != listed_total {
            return Err(bad(format!(
                "piece {} ({shard}) splits a listing of a different size; merge pieces of one run",
                i + 1
            )));
        }
        let parsed = Shard::parse(shard)
            .map_err(|_| bad(format!("piece {} has no valid \"shard\": \"K/N\"", i + 1)))?;
        match count {
            None => {
                count = Some(parsed.count);
                seen = vec![false; parsed.count];
            }
            Some(c) if c != parsed.count => {
                return Err(bad(format!(
                    "piece {} is one of {} pieces, the others of {c}",
                    i + 1,
                    parsed.count
                )));
            }
            _ => {}
        }
        if std::mem::replace(&mut seen[parsed.index - 1], true) {
            return Err(bad(format!("piece {shard} is given twice")));
        }
        let (Some(r), Some(c)) = (
            doc.get("results").and_then(Value::as_array),
            doc.get("counterexamples").and_then(Value::as_array),
        ) else {
            return Err(bad(format!(
                "piece {} lacks \"results\" or \"counterexamples\"",
                i + 1
            )));
        };
        let stated = doc.get("count").and_then(Value::as_u64);
        let expected = listed_total.map(|t| {
            let (t, k, c) = (t as usize, parsed.index, parsed.count);
            if t >= k { (t - k) / c + 1 } else { 0 }
        });
        if stated.is_some_and(|s| s as usize != r.len()) || expected.is_some_and(|e| e != r.len()) {
            return Err(bad(format!(
                "piece {} ({shard}) is cut short: it lists {} permutations, {} expected",
                i + 1,
                r.len(),
                expected.or(stated.map(|s| s as usize)).unwrap_or(0)
            )));
        }
        results.extend(r.iter().cloned());
        counterexamples.extend(c.iter().cloned());
    }
    if let Some(missing) = seen.iter().position(|s| !s) {
        return Err(bad(format!(
            "piece {}/{} is missing",
            missing + 1,
            seen.len()
        )));
    }
    let by_perm = |a: &Value, b: &Value| -> Ordering { perm_key(a).cmp(&perm_key(b)) };
    results.sort_by(by_perm);
    counterexamples.sort_by(by_perm);
    let mut merged = json!({
        "kind": SURVEY_KIND,
        "n": n,
        "shard": "1/1",
        "merged_from": seen.len(),
        "count": results.len(),
        "all_nonnegative": counterexamples.is_empty(),
        "results": results,
        "counterexamples": counterexamples,
    });
    if let Some(obj) = merged.as_object_mut() {
        for key in ["version", "listed_total", "listing"] {
            if let Some(v) = first.get(key) {
                obj.insert(key.into(), v.clone());
            }
        }
    }
    Ok(merged)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn shards_must_cover_once() {
        let shard = |k: usize, perms: &[[u64; 2]]| {
            json!({"kind": "quotient_survey", "n": 2, "shard": format!("{k}/2"),
                   "results": perms.iter().map(|p| json!({"perm": p})).collect::<Vec<_>>(),
                   "counterexamples": []})
        };
        let a = shard(1, &[[1, 2]]);
        let b = shard(2, &[[2, 1]]);
        let merged = merge_surveys(&[b.clone(), a.clone()]).unwrap_or(Value::Null);
        assert_eq!(merged["results"][0]["perm"], json!([1, 2]));
        assert_eq!(merged["count"], json!(2));
        assert!(merge_surveys(std::slice::from_ref(&a)).is_err());
        assert!(merge_surveys(&[a.clone(), a]).is_err());
        assert!(merge_surveys(&[]).is_err());
        // a piece cut short: it states a count its results do not reach
        let mut short = shard(2, &[[2, 1]]);
        short["count"] = json!(2);
        assert!(merge_surveys(&[shard(1, &[[1, 2]]), short]).is_err());
        // pieces of different versions or listings
        let mut other = shard(2, &[[2, 1]]);
        other["version"] = json!("0.0.0");
        assert!(merge_surveys(&[shard(1, &[[1, 2]]), other]).is_err());
        let mut wider = shard(2, &[[2, 1]]);
        wider["listed_total"] = json!(5);
        assert!(merge_surveys(&[shard(1, &[[1, 2]]), wider]).is_err());
    }
}
