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

/// Starts `elbowroom ARGS...`, waits until it announces on stderr that its
/// long run is registered with the Ctrl-C handler (the hook
/// `ELBOWROOM_ANNOUNCE_WATCH=1`), sends it SIGINT as Ctrl-C does, and returns
/// what it did. The announcement line is left out of the stderr returned.
pub fn interrupted(args: &[&str]) -> Output {
    signaled(args, "INT")
}

/// [`interrupted`] with another signal (`"TERM"`, `"HUP"`, `"INT"`), sent
/// once the long run is registered.
pub fn signaled(args: &[&str], signal: &str) -> Output {
    use elbowroom::cli::interrupt::{ANNOUNCE_ENV, ANNOUNCEMENT};
    use std::io::{BufRead, BufReader, Read};
    let mut child = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .env(ANNOUNCE_ENV, "1")
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    let mut stderr = BufReader::new(child.stderr.take().unwrap());
    let mut line = String::new();
    let read = stderr.read_line(&mut line).unwrap();
    assert!(
        read > 0 && line.trim_end() == ANNOUNCEMENT,
        "{args:?}: expected {ANNOUNCEMENT:?} on stderr first, got {line:?}"
    );
    let status = Command::new("kill")
        .args([&format!("-{signal}"), &child.id().to_string()])
        .status()
        .unwrap();
    assert!(status.success(), "kill -INT failed");
    // the rest of stderr on its own thread, so that neither pipe can fill up and stall the child
    let rest = std::thread::spawn(move || {
        let mut rest = Vec::new();
        stderr.read_to_end(&mut rest).map(|_| rest)
    });
    let mut out = child.wait_with_output().unwrap();
    out.stderr = rest.join().unwrap().unwrap();
    out
}
