//! The errors a headless command reports, with their exit statuses.

use crate::math::MathError;

/// Why a command did not produce its output.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum CliError {
    /// Bad input: exit status 2.
    Input(String),
    /// The run was interrupted (Ctrl-C): exit status 130.
    Canceled(String),
    /// Anything else (an unwritable file, ...): exit status 1.
    Failed(String),
}

impl CliError {
    /// The one-line message printed on stderr.
    pub fn message(&self) -> &str {
        match self {
            CliError::Input(m) | CliError::Canceled(m) | CliError::Failed(m) => m,
        }
    }

    /// The process exit status.
    pub fn exit_code(&self) -> u8 {
        match self {
            CliError::Input(_) => 2,
            CliError::Canceled(_) => 130,
            CliError::Failed(_) => 1,
        }
    }
}

impl From<MathError> for CliError {
    fn from(e: MathError) -> Self {
        match e {
            MathError::Canceled => CliError::Canceled("canceled".into()),
            other => CliError::Input(other.to_string()),
        }
    }
}
