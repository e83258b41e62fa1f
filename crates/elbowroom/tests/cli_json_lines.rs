//! `--jsonl` on the commands that list rows (`words`, `dreams`, `dreams --bumpless`): a
//! header line, one line per row with the object `--json` lists, a summary line; checked
//! against `--json` of the same run and against published counts.

mod common;

use common::run;
use serde_json::Value;

/// The lines of a `--jsonl` output, each parsed.
fn lines(args: &[&str]) -> Vec<Value> {
    let out = run(args);
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8(out.stdout).expect("UTF-8");
    assert!(text.ends_with('\n'));
    text.lines()
        .map(|l| serde_json::from_str(l).expect("one JSON object a line"))
        .collect()
}

/// `--jsonl` carries the `--json` document: header = its members before the list, rows =
/// the list's items (under `row_key` when a bare item is not an object), summary = the
/// number of rows.
fn same_as_json(args: &[&str], kind: &str, key: &str, row_key: Option<&str>) -> usize {
    let mut jl = args.to_vec();
    jl.push("--jsonl");
    let got = lines(&jl);
    let mut js = args.to_vec();
    js.push("--json");
    let doc = common::json(&js);
    let (head, rest) = got.split_first().expect("a header");
    let (summary, rows) = rest.split_last().expect("a summary");
    assert_eq!(head["kind"], kind, "{args:?}");
    for (k, v) in doc.as_object().expect("an object") {
        if k != key {
            assert_eq!(&head[k], v, "{args:?}: {k}");
        }
    }
    let rows: Vec<Value> = match row_key {
        Some(k) => rows.iter().map(|r| r[k].clone()).collect(),
        None => rows.to_vec(),
    };
    assert_eq!(
        rows,
        doc[key].as_array().expect("a list").as_slice(),
        "{args:?}"
    );
    assert_eq!(summary["summary"], kind);
    assert_eq!(summary["count"], rows.len());
    rows.len()
}

#[test]
fn reduced_words_as_json_lines() {
    // the longest element of S_4 has 16 reduced words, that of S_5 768 (Stanley 1984;
    // OEIS A005118)
    assert_eq!(
        same_as_json(&["words", "4321"], "reduced_words", "words", Some("word")),
        16
    );
    assert_eq!(
        same_as_json(
            &["words", "54321", "--limit", "100"],
            "reduced_words",
            "words",
            Some("word")
        ),
        100
    );
    let all = lines(&["words", "54321", "--limit", "1000", "--jsonl"]);
    assert_eq!(all[0]["count"], "768");
    assert_eq!(all.len(), 768 + 2);
    // --count: the header and an empty listing
    let none = lines(&["words", "4321", "--count", "--jsonl"]);
    assert_eq!(none.len(), 2);
    assert_eq!(none[1]["count"], 0);
}

#[test]
fn pipe_dreams_as_json_lines() {
    // the reduced pipe dreams of w number S_w(1, ..., 1): 5 for 1432 (Fomin–Kirillov;
    // S_1432 = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3, from memory)
    assert_eq!(
        same_as_json(&["dreams", "1432"], "pipe_dreams", "dreams", None),
        5
    );
    // bumpless pipe dreams are counted by S_w(1, ..., 1) too (Lam–Lee–Shimozono 2021)
    assert_eq!(
        same_as_json(
            &["dreams", "1432", "--bumpless"],
            "bumpless_pipe_dreams",
            "dreams",
            None
        ),
        5
    );
}

#[test]
fn json_lines_refuse_another_format() {
    for args in [
        &["words", "321", "--jsonl", "--json"][..],
        &["words", "321", "--jsonl", "--by-content"],
        &["dreams", "132", "--jsonl", "--json"],
        &["hessenberg", "--n", "3", "--jsonl", "--csv"],
        &["survey", "--n", "3", "--jsonl", "--latex"],
    ] {
        let out = run(args);
        assert_eq!(out.status.code(), Some(2), "{args:?}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(err.contains("cannot be used with"), "{args:?}: {err}");
        assert!(out.stdout.is_empty());
    }
}

#[test]
fn a_schubert_expansion_as_json_lines() {
    // S_w = x^code(w) for dominant w (Lascoux–Schützenberger): S_312 = x1^2 and
    // S_231 = x1 x2, so x1^2 + x1 x2 = S_231 + S_312
    let got = lines(&["expand", "x1^2 + x1 x2", "--n", "3", "--stable", "--jsonl"]);
    let doc = common::json(&["expand", "x1^2 + x1 x2", "--n", "3", "--stable", "--json"]);
    assert_eq!(got[0]["kind"], "schubert_expansion");
    assert_eq!(
        (&got[0]["n"], &got[0]["stable"]),
        (&doc["n"], &doc["stable"])
    );
    let rows = &got[1..got.len() - 1];
    assert_eq!(rows, doc["terms"].as_array().expect("a list").as_slice());
    let perms: Vec<&Value> = rows.iter().map(|r| &r["perm"]).collect();
    assert_eq!(
        perms,
        [&serde_json::json!([2, 3, 1]), &serde_json::json!([3, 1, 2])]
    );
    assert!(rows.iter().all(|r| r["coefficient"] == "1"));
    let summary = got.last().expect("a summary");
    assert_eq!(summary["summary"], "schubert_expansion");
    assert_eq!(summary["count"], 2);
    assert_eq!(summary["nonnegative"], doc["nonnegative"]);
}
