//! `elbowroom survey (--n N | --perm W)`: for each permutation w, the normal form modulo
//! J_n of the reversed Schubert polynomial S_w(x_n, ..., x_1), whether its coefficients are
//! all nonnegative, its number of terms and coefficient sum, and every counterexample.
//!
//! From n = 9 on only the w with ℓ(w) <= n − 1 are listed (the others reduce to 0).
//!
//! The walk finds the records level by level (by length), the listing is in
//! lexicographic order, and the heading names totals known only at the end: so
//! each record's row is rendered as soon as it is found, kept by listing position
//! in an [`output::Reorder`] (memory, then a temporary file) and the record
//! dropped; then the heading, the rows in listing order and the counterexamples
//! are written through the [`Sink`]. The output is byte for byte that of the
//! collected [`survey_json`], [`survey_text`] and [`survey_table`].
//!
//! Ctrl-C stops the run: stderr says how far it got, the exit status is 130 and nothing
//! is printed on stdout (or, once writing has begun, the output is cut short).

use super::args::SurveyArgs;
use super::documents::SURVEY_KIND;
use super::error::CliError;
use super::interrupt;
use super::json;
use super::output::{Reorder, Sink};
use super::shard::Shard;
use crate::math::quotient::forest_route::ForestReducer;
use crate::math::quotient::reduction::MAX_NORMAL_FORM_N;
use crate::math::quotient::survey::{
    FULL_LISTING_MAX_N, SurveyEntry, SurveyRecord, SurveySummary, survey_each, survey_each_by,
    survey_listing, survey_summaries_each, survey_summaries_each_by,
};
use crate::math::{MathError, Perm, Progress};
use crate::tables::results::survey_table;
use crate::tables::table::Table;
use serde::Serialize;
use serde_json::Value;
use std::sync::Arc;

/// One negative coefficient of a counterexample: its monomial's exponents and value.
#[derive(Serialize)]
struct NegativeRecord {
    monomial: Vec<u32>,
    value: String,
}

/// One counterexample: w and its negative coefficients.
#[derive(Serialize)]
struct CounterexampleRecord {
    perm: Vec<usize>,
    negative_coefficients: Vec<NegativeRecord>,
}

impl CounterexampleRecord {
    fn of<E: SurveyRecord>(e: &E, n: usize) -> CounterexampleRecord {
        CounterexampleRecord {
            perm: e.perm().one_line(),
            negative_coefficients: e
                .negatives()
                .iter()
                .map(|(m, c)| NegativeRecord {
                    monomial: m.exps(n),
                    value: c.to_string(),
                })
                .collect(),
        }
    }
}

/// A counterexample's line in `--jsonl`.
#[derive(Serialize)]
struct CounterexampleLine {
    counterexample: CounterexampleRecord,
}

/// One result: w, ℓ(w), whether the normal form is nonnegative, its number of
/// terms and coefficient sum, and (not in a summary) the normal form itself.
#[derive(Serialize)]
struct ResultRecord {
    perm: Vec<usize>,
    length: usize,
    nonnegative: bool,
    terms: usize,
    sum: String,
    #[serde(skip_serializing_if = "Option::is_none")]
    normal_form: Option<Value>,
}

impl ResultRecord {
    fn of<E: SurveyRecord>(e: &E, normal_form: &dyn Fn(&E) -> Option<Value>) -> ResultRecord {
        ResultRecord {
            perm: e.perm().one_line(),
            length: e.perm().length(),
            nonnegative: e.nonnegative(),
            terms: e.terms(),
            sum: e.sum().to_string(),
            normal_form: normal_form(e),
        }
    }
}

/// The members of the survey's JSON before its results.
#[derive(Serialize)]
struct SurveyHead<'a> {
    kind: &'static str,
    n: usize,
    shard: &'a str,
    count: usize,
    all_nonnegative: bool,
}

