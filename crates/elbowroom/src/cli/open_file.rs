//! `elbowroom FILE`: a single argument naming a session file opens it in the
//! explorer. This decides whether the command line is such a call, without
//! taking any command name away from the headless commands; and
//! [`read_text`] is the bounded reader for the files commands read.

use super::args::Cli;
use clap::CommandFactory;
use std::ffi::OsString;
use std::path::PathBuf;

/// The session file named by a command line (`argv[0]` included), if the line
/// is exactly one argument that is not an option, not a command name, and
/// either ends in `.ron` or names an existing file.
pub fn session_file_argument(argv: &[OsString]) -> Option<PathBuf> {
    let [_, arg] = argv else {
        return None;
    };
    let text = arg.to_string_lossy();
    if text.is_empty() || text.starts_with('-') {
        return None;
    }
    let command = Cli::command();
    let is_command = text == "help"
        || command
            .get_subcommands()
            .any(|c| c.get_name() == text || c.get_all_aliases().any(|a| a == text));
    if is_command {
        return None;
    }
    let path = PathBuf::from(arg);
    let named_as_session = path
        .extension()
        .is_some_and(|e| e.eq_ignore_ascii_case(crate::session::format::EXTENSION));
    (named_as_session || path.is_file()).then_some(path)
}

/// Reads a text file a command was given (a JSON piece, a session), refusing
/// what is not a regular file or is larger than
/// [`crate::math::limits::FILE_SIZE_LIMIT`] before reading it: bad input, exit 2.
pub fn read_text(path: &std::path::Path) -> Result<String, super::error::CliError> {
    crate::session::store::read_bounded(path).map_err(|reason| {
        super::error::CliError::Input(format!("cannot read {}: {reason}", path.display()))
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn line(args: &[&str]) -> Vec<OsString> {
        std::iter::once("elbowroom")
            .chain(args.iter().copied())
            .map(OsString::from)
            .collect()
    }

    #[test]
    fn commands_and_options_are_not_files() {
        assert_eq!(session_file_argument(&line(&["perm"])), None);
        assert_eq!(session_file_argument(&line(&["help"])), None);
        assert_eq!(session_file_argument(&line(&["--help"])), None);
        assert_eq!(session_file_argument(&line(&["perm", "312"])), None);
        assert_eq!(session_file_argument(&line(&[])), None);
    }

    #[test]
    fn session_files_are_recognised() {
        assert_eq!(
            session_file_argument(&line(&["study.ron"])),
            Some(PathBuf::from("study.ron"))
        );
        let existing = env!("CARGO_MANIFEST_DIR").to_string() + "/Cargo.toml";
        assert_eq!(
            session_file_argument(&line(&[&existing])),
            Some(PathBuf::from(&existing))
        );
        assert_eq!(session_file_argument(&line(&["no-such-thing"])), None);
    }
}
