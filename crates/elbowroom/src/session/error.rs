//! Why a session could not be read or written. Every message names the file
//! and says what was wrong, so the researcher can fix it; nothing here panics.

use std::path::PathBuf;

/// A failure to load, validate or save a session file.
#[derive(Debug, thiserror::Error)]
pub enum SessionError {
    /// The file could not be read (missing, unreadable, not UTF-8).
    #[error("cannot read {}: {reason}", path.display())]
    Read {
        /// The file.
        path: PathBuf,
        /// What the operating system said.
        reason: String,
    },
    /// The file is damaged: RON syntax or a field of the wrong type.
    #[error("{}:{line}:{column}: {message}", path.display())]
    Syntax {
        /// The file.
        path: PathBuf,
        /// 1-based line of the problem.
        line: usize,
        /// 1-based column of the problem.
        column: usize,
        /// What was found and what was expected.
        message: String,
    },
    /// The file is RON but not an elbowroom session.
    #[error("{} is not an elbowroom session: {reason}", path.display())]
    NotASession {
        /// The file.
        path: PathBuf,
        /// What is missing or different.
        reason: String,
    },
    /// The file was written by a later version of the program.
    #[error(
        "{} was written by a newer elbowroom: format version {found}, this build reads up to {supported}",
        path.display()
    )]
    NewerVersion {
        /// The file.
        path: PathBuf,
        /// The version the file declares.
        found: u32,
        /// The newest version this build reads.
        supported: u32,
    },
    /// The file parses but describes an impossible exploration.
    #[error("{}: {reason}", path.display())]
    Invalid {
        /// The file.
        path: PathBuf,
        /// Which field is wrong and what is accepted.
        reason: String,
    },
    /// The session could not be written; the previous file, if any, is intact.
    #[error("cannot save {}: {reason}", path.display())]
    Write {
        /// The file being saved.
        path: PathBuf,
        /// What went wrong.
        reason: String,
    },
    /// No directory for elbowroom's own files could be found (no home directory).
    #[error("no configuration directory: set XDG_CONFIG_HOME or HOME")]
    NoConfigDir,
}