/// The members of the survey's JSON after its counterexamples: from n = 9 on
/// the version, the listing's size and name; in a piece of a split run, the build.
#[derive(Serialize)]
struct SurveyTail {
    #[serde(skip_serializing_if = "Option::is_none")]
    version: Option<&'static str>,
    #[serde(skip_serializing_if = "Option::is_none")]
    listed_total: Option<usize>,
    #[serde(skip_serializing_if = "Option::is_none")]
    listing: Option<&'static str>,
    #[serde(skip_serializing_if = "Option::is_none")]
    build: Option<&'static str>,
}

impl SurveyTail {
    fn new(n: usize, shard: &str, listed_total: usize) -> SurveyTail {
        let large = n > FULL_LISTING_MAX_N;
        SurveyTail {
            version: large.then_some(env!("CARGO_PKG_VERSION")),
            listed_total: large.then_some(listed_total),
            listing: large.then(|| listing_name(n)),
            build: (shard != "1/1").then_some(super::documents::BUILD),
        }
    }
}

/// The survey's whole JSON.
#[derive(Serialize)]
struct SurveyDocument<'a> {
    #[serde(flatten)]
    head: SurveyHead<'a>,
    results: Vec<ResultRecord>,
    counterexamples: Vec<CounterexampleRecord>,
    #[serde(flatten)]
    tail: Option<SurveyTail>,
}

/// The end of every LaTeX table, after its rows.
const LATEX_END: &str = "\\hline\n\\end{tabular}\n";

/// What one run writes: n, the piece, the listing's size and the format.
struct Job {
    n: usize,
    shard: String,
    listed_total: usize,
    summary: bool,
    format: Format,
    /// The forest route when asked for (or at n = 12); `None`: the Gröbner basis.
    forests: Option<ForestReducer>,
}

impl Job {
    /// The full records of the survey, by the route of the job.
    fn entries(
        &self,
        perms: &[Perm],
        progress: &Progress,
        each: &mut dyn FnMut(usize, SurveyEntry) -> Result<(), CliError>,
    ) -> Result<(), CliError> {
        match &self.forests {
            Some(r) => survey_each_by(r, perms, progress, each),
            None => survey_each(perms, progress, each),
        }
    }

    /// The summaries of the survey, by the route of the job.
    fn summaries(
        &self,
        perms: &[Perm],
        progress: &Progress,
        each: &mut dyn FnMut(usize, SurveySummary) -> Result<(), CliError>,
    ) -> Result<(), CliError> {
        match &self.forests {
            Some(r) => survey_summaries_each_by(r, perms, progress, each),
            None => survey_summaries_each(perms, progress, each),
        }
    }
}

#[derive(Clone, Copy, PartialEq, Eq)]
enum Format {
    Text,
    Json,
    /// JSON Lines: a header, one line per result, one per counterexample, a summary.
    Jsonl,
    Csv,
    Latex,
}

