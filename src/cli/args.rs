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
    /// The quasisymmetric quotient Q[x1..xn]/J_n: basis, graded dimensions, Gröbner basis.
    Quotient(super::cmd_quotient::QuotientArgs),
    /// The normal form of a polynomial modulo J_n, in the basis of standard monomials.
    Reduce(super::cmd_reduce::ReduceArgs),
    /// Positivity survey: reversed Schubert polynomials modulo J_n over S_n.
    Survey(super::cmd_survey::SurveyArgs),
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
