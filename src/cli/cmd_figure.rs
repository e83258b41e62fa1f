//! `elbowroom figure KIND ... --out FILE`: draws a figure headless and writes it
//! as PNG, SVG or TikZ (the format follows the extension). The scenes are the
//! ones the explorer draws, so a file looks like the view it came from.
//!
//! - `dream W [--index K | --all]`: reduced pipe dreams of w, in enumeration order.
//! - `bumpless W [--index K | --all]`: bumpless pipe dreams of w.
//! - `wiring W [--index K | --all | --word A]`: wiring diagrams of the reduced
//!   words of w, in lexicographic order (or of the word given).
//! - `paths W [--columns C]`: the normal form modulo J_n of the reversed Schubert
//!   polynomial S_w(x_n, ..., x_1), one lattice path per standard monomial;
//!   `paths --poly F --n N` draws the normal form of any polynomial instead.
//! - `permutohedron --lambda L [--yaw A --pitch B]`: P_λ for n <= 5.
//! - `volume --from A --to B [--samples M]`: Vol P_λ along λ(t) = (1 - t)A + tB.
//!
//! With `--all`, `--out` is a directory (created if missing) and the files are
//! named `KIND-W-K.EXT` with `--format` (svg by default).

use super::cmd_volume::parse_lambda;
use super::error::CliError;
use super::json;
use crate::figure::Scene;
use crate::figure::bumpless::bumpless_scene;
use crate::figure::dream::dream_scene;
use crate::figure::export::{self, ExportOptions, Format};
use crate::figure::look::Look;
use crate::figure::paths::{PathPanel, path_grid_scene};
use crate::figure::permutohedron::polytope_scene;
use crate::figure::volume::volume_plot_scene;
use crate::figure::wiring::wiring_scene;
use crate::math::perms::words::reduced_words;
use crate::math::permutohedra::permutohedron::{Permutohedron, rational_to_f64};
use crate::math::pipes::bumpless::bumpless_dreams;
use crate::math::pipes::dream::{count_pipe_dreams, pipe_dreams};
use crate::math::poly::mono::exponents_text;
use crate::math::poly::parse::parse_poly;
use crate::math::quotient::groebner::MAX_QUOTIENT_N;
use crate::math::quotient::lattice_path::LatticePath;
use crate::math::quotient::normal_form::{groebner_basis, normal_form};
use crate::math::schubert::polynomial::schubert;
use crate::math::{MathError, Perm, Progress, RatPoly};
use clap::{Args, ValueEnum};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Signed};
use serde_json::json;
use std::path::PathBuf;
use std::sync::Arc;

/// The largest n for which P_λ is drawn (5! = 120 vertices).
pub const MAX_DRAWN_N: usize = 5;

/// The most files one `--all` writes.
pub const MAX_FILES: usize = 2000;

/// What `elbowroom figure` draws.
#[derive(Clone, Copy, Debug, PartialEq, Eq, ValueEnum)]
pub enum FigureKind {
    /// A reduced pipe dream of w.
    Dream,
    /// A bumpless pipe dream of w.
    Bumpless,
    /// The wiring diagram of a reduced word of w.
    Wiring,
    /// Lattice paths of a normal form modulo J_n.
    Paths,
    /// The permutohedron P_λ (n <= 5).
    Permutohedron,
    /// The volume of P_λ along a segment.
    Volume,
}

impl FigureKind {
    fn name(self) -> &'static str {
        match self {
            FigureKind::Dream => "dream",
            FigureKind::Bumpless => "bumpless",
            FigureKind::Wiring => "wiring",
            FigureKind::Paths => "paths",
            FigureKind::Permutohedron => "permutohedron",
            FigureKind::Volume => "volume",
        }
    }
}

/// A figure format for `--all`.
#[derive(Clone, Copy, Debug, PartialEq, Eq, ValueEnum)]
pub enum FormatArg {
    /// PNG image.
    Png,
    /// SVG document.
    Svg,
    /// Standalone LaTeX/TikZ document.
    Tex,
}

