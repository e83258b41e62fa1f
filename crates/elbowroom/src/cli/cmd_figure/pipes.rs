//! `figure dream` and `figure bumpless`: reduced and bumpless pipe dreams of w.

use super::Figure;
use super::pick::{compact, named, perm_arg, pick};
use crate::cli::args::FigureArgs;
use crate::cli::error::CliError;
use crate::figure::bumpless::bumpless_scene;
use crate::figure::dream::dream_scene;
use crate::figure::look::Look;
use crate::math::limits::BUMPLESS_LISTING_LIMIT;
use crate::math::pipes::bumpless::bumpless_dreams;
use crate::math::pipes::dream::{count_pipe_dreams, pipe_dreams};
use num_bigint::BigUint;

/// The reduced pipe dreams picked, in enumeration order.
pub fn dreams(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let w = perm_arg(args)?;
    let total = count_pipe_dreams(&w);
    let picked = pick(
        args,
        pipe_dreams(&w),
        &format!("pipe dreams of {} ({total})", compact(&w)),
    )?;
    Ok(named(args.kind.name(), &w, picked, |d| {
        dream_scene(d, look, &[])
    }))
}

/// The bumpless pipe dreams picked.
pub fn bumpless(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let w = perm_arg(args)?;
    // bumpless dreams are found all at once: count them first (as many as pipe dreams)
    let count = count_pipe_dreams(&w);
    if count > BigUint::from(BUMPLESS_LISTING_LIMIT) {
        return Err(CliError::Input(format!(
            "{w} has {count} bumpless pipe dreams; they are listed all at once, up to {BUMPLESS_LISTING_LIMIT}"
        )));
    }
    let all = bumpless_dreams(&w);
    let total = all.len();
    let picked = pick(
        args,
        all.into_iter(),
        &format!("bumpless pipe dreams of {} ({total})", compact(&w)),
    )?;
    Ok(named(args.kind.name(), &w, picked, |d| {
        bumpless_scene(d, look)
    }))
}
