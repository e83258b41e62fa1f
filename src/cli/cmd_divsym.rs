//! `elbowroom divsym POLY --n N [--h ...]`: the divided symmetrization DS_h(f).

use super::args::DivsymArgs;
use super::error::CliError;
use super::inputs::hessenberg_from_args;
use super::json;
use crate::math::hessenberg::divsym::divided_symmetrize;
use crate::math::poly::parse::parse_poly;
use serde_json::{Value, json};

/// Runs the command.
pub fn run(args: &DivsymArgs) -> Result<String, CliError> {
    let h = hessenberg_from_args(args.n, args.h.as_deref())?;
    let f = parse_poly(&args.poly, Some(args.n))?;
    let ds = divided_symmetrize(&f, &h)?;
    if args.json {
        let symmetric: Vec<Value> = ds
            .symmetric
            .iter()
            .map(|(lambda, c)| json!({"lambda": lambda, "value": json::exact(c)}))
            .collect();
        return Ok(json::render(&json!({
            "n": h.n(),
            "h": h.values(),
            "dimension": h.dimension(),
            "input": json::poly(&f),
            "result": json::poly(&ds.value),
            "symmetric": symmetric,
        })));
    }
    let name = if h.is_default() {
        format!("DS_{}", h.n())
    } else {
        format!("DS_h, h = {h}")
    };
    let mut out = format!("{name}({f}) = {}\n", ds.value);
    if !ds.symmetric.is_empty() && ds.symmetric.keys().any(|l| l.iter().any(|&v| v > 0)) {
        let parts: Vec<String> = ds
            .symmetric
            .iter()
            .map(|(lambda, c)| {
                let l: Vec<String> = lambda
                    .iter()
                    .filter(|&&v| v > 0)
                    .map(|v| v.to_string())
                    .collect();
                format!("({c}) m_{{{}}}", l.join(","))
            })
            .collect();
        out.push_str(&format!("  = {}\n", parts.join(" + ")));
    }
    Ok(out)
}
