//! `elbowroom dreams W`: the reduced pipe dreams of w (or, with `--bumpless`,
//! its bumpless pipe dreams), drawn as small pictures or listed as JSON.

use super::args::DreamsArgs;
use super::error::CliError;
use super::json;
use crate::math::Perm;
use crate::math::pipes::bumpless::bumpless_dreams;
use crate::math::pipes::dream::{count_pipe_dreams, pipe_dreams};
use crate::math::poly::mono::exponents_text;
use num_bigint::BigUint;
use serde_json::{Value, json};

/// The most bumpless pipe dreams the command will generate (they are found all at
/// once by a search with a set of the dreams seen).
pub const BUMPLESS_LIMIT: u64 = 200_000;

/// Runs the command.
pub fn run(args: &DreamsArgs) -> Result<String, CliError> {
    let w = Perm::parse(&args.perm)?;
    // the number of reduced pipe dreams, S_w(1, ..., 1); by Lam–Lee–Shimozono it
    // is also the number of bumpless pipe dreams
    let count = count_pipe_dreams(&w);
    let shown = if args.count { 0 } else { args.limit };
    if args.bumpless {
        return bumpless(args, &w, &count, shown);
    }
    let dreams: Vec<_> = pipe_dreams(&w).take(shown).collect();
    if args.json {
        let listed: Vec<Value> = dreams
            .iter()
            .map(|d| {
                json!({
                    "crosses": d.crosses().iter().map(|&(i, j)| [i, j]).collect::<Vec<_>>(),
                    "word": d.reading_word(),
                    "monomial": d.monomial(),
                })
            })
            .collect();
        return Ok(json::render(&json!({
            "perm": w.one_line(),
            "count": json::exact(&count),
            "dreams": listed,
        })));
    }
    let mut out = heading(&count, &w, "reduced pipe dream", dreams.len());
    for (k, d) in dreams.iter().enumerate() {
        let word: Vec<String> = d.reading_word().iter().map(|a| a.to_string()).collect();
        out.push_str(&format!(
            "\n\n#{}  {}  word {}\n{d}",
            k + 1,
            exponents_text(&d.monomial()),
            if word.is_empty() {
                "(empty)".to_string()
            } else {
                word.join(" ")
            }
        ));
    }
    Ok(out)
}

fn bumpless(
    args: &DreamsArgs,
    w: &Perm,
    count: &BigUint,
    shown: usize,
) -> Result<String, CliError> {
    let mut dreams = Vec::new();
    if shown > 0 {
        if *count > BigUint::from(BUMPLESS_LIMIT) {
            return Err(CliError::Input(format!(
                "{w} has {count} bumpless pipe dreams; --bumpless lists up to {BUMPLESS_LIMIT} (use --count for the number)"
            )));
        }
        dreams = bumpless_dreams(w);
        dreams.truncate(shown);
    }
    if args.json {
        let listed: Vec<Value> = dreams
            .iter()
            .map(|d| {
                let rows: Vec<String> = d.to_string().lines().map(str::to_string).collect();
                json!({
                    "blanks": d.blanks().iter().map(|&(i, j)| [i, j]).collect::<Vec<_>>(),
                    "monomial": d.monomial(),
                    "tiles": rows,
                })
            })
            .collect();
        return Ok(json::render(&json!({
            "perm": w.one_line(),
            "count": json::exact(count),
            "dreams": listed,
        })));
    }
    let mut out = heading(count, w, "bumpless pipe dream", dreams.len());
    for (k, d) in dreams.iter().enumerate() {
        out.push_str(&format!(
            "\n\n#{}  {}\n{d}",
            k + 1,
            exponents_text(&d.monomial())
        ));
    }
    Ok(out)
}

fn heading(count: &BigUint, w: &Perm, what: &str, listed: usize) -> String {
    let plural = if *count == BigUint::from(1u8) {
        ""
    } else {
        "s"
    };
    let mut out = format!("{count} {what}{plural} of {w}");
    if listed > 0 && *count > BigUint::from(listed) {
        out.push_str(&format!("; the first {listed}:"));
    } else if listed > 0 {
        out.push(':');
    }
    out
}
