//! The headless commands expand, product and `hessenberg --every-h`, run as
//! the real binary: their JSON shapes, published values, and refusals.
#![allow(clippy::unwrap_used)]

use serde_json::{Value, json as j};

mod common;
use common::{json, rejects, run};

fn terms(v: &Value) -> Vec<(Vec<u64>, String)> {
    v["terms"]
        .as_array()
        .unwrap()
        .iter()
        .map(|t| {
            let perm = t["perm"]
                .as_array()
                .unwrap()
                .iter()
                .map(|x| x.as_u64().unwrap())
                .collect();
            (perm, t["coefficient"].as_str().unwrap().to_string())
        })
        .collect()
}

#[test]
fn product_of_two_simple_classes() {
    // S_132 = x1 + x2 and (x1 + x2)^2 = S_231 + S_1423 (Monk 1959: x_2 S_132 = S_231 + S_1423 − ...,
    // checked by hand: S_231 = x1 x2, S_1423 = x1^2 + x1 x2 + x2^2)
    let out = run(&["product", "132", "132"]);
    assert!(out.status.success());
    assert_eq!(
        String::from_utf8(out.stdout).unwrap().trim(),
        "S_132 · S_132 = S_1423 + S_231"
    );
    let v = json(&["product", "132", "132", "--json"]);
    assert_eq!(v["u"], j!([1, 3, 2]));
    assert_eq!(v["v"], j!([1, 3, 2]));
    assert_eq!(
        terms(&v),
        vec![(vec![1, 4, 2, 3], "1".into()), (vec![2, 3, 1], "1".into())]
    );
    // in H*(Fl_3), S_1423 lies in I_3; the perms are written with 3 entries
    let v = json(&["product", "132", "132", "--n", "3", "--json"]);
    assert_eq!(terms(&v), vec![(vec![2, 3, 1], "1".into())]);
    // S_id is the unit; S_{w0} times anything of positive length is 0 in H*(Fl_n)
    let v = json(&["product", "1", "2413", "--json"]);
    assert_eq!(terms(&v), vec![(vec![2, 4, 1, 3], "1".into())]);
    let v = json(&["product", "4321", "213", "--n", "4", "--json"]);
    assert_eq!(terms(&v), vec![]);
}

#[test]
fn littlewood_richardson_through_grassmannian_permutations() {
    // s_21 · s_21 in three variables (Grassmannian permutations with their descent at 3;
    // λ ↦ w with w(i) = i + λ_{4-i} for i <= 3): s_42 + s_411 + s_33 + 2 s_321 + s_222,
    // the terms of s_21 · s_21 = s_42 + s_411 + s_33 + 2 s_321 + s_3111 + s_222 + s_2211
    // (Littlewood–Richardson rule, from memory) with at most three rows.
    let v = json(&["product", "13524", "13524", "--json"]);
    let mut got: Vec<(Vec<u64>, String)> = terms(&v);
    got.sort();
    let mut want: Vec<(Vec<u64>, String)> = vec![
        (vec![1, 4, 7, 2, 3, 5, 6], "1".into()), // s_42
        (vec![2, 3, 7, 1, 4, 5, 6], "1".into()), // s_411
        (vec![1, 5, 6, 2, 3, 4], "1".into()),    // s_33
        (vec![2, 4, 6, 1, 3, 5], "2".into()),    // s_321
        (vec![3, 4, 5, 1, 2], "1".into()),       // s_222
    ];
    want.sort();
    assert_eq!(got, want);
}

