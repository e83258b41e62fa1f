//! The quotient, reduce and survey commands, run as the real binary.
#![allow(clippy::unwrap_used)]

use serde_json::{Value, json};

mod common;
use common::{interrupted, json as json_of, rejects, run};

fn assert_input_error(args: &[&str]) {
    rejects(args, "");
}

/// Aval–Bergeron–Bergeron (2004): Catalan(4) = 14 (OEIS A000108), graded 1, 3, 5, 5
/// (OEIS A009766, row 3).
#[test]
fn quotient_json() {
    let v = json_of(&["quotient", "--n", "4", "--json"]);
    assert_eq!(v["basis"].as_array().unwrap().len(), 14);
    assert_eq!(v["hilbert"], json!([1, 3, 5, 5]));
    assert_eq!(v["dimension"], json!("14"));
    // corners: 1 + 1 + 2 + 5 = Catalan(0..3) summed
    assert_eq!(v["groebner_size"], json!(9));
    assert_eq!(v["basis"][0], json!([0, 0, 0, 0]));
    assert_eq!(v["paths"][1]["steps"].as_str().unwrap().len(), 8);
    let text = String::from_utf8(run(&["quotient", "--n", "3"]).stdout).unwrap();
    assert!(text.contains("x2^2 + x2 x3 + x3^2"), "{text}");
}

#[test]
fn reduce_json() {
    // x1 ≡ -x2 - x3 modulo M_(1) = x1 + x2 + x3
    let v = json_of(&["reduce", "x1", "--n", "3", "--json"]);
    assert_eq!(
        v["normal_form"],
        json!({"nvars": 3, "terms": [[[0, 1, 0], "-1"], [[0, 0, 1], "-1"]]})
    );
    assert_eq!(
        v["coefficients"][0],
        json!({"monomial": [0, 1, 0], "basis_index": 1, "value": "-1"})
    );
    // quasisymmetric atoms lie in the ideal; a constant survives
    let v = json_of(&["reduce", "M(2,1) + 3 F(1,1) - 1/2", "--n", "3", "--json"]);
    assert_eq!(
        v["normal_form"],
        json!({"nvars": 3, "terms": [[[0, 0, 0], "-1/2"]]})
    );
    assert_eq!(v["sum"], json!("-1/2"));
}

#[test]
fn bad_input_is_one_line_and_status_2() {
    assert_input_error(&["reduce", "x1 +", "--n", "3", "--json"]);
    assert_input_error(&["reduce", "x5", "--n", "3"]);
    assert_input_error(&["reduce", "M(0,1)", "--n", "3"]);
    assert_input_error(&["quotient", "--n", "13", "--json"]);
    assert_input_error(&["quotient", "--n", "0"]);
    // the Gröbner basis stops at 11; normal forms (through forests) at 12
    assert_input_error(&["survey", "--n", "13", "--json"]);
    assert_input_error(&["reduce", "x1", "--n", "13"]);
    // a piece beyond the listing (S_2 lists 2 permutations)
    rejects(
        &["survey", "--n", "2", "--shard", "3/5"],
        "beyond the listing",
    );
    assert_input_error(&["survey", "--perm", "1123"]);
    assert_input_error(&["survey", "--n", "3", "--shard", "4/3"]);
    assert_input_error(&["survey"]);
}

#[test]
fn survey_json_summary_and_csv() {
    let v = json_of(&["survey", "--n", "4", "--json"]);
    assert_eq!(v["kind"], json!("quotient_survey"));
    assert_eq!(v["shard"], json!("1/1"));
    let results = v["results"].as_array().unwrap();
    assert_eq!(results.len(), 24);
    // S_{1243} = x1 + x2 + x3, reversed x4 + x3 + x2: already standard
    let w = results
        .iter()
        .find(|r| r["perm"] == json!([1, 2, 4, 3]))
        .unwrap();
    assert_eq!(w["terms"], json!(3));
    assert_eq!(w["sum"], json!("3"));
    assert!(w["normal_form"].is_object());
    let s = json_of(&["survey", "--n", "4", "--json", "--summary"]);
    assert!(s["results"][0].get("normal_form").is_none());
    let csv = String::from_utf8(run(&["survey", "--n", "4", "--csv"]).stdout).unwrap();
    assert_eq!(csv.lines().count(), 25);
    let tex =
        String::from_utf8(run(&["survey", "--n", "4", "--latex", "--summary"]).stdout).unwrap();
    assert!(tex.contains("\\begin{tabular}") && tex.ends_with("\\end{tabular}\n"));
    // a header and the 24 permutations of S_4
    assert_eq!(tex.matches("\\\\\n").count(), 25, "{tex}");
    let one = json_of(&["survey", "--perm", "2143", "--json"]);
    assert_eq!(one["results"][0]["perm"], json!([2, 1, 4, 3]));
}

