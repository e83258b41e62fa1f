//! The command-line grammar (clap definitions): every argument type of every
//! command, one struct per command. The command modules read these; this
//! module imports none of them. The doc comments are the `--help` texts.

use super::shard::Shard;
use crate::math::Perm;
use crate::math::hessenberg::function::HessenbergFn;
use crate::tables::table::Table;
use clap::{Args, Parser, Subcommand, ValueEnum};
use std::path::PathBuf;

/// elbowroom: exact Schubert calculus. With no command, opens the explorer.
#[derive(Parser, Debug)]
#[command(name = "elbowroom", version = VERSION_LINE, about, long_about = None)]
pub struct Cli {
    /// The headless command to run; none opens the explorer.
    #[command(subcommand)]
    pub command: Option<Command>,
}

/// The headless commands.
#[derive(Subcommand, Debug)]
pub enum Command {
    /// Facts about a permutation: length, code, inverse, descents, classes, counts.
    Perm(PermArgs),
    /// The Schubert polynomial S_w.
    Schubert(SchubertArgs),
    /// The reduced words of w in lexicographic order, and their number.
    Words(WordsArgs),
    /// The reduced pipe dreams of w (or its bumpless pipe dreams), and their number.
    Dreams(DreamsArgs),
    /// Divided symmetrization DS_h(f) of a polynomial.
    Divsym(DivsymArgs),
    /// The Hessenberg class table a^h_w = DS_h(S_w), ℓ(w) = Σ (h(i) - i).
    Hessenberg(HessenbergArgs),
    /// The exact volume of the permutohedron P_λ.
    Volume(VolumeArgs),
    /// Mixed Eulerian numbers A_c.
    Eulerian(EulerianArgs),
    /// Why a^h_w is what it is: the reduced-word formula by content, rules, symmetries, a_w(q).
    Coefficient(CoefficientArgs),
    /// The Schubert expansion of a polynomial: in H*(Fl_n), or stably with --stable.
    Expand(ExpandArgs),
    /// Structure constants: S_u · S_v = Σ c^w_{uv} S_w, stably or in H*(Fl_n) with --n.
    Product(ProductArgs),
    /// Combines the JSON outputs of the pieces of a sharded run into one.
    Merge(MergeArgs),
    /// The quasisymmetric quotient Q[x1..xn]/J_n: basis, graded dimensions, Gröbner basis.
    Quotient(QuotientArgs),
    /// The normal form of a polynomial modulo J_n, in the basis of standard monomials.
    Reduce(ReduceArgs),
    /// Positivity survey: reversed Schubert polynomials modulo J_n over S_n.
    Survey(SurveyArgs),
    /// Checks and summarises a session file (`session check FILE`).
    Session(SessionArgs),
    /// Draws a figure and writes it as PNG, SVG or TikZ (`figure dream 1432 --out f.png`).
    Figure(FigureArgs),
    /// Prints a completion script for a shell (`elbowroom completions bash > …`).
    Completions(CompletionsArgs),
    /// Prints the manual page (roff; `elbowroom man > elbowroom.1`).
    Man,
    /// Forest polynomials: P_F of a code, the forest expansion of S_w or of a polynomial.
    Forest(ForestArgs),
}

/// The commit the program was built from ("unknown" outside a git checkout).
pub const BUILD: &str = env!("ELBOWROOM_COMMIT");

/// What `--version` prints after the name: the version, the commit and the
/// optional features built in.
#[cfg(feature = "gui")]
pub const VERSION_LINE: &str = concat!(
    env!("CARGO_PKG_VERSION"),
    " (commit ",
    env!("ELBOWROOM_COMMIT"),
    "; features: gui)"
);

/// What `--version` prints after the name: the version, the commit and the
/// optional features built in.
#[cfg(not(feature = "gui"))]
pub const VERSION_LINE: &str = concat!(
    env!("CARGO_PKG_VERSION"),
    " (commit ",
    env!("ELBOWROOM_COMMIT"),
    "; features: none)"
);

