//! `elbowroom merge FILES...`: combines the JSON outputs of the shards of a run
//! (`--shard K/N`) into the output a single run gives.
//!
//! Dispatch is on the `"kind"` key; each kind has its own merge function. A kind's
//! shards must agree on their parameters, carry distinct `"shard": "K/N"` labels
//! with one N, and together cover the listing exactly once. (The messages call
//! a shard a "piece", as they always have.)
//!
//! Hessenberg pieces are read side by side with serde, a coefficient at a time,
//! never held ([`piece_reader`]; the fields may come in any order, the
//! coefficients' w must come after n and h): a first pass re-checks every piece (its n, h, dimension, listing size and
//! version against the first file; each coefficient's w against the position of
//! the listing it must hold; its own total, nonzero count, maximum and negative
//! count against its rows; no piece cut short or too long), and only then a
//! second pass writes the merged table. Only regular files up to
//! [`MERGE_FILE_LIMIT`] bytes are read.

use super::args::MergeArgs;
use super::documents::{HESSENBERG_KIND, HessenbergJsonStream, SURVEY_KIND, VERSION};
use super::error::CliError;
use super::interrupt;
use super::json;
use super::merge_survey;
use super::output::Sink;
use super::piece_reader::{self, PieceStream};
use super::shard::Shard;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::rows::RowSummary;
use crate::math::perms::listing::{for_each_of_length, mahonian_row};
use crate::math::{MathError, Progress};
use num_bigint::BigInt;
use serde_json::Value;
use std::collections::BTreeSet;
use std::fs::File;
use std::path::{Path, PathBuf};
use std::sync::Arc;

/// The largest piece read: a whole table of n = 16 (43 874 857 rows of about
/// 66 bytes) is about 2.9 GB; 4 GB leaves room and refuses anything larger.
pub const MERGE_FILE_LIMIT: u64 = 4_000_000_000;

pub fn run(args: &MergeArgs, sink: &mut Sink<'_>) -> Result<(), CliError> {
    let mut kinds = Vec::new();
    for path in &args.files {
        check_file(path)?;
        kinds.push(kind_of(path)?);
    }
    let Some(kind) = kinds.first().cloned() else {
        return Err(CliError::Input("give at least one file to merge".into()));
    };
    for (path, k) in args.files.iter().zip(&kinds) {
        if *k != kind {
            return Err(CliError::Input(format!(
                "{} has kind '{k}' but the first file has kind '{kind}'; merge pieces of one run",
                shown(path)
            )));
        }
    }
    match kind.as_str() {
        HESSENBERG_KIND => merge_hessenberg(&args.files, sink),
        SURVEY_KIND => merge_survey::merge(&args.files, sink),
        other => Err(CliError::Input(format!(
            "cannot merge files of kind '{other}'; accepted kinds: {HESSENBERG_KIND}, {SURVEY_KIND}"
        ))),
    }
}

/// Refuses what is not a regular file (a device, a pipe, a directory) or is
/// larger than [`MERGE_FILE_LIMIT`].
fn check_file(path: &Path) -> Result<(), CliError> {
    let meta = std::fs::metadata(path)
        .map_err(|e| CliError::Input(format!("cannot read {}: {e}", shown(path))))?;
    if !meta.is_file() {
        return Err(CliError::Input(format!(
            "{} is not a regular file; merge reads the JSON files of the pieces",
            shown(path)
        )));
    }
    if meta.len() > MERGE_FILE_LIMIT {
        return Err(CliError::Input(format!(
            "{} has {} bytes, more than the {MERGE_FILE_LIMIT} accepted for a piece",
            shown(path),
            meta.len()
        )));
    }
    Ok(())
}

pub(super) fn open(path: &Path) -> Result<File, CliError> {
    File::open(path).map_err(|e| CliError::Input(format!("cannot read {}: {e}", shown(path))))
}

/// A Hessenberg piece read as it streams ([`PieceStream`]).
fn stream(path: &Path) -> Result<PieceStream, CliError> {
    PieceStream::open(open(path)?).map_err(|e| not_json(path, &e))
}

pub(super) fn not_json(path: &Path, why: &str) -> CliError {
    CliError::Input(format!(
        "{} is not a JSON output of elbowroom: {why}",
        shown(path)
    ))
}

