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
use crate::math::limits::RON_NESTING_LIMIT;
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
    /// `None` when absent; versions start at 1 (0 or a negative number is no version).
    #[serde(default, deserialize_with = "present")]
    version: Option<i64>,
}

/// A version written as a plain number (`version: 1`) read as present.
fn present<'de, D: serde::Deserializer<'de>>(d: D) -> Result<Option<i64>, D::Error> {
    i64::deserialize(d).map(Some)
}

/// Reads RON with the nesting of brackets limited to [`RON_NESTING_LIMIT`],
/// so a file of a hundred thousand `(` is refused instead of exhausting the stack.
fn read_ron<'a, T: Deserialize<'a>>(text: &'a str) -> Result<T, ron::error::SpannedError> {
    ron::Options::default()
        .with_recursion_limit(RON_NESTING_LIMIT)
        .from_str(text)
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
    let header: Header = read_ron(text).map_err(|e| syntax(path, text, &e))?;
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
        None => Err(SessionError::NotASession {
            path: path.into(),
            reason: "it has no `version` field".into(),
        }),
        Some(1) => {
            let file: FileV1 = read_ron(text).map_err(|e| syntax(path, text, &e))?;
            Ok((file.session, 1))
        }
        Some(v) if v > i64::from(CURRENT_VERSION) => Err(SessionError::NewerVersion {
            path: path.into(),
            found: u32::try_from(v).unwrap_or(u32::MAX),
            supported: CURRENT_VERSION,
        }),
        Some(v) => Err(SessionError::NotASession {
            path: path.into(),
            reason: format!(
                "its format version is {v}; versions are whole numbers from 1 (this build reads 1 to {CURRENT_VERSION})"
            ),
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

/// What went wrong, in the words of a session file rather than of the RON
/// library or of this program's types.
fn explain(code: &ron::Error) -> String {
    use ron::Error as E;
    match code {
        E::Eof | E::ExpectedStringEnd => "the file ends too early (is it truncated?)".into(),
        E::ExceededRecursionLimit => format!(
            "brackets nest more than {RON_NESTING_LIMIT} deep here; a session file nests four deep"
        ),
        E::MissingStructField { field, .. } => format!("the field `{field}` is missing here"),
        E::DuplicateStructField { field, .. } => format!("the field `{field}` appears twice"),
        E::NoSuchEnumVariant {
            expected, found, ..
        } => format!(
            "`{}` is not accepted here; accepted: {}",
            plain(found),
            expected.join(", ")
        ),
        E::InvalidValueForType { expected, found } => {
            format!("expected {} here, found {}", plain(expected), plain(found))
        }
        E::IntegerOutOfBounds => "this number is too large for its field".into(),
        E::ExpectedDifferentStructName { .. } | E::ExpectedNamedStructLike(_) => {
            "expected an elbowroom session `(format: \"elbowroom-session\", version: 1, session: (...))` here".into()
        }
        E::TrailingCharacters => "there is more text after the end of the session".into(),
        E::SuggestRawIdentifier(found) | E::InvalidIdentifier(found) => format!(
            "`{}` is not accepted here; a field name or a choice such as Dreams is expected",
            crate::math::excerpt::excerpt(found)
        ),
        E::ExpectedIdentifier => {
            "a field name or a choice such as Dreams is expected here".into()
        }
        E::Message(m) => format!("{} here", lower_first(&plain(m)).trim_end_matches('.')),
        other => format!(
            "{} here",
            lower_first(&plain(&other.to_string())).trim_end_matches('.')
        ),
    }
}

/// RON starts its messages with a capital; ours continue a sentence.
fn lower_first(text: &str) -> String {
    let mut chars = text.chars();
    match chars.next() {
        Some(c) => c.to_lowercase().chain(chars).collect(),
        None => String::new(),
    }
}

/// A message with the program's own type names and RON's raw-identifier
/// marks replaced by what a reader of the file sees.
fn plain(text: &str) -> String {
    let mut t = text.replace("r#", "");
    for (inner, outer) in [
        (
            "struct `Header`",
            "an elbowroom session `(format: \"elbowroom-session\", version: 1, session: (...))`",
        ),
        (
            "struct `FileV1`",
            "an elbowroom session `(format: \"elbowroom-session\", version: 1, session: (...))`",
        ),
        ("`FileV1`", "the session file"),
        ("`Header`", "the session file"),
        ("usize", "a whole number 0, 1, 2, ..."),
        ("u32", "a whole number 0, 1, 2, ..."),
        ("i64", "a whole number"),
        ("f32", "a number"),
        ("a sequence", "a list `[...]`"),
    ] {
        t = t.replace(inner, outer);
    }
    for name in [
        "Session",
        "BrowserPlace",
        "DreamPlace",
        "WordPlace",
        "QuotientPlace",
        "PermutohedronPlace",
        "HessenbergPlace",
        "WorkbenchPlace",
        "FigureSettings",
    ] {
        t = t.replace(&format!("struct `{name}`"), "a group of fields `(...)`");
        t = t.replace(&format!(" in `{name}`"), "");
    }
    t
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