/// The pieces of a sharded survey merge back into the whole survey.
#[test]
fn sharded_survey_merges_to_the_whole() {
    let whole = json_of(&["survey", "--n", "4", "--json"]);
    let pieces: Vec<Value> = (1..=3)
        .map(|k| json_of(&["survey", "--n", "4", "--json", "--shard", &format!("{k}/3")]))
        .collect();
    assert_eq!(pieces[0]["results"].as_array().unwrap().len(), 8);
    // through `elbowroom merge`, from files
    let dir = std::env::temp_dir().join(format!("elbowroom-survey-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let mut files = Vec::new();
    for (k, p) in pieces.iter().enumerate() {
        let f = dir.join(format!("piece{k}.json"));
        std::fs::write(&f, p.to_string()).unwrap();
        files.push(f.display().to_string());
    }
    let mut args = vec!["merge"];
    args.extend(files.iter().map(String::as_str));
    let via_cli = json_of(&args);
    assert_eq!(via_cli["results"], whole["results"]);
    assert_eq!(via_cli["counterexamples"], whole["counterexamples"]);
    assert_eq!(via_cli["kind"], json!("quotient_survey"));
    let _ = std::fs::remove_dir_all(&dir);
}

/// Ctrl-C: exit status 130, a message on stderr, nothing on stdout. SIGINT is
/// sent once the binary says the survey is registered with its handler.
#[cfg(unix)]
#[test]
fn interrupt_cancels_cleanly() {
    // n = 10: the walk takes seconds, so the signal lands inside it (or inside the basis)
    let out = interrupted(&["survey", "--n", "10", "--json"]);
    assert_eq!(out.status.code(), Some(130));
    assert!(out.stdout.is_empty());
    let err = String::from_utf8(out.stderr).unwrap();
    assert!(
        err.contains("the survey canceled after") && err.contains("permutations"),
        "{err}"
    );
}

/// n = 9 (the first n past the old limit): Catalan(9) = 4862 (OEIS A000108) and the
/// graded dimensions (9 − k)/(9 + k)·C(9 + k, k) (Aval–Bergeron–Bergeron 2004; OEIS
/// A009766, row 8: 1, 8, 35, 110, 275, 572, 1001, 1430, 1430); the survey lists the 8095
/// permutations of length <= 8 and says so.
#[test]
fn quotient_and_survey_at_n9() {
    let v = json_of(&["quotient", "--n", "9", "--json"]);
    assert_eq!(v["dimension"], json!("4862"));
    assert_eq!(
        v["hilbert"],
        json!([1, 8, 35, 110, 275, 572, 1001, 1430, 1430])
    );
    // corners: Catalan(0) + ... + Catalan(8) = 1 + 1 + 2 + 5 + 14 + 42 + 132 + 429 + 1430
    assert_eq!(v["groebner_size"], json!(2056));
    // M_(2,1,3) lies in J_9; x9^8 is standard (partial sums 0, ..., 0, 8 <= 8)
    let r = json_of(&["reduce", "M(2,1,3) + x9^8", "--n", "9", "--json"]);
    let c = r["coefficients"].as_array().unwrap();
    assert_eq!(c.len(), 1);
    assert_eq!(c[0]["monomial"], json!([0, 0, 0, 0, 0, 0, 0, 0, 8]));
    assert_eq!(c[0]["value"], json!("1"));
    let s = json_of(&[
        "survey",
        "--n",
        "9",
        "--json",
        "--summary",
        "--shard",
        "3/4",
    ]);
    assert_eq!(s["listed_total"], json!(8095));
    assert_eq!(s["count"], json!(2024));
}

#[test]
fn the_paths_figure_carries_its_legend_when_asked() {
    // NF of S_2413(x4, ..., x1) modulo J_4 = x3^2 x4 + x3 x4^2 (two panels); the legend
    // reads x^e as the path N^{e_1} E ... N^{e_n} E N^{n-|e|} (Aval–Bergeron–Bergeron 2004)
    let dir = std::env::temp_dir().join(format!("elbowroom-legend-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let plain = dir.join("plain.svg");
    let legend = dir.join("legend.svg");
    for (path, extra) in [(&plain, None), (&legend, Some("--legend"))] {
        let mut args = vec!["figure", "paths", "2413", "--out", path.to_str().unwrap()];
        args.extend(extra);
        let out = run(&args);
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
    }
    let plain = std::fs::read_to_string(&plain).unwrap();
    let legend = std::fs::read_to_string(&legend).unwrap();
    assert!(!plain.contains("a step east"));
    assert!(legend.contains("a step east"), "{legend}");
    assert!(legend.contains("Catalan(n)"));
    std::fs::remove_dir_all(&dir).ok();
}