/// The `"kind"` of a file: its fields are read up to the kind or to a list.
fn kind_of(path: &Path) -> Result<String, CliError> {
    piece_reader::kind(open(path)?).map_err(|e| not_json(path, &e))
}

/// One Hessenberg piece as read from its head and the end of its file.
struct Piece {
    path: PathBuf,
    name: String,
    h: HessenbergFn,
    listed: usize,
    shard: Shard,
    build: Option<String>,
}

impl Piece {
    fn bad(&self, what: &str) -> CliError {
        CliError::Input(format!("{}: {what}", self.name))
    }
}

/// The fields before `"coefficients"`, checked; the reader is left at the list.
fn read_head(path: &Path, r: &mut PieceStream) -> Result<(HessenbergFn, usize), CliError> {
    let name = shown(path);
    let bad = |what: &str| CliError::Input(format!("{name}: {what}"));
    let head = r.head().map_err(|e| bad(&e))?;
    let h_values: Vec<usize> = head
        .get("h")
        .and_then(Value::as_array)
        .ok_or_else(|| bad("no Hessenberg function \"h\""))?
        .iter()
        .map(|v| v.as_u64().map(|x| x as usize))
        .collect::<Option<Vec<_>>>()
        .ok_or_else(|| bad("\"h\" is not a list of positive integers"))?;
    let h = HessenbergFn::new(&h_values).map_err(|e| bad(&e.to_string()))?;
    let field = |key: &str| head.get(key).and_then(Value::as_u64);
    if field("n") != Some(h.n() as u64) {
        return Err(bad(&format!(
            "\"n\" is not {}, the n of its h = {h}",
            h.n()
        )));
    }
    if field("dimension") != Some(h.dimension() as u64) {
        return Err(bad(&format!(
            "\"dimension\" is not {}, the |h| of h = {h}",
            h.dimension()
        )));
    }
    let listed = mahonian_row(h.n()).get(h.dimension()).copied().unwrap_or(0) as usize;
    if field("listed") != Some(listed as u64) {
        return Err(bad(&format!(
            "\"listed\" is not {listed}, the number of w of length {} in S_{}",
            h.dimension(),
            h.n()
        )));
    }
    if head.get("order").and_then(Value::as_str) != Some("lexicographic in one-line notation") {
        return Err(bad(
            "\"order\" is not \"lexicographic in one-line notation\"",
        ));
    }
    Ok((h, listed))
}

/// The labels of a piece: `"shard"`, `"version"` and `"build"`, read as JSON
/// wherever they stand (the coefficients are stepped over one at a time,
/// never held); a piece without `"shard"` is the whole table.
struct Labels {
    shard: Shard,
    version: Option<String>,
    build: Option<String>,
}

fn labels(path: &Path) -> Result<Labels, CliError> {
    let name = shown(path);
    let bad = |what: &str| {
        if what.contains("cut short") {
            CliError::Input(format!(
                "{name}: cut short: the file ends before its JSON object does (rerun that piece)"
            ))
        } else {
            CliError::Input(format!("{name}: {what}"))
        }
    };
    let read = piece_reader::labels(open(path)?).map_err(|e| bad(&e))?;
    let text = |v: Option<Value>| v.and_then(|v| v.as_str().map(str::to_string));
    let shard = match read.shard {
        None => Shard::WHOLE,
        Some(v) => {
            let label = text(Some(v)).ok_or_else(|| bad("\"shard\" is not a text K/N"))?;
            Shard::parse(&label).map_err(|e| bad(&e.message()))?
        }
    };
    Ok(Labels {
        shard,
        version: text(read.version),
        build: text(read.build),
    })
}

/// A file's name as a message quotes it.
fn shown(path: &Path) -> String {
    crate::math::excerpt::excerpt(&path.display().to_string())
}

