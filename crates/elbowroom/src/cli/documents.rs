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
use serde_json::{Value, json};

/// The `"kind"` of `elbowroom hessenberg --json`.
pub const HESSENBERG_KIND: &str = "hessenberg_table";

/// The version a piece of a sharded table names (`"version"`).
pub const VERSION: &str = env!("CARGO_PKG_VERSION");

/// The build a piece of a sharded run names (`"build"`): the commit the
/// program was built from, "unknown" outside a git checkout.
pub const BUILD: &str = super::args::BUILD;

/// The `"kind"` of `elbowroom survey --json`.
pub const SURVEY_KIND: &str = "quotient_survey";

/// The JSON object of a (possibly partial) table.
pub fn hessenberg_table_json(table: &HessenbergTable, shard: Shard) -> Value {
    let coefficients: Vec<Value> = table
        .entries
        .iter()
        .map(|e| json!({"perm": e.perm.one_line(), "value": json::exact(&e.value)}))
        .collect();
    let mut v = json!({
        "kind": HESSENBERG_KIND,
        "n": table.h.n(),
        "h": table.h.values(),
        "dimension": table.h.dimension(),
        "order": "lexicographic in one-line notation",
        "listed": table.listed,
        "coefficients": coefficients,
        "total": json::exact(&table.total()),
        "nonzero": table.nonzero(),
        "max": json::exact(&table.max()),
        "negative": table.negative().len(),
        "all_nonnegative_integers": table.negative().is_empty(),
    });
    if !shard.is_whole()
        && let Some(obj) = v.as_object_mut()
    {
        obj.insert(
            "shard".into(),
            Value::String(format!("{}/{}", shard.index, shard.count)),
        );
        obj.insert("version".into(), Value::String(VERSION.into()));
        obj.insert("build".into(), Value::String(BUILD.into()));
    }
    v
}

/// `hessenberg_table_json` written as it goes: the head before the first
/// coefficient, one coefficient at a time, the summary after the last. The text
/// is byte for byte what [`json::render`] gives for [`hessenberg_table_json`].
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
        let head = json!({
            "kind": HESSENBERG_KIND,
            "n": h.n(),
            "h": h.values(),
            "dimension": h.dimension(),
            "order": "lexicographic in one-line notation",
            "listed": listed,
        });
        let text = json::render(&head);
        // the object without its closing brace, then the list is opened
        sink.text(&text[..text.len() - 1])?;
        sink.text(",\"coefficients\":[")?;
        Ok(HessenbergJsonStream { first: true })
    }

    /// Writes one coefficient {"perm": w, "value": "a^h_w"}.
    pub fn row(
        &mut self,
        sink: &mut Sink<'_>,
        line: &[u8],
        value: &BigInt,
    ) -> Result<(), CliError> {
        let mut text = String::with_capacity(16 + 3 * line.len());
        if !self.first {
            text.push(',');
        }
        self.first = false;
        text.push_str("{\"perm\":[");
        for (k, v) in line.iter().enumerate() {
            if k > 0 {
                text.push(',');
            }
            text.push_str(&v.to_string());
        }
        text.push_str("],\"value\":\"");
        text.push_str(&value.to_string());
        text.push_str("\"}");
        sink.text(&text)
    }

    /// Closes the list and writes the summary (and the shard of a piece).
    pub fn finish(
        self,
        sink: &mut Sink<'_>,
        summary: &RowSummary,
        shard: Shard,
    ) -> Result<(), CliError> {
        let mut tail = json!({
            "total": json::exact(&summary.total),
            "nonzero": summary.nonzero,
            "max": json::exact(&summary.max()),
            "negative": summary.negative,
            "all_nonnegative_integers": summary.negative == 0,
        });
        if !shard.is_whole()
            && let Some(obj) = tail.as_object_mut()
        {
            obj.insert(
                "shard".into(),
                Value::String(format!("{}/{}", shard.index, shard.count)),
            );
            // a piece names the version that made it; merge takes pieces of one version
            obj.insert("version".into(), Value::String(VERSION.into()));
            // and the build (the commit): merge takes pieces of one build
            obj.insert("build".into(), Value::String(BUILD.into()));
        }
        let text = json::render(&tail);
        sink.text("],")?;
        sink.text(&text[1..])?;
        sink.text("\n")
    }
}
