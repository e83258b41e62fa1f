//! The `elbowroom` binary: no arguments opens the explorer; a command runs headless.

use std::process::ExitCode;

fn main() -> ExitCode {
    let argv: Vec<std::ffi::OsString> = std::env::args_os().collect();
    if argv.len() <= 1 {
        return open_explorer();
    }
    if let Some(path) = elbowroom::cli::open_file::session_file_argument(&argv) {
        return open_session_file(&path);
    }
    elbowroom::cli::run(argv)
}

/// `elbowroom FILE`: validates the session and opens it; a bad file is
/// reported on one line (with its line and column) and nothing is written.
fn open_session_file(path: &std::path::Path) -> ExitCode {
    let session = match elbowroom::session::store::load(path) {
        Ok(s) => s,
        Err(e) => {
            eprintln!("elbowroom: {e}");
            return ExitCode::from(2);
        }
    };
    let _ = elbowroom::session::recent::push(path);
    println!(
        "The explorer window is not built yet; it would open \"{}\" (n = {}, view {:?}).",
        session.title, session.n, session.view
    );
    ExitCode::SUCCESS
}

fn open_explorer() -> ExitCode {
    println!(
        "The explorer window is not built yet. Try a headless command, for example:\n  elbowroom schubert 31524\n  elbowroom --help"
    );
    ExitCode::SUCCESS
}