/// Runs the command, writing the survey through `sink`.
pub fn run(args: &SurveyArgs, sink: &mut Sink<'_>) -> Result<(), CliError> {
    if args.no_cache {
        crate::basis_cache::disable();
    }
    let shard = args.shard.unwrap_or(Shard::WHOLE);
    let (n, perms): (usize, Vec<Perm>) = match (&args.perm, args.n) {
        (Some(w), _) => {
            let w = w.clone();
            if w.n() > MAX_NORMAL_FORM_N {
                return Err(CliError::Input(format!(
                    "{w} has n = {}; surveys run for n from 1 to {MAX_NORMAL_FORM_N}",
                    w.n()
                )));
            }
            (w.n(), vec![w])
        }
        (None, Some(n)) => {
            if n == 0 || n > MAX_NORMAL_FORM_N {
                return Err(CliError::Input(format!(
                    "--n {n} is out of range; surveys run for n from 1 to {MAX_NORMAL_FORM_N}"
                )));
            }
            (n, survey_listing(n))
        }
        (None, None) => {
            return Err(CliError::Input(
                "give --n N (all of S_N) or --perm W (one permutation)".into(),
            ));
        }
    };
    let listed_total = perms.len();
    shard.check_fits(listed_total)?;
    let perms: Vec<Perm> = perms
        .into_iter()
        .enumerate()
        .filter(|(i, _)| shard.selects(*i))
        .map(|(_, w)| w)
        .collect();
    let format = if args.lines.jsonl {
        Format::Jsonl
    } else if args.output.json {
        Format::Json
    } else if args.output.csv {
        Format::Csv
    } else if args.output.latex {
        Format::Latex
    } else {
        Format::Text
    };
    let job = Job {
        n,
        shard: format!("{}/{}", shard.index, shard.count),
        listed_total,
        summary: args.summary,
        format,
        forests: if args.by_forests {
            Some(ForestReducer::new(n)?)
        } else {
            None
        },
    };
    if job.forests.is_none() {
        basis_first(n, perms.len())?;
    }
    let summary = args.summary;
    let mut job = job;
    let result = match format {
        // the summary needs no normal form kept: the compact records
        Format::Text | Format::Json | Format::Jsonl if summary => stream(
            &job,
            &perms,
            sink,
            &|p, progress, each| job.summaries(p, progress, each),
            &|_| None,
            &|_| None,
        ),
        Format::Text | Format::Json | Format::Jsonl => stream(
            &job,
            &perms,
            sink,
            &|p, progress, each| job.entries(p, progress, each),
            &|e: &SurveyEntry| Some(e.normal_form.poly.to_string()),
            &|e: &SurveyEntry| Some(json::poly(&e.normal_form.poly)),
        ),
        Format::Csv | Format::Latex => {
            let row = TableRow::new(n, summary, format == Format::Latex);
            stream_table(&job, &perms, sink, &row)
        }
    };
    if result.is_err()
        && let Some(forests) = job.forests.take()
    {
        // what the forest route holds is freed on the pool, so a stop is reported at once
        crate::math::schubert::flat::free_later(forests);
    }
    result
}

/// Builds the basis of J_n before the walk (the walk then finds it built), so
/// that a Ctrl-C says which of the two it stopped: the walk counts permutations,
/// the construction its own steps.
fn basis_first(n: usize, listed: usize) -> Result<(), CliError> {
    if listed == 0 {
        return Ok(());
    }
    let progress = Arc::new(Progress::default());
    let watching = interrupt::watch_before_output(progress.clone());
    let built = crate::basis_cache::basis_with(n, &progress);
    drop(watching);
    match built {
        Ok(_) => Ok(()),
        Err(MathError::Canceled) => Err(CliError::Canceled(format!(
            "the survey canceled after 0 of {listed} permutations (while building the basis of J_{n}: {} of {} steps); no output written",
            progress.done(),
            progress.total()
        ))),
        Err(e) => Err(e.into()),
    }
}

/// Walks the survey, handing each record to `each` with its listing position.
type WalkFn<'a, E> = dyn Fn(&[Perm], &Progress, &mut dyn FnMut(usize, E) -> Result<(), CliError>) -> Result<(), CliError>
    + 'a;

