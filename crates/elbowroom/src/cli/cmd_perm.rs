//! `elbowroom perm W`: length, code, inverse, descents, classes and counts.

use super::args::PermArgs;
use super::error::CliError;
use super::json;
use crate::math::perms::words::count_reduced_words_with;
use crate::math::pipes::dream::count_pipe_dreams;
use crate::math::{Progress, perms::class::classes_of};
use serde::Serialize;

/// The JSON of `perm`.
#[derive(Serialize)]
struct PermRecord<'a> {
    perm: Vec<usize>,
    n: usize,
    length: usize,
    code: Vec<usize>,
    inverse: Vec<usize>,
    descents: Vec<usize>,
    classes: Vec<&'a str>,
    reduced_words: String,
    pipe_dreams: String,
}

pub fn run(args: &PermArgs) -> Result<String, CliError> {
    let w = args.perm.clone();
    let classes: Vec<&str> = classes_of(&w).iter().map(|c| c.key()).collect();
    let words = count_reduced_words_with(&w, &Progress::default())?;
    let dreams = count_pipe_dreams(&w);
    if args.output.json {
        return json::text(&PermRecord {
            perm: w.one_line(),
            n: w.n(),
            length: w.length(),
            code: w.code(),
            inverse: w.inverse().one_line(),
            descents: w.descents(),
            classes,
            reduced_words: words.to_string(),
            pipe_dreams: dreams.to_string(),
        });
    }
    let labels: Vec<&str> = classes_of(&w).iter().map(|c| c.label()).collect();
    Ok(format!(
        "w = {w}  (n = {})\nlength    {}\ncode      {:?}\ninverse   {}\ndescents  {:?}\nclasses   {}\nreduced words  {words}\npipe dreams    {dreams}",
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
