//! `elbowroom session check FILE [--json]`: validates a session file without
//! opening the explorer, and summarises what it would open.

use super::args::{SessionAction, SessionArgs, SessionCheckArgs};
use super::error::CliError;
use super::json;
use crate::math::excerpt::escape_controls;
use crate::session::model::excerpt;
use crate::session::{SessionError, store};
use serde::Serialize;

/// Runs `elbowroom session ...`.
pub fn run(args: &SessionArgs) -> Result<String, CliError> {
    match &args.action {
        Some(SessionAction::Check(a)) => check(a),
        None => Err(CliError::Input(
            "session needs an action; usage: elbowroom session check FILE [--json]".into(),
        )),
    }
}

/// The JSON of `session check`.
#[derive(Serialize)]
struct CheckRecord<'a> {
    ok: bool,
    version: u32,
    title: &'a str,
    n: usize,
    current: &'a [usize],
    view: &'a str,
    pins: usize,
    history: usize,
    notes_lines: usize,
}

fn check(args: &SessionCheckArgs) -> Result<String, CliError> {
    let (s, version) = store::load_with_version(&args.file).map_err(session_error)?;
    let view = format!("{:?}", s.view);
    if args.output.json {
        return json::text(&CheckRecord {
            ok: true,
            version,
            title: &s.title,
            n: s.n,
            current: &s.current,
            view: &view,
            pins: s.pins.len(),
            history: s.history.len(),
            notes_lines: s.notes.lines().count(),
        });
    }
    // one-line notation as everywhere else (the file was validated, so this is a permutation)
    let current = crate::math::Perm::from_one_line(&s.current)
        .map(|w| w.to_string())
        .unwrap_or_else(|_| format!("{:?}", s.current));
    let mut out = format!(
        "{}: a valid session (format version {version})\n  title:   {}\n  n:       {}\n  current: {}\n  view:    {view}\n  pins:    {}\n  history: {} permutation{}\n",
        escape_controls(&args.file.display().to_string()),
        escape_controls(&excerpt(&s.title, NOTE_EXCERPT)),
        s.n,
        current,
        s.pins.len(),
        s.history.len(),
        if s.history.len() == 1 { "" } else { "s" }
    );
    if !s.hessenberg.h.is_empty() {
        out.push_str(&format!(
            "  h:       ({})\n",
            s.hessenberg
                .h
                .iter()
                .map(|v| v.to_string())
                .collect::<Vec<_>>()
                .join(",")
        ));
    }
    if let Some(first) = s.notes.lines().find(|l| !l.trim().is_empty()) {
        let lines = s.notes.lines().count();
        out.push_str(&format!(
            "  notes:   {}{}\n",
            escape_controls(&excerpt(first, NOTE_EXCERPT)),
            if lines > 1 {
                format!(" ({lines} lines)")
            } else {
                String::new()
            }
        ));
    }
    Ok(out)
}

/// How many characters of the notes' first line the report shows.
const NOTE_EXCERPT: usize = 80;

/// A session error as a CLI error: an unreadable or unwritable file fails
/// (exit 1) when the operating system refused; a bad file is bad input (exit 2).
pub fn session_error(e: SessionError) -> CliError {
    match e {
        SessionError::Write { .. } | SessionError::NoConfigDir => CliError::Failed(e.to_string()),
        _ => CliError::Input(e.to_string()),
    }
}

#[cfg(test)]
mod tests {
    use super::excerpt;

    #[test]
    fn long_notes_are_shown_as_an_excerpt() {
        assert_eq!(excerpt("short", 80), "short");
        assert_eq!(excerpt(&"λ".repeat(100), 3), "λλλ…");
    }
}
