//! `elbowroom hessenberg --n N [--h ...] [--shard K/N]`: the table a^h_w = DS_h(S_w);
//! `elbowroom hessenberg --n N --every-h`: one summary line per Hessenberg function.
//!
//! Rows list every w in S_n with ℓ(w) = Σ (h(i) - i), zeros included, in
//! lexicographic order of one-line notation, written as they are read off the
//! class (text, CSV and JSON; LaTeX, which names its totals first, is collected).
//! The summary (total, nonzero, max, negative) is accumulated on the way. Ctrl-C
//! stops the run within a few milliseconds in every phase (exit status 130, with
//! the rows written so far named in the message).

use super::args::HessenbergArgs;
use super::documents::HessenbergJsonStream;
use super::error::CliError;
use super::inputs::hessenberg_from_args;
use super::interrupt;
use super::json;
use super::output::Sink;
use super::shard::Shard;
use crate::math::hessenberg::coefficients::coefficient_table;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::rows::{self, RowSummary};
use crate::math::hessenberg::sweep::{SweepRow, sweep_every_h};
use crate::math::{Perm, Progress};
use crate::tables::results::{every_h_table, hessenberg_table};
use crate::tables::table::csv_field;
use num_bigint::BigInt;
use serde_json::json;
use std::sync::Arc;

/// Runs the command, writing the rows as they are read off the class.
pub fn run(args: &HessenbergArgs, sink: &mut Sink<'_>) -> Result<(), CliError> {
    if args.every_h {
        return sink.whole(&every_h(args)?);
    }
    let h = hessenberg_from_args(args.n, args.h.as_deref())?;
    let shard = args.shard.unwrap_or(Shard::WHOLE);
    shard.check_fits(rows::size_class_table(&h)? as usize)?;
    if args.output.latex {
        // a LaTeX table names its totals above the rows: collected (sized like the rest)
        let table = interrupt::run_interruptible("the table", "permutations", 0, |progress| {
            coefficient_table(&h, &|i| shard.selects(i), progress)
        })?;
        return sink.whole(&hessenberg_table(&table).to_latex());
    }
    let format = if args.output.json {
        Format::Json
    } else if args.output.csv {
        Format::Csv
    } else {
        Format::Text
    };
    let progress = Arc::new(Progress::new(0));
    let _watch = interrupt::watch(progress.clone());
    let mut stream = RowStream {
        format,
        h: &h,
        shard,
        listed: rows::size_class_table(&h)? as usize,
        summary: RowSummary::default(),
        json: None,
        started: false,
    };
    let walked = rows::for_each_class_row(&h, &|i| shard.selects(i), &progress, &mut |row| {
        stream.row(sink, row.line, &row.value)
    });
    let rows_written = stream.summary.rows as u64;
    // a cancel counts the rows written out of the rows of this piece (the
    // walk's own counter runs ahead of the output, in parallel)
    let counted = Progress::new(stream.selected() as u64);
    counted.advance(rows_written);
    walked.map_err(|e| {
        interrupt::or_canceled(
            e,
            "the table",
            "permutations",
            &counted,
            rows_written,
            "rows",
        )
    })?;
    stream.finish(sink)
}

#[derive(Clone, Copy, PartialEq, Eq)]
enum Format {
    Text,
    Csv,
    Json,
}

/// The rows of one table on their way out, in one of the streamed formats; the
/// head is written with the first row (or at the end), so a refusal or a cancel
/// before any row leaves the output empty.
struct RowStream<'h> {
    format: Format,
    h: &'h HessenbergFn,
    shard: Shard,
    listed: usize,
    summary: RowSummary,
    json: Option<HessenbergJsonStream>,
    started: bool,
}

