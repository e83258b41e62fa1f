//! `elbowroom hessenberg --n N [--h ...] [--shard K/N]`: the table a^h_w = DS_h(S_w);
//! `elbowroom hessenberg --n N --every-h`: one summary line per Hessenberg function;
//! `--save-class FILE` writes the values once, `--class FILE` reads them back
//! (a split run whose pieces each cost their share, [`super::class_file`]).
//!
//! Rows list every w in S_n with ℓ(w) = Σ (h(i) - i), zeros included, in
//! lexicographic order of one-line notation, written as they are read off the
//! class (text, CSV, JSON and JSON Lines, each row formatted into one reused
//! buffer; LaTeX, which names its totals first, is collected). The summary
//! (total, nonzero, max, negative) is accumulated on the way. Ctrl-C stops the
//! run within a few milliseconds in every phase (exit status 130, with the rows
//! written so far named in the message).

use super::args::HessenbergArgs;
use super::class_file::{self, ClassReader};
use super::documents::{HESSENBERG_KIND, HessenbergJsonStream, VERSION};
use super::error::CliError;
use super::inputs::hessenberg_from_args;
use super::interrupt;
use super::json;
use super::output::Sink;
use super::shard::Shard;
use crate::math::hessenberg::coefficients::coefficient_table;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::rows::{self, RowSummary, RowValue};
use crate::math::hessenberg::sweep::{SweepRow, sweep_every_h};
use crate::math::hessenberg::table::{HessenbergTable, TableEntry};
use crate::math::perms::listing::for_each_of_length;
use crate::math::{MathError, Perm, Progress};
use crate::tables::results::{every_h_table, hessenberg_table};
use num_bigint::BigInt;
use serde::Serialize;
use std::path::Path;
use std::sync::Arc;

/// From this many listed rows on, a piece without `--class` says on stderr that
/// it expands the whole class (and so costs nearly a whole run).
const SPLIT_NOTE_FROM: usize = 1_000_000;

/// How many bytes of rows are gathered before they go to the sink.
const FLUSH_AT: usize = 1 << 16;

/// How many rows are read off a class file between two checks of the cancel flag.
const CHECK_EVERY: usize = 1 << 12;

