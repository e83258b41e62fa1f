//! The `perm`, `words` and `dreams` commands, run as the real binary; values are
//! checked against published counts (OEIS A005118, A000108) and Schubert polynomials;
//! and what any command does when its output cannot be written.
#![allow(clippy::unwrap_used)]

use serde_json::Value;
use std::process::Command;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .output()
        .unwrap();
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8(out.stdout).unwrap(),
        String::from_utf8(out.stderr).unwrap(),
    )
}

fn json(args: &[&str]) -> Value {
    let (code, out, err) = run(args);
    assert_eq!(code, 0, "stderr: {err}");
    assert_eq!(out.lines().count(), 1, "one JSON object on one line");
    serde_json::from_str(&out).unwrap()
}

#[test]
fn perm_reports_counts() {
    // A005118: 16 reduced words of 4321; w0 has the single pipe dream x1^3 x2^2 x3
    let v = json(&["perm", "4321", "--json"]);
    assert_eq!(v["reduced_words"], "16");
    assert_eq!(v["pipe_dreams"], "1");
    for key in [
        "perm", "n", "length", "code", "inverse", "descents", "classes",
    ] {
        assert!(v.get(key).is_some(), "missing {key}");
    }
    // S_{1432}(1,1,1,1) = 5 (Macdonald's table for S_4); 1432 = s2 s3 s2 = s3 s2 s3
    let v = json(&["perm", "1432", "--json"]);
    assert_eq!(v["pipe_dreams"], "5");
    assert_eq!(v["reduced_words"], "2");
    let (code, out, _) = run(&["perm", "1432"]);
    assert_eq!(code, 0);
    assert!(out.contains("pipe dreams") && out.contains('5'));
}

#[test]
fn words_lists_in_lex_order() {
    let v = json(&["words", "4321", "--json"]);
    assert_eq!(v["count"], "16");
    let words = v["words"].as_array().unwrap();
    assert_eq!(words.len(), 16);
    assert_eq!(words[0], serde_json::json!([1, 2, 1, 3, 2, 1]));
    assert_eq!(words[15], serde_json::json!([3, 2, 3, 1, 2, 3]));
    let v = json(&["words", "54321", "--json", "--limit", "5"]);
    assert_eq!(v["count"], "768");
    assert_eq!(v["words"].as_array().unwrap().len(), 5);
    let v = json(&["words", "654321", "--json", "--count"]);
    assert_eq!(v["count"], "292864");
    assert_eq!(v["words"], serde_json::json!([]));
    // w0 in S_10 (A005118)
    let v = json(&["words", "10,9,8,7,6,5,4,3,2,1", "--json", "--count"]);
    assert_eq!(v["count"], "273035280663535522487992320");
}

#[test]
fn dreams_of_w0_and_catalan() {
    let v = json(&["dreams", "4321", "--json"]);
    assert_eq!(v["count"], "1");
    let d = &v["dreams"][0];
    assert_eq!(
        d["crosses"],
        serde_json::json!([[1, 1], [1, 2], [1, 3], [2, 1], [2, 2], [3, 1]])
    );
    assert_eq!(d["monomial"], serde_json::json!([3, 2, 1, 0]));
    // S_{1 6 5 4 3 2}(1) = Catalan(5) = 42 (A000108; Woo 2004, from memory)
    let v = json(&["dreams", "165432", "--json", "--limit", "100"]);
    assert_eq!(v["count"], "42");
    assert_eq!(v["dreams"].as_array().unwrap().len(), 42);
    for d in v["dreams"].as_array().unwrap() {
        // the reading word has ℓ(165432) = 10 letters, one per cross
        assert_eq!(d["word"].as_array().unwrap().len(), 10);
        assert_eq!(d["crosses"].as_array().unwrap().len(), 10);
    }
    let v = json(&["dreams", "165432", "--json", "--count"]);
    assert_eq!(v["dreams"], serde_json::json!([]));
}

#[test]
fn bumpless_dreams_of_1432() {
    // S_{1432} has five terms, each with coefficient 1
    let v = json(&["dreams", "1432", "--bumpless", "--json"]);
    assert_eq!(v["count"], "5");
    let dreams = v["dreams"].as_array().unwrap();
    assert_eq!(dreams.len(), 5);
    let mut monomials: Vec<Value> = dreams.iter().map(|d| d["monomial"].clone()).collect();
    monomials.sort_by_key(|m| m.to_string());
    let mut expected = vec![
        serde_json::json!([2, 1, 0, 0]),
        serde_json::json!([2, 0, 1, 0]),
        serde_json::json!([1, 2, 0, 0]),
        serde_json::json!([1, 1, 1, 0]),
        serde_json::json!([0, 2, 1, 0]),
    ];
    expected.sort_by_key(|m| m.to_string());
    assert_eq!(monomials, expected);
    for d in dreams {
        assert_eq!(d["blanks"].as_array().unwrap().len(), 3);
    }
    let (code, out, _) = run(&["dreams", "1432", "--bumpless"]);
    assert_eq!(code, 0);
    assert!(out.contains('┌'));
}

#[test]
fn text_pictures() {
    let (code, out, _) = run(&["dreams", "312"]);
    assert_eq!(code, 0);
    assert!(out.starts_with("1 reduced pipe dream of 312"));
    assert!(out.contains("+ + ╯"));
}

#[test]
fn bad_input_exits_2_with_one_line() {
    for args in [
        vec!["perm", "3155", "--json"],
        vec!["words", "12a", "--json"],
        vec!["dreams", "", "--json"],
        vec!["dreams", "21", "--limit", "many"],
        vec!["words", "0,1", "--json"],
    ] {
        let (code, out, err) = run(&args);
        assert_eq!(code, 2, "{args:?}");
        assert!(out.is_empty(), "{args:?}: {out}");
        assert_eq!(err.trim_end().lines().count(), 1, "{args:?}: {err}");
    }
}

#[test]
fn a_failed_write_is_an_error_not_a_success() {
    // /dev/full refuses every write with ENOSPC, as a full disk does
    let Ok(full) = std::fs::OpenOptions::new().write(true).open("/dev/full") else {
        eprintln!("skipped: this system has no /dev/full");
        return;
    };
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(["hessenberg", "--n", "6", "--json"])
        .stdout(full)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(1));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.starts_with("elbowroom: cannot write standard output:"),
        "{err}"
    );
}
