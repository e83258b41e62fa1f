//! JSON shapes shared by every command: exact values as strings, polynomials as
//! `{"nvars": n, "terms": [[[e1, ..., en], "c"], ...]}`.

use crate::math::{Coeff, Poly};
use serde_json::{Value, json};

/// A polynomial as `{"nvars": n, "terms": [[[e1, ..., en], "c"], ...]}`, leading term first.
pub fn poly<C: Coeff>(p: &Poly<C>) -> Value {
    let n = p.nvars();
    let terms: Vec<Value> = p
        .terms()
        .iter()
        .map(|(m, c)| json!([m.exps(n), c.to_string()]))
        .collect();
    json!({"nvars": n, "terms": terms})
}

/// An exact value (integer or rational) as a JSON string.
pub fn exact<T: std::fmt::Display>(v: &T) -> Value {
    Value::String(v.to_string())
}

/// Prints a JSON value as the command's single output object, on one line
/// (serde_json's compact text; writing a `Value` cannot fail: its keys are
/// strings and its numbers finite).
pub fn render(v: &Value) -> String {
    v.to_string()
}
