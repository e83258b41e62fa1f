//! The commands `coefficient`, `words --by-content`, `schubert --principal` and
//! `eulerian --q`, run as the real binary: worked values (Nadeau–Tewari, IMRN 2023;
//! Postnikov, IMRN 2009; Macdonald's table of S_4), refusals in one line, and a cancel.
#![allow(clippy::unwrap_used)]

use elbowroom::math::explain::explanation::explain;
use elbowroom::math::{MathError, Perm, Progress};
use std::sync::Arc;
use std::time::{Duration, Instant};

mod common;
use common::json;

/// The exit status, standard output and standard error of `elbowroom ARGS...`.
fn run(args: &[&str]) -> (i32, String, String) {
    let out = common::run(args);
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8(out.stdout).unwrap(),
        String::from_utf8(out.stderr).unwrap(),
    )
}

#[test]
fn coefficient_of_1432() {
    // Red(1432) = {232, 323}: (A_021 + A_012)/3! = (4 + 2)/6 = 1; the orbit 1432, 3214
    // sums to |Red| = 2; a_1432(q) = q²
    let v = json(&["coefficient", "1432", "--q", "--json"]);
    assert_eq!(v["perm"], serde_json::json!([1, 4, 3, 2]));
    assert_eq!(v["n"], 4);
    assert_eq!(v["h"], serde_json::json!([2, 3, 4, 4]));
    assert_eq!(v["value"], "1");
    assert_eq!(
        v["by_content"],
        serde_json::json!([
            {"content": [0, 2, 1], "words": "1", "eulerian": "4"},
            {"content": [0, 1, 2], "words": "1", "eulerian": "2"}
        ])
    );
    assert_eq!(v["inverse"]["value"], "1");
    assert_eq!(v["conjugate"]["perm"], serde_json::json!([3, 2, 1, 4]));
    assert_eq!(v["rules"], serde_json::json!([]));
    assert_eq!(v["cyclic"]["sum"], "2");
    assert_eq!(v["cyclic"]["reduced_words"], "2");
    assert_eq!(
        v["cyclic"]["orbit"][1]["perm"],
        serde_json::json!([3, 2, 1, 4])
    );
    assert_eq!(v["q_value"], serde_json::json!(["0", "0", "1"]));
    // the keys come in the order of the contract
    let keys: Vec<&String> = v.as_object().unwrap().keys().collect();
    assert_eq!(
        keys,
        vec![
            "perm",
            "n",
            "h",
            "value",
            "by_content",
            "inverse",
            "conjugate",
            "rules",
            "cyclic",
            "by_trees",
            "q_value"
        ]
    );
    // a_w by trees (Nadeau–Tewari, Adv. Math. 2024): S_1432 = P_(0,2,1) + P_(1,2),
    // and only (1,2) is one tree on the leaves 1..4, with one increasing labeling
    assert_eq!(
        v["by_trees"],
        serde_json::json!([{"code": [1, 2], "coefficient": "1", "labelings": "1"}])
    );
}

/// Σ_T c_(w,T)·labelings = a_w for every w of S_5 with ℓ(w) = 4, read from the
/// JSON the command prints (the trees against the reduced-word formula).
#[test]
fn trees_add_up_to_the_coefficient() {
    let words = [
        "13542", "14352", "14523", "15243", "15324", "21543", "23451", "23514", "24153", "24315",
        "25134", "31452", "31524", "32154", "32415", "34125", "41253", "41325", "42135", "51234",
    ];
    for w in words {
        let v = json(&["coefficient", w, "--json"]);
        let Some(value) = v["value"].as_str() else {
            panic!("{w}: no value in {v}");
        };
        let sum: i64 = v["by_trees"]
            .as_array()
            .unwrap()
            .iter()
            .map(|t| {
                let c: i64 = t["coefficient"].as_str().unwrap().parse().unwrap();
                let l: i64 = t["labelings"].as_str().unwrap().parse().unwrap();
                assert!(c > 0, "{w}: the forest expansion of S_w is positive");
                c * l
            })
            .sum();
        assert_eq!(sum.to_string(), value, "{w}");
    }
}

#[test]
fn coefficient_rules_and_other_h() {
    // 2413 = s2 s1 s3 / s2 s3 s1: a Coxeter element, Grassmannian of shape (2,1), all
    // words parking; every rule gives 2; a_2413(q) = q + q²
    let v = json(&["coefficient", "2413", "--q", "--json"]);
    let names: Vec<&str> = v["rules"]
        .as_array()
        .unwrap()
        .iter()
        .map(|r| r["name"].as_str().unwrap())
        .collect();
    assert_eq!(names, vec!["parking", "grassmannian", "coxeter"]);
    for r in v["rules"].as_array().unwrap() {
        assert_eq!(r["value"], "2");
    }
    assert_eq!(v["q_value"], serde_json::json!(["0", "1", "1"]));
    // h = (3,3,3): the flag variety of S_3, its class is the point class: a_321 = 1
    let v = json(&["coefficient", "321", "--h", "3,3,3", "--json"]);
    assert_eq!(v["value"], "1");
    assert!(v.get("by_content").is_none());
    // the sum over h = (2,3,3) is 2 (σ_213 + σ_132; Anderson–Tymoczko)
    let (code, out, _) = run(&["coefficient", "231", "--h", "2,3,3"]);
    assert_eq!(code, 0);
    assert!(out.starts_with("a_231 = 1"), "{out}");
}