/// Runs the command, writing the rows as they are read off the class.
pub fn run(args: &HessenbergArgs, sink: &mut Sink<'_>) -> Result<(), CliError> {
    if args.every_h {
        return sink.whole(&every_h(args)?);
    }
    let h = hessenberg_from_args(
        args.n,
        args.h.as_ref(),
        crate::math::hessenberg::function::HESSENBERG_MAX_N,
    )?;
    let shard = args.shard.unwrap_or(Shard::WHOLE);
    if let Some(path) = &args.save_class {
        return save_class(&h, path, sink);
    }
    let listed = rows::size_class_table(&h)? as usize;
    shard.check_fits(listed)?;
    let mut class = match &args.class {
        Some(path) => Some(ClassReader::open(path, &h, listed as u64)?),
        None => None,
    };
    if class.is_none() && !shard.is_whole() && listed >= SPLIT_NOTE_FROM {
        eprintln!(
            "note: each piece expands the whole class of h = {h} and costs nearly a whole run; \
             run `hessenberg --save-class FILE` once and give each piece `--class FILE`"
        );
    }
    if args.output.latex {
        // a LaTeX table names its totals above the rows: collected (sized like the rest)
        let table = match class.as_mut() {
            Some(reader) => collect_from_file(&h, shard, listed, reader)?,
            None => interrupt::run_interruptible("the table", "permutations", 0, |progress| {
                coefficient_table(&h, &|i| shard.selects(i), progress)
            })?,
        };
        return sink.whole(&hessenberg_table(&table).to_latex());
    }
    let format = if args.output.json {
        Format::Json
    } else if args.lines.jsonl {
        Format::JsonLines
    } else if args.output.csv {
        Format::Csv
    } else {
        Format::Text
    };
    let progress = Arc::new(Progress::new(0));
    let _watch = interrupt::watch(progress.clone());
    let mut stream = RowStream::new(format, &h, shard, listed);
    let walked = match class.as_mut() {
        None => rows::for_each_class_value(&h, &|i| shard.selects(i), &progress, &mut |row| {
            stream.row(sink, row.line, &row.value)
        })
        .map(|_| ()),
        Some(reader) => rows_from_file(&h, shard, reader, &progress, &mut |line, value| {
            stream.row(sink, line, &value)
        }),
    };
    // the rows counted are the rows written, also when the run stops early
    let flushed = stream.flush(sink);
    let rows_written = stream.summary.rows as u64;
    // a cancel counts the rows written out of the rows of this piece (the
    // walk's own counter runs ahead of the output, in parallel)
    let counted = Progress::new(stream.selected() as u64);
    counted.advance(rows_written);
    walked.and(flushed).map_err(|e| {
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

/// `--save-class FILE`: the values of the table, written once for the pieces.
fn save_class(h: &HessenbergFn, path: &Path, sink: &mut Sink<'_>) -> Result<(), CliError> {
    let progress = Arc::new(Progress::new(0));
    let watching = interrupt::watch_before_output(progress.clone());
    let saved = class_file::save(path, h, &progress);
    drop(watching);
    let saved = saved.map_err(|e| {
        interrupt::or_canceled(e, "the class", "permutations", &progress, 0, "values")
    })?;
    sink.text(&format!(
        "saved the class of h = {h} (n = {}): {} values a^h_w, {} nonzero, {} bytes, to {}\n",
        h.n(),
        saved.values,
        saved.nonzero,
        saved.bytes,
        path.display()
    ))
}

/// What a row read from a class file is handed to: (w, a^h_w).
type RowVisitor<'a> = dyn FnMut(&[u8], RowValue) -> Result<(), CliError> + 'a;

/// Calls `visit` with (w, a^h_w) for the w of the piece, in listing order, the
/// values read from a class file (every value is read; only the piece's rows are
/// handed on).
fn rows_from_file(
    h: &HessenbergFn,
    shard: Shard,
    reader: &mut ClassReader,
    progress: &Progress,
    visit: &mut RowVisitor<'_>,
) -> Result<(), CliError> {
    let mut failure: Option<CliError> = None;
    let mut pending = 0usize;
    let walked = for_each_of_length(h.n(), h.dimension(), &mut |index, line| {
        pending += 1;
        if pending >= CHECK_EVERY {
            progress.check()?;
            pending = 0;
        }
        let step = reader.next_value().and_then(|v| {
            if shard.selects(index) {
                visit(line, RowValue::Int(v))
            } else {
                Ok(())
            }
        });
        if let Err(e) = step {
            failure = Some(e);
            return Err(MathError::Canceled);
        }
        Ok(())
    });
    if let Some(e) = failure {
        return Err(e);
    }
    walked?;
    progress.check()?;
    Ok(())
}

/// The rows of the piece from a class file, collected into a table (for LaTeX).
fn collect_from_file(
    h: &HessenbergFn,
    shard: Shard,
    listed: usize,
    reader: &mut ClassReader,
) -> Result<HessenbergTable, CliError> {
    let progress = Arc::new(Progress::new(0));
    let _watch = interrupt::watch_before_output(progress.clone());
    let mut entries = Vec::new();
    let mut index = 0usize;
    rows_from_file(h, shard, reader, &progress, &mut |line, value| {
        while !shard.selects(index) {
            index += 1;
        }
        let values: Vec<usize> = line.iter().map(|&v| usize::from(v)).collect();
        entries.push(TableEntry {
            index,
            perm: Perm::from_one_line(&values)?,
            value: value.to_big(),
        });
        index += 1;
        Ok(())
    })
    .map_err(|e| interrupt::or_canceled(e, "the table", "permutations", &progress, 0, "rows"))?;
    Ok(HessenbergTable {
        h: h.clone(),
        entries,
        listed,
    })
}

#[derive(Clone, Copy, PartialEq, Eq)]
enum Format {
    Text,
    Csv,
    Json,
    JsonLines,
}

/// The first line of `--jsonl`: the table's head, as the JSON document's.
#[derive(Serialize)]
struct JsonLinesHead<'a> {
    kind: &'a str,
    n: usize,
    h: &'a [usize],
    dimension: usize,
    order: &'a str,
    listed: usize,
}

/// The last line of `--jsonl`: the rows of this piece and the summary.
#[derive(Serialize)]
struct JsonLinesSummary {
    rows: usize,
    total: String,
    nonzero: usize,
    max: String,
    negative: usize,
    all_nonnegative_integers: bool,
    #[serde(skip_serializing_if = "Option::is_none")]
    shard: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    version: Option<&'static str>,
}

/// The rows of one table on their way out, in one of the streamed formats; the
/// head is written with the first row (or at the end), so a refusal or a cancel
/// before any row leaves the output empty. Rows are formatted into one buffer,
/// handed to the sink every [`FLUSH_AT`] bytes.
struct RowStream<'h> {
    format: Format,
    h: &'h HessenbergFn,
    shard: Shard,
    listed: usize,
    summary: RowSummary,
    json: Option<HessenbergJsonStream>,
    started: bool,
    /// Rows formatted and not yet written.
    buf: String,
    /// What stands between w and a^h_w in a row: `  ℓ(w)  ` (text), `,ℓ(w),` (CSV).
    middle: String,
    /// No JSON row written yet.
    first: bool,
    digits: itoa::Buffer,
}

impl<'h> RowStream<'h> {
    fn new(format: Format, h: &'h HessenbergFn, shard: Shard, listed: usize) -> Self {
        let len = h.dimension();
        let middle = match format {
            Format::Text => format!("  {len:>6}  "),
            Format::Csv => format!(",{len},"),
            Format::Json | Format::JsonLines => String::new(),
        };
        RowStream {
            format,
            h,
            shard,
            listed,
            summary: RowSummary::default(),
            json: None,
            started: false,
            buf: String::with_capacity(FLUSH_AT + 256),
            middle,
            first: true,
            digits: itoa::Buffer::new(),
        }
    }

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
            Format::JsonLines => {
                let head = JsonLinesHead {
                    kind: HESSENBERG_KIND,
                    n: self.h.n(),
                    h: self.h.values(),
                    dimension: self.h.dimension(),
                    order: "lexicographic in one-line notation",
                    listed: self.listed,
                };
                let text = serde_json::to_string(&head)
                    .map_err(|e| CliError::Failed(format!("cannot write the head: {e}")))?;
                sink.text(&text)?;
                sink.text("\n")
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

    fn row(&mut self, sink: &mut Sink<'_>, line: &[u8], value: &RowValue) -> Result<(), CliError> {
        if !self.started {
            self.start(sink)?;
        }
        self.summary.add_value(value);
        let buf = &mut self.buf;
        match self.format {
            Format::Json | Format::JsonLines => {
                if self.format == Format::Json && !self.first {
                    buf.push(',');
                }
                self.first = false;
                buf.push_str("{\"perm\":[");
                push_line(buf, line, ",");
                buf.push_str("],\"value\":\"");
                push_value(buf, &mut self.digits, value);
                buf.push_str("\"}");
                if self.format == Format::JsonLines {
                    buf.push('\n');
                }
            }
            Format::Csv => {
                // the field w(1),...,w(n) is quoted when it holds a comma (n >= 2)
                let quoted = line.len() > 1;
                if quoted {
                    buf.push('"');
                }
                push_line(buf, line, ",");
                if quoted {
                    buf.push('"');
                }
                buf.push_str(&self.middle);
                push_value(buf, &mut self.digits, value);
                buf.push('\n');
            }
            Format::Text => {
                // every w of S_n has the width of the column: no padding
                push_line(buf, line, if line.len() <= 9 { "" } else { "," });
                buf.push_str(&self.middle);
                push_value(buf, &mut self.digits, value);
                buf.push('\n');
            }
        }
        if self.buf.len() >= FLUSH_AT {
            self.flush(sink)?;
        }
        Ok(())
    }

    /// Hands the formatted rows to the sink.
    fn flush(&mut self, sink: &mut Sink<'_>) -> Result<(), CliError> {
        let result = sink.text(&self.buf);
        self.buf.clear();
        result
    }

    fn finish(mut self, sink: &mut Sink<'_>) -> Result<(), CliError> {
        if !self.started {
            self.start(sink)?;
        }
        self.flush(sink)?;
        match self.format {
            Format::Json => match self.json.take() {
                Some(j) => j.finish(sink, &self.summary, self.shard),
                None => Ok(()),
            },
            Format::JsonLines => {
                let piece = !self.shard.is_whole();
                let tail = JsonLinesSummary {
                    rows: self.summary.rows,
                    total: self.summary.total.to_string(),
                    nonzero: self.summary.nonzero,
                    max: self.summary.max().to_string(),
                    negative: self.summary.negative,
                    all_nonnegative_integers: self.summary.negative == 0,
                    shard: piece.then(|| format!("{}/{}", self.shard.index, self.shard.count)),
                    version: piece.then_some(VERSION),
                };
                let text = serde_json::to_string(&tail)
                    .map_err(|e| CliError::Failed(format!("cannot write the summary: {e}")))?;
                sink.text(&text)?;
                sink.text("\n")
            }
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

/// One-line values (1 to 17) joined by `sep`, appended to `buf`.
#[inline]
fn push_line(buf: &mut String, line: &[u8], sep: &str) {
    for (k, &v) in line.iter().enumerate() {
        if k > 0 {
            buf.push_str(sep);
        }
        if v >= 10 {
            buf.push(char::from(b'0' + v / 10));
        }
        buf.push(char::from(b'0' + v % 10));
    }
}

/// A value in decimal, appended to `buf`.
#[inline]
fn push_value(buf: &mut String, digits: &mut itoa::Buffer, value: &RowValue) {
    match value {
        RowValue::Int(v) => buf.push_str(digits.format(*v)),
        RowValue::Big(v) => buf.push_str(&v.to_string()),
    }
}

/// `--every-h --json`: the summaries of every Hessenberg function of n.
#[derive(Serialize)]
struct SweepDocument<'a> {
    n: usize,
    functions: Vec<SweepRecord<'a>>,
}

/// One Hessenberg function's summary in `--every-h --json`.
#[derive(Serialize)]
struct SweepRecord<'a> {
    h: &'a [usize],
    dimension: usize,
    #[serde(serialize_with = "json::as_text")]
    total: &'a BigInt,
    nonzero: usize,
    #[serde(serialize_with = "json::as_text")]
    max: &'a BigInt,
    negative: usize,
}

/// `--every-h`: the sweep over every Hessenberg function of n.
fn every_h(args: &HessenbergArgs) -> Result<String, CliError> {
    let n = args.n;
    let rows = interrupt::run_interruptible("the sweep", "Hessenberg functions", 0, |progress| {
        sweep_every_h(n, progress)
    })?;
    if args.output.json {
        let functions: Vec<SweepRecord<'_>> = rows
            .iter()
            .map(|r| SweepRecord {
                h: r.h.values(),
                dimension: r.dimension,
                total: &r.total,
                nonzero: r.nonzero,
                max: &r.max,
                negative: r.negative,
            })
            .collect();
        return json::text(&SweepDocument { n, functions });
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
