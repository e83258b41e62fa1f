//! `elbowroom figure KIND ... --out FILE`: draws a figure headless and writes it
//! as PNG, SVG or TikZ (the format follows the extension). The scenes are the
//! ones the explorer draws, so a file looks like the view it came from.
//!
//! - `dream W [--index K | --all]`: reduced pipe dreams of w, in enumeration order.
//! - `bumpless W [--index K | --all]`: bumpless pipe dreams of w.
//! - `wiring W [--index K | --all | --word A]`: wiring diagrams of the reduced
//!   words of w, in lexicographic order (or of the word given).
//! - `paths W [--columns C] [--legend]`: the normal form modulo J_n of the reversed Schubert
//!   polynomial S_w(x_n, ..., x_1), one lattice path per standard monomial;
//!   `paths --poly F --n N` draws the normal form of any polynomial instead.
//! - `permutohedron --lambda L [--yaw A --pitch B]`: P_λ for n <= 5.
//! - `volume --from A --to B [--samples M]`: Vol P_λ along λ(t) = (1 - t)A + tB.
//! - `hessenberg --h 2,3,3` (or `--n N` for h(i) = i + 1): the staircase of h.
//! - `forest --code 2,0,1`: an indexed forest standing on the number line.
//!
//! With `--all`, `--out` is a directory (created if missing) and the files are
//! named `KIND-W-K.EXT` with `--format` (svg by default).
//!
//! One file per kind of figure builds its scenes; [`pick`] chooses the items
//! of an enumeration and names their files; this file writes them.

mod forest;
mod hessenberg;
mod paths;
mod permutohedron;
pub mod pick;
mod pipes;
mod volume;
mod wiring;

use super::args::{FigureArgs, FigureKind, FormatArg};
use super::error::CliError;
use super::json;
use crate::figure::Scene;
use crate::figure::export::{self, ExportOptions, Format};
use crate::figure::look::Look;
use crate::math::limits::FIGURE_PIXEL_LIMIT;
use serde::Serialize;
use std::path::PathBuf;

/// A figure to write: its index in the enumeration, its file name without the
/// extension, and its scene.
type Figure = (usize, String, Scene);

/// A file written: index, path, width and height in points.
type Written = (usize, PathBuf, f32, f32);

/// The flags every kind of figure takes (where and how the file is written).
const COMMON_FLAGS: &[&str] = &[
    "kind",
    "out",
    "scale",
    "dpi",
    "transparent",
    "dark",
    "no_labels",
    "json",
];

/// The flags (clap ids) a kind of figure takes besides [`COMMON_FLAGS`], as
/// they are typed.
fn kind_flags(kind: FigureKind) -> &'static [(&'static str, &'static str)] {
    match kind {
        FigureKind::Dream | FigureKind::Bumpless => &[
            ("perm", "W"),
            ("index", "--index"),
            ("all", "--all"),
            ("format", "--format"),
        ],
        FigureKind::Wiring => &[
            ("perm", "W"),
            ("index", "--index"),
            ("all", "--all"),
            ("format", "--format"),
            ("word", "--word"),
        ],
        FigureKind::Paths => &[
            ("perm", "W"),
            ("poly", "--poly"),
            ("n", "--n"),
            ("columns", "--columns"),
            ("legend", "--legend"),
        ],
        FigureKind::Permutohedron => &[
            ("lambda", "--lambda"),
            ("yaw", "--yaw"),
            ("pitch", "--pitch"),
        ],
        FigureKind::Volume => &[("from", "--from"), ("to", "--to"), ("samples", "--samples")],
        FigureKind::Hessenberg => &[("h", "--h"), ("n", "--n")],
        FigureKind::Forest => &[("code", "--code")],
    }
}

/// Refuses a flag given on the command line that the kind of figure does not
/// take (`figure dream 1432 --lambda 1,2,3`), naming the flags it does take.
pub fn foreign_flags(matches: &clap::ArgMatches) -> Result<(), CliError> {
    use clap::parser::ValueSource;
    let Ok(Some(kind)) = matches.try_get_one::<FigureKind>("kind") else {
        return Ok(());
    };
    let own = kind_flags(*kind);
    let all = [
        ("perm", "W"),
        ("index", "--index"),
        ("all", "--all"),
        ("format", "--format"),
        ("word", "--word"),
        ("poly", "--poly"),
        ("n", "--n"),
        ("columns", "--columns"),
        ("legend", "--legend"),
        ("lambda", "--lambda"),
        ("yaw", "--yaw"),
        ("pitch", "--pitch"),
        ("from", "--from"),
        ("to", "--to"),
        ("code", "--code"),
        ("samples", "--samples"),
        ("h", "--h"),
    ];
    for (id, shown) in all {
        if COMMON_FLAGS.contains(&id) || own.iter().any(|(o, _)| *o == id) {
            continue;
        }
        if matches.value_source(id) == Some(ValueSource::CommandLine) {
            let takes: Vec<&str> = own.iter().map(|(_, s)| *s).collect();
            let what = if id == "perm" {
                "a permutation".to_string()
            } else {
                shown.to_string()
            };
            return Err(CliError::Input(format!(
                "figure {} takes no {what}; it takes {} (and --out, --scale, --dpi, --transparent, --dark, --no-labels, --json)",
                kind.name(),
                takes.join(", ")
            )));
        }
    }
    Ok(())
}