#[test]
fn coefficient_refuses_in_one_line() {
    for args in [
        vec!["coefficient", "1234"],
        vec!["coefficient", "4321"],
        vec!["coefficient", "1432", "--h", "3,3,4,4"],
        vec!["coefficient", "1432", "--h", "2,3,3"],
        vec!["coefficient", "3412", "--h", "3,3,4,4", "--q"],
        vec!["coefficient", "12x"],
    ] {
        let (code, out, err) = run(&args);
        assert_eq!(code, 2, "{args:?}: {err}");
        assert!(out.is_empty());
        assert_eq!(err.lines().count(), 1, "{args:?}: {err}");
    }
    let (_, _, err) = run(&["coefficient", "1234"]);
    assert!(err.contains("length |h| = 3"), "{err}");
    // n = 15 is beyond the explanations
    let w = "2,3,4,5,6,7,8,9,10,11,12,13,14,15,1";
    let (code, _, err) = run(&["coefficient", w]);
    assert_eq!(code, 2);
    assert!(err.contains("n = 15"), "{err}");
}

#[test]
fn words_by_content() {
    // 321: 121 and 212; 1432: 232 and 323 (contents in decreasing lexicographic order)
    let v = json(&["words", "1432", "--by-content", "--json"]);
    assert_eq!(v["perm"], serde_json::json!([1, 4, 3, 2]));
    assert_eq!(v["length"], 3);
    assert_eq!(v["count"], "2");
    assert_eq!(
        v["by_content"],
        serde_json::json!([
            {"content": [0, 2, 1], "words": "1"},
            {"content": [0, 1, 2], "words": "1"}
        ])
    );
    // 4321: 16 words (OEIS A005118); the contents' counts add up to it
    let v = json(&["words", "4321", "--by-content", "--json"]);
    let total: u64 = v["by_content"]
        .as_array()
        .unwrap()
        .iter()
        .map(|r| r["words"].as_str().unwrap().parse::<u64>().unwrap())
        .sum();
    assert_eq!(total, 16);
    // n is the length of w as typed: 21 in S_4 has contents of length 3
    let v = json(&["words", "2134", "--by-content", "--json"]);
    assert_eq!(v["by_content"][0]["content"], serde_json::json!([1, 0, 0]));
}

#[test]
fn schubert_principal_and_eulerian_q() {
    // S_1432(1, q, q², …) = q + 2q² + q³ + q⁴ and S_1432(1, …, 1) = 5 (Macdonald's table)
    let v = json(&["schubert", "1432", "--principal", "--json"]);
    assert_eq!(v["principal"], serde_json::json!(["0", "1", "2", "1", "1"]));
    assert_eq!(v["at_ones"], "5");
    let v = json(&["schubert", "3142", "--principal", "--json"]);
    assert_eq!(v["principal"], serde_json::json!(["0", "1", "1"]));
    // without the flag the output is as before
    let v = json(&["schubert", "1432", "--json"]);
    assert!(v.get("principal").is_none());
    // n = 4: A_030(q) = 2q(1 + q), A_111(q) = [3]_q!
    let v = json(&["eulerian", "--n", "4", "--q", "--json"]);
    let find = |c: [u32; 3]| {
        v["numbers"]
            .as_array()
            .unwrap()
            .iter()
            .find(|r| r["c"] == serde_json::json!(c))
            .unwrap()["q"]
            .clone()
    };
    assert_eq!(find([0, 3, 0]), serde_json::json!(["0", "2", "2"]));
    assert_eq!(find([1, 1, 1]), serde_json::json!(["1", "2", "2", "1"]));
    let plain = json(&["eulerian", "--n", "4", "--json"]);
    assert!(plain["numbers"][0].get("q").is_none());
}

#[test]
fn the_formula_stops_within_100_ms_of_a_cancel() {
    // the window's cancel: a Progress canceled from another thread while the formula
    // runs for w, its inverse, conjugate and cyclic orbit, n = 12 (w0 of S_5 and s_6: 768 · 11 words)
    let w = Perm::parse("5,4,3,2,1,7,6,8,9,10,11,12").unwrap();
    let progress = Arc::new(Progress::new(0));
    let p = progress.clone();
    let worker = std::thread::spawn(move || {
        let r = explain(&w, &p).map(|_| ());
        (r, Instant::now())
    });
    std::thread::sleep(Duration::from_millis(150));
    let canceled_at = Instant::now();
    progress.cancel();
    let (result, ended) = worker.join().unwrap();
    if result == Err(MathError::Canceled) {
        let late = ended.saturating_duration_since(canceled_at);
        assert!(
            late < Duration::from_millis(100),
            "stopped {late:?} after the cancel"
        );
    } else {
        // finished before the cancel: then it must have been correct
        assert_eq!(result, Ok(()));
    }
}
