//! The JSON documents of the batch commands that `elbowroom merge` reads back:
//! their `"kind"` values, and the Hessenberg table's object, which a merge of
//! shards rebuilds as a whole run prints it.

use super::json;
use super::shard::Shard;
use crate::math::hessenberg::table::HessenbergTable;
use serde_json::{Value, json};

/// The `"kind"` of `elbowroom hessenberg --json`.
pub const HESSENBERG_KIND: &str = "hessenberg_table";

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
    }
    v
}
