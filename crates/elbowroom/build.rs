//! Records the commit the program is built from (`git rev-parse`), for
//! `--version` and for the pieces of a sharded run, which `merge` takes only
//! from one build; "unknown" when the source is not in a git repository.

use std::process::Command;

fn git(args: &[&str]) -> Option<String> {
    let out = Command::new("git").args(args).output().ok()?;
    if !out.status.success() {
        return None;
    }
    let text = String::from_utf8(out.stdout).ok()?.trim().to_string();
    (!text.is_empty()).then_some(text)
}

fn main() {
    let commit = git(&["rev-parse", "--short=12", "HEAD"]).unwrap_or_else(|| "unknown".into());
    println!("cargo:rustc-env=ELBOWROOM_COMMIT={commit}");
    // rebuilt when HEAD moves: HEAD itself, the branch it names, packed refs
    if let Some(head) = git(&["rev-parse", "--git-path", "HEAD"]) {
        println!("cargo:rerun-if-changed={head}");
    }
    if let Some(branch) = git(&["symbolic-ref", "-q", "HEAD"])
        && let Some(r) = git(&["rev-parse", "--git-path", &branch])
    {
        println!("cargo:rerun-if-changed={r}");
    }
    if let Some(packed) = git(&["rev-parse", "--git-path", "packed-refs"]) {
        println!("cargo:rerun-if-changed={packed}");
    }
    println!("cargo:rerun-if-changed=build.rs");
}
