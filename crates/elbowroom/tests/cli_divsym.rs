//! The headless commands divsym, hessenberg, volume, eulerian and merge, run as the real binary.
#![allow(clippy::unwrap_used)]

use serde_json::Value;

mod common;
use common::{interrupted, json, rejects, run};

#[test]
fn divsym_gives_numbers_and_symmetric_polynomials() {
    // DS_3(x2^2) = -2 (Postnikov's descent formula: S = {1}, β_3({1}) = 2)
    let v = json(&["divsym", "x2^2", "--n", "3", "--json"]);
    assert_eq!(v["result"]["terms"], serde_json::json!([[[0, 0, 0], "-2"]]));
    // zero has no terms
    let v = json(&["divsym", "x1", "--n", "3", "--json"]);
    assert_eq!(v["result"]["terms"], serde_json::json!([]));
    // DS_3(x1^3) = m_1 = x1 + x2 + x3
    let v = json(&["divsym", "x1^3", "--n", "3", "--json"]);
    assert_eq!(v["result"]["terms"].as_array().unwrap().len(), 3);
    assert_eq!(
        v["symmetric"],
        serde_json::json!([{"lambda": [1, 0, 0], "value": "1"}])
    );
    // with h(i) = n the only number in degree C(n,2) is DS_h(x^δ) = ∂_{w0} x^δ = 1
    let v = json(&["divsym", "x1^2 x2", "--n", "3", "--h", "3,3,3", "--json"]);
    assert_eq!(v["result"]["terms"], serde_json::json!([[[0, 0, 0], "1"]]));
    rejects(
        &["divsym", "x1^2", "--n", "3", "--h", "2,1,3"],
        "weakly increasing",
    );
    rejects(&["divsym", "x1^2", "--n", "3", "--h", "2,3"], "entries");
    rejects(&["divsym", "x1 +* x2", "--n", "3"], "");
    rejects(&["divsym", "x5", "--n", "3"], "");
}

#[test]
fn hessenberg_lists_every_permutation_of_the_right_length() {
    let v = json(&["hessenberg", "--n", "4", "--json"]);
    assert_eq!(v["kind"], "hessenberg_table");
    assert_eq!(v["dimension"], 3);
    let c = v["coefficients"].as_array().unwrap();
    assert_eq!(c.len(), 6); // Mahonian T(4, 3) = 6, OEIS A008302
    assert_eq!(c[0]["perm"], serde_json::json!([1, 4, 3, 2]));
    // point variety: a^h_id = n! = 24 (common practice)
    let v = json(&["hessenberg", "--n", "4", "--h", "1,2,3,4", "--json"]);
    assert_eq!(v["coefficients"][0]["value"], "24");
    let csv = run(&["hessenberg", "--n", "4", "--csv"]);
    let text = String::from_utf8(csv.stdout).unwrap();
    assert_eq!(text.lines().count(), 7);
    assert!(text.starts_with("perm,length,value\n\"1,4,3,2\",3,"));
    let tex = String::from_utf8(run(&["hessenberg", "--n", "4", "--latex"]).stdout).unwrap();
    assert!(tex.contains("\\begin{tabular}") && tex.contains("\\end{tabular}"));
    rejects(&["hessenberg", "--n", "4", "--shard", "5/4"], "K/N");
    rejects(&["hessenberg", "--n", "0"], "1 <= n");
}

