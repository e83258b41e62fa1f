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
    open_explorer_on(session, path)
}

#[cfg(feature = "gui")]
fn open_explorer_on(session: elbowroom::session::Session, path: &std::path::Path) -> ExitCode {
    match elbowroom::gui::run_file(session, path.to_path_buf()) {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("elbowroom: the explorer window could not open: {e}");
            ExitCode::FAILURE
        }
    }
}

#[cfg(not(feature = "gui"))]
fn open_explorer_on(session: elbowroom::session::Session, _path: &std::path::Path) -> ExitCode {
    println!(
        "This build has no explorer window (built without the `gui` feature); the file is a valid session: \"{}\" (n = {}, view {:?}).",
        session.title, session.n, session.view
    );
    ExitCode::SUCCESS
}

#[cfg(feature = "gui")]
fn open_explorer() -> ExitCode {
    match elbowroom::gui::run(None) {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("elbowroom: the explorer window could not open: {e}");
            ExitCode::FAILURE
        }
    }
}

#[cfg(not(feature = "gui"))]
fn open_explorer() -> ExitCode {
    println!(
        "This build has no explorer window (built without the `gui` feature). Try a headless command, for example:\n  elbowroom schubert 31524\n  elbowroom --help"
    );
    ExitCode::SUCCESS
}
