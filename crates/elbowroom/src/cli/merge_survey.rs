//! Merging the shards of a survey (`elbowroom survey --shard K/N --json`) back
//! into one survey, as if it had been run whole.
//!
//! Pieces are read with serde into typed records ([`SurveyPiece`]): each
//! result keeps its normal form as the text it was read from (a
//! `RawValue`, not a tree of values), so a piece takes about its own size in
//! memory, whatever the order of its fields.

use super::documents::SURVEY_KIND;
use super::error::CliError;
use super::shard::Shard;
use serde::{Deserialize, Serialize};
use serde_json::Value;
use serde_json::value::RawValue;

/// One piece of a survey as `survey --json` writes it. Fields that old pieces
/// may lack are optional, so that the merge names what is missing.
#[derive(Debug, Deserialize)]
pub struct SurveyPiece {
    /// `"quotient_survey"`.
    pub kind: Option<String>,
    /// The n of S_n.
    pub n: Option<u64>,
    /// `"K/N"`.
    pub shard: Option<String>,
    /// The number of results the piece says it has.
    pub count: Option<u64>,
    /// Whether the piece says it has no counterexample.
    pub all_nonnegative: Option<bool>,
    /// One record per permutation of the piece, in listing order.
    pub results: Option<Vec<SurveyResult>>,
    /// The results with a negative coefficient.
    pub counterexamples: Option<Vec<Counterexample>>,
    /// The package version (from n = 9 on).
    pub version: Option<String>,
    /// The build (the commit) of a piece.
    pub build: Option<String>,
    /// The size of the whole listing (from n = 9 on).
    pub listed_total: Option<u64>,
    /// Which permutations the listing holds (from n = 9 on).
    pub listing: Option<String>,
}

/// One result of a survey.
#[derive(Debug, Deserialize, Serialize)]
pub struct SurveyResult {
    /// w in one-line notation.
    pub perm: Vec<u64>,
    /// ℓ(w).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub length: Option<u64>,
    /// Whether every coefficient of the normal form is nonnegative.
    pub nonnegative: bool,
    /// The number of terms of the normal form.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub terms: Option<u64>,
    /// The sum of the coefficients, as a string.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub sum: Option<String>,
    /// The normal form, kept as read and written compact.
    #[serde(skip_serializing_if = "Option::is_none", serialize_with = "compact")]
    pub normal_form: Option<Box<RawValue>>,
}

/// One counterexample of a survey.
#[derive(Debug, Deserialize, Serialize)]
pub struct Counterexample {
    /// w in one-line notation.
    pub perm: Vec<u64>,
    /// The negative coefficients, as read.
    #[serde(serialize_with = "compact_value")]
    pub negative_coefficients: Box<RawValue>,
}

/// The merged survey: the object a whole run prints, with `"merged_from"`.
#[derive(Debug, Serialize)]
pub struct MergedSurvey {
    kind: &'static str,
    n: u64,
    shard: &'static str,
    merged_from: usize,
    count: usize,
    all_nonnegative: bool,
    results: Vec<SurveyResult>,
    counterexamples: Vec<Counterexample>,
    #[serde(skip_serializing_if = "Option::is_none")]
    version: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    listed_total: Option<u64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    listing: Option<String>,
}

/// A kept JSON text written compact (as a whole run writes it), whatever white
/// space the piece had.
fn compact<S: serde::Serializer>(raw: &Option<Box<RawValue>>, s: S) -> Result<S::Ok, S::Error> {
    match raw {
        Some(r) => compact_value(r, s),
        None => s.serialize_none(),
    }
}

fn compact_value<S: serde::Serializer>(raw: &RawValue, s: S) -> Result<S::Ok, S::Error> {
    let v: Value = serde_json::from_str(raw.get()).map_err(serde::ser::Error::custom)?;
    v.serialize(s)
}

fn bad(msg: String) -> CliError {
    CliError::Input(msg)
}

fn excerpt(text: &str) -> String {
    crate::math::excerpt::excerpt(text)
}