/// The survey as text or JSON: rows rendered as the walk finds them, then written.
fn stream<E: SurveyRecord>(
    job: &Job,
    perms: &[Perm],
    sink: &mut Sink<'_>,
    walk: &WalkFn<'_, E>,
    text_nf: &dyn Fn(&E) -> Option<String>,
    json_nf: &dyn Fn(&E) -> Option<Value>,
) -> Result<(), CliError> {
    let n = job.n;
    let json_out = matches!(job.format, Format::Json | Format::Jsonl);
    let row = |e: &E| {
        if json_out {
            json::line(&ResultRecord::of(e, json_nf))
        } else {
            text_row(e, text_nf)
        }
    };
    let counterexample = |e: &E| {
        if job.format == Format::Jsonl {
            json::line(&CounterexampleLine {
                counterexample: CounterexampleRecord::of(e, n),
            })
        } else if json_out {
            json::line(&CounterexampleRecord::of(e, n))
        } else {
            counterexample_text(e, n)
        }
    };
    let progress = Arc::new(Progress::new(perms.len() as u64));
    // nothing is written while the walk runs: its progress line may be shown
    let walking = interrupt::watch_before_output(progress.clone());
    let mut store = collect_rows(perms, walk, &row, &counterexample, &progress)?;
    drop(walking);
    let _watch = interrupt::watch(progress.clone());
    let bad = store.extras();
    let count = perms.len();
    if job.format == Format::Jsonl {
        let head = format!("{}\n", jsonl_header(job, count)?);
        let tail = format!("\n{}", jsonl_summary(count, bad)?);
        let frame = Frame {
            head: &head,
            sep: "\n",
            between: if bad > 0 { "\n" } else { "" },
            extra_sep: "\n",
            tail: &tail,
        };
        write_out(sink, &mut store, &progress, &frame)
    } else if json_out {
        let (head, tail) = json_frame(job, count, bad)?;
        let frame = Frame {
            head: &head,
            sep: ",",
            between: "],\"counterexamples\":[",
            extra_sep: ",",
            tail: &tail,
        };
        write_out(sink, &mut store, &progress, &frame)
    } else {
        let head = text_head(job, count, bad);
        let frame = Frame {
            head: &head,
            sep: "",
            between: if bad > 0 {
                "\ncounterexamples (negative coefficients):\n"
            } else {
                ""
            },
            extra_sep: "",
            tail: "",
        };
        write_out(sink, &mut store, &progress, &frame)
    }
}

/// The survey as CSV or LaTeX (full records: the table's rows), rendered as the
/// walk finds them, then written.
fn stream_table(
    job: &Job,
    perms: &[Perm],
    sink: &mut Sink<'_>,
    row: &TableRow,
) -> Result<(), CliError> {
    let walk = |p: &[Perm],
                progress: &Progress,
                each: &mut dyn FnMut(usize, SurveyEntry) -> Result<(), CliError>| {
        job.entries(p, progress, each)
    };
    let render = |e: &SurveyEntry| row.of(e);
    let progress = Arc::new(Progress::new(perms.len() as u64));
    let walking = interrupt::watch_before_output(progress.clone());
    let mut store = collect_rows(perms, &walk, &render, &|_| String::new(), &progress)?;
    drop(walking);
    let _watch = interrupt::watch(progress.clone());
    let head = row.head(perms.len());
    let frame = Frame {
        head: &head,
        sep: "",
        between: "",
        extra_sep: "",
        tail: if job.format == Format::Latex {
            LATEX_END
        } else {
            ""
        },
    };
    write_out(sink, &mut store, &progress, &frame)
}

/// Runs the walk, keeping each record's row (and, for a counterexample, its
/// line) by listing position; nothing is written yet.
fn collect_rows<E: SurveyRecord>(
    perms: &[Perm],
    walk: &WalkFn<'_, E>,
    row: &dyn Fn(&E) -> String,
    counterexample: &dyn Fn(&E) -> String,
    progress: &Progress,
) -> Result<Reorder, CliError> {
    let mut store = Reorder::new(perms.len());
    let walked = walk(perms, progress, &mut |i, e| {
        store.row(i, &row(&e))?;
        if !e.nonnegative() {
            store.extra(i, &counterexample(&e))?;
        }
        Ok(())
    });
    walked.map_err(|e| {
        interrupt::or_canceled(e, "the survey", "permutations", progress, 0, "rows")
    })?;
    Ok(store)
}

/// The text around the rows: before them, between two rows, between the rows
/// and the counterexamples, between two counterexamples, after them.
struct Frame<'a> {
    head: &'a str,
    sep: &'a str,
    between: &'a str,
    extra_sep: &'a str,
    tail: &'a str,
}

