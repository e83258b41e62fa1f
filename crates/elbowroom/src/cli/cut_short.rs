//! The end of an output on standard output that stopped before it was
//! complete (a cancel by Ctrl-C, SIGTERM or SIGHUP, a limit reached, a
//! failure mid-listing): a last line no reader can take for the end of a
//! complete output, chosen by the output's format.
//!
//! - CSV: a line with one field more than the header (a strict CSV reader
//!   refuses it; a person reads the words in its first field).
//! - JSON and JSON lines: an unterminated object on a line of its own (the
//!   document, or the last line, does not parse).
//! - LaTeX: a comment and `\errmessage`, which stops a LaTeX run.
//! - Text: a line beginning with `…` saying the output is cut short.
//!
//! `--out FILE` never needs one: FILE appears only when the output is complete.

use std::ffi::OsString;
use std::sync::Mutex;

/// The words every marker carries.
pub const CUT_WORDS: &str =
    "output cut short: the run stopped before the end, so what is above is incomplete";

/// The format of a command's output, as its flags ask for it.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Format {
    /// Readable text (no format flag).
    Text,
    /// `--csv`.
    Csv,
    /// `--json` or `--jsonl`.
    Json,
    /// `--latex`.
    Latex,
}

impl Format {
    /// The format the command line asks for: the first of `--csv`, `--json`,
    /// `--jsonl`, `--latex` (or `--format X`) among the arguments; text otherwise.
    pub fn of_arguments(argv: &[OsString]) -> Format {
        let mut next_is_format = false;
        for a in argv.iter().skip(1) {
            let a = a.to_string_lossy();
            if a == "--" {
                break;
            }
            let named = if next_is_format {
                next_is_format = false;
                Some(a.as_ref())
            } else if a == "--format" {
                next_is_format = true;
                None
            } else {
                a.strip_prefix("--format=").or_else(|| a.strip_prefix("--"))
            };
            match named {
                Some("csv") => return Format::Csv,
                Some("json") | Some("jsonl") => return Format::Json,
                Some("latex") | Some("tex") => return Format::Latex,
                _ => {}
            }
        }
        Format::Text
    }

    /// The last line(s) of a cut output, whose first line was `header` (for
    /// CSV: the header, whose fields are counted). Starts with a newline when
    /// the output did not end with one (`at_line_start` false).
    pub fn marker(self, header: &str, at_line_start: bool) -> String {
        let start = if at_line_start { "" } else { "\n" };
        match self {
            Format::Csv => {
                let fields = csv_fields(header).max(1);
                format!("{start}\"{CUT_WORDS}\"{}\n", ",".repeat(fields))
            }
            Format::Json => format!("{start}{{\"cut_short\":\"{CUT_WORDS}\"\n"),
            Format::Latex => format!(
                "{start}% {CUT_WORDS}\n\\errmessage{{elbowroom: this table was cut short}}\n"
            ),
            Format::Text => format!("{start}… {CUT_WORDS}\n"),
        }
    }
}

/// The number of fields of one CSV line (commas outside double quotes, plus one).
pub fn csv_fields(line: &str) -> usize {
    let mut quoted = false;
    let mut fields = 1;
    for ch in line.chars() {
        match ch {
            '"' => quoted = !quoted,
            ',' if !quoted => fields += 1,
            _ => {}
        }
    }
    fields
}

/// What a signal that ends the process at once writes last on standard
/// output: set while a command streams to standard output.
static PENDING: Mutex<Option<String>> = Mutex::new(None);

/// Records the marker to write if the process is ended by a signal now.
pub fn set_pending(marker: Option<String>) {
    if let Ok(mut g) = PENDING.lock() {
        *g = marker;
    }
}

/// Writes the recorded marker on standard output (appending, through a handle
/// of its own, since the command's thread may hold the usual one), giving up
/// after a short wait when the reader does not take it (a full pipe).
pub fn write_pending() {
    let Some(marker) = PENDING.lock().ok().and_then(|mut g| g.take()) else {
        return;
    };
    let (tx, rx) = std::sync::mpsc::channel();
    std::thread::spawn(move || {
        use std::io::Write;
        #[cfg(target_os = "linux")]
        let opened = std::fs::OpenOptions::new()
            .append(true)
            .open("/proc/self/fd/1");
        #[cfg(not(target_os = "linux"))]
        let opened: std::io::Result<std::fs::File> =
            Err(std::io::Error::from(std::io::ErrorKind::Unsupported));
        if let Ok(mut out) = opened {
            let _ = out.write_all(marker.as_bytes());
            let _ = out.flush();
        }
        let _ = tx.send(());
    });
    let _ = rx.recv_timeout(std::time::Duration::from_millis(300));
}

#[cfg(test)]
mod tests {
    use super::*;

    fn argv(s: &[&str]) -> Vec<OsString> {
        s.iter().map(OsString::from).collect()
    }

    #[test]
    fn the_format_is_read_from_the_flags() {
        assert_eq!(
            Format::of_arguments(&argv(&["elbowroom", "hessenberg", "--n", "5", "--csv"])),
            Format::Csv
        );
        assert_eq!(
            Format::of_arguments(&argv(&["elbowroom", "survey", "--jsonl"])),
            Format::Json
        );
        assert_eq!(
            Format::of_arguments(&argv(&["elbowroom", "words", "4321"])),
            Format::Text
        );
        assert_eq!(
            Format::of_arguments(&argv(&["elbowroom", "x", "--format", "latex"])),
            Format::Latex
        );
    }

    #[test]
    fn a_csv_marker_has_one_field_more_than_the_header() {
        let m = Format::Csv.marker("perm,length,\"a, b\"", true);
        assert_eq!(csv_fields(m.trim_end()), 4);
        assert!(m.starts_with('"'));
        // a JSON marker never parses, alone or after a complete object
        let j = Format::Json.marker("{", false);
        assert!(serde_json::from_str::<serde_json::Value>(&j).is_err());
        assert!(serde_json::from_str::<serde_json::Value>(&format!("{{}}{j}")).is_err());
        assert!(
            Format::Text
                .marker("", false)
                .starts_with("\n… output cut short")
        );
    }
}
