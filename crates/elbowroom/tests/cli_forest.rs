//! The `forest` command, `reduce --forest` and `figure forest`, run as the
//! real binary: the JSON shapes, the text, and refusals in one line.
#![allow(clippy::unwrap_used)]

use serde_json::json;

mod common;
use common::{interrupted, json as json_of, rejects, run};

/// Nadeau–Tewari 2024 (from memory, checked by hand from the labelings):
/// P_(1,0,1) = x1^2 + x1 x2 + x1 x3.
#[test]
fn forest_code_json() {
    let v = json_of(&["forest", "--code", "1,0,1", "--json"]);
    assert_eq!(
        v,
        json!({"code": [1, 0, 1], "polynomial": {"nvars": 3, "terms": [[[2, 0, 0], "1"], [[1, 1, 0], "1"], [[1, 0, 1], "1"]]}})
    );
    // trailing zeros are dropped; the empty forest is [] with P = 1
    let v = json_of(&["forest", "--code", "0,0", "--json"]);
    assert_eq!(v["code"], json!([]));
    assert_eq!(v["polynomial"]["terms"], json!([[[0], "1"]]));
    let text = String::from_utf8(run(&["forest", "--code", "2,0,1"]).stdout).unwrap();
    assert!(text.contains("F = ((1 2)(3 4))"), "{text}");
    assert!(text.contains("P_F = x1^2 x2 + x1^2 x3"), "{text}");
}

/// S_2413 = P_(1,2) + P_(2,1) and S_3142 = P_(2,0,1), terms in decreasing
/// lexicographic order of code.
#[test]
fn forest_expansion_of_schubert_json() {
    let v = json_of(&["forest", "2413", "--json"]);
    assert_eq!(
        v,
        json!({"perm": [2, 4, 1, 3], "terms": [{"code": [2, 1], "coefficient": "1"}, {"code": [1, 2], "coefficient": "1"}], "single": false})
    );
    let v = json_of(&["forest", "3142", "--json"]);
    assert_eq!(v["single"], json!(true));
    assert_eq!(v["terms"], json!([{"code": [2, 0, 1], "coefficient": "1"}]));
    // the identity: S_id = 1 = P_∅
    let v = json_of(&["forest", "123", "--json"]);
    assert_eq!(v["terms"], json!([{"code": [], "coefficient": "1"}]));
    assert_eq!(v["single"], json!(true));
    let text = String::from_utf8(run(&["forest", "1432"]).stdout).unwrap();
    assert!(text.starts_with("S_1432 = P_(1,2) + P_(0,2,1)\n"), "{text}");
    assert!(text.contains("not a single forest polynomial"), "{text}");
}

/// x2^2 = P_(0,2) − P_(1,1) − P_(2), from the anchors P_(0,2) = x1^2 + x1 x2 + x2^2,
/// P_(1,1) = x1 x2, P_(2) = x1^2; rational coefficients stay exact.
#[test]
fn forest_expansion_of_a_polynomial_json() {
    let v = json_of(&["forest", "--poly", "x2^2", "--n", "2", "--json"]);
    assert_eq!(
        v,
        json!({"n": 2, "terms": [{"code": [2], "coefficient": "-1"}, {"code": [1, 1], "coefficient": "-1"}, {"code": [0, 2], "coefficient": "1"}]})
    );
    let v = json_of(&["forest", "--poly", "1/2 x1 + 3", "--n", "3", "--json"]);
    assert_eq!(
        v["terms"],
        json!([{"code": [1], "coefficient": "1/2"}, {"code": [], "coefficient": "3"}])
    );
}

/// reduce --forest adds "forest" after the existing keys; without the flag the
/// document is unchanged. x1 x2 + x3^2 ≡ 2 x1 x2 = 2 P_(1,1) mod J_3: x3^2 − x1 x2
/// = P_(0,0,2) − ... lies in J_3 (checked against the Gröbner normal form in the tests of the mathematics).
#[test]
fn reduce_in_the_forest_basis() {
    let plain = json_of(&["reduce", "x1*x2 + x3^2", "--n", "3", "--json"]);
    assert!(plain.get("forest").is_none());
    let v = json_of(&["reduce", "x1*x2 + x3^2", "--n", "3", "--json", "--forest"]);
    let keys: Vec<&String> = v.as_object().unwrap().keys().collect();
    assert_eq!(
        keys,
        ["n", "input", "normal_form", "coefficients", "sum", "forest"]
    );
    assert_eq!(v["forest"], json!([{"code": [1, 1], "value": "2"}]));
    for k in ["n", "input", "normal_form", "coefficients", "sum"] {
        assert_eq!(v[k], plain[k], "{k}");
    }
    // degree n or more: the class is 0
    let v = json_of(&["reduce", "x1^3", "--n", "3", "--json", "--forest"]);
    assert_eq!(v["forest"], json!([]));
}

#[test]
fn figure_forest_writes_a_file() {
    let dir = std::env::temp_dir().join(format!("elbowroom-forest-{}", std::process::id()));
    let path = dir.join("f.svg");
    let out = run(&[
        "figure",
        "forest",
        "--code",
        "2,0,1",
        "--out",
        path.to_str().unwrap(),
    ]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let svg = std::fs::read_to_string(&path).unwrap();
    // three internal nodes, tagged
    assert_eq!(svg.matches("data-node=").count(), 3, "{svg}");
    std::fs::remove_dir_all(&dir).unwrap();
    rejects(&["figure", "forest", "--out", "f.svg"], "--code");
}

#[test]
fn bad_forest_input_is_refused_in_one_line() {
    rejects(&["forest", "--code", "1,x"], "not a whole number");
    rejects(&["forest", "--code", "1,,2"], "empty entry");
    rejects(
        &["forest", "--code", "300"],
        "300 internal nodes; at most 255",
    );
    rejects(
        &["forest", "--code", "0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,1"],
        "17 positions",
    );
    rejects(
        &["forest", "--code", "0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,20"],
        "labelings; at most 2000000",
    );
    rejects(
        &["forest", "--poly", "x1^60*x8^60", "--n", "8"],
        "at most 2000000",
    );
    rejects(
        &["forest", "--poly", "x1", "--n", "17"],
        "--n 17 is out of range",
    );
    rejects(&["forest", "--poly", "x4", "--n", "3"], "x4");
    rejects(&["forest"], "give a permutation W");
    rejects(&["forest", "0"], "invalid permutation");
    rejects(
        &["forest", "1,3,5,7,9,11,13,15,2,4,6,8,10,12,14,16"],
        "268435456 terms",
    );
    rejects(
        &["reduce", "x1", "--n", "13", "--forest"],
        "--n 13 is out of range",
    );
}

#[test]
fn ctrl_c_stops_a_forest_expansion() {
    // 3869 forests of degree 10 in x1..x10: seconds of work in the debug build
    let out = interrupted(&[
        "forest",
        "--poly",
        "(x1+2*x2+3*x3+x4+x5+x6+x7+x8+x9+x10)^10",
        "--n",
        "10",
    ]);
    assert_eq!(out.status.code(), Some(130));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("the forest expansion canceled after"), "{err}");
    assert!(out.stdout.is_empty());
}
