//! The survey streamed, run as the real binary: its output in every format, whole
//! and in pieces, with and without normal forms, is byte for byte the survey
//! collected by the library and rendered whole; rows kept in the temporary file
//! come back the same; a full device, an unwritable temporary directory and
//! Ctrl-C end the run with their messages; the rows of each length are as many as
//! the Mahonian numbers say.
#![allow(clippy::unwrap_used)]

mod common;

use common::{interrupted, rejects, run};
use elbowroom::cli::cmd_survey::{survey_document, survey_text};
use elbowroom::cli::json::{poly, render};
use elbowroom::cli::output::KEPT_IN_MEMORY_ENV;
use elbowroom::cli::shard::Shard;
use elbowroom::math::quotient::survey::{SurveyEntry, survey, survey_listing, survey_summaries};
use elbowroom::math::{Perm, Progress};
use elbowroom::tables::results::survey_table;
use std::process::{Command, Output};

fn run_with(args: &[&str], env: &[(&str, &str)]) -> Output {
    let mut c = Command::new(env!("CARGO_BIN_EXE_elbowroom"));
    c.args(args);
    for (k, v) in env {
        c.env(k, v);
    }
    c.output().unwrap()
}

fn stdout_of(out: Output, args: &[&str]) -> String {
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

/// What `survey ARGS` prints, computed the collected way: every record of the
/// piece in a Vec (`survey`, `survey_summaries`), rendered whole.
fn collected(n: usize, shard: Shard, format: &str, summary: bool) -> String {
    let listing = survey_listing(n);
    let listed_total = listing.len();
    let perms: Vec<Perm> = listing
        .into_iter()
        .enumerate()
        .filter(|(i, _)| shard.selects(*i))
        .map(|(_, w)| w)
        .collect();
    let piece = format!("{}/{}", shard.index, shard.count);
    let progress = Progress::new(0);
    match format {
        "--json" if summary => {
            let entries = survey_summaries(&perms, &progress).unwrap();
            render(&survey_document(n, &piece, listed_total, &entries, &|_| {
                None
            })) + "\n"
        }
        "--json" => {
            let entries = survey(&perms, &progress).unwrap();
            let nf = |e: &SurveyEntry| Some(poly(&e.normal_form.poly));
            render(&survey_document(n, &piece, listed_total, &entries, &nf)) + "\n"
        }
        "--csv" => survey_table(n, &survey(&perms, &progress).unwrap(), summary).to_csv(),
        "--latex" => survey_table(n, &survey(&perms, &progress).unwrap(), summary).to_latex(),
        _ if summary => {
            let entries = survey_summaries(&perms, &progress).unwrap();
            survey_text(n, &piece, &entries, true, &|_| None)
        }
        _ => {
            let entries = survey(&perms, &progress).unwrap();
            let nf = |e: &SurveyEntry| Some(e.normal_form.poly.to_string());
            survey_text(n, &piece, &entries, false, &nf)
        }
    }
}

/// Every format, with and without `--summary`, whole and as piece 2/3, for
/// n <= 6: the streamed output equals the collected one byte for byte. With
/// no rows kept in memory (every row through the temporary file) as well, at n = 5.
#[test]
fn streamed_survey_equals_the_collected_one() {
    for n in 1..=6usize {
        let n_arg = n.to_string();
        for shard in [Shard::WHOLE, Shard { index: 2, count: 3 }] {
            let shard_arg = format!("{}/{}", shard.index, shard.count);
            if survey_listing(n).len() < shard.count {
                rejects(
                    &["survey", "--n", &n_arg, "--shard", &shard_arg],
                    "beyond the listing",
                );
                continue;
            }
            for format in ["", "--json", "--csv", "--latex"] {
                for summary in [false, true] {
                    let mut args = vec!["survey", "--n", &n_arg, "--shard", &shard_arg];
                    if !format.is_empty() {
                        args.push(format);
                    }
                    if summary {
                        args.push("--summary");
                    }
                    let expected = collected(n, shard, format, summary);
                    assert_eq!(stdout_of(run(&args), &args), expected, "{args:?} in memory");
                    if n == 5 {
                        let out = run_with(&args, &[(KEPT_IN_MEMORY_ENV, "0")]);
                        assert_eq!(stdout_of(out, &args), expected, "{args:?} from the file");
                    }
                }
            }
        }
    }
    // one permutation (S_{2413} = x1^2 x2 + x1 x2^2 ... reversed; compared, not restated)
    for format in ["", "--json", "--csv", "--latex"] {
        let mut args = vec!["survey", "--perm", "2413"];
        if !format.is_empty() {
            args.push(format);
        }
        let w = Perm::parse("2413").unwrap();
        let entries = survey(std::slice::from_ref(&w), &Progress::new(0)).unwrap();
        let expected = match format {
            "--json" => {
                let nf = |e: &SurveyEntry| Some(poly(&e.normal_form.poly));
                render(&survey_document(4, "1/1", 1, &entries, &nf)) + "\n"
            }
            "--csv" => survey_table(4, &entries, false).to_csv(),
            "--latex" => survey_table(4, &entries, false).to_latex(),
            _ => {
                let nf = |e: &SurveyEntry| Some(e.normal_form.poly.to_string());
                survey_text(4, "1/1", &entries, false, &nf)
            }
        };
        assert_eq!(stdout_of(run(&args), &args), expected, "{args:?}");
    }
}

/// The rows of each length ℓ in the survey of S_6 are the permutations of 6
/// with ℓ inversions: the Mahonian numbers M(6, ℓ) = 1 5 14 29 49 71 90 101 101
/// 90 71 49 29 14 5 1 (OEIS A008302, row n = 6, from memory), in lexicographic order.
#[test]
fn rows_by_length_are_mahonian_numbers() {
    let args = ["survey", "--n", "6", "--csv", "--summary"];
    let csv = stdout_of(run(&args), &args);
    let mut by_length = [0usize; 16];
    let mut perms = Vec::new();
    for line in csv.lines().skip(1) {
        let fields: Vec<&str> = line.rsplitn(6, ',').collect();
        let length: usize = fields[4].parse().unwrap();
        by_length[length] += 1;
        perms.push(fields[5].to_string());
    }
    assert_eq!(
        by_length,
        [1, 5, 14, 29, 49, 71, 90, 101, 101, 90, 71, 49, 29, 14, 5, 1]
    );
    let mut sorted = perms.clone();
    sorted.sort();
    assert_eq!(perms, sorted, "listing order");
}

/// A write to a full device is an error (exit status 1), named.
#[cfg(target_os = "linux")]
#[test]
fn a_full_device_is_an_error() {
    for args in [
        ["survey", "--n", "6", "--json"],
        ["survey", "--n", "6", "--latex"],
    ] {
        let full = std::fs::OpenOptions::new()
            .write(true)
            .open("/dev/full")
            .unwrap();
        let out = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
            .args(args)
            .stdout(full)
            .output()
            .unwrap();
        assert_eq!(out.status.code(), Some(1), "{args:?}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(err.contains("cannot write standard output"), "{err}");
    }
}

/// A temporary file that cannot be made is an error (exit status 1) naming it,
/// and nothing is written on stdout.
#[test]
fn an_unwritable_temporary_file_is_an_error() {
    let dir = std::env::temp_dir().join(format!("elbowroom-no-such-dir-{}", std::process::id()));
    let dir_text = dir.to_string_lossy().to_string();
    let args = ["survey", "--n", "5", "--json"];
    let out = run_with(
        &args,
        &[(KEPT_IN_MEMORY_ENV, "0"), ("TMPDIR", dir_text.as_str())],
    );
    assert_eq!(out.status.code(), Some(1));
    assert!(out.stdout.is_empty());
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains(&format!(
            "cannot write the temporary file {}",
            dir.join("elbowroom-rows-*.tmp").to_string_lossy()
        )),
        "{err}"
    );
    assert_eq!(err.trim().lines().count(), 1, "{err}");
}

/// Ctrl-C during a survey of S_10 (while the basis is read or built, or during the walk): exit status
/// 130 and one line saying how far it got, nothing on stdout.
#[test]
fn ctrl_c_stops_a_survey_and_says_so() {
    for args in [
        ["survey", "--n", "10", "--json"],
        ["survey", "--n", "10", "--summary"],
    ] {
        let out = interrupted(&args);
        assert_eq!(out.status.code(), Some(130), "{args:?}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(
            err.contains("the survey canceled after") && err.contains("no output written"),
            "{args:?}: {err}"
        );
        assert_eq!(err.trim().lines().count(), 1, "{args:?}: {err}");
        assert!(out.stdout.is_empty(), "{args:?}");
    }
}

/// `survey --jsonl` carries what `--json` does, a line at a time: a header
/// with the kind, n, the piece and the count; the results in listing order
/// (each one the object of `--json`); one `{"counterexample": ...}` per
/// counterexample; and a summary whose "all_nonnegative" is the JSON's.
#[test]
fn json_lines_carry_the_json_document() {
    for n in 1..=5usize {
        let n_arg = n.to_string();
        for shard in ["1/1", "2/2"] {
            if n == 1 && shard == "2/2" {
                continue;
            }
            for summary in [false, true] {
                let mut args = vec!["survey", "--n", &n_arg, "--shard", shard];
                if summary {
                    args.push("--summary");
                }
                let whole = common::json(&[args.clone(), vec!["--json"]].concat());
                let out = common::run(&[args, vec!["--jsonl"]].concat());
                assert!(out.status.success());
                let lines: Vec<serde_json::Value> = String::from_utf8(out.stdout)
                    .unwrap()
                    .lines()
                    .map(|l| serde_json::from_str(l).unwrap())
                    .collect();
                let header = &lines[0];
                for key in ["kind", "n", "shard", "count"] {
                    assert_eq!(header[key], whole[key], "{key}");
                }
                let results = whole["results"].as_array().unwrap();
                let counter = whole["counterexamples"].as_array().unwrap();
                assert_eq!(&lines[1..=results.len()], &results[..]);
                let extra: Vec<serde_json::Value> = lines[results.len() + 1..lines.len() - 1]
                    .iter()
                    .map(|l| l["counterexample"].clone())
                    .collect();
                assert_eq!(&extra, counter);
                let last = &lines[lines.len() - 1];
                assert_eq!(last["summary"], "quotient_survey");
                assert_eq!(last["all_nonnegative"], whole["all_nonnegative"]);
                assert_eq!(last["count"], whole["count"]);
            }
        }
    }
}

/// A fresh, empty temporary directory of this test process.
fn scratch_dir(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("elbowroom-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// What a directory holds, by name.
fn entries_of(dir: &std::path::Path) -> Vec<String> {
    std::fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().to_string())
        .collect()
}

/// Two surveys at once, each keeping every row in its temporary file in the
/// same directory, do not meet there: each prints the survey computed in
/// memory, and the directory is empty afterwards (and while they run, since
/// the file has no name once it is open).
#[test]
fn two_surveys_at_once_keep_their_own_temporary_files() {
    let dir = scratch_dir("spill-pair");
    let dir_text = dir.to_string_lossy().to_string();
    let args = ["survey", "--n", "6", "--json"];
    let expected = stdout_of(run(&args), &args);
    let start = || {
        let mut c = Command::new(env!("CARGO_BIN_EXE_elbowroom"));
        c.args(args)
            .env(KEPT_IN_MEMORY_ENV, "0")
            .env("TMPDIR", &dir_text)
            .stdout(std::process::Stdio::piped())
            .stderr(std::process::Stdio::piped());
        c.spawn().unwrap()
    };
    let (a, b) = (start(), start());
    for child in [a, b] {
        let out = child.wait_with_output().unwrap();
        assert_eq!(stdout_of(out, &args), expected);
    }
    assert_eq!(entries_of(&dir), Vec::<String>::new());
    let _ = std::fs::remove_dir_all(&dir);
}

/// A survey stopped by Ctrl-C while its rows sit in the temporary file (the
/// signal is sent when the rows start going out) leaves no file behind: the
/// directory holds nothing while it runs and nothing after it.
#[cfg(unix)]
#[test]
fn a_canceled_survey_leaves_no_temporary_file() {
    use elbowroom::cli::interrupt::{ANNOUNCE_ENV, ANNOUNCEMENT};
    use std::io::{BufRead, BufReader, Read};
    let dir = scratch_dir("spill-cancel");
    let out_file = std::env::temp_dir().join(format!(
        "elbowroom-spill-cancel-{}.json",
        std::process::id()
    ));
    let mut child = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(["survey", "--n", "7", "--json"])
        .env(KEPT_IN_MEMORY_ENV, "0")
        .env("TMPDIR", &dir)
        .env(ANNOUNCE_ENV, "1")
        .stdout(std::fs::File::create(&out_file).unwrap())
        .stderr(std::process::Stdio::piped())
        .spawn()
        .unwrap();
    let mut stderr = BufReader::new(child.stderr.take().unwrap());
    // the basis, the walk (rows kept in the file), then the writing out
    let mut seen = 0;
    let mut line = String::new();
    while seen < 3 {
        line.clear();
        assert!(stderr.read_line(&mut line).unwrap() > 0, "ended early");
        if line.trim_end() == ANNOUNCEMENT {
            seen += 1;
        }
    }
    assert_eq!(
        entries_of(&dir),
        Vec::<String>::new(),
        "no name while running"
    );
    let killed = Command::new("kill")
        .args(["-INT", &child.id().to_string()])
        .status()
        .unwrap();
    assert!(killed.success());
    let mut rest = String::new();
    let _ = stderr.read_to_string(&mut rest);
    let status = child.wait().unwrap();
    // stopped while writing (130), or done before the signal came (0)
    assert!(matches!(status.code(), Some(130 | 0)), "{status:?}: {rest}");
    assert_eq!(entries_of(&dir), Vec::<String>::new());
    let _ = std::fs::remove_dir_all(&dir);
    let _ = std::fs::remove_file(&out_file);
}