/// Writes the frame's head, the rows, the counterexamples and its tail, then
/// ends the line; a cancel stops it between two rows.
fn write_out(
    sink: &mut Sink<'_>,
    store: &mut Reorder,
    progress: &Progress,
    frame: &Frame<'_>,
) -> Result<(), CliError> {
    let written = std::cell::Cell::new(0u64);
    let mut check = |k: u64| -> Result<(), CliError> {
        written.set(k);
        if k > 0 {
            progress.check()?;
        }
        Ok(())
    };
    let mut wrote = progress.check().map_err(CliError::from);
    if wrote.is_ok() {
        wrote = (|| {
            sink.text(frame.head)?;
            store.write_rows(sink, frame.sep, &mut check)?;
            sink.text(frame.between)?;
            store.write_extras(sink, frame.extra_sep)?;
            sink.text(frame.tail)?;
            sink.end_line()
        })();
    }
    wrote.map_err(|e| {
        interrupt::or_canceled(
            e,
            "the survey",
            "permutations",
            progress,
            written.get(),
            "rows",
        )
    })
}

/// The first line of `survey --jsonl`: what the lines after it are.
#[derive(serde::Serialize)]
struct JsonlHeader<'a> {
    kind: &'a str,
    n: usize,
    shard: &'a str,
    count: usize,
    #[serde(skip_serializing_if = "Option::is_none")]
    listed_total: Option<usize>,
    #[serde(skip_serializing_if = "Option::is_none")]
    listing: Option<&'static str>,
    #[serde(skip_serializing_if = "Option::is_none")]
    version: Option<&'static str>,
    #[serde(skip_serializing_if = "Option::is_none")]
    build: Option<&'static str>,
}

/// The last line of `survey --jsonl`: its presence says the output is complete.
#[derive(serde::Serialize)]
struct JsonlSummary {
    summary: &'static str,
    count: usize,
    all_nonnegative: bool,
    counterexamples: usize,
}

fn jsonl_header(job: &Job, count: usize) -> Result<String, CliError> {
    let large = job.n > FULL_LISTING_MAX_N;
    let header = JsonlHeader {
        kind: SURVEY_KIND,
        n: job.n,
        shard: &job.shard,
        count,
        listed_total: large.then_some(job.listed_total),
        listing: large.then(|| listing_name(job.n)),
        version: large.then_some(env!("CARGO_PKG_VERSION")),
        build: (job.shard != "1/1").then_some(super::documents::BUILD),
    };
    serde_json::to_string(&header)
        .map_err(|e| CliError::Failed(format!("cannot write the header: {e}")))
}

fn jsonl_summary(count: usize, bad: usize) -> Result<String, CliError> {
    let summary = JsonlSummary {
        summary: SURVEY_KIND,
        count,
        all_nonnegative: bad == 0,
        counterexamples: bad,
    };
    serde_json::to_string(&summary)
        .map_err(|e| CliError::Failed(format!("cannot write the summary: {e}")))
}

/// The text before the first result (the head's members, the list opened)
/// and after the last counterexample (the tail's members, the object closed).
fn json_frame(job: &Job, count: usize, bad: usize) -> Result<(String, String), CliError> {
    let head = SurveyHead {
        kind: SURVEY_KIND,
        n: job.n,
        shard: &job.shard,
        count,
        all_nonnegative: bad == 0,
    };
    Ok((
        json::open_list(&head, "results")?,
        json::close_list(&SurveyTail::new(job.n, &job.shard, job.listed_total))?,
    ))
}

/// The text output's heading and column names.
fn text_head(job: &Job, count: usize, bad: usize) -> String {
    heading(job.n, &job.shard, count, bad, job.summary)
}

/// The heading of the text output of piece `shard` of the survey of S_n: the
/// counts, the listing when it is not all of S_n, the column names.
fn heading(n: usize, shard: &str, count: usize, bad: usize, summary: bool) -> String {
    let mut out = format!(
        "normal forms of S_w(x{n}, ..., x1) modulo J_{n} (piece {shard}): {count} {}, {bad} with a negative coefficient\n\n",
        if count == 1 {
            "permutation"
        } else {
            "permutations"
        },
    );
    if n > FULL_LISTING_MAX_N {
        out.push_str(&format!(
            "(listed: the w with ℓ(w) <= {}; every S_w of degree >= {n} lies in J_{n})\n\n",
            n - 1
        ));
    }
    out.push_str(&format!(
        "{:<10} {:>3} {:>6} {:>8} {:>6}{}\n",
        "w",
        "ℓ",
        "terms",
        "sum",
        "≥ 0",
        if summary { "" } else { "  normal form" }
    ));
    out
}