impl RowStream<'_> {
    /// How many rows this piece holds: the listing positions i < listed with
    /// i mod N = K − 1.
    fn selected(&self) -> usize {
        let skip = self.shard.index - 1;
        if self.listed > skip {
            (self.listed - skip - 1) / self.shard.count + 1
        } else {
            0
        }
    }

    fn start(&mut self, sink: &mut Sink<'_>) -> Result<(), CliError> {
        self.started = true;
        match self.format {
            Format::Json => {
                self.json = Some(HessenbergJsonStream::start(sink, self.h, self.listed)?);
                Ok(())
            }
            Format::Csv => sink.text("perm,length,value\n"),
            Format::Text => {
                let piece = if self.shard.is_whole() {
                    String::new()
                } else {
                    format!(
                        "  (piece {}/{}: {} of them)",
                        self.shard.index,
                        self.shard.count,
                        self.selected()
                    )
                };
                sink.text(&format!(
                    "h = {}  n = {}  dimension = {}  permutations = {}{piece}\n",
                    self.h,
                    self.h.n(),
                    self.h.dimension(),
                    self.listed
                ))?;
                let width = self.width();
                sink.text(&format!("{:<width$}  {:>6}  a^h_w\n", "w", "ℓ(w)"))
            }
        }
    }

    /// The width of the w column: that of every w in S_n, or 1 for no rows.
    fn width(&self) -> usize {
        if self.selected() == 0 {
            1
        } else {
            Perm::identity(self.h.n()).to_string().len()
        }
    }

    fn row(&mut self, sink: &mut Sink<'_>, line: &[u8], value: &BigInt) -> Result<(), CliError> {
        if !self.started {
            self.start(sink)?;
        }
        self.summary.add(value);
        let len = self.h.dimension();
        match self.format {
            Format::Json => match self.json.as_mut() {
                Some(j) => j.row(sink, line, value),
                None => Ok(()),
            },
            Format::Csv => {
                let perm = joined(line, ",");
                sink.text(&format!("{},{len},{value}\n", csv_field(&perm)))
            }
            Format::Text => {
                let perm = if line.len() <= 9 {
                    joined(line, "")
                } else {
                    joined(line, ",")
                };
                let width = self.width();
                sink.text(&format!("{perm:<width$}  {len:>6}  {value}\n"))
            }
        }
    }

    fn finish(mut self, sink: &mut Sink<'_>) -> Result<(), CliError> {
        if !self.started {
            self.start(sink)?;
        }
        match self.format {
            Format::Json => match self.json.take() {
                Some(j) => j.finish(sink, &self.summary, self.shard),
                None => Ok(()),
            },
            Format::Csv => Ok(()),
            Format::Text => sink.text(&format!(
                "total = {}  nonzero = {}  max = {}  negative = {}\n",
                self.summary.total,
                self.summary.nonzero,
                self.summary.max(),
                self.summary.negative
            )),
        }
    }
}

/// One-line values joined by `sep`.
fn joined(line: &[u8], sep: &str) -> String {
    let parts: Vec<String> = line.iter().map(|v| v.to_string()).collect();
    parts.join(sep)
}

/// `--every-h`: the sweep over every Hessenberg function of n.
fn every_h(args: &HessenbergArgs) -> Result<String, CliError> {
    let n = args.n;
    let rows = interrupt::run_interruptible("the sweep", "Hessenberg functions", 0, |progress| {
        sweep_every_h(n, progress)
    })?;
    if args.output.json {
        let functions: Vec<_> = rows
            .iter()
            .map(|r| {
                json!({
                    "h": r.h.values(),
                    "dimension": r.dimension,
                    "total": json::exact(&r.total),
                    "nonzero": r.nonzero,
                    "max": json::exact(&r.max),
                    "negative": r.negative,
                })
            })
            .collect();
        return Ok(json::render(&json!({"n": n, "functions": functions})));
    }
    if let Some(out) = args.output.table(|| every_h_table(n, &rows)) {
        return Ok(out);
    }
    Ok(every_h_text(n, &rows))
}

fn every_h_text(n: usize, rows: &[SweepRow]) -> String {
    let with_negative = rows.iter().filter(|r| r.negative > 0).count();
    let mut out = format!(
        "every Hessenberg function of n = {n}: {} of them, {with_negative} with a negative a^h_w\n",
        rows.len()
    );
    let h_width = rows
        .iter()
        .map(|r| r.h.to_string().chars().count())
        .max()
        .unwrap_or(1)
        .max(1);
    let cells: Vec<[String; 4]> = rows
        .iter()
        .map(|r| {
            [
                r.total.to_string(),
                r.nonzero.to_string(),
                r.max.to_string(),
                r.negative.to_string(),
            ]
        })
        .collect();
    let widths: Vec<usize> = (0..4)
        .map(|k| cells.iter().map(|c| c[k].len()).max().unwrap_or(0))
        .zip([5, 7, 3, 8])
        .map(|(a, b)| a.max(b))
        .collect();
    out.push_str(&format!(
        "{:<h_width$}  {:>3}  {:>w0$}  {:>w1$}  {:>w2$}  {:>w3$}\n",
        "h",
        "|h|",
        "total",
        "nonzero",
        "max",
        "negative",
        w0 = widths[0],
        w1 = widths[1],
        w2 = widths[2],
        w3 = widths[3],
    ));
    for (r, c) in rows.iter().zip(&cells) {
        out.push_str(&format!(
            "{:<h_width$}  {:>3}  {:>w0$}  {:>w1$}  {:>w2$}  {:>w3$}\n",
            r.h.to_string(),
            r.dimension,
            c[0],
            c[1],
            c[2],
            c[3],
            w0 = widths[0],
            w1 = widths[1],
            w2 = widths[2],
            w3 = widths[3],
        ));
    }
    out
}
