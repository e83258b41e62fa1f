//! The session file format: RON text with a header that names the format and
//! its version, then the session itself.
//!
//! ```text
//! // elbowroom session
//! (
//!     format: "elbowroom-session",
//!     version: 1,
//!     session: ( title: "...", n: 4, current: [1, 4, 3, 2], ... ),
//! )
//! ```
//!
//! Reading happens in two passes. The first reads only `format` and `version`
//! (every other field is skipped unread), so a file from a newer program is
//! refused by its version before any of its fields can confuse this one. The
//! second pass reads the body of that version ([`FileV1`], ...) and migrates
//! it to the current [`Session`]. Fields unknown to this build are ignored and
//! missing fields take their defaults (`#[serde(default)]` on `Session`), so
//! adding a field never needs a new version; renaming or reinterpreting one
//! does, together with a `FileVn` struct and a migration arm in
//! [`decode_with_version`].
//!
//! An explicit header was chosen over an internally tagged enum
//! (`#[serde(tag = "version")]`): serde reads such enums through a buffered
//! intermediate value, so an error inside the body would be reported at the
//! end of the buffered value instead of at its own line and column.

use super::error::SessionError;
use super::model::Session;
use serde::{Deserialize, Serialize};
use std::path::Path;

/// The value of the `format` field of every session file.
pub const FORMAT_NAME: &str = "elbowroom-session";

/// The newest file version this build reads, and the one it writes.
pub const CURRENT_VERSION: u32 = 1;

/// The file extension of session files.
pub const EXTENSION: &str = "ron";

/// The first pass: just enough to recognise the file and its version.
#[derive(Deserialize)]
struct Header {
    #[serde(default)]
    format: String,
    /// 0 when absent: versions start at 1.
    #[serde(default)]
    version: u32,
}

/// Version 1 of the file: the header and the session.
#[derive(Serialize, Deserialize)]
pub struct FileV1 {
    /// Always [`FORMAT_NAME`].
    pub format: String,
    /// Always 1.
    pub version: u32,
    /// The exploration.
    pub session: Session,
}

/// Writes a session as the text of a current-version file.
pub fn encode(session: &Session) -> Result<String, ron::Error> {
    let file = FileV1 {
        format: FORMAT_NAME.into(),
        version: CURRENT_VERSION,
        session: session.clone(),
    };
    let config = ron::ser::PrettyConfig::new()
        .depth_limit(4)
        .struct_names(false)
        .separate_tuple_members(false)
        .compact_arrays(true)
        .escape_strings(false);
    let body = ron::ser::to_string_pretty(&file, config)?;
    Ok(format!("// elbowroom session file (RON)\n{body}\n"))
}

/// Reads the text of a session file of any version this build knows, and
/// migrates it to the current [`Session`]. `path` is used in messages only.
/// The session is not validated here; see [`super::validate`].
pub fn decode(text: &str, path: &Path) -> Result<Session, SessionError> {
    decode_with_version(text, path).map(|(session, _)| session)
}

/// [`decode`], also returning the format version the file was written in.
pub fn decode_with_version(text: &str, path: &Path) -> Result<(Session, u32), SessionError> {
    let header: Header = ron::from_str(text).map_err(|e| syntax(path, text, &e))?;
    match header.format.as_str() {
        FORMAT_NAME => {}
        "" => {
            return Err(SessionError::NotASession {
                path: path.into(),
                reason: format!("it has no `format: \"{FORMAT_NAME}\"` field"),
            });
        }
        other => {
            return Err(SessionError::NotASession {
                path: path.into(),
                reason: format!("its format is \"{other}\", expected \"{FORMAT_NAME}\""),
            });
        }
    }
    match header.version {
        0 => Err(SessionError::NotASession {
            path: path.into(),
            reason: "it has no `version` field".into(),
        }),
        1 => {
            let file: FileV1 = ron::from_str(text).map_err(|e| syntax(path, text, &e))?;
            Ok((file.session, 1))
        }
        v if v > CURRENT_VERSION => Err(SessionError::NewerVersion {
            path: path.into(),
            found: v,
            supported: CURRENT_VERSION,
        }),
        v => Err(SessionError::NotASession {
            path: path.into(),
            reason: format!("format version {v} is unknown"),
        }),
    }
}

fn syntax(path: &Path, text: &str, e: &ron::error::SpannedError) -> SessionError {
    let (line, column) = (e.span.start.line, e.span.start.col);
    let mut message = explain(&e.code);
    if let Some(field) = field_at(text, line, column) {
        message.push_str(&format!(" (in the field `{field}`)"));
    }
    SessionError::Syntax {
        path: path.into(),
        line,
        column,
        message,
    }
}

/// RON's message, with a plainer word for the end of a truncated file.
fn explain(code: &ron::Error) -> String {
    match code {
        ron::Error::Eof | ron::Error::ExpectedStringEnd => {
            "the file ends too early (is it truncated?)".into()
        }
        other => {
            // the header's type name means nothing to a reader: say what it is
            let text = other.to_string().replace(
                "struct `Header`",
                "an elbowroom session `(format: \"elbowroom-session\", version: 1, session: (...))`",
            );
            format!("{} here", text.trim_end_matches('.'))
        }
    }
}

/// The name of the field written as `name:` on `line` before `column`, if any.
fn field_at(text: &str, line: usize, column: usize) -> Option<String> {
    let src = text.lines().nth(line.checked_sub(1)?)?;
    let before: String = src.chars().take(column.saturating_sub(1)).collect();
    let colon = before.rfind(':')?;
    let name: String = before[..colon]
        .trim_end()
        .chars()
        .rev()
        .take_while(|c| c.is_ascii_alphanumeric() || *c == '_')
        .collect::<Vec<_>>()
        .into_iter()
        .rev()
        .collect();
    (!name.is_empty() && !name.starts_with(|c: char| c.is_ascii_digit())).then_some(name)
}