impl Command {
    /// The file given with `--out` for a command whose output (otherwise on
    /// standard output) goes there instead.
    pub fn out_file(&self) -> Option<&std::path::Path> {
        match self {
            Command::Hessenberg(a) => a.output.out.as_deref(),
            Command::Eulerian(a) => a.output.out.as_deref(),
            Command::Survey(a) => a.output.out.as_deref(),
            Command::Words(a) => a.out.out.as_deref(),
            Command::Dreams(a) => a.out.out.as_deref(),
            Command::Merge(a) => a.out.out.as_deref(),
            _ => None,
        }
    }
}

/// The shells `elbowroom completions` writes scripts for.
#[derive(Clone, Copy, Debug, PartialEq, Eq, ValueEnum)]
pub enum ShellArg {
    /// bash
    Bash,
    /// zsh
    Zsh,
    /// fish
    Fish,
}

/// Arguments of `elbowroom completions`.
#[derive(Args, Debug)]
pub struct CompletionsArgs {
    /// The shell.
    #[arg(value_enum)]
    pub shell: ShellArg,
}

/// `--out FILE`: the output written to FILE instead of standard output,
/// through a temporary file renamed to FILE only when complete.
#[derive(Args, Debug, Default)]
pub struct OutFile {
    /// Write the output to this file instead of standard output; it appears
    /// only when complete (a stopped run leaves no file).
    #[arg(long, value_name = "FILE")]
    pub out: Option<PathBuf>,
}

/// Arguments of `elbowroom forest`.
#[derive(Args, Debug)]
pub struct ForestArgs {
    /// The permutation W whose Schubert polynomial is expanded: 1432, "1 4 3 2" or 1,4,3,2.
    #[arg(allow_hyphen_values = true, conflicts_with_all = ["code", "poly"])]
    pub perm: Option<String>,
    /// The code of an indexed forest, c1,c2,… (e.g. 1,0,2): prints P_F.
    #[arg(long, allow_hyphen_values = true, conflicts_with = "poly")]
    pub code: Option<String>,
    /// A polynomial in x1..xN to expand in forest polynomials (with --n).
    #[arg(long, allow_hyphen_values = true, requires = "n")]
    pub poly: Option<String>,
    /// The number of variables N of --poly.
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n)]
    pub n: Option<usize>,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

/// Arguments of `elbowroom perm`.
#[derive(Args, Debug)]
pub struct PermArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4 (commas needed for n >= 10).
    #[arg(allow_hyphen_values = true, value_parser = perm_arg)]
    pub perm: Perm,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

/// Arguments of `elbowroom schubert`.
#[derive(Args, Debug)]
pub struct SchubertArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    #[arg(allow_hyphen_values = true, value_parser = perm_arg)]
    pub perm: Perm,
    /// How to print the polynomial.
    #[command(flatten)]
    pub output: JsonOrLatex,
    /// Also give the principal specialization S_w(1, q, q², …) and S_w(1, …, 1).
    #[arg(long)]
    pub principal: bool,
}

/// Arguments of `elbowroom words`.
#[derive(Args, Debug)]
pub struct WordsArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    #[arg(allow_hyphen_values = true, value_parser = perm_arg)]
    pub perm: Perm,
    /// List at most this many words (the first ones in lexicographic order).
    #[arg(long, default_value_t = 1000, allow_hyphen_values = true, value_parser = whole_count)]
    pub limit: usize,
    /// Only count; list no words.
    #[arg(long)]
    pub count: bool,
    /// The number of reduced words of each content c (c_i = number of letters i), no words listed.
    #[arg(long, conflicts_with_all = ["count", "jsonl"])]
    pub by_content: bool,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
    /// `--jsonl`.
    #[command(flatten)]
    pub lines: JsonLines,
    /// Where the output goes.
    #[command(flatten)]
    pub out: OutFile,
}

