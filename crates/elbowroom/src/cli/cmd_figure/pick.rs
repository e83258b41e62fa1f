//! The permutation argument of a figure, and choosing the items of an
//! enumeration to draw (one by `--index`, or all with `--all`) and naming
//! their files `KIND-W-KKK`.

use super::Figure;
use crate::cli::args::FigureArgs;
use crate::cli::error::CliError;
use crate::figure::Scene;
use crate::math::Perm;
use crate::math::limits::FIGURE_INDEX_LIMIT;

/// The most files one `--all` writes.
pub const MAX_FILES: usize = 2000;

/// The permutation the figure is of (dream, bumpless, wiring, paths).
pub fn perm_arg(args: &FigureArgs) -> Result<Perm, CliError> {
    let Some(text) = &args.perm else {
        return Err(CliError::Input(format!(
            "figure {} needs a permutation, for example 'elbowroom figure {} 1432 --out f.svg'",
            args.kind.name(),
            args.kind.name()
        )));
    };
    Ok(Perm::parse(text)?)
}

/// w in one-line notation as it goes into a file name: `1432`, or `1,10,...` for n >= 10.
pub fn compact(w: &Perm) -> String {
    let sep = if w.n() >= 10 { "," } else { "" };
    w.one_line()
        .iter()
        .map(|v| v.to_string())
        .collect::<Vec<_>>()
        .join(sep)
}

/// Picks the figures asked for from an enumeration: one by index, or all.
pub fn pick<T>(
    args: &FigureArgs,
    items: impl Iterator<Item = T>,
    what: &str,
) -> Result<Vec<(usize, T)>, CliError> {
    if args.all {
        let v: Vec<(usize, T)> = items.take(MAX_FILES + 1).enumerate().collect();
        if v.len() > MAX_FILES {
            return Err(CliError::Input(format!(
                "there are more than {MAX_FILES} {what}; --all writes at most {MAX_FILES} files, choose them with --index"
            )));
        }
        return Ok(v);
    }
    if args.index > FIGURE_INDEX_LIMIT {
        return Err(CliError::Input(format!(
            "--index {} is past the {FIGURE_INDEX_LIMIT} {what} a figure walks through; give an index from 0 to {FIGURE_INDEX_LIMIT}",
            args.index
        )));
    }
    let mut items = items;
    match items.nth(args.index) {
        Some(x) => Ok(vec![(args.index, x)]),
        None => Err(CliError::Input(format!(
            "--index {} is out of range: there are fewer {what} (indices start at 0)",
            args.index
        ))),
    }
}

/// Draws the picked items of an enumeration of w's dreams or words, each named
/// `KIND-W-KKK` by its place K in the enumeration.
pub fn named<T>(
    kind: &str,
    w: &Perm,
    picked: Vec<(usize, T)>,
    draw: impl Fn(&T) -> Scene,
) -> Vec<Figure> {
    picked
        .into_iter()
        .map(|(k, item)| (k, format!("{kind}-{}-{k:03}", compact(w)), draw(&item)))
        .collect()
}
