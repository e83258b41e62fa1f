//! `elbowroom words W`: the reduced words of w in lexicographic order, and their number.

use super::args::WordsArgs;
use super::error::CliError;
use super::json;
use crate::math::perms::words::{count_reduced_words_with, reduced_words};
use crate::math::{Perm, Progress};
use serde_json::json;

/// Runs the command.
pub fn run(args: &WordsArgs) -> Result<String, CliError> {
    let w = Perm::parse(&args.perm)?;
    let count = count_reduced_words_with(&w, &Progress::default())?;
    let shown = if args.count { 0 } else { args.limit };
    let words: Vec<Vec<usize>> = reduced_words(&w).take(shown).collect();
    if args.json {
        return Ok(json::render(&json!({
            "perm": w.one_line(),
            "length": w.length(),
            "count": json::exact(&count),
            "words": words,
        })));
    }
    let mut out = format!(
        "{count} reduced word{} of {w} (length {})",
        if count == 1u8.into() { "" } else { "s" },
        w.length()
    );
    if !words.is_empty() {
        let listed = words.len();
        out.push_str(&if count > listed.into() {
            format!("; the first {listed}:")
        } else {
            ":".to_string()
        });
        for a in &words {
            let text: Vec<String> = a.iter().map(|x| x.to_string()).collect();
            out.push('\n');
            out.push_str(if text.is_empty() { "(empty word)" } else { "" });
            out.push_str(&text.join(" "));
        }
    }
    Ok(out)
}