#[test]
fn expansions_in_the_flag_variety_and_stably() {
    // (x1 − x3)(x2 − x3) is 3 S_231 in H*(Fl_3): x3 = −x1 − x2 there, and
    // (2x1 + x2)(x1 + 2x2) = 2x1^2 + 5 x1 x2 + 2 x2^2 ≡ 3 x1 x2 modulo I_3 (by hand)
    let v = json(&["expand", "(x1 - x3)(x2 - x3)", "--n", "3", "--json"]);
    assert_eq!(v["n"], 3);
    assert_eq!(terms(&v), vec![(vec![2, 3, 1], "3".into())]);
    assert_eq!(v["nonnegative"], true);
    // stably the same polynomial is S_12534 − 2 S_1342 − S_1423 + 3 S_231 (checked by
    // multiplying out: S_12534 = h_2(x1,x2,x3), S_1342 = e_2(x1,x2,x3)); ordered by
    // length, then lexicographically
    let v = json(&["expand", "(x1-x3)(x2-x3)", "--n", "3", "--stable", "--json"]);
    assert_eq!(
        terms(&v),
        vec![
            (vec![1, 2, 5, 3, 4], "1".into()),
            (vec![1, 3, 4, 2], "-2".into()),
            (vec![1, 4, 2, 3], "-1".into()),
            (vec![2, 3, 1], "3".into()),
        ]
    );
    assert_eq!(v["nonnegative"], false);
    // the same polynomial typed expanded gives the same answer (two methods)
    let w = json(&[
        "expand",
        "x1 x2 - x1 x3 - x2 x3 + x3^2",
        "--n",
        "3",
        "--stable",
        "--json",
    ]);
    assert_eq!(terms(&w), terms(&v));
    // a constant is the identity, written [1]; zero has no terms
    let v = json(&["expand", "5/2", "--n", "3", "--stable", "--json"]);
    assert_eq!(terms(&v), vec![(vec![1], "5/2".into())]);
    let v = json(&["expand", "x1 + x2 + x3", "--n", "3", "--json"]);
    assert_eq!(terms(&v), vec![]);
    // Monk (1959): x_2 S_132 = S_{132 t_24} − S_{132 t_12} = S_1423 − S_312
    // (by hand: x2 (x1 + x2) = (x1^2 + x1 x2 + x2^2) − x1^2)
    let v = json(&["expand", "x2 (x1 + x2)", "--n", "2", "--stable", "--json"]);
    assert_eq!(
        terms(&v),
        vec![(vec![1, 4, 2, 3], "1".into()), (vec![3, 1, 2], "-1".into())]
    );
}

#[test]
fn every_h_summarises_each_table() {
    // Catalan(4) = 14 Hessenberg functions (OEIS A000108)
    let v = json(&["hessenberg", "--n", "4", "--every-h", "--json"]);
    assert_eq!(v["n"], 4);
    let functions = v["functions"].as_array().unwrap();
    assert_eq!(functions.len(), 14);
    // each row agrees with the table of its own h
    for f in functions {
        let h: Vec<String> = f["h"]
            .as_array()
            .unwrap()
            .iter()
            .map(|x| x.to_string())
            .collect();
        let t = json(&["hessenberg", "--n", "4", "--h", &h.join(","), "--json"]);
        for key in ["dimension", "total", "nonzero", "max", "negative"] {
            assert_eq!(f[key], t[key], "h = {h:?}, {key}");
        }
    }
    // h(i) = i: n! points (common practice); h(i) = n: the whole flag variety, a_{w0} = 1
    assert_eq!(functions[0]["h"], j!([1, 2, 3, 4]));
    assert_eq!(functions[0]["total"], "24");
    assert_eq!(functions[13]["h"], j!([4, 4, 4, 4]));
    assert_eq!(functions[13]["total"], "1");
    let csv = run(&["hessenberg", "--n", "3", "--every-h", "--csv"]);
    let text = String::from_utf8(csv.stdout).unwrap();
    assert_eq!(
        text.lines().next(),
        Some("h,dimension,total,nonzero,max,negative")
    );
    assert_eq!(text.lines().count(), 1 + 5);
}

#[test]
fn bad_input_is_refused_in_one_line() {
    rejects(&["product", "1233", "12"], "appears twice");
    rejects(
        &["product", "1243", "12", "--n", "3"],
        "does not lie in S_3",
    );
    rejects(&["expand", "x5", "--n", "3"], "x5");
    rejects(&["expand", "x1", "--n", "0"], "n must be between 1 and 16");
    rejects(
        &["hessenberg", "--n", "4", "--every-h", "--h", "2,3,4,4"],
        "",
    );
    rejects(&["hessenberg", "--n", "40", "--every-h"], "n = 40");
}
