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
/// reported on one line (with its line and column), nothing is written, and
/// the window (where there is a display) opens with the refusal shown.
fn open_session_file(path: &std::path::Path) -> ExitCode {
    let session = match elbowroom::session::store::load(path) {
        Ok(s) => s,
        Err(e) => {
            elbowroom::cli::report(&e.to_string());
            show_refusal(path, e.to_string());
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
        Err(e) => window_failure(&e.to_string()),
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

/// The explorer with the refusal of a session file in its open window; where
/// no window can open, the line on stderr is the whole answer.
#[cfg(feature = "gui")]
fn show_refusal(path: &std::path::Path, refusal: String) {
    let unset = |name: &str| std::env::var_os(name).is_none_or(|v| v.is_empty());
    if unset("DISPLAY") && unset("WAYLAND_DISPLAY") && unset("WAYLAND_SOCKET") {
        return;
    }
    let _ = elbowroom::gui::run_refused(path.to_path_buf(), refusal);
}

#[cfg(not(feature = "gui"))]
fn show_refusal(_path: &std::path::Path, _refusal: String) {}

#[cfg(feature = "gui")]
fn open_explorer() -> ExitCode {
    match elbowroom::gui::run(None) {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => window_failure(&e.to_string()),
    }
}

#[cfg(not(feature = "gui"))]
fn open_explorer() -> ExitCode {
    println!(
        "This build has no explorer window (built without the `gui` feature). Try a headless command, for example:\n  elbowroom schubert 31524\n  elbowroom --help"
    );
    ExitCode::SUCCESS
}

/// Says why the window could not open, in the user's terms: with no display
/// at all, that the commands need none; otherwise the system's reason, without
/// the source locations of the libraries underneath.
#[cfg(feature = "gui")]
fn window_failure(reason: &str) -> ExitCode {
    let unset = |name: &str| std::env::var_os(name).is_none_or(|v| v.is_empty());
    if unset("DISPLAY") && unset("WAYLAND_DISPLAY") && unset("WAYLAND_SOCKET") {
        elbowroom::cli::report(
            "the explorer window could not open: there is no display (DISPLAY and WAYLAND_DISPLAY are unset); the headless commands need none, see 'elbowroom --help'",
        );
    } else {
        elbowroom::cli::report(&format!(
            "the explorer window could not open: {}",
            without_source_locations(reason)
        ));
    }
    ExitCode::FAILURE
}

/// `"os error at /x/y.rs:765: no screen"` -> `"os error: no screen"`.
#[cfg(feature = "gui")]
fn without_source_locations(text: &str) -> String {
    let mut out = text.to_string();
    while let Some(at) = out.find(" at /") {
        let rest = &out[at..];
        let Some(rs) = rest.find(".rs:") else { break };
        let tail = &rest[rs + 4..];
        let digits = tail.chars().take_while(char::is_ascii_digit).count();
        let mut end = at + rs + 4 + digits;
        if out[end..].starts_with(':') {
            end += 1;
        }
        out.replace_range(at..end, ":");
    }
    out
}

#[cfg(all(test, feature = "gui"))]
mod tests {
    use super::without_source_locations;

    #[test]
    fn library_source_locations_are_left_out_of_the_message() {
        assert_eq!(
            without_source_locations(
                "os error at /r/winit-0.30/src/linux/mod.rs:765: no display set."
            ),
            "os error: no display set."
        );
        assert_eq!(
            without_source_locations("no adapter found"),
            "no adapter found"
        );
    }
}