/// Arguments of `elbowroom figure`.
#[derive(Args, Debug)]
pub struct FigureArgs {
    /// What to draw.
    #[arg(value_enum)]
    pub kind: FigureKind,
    /// The permutation (dream, bumpless, wiring, paths): 1432, "1 4 3 2" or 1,4,3,2.
    pub perm: Option<String>,
    /// Which one to draw, 0-based in enumeration order (pipe dreams) or lexicographic order (words).
    #[arg(long, default_value_t = 0)]
    pub index: usize,
    /// Draw every pipe dream (or word) of w; --out is then a directory.
    #[arg(long, conflicts_with = "index")]
    pub all: bool,
    /// The file to write (.png, .svg, .tex), or the directory with --all.
    #[arg(long)]
    pub out: PathBuf,
    /// The format of the files written with --all.
    #[arg(long, value_enum, default_value = "svg")]
    pub format: FormatArg,
    /// PNG pixels per point (default 4).
    #[arg(long, conflicts_with = "dpi")]
    pub scale: Option<f32>,
    /// PNG resolution in dots per inch (72 dpi = scale 1).
    #[arg(long)]
    pub dpi: Option<f32>,
    /// Leave out the background.
    #[arg(long)]
    pub transparent: bool,
    /// Light ink on a dark background.
    #[arg(long)]
    pub dark: bool,
    /// Leave out row, column and vertex labels.
    #[arg(long)]
    pub no_labels: bool,
    /// wiring: draw this reduced word (letters 1..n-1, e.g. 121 or 1,2,1) instead of one of w's.
    #[arg(long)]
    pub word: Option<String>,
    /// paths: the polynomial to reduce instead of the reversed Schubert polynomial.
    #[arg(long)]
    pub poly: Option<String>,
    /// paths: the number of variables for --poly (1 to 8).
    #[arg(long)]
    pub n: Option<usize>,
    /// paths: panels per row (default: about the square root of their number).
    #[arg(long)]
    pub columns: Option<usize>,
    /// permutohedron: λ_1,...,λ_n (rationals, n <= 5).
    #[arg(long)]
    pub lambda: Option<String>,
    /// permutohedron: turn about the vertical axis, in radians.
    #[arg(long, default_value_t = 0.6, allow_negative_numbers = true)]
    pub yaw: f32,
    /// permutohedron: tilt about the horizontal axis, in radians.
    #[arg(long, default_value_t = 0.35, allow_negative_numbers = true)]
    pub pitch: f32,
    /// volume: the start λ_a of the segment.
    #[arg(long)]
    pub from: Option<String>,
    /// volume: the end λ_b of the segment.
    #[arg(long)]
    pub to: Option<String>,
    /// volume: the number of intervals sampled on the segment (1 to 400).
    #[arg(long, default_value_t = 24)]
    pub samples: usize,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Runs the command.
pub fn run(args: &FigureArgs) -> Result<String, CliError> {
    let opts = export_options(args)?;
    let look = Look {
        dark: args.dark,
        labels: !args.no_labels,
    };
    let figures = scenes(args, &look)?;
    let mut written = Vec::with_capacity(figures.len());
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
    for (index, name, scene) in &figures {
        let path = if args.all {
            let ext = match args.format {
                FormatArg::Png => "png",
                FormatArg::Svg => "svg",
                FormatArg::Tex => "tex",
            };
            args.out.join(format!("{name}.{ext}"))
        } else {
            args.out.clone()
        };
        export::write(scene, &path, &opts).map_err(|e| CliError::Failed(e.to_string()))?;
        written.push((*index, path, scene.width, scene.height));
    }
    if args.json {
        let files: Vec<_> = written
            .iter()
            .map(|(i, p, w, h)| json!({"index": i, "path": p.display().to_string(), "width": w, "height": h}))
            .collect();
        return Ok(json::render(&json!({
            "kind": args.kind.name(),
            "count": written.len(),
            "files": files,
        })));
    }
    let mut out = String::new();
    for (_, p, w, h) in &written {
        out.push_str(&format!("wrote {} ({w} × {h} pt)\n", p.display()));
    }
    Ok(out)
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

type Figure = (usize, String, Scene);

fn perm_arg(args: &FigureArgs) -> Result<Perm, CliError> {
    let Some(text) = &args.perm else {
        return Err(CliError::Input(format!(
            "figure {} needs a permutation, for example 'elbowroom figure {} 1432 --out f.svg'",
            args.kind.name(),
            args.kind.name()
        )));
    };
    Ok(Perm::parse(text)?)
}

fn compact(w: &Perm) -> String {
    let sep = if w.n() >= 10 { "," } else { "" };
    w.one_line()
        .iter()
        .map(|v| v.to_string())
        .collect::<Vec<_>>()
        .join(sep)
}

/// Picks the figures asked for from an enumeration: one by index, or all.
fn pick<T>(
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
fn named<T>(
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

fn scenes(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let kind = args.kind.name();
    match args.kind {
        FigureKind::Dream => {
            let w = perm_arg(args)?;
            let total = count_pipe_dreams(&w);
            let picked = pick(
                args,
                pipe_dreams(&w),
                &format!("pipe dreams of {} ({total})", compact(&w)),
            )?;
            Ok(named(kind, &w, picked, |d| dream_scene(d, look, &[])))
        }
        FigureKind::Bumpless => {
            let w = perm_arg(args)?;
            let all = bumpless_dreams(&w);
            let total = all.len();
            let picked = pick(
                args,
                all.into_iter(),
                &format!("bumpless pipe dreams of {} ({total})", compact(&w)),
            )?;
            Ok(named(kind, &w, picked, |d| bumpless_scene(d, look)))
        }
        FigureKind::Wiring => {
            if let Some(word) = &args.word {
                let (word, n) = parse_word(word, args.perm.as_deref())?;
                let name = word
                    .iter()
                    .map(|a| a.to_string())
                    .collect::<Vec<_>>()
                    .join("");
                return Ok(vec![(
                    0,
                    format!("{kind}-{name}"),
                    wiring_scene(&word, n, look, None),
                )]);
            }
            let w = perm_arg(args)?;
            let picked = pick(
                args,
                reduced_words(&w),
                &format!("reduced words of {}", compact(&w)),
            )?;
            Ok(named(kind, &w, picked, |word| {
                wiring_scene(word, w.n(), look, None)
            }))
        }
        FigureKind::Paths => {
            let (f, n, name) = match &args.poly {
                Some(text) => {
                    let Some(n) = args.n else {
                        return Err(CliError::Input(
                            "figure paths --poly needs --n, the number of variables (1 to 8)"
                                .into(),
                        ));
                    };
                    (parse_poly(text, Some(n))?, n, format!("{kind}-poly"))
                }
                None => {
                    let w = perm_arg(args)?;
                    let s = schubert(&w).reverse_vars();
                    (s.to_rational(), w.n(), format!("{kind}-{}", compact(&w)))
                }
            };
            Ok(vec![(0, name, paths_scene(&f, n, args.columns, look)?)])
        }
        FigureKind::Permutohedron => {
            let Some(text) = &args.lambda else {
                return Err(CliError::Input(
                    "figure permutohedron needs --lambda, for example --lambda 3,2,1,0".into(),
                ));
            };
            let lambda = parse_lambda(text)?;
            let scene = polytope_figure(&lambda, args.yaw, args.pitch, look)?;
            Ok(vec![(0, kind.to_string(), scene)])
        }
        FigureKind::Volume => {
            let (Some(a), Some(b)) = (&args.from, &args.to) else {
                return Err(CliError::Input(
                    "figure volume needs --from and --to, for example --from 1,1,0,0 --to 3,2,1,0"
                        .into(),
                ));
            };
            if args.samples == 0 || args.samples > 400 {
                return Err(CliError::Input(format!(
                    "--samples {} is out of range; use 1 to 400",
                    args.samples
                )));
            }
            let (a, b) = (parse_lambda(a)?, parse_lambda(b)?);
            let points = volume_samples(&a, &b, args.samples)?;
            Ok(vec![(
                0,
                kind.to_string(),
                volume_plot_scene(&points, look),
            )])
        }
    }
}

/// P_λ drawn from its vertices, edges and labels (n <= [`MAX_DRAWN_N`]).
fn polytope_figure(
    lambda: &[BigRational],
    yaw: f32,
    pitch: f32,
    look: &Look,
) -> Result<Scene, CliError> {
    let p = Permutohedron::new(lambda)?;
    if p.n() > MAX_DRAWN_N {
        return Err(CliError::Input(format!(
            "P_λ is drawn for n <= {MAX_DRAWN_N}; --lambda has {} entries",
            p.n()
        )));
    }
    let vertices = p.vertices(120)?;
    let edges = p.edges(&vertices);
    let coords = Permutohedron::drawing_coordinates(&vertices);
    let labels: Vec<String> = vertices
        .iter()
        .map(|v| {
            if !look.labels {
                return String::new();
            }
            let t: Vec<String> = v.iter().map(|x| x.to_string()).collect();
            format!("({})", t.join(", "))
        })
        .collect();
    Ok(polytope_scene(&coords, &edges, &labels, yaw, pitch, look))
}

/// (t, Vol P_λ(t)) at t = k/m, k = 0..m, for λ(t) = (1 - t)a + tb: exact
/// volumes, converted to floats only for drawing. Stops on Ctrl-C.
fn volume_samples(
    a: &[BigRational],
    b: &[BigRational],
    m: usize,
) -> Result<Vec<(f64, f64)>, CliError> {
    if a.len() != b.len() {
        return Err(CliError::Input(format!(
            "--from has {} entries and --to has {}; the two ends of the segment need the same number",
            a.len(),
            b.len()
        )));
    }
    let progress = Arc::new(Progress::new(m as u64 + 1));
    let _watch = super::interrupt::watch(progress.clone());
    let mut points = Vec::with_capacity(m + 1);
    for k in 0..=m {
        progress.check()?;
        let t = BigRational::new(BigInt::from(k), BigInt::from(m));
        let one_minus = BigRational::one() - &t;
        let lambda: Vec<BigRational> = a
            .iter()
            .zip(b)
            .map(|(x, y)| &one_minus * x + &t * y)
            .collect();
        let v = Permutohedron::new(&lambda)?.volume();
        points.push((rational_to_f64(&t), rational_to_f64(&v)));
        progress.advance(1);
    }
    Ok(points)
}

fn parse_word(text: &str, perm: Option<&str>) -> Result<(Vec<usize>, usize), CliError> {
    let parts: Vec<&str> = if text.contains([',', ' ']) {
        text.split([',', ' ']).filter(|s| !s.is_empty()).collect()
    } else {
        text.split("").filter(|s| !s.is_empty()).collect()
    };
    let mut word = Vec::with_capacity(parts.len());
    for p in parts {
        let Ok(a) = p.parse::<usize>() else {
            return Err(CliError::Input(format!(
                "--word {text:?}: {p:?} is not a letter; give letters 1..n-1 like 121 or 1,2,1"
            )));
        };
        word.push(a);
    }
    if word.contains(&0) {
        return Err(CliError::Input(format!(
            "--word {text:?}: letters start at 1"
        )));
    }
    let needed = word.iter().max().map_or(1, |m| m + 1);
    let n = match perm {
        Some(p) => Perm::parse(p)?.n().max(needed),
        None => needed,
    };
    let w = Perm::from_word(&word, Some(n))?;
    if w.length() != word.len() {
        return Err(CliError::Input(format!(
            "--word {text:?} is not reduced: its product has length {} < {}",
            w.length(),
            word.len()
        )));
    }
    Ok((word, n))
}

fn paths_scene(
    f: &RatPoly,
    n: usize,
    columns: Option<usize>,
    look: &Look,
) -> Result<Scene, CliError> {
    if n == 0 || n > MAX_QUOTIENT_N {
        return Err(CliError::Input(format!(
            "n = {n} is out of range; the quotient is computed for n from 1 to {MAX_QUOTIENT_N}"
        )));
    }
    let q = groebner_basis(n)?;
    let nf = normal_form(&q, f)?;
    let mut panels = Vec::with_capacity(nf.coefficients.len());
    for (_, m, c) in &nf.coefficients {
        let e = m.exps(n);
        let path =
            LatticePath::of_monomial(&e).map_err(|e: MathError| CliError::Failed(e.to_string()))?;
        panels.push(PathPanel {
            path,
            monomial: exponents_text(&e),
            coefficient: c.to_string(),
            negative: c.is_negative(),
        });
    }
    let columns = columns.unwrap_or_else(|| (panels.len() as f64).sqrt().ceil().max(1.0) as usize);
    if columns == 0 {
        return Err(CliError::Input("--columns must be at least 1".into()));
    }
    Ok(path_grid_scene(&panels, n, columns, look))
}
