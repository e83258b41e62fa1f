//! The `elbowroom` binary: no arguments opens the explorer; a command runs headless.

use std::process::ExitCode;

fn main() -> ExitCode {
    let argv: Vec<std::ffi::OsString> = std::env::args_os().collect();
    if argv.len() <= 1 {
        return open_explorer();
    }
    elbowroom::cli::run(argv)
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
