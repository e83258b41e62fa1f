//! Streamed output, run as the real binary: Hessenberg tables written row by row
//! agree with the tables collected by the library, their row counts are the
//! Mahonian numbers, words and dreams stream their first K items, Ctrl-C during
//! a listing says how far it got, and merge re-checks every piece it reads.
#![allow(clippy::unwrap_used)]

mod common;

use common::{interrupted, json, rejects, run};
use elbowroom::cli::documents::hessenberg_table_json;
use elbowroom::cli::json::render;
use elbowroom::cli::shard::Shard;
use elbowroom::math::Progress;
use elbowroom::math::hessenberg::coefficients::coefficient_table;
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::tables::results::hessenberg_table;

fn stdout(args: &[&str]) -> String {
    let out = run(args);
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

/// The streamed JSON and CSV of `hessenberg` are byte for byte the collected
/// table's (the library's `hessenberg_table_json` rendered whole, and the CSV of
/// `hessenberg_table`), for every h of n <= 5, whole and in pieces.
#[test]
fn streamed_tables_equal_the_collected_ones() {
    for n in 1..=5 {
        for h in HessenbergFn::all(n) {
            let h_text: Vec<String> = h.values().iter().map(|v| v.to_string()).collect();
            let h_arg = h_text.join(",");
            let n_arg = n.to_string();
            for shard in [Shard::WHOLE, Shard { index: 2, count: 3 }] {
                let table =
                    coefficient_table(&h, &|i| shard.selects(i), &Progress::default()).unwrap();
                let shard_arg = format!("{}/{}", shard.index, shard.count);
                let base = [
                    "hessenberg",
                    "--n",
                    &n_arg,
                    "--h",
                    &h_arg,
                    "--shard",
                    &shard_arg,
                ];
                let mut with_json = base.to_vec();
                with_json.push("--json");
                if table.listed < shard.count {
                    // a split into more pieces than the listing has rows is refused
                    rejects(&with_json, "beyond the listing");
                    continue;
                }
                assert_eq!(
                    stdout(&with_json),
                    render(&hessenberg_table_json(&table, shard)) + "\n",
                    "h = {h}, piece {shard_arg}"
                );
                let mut with_csv = base.to_vec();
                with_csv.push("--csv");
                assert_eq!(
                    stdout(&with_csv),
                    hessenberg_table(&table).to_csv(),
                    "h = {h}, piece {shard_arg}"
                );
            }
        }
    }
}

/// Row counts of the default table (|h| = n − 1) and of h = (3,4,5,5,5) (|h| = 7)
/// are the Mahonian numbers M(n, k), the number of permutations of n with k
/// inversions (OEIS A008302, rows from memory: 1 3 5 6 5 3 1 for n = 4;
/// 1 4 9 15 20 22 20 15 9 4 1 for n = 5; 1 5 14 29 49 71 90 101 ... for n = 6;
/// 1 6 20 49 98 169 259 ... for n = 7; 1 7 27 76 174 343 602 961 ... for n = 8).
#[test]
fn row_counts_are_mahonian_numbers() {
    for (n, rows) in [(4, 6), (5, 20), (6, 71), (7, 259), (8, 961)] {
        let csv = stdout(&["hessenberg", "--n", &n.to_string(), "--csv"]);
        assert_eq!(csv.lines().count() - 1, rows, "n = {n}");
        let text = stdout(&["hessenberg", "--n", &n.to_string()]);
        // a heading, the column names, the rows, the summary
        assert_eq!(text.lines().count() - 3, rows, "n = {n}");
        assert!(text.contains(&format!("permutations = {rows}")), "n = {n}");
    }
    let csv = stdout(&["hessenberg", "--n", "5", "--h", "3,4,5,5,5", "--csv"]);
    assert_eq!(csv.lines().count() - 1, 15);
    // the pieces of a split hold ceil((M - K + 1) / N) rows each and add up to M
    let mut total = 0;
    for k in 1..=4 {
        let v = json(&[
            "hessenberg",
            "--n",
            "7",
            "--shard",
            &format!("{k}/4"),
            "--json",
        ]);
        let rows = v["coefficients"].as_array().unwrap().len();
        assert_eq!(rows, (259 - k) / 4 + 1);
        total += rows;
    }
    assert_eq!(total, 259);
}

/// `--limit K` streams the first K reduced words and pipe dreams; the count is
/// the whole number (reduced words of w0 in S_4: 16, Stanley 1984, OEIS A005118;
/// pipe dreams of w0 in S_4: one, of 1432: S_1432(1,1,1) = 5, Macdonald's tables).
#[test]
fn limits_stream_the_first_items() {
    let v = json(&["words", "4321", "--limit", "5", "--json"]);
    assert_eq!(v["count"], "16");
    assert_eq!(v["words"].as_array().unwrap().len(), 5);
    assert_eq!(v["words"][0], serde_json::json!([1, 2, 1, 3, 2, 1]));
    let all = json(&["words", "4321", "--json"]);
    assert_eq!(all["words"].as_array().unwrap().len(), 16);
    assert_eq!(
        all["words"].as_array().unwrap()[..5],
        v["words"].as_array().unwrap()[..]
    );
    let d = json(&["dreams", "1432", "--limit", "2", "--json"]);
    assert_eq!(d["count"], "5");
    assert_eq!(d["dreams"].as_array().unwrap().len(), 2);
    let text = stdout(&["words", "4321", "--limit", "3"]);
    assert!(text.starts_with("16 reduced words of 4321 (length 6); the first 3:\n"));
    assert_eq!(text.lines().count(), 4);
}

/// Ctrl-C during a long listing: exit status 130 and a line saying how far it got.
#[test]
fn ctrl_c_stops_a_listing_and_says_so() {
    // w0 of S_9 has about 10^20 reduced words; 1 16 15 ... 2 has Catalan(15) = 9 694 845 pipe dreams
    for args in [
        ["words", "987654321", "--limit", "100000000"],
        [
            "dreams",
            "1,16,15,14,13,12,11,10,9,8,7,6,5,4,3,2",
            "--limit",
            "100000000",
        ],
    ] {
        let out = interrupted(&args);
        assert_eq!(out.status.code(), Some(130), "{args:?}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(err.contains("canceled"), "{args:?}: {err}");
        assert_eq!(err.trim().lines().count(), 1, "{args:?}: {err}");
    }
}

/// merge re-reads every piece: refuses a device, a piece cut short, totals that
/// do not match the piece's rows, a changed value, another version, a missing piece.
#[test]
fn merge_rechecks_every_piece() {
    let dir = std::env::temp_dir().join(format!("elbowroom-stream-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let mut files = Vec::new();
    let mut texts = Vec::new();
    for k in 1..=3 {
        let text = stdout(&[
            "hessenberg",
            "--n",
            "7",
            "--shard",
            &format!("{k}/3"),
            "--json",
        ]);
        let path = dir.join(format!("p{k}.json"));
        std::fs::write(&path, &text).unwrap();
        files.push(path.to_string_lossy().to_string());
        texts.push(text);
    }
    let merged = stdout(&["merge", &files[2], &files[0], &files[1]]);
    assert_eq!(merged, stdout(&["hessenberg", "--n", "7", "--json"]));
    let variant = |name: &str, text: String| {
        let path = dir.join(name);
        std::fs::write(&path, text).unwrap();
        path.to_string_lossy().to_string()
    };
    rejects(&["merge", "/dev/zero"], "not a regular file");
    let cut = variant("cut.json", texts[1][..texts[1].len() / 2].to_string());
    rejects(
        &["merge", &files[0], &cut, &files[2]],
        "cut.json: cut short",
    );
    let total = variant(
        "total.json",
        texts[1].replace("\"total\":\"", "\"total\":\"1"),
    );
    rejects(&["merge", &files[0], &total, &files[2]], "\"total\"");
    let value = variant(
        "value.json",
        texts[1].replacen("\"value\":\"1\"", "\"value\":\"2\"", 1),
    );
    rejects(&["merge", &files[0], &value, &files[2]], "value.json");
    let version = variant(
        "version.json",
        texts[1].replace(
            &format!("\"version\":\"{}\"", env!("CARGO_PKG_VERSION")),
            "\"version\":\"0.0.1\"",
        ),
    );
    rejects(&["merge", &files[0], &version, &files[2]], "\"version\"");
    rejects(&["merge", &files[0], &files[2]], "pieces 2/3 are missing");
    // pieces are read as JSON: white space after the colons changes nothing
    let spaced = variant("spaced.json", texts[1].replace("\":", "\": "));
    assert_eq!(stdout(&["merge", &files[0], &spaced, &files[2]]), merged);
    // a piece of another build is refused, naming the builds
    let build = format!("\"build\":\"{}\"", elbowroom::cli::documents::BUILD);
    assert!(texts[1].contains(&build), "a piece names its build");
    let other = variant(
        "build.json",
        texts[1].replace(&build, "\"build\":\"0123456789ab\""),
    );
    rejects(
        &["merge", &files[0], &other, &files[2]],
        "build 0123456789ab",
    );
    // the summary and the labels may stand before the coefficients
    let reordered = {
        let v: serde_json::Value = serde_json::from_str(&texts[1]).unwrap();
        let obj = v.as_object().unwrap();
        let mut text = String::from("{");
        for key in [
            "shard", "total", "version", "build", "nonzero", "max", "negative",
        ] {
            text.push_str(&format!("\"{key}\":{},", obj[key]));
        }
        text.push_str(&format!(
            "\"all_nonnegative_integers\":{},",
            obj["all_nonnegative_integers"]
        ));
        for key in [
            "kind",
            "n",
            "h",
            "dimension",
            "order",
            "listed",
            "coefficients",
        ] {
            text.push_str(&format!("\"{key}\":{},", obj[key]));
        }
        text.pop();
        text.push('}');
        variant("reordered.json", text)
    };
    assert_eq!(stdout(&["merge", &files[0], &reordered, &files[2]]), merged);
    // a large field (300 000 list items, a 6 MB string in pieces) before
    // "kind" is stepped over, not held
    let padded = variant(
        "padded.json",
        format!(
            "{{\"notes\":[{}0],\"more\":[{}],{}",
            "0,".repeat(300_000),
            vec![format!("\"{}\"", "x".repeat(60_000)); 100].join(","),
            &texts[1][1..]
        ),
    );
    assert_eq!(stdout(&["merge", &files[0], &padded, &files[2]]), merged);
    // one string longer than 64 KiB is refused, in one line
    let long = variant(
        "long.json",
        format!("{{\"notes\":\"{}\",{}", "x".repeat(70_000), &texts[1][1..]),
    );
    rejects(
        &["merge", &files[0], &long, &files[2]],
        "longer than 65536 bytes",
    );
    // a coefficient with a foreign w, and one list item too many
    let foreign = variant(
        "foreign.json",
        texts[1].replacen("{\"perm\":[", "{\"perm\":[9,9,", 1),
    );
    rejects(
        &["merge", &files[0], &foreign, &files[2]],
        "does not follow the listing",
    );
    // a split into N pieces with N far beyond the listing costs nothing to refuse
    let one = variant(
        "wide.json",
        texts[0].replace("\"shard\":\"1/3\"", "\"shard\":\"1/18446744073709551615\""),
    );
    rejects(
        &["merge", &one],
        "and 18446744073709551609 more are missing",
    );
    std::fs::remove_dir_all(&dir).ok();
}
