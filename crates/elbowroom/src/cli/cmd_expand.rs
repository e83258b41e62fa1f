//! `elbowroom expand POLY --n N [--stable] [--json]`: the Schubert expansion
//! of a typed polynomial, its class in H*(Fl_N) (every w in S_N, written with N
//! entries) or, with `--stable`, its unique expansion in Q[x_1..x_N] over S_∞
//! (each w in the smallest S_m that holds it; the identity is `[1]`). Terms by
//! length, then lexicographically. A product of powers of linear forms goes
//! through Monk's rule and is never multiplied out.

use super::args::ExpandArgs;
use super::error::CliError;
use super::expansion_text::TermRecord;
use super::interrupt;
use super::json;
use super::output::Sink;
use crate::math::schubert::expansion::expand_typed;
use num_rational::BigRational;
use num_traits::{One, Signed};
use serde::Serialize;
use std::fmt::Write as _;

/// The members of `expand --json` before its terms.
#[derive(Serialize)]
struct ExpandHead {
    n: usize,
    stable: bool,
}

/// The members of `expand --json` after its terms.
#[derive(Serialize)]
struct ExpandSummary {
    nonnegative: bool,
}

/// The header line of `expand --jsonl`.
#[derive(Serialize)]
struct ExpandLinesHead {
    kind: &'static str,
    n: usize,
    stable: bool,
}

/// The summary line of `expand --jsonl`.
#[derive(Serialize)]
struct ExpandLinesSummary {
    summary: &'static str,
    count: usize,
    nonnegative: bool,
}

/// The kind of `expand --jsonl`'s lines.
const LINES_KIND: &str = "schubert_expansion";

/// How many bytes of terms are gathered before they go to the sink.
const FLUSH_AT: usize = 1 << 16;

/// Runs the command, writing the terms one at a time into one reused buffer
/// (the JSON object is never built as a tree: its head, terms and summary
/// are typed records written in turn).
pub fn run(args: &ExpandArgs, sink: &mut Sink<'_>) -> Result<(), CliError> {
    let expansion = interrupt::run_interruptible("the expansion", "steps", 0, |progress| {
        expand_typed(&args.poly, args.n, args.stable, progress)
    })?;
    let terms = &expansion.terms;
    let mut buf = String::with_capacity(FLUSH_AT + 256);
    if args.lines.jsonl {
        // a header line, one {"perm":[...],"coefficient":"c"} a line, a summary line
        buf.push_str(&json::line(&ExpandLinesHead {
            kind: LINES_KIND,
            n: args.n,
            stable: args.stable,
        }));
        buf.push('\n');
        for (w, c) in terms {
            buf.push_str(&json::text(&TermRecord::of(w, c))?);
            buf.push('\n');
            flush_when_full(&mut buf, sink)?;
        }
        buf.push_str(&json::line(&ExpandLinesSummary {
            summary: LINES_KIND,
            count: terms.len(),
            nonnegative: expansion.is_nonnegative(),
        }));
        buf.push('\n');
        return sink.text(&buf);
    }
    if args.output.json {
        // {"n":N,"stable":B,"terms":[{"perm":[...],"coefficient":"c"},...],"nonnegative":B}
        let head = ExpandHead {
            n: args.n,
            stable: args.stable,
        };
        buf.push_str(&json::open_list(&head, "terms")?);
        for (k, (w, c)) in terms.iter().enumerate() {
            if k > 0 {
                buf.push(',');
            }
            buf.push_str(&json::text(&TermRecord::of(w, c))?);
            flush_when_full(&mut buf, sink)?;
        }
        let tail = ExpandSummary {
            nonnegative: expansion.is_nonnegative(),
        };
        buf.push_str(&json::close_list(&tail)?);
        buf.push('\n');
        return sink.text(&buf);
    }
    let space = if args.stable {
        format!("in Q[x1..x{}], over S_∞", args.n)
    } else {
        format!("in H*(Fl_{})", args.n)
    };
    let _ = write!(buf, "{} = ", args.poly.trim());
    if terms.is_empty() {
        buf.push('0');
    }
    for (k, (w, c)) in terms.iter().enumerate() {
        push_term(&mut buf, k, w, c);
        flush_when_full(&mut buf, sink)?;
    }
    let count = terms.len();
    let _ = writeln!(
        buf,
        "\n  ({space}; {count} {}, {})",
        if count == 1 { "term" } else { "terms" },
        if expansion.is_nonnegative() {
            "all coefficients nonnegative"
        } else {
            "some coefficient negative"
        }
    );
    sink.text(&buf)
}

/// One term of Σ c_w S_w as text (the sign, |c| unless 1, `S_w`), as
/// `expansion_text::sum_text` writes it.
fn push_term(buf: &mut String, k: usize, w: &crate::math::Perm, c: &BigRational) {
    let sign = match (k, c.is_negative()) {
        (0, false) => "",
        (0, true) => "-",
        (_, false) => " + ",
        (_, true) => " - ",
    };
    buf.push_str(sign);
    let magnitude = c.abs();
    if !magnitude.is_one() {
        let _ = write!(buf, "{magnitude} ");
    }
    let _ = write!(buf, "S_{w}");
}

fn flush_when_full(buf: &mut String, sink: &mut Sink<'_>) -> Result<(), CliError> {
    if buf.len() >= FLUSH_AT {
        sink.text(buf)?;
        buf.clear();
    }
    Ok(())
}