#[test]
fn sharded_pieces_merge_into_the_single_run() {
    let dir = std::env::temp_dir().join(format!("elbowroom-merge-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let single = json(&["hessenberg", "--n", "6", "--h", "3,3,4,5,6,6", "--json"]);
    let mut files = Vec::new();
    for k in 1..=3 {
        let piece = run(&[
            "hessenberg",
            "--n",
            "6",
            "--h",
            "3,3,4,5,6,6",
            "--shard",
            &format!("{k}/3"),
            "--json",
        ]);
        assert!(piece.status.success());
        let v: Value = serde_json::from_slice(&piece.stdout).unwrap();
        assert_eq!(v["shard"], format!("{k}/3"));
        let path = dir.join(format!("piece{k}.json"));
        std::fs::write(&path, &piece.stdout).unwrap();
        files.push(path.to_string_lossy().to_string());
    }
    let args: Vec<&str> = std::iter::once("merge")
        .chain(files.iter().map(|s| s.as_str()))
        .collect();
    assert_eq!(json(&args), single);
    // incomplete, repeated, or from another run
    rejects(&["merge", &files[0], &files[1]], "missing");
    rejects(&["merge", &files[0], &files[0], &files[1]], "twice");
    let other = run(&["hessenberg", "--n", "6", "--shard", "3/3", "--json"]);
    let other_path = dir.join("other.json");
    std::fs::write(&other_path, &other.stdout).unwrap();
    rejects(
        &["merge", &files[0], &files[1], other_path.to_str().unwrap()],
        "differs",
    );
    let bad_path = dir.join("bad.json");
    std::fs::write(&bad_path, "{\"kind\": \"something_else\"}").unwrap();
    rejects(&["merge", bad_path.to_str().unwrap()], "accepted kinds");
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn volume_and_eulerian() {
    // the regular permutohedron of size 5 has volume 5^3 = 125 (Postnikov IMRN 2009; OEIS A000272)
    let v = json(&["volume", "--lambda", "0,1,2,3,4", "--json"]);
    assert_eq!(v["volume"], "125");
    assert_eq!(v["vertices"], "120");
    let v = json(&["volume", "--lambda", "1/2,-1,1/2", "--json", "--polynomial"]);
    assert_eq!(v["vertices"], "3");
    assert_eq!(v["volume"], "9/8"); // a triangle with side vector (3/2, -3/2, 0): area (3/2)^2 / 2
    assert_eq!(v["polynomial"]["nvars"], 3);
    assert_eq!(v["drawing"]["edges"].as_array().unwrap().len(), 3);
    rejects(&["volume", "--lambda", "1,x"], "rational");
    let v = json(&["eulerian", "--n", "4", "--json"]);
    let numbers = v["numbers"].as_array().unwrap();
    assert_eq!(numbers.len(), 10);
    assert_eq!(
        numbers[0],
        serde_json::json!({"c": [3, 0, 0], "value": "1"})
    );
    assert_eq!(v["sum"], "30"); // 3! Catalan(3) (Postnikov §16)
    rejects(&["eulerian", "--n", "1"], "2 <= n");
}

/// Ctrl-C: exit status 130, how far it got on stderr, nothing on stdout. SIGINT
/// is sent once the binary says the table is registered with its handler.
#[cfg(unix)]
#[test]
fn ctrl_c_stops_a_long_table_cleanly() {
    let out = interrupted(&["hessenberg", "--n", "12", "--json"]);
    assert_eq!(out.status.code(), Some(130));
    assert!(out.stdout.is_empty(), "no partial JSON");
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains("canceled after") && err.contains("permutations"),
        "{err}"
    );
}

#[test]
fn eulerian_tables_as_csv_and_latex() {
    // n = 4: the 10 compositions of 3 into 3 parts; A_{(1,1,1)} = (n-1)! = 6 and the
    // sum of all A_c is (n-1)!·Catalan(n-1) = 6·5 = 30 (Postnikov, IMRN 2009, §16, from memory)
    let csv = String::from_utf8(run(&["eulerian", "--n", "4", "--csv"]).stdout).unwrap();
    assert_eq!(csv.lines().count(), 11, "{csv}");
    assert!(csv.starts_with("c,value\n"), "{csv}");
    assert!(csv.contains("\n\"(1,1,1)\",6\n"), "{csv}");
    let tex = String::from_utf8(run(&["eulerian", "--n", "4", "--latex"]).stdout).unwrap();
    assert!(tex.contains("sum of all A_c = 30"), "{tex}");
    assert!(tex.contains("$(1,1,1)$ & $6$ \\\\"), "{tex}");
    assert_eq!(
        tex.matches("\\\\\n").count(),
        11,
        "a header and 10 rows: {tex}"
    );
    rejects(
        &["eulerian", "--n", "4", "--csv", "--latex"],
        "cannot be used with",
    );
}
