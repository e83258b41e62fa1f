//! Merging the shards of a survey (`elbowroom survey --shard K/N --json`) back
//! into one survey, as if it had been run whole, reading the pieces side by
//! side as they stream ([`PieceStream`] with the [`Survey`] layout), never
//! holding one.
//!
//! Three passes over the pieces: the first reads each piece's small fields
//! wherever they stand and counts its results (its lists stepped over), and
//! checks that the pieces belong together (one n, version, build and listing;
//! shards K/N covering 1..N once; each piece as long as its share of the
//! listing); the second walks the listing of the survey of S_n
//! ([`survey_listing`], held packed, n bytes a permutation), taking position i
//! from piece (i mod N) + 1, and re-checks every result against the listing,
//! every piece's counterexamples against its results marked
//! `"nonnegative": false` and its `"all_nonnegative"` against them; only then
//! the third writes the merged survey as it walks again, the results and then
//! the counterexamples in listing order. Memory: the packed listing, one bit
//! per permutation for the results that are not nonnegative, and a few
//! batches of each piece ([`super::piece_reader`]).

use super::cmd_merge::{not_json, open};
use super::documents::SURVEY_KIND;
use super::error::CliError;
use super::interrupt;
use super::json;
use super::output::Sink;
use super::piece_reader::{self, PieceStream};
use super::shard::Shard;
use super::survey_piece::{Counterexample, CounterexampleSeed, SURVEY_KEPT, Survey};
use crate::math::Progress;
use crate::math::quotient::survey::survey_listing;
use serde::Serialize;
use serde::de::DeserializeSeed;
use serde_json::{Map, Value};
use std::path::{Path, PathBuf};
use std::sync::Arc;

fn bad(msg: String) -> CliError {
    CliError::Input(msg)
}

fn excerpt(text: &str) -> String {
    crate::math::excerpt::excerpt(text)
}

/// The listing of the survey of S_n, each permutation's one-line notation in
/// n bytes.
struct Listing {
    n: usize,
    packed: Vec<u8>,
}

impl Listing {
    fn of(n: usize) -> Listing {
        let mut packed = Vec::new();
        for w in survey_listing(n) {
            packed.extend_from_slice(w.as_bytes());
        }
        Listing { n, packed }
    }

    fn len(&self) -> usize {
        self.packed.len() / self.n.max(1)
    }

    fn get(&self, i: usize) -> &[u8] {
        &self.packed[i * self.n..(i + 1) * self.n]
    }
}

fn same(perm: &[u64], want: &[u8]) -> bool {
    perm.len() == want.len() && perm.iter().zip(want).all(|(&a, &b)| a == u64::from(b))
}

/// One piece as its small fields describe it.
struct Piece {
    path: PathBuf,
    /// Its place among the files given (from 1), as messages name it.
    number: usize,
    shard: Shard,
    /// How many results it holds.
    rows: usize,
}

impl Piece {
    fn label(&self) -> String {
        format!(
            "piece {} ({}/{})",
            self.number, self.shard.index, self.shard.count
        )
    }
}

/// The small fields of a piece.
struct Head {
    n: Option<u64>,
    shard: Option<String>,
    count: Option<u64>,
    version: Option<String>,
    build: Option<String>,
    listed_total: Option<u64>,
    listing: Option<String>,
    results: Option<usize>,
    counterexamples: Option<usize>,
}

fn read_head(path: &Path) -> Result<Head, CliError> {
    let read = piece_reader::fields(open(path)?, &SURVEY_KEPT, &["results", "counterexamples"])
        .map_err(|e| not_json(path, &e))?;
    let v = &read.values;
    let text = |k: &str| v.get(k).and_then(Value::as_str).map(str::to_string);
    let number = |k: &str| v.get(k).and_then(Value::as_u64);
    Ok(Head {
        n: number("n"),
        shard: text("shard"),
        count: number("count"),
        version: text("version"),
        build: text("build"),
        listed_total: number("listed_total"),
        listing: text("listing"),
        results: read.counts[0],
        counterexamples: read.counts[1],
    })
}

/// The merged survey's members before its results.
#[derive(Serialize)]
struct MergedHead {
    kind: &'static str,
    n: u64,
    shard: &'static str,
    merged_from: usize,
    count: usize,
    all_nonnegative: bool,
}

