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

fn excerpt(text: &str) -> String {
    crate::math::excerpt::excerpt(text)
}

/// The listing of the survey of S_n, as one-line lists.
fn listing_of(n: Option<u64>) -> Result<Vec<Vec<u64>>, CliError> {
    let max = crate::math::quotient::groebner::MAX_QUOTIENT_N;
    let n = match n {
        Some(n) if (1..=max as u64).contains(&n) => n as usize,
        _ => {
            return Err(bad(format!(
                "the first piece has no \"n\" from 1 to {max}; merge the JSON outputs of survey --shard"
            )));
        }
    };
    Ok(crate::math::quotient::survey::survey_listing(n)
        .iter()
        .map(|w| w.one_line().into_iter().map(|v| v as u64).collect())
        .collect())
}

/// The re-checks of one piece (number `number`, piece `shard`): its results are
/// exactly the permutations of the listing that belong to it, in order (no
/// duplicate, no foreign permutation, none left out); each result says whether
/// it is nonnegative; the counterexamples are exactly the results that are not,
/// in order; and `"all_nonnegative"` agrees with them.
fn check_piece(
    doc: &Value,
    results: &[Value],
    counterexamples: &[Value],
    listing: &[Vec<u64>],
    shard: Shard,
    number: usize,
) -> Result<(), CliError> {
    let label = format!("piece {number} ({}/{})", shard.index, shard.count);
    let mine = listing
        .iter()
        .enumerate()
        .filter(|(i, _)| shard.selects(*i))
        .map(|(_, w)| w);
    let mut negative: Vec<Vec<u64>> = Vec::new();
    for (j, (r, want)) in results.iter().zip(mine).enumerate() {
        let got = perm_key(r);
        if &got != want {
            return Err(bad(format!(
                "{label}: result {} is {}, but that place of the listing holds {want:?}; the piece does not follow the listing (a row repeated, foreign or left out)",
                j + 1,
                excerpt(&r.get("perm").map_or("missing".into(), |v| v.to_string()))
            )));
        }
        match r.get("nonnegative").and_then(Value::as_bool) {
            Some(true) => {}
            Some(false) => negative.push(got),
            None => {
                return Err(bad(format!(
                    "{label}: result {} has no \"nonnegative\": true or false",
                    j + 1
                )));
            }
        }
    }
    let listed: Vec<Vec<u64>> = counterexamples.iter().map(perm_key).collect();
    if listed != negative {
        return Err(bad(format!(
            "{label}: its counterexamples ({}) are not its results with \"nonnegative\": false ({}); the piece is not consistent",
            listed.len(),
            negative.len()
        )));
    }
    if doc.get("all_nonnegative").and_then(Value::as_bool) != Some(negative.is_empty()) {
        return Err(bad(format!(
            "{label}: \"all_nonnegative\" is not {}, though it has {} counterexamples; the piece is not consistent",
            negative.is_empty(),
            negative.len()
        )));
    }
    Ok(())
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
    let build = first.get("build").and_then(Value::as_str);
    let listing = listing_of(n)?;
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
        let its_build = doc.get("build").and_then(Value::as_str);
        if its_build != build {
            return Err(bad(format!(
                "piece {} ({}) was made by build {}, the first piece by build {}; rerun the pieces with one build",
                i + 1,
                excerpt(shard),
                its_build.map_or("(none)".into(), excerpt),
                build.map_or("(none)".into(), excerpt)
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
            return Err(bad(format!("piece {} is given twice", excerpt(shard))));
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
        check_piece(doc, r, c, &listing, parsed, i + 1)?;
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
                   "all_nonnegative": true,
                   "results": perms.iter().map(|p| json!({"perm": p, "nonnegative": true})).collect::<Vec<_>>(),
                   "counterexamples": []})
        };
        let a = shard(1, &[[1, 2]]);
        let b = shard(2, &[[2, 1]]);
        let merged = merge_surveys(&[b.clone(), a.clone()]).unwrap_or(Value::Null);
        assert_eq!(merged["results"][0]["perm"], json!([1, 2]));
        assert_eq!(merged["count"], json!(2));
        assert!(
            merge_surveys(std::slice::from_ref(&a)).is_err_and(|e| matches!(e, CliError::Input(_)))
        );
        assert!(merge_surveys(&[a.clone(), a]).is_err_and(|e| matches!(e, CliError::Input(_))));
        assert!(merge_surveys(&[]).is_err_and(|e| matches!(e, CliError::Input(_))));
        // a piece cut short: it states a count its results do not reach
        let mut short = shard(2, &[[2, 1]]);
        short["count"] = json!(2);
        assert!(
            merge_surveys(&[shard(1, &[[1, 2]]), short])
                .is_err_and(|e| matches!(e, CliError::Input(_)))
        );
        // pieces of different versions or listings
        let mut other = shard(2, &[[2, 1]]);
        other["version"] = json!("0.0.0");
        assert!(
            merge_surveys(&[shard(1, &[[1, 2]]), other])
                .is_err_and(|e| matches!(e, CliError::Input(_)))
        );
        // pieces of different builds
        let mut other = shard(2, &[[2, 1]]);
        other["build"] = json!("0123abcd");
        let e = merge_surveys(&[shard(1, &[[1, 2]]), other]).unwrap_err();
        assert!(
            matches!(&e, CliError::Input(m) if m.contains("build")),
            "{e:?}"
        );
        // doctored pieces: a foreign permutation, a repeated one, a row said
        // negative without a counterexample
        let e = merge_surveys(&[shard(1, &[[9, 9]]), shard(2, &[[2, 1]])]).unwrap_err();
        assert!(
            matches!(&e, CliError::Input(m) if m.contains("does not follow the listing")),
            "{e:?}"
        );
        let e = merge_surveys(&[shard(1, &[[1, 2]]), shard(2, &[[1, 2]])]).unwrap_err();
        assert!(
            matches!(&e, CliError::Input(m) if m.contains("does not follow the listing")),
            "{e:?}"
        );
        let mut lying = shard(2, &[[2, 1]]);
        lying["results"][0]["nonnegative"] = json!(false);
        let e = merge_surveys(&[shard(1, &[[1, 2]]), lying]).unwrap_err();
        assert!(
            matches!(&e, CliError::Input(m) if m.contains("not consistent")),
            "{e:?}"
        );
        let mut wider = shard(2, &[[2, 1]]);
        wider["listed_total"] = json!(5);
        assert!(
            merge_surveys(&[shard(1, &[[1, 2]]), wider])
                .is_err_and(|e| matches!(e, CliError::Input(_)))
        );
    }
}
