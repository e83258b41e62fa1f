//! Hostile input for the real binary: inputs far too large, nested far too
//! deep, files that never end, and malformed arguments. Each case must be
//! answered (or refused in one line naming the estimate and the limit) with
//! the exit status promised: 2 for bad input, 1 for a failed write, 130 for
//! an interrupt. Each child runs under a time limit (the test fails when it
//! is exceeded) and, where `prlimit` is installed, under an address-space
//! limit, so an unbounded allocation fails the test instead of the machine.
#![allow(clippy::unwrap_used)]

mod common;

use std::io::Read;
use std::process::{Command, Output, Stdio};
use std::time::{Duration, Instant};

/// How long one case may take in the debug build before the test fails.
const TIME_LIMIT: Duration = Duration::from_secs(15);

/// The address space a case may use (bytes): far below what the unbounded
/// runs took (8 to 16 GB), above what a refusal or a small answer needs.
const MEMORY_LIMIT: u64 = 2_000_000_000;

/// w0 in S_16.
const W0_16: &str = "16,15,14,13,12,11,10,9,8,7,6,5,4,3,2,1";

/// A permutation of S_16 with 2^28 reduced pipe dreams (S_w(1) = 268 435 456).
const WIDE_16: &str = "1,3,5,7,9,11,13,15,2,4,6,8,10,12,14,16";

fn prlimit_available() -> bool {
    Command::new("prlimit")
        .arg("--version")
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .status()
        .is_ok_and(|s| s.success())
}

/// Runs the binary with `args` (stdout sent to `stdout` when given), under
/// [`TIME_LIMIT`] and [`MEMORY_LIMIT`]; fails the test when time runs out.
fn bounded_with(args: &[&str], stdout: Option<std::fs::File>) -> Output {
    let bin = env!("CARGO_BIN_EXE_elbowroom");
    let mut command = if prlimit_available() {
        let mut c = Command::new("prlimit");
        c.arg(format!("--as={MEMORY_LIMIT}")).arg("--").arg(bin);
        c
    } else {
        Command::new(bin)
    };
    command
        .args(args)
        .stdin(Stdio::null())
        .stderr(Stdio::piped());
    let piped = stdout.is_none();
    match stdout {
        Some(f) => command.stdout(f),
        None => command.stdout(Stdio::piped()),
    };
    let mut child = command.spawn().unwrap();
    // both pipes are drained on threads, so a long output cannot stall the child
    let mut out_pipe = child.stdout.take();
    let mut err_pipe = child.stderr.take().unwrap();
    let out_reader = std::thread::spawn(move || {
        let mut v = Vec::new();
        if let Some(p) = out_pipe.as_mut() {
            let _ = p.read_to_end(&mut v);
        }
        v
    });
    let err_reader = std::thread::spawn(move || {
        let mut v = Vec::new();
        let _ = err_pipe.read_to_end(&mut v);
        v
    });
    let start = Instant::now();
    let status = loop {
        if let Some(status) = child.try_wait().unwrap() {
            break status;
        }
        if start.elapsed() > TIME_LIMIT {
            let _ = child.kill();
            let _ = child.wait();
            panic!("{:?} did not finish within {TIME_LIMIT:?}", short(args));
        }
        std::thread::sleep(Duration::from_millis(10));
    };
    let stdout = out_reader.join().unwrap();
    let stderr = err_reader.join().unwrap();
    let _ = piped;
    Output {
        status,
        stdout,
        stderr,
    }
}

fn bounded(args: &[&str]) -> Output {
    bounded_with(args, None)
}

/// The arguments as shown in a failure: long ones cut short.
fn short(args: &[&str]) -> Vec<String> {
    args.iter()
        .map(|a| a.chars().take(60).collect::<String>())
        .collect()
}

/// The case is refused: exit status 2, nothing on stdout, one short line on
/// stderr holding every one of `words`.
fn refused(args: &[&str], words: &[&str]) -> String {
    let out = bounded(args);
    let err = String::from_utf8_lossy(&out.stderr).to_string();
    assert_eq!(out.status.code(), Some(2), "{:?}: {err}", short(args));
    assert!(
        out.stdout.is_empty(),
        "{:?}: no output on stdout",
        short(args)
    );
    assert_eq!(
        err.trim_end().lines().count(),
        1,
        "{:?}: one line: {err}",
        short(args)
    );
    assert!(
        err.len() < 600,
        "{:?}: a short message: {} bytes",
        short(args),
        err.len()
    );
    for w in words {
        assert!(err.contains(w), "{:?}: {w:?} missing in {err}", short(args));
    }
    err
}