/// The merged survey's members after its counterexamples.
#[derive(Serialize)]
struct MergedTail {
    #[serde(skip_serializing_if = "Option::is_none")]
    version: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    listed_total: Option<u64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    listing: Option<String>,
}

/// Merges the survey pieces in `files` (`"kind": "quotient_survey"`) of the
/// same n, version and build whose shards K/N cover 1..N exactly once, after
/// re-checking each one, and writes the survey with `"shard": "1/1"` and
/// `"merged_from": N` through `sink` as it goes.
pub fn merge(files: &[PathBuf], sink: &mut Sink<'_>) -> Result<(), CliError> {
    let mut heads = Vec::with_capacity(files.len());
    for path in files {
        heads.push(read_head(path)?);
    }
    let Some(first) = heads.first() else {
        return Err(bad(
            "nothing to merge: give the JSON files of the pieces".into()
        ));
    };
    let max = crate::math::quotient::reduction::MAX_NORMAL_FORM_N;
    let n = match first.n {
        Some(n) if (1..=max as u64).contains(&n) => n,
        _ => {
            return Err(bad(format!(
                "the first piece has no \"n\" from 1 to {max}; merge the JSON outputs of survey --shard"
            )));
        }
    };
    let listing = Listing::of(n as usize);
    let size = listing.len();
    // pieces of n <= 8 carry no "listed_total": they list all of S_n
    let full = |d: &Head| {
        d.listed_total.or_else(|| {
            let m = d.n?;
            (m <= 8).then(|| (1..=m).product())
        })
    };
    if full(first).is_some_and(|t| t != size as u64) {
        return Err(bad(format!(
            "piece 1 ({}) splits a listing of {} permutations, but the survey of S_{n} lists {size}; merge the JSON outputs of survey --shard",
            excerpt(first.shard.as_deref().unwrap_or("")),
            full(first).unwrap_or(0)
        )));
    }
    let mut seen: Vec<bool> = Vec::new();
    let mut pieces = Vec::with_capacity(files.len());
    for (i, (doc, path)) in heads.iter().zip(files).enumerate() {
        let shard = excerpt(doc.shard.as_deref().unwrap_or(""));
        if doc.n != first.n {
            return Err(bad(format!(
                "piece {} ({shard}) surveys n = {}, the first piece n = {n}; merge pieces of one run",
                i + 1,
                doc.n.map_or("?".into(), |v| v.to_string()),
            )));
        }
        if doc.version != first.version {
            return Err(bad(format!(
                "piece {} ({shard}) was written by version {}, the first piece by {}; rerun the pieces with one version",
                i + 1,
                doc.version.as_deref().map_or("(none)".into(), excerpt),
                first.version.as_deref().map_or("(none)".into(), excerpt)
            )));
        }
        if doc.build != first.build {
            return Err(bad(format!(
                "piece {} ({shard}) was made by build {}, the first piece by build {}; rerun the pieces with one build",
                i + 1,
                doc.build.as_deref().map_or("(none)".into(), excerpt),
                first.build.as_deref().map_or("(none)".into(), excerpt)
            )));
        }
        if full(doc) != full(first) || doc.listing != first.listing {
            return Err(bad(format!(
                "piece {} ({shard}) splits a listing of a different size; merge pieces of one run",
                i + 1
            )));
        }
        let parsed = Shard::parse(doc.shard.as_deref().unwrap_or(""))
            .map_err(|_| bad(format!("piece {} has no valid \"shard\": \"K/N\"", i + 1)))?;
        if seen.is_empty() {
            if parsed.count > size.max(1) {
                return Err(bad(format!(
                    "piece {} ({shard}) is one of {} pieces, more than the {size} permutations of the listing",
                    i + 1,
                    parsed.count,
                )));
            }
            seen = vec![false; parsed.count];
        } else if seen.len() != parsed.count {
            return Err(bad(format!(
                "piece {} is one of {} pieces, the others of {}",
                i + 1,
                parsed.count,
                seen.len()
            )));
        }
        if std::mem::replace(&mut seen[parsed.index - 1], true) {
            return Err(bad(format!("piece {shard} is given twice")));
        }
        let (Some(rows), Some(_)) = (doc.results, doc.counterexamples) else {
            return Err(bad(format!(
                "piece {} lacks \"results\" or \"counterexamples\"",
                i + 1
            )));
        };
        let (k, c) = (parsed.index, parsed.count);
        let expected = if size >= k { (size - k) / c + 1 } else { 0 };
        if doc.count.is_some_and(|s| s as usize != rows) || expected != rows {
            return Err(bad(format!(
                "piece {} ({shard}) is cut short: it lists {rows} permutations, {expected} expected",
                i + 1,
            )));
        }
        pieces.push(Piece {
            path: path.clone(),
            number: i + 1,
            shard: parsed,
            rows,
        });
    }
    if let Some(missing) = seen.iter().position(|s| !s) {
        return Err(bad(format!(
            "piece {}/{} is missing",
            missing + 1,
            seen.len()
        )));
    }
    pieces.sort_by_key(|p| p.shard.index);
    // Ctrl-C, SIGTERM and SIGHUP stop either pass with a "canceled" line
    let progress = Arc::new(Progress::new(2 * size as u64));
    let _watch = interrupt::watch(progress.clone());
    let canceled = |e: CliError, written: u64| {
        interrupt::or_canceled(e, "merge", "rows (two passes)", &progress, written, "rows")
    };
    // every check first: nothing is written unless all pieces pass
    let negatives = walk(&pieces, &listing, &progress, None).map_err(|e| canceled(e, 0))?;
    let head = MergedHead {
        kind: SURVEY_KIND,
        n,
        shard: "1/1",
        merged_from: pieces.len(),
        count: size,
        all_nonnegative: negatives == 0,
    };
    let tail = MergedTail {
        version: first.version.clone(),
        listed_total: first.listed_total,
        listing: first.listing.clone(),
    };
    sink.text(&json::open_list(&head, "results")?)?;
    let mut written = 0;
    walk(&pieces, &listing, &progress, Some((sink, &mut written)))
        .map_err(|e| canceled(e, written))?;
    sink.text(&json::close_list(&tail)?)?;
    sink.end_line()
}

