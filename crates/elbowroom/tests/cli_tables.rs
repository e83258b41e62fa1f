//! Hessenberg tables as JSON Lines and through a class file, run as the real
//! binary: the JSON Lines carry the rows and summary of the JSON document; a
//! piece reading `--class FILE` prints byte for byte what the piece expanding
//! the class prints (two methods: the values read back from the file, and the
//! class expanded again); a class file of another n or h, a damaged one and a
//! foreign file are refused in one line before any row.
#![allow(clippy::unwrap_used)]

mod common;

use common::{json, rejects, run};
use serde_json::Value;
use std::path::PathBuf;

fn stdout(args: &[&str]) -> String {
    let out = run(args);
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

/// A fresh directory of this test's own.
fn scratch(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("elbowroom-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

#[test]
fn json_lines_hold_the_rows_and_summary_of_the_json_document() {
    for (n, h, shard) in [
        ("6", "2,3,4,5,6,6", None),
        ("7", "3,3,4,6,6,7,7", Some("2/3")),
        ("5", "1,2,3,4,5", None),
    ] {
        let mut args = vec!["hessenberg", "--n", n, "--h", h];
        if let Some(s) = shard {
            args.extend(["--shard", s]);
        }
        let doc = json(&[args.as_slice(), &["--json"]].concat());
        let text = stdout(&[args.as_slice(), &["--jsonl"]].concat());
        let lines: Vec<Value> = text
            .lines()
            .map(|l| serde_json::from_str(l).unwrap())
            .collect();
        let rows = doc["coefficients"].as_array().unwrap();
        assert_eq!(lines.len(), rows.len() + 2, "a head, the rows, a summary");
        let head = &lines[0];
        for key in ["kind", "n", "h", "dimension", "order", "listed"] {
            assert_eq!(head[key], doc[key], "{key}");
        }
        assert_eq!(&lines[1..=rows.len()], rows.as_slice());
        let tail = &lines[rows.len() + 1];
        for key in [
            "total",
            "nonzero",
            "max",
            "negative",
            "all_nonnegative_integers",
            "shard",
            "version",
        ] {
            assert_eq!(tail[key], doc[key], "{key}");
        }
        assert_eq!(tail["rows"], rows.len());
    }
}

#[test]
fn pieces_reading_the_class_file_print_what_the_pieces_expanding_it_print() {
    let dir = scratch("class-pieces");
    let file = dir.join("class-n8.bin");
    let file = file.to_str().unwrap();
    let h = "2,4,4,5,6,7,8,8";
    let saved = stdout(&["hessenberg", "--n", "8", "--h", h, "--save-class", file]);
    // M(8, 8) = 1415 permutations of length |h| = 8 in S_8 (OEIS A008302)
    assert!(saved.contains("1415 values"), "{saved}");
    for format in [
        None,
        Some("--csv"),
        Some("--json"),
        Some("--jsonl"),
        Some("--latex"),
    ] {
        for piece in ["1/3", "2/3", "3/3"] {
            let mut args = vec!["hessenberg", "--n", "8", "--h", h, "--shard", piece];
            args.extend(format);
            let expanded = stdout(&args);
            args.extend(["--class", file]);
            assert_eq!(stdout(&args), expanded, "{format:?} {piece}");
        }
    }
    // the whole table from the file, too
    let whole = stdout(&["hessenberg", "--n", "8", "--h", h, "--csv"]);
    let from_file = stdout(&["hessenberg", "--n", "8", "--h", h, "--csv", "--class", file]);
    assert_eq!(from_file, whole);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn foreign_and_damaged_class_files_are_refused_before_any_row() {
    let dir = scratch("class-refused");
    let path = dir.join("class-n6.bin");
    let file = path.to_str().unwrap();
    stdout(&["hessenberg", "--n", "6", "--save-class", file]);
    rejects(
        &[
            "hessenberg",
            "--n",
            "6",
            "--h",
            "3,3,4,5,6,6",
            "--class",
            file,
        ],
        "not of n = 6, h = (3,3,4,5,6,6)",
    );
    rejects(&["hessenberg", "--n", "7", "--class", file], "not of n = 7");
    let mut bytes = std::fs::read(&path).unwrap();
    let last = bytes.len() - 3;
    bytes[last] ^= 0x01;
    let damaged = dir.join("damaged.bin");
    std::fs::write(&damaged, &bytes).unwrap();
    rejects(
        &[
            "hessenberg",
            "--n",
            "6",
            "--class",
            damaged.to_str().unwrap(),
        ],
        "is damaged",
    );
    let cut = dir.join("cut.bin");
    std::fs::write(&cut, &bytes[..bytes.len() - 5]).unwrap();
    rejects(
        &["hessenberg", "--n", "6", "--class", cut.to_str().unwrap()],
        "is damaged",
    );
    let foreign = dir.join("foreign.bin");
    std::fs::write(&foreign, b"perm,length,value\n").unwrap();
    rejects(
        &[
            "hessenberg",
            "--n",
            "6",
            "--class",
            foreign.to_str().unwrap(),
        ],
        "is not a class file",
    );
    rejects(
        &[
            "hessenberg",
            "--n",
            "6",
            "--class",
            dir.join("none.bin").to_str().unwrap(),
        ],
        "cannot be read",
    );
    rejects(
        &[
            "hessenberg",
            "--n",
            "6",
            "--save-class",
            file,
            "--shard",
            "1/2",
        ],
        "cannot be used with",
    );
    let _ = std::fs::remove_dir_all(&dir);
}
