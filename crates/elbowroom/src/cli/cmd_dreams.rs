//! `elbowroom dreams W`: the reduced pipe dreams of w (or, with `--bumpless`,
//! its bumpless pipe dreams), drawn as small pictures or listed as JSON, written
//! one by one as they are found (at most `--limit`); Ctrl-C stops the listing with
//! a "canceled after ..." line and exit status 130.

use super::args::DreamsArgs;
use super::error::CliError;
use super::interrupt;
use super::output::Sink;
use crate::math::pipes::bumpless::{BumplessDream, bumpless_dreams};
use crate::math::pipes::dream::{PipeDream, count_pipe_dreams, pipe_dreams};
use crate::math::poly::mono::exponents_text;
use crate::math::{Perm, Progress};
use num_bigint::BigUint;
use serde::Serialize;

/// The members of `dreams --json` before its list of dreams.
#[derive(Serialize)]
struct DreamsHead {
    perm: Vec<usize>,
    count: String,
}

/// One reduced pipe dream: its crosses (i, j), reading word and monomial.
#[derive(Serialize)]
struct DreamRecord<W: Serialize, M: Serialize> {
    crosses: Vec<[usize; 2]>,
    word: W,
    monomial: M,
}

/// One bumpless pipe dream: its blank tiles (i, j), monomial and rows of tiles.
#[derive(Serialize)]
struct BumplessRecord<M: Serialize> {
    blanks: Vec<[usize; 2]>,
    monomial: M,
    tiles: Vec<String>,
}
use std::fmt::Write as _;
use std::sync::Arc;

/// The most bumpless pipe dreams the command will generate (they are found all at
/// once by a search with a set of the dreams seen).
pub const BUMPLESS_LIMIT: u64 = 200_000;

pub fn run(args: &DreamsArgs, sink: &mut Sink<'_>) -> Result<(), CliError> {
    let w = args.perm.clone();
    // the number of reduced pipe dreams, S_w(1, ..., 1); by Lam–Lee–Shimozono it
    // is also the number of bumpless pipe dreams
    let count = count_pipe_dreams(&w);
    let shown = if args.count { 0 } else { args.limit };
    let progress = Arc::new(Progress::new(0));
    let _watch = interrupt::watch(progress.clone());
    let mut written = 0u64;
    let result = if args.bumpless {
        bumpless(args, sink, &w, &count, shown, &progress, &mut written)
    } else {
        reduced(args, sink, &w, &count, shown, &progress, &mut written)
    };
    result.map_err(|e| {
        interrupt::or_canceled(
            e,
            "the listing",
            "pipe dreams",
            &progress,
            written,
            "pipe dreams",
        )
    })
}

/// The reduced pipe dreams, written one by one as the walk finds them.
fn reduced(
    args: &DreamsArgs,
    sink: &mut Sink<'_>,
    w: &Perm,
    count: &BigUint,
    shown: usize,
    progress: &Progress,
    written: &mut u64,
) -> Result<(), CliError> {
    // the number listed is known before the first: min(limit, count)
    let listed = if *count < BigUint::from(shown) {
        usize::try_from(count).unwrap_or(shown)
    } else {
        shown
    };
    progress.set_total(listed as u64);
    let dreams = pipe_dreams(w).take(listed);
    let record = |d: PipeDream| DreamRecord {
        crosses: d.crosses().iter().map(|&(i, j)| [i, j]).collect(),
        word: d.reading_word(),
        monomial: d.monomial(),
    };
    let head = DreamsHead {
        perm: w.one_line(),
        count: count.to_string(),
    };
    if args.lines.jsonl {
        return sink.json_lines_listing("pipe_dreams", &head, dreams, record, progress, written);
    }
    if args.output.json {
        return sink.json_listing(&head, "dreams", dreams, record, progress, written);
    }
    sink.text(&heading(count, w, "reduced pipe dream", listed))?;
    write_each(sink, dreams, progress, written, |buf, k, d| {
        let _ = write!(
            buf,
            "\n\n#{}  {}  word ",
            k + 1,
            exponents_text(&d.monomial())
        );
        let word = d.reading_word();
        if word.is_empty() {
            buf.push_str("(empty)");
        }
        for (i, a) in word.iter().enumerate() {
            if i > 0 {
                buf.push(' ');
            }
            let _ = write!(buf, "{a}");
        }
        let _ = write!(buf, "\n{d}");
    })
}

/// The bumpless pipe dreams: found all at once (at most [`BUMPLESS_LIMIT`]),
/// then written one by one.
fn bumpless(
    args: &DreamsArgs,
    sink: &mut Sink<'_>,
    w: &Perm,
    count: &BigUint,
    shown: usize,
    progress: &Progress,
    written: &mut u64,
) -> Result<(), CliError> {
    let mut dreams = Vec::new();
    if shown > 0 {
        if *count > BigUint::from(BUMPLESS_LIMIT) {
            return Err(CliError::Input(format!(
                "{w} has {count} bumpless pipe dreams; --bumpless lists up to {BUMPLESS_LIMIT} (use --count for the number)"
            )));
        }
        dreams = bumpless_dreams(w);
        dreams.truncate(shown);
    }
    progress.set_total(dreams.len() as u64);
    let record = |d: &BumplessDream| BumplessRecord {
        blanks: d.blanks().iter().map(|&(i, j)| [i, j]).collect(),
        monomial: d.monomial(),
        tiles: d.to_string().lines().map(str::to_string).collect(),
    };
    let head = DreamsHead {
        perm: w.one_line(),
        count: count.to_string(),
    };
    if args.lines.jsonl {
        return sink.json_lines_listing(
            "bumpless_pipe_dreams",
            &head,
            &dreams,
            record,
            progress,
            written,
        );
    }
    if args.output.json {
        return sink.json_listing(&head, "dreams", &dreams, record, progress, written);
    }
    sink.text(&heading(count, w, "bumpless pipe dream", dreams.len()))?;
    write_each(sink, dreams.iter(), progress, written, |buf, k, d| {
        let _ = write!(
            buf,
            "\n\n#{}  {}\n{d}",
            k + 1,
            exponents_text(&d.monomial())
        );
    })
}

/// Writes the dreams as text, each formatted by `format` (given its 0-based
/// place) into one reused buffer, then ends the last line; polls the cancel
/// flag and counts what was written.
fn write_each<T>(
    sink: &mut Sink<'_>,
    dreams: impl Iterator<Item = T>,
    progress: &Progress,
    written: &mut u64,
    mut format: impl FnMut(&mut String, usize, &T),
) -> Result<(), CliError> {
    let mut buf = String::new();
    for (k, d) in dreams.enumerate() {
        progress.check()?;
        buf.clear();
        format(&mut buf, k, &d);
        sink.text(&buf)?;
        progress.advance(1);
        *written += 1;
    }
    sink.end_line()
}

fn heading(count: &BigUint, w: &Perm, what: &str, listed: usize) -> String {
    let plural = if *count == BigUint::from(1u8) {
        ""
    } else {
        "s"
    };
    let mut out = format!("{count} {what}{plural} of {w}");
    if listed > 0 && *count > BigUint::from(listed) {
        out.push_str(&format!("; the first {listed}:"));
    } else if listed > 0 {
        out.push(':');
    }
    out
}
