//! Running the real `elbowroom` binary from the command-line tests: its output,
//! its one JSON object, and its refusals of bad input.
#![allow(dead_code, clippy::unwrap_used)]

use serde_json::Value;
use std::process::{Command, Output, Stdio};

/// Runs `elbowroom ARGS...` and returns what it did.
pub fn run(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .output()
        .unwrap()
}

/// Runs a command that must succeed and print exactly one JSON object on one line.
pub fn json(args: &[&str]) -> Value {
    let out = run(args);
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8(out.stdout).unwrap();
    assert_eq!(text.trim().lines().count(), 1, "exactly one JSON object");
    serde_json::from_str(&text).unwrap()
}

/// Runs a command that must be refused: exit status 2, nothing on stdout, and
/// one line on stderr that contains `needle`.
pub fn rejects(args: &[&str], needle: &str) {
    let out = run(args);
    assert_eq!(out.status.code(), Some(2), "{args:?}");
    assert!(
        out.stdout.is_empty(),
        "{args:?}: no partial output on stdout"
    );
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(err.trim().lines().count(), 1, "{args:?}: one line: {err}");
    assert!(err.contains(needle), "{args:?}: {err}");
}

/// Starts `elbowroom ARGS...`, sends it SIGINT (as Ctrl-C does) after
/// `after_ms` milliseconds, and returns what it did.
pub fn interrupted(args: &[&str], after_ms: u64) -> Output {
    let child = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    std::thread::sleep(std::time::Duration::from_millis(after_ms));
    let status = Command::new("kill")
        .args(["-INT", &child.id().to_string()])
        .status()
        .unwrap();
    assert!(status.success(), "kill -INT failed");
    child.wait_with_output().unwrap()
}
