//! `elbowroom words W`: the reduced words of w in lexicographic order, and their number.
//!
//! The words are written as they are listed (at most `--limit` of them), text or
//! JSON, through the command's buffered output; Ctrl-C stops the count or the
//! listing with a "canceled after ..." line and exit status 130.

use super::args::WordsArgs;
use super::error::CliError;
use super::interrupt;
use super::json;
use super::output::Sink;
use crate::math::perms::words::{count_reduced_words_with, counts_by_content_with, reduced_words};
use crate::math::{MathError, Perm, Progress};
use num_bigint::BigUint;
use serde::Serialize;

/// The members of `words --json` before its list of words.
#[derive(Serialize)]
struct WordsHead {
    perm: Vec<usize>,
    length: usize,
    count: String,
}

/// One line of `words --jsonl`.
#[derive(Serialize)]
struct WordRow {
    word: Vec<usize>,
}

/// The number of reduced words of one content.
#[derive(Serialize)]
struct ContentCount<'a, C: Serialize> {
    content: &'a C,
    words: String,
}

/// The JSON of `words --by-content`.
#[derive(Serialize)]
struct ByContentRecord<'a, C: Serialize> {
    perm: Vec<usize>,
    length: usize,
    count: String,
    by_content: Vec<ContentCount<'a, C>>,
}
use std::sync::Arc;

pub fn run(args: &WordsArgs, sink: &mut Sink<'_>) -> Result<(), CliError> {
    let w = args.perm.clone();
    if args.by_content {
        return sink.whole(&by_content(args, &w)?);
    }
    let progress = Arc::new(Progress::new(0));
    let _watch = interrupt::watch(progress.clone());
    let count = count_reduced_words_with(&w, &progress).map_err(|e| match e {
        MathError::Canceled => {
            CliError::Canceled("the count of reduced words canceled; no output written".into())
        }
        other => other.into(),
    })?;
    let shown = if args.count { 0 } else { args.limit };
    // the number listed is known before the first: min(limit, count)
    let listed = if count < BigUint::from(shown) {
        usize::try_from(&count).unwrap_or(shown)
    } else {
        shown
    };
    progress.set_total(listed as u64);
    let mut written = 0u64;
    let result = list(args, sink, &w, &count, listed, &progress, &mut written);
    result
        .map_err(|e| interrupt::or_canceled(e, "the listing", "words", &progress, written, "words"))
}

fn list(
    args: &WordsArgs,
    sink: &mut Sink<'_>,
    w: &Perm,
    count: &BigUint,
    listed: usize,
    progress: &Progress,
    written: &mut u64,
) -> Result<(), CliError> {
    let words = reduced_words(w).take(listed);
    if args.lines.jsonl {
        let head = WordsHead {
            perm: w.one_line(),
            length: w.length(),
            count: count.to_string(),
        };
        return sink.json_lines_listing(
            "reduced_words",
            &head,
            words,
            |word| WordRow { word },
            progress,
            written,
        );
    }
    if args.output.json {
        let head = WordsHead {
            perm: w.one_line(),
            length: w.length(),
            count: count.to_string(),
        };
        return sink.json_listing(&head, "words", words, |a| a, progress, written);
    }
    sink.text(&format!(
        "{count} reduced word{} of {w} (length {})",
        if *count == 1u8.into() { "" } else { "s" },
        w.length()
    ))?;
    if listed > 0 {
        sink.text(&if *count > listed.into() {
            format!("; the first {listed}:")
        } else {
            ":".to_string()
        })?;
        // each word is formatted into one reused buffer
        let mut line = String::new();
        let mut digits = itoa::Buffer::new();
        for a in words {
            progress.check()?;
            line.clear();
            line.push('\n');
            if a.is_empty() {
                line.push_str("(empty word)");
            }
            for (k, x) in a.iter().enumerate() {
                if k > 0 {
                    line.push(' ');
                }
                line.push_str(digits.format(*x));
            }
            sink.text(&line)?;
            progress.advance(1);
            *written += 1;
        }
    }
    sink.text("\n")
}

/// `--by-content`: the number of reduced words of each content, contents in
/// decreasing lexicographic order (n − 1 entries, n the length of w as typed).
fn by_content(args: &WordsArgs, w: &Perm) -> Result<String, CliError> {
    let (count, by) = interrupt::run_interruptible("the count by content", "letters", 0, |p| {
        let count = count_reduced_words_with(w, p)?;
        Ok((count, counts_by_content_with(w, p)?))
    })?;
    if args.output.json {
        return json::text(&ByContentRecord {
            perm: w.one_line(),
            length: w.length(),
            count: count.to_string(),
            by_content: by
                .iter()
                .rev()
                .map(|(c, k)| ContentCount {
                    content: c,
                    words: k.to_string(),
                })
                .collect(),
        });
    }
    let mut out = format!(
        "{count} reduced word{} of {w} (length {}) by content c (c_i = number of letters i):",
        if count == 1u8.into() { "" } else { "s" },
        w.length()
    );
    let width = by.keys().map(|c| format!("{c:?}").len()).max().unwrap_or(0);
    for (c, k) in by.iter().rev() {
        out.push_str(&format!("\n  {:<width$}  {k}", format!("{c:?}")));
    }
    Ok(out)
}