#[test]
fn mixed_eulerian_numbers_past_the_budget_are_refused_at_once() {
    // C(21, 11) = 352 716 compositions at n = 12 (OEIS A001700 gives C(2n-1, n))
    refused(
        &["eulerian", "--n", "12"],
        &["352716 compositions", "2000000000"],
    );
    refused(
        &["eulerian", "--n", "16", "--json"],
        &["compositions", "n <= 10"],
    );
}

#[test]
fn explanations_past_their_limits_are_refused_at_once() {
    // A_c(q) at n = 10: C(17, 8) = 24 310 compositions of n^6 steps each
    refused(
        &["eulerian", "--n", "10", "--q"],
        &["24310 compositions", "5000000000"],
    );
    // n = 15 is past EXPLAIN_MAX_N = 14
    refused(
        &["coefficient", "2,3,4,5,6,7,8,9,10,11,12,13,14,15,1"],
        &["n = 15", "n <= 14"],
    );
}

#[test]
fn ctrl_c_in_an_explanation_is_answered_with_a_message() {
    // a_w and a_w(q) for w in S_12 of length 11 with many words: seconds in the debug build
    let out = common::interrupted(&["coefficient", "4,3,2,1,7,6,5,9,8,11,10,12", "--q"]);
    assert_eq!(out.status.code(), Some(130));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("canceled after"), "{err}");
    assert!(out.stdout.is_empty());
}

#[test]
fn divided_symmetrization_past_the_budget_is_refused() {
    // DS_6(x1^100) is symmetric of degree 95 in 6 variables: C(100, 5) = 75 287 520 monomials
    refused(
        &["divsym", "x1^100", "--n", "6"],
        &["75287520 monomials", "200000"],
    );
    refused(
        &["divsym", "(x1+x2+x3+x4)^100", "--n", "4"],
        &["coefficient products", "4000000"],
    );
    refused(
        &["divsym", "x1^8", "--n", "9", "--h", "1,2,3,4,5,6,7,8,9"],
        &["Q_h", "20000000"],
    );
}

#[test]
fn large_schubert_polynomials_and_bumpless_listings_are_refused() {
    refused(&["schubert", WIDE_16], &["268435456 terms", "2000000"]);
    refused(
        &[
            "figure", "bumpless", WIDE_16, "--index", "300000", "--out", "b.svg",
        ],
        &["268435456 bumpless pipe dreams", "200000"],
    );
}