/// Draws the figures asked for and writes their files.
pub fn run(args: &FigureArgs) -> Result<String, CliError> {
    let opts = export_options(args)?;
    let look = Look {
        dark: args.dark,
        labels: !args.no_labels,
    };
    let figures = scenes(args, &look)?;
    prepare_out(args)?;
    let mut written: Vec<Written> = Vec::with_capacity(figures.len());
    for (_, name, scene) in &figures {
        check_pixels(scene, &file_path(args, name), &opts)?;
    }
    for (index, name, scene) in &figures {
        let path = file_path(args, name);
        export::write(scene, &path, &opts).map_err(|e| CliError::Failed(e.to_string()))?;
        written.push((*index, path, scene.width, scene.height));
    }
    Ok(report(args, &written))
}

fn export_options(args: &FigureArgs) -> Result<ExportOptions, CliError> {
    let scale = match (args.scale, args.dpi) {
        (Some(s), _) => s,
        (None, Some(dpi)) => dpi / 72.0,
        (None, None) => 4.0,
    };
    if !(scale.is_finite() && scale > 0.0 && scale <= 64.0) {
        return Err(CliError::Input(format!(
            "a scale of {scale} pixels per point is not accepted; use --scale in (0, 64] or --dpi in (0, 4608]"
        )));
    }
    Ok(ExportOptions {
        scale,
        transparent: args.transparent,
    })
}

/// Refuses a PNG larger than [`FIGURE_PIXEL_LIMIT`] pixels (or wider or higher
/// than the writer's side limit) before anything is drawn: bad input, exit 2.
fn check_pixels(
    scene: &Scene,
    path: &std::path::Path,
    opts: &ExportOptions,
) -> Result<(), CliError> {
    if !matches!(Format::from_path(path), Ok(Format::Png)) {
        return Ok(());
    }
    let (w, h) =
        crate::figure::png::pixel_size(scene, opts).map_err(|e| CliError::Input(format!("{e}")))?;
    let pixels = u64::from(w) * u64::from(h);
    if pixels > FIGURE_PIXEL_LIMIT {
        return Err(CliError::Input(format!(
            "the PNG would be {w} × {h} = {pixels} pixels; at most {FIGURE_PIXEL_LIMIT} are accepted: lower --scale or --dpi"
        )));
    }
    Ok(())
}

/// The scenes of the figure kind asked for.
fn scenes(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    match args.kind {
        FigureKind::Dream => pipes::dreams(args, look),
        FigureKind::Bumpless => pipes::bumpless(args, look),
        FigureKind::Wiring => wiring::diagrams(args, look),
        FigureKind::Paths => paths::panels(args, look),
        FigureKind::Permutohedron => permutohedron::drawing(args, look),
        FigureKind::Volume => volume::plot(args, look),
        FigureKind::Hessenberg => hessenberg::staircase(args, look),
        FigureKind::Forest => forest::drawing(args, look),
    }
}

/// Makes the folder the files go to (the `--all` directory, or the parent of
/// `--out`), after checking that `--out` names a format.
fn prepare_out(args: &FigureArgs) -> Result<(), CliError> {
    if args.all {
        std::fs::create_dir_all(&args.out)
            .map_err(|e| CliError::Failed(format!("cannot create {}: {e}", args.out.display())))?;
    } else if Format::from_path(&args.out).is_err() {
        return Err(CliError::Input(format!(
            "cannot tell the figure format of {}: end --out with .png, .svg or .tex",
            args.out.display()
        )));
    } else if let Some(dir) = args.out.parent().filter(|d| !d.as_os_str().is_empty()) {
        // as with --all, a missing folder is made (slides/figures/dream.png)
        std::fs::create_dir_all(dir)
            .map_err(|e| CliError::Failed(format!("cannot create {}: {e}", dir.display())))?;
    }
    Ok(())
}

/// Where a figure named `name` goes: `--out`, or `--out/NAME.EXT` with `--all`.
fn file_path(args: &FigureArgs, name: &str) -> PathBuf {
    if !args.all {
        return args.out.clone();
    }
    let ext = match args.format {
        FormatArg::Png => "png",
        FormatArg::Svg => "svg",
        FormatArg::Tex => "tex",
    };
    args.out.join(format!("{name}.{ext}"))
}

/// One file written: its index, path and size in points (written as
/// double-precision numbers, as the size always was).
#[derive(Serialize)]
struct FileRecord {
    index: usize,
    path: String,
    width: f64,
    height: f64,
}

/// The JSON of `figure`: the kind and the files written.
#[derive(Serialize)]
struct FiguresRecord {
    kind: &'static str,
    count: usize,
    files: Vec<FileRecord>,
}

/// What the command prints: one line per file, or one JSON object.
fn report(args: &FigureArgs, written: &[Written]) -> String {
    if args.output.json {
        return json::line(&FiguresRecord {
            kind: args.kind.name(),
            count: written.len(),
            files: written
                .iter()
                .map(|(i, p, w, h)| FileRecord {
                    index: *i,
                    path: p.display().to_string(),
                    width: f64::from(*w),
                    height: f64::from(*h),
                })
                .collect(),
        });
    }
    let mut out = String::new();
    for (_, p, w, h) in written {
        out.push_str(&format!("wrote {} ({w} × {h} pt)\n", p.display()));
    }
    out
}
