//! The `elbowroom` binary: no arguments opens the explorer; a command runs headless.

use std::process::ExitCode;

fn main() -> ExitCode {
    let argv: Vec<std::ffi::OsString> = std::env::args_os().collect();
    if argv.len() <= 1 {
        return open_explorer();
    }
    elbowroom::cli::run(argv)
}

fn open_explorer() -> ExitCode {
    println!(
        "The explorer window is not built yet. Try a headless command, for example:\n  elbowroom schubert 31524\n  elbowroom --help"
    );
    ExitCode::SUCCESS
}