/// Arguments of `elbowroom dreams`.
#[derive(Args, Debug)]
pub struct DreamsArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    #[arg(allow_hyphen_values = true, value_parser = perm_arg)]
    pub perm: Perm,
    /// List at most this many dreams.
    #[arg(long, default_value_t = 1000, allow_hyphen_values = true, value_parser = whole_count)]
    pub limit: usize,
    /// Only count; list no dreams.
    #[arg(long)]
    pub count: bool,
    /// Bumpless pipe dreams (n×n grids) instead of reduced pipe dreams.
    #[arg(long)]
    pub bumpless: bool,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
    /// `--jsonl`.
    #[command(flatten)]
    pub lines: JsonLines,
    /// Where the output goes.
    #[command(flatten)]
    pub out: OutFile,
}

/// Arguments of `elbowroom divsym`.
#[derive(Args, Debug)]
pub struct DivsymArgs {
    /// The polynomial f, for example "x1^2 x3 - 3/2 x2^3" (x1 or x_1; + - * ^ / and parentheses).
    #[arg(allow_hyphen_values = true)]
    pub poly: String,
    /// The number of variables n.
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n)]
    pub n: usize,
    /// A Hessenberg function h(1),...,h(n) (default h(i) = i+1, i.e. DS_n).
    #[arg(long, allow_hyphen_values = true, value_parser = hessenberg_arg)]
    pub h: Option<HessenbergArg>,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

/// Arguments of `elbowroom hessenberg`.
#[derive(Args, Debug)]
#[command(group(clap::ArgGroup::new("one_format").args(["jsonl", "csv", "latex"]).multiple(false)))]
pub struct HessenbergArgs {
    /// The number of variables n.
    #[arg(long, allow_hyphen_values = true, value_parser = table_n, help = format!("The number of variables n (1 to {})", crate::math::hessenberg::function::HESSENBERG_MAX_N))]
    pub n: usize,
    /// A Hessenberg function h(1),...,h(n) (default h(i) = i+1 for i < n).
    #[arg(long, allow_hyphen_values = true, value_parser = hessenberg_arg)]
    pub h: Option<HessenbergArg>,
    /// Compute only piece K of N (K/N): the permutations at listing positions i with i mod N = K-1.
    #[arg(long, allow_hyphen_values = true, value_parser = shard_arg)]
    pub shard: Option<Shard>,
    /// Summarise the table of every Hessenberg function of n (Catalan(n) of
    /// them): dimension, total, nonzero entries, maximum, negative entries.
    #[arg(long, conflicts_with_all = ["h", "shard", "jsonl"])]
    pub every_h: bool,
    /// `--jsonl`.
    #[command(flatten)]
    pub lines: JsonLines,
    /// Compute the table once and write its values to FILE, for the pieces of a
    /// split run (`--class FILE`); prints one line.
    #[arg(long, value_name = "FILE", conflicts_with_all = ["shard", "every_h", "class", "json", "jsonl", "csv", "latex"])]
    pub save_class: Option<PathBuf>,
    /// Read the values from FILE (written by `--save-class` with the same build,
    /// n and h) instead of expanding the class: each piece costs its share.
    #[arg(long, value_name = "FILE", conflicts_with = "every_h")]
    pub class: Option<PathBuf>,
    /// How to print the table.
    #[command(flatten)]
    pub output: TableOutput,
}

/// Arguments of `elbowroom expand`.
#[derive(Args, Debug)]
pub struct ExpandArgs {
    /// The polynomial, for example "(x1 - x3)(x2 - x3)" or "x1^2 x2 + 3x3".
    #[arg(allow_hyphen_values = true)]
    pub poly: String,
    /// The number of variables N: the class in H*(Fl_N), or the stable expansion in Q[x1..xN].
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n)]
    pub n: usize,
    /// The expansion in Q[x1..xN] over S_∞ instead of its image in H*(Fl_N).
    #[arg(long)]
    pub stable: bool,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
    /// `--jsonl`.
    #[command(flatten)]
    pub lines: JsonLines,
}