/// Where the merged results and counterexamples go (and how many rows were
/// written), in the writing pass.
type Out<'a, 'b> = Option<(&'a mut Sink<'b>, &'a mut u64)>;

/// One pass over the pieces side by side: result i of the listing from piece
/// (i mod N) + 1, then the counterexamples in listing order; every check of
/// the module notes. With `out`, the results, `],"counterexamples":[` and the
/// counterexamples are written. Returns the number of counterexamples.
fn walk(
    pieces: &[Piece],
    listing: &Listing,
    progress: &Progress,
    mut out: Out<'_, '_>,
) -> Result<usize, CliError> {
    let keep = out.is_some();
    let mut streams = Vec::with_capacity(pieces.len());
    let mut held = Vec::with_capacity(pieces.len());
    for p in pieces {
        let mut s = PieceStream::open_as(open(&p.path)?, Survey { keep })
            .map_err(|e| not_json(&p.path, &e))?;
        let mut head = s.head().map_err(|e| not_json(&p.path, &e))?;
        // counterexamples before the results were read whole with the head
        held.push(
            head.remove("counterexamples")
                .map(|v| match v {
                    Value::Array(items) => Ok(items.into_iter()),
                    _ => Err(not_json(
                        &p.path,
                        "\"counterexamples\" is not a list of counterexamples",
                    )),
                })
                .transpose()?,
        );
        streams.push(s);
    }
    let count = pieces.len();
    let size = listing.len();
    let mut rows = vec![0usize; count];
    let mut negative = vec![0usize; count];
    let mut bits = vec![0u64; size.div_ceil(64)];
    let mut text = String::new();
    for i in 0..size {
        progress.check()?;
        progress.advance(1);
        let k = i % count;
        let p = &pieces[k];
        let item = streams[k].next_item().map_err(|e| not_json(&p.path, &e))?;
        let Some(r) = item else {
            return Err(bad(format!(
                "{} is cut short: it lists {} permutations, {} expected",
                p.label(),
                rows[k],
                p.rows
            )));
        };
        rows[k] += 1;
        let want = listing.get(i);
        if !same(&r.perm, want) {
            return Err(bad(format!(
                "{}: result {} is {}, but that place of the listing holds {want:?}; the piece does not follow the listing (a row repeated, foreign or left out)",
                p.label(),
                rows[k],
                excerpt(&format!("{:?}", r.perm))
            )));
        }
        if !r.nonnegative {
            bits[i / 64] |= 1 << (i % 64);
            negative[k] += 1;
        }
        if let Some((sink, written)) = &mut out {
            text.clear();
            if i > 0 {
                text.push(',');
            }
            r.write(&mut text);
            sink.text(&text)?;
            **written += 1;
        }
    }
    for ((p, s), got) in pieces.iter().zip(&mut streams).zip(&rows) {
        let mut more = 0;
        while s.next_item().map_err(|e| not_json(&p.path, &e))?.is_some() {
            more += 1;
        }
        if more > 0 {
            return Err(bad(format!(
                "{} is cut short: it lists {} permutations, {} expected",
                p.label(),
                got + more,
                p.rows
            )));
        }
    }
    if let Some((sink, _)) = &mut out {
        sink.text("],\"counterexamples\":[")?;
    }
    // counterexample j of piece k is its j-th result not nonnegative
    let mut counter = Counterexamples {
        pieces,
        streams: &mut streams,
        held,
        keep,
        taken: vec![0; count],
        negative: &negative,
    };
    let mut first = true;
    for (word, &b) in bits.iter().enumerate() {
        let mut b = b;
        while b != 0 {
            let i = word * 64 + b.trailing_zeros() as usize;
            b &= b - 1;
            progress.check()?;
            let k = i % count;
            match counter.next(k)? {
                Some(c) if same(&c.perm, listing.get(i)) => {
                    if let Some((sink, _)) = &mut out {
                        text.clear();
                        if !first {
                            text.push(',');
                        }
                        c.write(&mut text);
                        sink.text(&text)?;
                    }
                    first = false;
                }
                _ => return Err(counter.inconsistent(k)),
            }
        }
    }
    for k in 0..count {
        if counter.next(k)?.is_some() {
            return Err(counter.inconsistent(k));
        }
    }
    for (k, (p, s)) in pieces.iter().zip(&mut streams).enumerate() {
        let tail: Map<String, Value> = s.tail().map_err(|e| not_json(&p.path, &e))?;
        let none = negative[k] == 0;
        if tail.get("all_nonnegative").and_then(Value::as_bool) != Some(none) {
            return Err(bad(format!(
                "{}: \"all_nonnegative\" is not {none}, though it has {} counterexamples; the piece is not consistent",
                p.label(),
                negative[k]
            )));
        }
        let label = tail.get("shard").and_then(Value::as_str).map(Shard::parse);
        if !matches!(label, Some(Ok(s)) if s == p.shard) {
            return Err(bad(format!(
                "{}: its \"shard\" label changed while it was read",
                p.label()
            )));
        }
    }
    Ok(negative.iter().sum())
}

/// The counterexamples of the pieces, one piece at a time: from the stream,
/// or from the list read whole when it came before the results.
struct Counterexamples<'a> {
    pieces: &'a [Piece],
    streams: &'a mut [PieceStream<Survey>],
    held: Vec<Option<std::vec::IntoIter<Value>>>,
    keep: bool,
    /// How many were read from each piece.
    taken: Vec<usize>,
    /// How many results of each piece are not nonnegative.
    negative: &'a [usize],
}

impl Counterexamples<'_> {
    /// The next counterexample of piece k.
    fn next(&mut self, k: usize) -> Result<Option<Counterexample>, CliError> {
        let path = &self.pieces[k].path;
        let next = match &mut self.held[k] {
            Some(items) => items
                .next()
                .map(|v| CounterexampleSeed { keep: self.keep }.deserialize(&v))
                .transpose()
                .map_err(|e| not_json(path, &e.to_string()))?,
            None => self.streams[k]
                .next_extra()
                .map_err(|e| not_json(path, &e))?,
        };
        if next.is_some() {
            self.taken[k] += 1;
        }
        Ok(next)
    }

    /// Piece k's counterexamples are not its results marked not nonnegative:
    /// the message counts both (the rest of its counterexamples read).
    fn inconsistent(&mut self, k: usize) -> CliError {
        loop {
            match self.next(k) {
                Ok(Some(_)) => {}
                Ok(None) => break,
                Err(e) => return e,
            }
        }
        bad(format!(
            "{}: its counterexamples ({}) are not its results with \"nonnegative\": false ({}); the piece is not consistent",
            self.pieces[k].label(),
            self.taken[k],
            self.negative[k]
        ))
    }
}
