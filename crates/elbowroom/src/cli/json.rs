//! JSON shapes shared by every command: exact values as strings, polynomials as
//! `{"nvars": n, "terms": [[[e1, ..., en], "c"], ...]}`; and the pieces of a
//! streamed document, written from typed records (`serde::Serialize`): the
//! members of a head before a list, the items, the members of a summary after
//! it, so that a long listing is written as it is produced and the text is the
//! one serde_json gives for the whole object.

use super::error::CliError;
use crate::math::{Coeff, Poly};
use serde::Serialize;
use serde_json::Value;

/// A polynomial as a JSON record: `{"nvars": n, "terms": [[[e1, ..., en], "c"], ...]}`,
/// leading term first.
#[derive(Serialize, Debug)]
pub struct PolyRecord {
    /// The number of variables.
    pub nvars: usize,
    /// (exponents, coefficient as a string) per term.
    pub terms: Vec<(Vec<u32>, String)>,
}

impl PolyRecord {
    /// The record of `p`.
    pub fn of<C: Coeff>(p: &Poly<C>) -> PolyRecord {
        let n = p.nvars();
        PolyRecord {
            nvars: n,
            terms: p
                .terms()
                .iter()
                .map(|(m, c)| (m.exps(n), c.to_string()))
                .collect(),
        }
    }
}

/// A polynomial as `{"nvars": n, "terms": [[[e1, ..., en], "c"], ...]}`, leading term first.
pub fn poly<C: Coeff>(p: &Poly<C>) -> Value {
    value(&PolyRecord::of(p))
}

/// An exact value (integer or rational) as a JSON string.
pub fn exact<T: std::fmt::Display>(v: &T) -> Value {
    Value::String(v.to_string())
}

/// Writes an exact value (integer or rational) as a JSON string, for
/// `#[serde(serialize_with = "...")]` on a record's field.
pub fn as_text<T: std::fmt::Display, S: serde::Serializer>(v: &T, s: S) -> Result<S::Ok, S::Error> {
    s.collect_str(v)
}

/// A typed record as a JSON value (records have string keys and finite
/// numbers, so this cannot fail; `null` if it ever did).
pub fn value<T: Serialize>(record: &T) -> Value {
    serde_json::to_value(record).unwrap_or(Value::Null)
}

/// A typed record's text: compact, on one line.
pub fn text<T: Serialize>(record: &T) -> Result<String, CliError> {
    serde_json::to_string(record).map_err(|e| CliError::Failed(format!("cannot write JSON: {e}")))
}

/// A typed record's text, compact, for a row rendered where no error can be
/// returned (records have string keys and finite numbers: `null` if it ever failed).
pub fn line<T: Serialize>(record: &T) -> String {
    serde_json::to_string(record).unwrap_or_else(|_| "null".into())
}

/// The members of a typed record (an object), `"key":value` joined by commas,
/// without the braces: what stands in the whole object's text between its
/// other members.
pub fn members<T: Serialize>(record: &T) -> Result<String, CliError> {
    let Value::Object(fields) = value(record) else {
        return Err(CliError::Failed(
            "internal: a record is not an object".into(),
        ));
    };
    let mut out = String::new();
    for (k, v) in &fields {
        if !out.is_empty() {
            out.push(',');
        }
        out.push_str(&Value::String(k.clone()).to_string());
        out.push(':');
        out.push_str(&v.to_string());
    }
    Ok(out)
}

/// The text of an object made of `head`'s members, then the list `key` opened:
/// `{"a":1,...,"key":[`.
pub fn open_list<T: Serialize>(head: &T, key: &str) -> Result<String, CliError> {
    let members = members(head)?;
    let key = Value::String(key.into()).to_string();
    Ok(if members.is_empty() {
        format!("{{{key}:[")
    } else {
        format!("{{{members},{key}:[")
    })
}

/// The text that closes a list, then `summary`'s members and the object: `],"b":2,...}`.
pub fn close_list<T: Serialize>(summary: &T) -> Result<String, CliError> {
    let members = members(summary)?;
    Ok(if members.is_empty() {
        "]}".into()
    } else {
        format!("],{members}}}")
    })
}

/// Prints a JSON value as the command's single output object, on one line
/// (serde_json's compact text; writing a `Value` cannot fail: its keys are
/// strings and its numbers finite).
pub fn render(v: &Value) -> String {
    v.to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[derive(Serialize)]
    struct Head {
        kind: &'static str,
        n: usize,
    }

    #[derive(Serialize)]
    struct Tail {
        #[serde(serialize_with = "as_text")]
        total: i64,
        #[serde(skip_serializing_if = "Option::is_none")]
        shard: Option<String>,
    }

    #[derive(Serialize)]
    struct Whole {
        kind: &'static str,
        n: usize,
        items: Vec<u8>,
        #[serde(serialize_with = "as_text")]
        total: i64,
    }

    /// A document written in pieces is the text serde_json gives for it whole.
    #[test]
    fn pieces_make_the_whole_text() {
        let head = Head { kind: "a\"b", n: 3 };
        let tail = Tail {
            total: -7,
            shard: None,
        };
        let streamed = format!(
            "{}1,2{}",
            open_list(&head, "items").unwrap_or_default(),
            close_list(&tail).unwrap_or_default()
        );
        let whole = Whole {
            kind: "a\"b",
            n: 3,
            items: vec![1, 2],
            total: -7,
        };
        assert_eq!(streamed, text(&whole).unwrap_or_default());
        let x = crate::math::Poly::<num_bigint::BigInt>::zero(2);
        assert_eq!(poly(&x).to_string(), r#"{"nvars":2,"terms":[]}"#);
    }
}