#[test]
fn figure_indices_and_pixels_past_their_limits_are_refused() {
    let dir = std::env::temp_dir().join(format!("elbowroom-hostile-{}", std::process::id()));
    let svg = dir.join("w.svg");
    let png = dir.join("w.png");
    refused(
        &[
            "figure",
            "wiring",
            W0_16,
            "--index",
            "1000000000",
            "--out",
            svg.to_str().unwrap(),
        ],
        &["--index 1000000000", "1000000"],
    );
    // a scale inside (0, 64] that still makes too large an image is bad input too
    refused(
        &[
            "figure",
            "wiring",
            W0_16,
            "--scale",
            "64",
            "--out",
            png.to_str().unwrap(),
        ],
        &["pixels", "16384"],
    );
    refused(
        &[
            "figure",
            "dream",
            "1432",
            "--scale",
            "64",
            "--out",
            png.to_str().unwrap(),
        ],
        &["104857600 pixels", "64000000"],
    );
    assert!(!png.exists(), "nothing written");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn volumes_with_huge_rationals_are_refused() {
    let entry = |k: usize| format!("{}{k}/{}{k}", "7".repeat(2000), "3".repeat(1999));
    let lambda: Vec<String> = (0..16).map(entry).collect();
    refused(
        &["volume", "--lambda", &lambda.join(",")],
        &["digits", "1500"],
    );
}

#[test]
fn session_check_refuses_files_that_never_end() {
    for dev in ["/dev/zero", "/dev/urandom"] {
        if std::path::Path::new(dev).exists() {
            refused(&["session", "check", dev], &[dev, "not a regular file"]);
        }
    }
    refused(&["session", "check", "/"], &["directory"]);
    // a sparse file just over 64 MB: refused by its size before it is read
    let dir = std::env::temp_dir().join(format!("elbowroom-big-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let big = dir.join("big.ron");
    std::fs::File::create(&big)
        .unwrap()
        .set_len(64 * 1024 * 1024 + 1)
        .unwrap();
    refused(
        &["session", "check", big.to_str().unwrap()],
        &["67108865 bytes", "64 MB"],
    );
    let _ = std::fs::remove_dir_all(&dir);
}

/// Writes `text` to a fresh file and runs `session check` on it.
fn check_session(name: &str, text: &str, words: &[&str]) -> String {
    let dir = std::env::temp_dir().join(format!("elbowroom-s-{}-{name}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join(format!("{name}.ron"));
    std::fs::write(&path, text).unwrap();
    let err = refused(&["session", "check", path.to_str().unwrap()], words);
    for internal in ["ron::", "FileV1", "Header", "r#", "Options"] {
        assert!(!err.contains(internal), "{name}: {internal:?} in {err}");
    }
    let _ = std::fs::remove_dir_all(&dir);
    err
}

fn session_text(body: &str) -> String {
    format!("(format: \"elbowroom-session\", version: 1, session: ({body}))")
}

#[test]
fn session_files_nested_deep_or_with_impossible_fields_are_refused_in_our_words() {
    check_session("open", &"(".repeat(100_000), &["open.ron"]);
    check_session(
        "deep",
        &session_text(&format!("notes: {}", "[".repeat(100_000))),
        &["nest more than 32 deep"],
    );
    check_session(
        "zero",
        "(format: \"elbowroom-session\", version: 0, session: ())",
        &["format version is 0"],
    );
    check_session(
        "divides",
        &session_text("solid: (lambda: [\"1/0\", \"2\"])"),
        &["solid.lambda[0]", "divides by zero"],
    );
    check_session(
        "letter",
        &session_text("solid: (lambda: [\"a\"])"),
        &["solid.lambda[0]", "not a rational number"],
    );
    let many = vec!["\"1\""; 17].join(", ");
    check_session(
        "many",
        &session_text(&format!("solid: (lambda: [{many}])")),
        &["17 entries", "at most 16"],
    );
    check_session(
        "sort",
        &session_text("hessenberg: (sort_by: \"size\")"),
        &["\"size\" is not known", "\"perm\", \"length\", \"value\""],
    );
    check_session("raw", &session_text("current: [1, 2, r#0]"), &["current"]);
    check_session(
        "class",
        &session_text("browser: (class: Some(\"round\"))"),
        &["browser.class", "dominant"],
    );
}

#[test]
fn deep_or_long_polynomials_are_refused_or_read_in_bounded_time() {
    // one argument holds at most 128 KiB on Linux: 10^5 open parentheses fit
    let deep = format!("{}x1", "(".repeat(100_000));
    refused(&["divsym", &deep, "--n", "2"], &["more than 200 deep"]);
    refused(&["expand", &deep, "--n", "2"], &["more than 200 deep"]);
    refused(
        &["divsym", &format!("{}x1", "-".repeat(100_000)), "--n", "2"],
        &["more than 200 deep"],
    );
    refused(
        &["divsym", &format!("x1{}", "^2".repeat(50_000)), "--n", "2"],
        &["repeated powers"],
    );
    // products of linear forms are read without recursion: 99 999 signs are one minus
    let out = bounded(&["expand", &format!("{}x1", "-".repeat(99_999)), "--n", "2"]);
    assert_eq!(out.status.code(), Some(0));
    assert!(String::from_utf8_lossy(&out.stdout).contains("= -S_21"));
    // a 120 KB input with an error at its end is quoted as a short excerpt, once
    let long = format!("{}*", "x1+".repeat(40_000));
    let err = refused(&["divsym", &long, "--n", "2"], &["column 120001", "…"]);
    assert!(err.len() < 400, "{} bytes", err.len());
}

#[test]
fn exponents_name_the_variable_and_the_limit() {
    refused(
        &["divsym", "x1^200*x1^100", "--n", "2"],
        &["column 7", "x1 would have the exponent 300", "up to 255"],
    );
    // decimals as the rational reader reads them: a digit after the point
    refused(&["divsym", "1. x1", "--n", "2"], &["'1.' is not a number"]);
}

#[test]
fn negative_numbers_reach_their_readers() {
    refused(
        &["divsym", "x1", "--n", "-1"],
        &["--n must be a whole number from 1 to 16; got -1"],
    );
    refused(&["eulerian", "--n", "17"], &["--n 17", "2 <= n <= 16"]);
    refused(&["divsym", "x1", "--n", "0"], &["--n 0", "1 <= n <= 16"]);
    // the Hessenberg table reaches S_17 (its permutations on the wide key);
    // the polynomial commands stop at 16 variables
    refused(&["hessenberg", "--n", "18"], &["--n 18", "1 <= n <= 17"]);
    refused(&["divsym", "x1", "--n", "17"], &["--n 17", "1 <= n <= 16"]);
    refused(
        &["hessenberg", "--n", "x"],
        &["--n must be a whole number from 1 to 17; got x"],
    );
    // the default h of n = 17 is accepted, but a larger class of S_17 is
    // refused before the work: M(17, 17) = 300 895 513 rows
    let h17: Vec<String> = [3]
        .into_iter()
        .chain(3..=17)
        .chain([17])
        .map(|v| v.to_string())
        .collect();
    refused(
        &["hessenberg", "--n", "17", "--h", &h17.join(",")],
        &["300895513 permutations", "175000000 accepted"],
    );
    refused(
        &["divsym", "x1", "--n", "x"],
        &["--n must be a whole number from 1 to 16; got x"],
    );
    refused(
        &["words", "321", "--limit", "-3"],
        &["whole number", "got -3"],
    );
    // DS_2(x2 - x1) = (x2 - x1)/(x1 - x2) + (x1 - x2)/(x2 - x1) = -2, by the definition
    let out = bounded(&["divsym", "-x1 + x2", "--n", "2"]);
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    assert!(String::from_utf8_lossy(&out.stdout).contains("= -2"));
}

#[test]
fn lists_with_empty_entries_and_degenerate_angles_are_refused() {
    refused(&["perm", "1,,2"], &["empty entry"]);
    refused(
        &["hessenberg", "--n", "4", "--h", "2,,3,4,4"],
        &["--h has an empty entry"],
    );
    refused(
        &["volume", "--lambda", "1,2,"],
        &["--lambda has an empty entry"],
    );
    refused(
        &[
            "figure",
            "permutohedron",
            "--lambda",
            "3,2,1,0",
            "--yaw",
            "NaN",
            "--out",
            "p.svg",
        ],
        &["--yaw", "finite"],
    );
    refused(
        &[
            "figure",
            "permutohedron",
            "--lambda",
            "3,2,1,0",
            "--pitch",
            "inf",
            "--out",
            "p.svg",
        ],
        &["--pitch", "finite"],
    );
}

#[test]
fn session_without_an_action_prints_its_usage_and_exits_2() {
    refused(&["session"], &["usage: elbowroom session check FILE"]);
}

#[test]
fn a_failed_write_to_standard_output_exits_1() {
    let Ok(full) = std::fs::OpenOptions::new().write(true).open("/dev/full") else {
        return;
    };
    let out = bounded_with(&["perm", "312"], Some(full));
    assert_eq!(out.status.code(), Some(1));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("cannot write standard output"), "{err}");
}

#[test]
fn ctrl_c_in_divided_symmetrization_is_answered_with_a_message() {
    // Q_h = Δ for h = id in 8 variables: seconds of work in the debug build
    let out = common::interrupted(&["divsym", "x1", "--n", "8", "--h", "1,2,3,4,5,6,7,8"]);
    assert_eq!(out.status.code(), Some(130));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("canceled; no output written"), "{err}");
    assert!(out.stdout.is_empty());
}

#[test]
fn ctrl_c_while_the_basis_of_the_quotient_is_built_is_answered_with_a_message() {
    // the Gröbner basis of J_12 takes about half a minute in a release build
    let out = common::interrupted(&["quotient", "--n", "12", "--no-cache"]);
    assert_eq!(out.status.code(), Some(130));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("the basis of J_12 canceled after"), "{err}");
    assert!(out.stdout.is_empty());
}

/// Runs the binary through `sh -c SCRIPT` (with `$B` the binary), for what
/// only a shell sets up: a closed descriptor, a full device, a size limit.
fn shell(script: &str) -> Output {
    Command::new("sh")
        .arg("-c")
        .arg(script)
        .env("B", env!("CARGO_BIN_EXE_elbowroom"))
        .stdin(Stdio::null())
        .output()
        .unwrap()
}

/// A scratch folder of its own for one test.
fn scratch(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("elbowroom-hostile-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

fn names_in(dir: &std::path::Path) -> Vec<String> {
    let mut v: Vec<String> = std::fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().to_string())
        .collect();
    v.sort();
    v
}

#[test]
fn sigterm_and_sighup_cancel_like_ctrl_c_with_128_plus_the_signal() {
    // the Hessenberg table of n = 12 streams for many seconds in the debug build
    for (signal, status) in [("TERM", 143), ("HUP", 129)] {
        let out = common::signaled(&["hessenberg", "--n", "12", "--csv"], signal);
        let err = String::from_utf8_lossy(&out.stderr);
        assert_eq!(out.status.code(), Some(status), "SIG{signal}: {err}");
        assert!(err.contains("the table canceled after"), "{err}");
        assert_eq!(err.trim_end().lines().count(), 1, "{err}");
        // the counts agree with what was written: "after R of L permutations;
        // output cut short after R rows", with L the rows of the listing
        // (the Mahonian number M(12, 11) = 1 062 719 of OEIS A008302, from memory,
        // is not needed: the rows on stdout are counted)
        // the header and, after a cut, the marker line are not rows
        let text = String::from_utf8_lossy(&out.stdout);
        let marker = usize::from(text.lines().last().is_some_and(|l| l.contains("cut short")));
        let rows = text.lines().count().saturating_sub(1 + marker);
        if rows > 0 {
            assert!(
                err.contains(&format!("canceled after {rows} of ")),
                "{rows} rows written: {err}"
            );
            assert!(
                err.contains(&format!("cut short after {rows} rows")),
                "{err}"
            );
        }
    }
}

/// Starts `args`, waits until standard output has given `lines` lines, sends
/// SIGTERM, and returns the exit status with all of standard output.
fn terminated_after_lines(args: &[&str], lines: usize) -> (Option<i32>, String) {
    use std::io::{BufRead, BufReader};
    let mut child = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .stdout(Stdio::piped())
        .stderr(Stdio::null())
        .spawn()
        .unwrap();
    let mut stdout = BufReader::new(child.stdout.take().unwrap());
    let mut text = String::new();
    for _ in 0..lines {
        if stdout.read_line(&mut text).unwrap() == 0 {
            break;
        }
    }
    let _ = Command::new("kill")
        .args(["-TERM", &child.id().to_string()])
        .status();
    let mut rest = String::new();
    stdout.read_to_string(&mut rest).unwrap();
    text.push_str(&rest);
    (child.wait().unwrap().code(), text)
}

/// A table cut short on standard output (no `--out`) ends in a way no reader
/// takes for complete: CSV with a last line of one field more than the header,
/// JSON lines with a last line that does not parse, text with a "cut short"
/// line. The table of n = 13 (762 007 rows) takes far longer than the 40 rows
/// read before the signal.
#[test]
fn a_table_cut_short_on_standard_output_ends_with_a_marker() {
    let n13 = ["hessenberg", "--n", "13"];
    let (status, csv) = terminated_after_lines(&[&n13[..], &["--csv"]].concat(), 40);
    assert_eq!(status, Some(143));
    let lines: Vec<&str> = csv.lines().collect();
    assert!(lines.len() > 40, "{}", lines.len());
    let fields = |l: &str| elbowroom::cli::cut_short::csv_fields(l);
    let last = lines[lines.len() - 1];
    assert_eq!(lines[0], "perm,length,value");
    assert_eq!(fields(last), fields(lines[0]) + 1, "{last}");
    assert!(last.contains("cut short"), "{last}");
    // every line before the marker is a whole row
    assert!(lines[1..lines.len() - 1].iter().all(|l| fields(l) == 3));

    let (status, jsonl) = terminated_after_lines(&[&n13[..], &["--jsonl"]].concat(), 40);
    assert_eq!(status, Some(143));
    let lines: Vec<&str> = jsonl.lines().collect();
    let last = lines[lines.len() - 1];
    assert!(
        serde_json::from_str::<serde_json::Value>(last).is_err(),
        "{last}"
    );
    assert!(last.contains("cut_short"), "{last}");

    let (status, text) = terminated_after_lines(&n13, 40);
    assert_eq!(status, Some(143));
    let last = text.lines().last().unwrap_or_default();
    assert!(last.starts_with("… output cut short"), "{last}");
    // a complete run ends without a marker (h = (2,3,4,4): six rows, OEIS A008302)
    let whole = bounded(&["hessenberg", "--n", "4", "--h", "2,3,4,4", "--csv"]);
    assert!(whole.status.success());
    assert!(!String::from_utf8_lossy(&whole.stdout).contains("cut short"));
}

#[test]
fn a_signal_leaves_no_out_file_and_no_temporary() {
    let dir = scratch("term-out");
    let out_path = dir.join("t.csv");
    let out = common::signaled(
        &[
            "hessenberg",
            "--n",
            "12",
            "--csv",
            "--out",
            out_path.to_str().unwrap(),
        ],
        "TERM",
    );
    assert_eq!(out.status.code(), Some(143));
    assert!(names_in(&dir).is_empty(), "{:?}", names_in(&dir));
    let _ = std::fs::remove_dir_all(&dir);
}

/// A run that cannot stop by itself (here: blocked writing to a pipe nobody
/// reads) is ended by the signal after a grace period, still with one
/// "canceled" line and 128 + the signal.
#[test]
fn a_run_that_cannot_stop_by_itself_is_ended_with_a_canceled_line() {
    use elbowroom::cli::interrupt::{ANNOUNCE_ENV, ANNOUNCEMENT};
    use std::io::{BufRead, BufReader};
    let mut child = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(["hessenberg", "--n", "10", "--csv"])
        .env(ANNOUNCE_ENV, "1")
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    let mut stderr = BufReader::new(child.stderr.take().unwrap());
    let mut line = String::new();
    stderr.read_line(&mut line).unwrap();
    assert_eq!(line.trim_end(), ANNOUNCEMENT);
    // the rows (about 390 kB) fill the pipe (nobody reads it) and the writer blocks
    std::thread::sleep(Duration::from_millis(500));
    let start = Instant::now();
    let _ = Command::new("kill")
        .args(["-TERM", &child.id().to_string()])
        .status();
    let status = child.wait().unwrap();
    let mut rest = String::new();
    let _ = std::io::Read::read_to_string(&mut stderr, &mut rest);
    assert_eq!(status.code(), Some(143), "{rest}");
    assert!(start.elapsed() < Duration::from_secs(10));
    assert!(
        rest.contains("hessenberg canceled after") && rest.contains("SIGTERM"),
        "{rest}"
    );
    assert_eq!(rest.trim_end().lines().count(), 1, "{rest}");
}

#[test]
fn a_file_size_limit_is_a_clean_failure_with_a_message() {
    if !prlimit_available() {
        return;
    }
    let dir = scratch("efbig");
    let script = format!(
        "cd {} && prlimit --fsize=1000 \"$B\" hessenberg --n 8 > f; echo \"status $?\"; \
         prlimit --fsize=1000 \"$B\" hessenberg --n 8 --csv --out g.csv; echo \"status $?\"",
        dir.display()
    );
    let out = shell(&script);
    let said = String::from_utf8_lossy(&out.stdout);
    let err = String::from_utf8_lossy(&out.stderr);
    // exit 1 (a failed write), not death by SIGXFSZ (153)
    assert_eq!(said.matches("status 1").count(), 2, "{said} / {err}");
    assert!(err.contains("cannot write standard output"), "{err}");
    assert!(err.contains("cannot write g.csv"), "{err}");
    assert!(
        !err.contains(".writing"),
        "no temporary name in the message: {err}"
    );
    // the --out file never appeared, and no temporary is left
    assert_eq!(names_in(&dir), ["f"]);
    // a figure past the limit: a failed write (1), and no `.NAME.…writing` left behind
    let out = shell(&format!(
        "cd {} && prlimit --fsize=200 \"$B\" figure dream 1432 --out d.svg",
        dir.display()
    ));
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(1), "{err}");
    assert!(err.contains("File too large"), "{err}");
    assert_eq!(names_in(&dir), ["f"]);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_closed_standard_output_is_a_failure() {
    for cmd in ["perm 312", "survey --n 3 --csv", "--version", "--help"] {
        let out = shell(&format!("\"$B\" {cmd} >&-"));
        let err = String::from_utf8_lossy(&out.stderr);
        assert_eq!(out.status.code(), Some(1), "{cmd}: {err}");
        assert!(err.contains("cannot write standard output"), "{cmd}: {err}");
    }
    // `> /dev/null` is not closed
    let out = shell("\"$B\" perm 312 > /dev/null");
    assert_eq!(out.status.code(), Some(0));
}

#[test]
fn help_and_version_to_a_full_device_are_failures() {
    if !std::path::Path::new("/dev/full").exists() {
        return;
    }
    for flag in ["--help", "--version", "completions bash", "man"] {
        let out = shell(&format!("\"$B\" {flag} > /dev/full"));
        assert_eq!(out.status.code(), Some(1), "{flag}");
    }
}

#[test]
fn refusals_survive_an_unwritable_standard_error() {
    if !std::path::Path::new("/dev/full").exists() {
        return;
    }
    // the message cannot be written; the status still says why (no panic: 101)
    let out = shell("\"$B\" perm 1a 2>/dev/full");
    assert_eq!(out.status.code(), Some(2));
    let out = shell("\"$B\" perm 312 2>&- >/dev/full");
    assert_eq!(out.status.code(), Some(1));
    // stderr on a pipe whose reader has gone
    let out = shell("\"$B\" perm 1a 2>&1 >/dev/null | true; echo done");
    assert!(String::from_utf8_lossy(&out.stdout).contains("done"));
}

#[test]
fn messages_quote_inputs_as_one_short_line() {
    let long = "7".repeat(131_000);
    let with_newline = "1\n2";
    let escape = "3\u{1b}[31m1";
    for bad in [long.as_str(), with_newline, escape] {
        let err = refused(&["perm", bad], &[]);
        assert!(!err.contains('\u{1b}'), "escaped: {err:?}");
    }
    let err = refused(&["perm", with_newline], &["'1\\n2'"]);
    assert!(err.len() < 300, "{err}");
    let shard = format!("1/{}", "9".repeat(100_000));
    refused(
        &["hessenberg", "--n", "4", "--shard", &shard, "--json"],
        &["--shard"],
    );
}

#[test]
fn figure_kinds_take_only_their_own_flags() {
    refused(
        &[
            "figure", "dream", "1432", "--lambda", "1,2,3", "--out", "x.svg",
        ],
        &["figure dream takes no --lambda"],
    );
    refused(
        &[
            "figure",
            "permutohedron",
            "--lambda",
            "3,2,1",
            "--samples",
            "5",
            "--out",
            "x.svg",
        ],
        &["figure permutohedron takes no --samples"],
    );
    refused(
        &[
            "figure", "volume", "1432", "--from", "1,0", "--to", "0,1", "--out", "x.svg",
        ],
        &["figure volume takes no a permutation"],
    );
}

#[test]
fn a_split_into_more_pieces_than_rows_is_refused_when_the_piece_is_made() {
    refused(
        &[
            "hessenberg",
            "--n",
            "4",
            "--shard",
            "1/18446744073709551615",
            "--json",
        ],
        &["beyond the listing"],
    );
    refused(
        &["survey", "--n", "3", "--shard", "1/99999999999", "--json"],
        &["beyond the listing"],
    );
}

#[test]
fn out_writes_the_whole_file_or_none() {
    let dir = scratch("out");
    let path = dir.join("e.csv");
    let out = bounded(&[
        "eulerian",
        "--n",
        "4",
        "--csv",
        "--out",
        path.to_str().unwrap(),
    ]);
    assert!(out.status.success());
    assert!(out.stdout.is_empty(), "the output went to the file");
    let direct = bounded(&["eulerian", "--n", "4", "--csv"]);
    assert_eq!(std::fs::read(&path).unwrap(), direct.stdout);
    // a refused run leaves the old file as it was and no temporary
    let refused_run = bounded(&[
        "eulerian",
        "--n",
        "0",
        "--csv",
        "--out",
        path.to_str().unwrap(),
    ]);
    assert_eq!(refused_run.status.code(), Some(2));
    assert_eq!(std::fs::read(&path).unwrap(), direct.stdout);
    assert_eq!(names_in(&dir), ["e.csv"]);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn concurrent_figure_writes_are_reported_honestly() {
    let dir = scratch("concurrent");
    let path = dir.join("f.svg");
    let p = path.to_str().unwrap().to_string();
    let children: Vec<_> = (0..6)
        .map(|k| {
            let w = if k % 2 == 0 { "1432" } else { "2143" };
            Command::new(env!("CARGO_BIN_EXE_elbowroom"))
                .args(["figure", "dream", w, "--out", &p])
                .stdout(Stdio::piped())
                .stderr(Stdio::piped())
                .spawn()
                .unwrap()
        })
        .collect();
    let outs: Vec<Output> = children
        .into_iter()
        .map(|c| c.wait_with_output().unwrap())
        .collect();
    // every run either says it wrote the file or says another run replaced it
    for o in &outs {
        let err = String::from_utf8_lossy(&o.stderr);
        assert!(
            o.status.success() || err.contains("replaced it at the same moment"),
            "{:?}: {err}",
            o.status
        );
    }
    assert!(outs.iter().any(|o| o.status.success()));
    // one whole figure and no temporary file
    assert_eq!(names_in(&dir), ["f.svg"]);
    let svg = std::fs::read_to_string(&path).unwrap();
    assert!(svg.trim_end().ends_with("</svg>"));
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn version_names_the_build_and_completions_and_manual_are_printed() {
    let out = bounded(&["--version"]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.starts_with(&format!("elbowroom {} (commit ", env!("CARGO_PKG_VERSION"))),
        "{text}"
    );
    assert!(text.contains("features:"), "{text}");
    for shell in ["bash", "zsh", "fish"] {
        let out = bounded(&["completions", shell]);
        assert!(out.status.success());
        let script = String::from_utf8_lossy(&out.stdout);
        assert!(
            script.contains("hessenberg") && script.contains("shard"),
            "{shell}"
        );
    }
    let man = bounded(&["man"]);
    let page = String::from_utf8_lossy(&man.stdout);
    assert!(
        page.contains(".TH elbowroom 1") && page.contains("hessenberg"),
        "{page}"
    );
    refused(&["completions", "tcsh"], &["tcsh"]);
}

#[test]
fn session_check_escapes_titles_and_speaks_no_ron() {
    let dir = scratch("session-words");
    let escape = dir.join("escape.ron");
    std::fs::write(
        &escape,
        "(format: \"elbowroom-session\", version: 1, session: (title: \"a\\u{1b}[31mred\", n: 4))",
    )
    .unwrap();
    let out = bounded(&["session", "check", escape.to_str().unwrap()]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(!text.contains('\u{1b}'), "{text:?}");
    assert!(text.contains("a\\u{1b}[31mred"), "{text}");
    let number = dir.join("number.ron");
    std::fs::write(
        &number,
        "(format: \"elbowroom-session\", version: 1, session: (title: \"x\", view: 0.35))",
    )
    .unwrap();
    let err = refused(
        &["session", "check", number.to_str().unwrap()],
        &["`0.35` is not accepted here"],
    );
    assert!(
        !err.contains("raw identifier") && !err.contains("std identifier"),
        "{err}"
    );
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn forests_past_their_limits_are_refused() {
    refused(&["forest", "--code", "300"], &["300 internal nodes", "255"]);
    refused(
        &["forest", "--code", "0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,20"],
        &["3247943160 labelings", "2000000"],
    );
    refused(&["forest", WIDE_16], &["268435456 terms", "2000000"]);
    refused(
        &["forest", "--poly", "x1^30*x12^30", "--n", "12"],
        &["monomials", "2000000"],
    );
}

#[cfg(feature = "gui")]
#[test]
fn a_start_without_a_display_and_without_stderr_does_not_panic() {
    let out = shell("env -u DISPLAY -u WAYLAND_DISPLAY -u WAYLAND_SOCKET \"$B\" 2>/dev/full");
    // the window cannot open: a failure (1), not a panic (101)
    assert_eq!(out.status.code(), Some(1));
}