/// Arguments of `elbowroom product`.
#[derive(Args, Debug)]
pub struct ProductArgs {
    /// The permutation u: 132, "1 3 2" or 1,3,2.
    #[arg(allow_hyphen_values = true, value_parser = perm_arg)]
    pub u: Perm,
    /// The permutation v.
    #[arg(allow_hyphen_values = true, value_parser = perm_arg)]
    pub v: Perm,
    /// Multiply in H*(Fl_N) instead of stably (u and v must lie in S_N).
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n)]
    pub n: Option<usize>,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

/// Arguments of `elbowroom volume`.
#[derive(Args, Debug)]
pub struct VolumeArgs {
    /// λ_1,...,λ_n: rationals in any order, repeats allowed (for example 3,1/2,-1,0).
    #[arg(long, allow_hyphen_values = true, value_parser = lambda_arg)]
    pub lambda: Lambda,
    /// Also give the volume as a polynomial in λ_1..λ_n (valid on λ_1 >= ... >= λ_n).
    #[arg(long)]
    pub polynomial: bool,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

/// Arguments of `elbowroom eulerian`.
#[derive(Args, Debug)]
pub struct EulerianArgs {
    /// The number of variables n (compositions of n-1 into n-1 parts).
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n)]
    pub n: usize,
    /// Also give A_c(q), the q-analogue read in the algebra K_n(q) (text and JSON).
    #[arg(long, conflicts_with_all = ["csv", "latex"])]
    pub q: bool,
    /// How to print the table.
    #[command(flatten)]
    pub output: TableOutput,
}

/// Arguments of `elbowroom coefficient`.
#[derive(Args, Debug)]
pub struct CoefficientArgs {
    /// The permutation w, of length |h| = Σ (h(i) − i) (n − 1 for the default h).
    #[arg(allow_hyphen_values = true)]
    pub perm: String,
    /// A Hessenberg function h(1),...,h(n) (default h(i) = i+1: the permutahedral class).
    #[arg(long, allow_hyphen_values = true, value_parser = hessenberg_arg)]
    pub h: Option<HessenbergArg>,
    /// Also give the q-analogue a_w(q) (default h only).
    #[arg(long)]
    pub q: bool,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

/// How a command that makes a table prints it: readable text by default, or
/// one JSON object, CSV, or a LaTeX tabular.
#[derive(Args, Debug, Default)]
pub struct TableOutput {
    /// Print one JSON object instead of text.
    #[arg(long, conflicts_with_all = ["csv", "latex"])]
    pub json: bool,
    /// Print CSV: a header line, then one row per line.
    #[arg(long, conflicts_with = "latex")]
    pub csv: bool,
    /// Print a LaTeX tabular.
    #[arg(long)]
    pub latex: bool,
    /// Write the output to this file instead of standard output; it appears
    /// only when complete (a stopped run leaves no file).
    #[arg(long, value_name = "FILE")]
    pub out: Option<PathBuf>,
}

impl TableOutput {
    /// The table as CSV or LaTeX when one of those was asked for (built only then).
    pub fn table(&self, build: impl FnOnce() -> Table) -> Option<String> {
        if self.csv {
            Some(build().to_csv())
        } else if self.latex {
            Some(build().to_latex())
        } else {
            None
        }
    }
}

/// `--jsonl`, for a command that streams rows (beside [`TableOutput`]'s formats).
#[derive(Args, Debug, Default)]
pub struct JsonLines {
    /// Print JSON Lines: a header object, one object per row (a survey adds one
    /// {"counterexample": ...} per counterexample), then a summary object.
    #[arg(long, conflicts_with = "json")]
    pub jsonl: bool,
}

/// `--json`, for a command whose only other output is its text.
#[derive(Args, Debug, Default)]
pub struct JsonOutput {
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// `--json` or `--latex`, for a command that prints one polynomial.
#[derive(Args, Debug, Default)]
pub struct JsonOrLatex {
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
    /// Print the polynomial in LaTeX instead of plain text.
    #[arg(long, conflicts_with = "json")]
    pub latex: bool,
}

/// Arguments of `elbowroom merge`.
#[derive(Args, Debug)]
pub struct MergeArgs {
    /// The JSON outputs of the pieces of one sharded run.
    #[arg(required = true)]
    pub files: Vec<PathBuf>,
    /// Where the output goes.
    #[command(flatten)]
    pub out: OutFile,
}

/// Arguments of `elbowroom quotient`.
#[derive(Args, Debug)]
pub struct QuotientArgs {
    /// The number of variables n (the help names the range from the limits).
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n, help = quotient_n_help())]
    pub n: usize,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
    /// Draw every basis path in the text output (by default only for n <= 4).
    #[arg(long, conflicts_with = "json")]
    pub draw: bool,
    /// Neither read nor write the basis of J_n in the cache directory (build it afresh).
    #[arg(long)]
    pub no_cache: bool,
}

