//! The JSON documents of the batch commands that `elbowroom merge` reads back:
//! their `"kind"` values, and the Hessenberg table's object, which a merge of
//! shards rebuilds as a whole run prints it, collected or written as it goes.

use super::error::CliError;
use super::json;
use super::output::Sink;
use super::shard::Shard;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::rows::RowSummary;
use crate::math::hessenberg::table::HessenbergTable;
use num_bigint::BigInt;
use serde::Serialize;
use serde_json::Value;

/// The `"kind"` of `elbowroom hessenberg --json`.
pub const HESSENBERG_KIND: &str = "hessenberg_table";

/// The version a piece of a sharded table names (`"version"`).
pub const VERSION: &str = env!("CARGO_PKG_VERSION");

/// The build a piece of a sharded run names (`"build"`): the commit the
/// program was built from, "unknown" outside a git checkout.
pub const BUILD: &str = super::args::BUILD;

/// The `"kind"` of `elbowroom survey --json`.
pub const SURVEY_KIND: &str = "quotient_survey";

/// The members of a table's JSON before its coefficients.
#[derive(Serialize)]
pub struct TableHead<'a> {
    kind: &'static str,
    n: usize,
    h: &'a [usize],
    dimension: usize,
    order: &'static str,
    listed: usize,
}

impl TableHead<'_> {
    /// The head of the table of `h` listing `listed` permutations.
    pub fn of(h: &HessenbergFn, listed: usize) -> TableHead<'_> {
        TableHead {
            kind: HESSENBERG_KIND,
            n: h.n(),
            h: h.values(),
            dimension: h.dimension(),
            order: "lexicographic in one-line notation",
            listed,
        }
    }
}

/// One coefficient {"perm": w, "value": "a^h_w"}.
#[derive(Serialize)]
pub struct Coefficient<'a, P: Serialize> {
    perm: P,
    #[serde(serialize_with = "json::as_text")]
    value: &'a BigInt,
}

/// The members of a table's JSON after its coefficients; a piece of a split
/// run names its split, version and build (merge takes pieces of one build).
#[derive(Serialize)]
pub struct TableSummary {
    #[serde(serialize_with = "json::as_text")]
    total: BigInt,
    nonzero: usize,
    #[serde(serialize_with = "json::as_text")]
    max: BigInt,
    negative: usize,
    all_nonnegative_integers: bool,
    #[serde(skip_serializing_if = "Option::is_none")]
    shard: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    version: Option<&'static str>,
    #[serde(skip_serializing_if = "Option::is_none")]
    build: Option<&'static str>,
}

impl TableSummary {
    fn new(total: BigInt, nonzero: usize, max: BigInt, negative: usize, shard: Shard) -> Self {
        let piece = !shard.is_whole();
        TableSummary {
            total,
            nonzero,
            max,
            negative,
            all_nonnegative_integers: negative == 0,
            shard: piece.then(|| format!("{}/{}", shard.index, shard.count)),
            version: piece.then_some(VERSION),
            build: piece.then_some(BUILD),
        }
    }
}

/// A whole table's JSON: head, coefficients, summary.
#[derive(Serialize)]
struct TableDocument<'a> {
    #[serde(flatten)]
    head: TableHead<'a>,
    coefficients: Vec<Coefficient<'a, Vec<usize>>>,
    #[serde(flatten)]
    summary: TableSummary,
}

/// The JSON object of a (possibly partial) table.
pub fn hessenberg_table_json(table: &HessenbergTable, shard: Shard) -> Value {
    json::value(&TableDocument {
        head: TableHead::of(&table.h, table.listed),
        coefficients: table
            .entries
            .iter()
            .map(|e| Coefficient {
                perm: e.perm.one_line(),
                value: &e.value,
            })
            .collect(),
        summary: TableSummary::new(
            table.total(),
            table.nonzero(),
            table.max(),
            table.negative().len(),
            shard,
        ),
    })
}

/// `hessenberg_table_json` written as it goes: the head before the first
/// coefficient, one coefficient at a time, the summary after the last, each
/// from its typed record; the text is byte for byte what [`json::render`]
/// gives for [`hessenberg_table_json`].
pub struct HessenbergJsonStream {
    first: bool,
}

impl HessenbergJsonStream {
    /// Writes everything before the first coefficient.
    pub fn start(
        sink: &mut Sink<'_>,
        h: &HessenbergFn,
        listed: usize,
    ) -> Result<HessenbergJsonStream, CliError> {
        sink.text(&json::open_list(&TableHead::of(h, listed), "coefficients")?)?;
        Ok(HessenbergJsonStream { first: true })
    }

    /// Writes one coefficient {"perm": w, "value": "a^h_w"}.
    pub fn row(
        &mut self,
        sink: &mut Sink<'_>,
        line: &[u8],
        value: &BigInt,
    ) -> Result<(), CliError> {
        if !self.first {
            sink.text(",")?;
        }
        self.first = false;
        sink.text(&json::text(&Coefficient { perm: line, value })?)
    }

    /// Closes the list and writes the summary (and the shard of a piece).
    pub fn finish(
        self,
        sink: &mut Sink<'_>,
        summary: &RowSummary,
        shard: Shard,
    ) -> Result<(), CliError> {
        let tail = TableSummary::new(
            summary.total.clone(),
            summary.nonzero,
            summary.max(),
            summary.negative,
            shard,
        );
        sink.text(&json::close_list(&tail)?)?;
        sink.text("\n")
    }
}
