//! `elbowroom divsym POLY --n N [--h ...]`: the divided symmetrization DS_h(f).
//!
//! Sized before it starts ([`check_budget`]): the monomials of the answer and
//! the terms of f·Q_h it goes through. The computation runs on its own thread
//! while this one watches for Ctrl-C, so an interrupt is answered at once with
//! a message and exit status 130.

use super::args::DivsymArgs;
use super::error::CliError;
use super::inputs::hessenberg_from_args;
use super::interrupt;
use super::json;
use super::json::PolyRecord;
use crate::math::RatPoly;
use crate::math::hessenberg::divsym::{DividedSymmetrization, divided_symmetrize_with};
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::poly::parse::parse_poly;
use crate::math::{MathError, Progress};
use serde::Serialize;
use std::sync::Arc;
use std::time::Duration;

/// One term c·m_λ of a symmetric result.
#[derive(Serialize)]
struct SymmetricTerm<'a, L: Serialize> {
    lambda: &'a L,
    value: String,
}

/// The JSON of `divsym`.
#[derive(Serialize)]
struct DivsymRecord<'a, L: Serialize> {
    n: usize,
    h: &'a [usize],
    dimension: usize,
    input: PolyRecord,
    result: PolyRecord,
    symmetric: Vec<SymmetricTerm<'a, L>>,
}

pub fn run(args: &DivsymArgs) -> Result<String, CliError> {
    let h = hessenberg_from_args(args.n, args.h.as_ref(), crate::math::MAX_N)?;
    let f = parse_poly(&args.poly, Some(args.n))?;
    check_budget(&f, &h)?;
    let ds = interruptible(&f, &h)?;
    if args.output.json {
        return json::text(&DivsymRecord {
            n: h.n(),
            h: h.values(),
            dimension: h.dimension(),
            input: PolyRecord::of(&f),
            result: PolyRecord::of(&ds.value),
            symmetric: ds
                .symmetric
                .iter()
                .map(|(lambda, c)| SymmetricTerm {
                    lambda,
                    value: c.to_string(),
                })
                .collect(),
        });
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

/// Refuses DS_h(f) before it starts when it is past its limits
/// ([`crate::math::sizing::check_divsym`], the check the window makes too).
pub fn check_budget(f: &RatPoly, h: &HessenbergFn) -> Result<(), CliError> {
    Ok(crate::math::sizing::check_divsym(f, h)?)
}

/// DS_h(f) on a thread of its own while this thread watches for Ctrl-C: an
/// interrupt returns at once (the process then exits, ending the thread).
fn interruptible(f: &RatPoly, h: &HessenbergFn) -> Result<DividedSymmetrization, CliError> {
    let progress = Arc::new(Progress::new(1));
    let _watch = interrupt::watch(progress.clone());
    let (send, receive) = std::sync::mpsc::channel();
    let (f, h, stop) = (f.clone(), h.clone(), progress.clone());
    std::thread::spawn(move || {
        let _ = send.send(divided_symmetrize_with(&f, &h, &stop));
    });
    loop {
        match receive.recv_timeout(Duration::from_millis(20)) {
            Ok(Err(MathError::Canceled)) => return Err(canceled()),
            Ok(result) => return Ok(result?),
            Err(std::sync::mpsc::RecvTimeoutError::Timeout) if progress.is_canceled() => {
                return Err(canceled());
            }
            Err(std::sync::mpsc::RecvTimeoutError::Timeout) => {}
            Err(std::sync::mpsc::RecvTimeoutError::Disconnected) => {
                return Err(CliError::Failed(
                    "the divided symmetrization stopped without an answer".into(),
                ));
            }
        }
    }
}

/// The one-line answer to a Ctrl-C.
fn canceled() -> CliError {
    CliError::Canceled("divided symmetrization canceled; no output written".into())
}