/// Arguments of `elbowroom reduce`.
#[derive(Args, Debug)]
pub struct ReduceArgs {
    /// The polynomial, e.g. "x1^2 x2 - 3/2 x3" or "M(2,1) + F(1,1)".
    #[arg(allow_hyphen_values = true)]
    pub poly: String,
    /// The number of variables n (the help names the range from the limits).
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n, help = normal_form_n_help())]
    pub n: usize,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
    /// Also give the class in the forest basis (the forests with leaves in [n]).
    #[arg(long)]
    pub forest: bool,
    /// Neither read nor write the basis of J_n in the cache directory (build it afresh).
    #[arg(long)]
    pub no_cache: bool,
    /// Reduce through the forest basis of the quotient instead of the Gröbner basis of
    /// J_n (same answers; nothing to build; always so at n = 12).
    #[arg(long)]
    pub by_forests: bool,
}

/// Arguments of `elbowroom survey`.
#[derive(Args, Debug)]
#[command(group(clap::ArgGroup::new("one_format").args(["jsonl", "csv", "latex"]).multiple(false)))]
pub struct SurveyArgs {
    /// Survey all of S_n (the help names the range from the limits).
    #[arg(
        help = format!("Survey all of S_n (1 <= n <= {})", crate::math::quotient::reduction::MAX_NORMAL_FORM_N),
        long,
        conflicts_with = "perm",
        required_unless_present = "perm",
        allow_hyphen_values = true,
        value_parser = whole_n
    )]
    pub n: Option<usize>,
    /// Survey one permutation, e.g. 2143.
    #[arg(long, value_parser = perm_arg)]
    pub perm: Option<Perm>,
    /// How to print the results.
    #[command(flatten)]
    pub output: TableOutput,
    /// Leave out the per-permutation normal forms.
    #[arg(long)]
    pub summary: bool,
    /// `--jsonl`.
    #[command(flatten)]
    pub lines: JsonLines,
    /// Neither read nor write the basis of J_n in the cache directory (build it afresh).
    #[arg(long)]
    pub no_cache: bool,
    /// Reduce through the forest basis of the quotient instead of the Gröbner basis of
    /// J_n (same answers; nothing to build; always so at n = 12).
    #[arg(long)]
    pub by_forests: bool,
    /// Run only piece K of N of the listing (item i goes to piece (i mod N) + 1).
    #[arg(long, value_name = "K/N", value_parser = shard_arg)]
    pub shard: Option<Shard>,
}

/// Arguments of `elbowroom session`.
#[derive(Args, Debug)]
pub struct SessionArgs {
    /// What to do with the session file (none: the usage is printed, exit status 2).
    #[command(subcommand)]
    pub action: Option<SessionAction>,
}

/// What `elbowroom session` does.
#[derive(Subcommand, Debug)]
pub enum SessionAction {
    /// Reads and validates a session file and summarises it; never writes.
    Check(SessionCheckArgs),
}

