//! The errors a headless command reports, with their exit statuses.

use crate::math::MathError;

/// Why a command did not produce its output.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum CliError {
    /// Bad input: exit status 2.
    #[error("{0}")]
    Input(String),
    /// The mathematics refused the input (too large, malformed, out of range)
    /// or was canceled: exit status 2 (a cancel: 128 + the signal).
    #[error("{0}")]
    Math(MathError),
    /// The run was interrupted (Ctrl-C, SIGTERM, SIGHUP): exit status 128 + the signal.
    #[error("{0}")]
    Canceled(String),
    /// Anything else (an unwritable file, ...): exit status 1.
    #[error("{0}")]
    Failed(String),
}

impl CliError {
    /// The one-line message printed on stderr.
    pub fn message(&self) -> String {
        match self {
            CliError::Math(MathError::Canceled) => "canceled".into(),
            other => other.to_string(),
        }
    }

    /// Whether the run was canceled (by a signal).
    pub fn is_canceled(&self) -> bool {
        matches!(
            self,
            CliError::Canceled(_) | CliError::Math(MathError::Canceled)
        )
    }

    /// The process exit status.
    pub fn exit_code(&self) -> u8 {
        match self {
            CliError::Input(_) | CliError::Math(_) if !self.is_canceled() => 2,
            CliError::Failed(_) => 1,
            _ => super::interrupt::canceled_status(),
        }
    }
}

impl From<MathError> for CliError {
    fn from(e: MathError) -> Self {
        CliError::Math(e)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn statuses_follow_the_kind_of_failure() {
        assert_eq!(CliError::Input("x".into()).exit_code(), 2);
        assert_eq!(CliError::Failed("x".into()).exit_code(), 1);
        assert_eq!(CliError::Math(MathError::Canceled).exit_code(), 130);
        assert_eq!(CliError::Canceled("c".into()).exit_code(), 130);
        assert_eq!(CliError::Math(MathError::Canceled).message(), "canceled");
    }
}
