//! The command-line grammar (clap definitions), one struct per command.

use clap::{Args, Parser, Subcommand};

/// elbowroom: exact Schubert calculus. With no command, opens the explorer.
#[derive(Parser, Debug)]
#[command(name = "elbowroom", version, about, long_about = None)]
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
    /// Combines the JSON outputs of the pieces of a sharded run into one.
    Merge(MergeArgs),
    /// The quasisymmetric quotient Q[x1..xn]/J_n: basis, graded dimensions, Gröbner basis.
    Quotient(super::cmd_quotient::QuotientArgs),
    /// The normal form of a polynomial modulo J_n, in the basis of standard monomials.
    Reduce(super::cmd_reduce::ReduceArgs),
    /// Positivity survey: reversed Schubert polynomials modulo J_n over S_n.
    Survey(super::cmd_survey::SurveyArgs),
    /// Checks and summarises a session file (`session check FILE`).
    Session(super::cmd_session::SessionArgs),
    /// Draws a figure and writes it as PNG, SVG or TikZ (`figure dream 1432 --out f.png`).
    Figure(super::cmd_figure::FigureArgs),
}

/// Arguments of `elbowroom perm`.
#[derive(Args, Debug)]
pub struct PermArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4 (commas needed for n >= 10).
    pub perm: String,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Arguments of `elbowroom schubert`.
#[derive(Args, Debug)]
pub struct SchubertArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    pub perm: String,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
    /// Print the polynomial in LaTeX instead of plain text.
    #[arg(long, conflicts_with = "json")]
    pub latex: bool,
}

/// Arguments of `elbowroom words`.
#[derive(Args, Debug)]
pub struct WordsArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    pub perm: String,
    /// List at most this many words (the first ones in lexicographic order).
    #[arg(long, default_value_t = 1000)]
    pub limit: usize,
    /// Only count; list no words.
    #[arg(long)]
    pub count: bool,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Arguments of `elbowroom dreams`.
#[derive(Args, Debug)]
pub struct DreamsArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    pub perm: String,
    /// List at most this many dreams.
    #[arg(long, default_value_t = 1000)]
    pub limit: usize,
    /// Only count; list no dreams.
    #[arg(long)]
    pub count: bool,
    /// Bumpless pipe dreams (n×n grids) instead of reduced pipe dreams.
    #[arg(long)]
    pub bumpless: bool,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Arguments of `elbowroom divsym`.
#[derive(Args, Debug)]
pub struct DivsymArgs {
    /// The polynomial f, for example "x1^2 x3 - 3/2 x2^3" (x1 or x_1; + - * ^ / and parentheses).
    pub poly: String,
    /// The number of variables n.
    #[arg(long)]
    pub n: usize,
    /// A Hessenberg function h(1),...,h(n) (default h(i) = i+1, i.e. DS_n).
    #[arg(long)]
    pub h: Option<String>,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Arguments of `elbowroom hessenberg`.
#[derive(Args, Debug)]
pub struct HessenbergArgs {
    /// The number of variables n.
    #[arg(long)]
    pub n: usize,
    /// A Hessenberg function h(1),...,h(n) (default h(i) = i+1 for i < n).
    #[arg(long)]
    pub h: Option<String>,
    /// Compute only piece K of N (K/N): the permutations at listing positions i with i mod N = K-1.
    #[arg(long)]
    pub shard: Option<String>,
    /// How to print the table.
    #[command(flatten)]
    pub output: TableOutput,
}

/// Arguments of `elbowroom volume`.
#[derive(Args, Debug)]
pub struct VolumeArgs {
    /// λ_1,...,λ_n: rationals in any order, repeats allowed (for example 3,1/2,-1,0).
    #[arg(long, allow_hyphen_values = true)]
    pub lambda: String,
    /// Also give the volume as a polynomial in λ_1..λ_n (valid on λ_1 >= ... >= λ_n).
    #[arg(long)]
    pub polynomial: bool,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Arguments of `elbowroom eulerian`.
#[derive(Args, Debug)]
pub struct EulerianArgs {
    /// The number of variables n (compositions of n-1 into n-1 parts).
    #[arg(long)]
    pub n: usize,
    /// How to print the table.
    #[command(flatten)]
    pub output: TableOutput,
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
}

impl TableOutput {
    /// The table as CSV or LaTeX when one of those was asked for (built only then).
    pub fn table(&self, build: impl FnOnce() -> crate::figure::table::Table) -> Option<String> {
        if self.csv {
            Some(build().to_csv())
        } else if self.latex {
            Some(build().to_latex())
        } else {
            None
        }
    }
}

/// Arguments of `elbowroom merge`.
#[derive(Args, Debug)]
pub struct MergeArgs {
    /// The JSON outputs of the pieces of one sharded run.
    #[arg(required = true)]
    pub files: Vec<std::path::PathBuf>,
}
