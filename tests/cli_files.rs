//! The file commands run as the real binary: `session check`, `elbowroom FILE`,
//! and (further down) `figure`.

#![allow(clippy::unwrap_used)]

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

fn elbowroom(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .env("XDG_CONFIG_HOME", scratch_root().join("config"))
        .output()
        .unwrap()
}

fn scratch_root() -> PathBuf {
    Path::new(env!("CARGO_TARGET_TMPDIR")).join("cli-files")
}

fn scratch(name: &str) -> PathBuf {
    let dir = scratch_root().join(name);
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

fn demo(name: &str) -> String {
    Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("sessions")
        .join(name)
        .display()
        .to_string()
}

fn stdout_json(out: &Output) -> serde_json::Value {
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8(out.stdout.clone()).unwrap();
    assert_eq!(text.trim().lines().count(), 1, "one JSON object: {text}");
    serde_json::from_str(&text).unwrap()
}

#[test]
fn session_check_summarises_a_demo() {
    let v = stdout_json(&elbowroom(&[
        "session",
        "check",
        &demo("03-seminar-hessenberg-growth.ron"),
        "--json",
    ]));
    assert_eq!(v["ok"], true);
    assert_eq!(v["version"], 1);
    assert_eq!(v["n"], 4);
    assert_eq!(v["current"], serde_json::json!([2, 4, 3, 1]));
    assert_eq!(v["view"], "Hessenberg");
    assert_eq!(v["pins"], 3);
    assert_eq!(v["history"], 3);
    assert!(v["title"].as_str().unwrap().contains("Hessenberg"));
}

#[test]
fn session_check_text_names_the_file() {
    let out = elbowroom(&["session", "check", &demo("01-seminar-pipe-dreams.ron")]);
    assert!(out.status.success());
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(
        text.contains("a valid session (format version 1)"),
        "{text}"
    );
    assert!(text.contains("current: 1432"), "{text}");
}

fn assert_refused(out: &Output, expected: &[&str]) {
    assert_eq!(out.status.code(), Some(2));
    assert!(out.stdout.is_empty(), "no partial output");
    let err = String::from_utf8(out.stderr.clone()).unwrap();
    assert_eq!(err.trim_end().lines().count(), 1, "one line: {err}");
    for e in expected {
        assert!(err.contains(e), "{e:?} in {err}");
    }
}

#[test]
fn session_check_refuses_bad_files_with_their_position() {
    let dir = scratch("bad");
    let text = std::fs::read_to_string(demo("02-seminar-reduced-words.ron")).unwrap();

    let truncated = dir.join("truncated.ron");
    std::fs::write(&truncated, &text[..text.len() * 2 / 3]).unwrap();
    let p = truncated.display().to_string();
    let out = elbowroom(&["session", "check", &p, "--json"]);
    assert_refused(&out, &[&format!("{p}:"), "truncated"]);

    let wrong = dir.join("wrong.ron");
    std::fs::write(
        &wrong,
        text.replacen("history_pos: 1", "history_pos: [1]", 1),
    )
    .unwrap();
    let line = text
        .lines()
        .position(|l| l.contains("history_pos: 1"))
        .unwrap()
        + 1;
    let p = wrong.display().to_string();
    let out = elbowroom(&["session", "check", &p, "--json"]);
    assert_refused(&out, &[&format!("{p}:{line}:"), "history_pos"]);

    let newer = dir.join("newer.ron");
    std::fs::write(&newer, text.replacen("version: 1", "version: 7", 1)).unwrap();
    let out = elbowroom(&["session", "check", &newer.display().to_string()]);
    assert_refused(&out, &["format version 7, this build reads up to 1"]);

    let out = elbowroom(&["session", "check", "/no/such/file.ron"]);
    assert_refused(&out, &["cannot read /no/such/file.ron"]);
    assert_eq!(
        std::fs::read_to_string(&truncated).unwrap(),
        text[..text.len() * 2 / 3],
        "checking never writes"
    );
}

#[test]
fn a_session_file_argument_is_validated_before_anything_opens() {
    let dir = scratch("open");
    let bad = dir.join("bad.ron");
    std::fs::write(
        &bad,
        "(format: \"elbowroom-session\", version: 1, session: (n: 40))",
    )
    .unwrap();
    let out = elbowroom(&[&bad.display().to_string()]);
    assert_refused(&out, &["n = 40 is out of range"]);
    let out = elbowroom(&["missing-session.ron"]);
    assert_refused(&out, &["cannot read missing-session.ron"]);
    // a command name is still a command
    let out = elbowroom(&["perm", "312", "--json"]);
    assert!(out.status.success());
}