/// One row of the text output.
fn text_row<E: SurveyRecord>(e: &E, normal_form: &dyn Fn(&E) -> Option<String>) -> String {
    let mut out = format!(
        "{:<10} {:>3} {:>6} {:>8} {:>6}",
        e.perm().to_string(),
        e.perm().length(),
        e.terms(),
        e.sum().to_string(),
        if e.nonnegative() { "yes" } else { "NO" }
    );
    if let Some(p) = normal_form(e) {
        out.push_str(&format!("  {p}"));
    }
    out.push('\n');
    out
}

/// One counterexample line of the text output.
fn counterexample_text<E: SurveyRecord>(e: &E, n: usize) -> String {
    let negs: Vec<String> = e
        .negatives()
        .iter()
        .map(|(m, c)| format!("{c}·{}", m.text(n)))
        .collect();
    format!("  {}: {}\n", e.perm(), negs.join(", "))
}

/// The rows of [`survey_table`] one at a time, as its CSV or LaTeX renders them.
struct TableRow {
    n: usize,
    summary: bool,
    latex: bool,
    /// Where the rows go in the rendering of the table without rows or comments,
    /// and how much follows them.
    at: usize,
    after: usize,
}

impl TableRow {
    fn new(n: usize, summary: bool, latex: bool) -> TableRow {
        let mut row = TableRow {
            n,
            summary,
            latex,
            at: 0,
            after: 0,
        };
        let empty = row.render(&row.bare(&[]));
        row.after = if latex && empty.ends_with(LATEX_END) {
            LATEX_END.len()
        } else {
            0
        };
        row.at = empty.len() - row.after;
        row
    }

    fn bare(&self, entries: &[SurveyEntry]) -> Table {
        let mut t = survey_table(self.n, entries, self.summary);
        t.comments.clear();
        t
    }

    fn render(&self, t: &Table) -> String {
        if self.latex { t.to_latex() } else { t.to_csv() }
    }

    /// The text of the row of e.
    fn of(&self, e: &SurveyEntry) -> String {
        let whole = self.render(&self.bare(std::slice::from_ref(e)));
        let end = whole.len().saturating_sub(self.after);
        whole.get(self.at..end).unwrap_or("").to_string()
    }

    /// The table's text before its rows, its comment naming `count` permutations.
    fn head(&self, count: usize) -> String {
        let mut t = survey_table(self.n, &[], self.summary);
        for c in &mut t.comments {
            if let Some(stem) = c.strip_suffix(" 0 permutations") {
                *c = format!("{stem} {count} permutations");
            }
        }
        let whole = self.render(&t);
        whole[..whole.len() - self.after].to_string()
    }
}

/// The collected JSON document of a survey of S_n whose listing has `listed_total`
/// permutations: [`survey_json`] with, from n = 9 on, the listing's name, size and
/// the version, and in a piece of a split run the build. The command writes the
/// same text as it goes.
pub fn survey_document<E: SurveyRecord>(
    n: usize,
    shard: &str,
    listed_total: usize,
    entries: &[E],
    normal_form: &dyn Fn(&E) -> Option<Value>,
) -> Value {
    json::value(&document(
        n,
        shard,
        entries,
        normal_form,
        Some(SurveyTail::new(n, shard, listed_total)),
    ))
}

fn document<'a, E: SurveyRecord>(
    n: usize,
    shard: &'a str,
    entries: &[E],
    normal_form: &dyn Fn(&E) -> Option<Value>,
    tail: Option<SurveyTail>,
) -> SurveyDocument<'a> {
    let counterexamples: Vec<CounterexampleRecord> = entries
        .iter()
        .filter(|e| !e.nonnegative())
        .map(|e| CounterexampleRecord::of(e, n))
        .collect();
    SurveyDocument {
        head: SurveyHead {
            kind: SURVEY_KIND,
            n,
            shard,
            count: entries.len(),
            all_nonnegative: counterexamples.is_empty(),
        },
        results: entries
            .iter()
            .map(|e| ResultRecord::of(e, normal_form))
            .collect(),
        counterexamples,
        tail,
    }
}