/// Arguments of `elbowroom session check`.
#[derive(Args, Debug)]
pub struct SessionCheckArgs {
    /// The session file (`.ron`).
    pub file: PathBuf,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

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
    /// The staircase diagram of a Hessenberg function h (--h, or --n for h(i) = i + 1).
    Hessenberg,
    /// An indexed forest on the number line (--code c1,c2,…).
    Forest,
}

impl FigureKind {
    /// The kind as typed, which also starts the names of the files written.
    pub fn name(self) -> &'static str {
        match self {
            FigureKind::Dream => "dream",
            FigureKind::Bumpless => "bumpless",
            FigureKind::Wiring => "wiring",
            FigureKind::Paths => "paths",
            FigureKind::Permutohedron => "permutohedron",
            FigureKind::Volume => "volume",
            FigureKind::Hessenberg => "hessenberg",
            FigureKind::Forest => "forest",
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
    #[arg(long, default_value_t = 0, allow_hyphen_values = true, value_parser = whole_count)]
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
    #[arg(long, conflicts_with = "dpi", allow_hyphen_values = true, value_parser = finite_number)]
    pub scale: Option<f32>,
    /// PNG resolution in dots per inch (72 dpi = scale 1).
    #[arg(long, allow_hyphen_values = true, value_parser = finite_number)]
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
    #[arg(long, allow_hyphen_values = true)]
    pub word: Option<String>,
    /// forest: the code of the forest, c1,c2,… (e.g. 2,0,1).
    #[arg(long, allow_hyphen_values = true)]
    pub code: Option<String>,
    /// paths: the polynomial to reduce instead of the reversed Schubert polynomial.
    #[arg(long, allow_hyphen_values = true)]
    pub poly: Option<String>,
    /// paths: the number of variables for --poly (the help names the range).
    #[arg(long, allow_hyphen_values = true, value_parser = whole_n, help = format!("paths: the number of variables for --poly (1 to {})", crate::math::quotient::reduction::MAX_NORMAL_FORM_N))]
    pub n: Option<usize>,
    /// paths: panels per row (default: about the square root of their number).
    #[arg(long, allow_hyphen_values = true, value_parser = whole_count)]
    pub columns: Option<usize>,
    /// paths: put the legend (how a monomial becomes a path, the colours) beside the panels.
    #[arg(long)]
    pub legend: bool,
    /// permutohedron: λ_1,...,λ_n (rationals, n <= 5).
    #[arg(long, allow_hyphen_values = true, value_parser = lambda_arg)]
    pub lambda: Option<Lambda>,
    /// permutohedron: turn about the vertical axis, in radians.
    #[arg(long, default_value_t = 0.6, allow_hyphen_values = true, value_parser = finite_angle)]
    pub yaw: f32,
    /// permutohedron: tilt about the horizontal axis, in radians.
    #[arg(long, default_value_t = 0.35, allow_hyphen_values = true, value_parser = finite_angle)]
    pub pitch: f32,
    /// volume: the start λ_a of the segment.
    #[arg(long, allow_hyphen_values = true, value_parser = lambda_arg)]
    pub from: Option<Lambda>,
    /// volume: the end λ_b of the segment.
    #[arg(long, allow_hyphen_values = true, value_parser = lambda_arg)]
    pub to: Option<Lambda>,
    /// volume: the number of intervals sampled on the segment (1 to 400).
    #[arg(long, default_value_t = 24, allow_hyphen_values = true, value_parser = whole_count)]
    pub samples: usize,
    /// hessenberg: the Hessenberg function h(1),...,h(n), e.g. 2,3,3.
    #[arg(long, allow_hyphen_values = true, value_parser = hessenberg_arg)]
    pub h: Option<HessenbergArg>,
    /// How to print the result.
    #[command(flatten)]
    pub output: JsonOutput,
}

/// `--h`: a Hessenberg function as typed. Its entries are read by the parser
/// (a text that is not a list of positive integers is refused there); whether
/// it is a Hessenberg function of the right n is known once n is
/// ([`HessenbergArg::for_n`]), so that the refusal names what is wrong (its
/// number of entries before its values).
#[derive(Clone, Debug)]
pub struct HessenbergArg {
    /// The function, when the entries make one.
    pub h: Option<HessenbergFn>,
    /// The text it was read from, as messages quote it.
    pub typed: String,
}

impl HessenbergArg {
    /// The function of size `n` (any size with `None`), or the reader's refusal.
    pub fn for_n(&self, n: Option<usize>) -> crate::math::MathResult<HessenbergFn> {
        match (&self.h, n) {
            (Some(h), None) => Ok(h.clone()),
            (Some(h), Some(n)) if h.n() == n => Ok(h.clone()),
            _ => HessenbergFn::parse(&self.typed, n),
        }
    }
}

/// `--h h(1),...,h(n)` ([`HessenbergFn::parse`]): entries that are not
/// positive integers are refused here, with the reader's message.
pub fn hessenberg_arg(text: &str) -> Result<HessenbergArg, Verbatim> {
    let whole = HessenbergFn::parse(text, None);
    let integers = text
        .split([',', ' ', '\t'])
        .filter(|t| !t.is_empty())
        .all(|t| t.trim().parse::<usize>().is_ok());
    match whole {
        Ok(h) => Ok(HessenbergArg {
            h: Some(h),
            typed: text.to_string(),
        }),
        Err(e) if !integers => Err(Verbatim(e.to_string())),
        Err(_) => Ok(HessenbergArg {
            h: None,
            typed: text.to_string(),
        }),
    }
}

/// λ = (λ_1, ..., λ_n), exact rationals as typed.
pub type Lambda = Vec<num_rational::BigRational>;

/// A refusal by one of the typed readers below, printed as it is (the same
/// one line the command itself would give), without clap's framing.
#[derive(Debug)]
pub struct Verbatim(pub String);

impl std::fmt::Display for Verbatim {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for Verbatim {}

/// A permutation argument: 31524, "3 1 5 2 4" or 3,1,5,2,4 ([`Perm::parse`]).
pub fn perm_arg(text: &str) -> Result<Perm, Verbatim> {
    Perm::parse(text).map_err(|e| Verbatim(e.to_string()))
}

/// `--shard K/N` ([`Shard::parse`]).
pub fn shard_arg(text: &str) -> Result<Shard, Verbatim> {
    Shard::parse(text).map_err(|e| Verbatim(e.message()))
}

/// λ as `l1,...,ln` ([`super::inputs::parse_lambda`]).
pub fn lambda_arg(text: &str) -> Result<Lambda, Verbatim> {
    super::inputs::parse_lambda(text).map_err(|e| Verbatim(e.message()))
}

/// The help of `--n` where normal forms modulo J_n are computed.
fn normal_form_n_help() -> String {
    format!(
        "The number of variables n (1 to {})",
        crate::math::quotient::reduction::MAX_NORMAL_FORM_N
    )
}

/// The help of `--n` where the quotient by J_n is computed.
fn quotient_n_help() -> String {
    format!(
        "The number of variables n (1 to {})",
        crate::math::quotient::groebner::MAX_QUOTIENT_N
    )
}

/// `--n`: a whole number. Negative numbers and other text are refused here,
/// saying what is accepted (a whole number from 1 to [`crate::math::MAX_N`]);
/// each command then checks the range it supports and names it.
pub fn whole_n(text: &str) -> Result<usize, String> {
    n_up_to(text, crate::math::MAX_N)
}

/// `--n` of `hessenberg`: a whole number (its range, 1 to
/// [`crate::math::hessenberg::function::HESSENBERG_MAX_N`], is checked where
/// it is used).
pub fn table_n(text: &str) -> Result<usize, String> {
    n_up_to(text, crate::math::hessenberg::function::HESSENBERG_MAX_N)
}

/// `--n` read as a whole number; the refusal names the range 1 to `max`.
fn n_up_to(text: &str, max: usize) -> Result<usize, String> {
    text.trim().parse::<usize>().map_err(|_| {
        format!(
            "--n must be a whole number from 1 to {max}; got {}",
            quoted(text)
        )
    })
}

/// A count or a position (`--limit`, `--index`, `--columns`, `--samples`):
/// a whole number 0, 1, 2, ...
pub fn whole_count(text: &str) -> Result<usize, String> {
    text.trim().parse::<usize>().map_err(|_| {
        format!(
            "must be a whole number 0, 1, 2, ... (at most {}); got {}",
            usize::MAX,
            quoted(text)
        )
    })
}

/// `--scale`, `--dpi`: a finite number (its range is checked where it is used).
pub fn finite_number(text: &str) -> Result<f32, String> {
    match text.trim().parse::<f32>() {
        Ok(v) if v.is_finite() => Ok(v),
        _ => Err(format!(
            "must be a finite number such as 4 or 2.5; got {}",
            quoted(text)
        )),
    }
}

/// `--yaw`, `--pitch`: a finite angle in radians, at most 10^6 in size.
pub fn finite_angle(text: &str) -> Result<f32, String> {
    match text.trim().parse::<f32>() {
        Ok(v) if v.is_finite() && v.abs() <= 1.0e6 => Ok(v),
        _ => Err(format!(
            "must be a finite angle in radians such as 0.6 or -1.2 (|angle| <= 1000000); got {}",
            quoted(text)
        )),
    }
}

/// A typed value as quoted in a message: a short excerpt of a long one,
/// control characters escaped.
fn quoted(text: &str) -> String {
    if text.trim().is_empty() {
        "nothing".into()
    } else {
        crate::math::excerpt::excerpt(text)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_are_read_with_their_range() {
        assert_eq!(whole_n("4"), Ok(4));
        assert_eq!(
            whole_n("-1"),
            Err("--n must be a whole number from 1 to 16; got -1".into())
        );
        assert!(whole_n("x").is_err() && whole_n("1.5").is_err());
        // the range is the command's to check and to name
        assert_eq!(whole_n("17"), Ok(17));
        assert_eq!(whole_count("0"), Ok(0));
        assert!(whole_count("-3").is_err());
        assert!(finite_angle("NaN").is_err() && finite_angle("inf").is_err());
        assert_eq!(finite_angle("-0.5"), Ok(-0.5));
        assert!(finite_number("nan").is_err());
    }

    /// `--h`: a text that is not a list of positive integers is refused by the
    /// parser; one of the wrong size is refused once n is known, by its size
    /// (2,3 is no Hessenberg function of any n, but the message says it has
    /// 2 entries where 3 were asked).
    #[test]
    fn hessenberg_functions_are_read_typed() {
        let typed = |t: &str| hessenberg_arg(t).map_err(|e| e.0);
        assert!(typed("2,x,3").is_err_and(|e| e.contains("'x'")));
        let h = typed("2 3,3").map(|a| a.for_n(Some(3)).map(|h| h.values().to_vec()));
        assert_eq!(h, Ok(Ok(vec![2, 3, 3])));
        let short = typed("2,3").map(|a| a.for_n(Some(3)).map_err(|e| e.to_string()));
        assert!(
            short.as_ref().is_ok_and(|r| r
                .as_ref()
                .is_err_and(|e| e.contains("'2,3' has 2 entries but n = 3"))),
            "{short:?}"
        );
        // a function of another n than asked, and one that is no function
        assert!(typed("2,3,3").is_ok_and(|a| a.for_n(Some(4)).is_err()));
        assert!(typed("3,2,3").is_ok_and(|a| a.for_n(Some(3)).is_err() && a.for_n(None).is_err()));
    }
}