/// Merges the pieces of `elbowroom hessenberg --shard K/N --json`.
fn merge_hessenberg(files: &[PathBuf], sink: &mut Sink<'_>) -> Result<(), CliError> {
    let mut pieces: Vec<Piece> = Vec::new();
    let mut shards = BTreeSet::new();
    for path in files {
        let name = shown(path);
        let (h, listed) = read_head(path, &mut stream(path)?)?;
        let Labels {
            shard,
            version,
            build,
        } = labels(path)?;
        let piece = Piece {
            path: path.clone(),
            name,
            h,
            listed,
            shard,
            build,
        };
        if let Some(first) = pieces.first() {
            if first.h != piece.h {
                return Err(piece.bad(&format!(
                    "h = {} (n = {}) differs from h = {} (n = {}) in the first file; merge pieces of one run",
                    piece.h,
                    piece.h.n(),
                    first.h,
                    first.h.n()
                )));
            }
            if first.build != piece.build {
                return Err(piece.bad(&format!(
                    "it was made by build {}, the first file by build {}; merge pieces made by one build (rerun them with one program)",
                    piece.build.as_deref().map_or("(none)".into(), crate::math::excerpt::excerpt),
                    first.build.as_deref().map_or("(none)".into(), crate::math::excerpt::excerpt)
                )));
            }
            if first.shard.count != shard.count {
                return Err(piece.bad(&format!(
                    "piece {}/{} belongs to a split into {} pieces, the first file to one into {}",
                    shard.index, shard.count, shard.count, first.shard.count
                )));
            }
        }
        if !shard.is_whole() && version.as_deref() != Some(VERSION) {
            return Err(piece.bad(&format!(
                "\"version\" is {}, but this is elbowroom {VERSION}; merge pieces made by one version",
                version.map_or("missing".to_string(), |v| format!(
                    "\"{}\"",
                    crate::math::excerpt::excerpt(&v)
                ))
            )));
        }
        if !shards.insert(shard.index) {
            return Err(piece.bad(&format!(
                "piece {}/{} appears twice",
                shard.index, shard.count
            )));
        }
        pieces.push(piece);
    }
    let Some(first) = pieces.first() else {
        return Err(CliError::Input("nothing to merge".into()));
    };
    let count = first.shard.count;
    // the pieces given are distinct, so some are missing exactly when fewer
    // than N were given; the message names the first few (memory does not
    // grow with N)
    if shards.len() < count {
        let absent = count - shards.len();
        let first: Vec<String> = (1..=count)
            .filter(|k| !shards.contains(k))
            .take(5)
            .map(|k| format!("{k}/{count}"))
            .collect();
        let more = if absent > first.len() {
            format!(" and {} more", absent - first.len())
        } else {
            String::new()
        };
        return Err(CliError::Input(format!(
            "pieces {}{more} are missing; give all {count} pieces of the run (rerun the missing ones)",
            first.join(", "),
        )));
    }
    pieces.sort_by_key(|p| p.shard.index);
    let (h, listed) = (pieces[0].h.clone(), pieces[0].listed);
    // Ctrl-C, SIGTERM and SIGHUP stop either pass with a "canceled" line
    let progress = Arc::new(Progress::new(2 * listed as u64));
    let _watch = interrupt::watch(progress.clone());
    let canceled = |e: CliError, written: u64| {
        interrupt::or_canceled(e, "merge", "rows (two passes)", &progress, written, "rows")
    };
    // first pass: every check; nothing is written unless all pieces pass
    walk(&pieces, &progress, &mut |_, _| Ok(())).map_err(|e| canceled(e, 0))?;
    let mut out = HessenbergJsonStream::start(sink, &h, listed)?;
    let mut summary = RowSummary::default();
    walk(&pieces, &progress, &mut |line, value| {
        summary.add(value);
        out.row(sink, line, value)
    })
    .map_err(|e| canceled(e, summary.rows as u64))?;
    out.finish(sink, &summary, Shard::WHOLE)
}

/// What the walk hands each merged row (w, a^h_w) to.
type RowVisitor<'a> = dyn FnMut(&[u8], &BigInt) -> Result<(), CliError> + 'a;