/// The listing of the survey of S_n, as one-line lists.
fn listing_of(n: Option<u64>) -> Result<Vec<Vec<u64>>, CliError> {
    let max = crate::math::quotient::reduction::MAX_NORMAL_FORM_N;
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
/// duplicate, no foreign permutation, none left out); the counterexamples are
/// exactly the results that are not nonnegative, in order; and
/// `"all_nonnegative"` agrees with them.
fn check_piece(
    piece: &SurveyPiece,
    results: &[SurveyResult],
    counterexamples: &[Counterexample],
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
    let mut negative: Vec<&[u64]> = Vec::new();
    for (j, (r, want)) in results.iter().zip(mine).enumerate() {
        if &r.perm != want {
            return Err(bad(format!(
                "{label}: result {} is {}, but that place of the listing holds {want:?}; the piece does not follow the listing (a row repeated, foreign or left out)",
                j + 1,
                excerpt(&format!("{:?}", r.perm))
            )));
        }
        if !r.nonnegative {
            negative.push(&r.perm);
        }
    }
    let listed: Vec<&[u64]> = counterexamples.iter().map(|c| c.perm.as_slice()).collect();
    if listed != negative {
        return Err(bad(format!(
            "{label}: its counterexamples ({}) are not its results with \"nonnegative\": false ({}); the piece is not consistent",
            listed.len(),
            negative.len()
        )));
    }
    if piece.all_nonnegative != Some(negative.is_empty()) {
        return Err(bad(format!(
            "{label}: \"all_nonnegative\" is not {}, though it has {} counterexamples; the piece is not consistent",
            negative.is_empty(),
            negative.len()
        )));
    }
    Ok(())
}

/// [`merge_survey_pieces`] on JSON values (for callers holding documents).
pub fn merge_surveys(docs: &[Value]) -> Result<Value, CliError> {
    let mut pieces = Vec::with_capacity(docs.len());
    for (i, d) in docs.iter().enumerate() {
        let piece: SurveyPiece = serde_json::from_str(&d.to_string()).map_err(|e| {
            bad(format!(
                "piece {} is not a survey piece: {}",
                i + 1,
                excerpt(&e.to_string())
            ))
        })?;
        pieces.push(piece);
    }
    let merged = merge_survey_pieces(pieces)?;
    serde_json::to_value(&merged)
        .map_err(|e| CliError::Failed(format!("cannot write the merge: {e}")))
}

/// Merges survey pieces (`"kind": "quotient_survey"`) of the same n, version and
/// build whose shards K/N cover 1..N exactly once, after re-checking each one
/// ([`check_piece`]). Results and counterexamples come back in listing order
/// (lex order of the permutations), with `"shard": "1/1"` and `"merged_from": N`.
pub fn merge_survey_pieces(docs: Vec<SurveyPiece>) -> Result<MergedSurvey, CliError> {
    let Some(first) = docs.first() else {
        return Err(bad(
            "nothing to merge: give the JSON files of the pieces".into()
        ));
    };
    let n = first.n;
    let version = first.version.clone();
    let build = first.build.clone();
    let listing_name = first.listing.clone();
    let listing = listing_of(n)?;
    // pieces of n <= 8 carry no "listed_total": they list all of S_n
    let full = |d: &SurveyPiece| {
        d.listed_total.or_else(|| {
            let m = d.n?;
            (m <= 8).then(|| (1..=m).product())
        })
    };
    let listed_total = full(first);
    let stated_total = first.listed_total;
    let mut seen: Vec<bool> = Vec::new();
    let mut count: Option<usize> = None;
    let mut results: Vec<SurveyResult> = Vec::new();
    let mut counterexamples: Vec<Counterexample> = Vec::new();
    for (i, doc) in docs.into_iter().enumerate() {
        if doc.kind.as_deref() != Some(SURVEY_KIND) {
            return Err(bad(format!(
                "piece {} is not a quotient survey (its \"kind\" is not \"quotient_survey\")",
                i + 1
            )));
        }
        let shard = excerpt(doc.shard.as_deref().unwrap_or(""));
        if doc.n != n {
            return Err(bad(format!(
                "piece {} ({shard}) surveys n = {}, the first piece n = {}; merge pieces of one run",
                i + 1,
                doc.n.map_or("?".into(), |v| v.to_string()),
                n.map_or("?".into(), |v| v.to_string())
            )));
        }
        if doc.version != version {
            return Err(bad(format!(
                "piece {} ({shard}) was written by version {}, the first piece by {}; rerun the pieces with one version",
                i + 1,
                doc.version.as_deref().map_or("(none)".into(), excerpt),
                version.as_deref().map_or("(none)".into(), excerpt)
            )));
        }
        if doc.build != build {
            return Err(bad(format!(
                "piece {} ({shard}) was made by build {}, the first piece by build {}; rerun the pieces with one build",
                i + 1,
                doc.build.as_deref().map_or("(none)".into(), excerpt),
                build.as_deref().map_or("(none)".into(), excerpt)
            )));
        }
        if full(&doc) != listed_total {
            return Err(bad(format!(
                "piece {} ({shard}) splits a listing of a different size; merge pieces of one run",
                i + 1
            )));
        }
        let parsed = Shard::parse(doc.shard.as_deref().unwrap_or(""))
            .map_err(|_| bad(format!("piece {} has no valid \"shard\": \"K/N\"", i + 1)))?;
        match count {
            None => {
                if parsed.count > listing.len().max(1) {
                    return Err(bad(format!(
                        "piece {} ({shard}) is one of {} pieces, more than the {} permutations of the listing",
                        i + 1,
                        parsed.count,
                        listing.len()
                    )));
                }
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
        let stated = doc.count;
        let all_nonnegative = doc.all_nonnegative;
        let (Some(r), Some(c)) = (doc.results, doc.counterexamples) else {
            return Err(bad(format!(
                "piece {} lacks \"results\" or \"counterexamples\"",
                i + 1
            )));
        };
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
        let checked = SurveyPiece {
            all_nonnegative,
            results: None,
            counterexamples: None,
            ..SurveyPiece::empty()
        };
        check_piece(&checked, &r, &c, &listing, parsed, i + 1)?;
        results.extend(r);
        counterexamples.extend(c);
    }
    if let Some(missing) = seen.iter().position(|s| !s) {
        return Err(bad(format!(
            "piece {}/{} is missing",
            missing + 1,
            seen.len()
        )));
    }
    results.sort_by(|a, b| a.perm.cmp(&b.perm));
    counterexamples.sort_by(|a, b| a.perm.cmp(&b.perm));
    Ok(MergedSurvey {
        kind: SURVEY_KIND,
        n: n.unwrap_or(0),
        shard: "1/1",
        merged_from: seen.len(),
        count: results.len(),
        all_nonnegative: counterexamples.is_empty(),
        results,
        counterexamples,
        version,
        listed_total: stated_total,
        listing: listing_name,
    })
}

impl SurveyPiece {
    fn empty() -> SurveyPiece {
        SurveyPiece {
            kind: None,
            n: None,
            shard: None,
            count: None,
            all_nonnegative: None,
            results: None,
            counterexamples: None,
            version: None,
            build: None,
            listed_total: None,
            listing: None,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::json;

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