/// Which permutations the survey of S_n lists (the `"listing"` of the JSON).
fn listing_name(n: usize) -> &'static str {
    if n <= FULL_LISTING_MAX_N {
        "all of S_n"
    } else {
        "length at most n - 1 (the others reduce to 0)"
    }
}

/// The survey as the JSON object of the command (`"kind": "quotient_survey"`); each
/// result carries `"normal_form"` when `normal_form` gives one (not in a summary).
pub fn survey_json<E: SurveyRecord>(
    n: usize,
    shard: &str,
    entries: &[E],
    normal_form: &dyn Fn(&E) -> Option<Value>,
) -> Value {
    json::value(&document(n, shard, entries, normal_form, None))
}

/// The collected text output of a survey (the command writes the same text as it goes).
pub fn survey_text<E: SurveyRecord>(
    n: usize,
    shard: &str,
    entries: &[E],
    summary: bool,
    normal_form: &dyn Fn(&E) -> Option<String>,
) -> String {
    let bad = entries.iter().filter(|e| !e.nonnegative()).count();
    let mut out = heading(n, shard, entries.len(), bad, summary);
    for e in entries {
        out.push_str(&text_row(e, normal_form));
    }
    if bad > 0 {
        out.push_str("\ncounterexamples (negative coefficients):\n");
        for e in entries.iter().filter(|e| !e.nonnegative()) {
            out.push_str(&counterexample_text(e, n));
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::math::poly::mono::Mono;
    use crate::math::quotient::survey::SurveySummary;
    use num_bigint::BigInt;
    use num_rational::BigRational;

    /// The layout of the counterexamples, which no survey up to n = 11 has (see
    /// the README): records handed out in reverse order, two of them with a
    /// negative coefficient (made up for the layout, not mathematics), written
    /// as the collected text and JSON write them.
    #[test]
    fn counterexamples_are_laid_out_as_when_collected() {
        let int = |c: i64| BigRational::from_integer(BigInt::from(c));
        let record = |w: &str, negatives: Vec<(Mono, BigRational)>| SurveySummary {
            perm: Perm::parse(w).unwrap_or_else(|_| Perm::identity(3)),
            terms: 2,
            sum: int(1),
            negatives,
        };
        let x3 = Mono::from_exps(&[0, 0, 1]).unwrap_or(Mono(0));
        let records = vec![
            record("123", vec![]),
            record("132", vec![(x3, int(-1))]),
            record("213", vec![]),
            record("231", vec![(x3, int(-2)), (Mono(0), int(-3))]),
        ];
        let walk = |_: &[Perm],
                    _: &Progress,
                    each: &mut dyn FnMut(usize, SurveySummary) -> Result<(), CliError>|
         -> Result<(), CliError> {
            for (i, r) in records.iter().enumerate().rev() {
                each(i, r.clone())?;
            }
            Ok(())
        };
        let perms: Vec<Perm> = records.iter().map(|r| r.perm.clone()).collect();
        for format in [Format::Text, Format::Json] {
            let job = Job {
                n: 3,
                shard: "1/1".into(),
                listed_total: 4,
                summary: true,
                format,
                forests: None,
            };
            let mut buf = Vec::new();
            let mut sink = Sink::new(&mut buf, "a buffer");
            let wrote = stream(&job, &perms, &mut sink, &walk, &|_| None, &|_| None);
            assert!(wrote.is_ok());
            let expected = match format {
                Format::Json => {
                    json::render(&survey_document(3, "1/1", 4, &records, &|_| None)) + "\n"
                }
                _ => survey_text(3, "1/1", &records, true, &|_| None),
            };
            let got = String::from_utf8(buf).unwrap_or_default();
            assert_eq!(got, expected);
            assert!(
                got.contains("2 with a negative coefficient")
                    || got.contains("\"all_nonnegative\":false")
            );
        }
    }
}