/// Walks the listing of the w of length |h| with every piece open, taking row i
/// from piece (i mod N) + 1, and hands each (w, a^h_w) to `row` in listing order;
/// checks everything the module notes list.
fn walk(pieces: &[Piece], progress: &Progress, row: &mut RowVisitor<'_>) -> Result<(), CliError> {
    let mut readers = Vec::with_capacity(pieces.len());
    for p in pieces {
        let mut r = stream(&p.path)?;
        read_head(&p.path, &mut r)?;
        readers.push(r);
    }
    let mut sums = vec![RowSummary::default(); pieces.len()];
    let count = pieces.len();
    let h = &pieces[0].h;
    let mut failure: Option<CliError> = None;
    let walked = for_each_of_length(h.n(), h.dimension(), &mut |i, line| {
        let k = i % count;
        let p = &pieces[k];
        let mut step = || -> Result<(), CliError> {
            progress.check()?;
            progress.advance(1);
            let item = readers[k]
                .next_item()
                .map_err(|e| p.bad(&format!("coefficient {}: {e}", sums[k].rows + 1)))?;
            let Some(item) = item else {
                return Err(p.bad(&format!(
                    "the \"coefficients\" end after {} rows, but piece {}/{} of this table holds {} (cut short)",
                    sums[k].rows,
                    p.shard.index,
                    p.shard.count,
                    rows_of(p)
                )));
            };
            let perm: Option<Vec<u8>> =
                item.perm.as_ref().and_then(Value::as_array).and_then(|a| {
                    a.iter()
                        .map(|v| v.as_u64().and_then(|x| u8::try_from(x).ok()))
                        .collect()
                });
            if perm.as_deref() != Some(line) {
                return Err(p.bad(&format!(
                    "coefficient {} has \"perm\" {}, but position {i} of the listing is {:?}; \
                     the piece does not follow the listing",
                    sums[k].rows + 1,
                    item.perm
                        .as_ref()
                        .map_or("missing".into(), |v| v.to_string()),
                    line
                )));
            }
            let value: BigInt = item
                .value
                .as_ref()
                .and_then(Value::as_str)
                .and_then(|s| s.parse().ok())
                .ok_or_else(|| {
                    p.bad(&format!(
                        "coefficient {} has a \"value\" that is not an integer string",
                        sums[k].rows + 1
                    ))
                })?;
            sums[k].add(&value);
            row(line, &value)
        };
        match step() {
            Ok(()) => Ok(()),
            Err(e) => {
                failure = Some(e);
                // stops the walk; the reason is returned below
                Err(MathError::Canceled)
            }
        }
    });
    if let Some(e) = failure {
        return Err(e);
    }
    walked?;
    for ((p, r), sum) in pieces.iter().zip(&mut readers).zip(&sums) {
        check_end(p, r, sum)?;
    }
    Ok(())
}

/// How many rows a piece holds.
fn rows_of(p: &Piece) -> usize {
    let skip = p.shard.index - 1;
    if p.listed > skip {
        (p.listed - skip - 1) / p.shard.count + 1
    } else {
        0
    }
}

/// After a piece's rows: no more coefficients, and its summary fields agree
/// with its rows.
fn check_end(p: &Piece, r: &mut PieceStream, sum: &RowSummary) -> Result<(), CliError> {
    match r.next_item().map_err(|e| p.bad(&e))? {
        None => {}
        Some(_) => {
            return Err(p.bad(&format!(
                "more than the {} coefficients piece {}/{} of this table holds",
                rows_of(p),
                p.shard.index,
                p.shard.count
            )));
        }
    }
    let tail = r.tail().map_err(|e| p.bad(&e))?;
    let expect = [
        ("total", json::exact(&sum.total)),
        ("nonzero", Value::from(sum.nonzero)),
        ("max", json::exact(&sum.max())),
        ("negative", Value::from(sum.negative)),
        ("all_nonnegative_integers", Value::from(sum.negative == 0)),
    ];
    for (key, want) in expect {
        match tail.get(key) {
            None => return Err(p.bad(&format!("no \"{key}\" after the coefficients (cut short?)"))),
            Some(v) if *v != want => {
                return Err(p.bad(&format!(
                    "\"{key}\" is {v}, but its rows give {want}; the piece is not consistent"
                )));
            }
            Some(_) => {}
        }
    }
    let label = tail.get("shard").and_then(Value::as_str);
    let want = (!p.shard.is_whole()).then(|| format!("{}/{}", p.shard.index, p.shard.count));
    if label.map(str::to_string) != want {
        return Err(p.bad("its \"shard\" label changed while it was read"));
    }
    Ok(())
}
