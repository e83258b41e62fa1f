//! `elbowroom perm W`: length, code, inverse, descents, classes and counts.

use super::args::PermArgs;
use super::error::CliError;
use super::json;
use crate::math::{Perm, perm_class::classes_of};
use serde_json::json;

/// Runs the command.
pub fn run(args: &PermArgs) -> Result<String, CliError> {
    let w = Perm::parse(&args.perm)?;
    let classes: Vec<&str> = classes_of(&w).iter().map(|c| c.key()).collect();
    if args.json {
        return Ok(json::render(&json!({
            "perm": w.one_line(),
            "n": w.n(),
            "length": w.length(),
            "code": w.code(),
            "inverse": w.inverse().one_line(),
            "descents": w.descents(),
            "classes": classes,
        })));
    }
    let labels: Vec<&str> = classes_of(&w).iter().map(|c| c.label()).collect();
    Ok(format!(
        "w = {w}  (n = {})\nlength    {}\ncode      {:?}\ninverse   {}\ndescents  {:?}\nclasses   {}",
        w.n(),
        w.length(),
        w.code(),
        w.inverse(),
        w.descents(),
        if labels.is_empty() {
            "none".to_string()
        } else {
            labels.join(", ")
        },
    ))
}
